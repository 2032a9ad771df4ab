import { describe, expect, it } from 'vitest'
import { DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { rel } from '../../../helpers/engine'

describe('SLS stage in the member design', () => {
  const d = designMember(DEMO_PS2, { proposal: false })

  it('long-term deflection of an uncracked member is (1 + φ) times the short-term one (EN 1992-1-1 eq. (7.20))', () => {
    for (const s of d.deflection.spans) {
      if (s.cracked) continue
      expect(rel(s.longTerm.down, (1 + d.deflection.phi) * s.shortTerm.down)).toBeLessThan(1e-9)
    }
  })
})

describe('deflection: one sign, downward positive, camber negative', () => {
  // PS-2 with tendons at 400 mm instead of 750 mm: the prestress lifts the slab (invented case)
  const d = designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, spacing: 400 } }, { proposal: false })
  it('an upward long-term deflection is reported negative and labelled as a camber', () => {
    const s = d.deflection.spans[0]!
    expect(s.longTerm.up).toBeLessThan(0)
    expect(-s.longTerm.up).toBeGreaterThan(s.longTerm.down)
    expect(s.longTerm.value).toBe(s.longTerm.up)
    expect(s.longTerm.direction).toBe('upward (camber)')
  })
  it('the sag check of EN 1992-1-1 7.4.1(4) takes the downward deflection only', () => {
    const c = d.checks.find((k) => k.id === 'sls.deflection.total')!
    expect(c.actual).toBeCloseTo(Math.max(...d.deflection.spans.map((s) => s.longTerm.down)), 9)
  })
  it('the camber has its own check: span/250 upward (common practice, appearance); hand: 7800/250 = 31.2 mm', () => {
    const c = d.checks.find((k) => k.id === 'sls.deflection.camber')!
    const worst = Math.max(...d.deflection.spans.map((s) => -s.longTerm.up / s.L))
    expect(c.actual / (c.limit * 250)).toBeCloseTo(worst, 9)
    expect(d.deflection.spans[0]!.limitCamber).toBeCloseTo(31.2, 9)
    expect(c.clause).toMatch(/common practice/)
  })
})
