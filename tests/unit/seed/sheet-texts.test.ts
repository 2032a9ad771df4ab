/**
 * The demo engineer's own text of PS-3: it loads against the model with the built-in template of
 * today, its hand calculation gives the hand results (written out below), its check passes, and
 * the moments figure carries the façade's moment.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { PS3_OWN_TEXT } from '../../../server/seed/sheet-texts'
import { DEMO_PS3 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import { compileTemplate, lintTemplate } from '../../../shared/report/compile'
import { ptMemberModel } from '../../../shared/report/models'
import { renderReport } from '../../../shared/report/render'

const TEMPLATE = readFileSync(new URL('../../../content-templates/pt-slab-strip.md', import.meta.url), 'utf8')

describe('PS-3, with the façade worked out by hand', () => {
  const text = PS3_OWN_TEXT(TEMPLATE)

  it('keeps the template\'s text and adds one section before the tendons', () => {
    expect(text.startsWith(TEMPLATE.slice(0, TEMPLATE.indexOf('# Tendons, cover')))).toBe(true)
    expect(text.endsWith(TEMPLATE.slice(TEMPLATE.indexOf('# Tendons, cover')))).toBe(true)
    expect(text).toContain('# Façade on the cantilever, by hand')
    expect(lintTemplate(text, ptMemberModel)).toEqual([])
  })

  it('gives the hand results, passes its check and marks the root moment on the moments figure', () => {
    const report = renderReport(compileTemplate(text, ptMemberModel), { inputs: DEMO_PS3, results: designMember(DEMO_PS3), mode: 'frozen' })
    expect(report.html).not.toContain('tb-calc-problem')
    // by hand: w = 3.6 m × 2.05 kN/m² = 7.38 kN/m; M = −7.38 kN/m × 1 m × 2.3 m = −16.974 kNm
    expect(report.html).toContain('<g role="group" aria-label="M_f = −16.97 kNm">')
    const own = report.checks.filter((c) => c.group === 'own')
    expect(own).toHaveLength(1)
    expect(own[0]!.pass).toBe(true)
    expect(own[0]!.utilisation).toBeCloseTo(7.38 / 7.5, 3) // by hand: against the 7.5 kN/m the sheet designs for
  })
})
