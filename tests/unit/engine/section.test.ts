import { describe, expect, it } from 'vitest'
import { sectionProperties } from '../../../shared/engine/index'

describe('section properties (first and second moments of area, parallel-axis theorem)', () => {
  it('slab strip 1000 × 260: A = 260 000 mm², I = bh³/12, Z = bh²/6, h0 = 2A/u = h for both faces drying', () => {
    const s = sectionProperties({ kind: 'slab-strip', h: 260 })
    expect(s.A).toBe(260000)
    expect(s.I).toBeCloseTo((1000 * 260 ** 3) / 12, 3)
    expect(s.Zt).toBeCloseTo((1000 * 260 ** 2) / 6, 3)
    expect(s.h0).toBeCloseTo(260, 9)
    expect(s.kernTop).toBeCloseTo(260 / 6, 9) // kern of a rectangle: h/6 (any strength-of-materials text)
  })
  it('T-section by hand: flange 1200 × 150, web 300 × 450 (h = 600)', () => {
    // hand: A = 180 000 + 135 000 = 315 000; yt = (180 000·75 + 135 000·375)/315 000 = 203.571
    // I = 1200·150³/12 + 180 000·(203.571 − 75)² + 300·450³/12 + 135 000·(375 − 203.571)²
    //   = 0.3375e9 + 2.9755e9 + 2.2781e9 + 3.9673e9 = 9.5585e9
    const s = sectionProperties({ kind: 'tee-beam', h: 600, bw: 300, bf: 1200, hf: 150 })
    expect(s.A).toBe(315000)
    expect(s.yt).toBeCloseTo(203.5714, 3)
    expect(s.I / 1e9).toBeCloseTo(9.5585, 3)
    expect(s.Zb).toBeCloseTo(s.I / (600 - s.yt), 6)
  })
  it('an L-beam with the same flange width has the same properties as the T-beam (symmetry is not used in bending)', () => {
    const t = sectionProperties({ kind: 'tee-beam', h: 400, bw: 2400, bf: 4400, hf: 220 })
    const l = sectionProperties({ kind: 'ell-beam', h: 400, bw: 2400, bf: 4400, hf: 220 })
    expect(l.I).toBeCloseTo(t.I, 6)
  })
  it('bad geometry names the field', () => {
    expect(() => sectionProperties({ kind: 'tee-beam', h: 400, bw: 2400, bf: 2000, hf: 220 })).toThrow(/section\.bf/)
    expect(() => sectionProperties({ kind: 'rectangle', h: 400 })).toThrow(/section\.b/)
  })
})
