import { describe, expect, it } from 'vitest'
import { STRANDS, jackingLimits, relaxationLoss } from '../../../../shared/engine/index'

describe('strand, prEN 10138-3 Y1860S7 and EN 1992-1-1 5.10.2.1 / 5.10.3', () => {
  // prEN 10138-3 table as quoted in the project references: Ap, Fpk, Fp0.1k
  const table: Array<[keyof typeof STRANDS, number, number, number]> = [
    ['12.5', 93, 173, 152], ['12.9', 100, 186, 164], ['15.2', 140, 260, 229], ['15.7', 150, 279, 246],
  ]
  it.each(table)('%s mm: Ap %i mm², Fpk %i kN, Fp0.1k %i kN', (type, Ap, Fpk, Fp01k) => {
    const s = STRANDS[type]
    expect(s.Ap).toBe(Ap)
    expect((s.fpk * s.Ap) / 1000).toBeCloseTo(Fpk, 6)
    expect((s.fp01k * s.Ap) / 1000).toBeCloseTo(Fp01k, 6)
    expect(s.Ep).toBe(195000) // EN 1992-1-1 3.3.6(3): 195 GPa for strand
    expect(s.fpk / s.fp01k).toBeGreaterThanOrEqual(1.1) // EN 1992-1-1 3.3.4(5) ductility
  })
  it('12.9 mm: σp,max = min(0.8·1860, 0.9·1640) = 1476 MPa; σpm0 = min(0.75·1860, 0.85·1640) = 1394 MPa', () => {
    const j = jackingLimits(STRANDS['12.9'])
    expect(j.sigmaPmax).toBeCloseTo(1476, 6)
    expect(j.Pmax).toBeCloseTo(147600, 3)
    expect(j.sigmaPm0).toBeCloseTo(1394, 6)
    expect(j.Pm0).toBeCloseTo(139400, 3)
  })
  it('15.7 mm: σp,max = min(1488, 1476) = 1476 MPa, so k2·fp0.1k governs (5.10.2.1(1))', () => {
    expect(jackingLimits(STRANDS['15.7']).sigmaPmax).toBeCloseTo(0.9 * 1640, 6)
  })
})

describe('relaxation, EN 1992-1-1 eqs. (3.28)–(3.30)', () => {
  it('class 2 at μ = 0.75, 500 000 h: 0.66·ρ1000·e^(9.1μ)·500^(0.75(1−μ))·1e-5', () => {
    // eq. (3.29) evaluated by hand: 0.66 × 2.5 × e^6.825 × 500^0.1875 × 1e-5 = 0.0487
    expect(relaxationLoss(2, 2.5, 0.75, 500000)).toBeCloseTo(0.0487, 3)
  })
  it('class 1 and class 3 follow eqs. (3.28) and (3.30)', () => {
    // eq. (3.28) by hand: 5.39 × 8 × e^(6.7·0.7) × 1^(…) × 1e-5 at 1000 h = 0.0471
    expect(relaxationLoss(1, 8, 0.7, 1000)).toBeCloseTo(5.39 * 8 * Math.exp(4.69) * 1e-5, 10)
    // eq. (3.30) by hand: 1.98 × 4 × e^(8·0.7) × 1e-5 at 1000 h = 0.0214
    expect(relaxationLoss(3, 4, 0.7, 1000)).toBeCloseTo(0.0214, 3)
  })
  it('grows with time as (t/1000)^(0.75(1−μ)) (form of eqs. (3.28)–(3.30))', () => {
    const r = relaxationLoss(2, 2.5, 0.7, 500000) / relaxationLoss(2, 2.5, 0.7, 1000)
    expect(r).toBeCloseTo(500 ** 0.225, 8)
  })
  it('bad arguments give a typed error naming the argument', () => {
    expect(() => relaxationLoss(2, 2.5, 1.2, 1000)).toThrow(/mu/)
    expect(() => relaxationLoss(2, -1, 0.7, 1000)).toThrow(/rho1000/)
  })
})
