import { describe, expect, it } from 'vitest'
import { magnelStage } from '../../../../shared/engine/member/magnel'
import { designForService, ONE_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('Magnel stage (Magnel diagram, any prestressed-concrete textbook)', () => {
  const d = designForService(parsed(ONE_SPAN_SLAB))
  const regions = magnelStage(d).result
  it('one region per critical section, cut by the eccentricity limits', () => {
    expect(regions).toHaveLength(d.stresses.sections.length)
    for (const r of regions) expect(r.eLimits).toEqual({ min: -d.section.eccentricity.top, max: d.section.eccentricity.bottom })
  })
  it('a member whose stresses pass lies inside every region: its transfer force is at least the least force of each', () => {
    const passes = d.checks.filter((c) => c.group === 'transfer' || c.group === 'service').every((c) => c.pass)
    regions.forEach((r, i) => {
      if (passes && r.minP !== null) expect(r.minP).toBeLessThanOrEqual(d.stresses.sections[i]!.force.transfer * (1 + 1e-6))
    })
  })
})
