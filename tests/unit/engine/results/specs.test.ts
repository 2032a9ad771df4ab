import { describe, expect, it } from 'vitest'
import { RESULT_SPECS, specFor } from '../../../../shared/engine/results/specs'

describe('result specs', () => {
  it('one table holds the service, ULS, SLS and site keys that templates bind to', () => {
    for (const k of ['sections[].stress.transfer.top', 'force.meanService', 'uls.sections[].sagging.MRd', 'deflection.series.longTerm[]', 'site.heights.rows[].chair', 'site.heights.spans[].rows[].chair']) {
      expect(RESULT_SPECS[k], k).toBeDefined()
    }
  })
  it('finds a concrete path by its generic key, and input paths by the input schema', () => {
    expect(specFor('sections.3.stress.transfer.top')?.unit).toBe('MPa')
    expect(specFor('input.tendon.spacing')?.unit).toBe('mm')
    expect(specFor('proposal.inputPatch.tendon.spacing')?.unit).toBe('mm')
  })
})
