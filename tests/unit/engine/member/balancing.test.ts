import { describe, expect, it } from 'vitest'
import { designForService, ONE_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('balancing stage (Lin, ACI Journal 1963)', () => {
  it('P = wL²/8a for the load chosen: 0.9 × 6.25 kN/m over 8 m with a = 86.45 mm', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB, { loads: { ...ONE_SPAN_SLAB.loads, balanceSelfWeight: 0.9 } }))
    const w = 0.9 * 6.25
    expect(d.balancing.load).toBeCloseTo(w, 12)
    expect(d.balancing.governing).toBeCloseTo((w * 8000 ** 2) / (8 * 86.45), 6)
  })
  it('the strands needed follow from the mean service force per strand; the check compares them with the strands provided', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB))
    const perStrand = d.losses.service.Pmean / d.section.strands
    expect(d.losses.balancing.strandsNeeded).toBeCloseTo(d.balancing.governing / perStrand, 9)
    const c = d.checks.find((k) => k.id === 'balancing.strands')!
    expect(c.pass).toBe(d.section.strands >= d.losses.balancing.strandsNeeded)
  })
})
