import { describe, expect, it } from 'vitest'
import solver from 'javascript-lp-solver'
import { fibreStresses, magnel, magnelRegion, requiredModuli } from '../../../../shared/engine/index'
import type { MagnelCondition } from '../../../../shared/engine/index'
import { between, prng } from '../../../helpers/prng'

describe('fibre stresses (engineering bending theory, Navier)', () => {
  it('σ = P/A ∓ Pe/Z ± M/Z, compression positive', () => {
    const s = fibreStresses({ A: 2e5, Zt: 1e7, Zb: 1e7, P: 1e6, e: 50, M: 1e8 })
    expect(s.top).toBeCloseTo(5 - 5 + 10, 12)
    expect(s.bottom).toBeCloseTo(5 + 5 - 10, 12)
  })
})

/** The same inequalities solved as a linear programme with javascript-lp-solver: maximise 1/P. */
function lpMinP(A: number, Zt: number, Zb: number, conditions: MagnelCondition[], eMin: number, eMax: number): number | null {
  // variables: s = e − eMin ≥ 0 and u = 1/P (scaled by 1e6 so the simplex works with sizes near 1)
  const U = 1e6
  const constraints: Record<string, { max?: number }> = { eRange: { max: eMax - eMin } }
  const sCoef: Record<string, number> = { eRange: 1 }
  const uCoef: Record<string, number> = { obj: 1 }
  conditions.forEach((c, i) => {
    const ke = c.fibre === 'top' ? -1 / Zt : 1 / Zb
    const kM = c.fibre === 'top' ? 1 / Zt : -1 / Zb
    const r = c.forceFactor
    // σ·u within limits, with e = s + eMin (Magnel's inequalities divided by P)
    const ae = c.bound === 'compression' ? r * ke : -r * ke
    const au = c.bound === 'compression' ? kM * c.M - c.limit : -(kM * c.M + c.limit)
    const b = c.bound === 'compression' ? -r / A : r / A
    const name = `c${i}`
    const scale = 1 / Math.abs(b) // rows scaled to order one for the simplex tolerances
    constraints[name] = { max: (b - ae * eMin) * scale }
    sCoef[name] = ae * scale
    uCoef[name] = (au / U) * scale
  })
  const model = { optimize: 'obj', opType: 'max' as const, constraints, variables: { s: sCoef, u: { ...uCoef, uCap: 1 } } }
  ;(model.constraints as Record<string, { max?: number }>).uCap = { max: 1e3 }
  const res = solver.Solve(model) as { feasible: boolean; result: number; u?: number }
  if (!res.feasible) return null
  const u = (res.u ?? 0) / U
  return u > 0 ? 1 / u : null
}

describe('Magnel diagram against a general-purpose LP solver (javascript-lp-solver), random sections', () => {
  it('the least force agrees with the LP optimum for 80 random sections', () => {
    const r = prng(42)
    let feasibleCount = 0
    for (let trial = 0; trial < 80; trial++) {
      const b = between(r, 300, 2000)
      const h = between(r, 200, 900)
      const A = b * h
      const Z = (b * h * h) / 6
      const Mmin = between(r, 0, 0.4) * Z * 3
      const Mmax = Mmin + between(r, 0.2, 1.5) * Z * 5
      const eMax = h / 2 - between(r, 40, 80)
      const input = {
        A, Zt: Z, Zb: Z, Mmin, Mmax, eMax, eta: between(r, 0.75, 0.9), rsup: 1.1, rinf: 0.9,
        limits: { transferCompression: between(r, 10, 20), transferTension: between(r, 1, 3), serviceCompression: between(r, 12, 24), serviceTension: between(r, 0, 3) },
      }
      const m = magnel(input)
      const conds: MagnelCondition[] = m.lines.map((l) => ({ id: l.id, label: l.label, stage: l.stage, fibre: l.fibre, bound: l.bound, forceFactor: l.forceFactor, M: l.M, limit: l.limit }))
      const lp = lpMinP(A, Z, Z, conds, -eMax, eMax)
      if (lp === null) {
        expect(m.feasible).toBe(false)
      } else if (lp <= 1000 * (1 + 1e-9)) {
        // the LP reached its cap of 1/P ≤ 1/(1 kN): no prestress is needed for stresses
        expect(m.unbounded).toBe(true)
      } else {
        feasibleCount++
        expect(m.feasible).toBe(true)
        expect(Math.abs((m.minP as number) - lp) / lp).toBeLessThan(1e-6)
        // the vertex satisfies every condition at the least force
        for (const l of m.lines) expect(l.ae * (m.eAtMinP as number) + l.au / (m.minP as number) - l.b).toBeLessThan(1e-9 * Math.abs(l.b) + 1e-15)
      }
    }
    expect(feasibleCount).toBeGreaterThan(10)
  })
  it('a flanged (unsymmetric) section: region vertices satisfy every line, LP agrees', () => {
    const A = 1.4e6
    const Zt = 9.9e7
    const Zb = 7.45e7
    const conds: MagnelCondition[] = [
      { id: 'a', label: 'a', stage: 'transfer', fibre: 'top', bound: 'tension', forceFactor: 1.1, M: 8e7, limit: 2.5 },
      { id: 'b', label: 'b', stage: 'transfer', fibre: 'bottom', bound: 'compression', forceFactor: 1.1, M: 8e7, limit: 15.6 },
      { id: 'c', label: 'c', stage: 'service', fibre: 'top', bound: 'compression', forceFactor: 0.8, M: 4.5e8, limit: 24 },
      { id: 'd', label: 'd', stage: 'service', fibre: 'bottom', bound: 'tension', forceFactor: 0.8, M: 4.5e8, limit: 3.5 },
    ]
    const m = magnelRegion({ A, Zt, Zb }, conds, -130, 188)
    const lp = lpMinP(A, Zt, Zb, conds, -130, 188)
    expect(m.feasible).toBe(true)
    expect(Math.abs((m.minP as number) - (lp as number)) / (lp as number)).toBeLessThan(1e-6)
    for (const v of m.region) for (const l of m.lines) expect(l.ae * v.e + l.au * v.invP - l.b).toBeLessThan(1e-9 * Math.abs(l.b) + 1e-15)
  })
  it('an infeasible case (section too small) reports no force', () => {
    const m = magnel({ A: 1e5, Zt: 5e6, Zb: 5e6, Mmin: 0, Mmax: 3e8, eMax: 60, eta: 0.85, limits: { transferCompression: 12, transferTension: 1, serviceCompression: 15, serviceTension: 0 } })
    expect(m.feasible).toBe(false)
    expect(m.minP).toBeNull()
  })
})

describe('least section moduli (textbook necessary conditions, e.g. Lin & Burns)', () => {
  it('Zt ≥ (Mmax − ηMmin)/(fcs + η·ftt), Zb ≥ (Mmax − ηMmin)/(η·fct + fts)', () => {
    // hand: range = 300 − 0.8·100 = 220 kNm; Zt = 220e6/(15 + 0.8·1) = 13.92e6; Zb = 220e6/(0.8·18 + 2) = 13.41e6
    const z = requiredModuli({ Mmin: 100e6, Mmax: 300e6, eta: 0.8, fct: 18, ftt: 1, fcs: 15, fts: 2 })
    expect(z.Zt).toBeCloseTo(220e6 / 15.8, 0)
    expect(z.Zb).toBeCloseTo(220e6 / 16.4, 0)
  })
})
