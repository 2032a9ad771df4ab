import { describe, expect, it } from 'vitest'
import { ULS_FACTORS, ulsLoadCases } from '../../../../shared/engine/loads/uls-combinations'
import { fieldOf } from '../../../helpers/engine'

describe('ULS load cases (EN 1990 6.4.3.2, Table A1.2(B); EN 1992-1-1 5.1.3)', () => {
  it('recommended factors: γG = 1.35, γQ = 1.5, ξ = 0.85, ψ0 = 0.7, γP = 1.0', () => {
    expect(ULS_FACTORS).toEqual({ gammaGsup: 1.35, gammaQ: 1.5, psi0: 0.7, xi: 0.85, gammaP: 1.0 })
  })

  it('eq. (6.10) for four spans: all, alternate (2) and adjacent pairs (3)', () => {
    const cases = ulsLoadCases(4, '6.10')
    expect(cases.map((c) => c.id)).toEqual(['6.10.all', '6.10.odd', '6.10.even', '6.10.adj1-2', '6.10.adj2-3', '6.10.adj3-4'])
    expect(cases[1]!.q).toEqual([1.5, 0, 1.5, 0])
    expect(cases[4]!.q).toEqual([0, 1.5, 1.5, 0])
    for (const c of cases) expect(c.g).toEqual([1.35, 1.35, 1.35, 1.35]) // same γG throughout (5.1.3(1) note)
  })

  it('eqs. (6.10a) and (6.10b)', () => {
    const cases = ulsLoadCases(2, '6.10a/b')
    const a = cases.find((c) => c.id === '6.10a.all')!
    const b = cases.find((c) => c.id === '6.10b.all')!
    expect(a.g[0]).toBeCloseTo(1.35, 12)
    expect(a.q[0]).toBeCloseTo(1.5 * 0.7, 12) // γQ ψ0
    expect(b.g[0]).toBeCloseTo(0.85 * 1.35, 12) // ξ γG
    expect(b.q[0]).toBeCloseTo(1.5, 12)
    expect(cases).toHaveLength(6) // all + odd + even for each expression; no adjacent pair with two spans
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => ulsLoadCases(0, '6.10'))).toBe('spans')
    expect(fieldOf(() => ulsLoadCases(3, '6.10', { ...ULS_FACTORS, gammaQ: 3 }))).toBe('uls.gammaQ')
  })
})
