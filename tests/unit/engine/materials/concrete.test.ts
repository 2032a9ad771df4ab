import { describe, expect, it } from 'vitest'
import { concreteAtAge, concreteProperties } from '../../../../shared/engine/index'
import { EngineInputError } from '../../../../shared/engine/contract'

describe('concrete, EN 1992-1-1 Table 3.1', () => {
  // Tabulated (rounded) values of EN 1992-1-1 Table 3.1: [fck, fcm, fctm, fctk0.05, fctk0.95, Ecm GPa]
  // C30/37 and C40/50 as quoted in the project references; the other rows from Table 3.1 (from memory).
  const table: Array<[number, number, number, number, number, number]> = [
    [20, 28, 2.2, 1.5, 2.9, 30],
    [25, 33, 2.6, 1.8, 3.3, 31],
    [30, 38, 2.9, 2.0, 3.8, 33],
    [35, 43, 3.2, 2.2, 4.2, 34],
    [40, 48, 3.5, 2.5, 4.6, 35],
    [50, 58, 4.1, 2.9, 5.3, 37],
    [60, 68, 4.4, 3.0, 5.7, 39],
    [90, 98, 5.0, 3.5, 6.6, 44],
  ]
  it.each(table)('C%i: fcm, fctm, fctk and Ecm round to the table', (fck, fcm, fctm, f005, f095, Ecm) => {
    const c = concreteProperties(fck)
    expect(c.fcm).toBeCloseTo(fcm, 6)
    expect(Math.abs(c.fctm - fctm)).toBeLessThanOrEqual(0.051)
    expect(Math.abs(c.fctk005 - f005)).toBeLessThanOrEqual(0.051)
    expect(Math.abs(c.fctk095 - f095)).toBeLessThanOrEqual(0.051)
    expect(Math.abs(c.Ecm / 1000 - Ecm)).toBeLessThanOrEqual(0.5)
  })

  it('rejects a class outside the table with a typed error', () => {
    expect(() => concreteProperties(8)).toThrow(EngineInputError)
    expect(() => concreteProperties(Number.NaN)).toThrow(EngineInputError)
  })
})

describe('concrete at age, EN 1992-1-1 3.1.2', () => {
  it('βcc(28) = 1 for every cement class (eq. (3.2))', () => {
    for (const c of ['R', 'N', 'S'] as const) expect(concreteAtAge(30, 28, c).betaCC).toBeCloseTo(1, 12)
  })
  it('βcc(7) = exp(s(1 − √4)): 0.819 (R), 0.779 (N), 0.684 (S) — eq. (3.2) with s of 3.1.2(6)', () => {
    expect(concreteAtAge(30, 7, 'R').betaCC).toBeCloseTo(Math.exp(-0.2), 10)
    expect(concreteAtAge(30, 7, 'N').betaCC).toBeCloseTo(0.7788, 4)
    expect(concreteAtAge(30, 7, 'S').betaCC).toBeCloseTo(0.6839, 4)
  })
  it('fck(t) = fcm(t) − 8 before 28 days; fctm(t) = βcc·fctm; Ecm(t) = (fcm(t)/fcm)^0.3·Ecm (eqs. (3.1), (3.4), (3.5))', () => {
    const t = concreteAtAge(32, 5, 'N')
    const c = concreteProperties(32)
    const beta = Math.exp(0.25 * (1 - Math.sqrt(28 / 5)))
    expect(t.fcm).toBeCloseTo(beta * 40, 8)
    expect(t.fck).toBeCloseTo(beta * 40 - 8, 8)
    expect(t.fctm).toBeCloseTo(beta * c.fctm, 8)
    expect(t.Ecm).toBeCloseTo(beta ** 0.3 * c.Ecm, 6)
  })
  it('after 28 days fctm grows with βcc^(2/3) (3.1.2(9))', () => {
    const t = concreteAtAge(30, 90, 'N')
    expect(t.fctm / concreteProperties(30).fctm).toBeCloseTo(t.betaCC ** (2 / 3), 10)
    expect(t.fck).toBe(30)
  })
})
