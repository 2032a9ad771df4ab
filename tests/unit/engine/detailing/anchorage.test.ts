import { describe, expect, it } from 'vitest'
import {
  ANCHORAGE_DISPERSAL_ANGLE, anchorageBurstingForce, anchorageBurstingForceFull, partiallyLoadedArea,
} from '../../../../shared/engine/detailing/anchorage'
import { EngineInputError } from '../../../../shared/engine/contract'

describe('bursting force behind an anchorage, EN 1992-1-1 6.5.3(3)', () => {
  it('eq. (6.58), partial discontinuity: T = ¼·(b − a)/b·F', () => {
    // hand: F = 1,000 kN, a = 200 mm anchor plate, b = 600 mm: T = 0.25 × 400/600 × 1,000 = 166.67 kN
    expect(anchorageBurstingForce({ F: 1e6, a: 200, b: 600 })).toBeCloseTo(166666.6667, 3)
    expect(anchorageBurstingForce({ F: 1e6, a: 600, b: 600 })).toBe(0) // no spread, no tie
  })
  it('eq. (6.59), full discontinuity: T = ¼·(1 − 0.7·a/h)·F', () => {
    // hand: F = 1,000 kN, a = 250 mm, h = 1,000 mm: T = 0.25 × (1 − 0.175) × 1,000 = 206.25 kN
    expect(anchorageBurstingForceFull({ F: 1e6, a: 250, h: 1000 })).toBeCloseTo(206250, 6)
  })
  it('the dispersal angle β = arctan(2/3) ≈ 33.7° (EN 1992-1-1 8.10.3)', () => {
    expect((ANCHORAGE_DISPERSAL_ANGLE * 180) / Math.PI).toBeCloseTo(33.690, 3)
  })
})

describe('partially loaded area, EN 1992-1-1 6.7 eq. (6.63)', () => {
  it('FRdu = Ac0·fcd·√(Ac1/Ac0) below the cap', () => {
    // hand: plate 200 × 200 (Ac0 = 40,000 mm²), Ac1 = 400 × 400 = 160,000 mm², fcd = 20 MPa (C30/37, γc 1.5, αcc 1.0):
    // FRdu = 40,000 × 20 × √4 = 1,600 kN
    expect(partiallyLoadedArea({ Ac0: 40000, Ac1: 160000, fcd: 20 })).toBeCloseTo(1.6e6, 6)
  })
  it('capped at 3.0·fcd·Ac0 when Ac1/Ac0 > 9', () => {
    // hand: Ac1 = 16·Ac0 ⇒ √16 = 4 > 3: FRdu = 3 × 40,000 × 20 = 2,400 kN
    expect(partiallyLoadedArea({ Ac0: 40000, Ac1: 640000, fcd: 20 })).toBeCloseTo(2.4e6, 6)
    // at exactly Ac1 = 9·Ac0 both give 3.0·fcd·Ac0
    expect(partiallyLoadedArea({ Ac0: 40000, Ac1: 360000, fcd: 20 })).toBeCloseTo(2.4e6, 6)
  })
  it('bad input names the field', () => {
    expect(() => partiallyLoadedArea({ Ac0: 40000, Ac1: 30000, fcd: 20 })).toThrow(EngineInputError)
    expect(() => partiallyLoadedArea({ Ac0: 40000, Ac1: 30000, fcd: 20 })).toThrow(/^Ac1/)
    expect(() => partiallyLoadedArea({ Ac0: 0, Ac1: 30000, fcd: 20 })).toThrow(/^Ac0/)
    expect(() => anchorageBurstingForce({ F: 1e6, a: 700, b: 600 })).toThrow(/^a/)
    expect(() => anchorageBurstingForce({ F: Number.NaN, a: 200, b: 600 })).toThrow(/^F/)
    expect(() => anchorageBurstingForceFull({ F: 1e6, a: 200, h: 0 })).toThrow(/^h/)
  })
})
