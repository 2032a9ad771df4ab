import { describe, expect, it } from 'vitest'
import { sectionOutline, sectionStage } from '../../../../shared/engine/member/section'
import { ONE_SPAN_SLAB, parsed } from '../../../helpers/members'
import { fieldOf } from '../../../helpers/engine'

describe('section stage (slab strip 250 mm, C32/40, 3 × 12.9 mm strands at 600 mm)', () => {
  const s = sectionStage(parsed(ONE_SPAN_SLAB)).result
  it('strands in the metre strip: 1000/600 × 3 = 5, Ap = 5 × 100 mm² (prEN 10138-3: 12.9 mm strand 100 mm²)', () => {
    expect(s.strands).toBeCloseTo(5, 12)
    expect(s.Ap).toBeCloseTo(500, 9)
  })
  it('jacking stress min(0.8 fpk, 0.9 fp0.1k) = min(0.8 × 1860, 0.9 × 1640) = 1476 MPa (EN 1992-1-1 eq. (5.41); prEN 10138-3 Fpk 186 kN, Fp0.1k 164 kN)', () => {
    expect(s.sigmaJack).toBeCloseTo(1476, 9)
    expect(s.Pjack).toBeCloseTo(1476 * 500, 6)
  })
  it('eccentricity limit: h/2 − cover − duct/2 − (duct − strand)/2 = 125 − 25 − 10 − 3.55 = 86.45 mm (common practice, duct 20 mm by default)', () => {
    expect(s.eccentricity.top).toBeCloseTo(86.45, 9)
    expect(s.eccentricity.bottom).toBeCloseTo(86.45, 9)
  })
  it('EI of the gross section: Ecm = 22 (40/10)^0.3 GPa (EN 1992-1-1 Table 3.1) times I = 1000 × 250³/12', () => {
    expect(s.EI / (22000 * 4 ** 0.3 * (1000 * 250 ** 3) / 12)).toBeCloseTo(1, 9)
  })
  it('the outline of a slab strip is a 1 m wide rectangle', () => {
    expect(sectionOutline(parsed(ONE_SPAN_SLAB))).toEqual({ kind: 'rectangle', b: 1000, h: 250 })
  })
  it('covers that reach the centroid name the cover', () => {
    expect(fieldOf(() => sectionStage(parsed(ONE_SPAN_SLAB, { section: { kind: 'slab-strip', h: 250 }, tendon: { ...ONE_SPAN_SLAB.tendon, coverTop: 120, coverBottom: 25, ductHeight: 10, ductWidth: 20 } })))).toBe('tendon.coverTop')
  })
})
