import { fieldOf } from '../../../helpers/engine'
import { describe, expect, it } from 'vitest'
import { forceAfterLockOff } from '../../../../shared/engine/prestress/draw-in'
import { drawInForces } from '../../../../shared/engine/prestress/losses'
import { EngineInputError } from '../../../../shared/engine/contract'

const stations = (L: number, n: number): number[] => Array.from({ length: n + 1 }, (_, i) => (i * L) / n)
const area = (x: readonly number[], v: readonly number[]): number => {
  let a = 0
  for (let i = 1; i < x.length; i++) a += (((v[i - 1] as number) + (v[i] as number)) / 2) * ((x[i] as number) - (x[i - 1] as number)) // trapezoidal rule
  return a
}
const mean = (x: readonly number[], v: readonly number[]): number => area(x, v) / ((x[x.length - 1] as number) - (x[0] as number))

// straight tendon with wobble only: F(x) = Pj·e^(−μ·k·x), EN 1992-1-1 eq. (5.45) with θ = 0
const straight = (x: readonly number[], L: number, Pj: number, mu: number, k: number) => ({
  fromLeft: x.map((v) => Pj * Math.exp(-mu * k * v)),
  fromRight: x.map((v) => Pj * Math.exp(-mu * k * (L - v))),
})

describe('draw-in at one stressed end', () => {
  it('textbook method: l_set = √(Δ·Ep·Ap/p) and a loss 2·p·l_set at the anchor for a nearly constant friction loss p', () => {
    // hand: σ = 1400 MPa, Ap = 1000 mm², μ = 0.19, k = 0.01 rad/m → p = μ·k·P0 = 0.19 × 1e-5 × 1.4e6 = 2.66 N/mm
    // l_set = √(6 × 195 000 × 1000 / 2.66) = 20 973 mm; loss at the anchor 2 × 2.66 × 20 973 = 111.6 kN (textbook, from memory)
    // the textbook formula takes p constant; eq. (5.45) makes it fall by μkx ≈ 4 % over l_set, hence 2.5 %.
    // Exact for F = P0·e^(−αx), α = μk, reverse R0·e^(αx) meeting F at l: ∫(F − R) dx = (P0/α)(1 − e^(−αl))² = Δ·Ep·Ap
    // → l = −ln(1 − √(Δ·Ep·Ap·α/P0))/α = 21 402 mm, anchor loss P0(1 − e^(−2αl)) = 109.35 kN (derived here)
    const L = 60000
    const x = stations(L, 600)
    const { fromLeft } = straight(x, L, 1.4e6, 0.19, 1e-5)
    const r = forceAfterLockOff({ x, frictionFromLeft: fromLeft, ends: 'left', slip: 6, EpAp: 195000 * 1000 })
    const p = 0.19 * 1e-5 * 1.4e6
    const lset = Math.sqrt((6 * 195000 * 1000) / p)
    expect(lset).toBeCloseTo(20973, 0)
    expect(Math.abs((r.setLength.left as number) / lset - 1)).toBeLessThan(0.025)
    expect(Math.abs((r.lossAtAnchor.left as number) / (2 * p * lset) - 1)).toBeLessThan(0.025)
    const alpha = 0.19 * 1e-5
    const s = Math.sqrt((6 * 195000 * 1000 * alpha) / 1.4e6)
    const lExact = -Math.log(1 - s) / alpha
    expect(lExact).toBeCloseTo(21402, -1)
    expect(Math.abs((r.setLength.left as number) / lExact - 1)).toBeLessThan(1e-3)
    expect(Math.abs((r.lossAtAnchor.left as number) / (1.4e6 * (1 - (1 - s) ** 2)) - 1)).toBeLessThan(1e-3)
    expect(r.wholeLength.left).toBe(false)
    // compatibility of the slip: ∫ΔP dx = Δ·Ep·Ap
    expect(area(x, fromLeft.map((f, i) => f - (r.force[i] as number))) / (6 * 195000 * 1000)).toBeCloseTo(1, 9)
    // the reverse friction follows eq. (5.45) backwards: P·e^(−μkx) is constant over the affected length
    const inZone = x.map((v, i) => [v, (r.force[i] as number) * Math.exp(-0.19 * 1e-5 * v)] as const).filter(([v]) => v < 0.9 * lset)
    for (const [, c] of inZone) expect(c / (inZone[0] as readonly [number, number])[1]).toBeCloseTo(1, 9)
  })

  it('a draw-in longer than the tendon lowers the force along the whole length (6 m, mean loss Δ·Ep/L = 195 MPa)', () => {
    // hand: l_set = 20 973 mm > 6000 mm; the whole tendon slides and ∫Δσ dx = Δ·Ep → mean Δσ = 6 × 195 000 / 6000 = 195 MPa
    const L = 6000
    const x = stations(L, 600)
    const { fromLeft } = straight(x, L, 1.4e6, 0.19, 1e-5)
    const r = forceAfterLockOff({ x, frictionFromLeft: fromLeft, ends: 'left', slip: 6, EpAp: 195000 * 1000 })
    expect(r.wholeLength.left).toBe(true)
    expect(r.setLength.left).toBeCloseTo(L, 6)
    expect((mean(x, fromLeft) - mean(x, r.force)) / 1000).toBeCloseTo(195, 6)
    for (let i = 0; i < x.length; i++) expect(r.force[i] as number).toBeLessThan(fromLeft[i] as number)
  })

  it('the right end alone is the mirror image of the left end alone', () => {
    const L = 30000
    const x = stations(L, 300)
    const c = straight(x, L, 1.2e6, 0.2, 2e-5)
    const a = forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, ends: 'left', slip: 7, EpAp: 195000 * 900 })
    const b = forceAfterLockOff({ x, frictionFromRight: c.fromRight, ends: 'right', slip: 7, EpAp: 195000 * 900 })
    a.force.forEach((f, i) => expect(b.force[x.length - 1 - i] as number).toBeCloseTo(f, 4))
    expect(b.setLength.right).toBeCloseTo(a.setLength.left as number, 6)
  })

  it('drawInForces (textbook mirror image of any friction curve) is the one-end case of forceAfterLockOff', () => {
    const L = 20000
    const x = stations(L, 200)
    const P = x.map((v) => 1e6 - 10 * v) // a constant friction loss p = 10 N/mm
    const a = drawInForces(x, P, 6, 195000 * 700)
    const b = forceAfterLockOff({ x, frictionFromLeft: P, ends: 'left', slip: 6, EpAp: 195000 * 700, reverseFriction: 'mirror' })
    expect(a.P).toEqual(b.force)
    expect(a.lset).toBeCloseTo(Math.sqrt((6 * 195000 * 700) / 10), 0) // l_set = √(Δ·Ep·Ap/p), textbook
  })
})

describe('draw-in with both ends stressed', () => {
  // 6 m single span, straight, σjack = 1400 MPa, Ap = 1000 mm², Ep = 195 GPa, μ = 0.19, k = 0.01 rad/m, Δ = 6 mm per anchor
  const L = 6000
  const x = stations(L, 600)
  const c = straight(x, L, 1.4e6, 0.19, 1e-5)
  const EpAp = 195000 * 1000
  const jacked = c.fromLeft.map((f, i) => Math.max(f, c.fromRight[i] as number))

  it('both jacks locked off together: the tendon shortens by 2Δ, mean loss 2·Δ·Ep/L = 390 MPa (not the ≈ 195 MPa of one slip)', () => {
    // hand: each set length (20 973 mm, above) exceeds half the tendon, so the whole tendon slides, each half towards its
    // own anchor; total shortening 6 + 6 = 12 mm → ∫Δσ dx = 12 × 195 000 N/mm → mean Δσ = 12 × 195 000 / 6000 = 390 MPa
    const r = forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, frictionFromRight: c.fromRight, ends: 'both', slip: 6, EpAp, sequence: 'simultaneous' })
    expect((mean(x, jacked) - mean(x, r.force)) / 1000).toBeCloseTo(390, 6)
    expect(r.lossArea.left).toBeCloseTo(6 * EpAp, -1)
    expect(r.lossArea.right).toBeCloseTo(6 * EpAp, -1)
    // by symmetry the stationary point is at mid-length
    expect(r.setLength.left).toBeCloseTo(3000, 3)
    // taking the larger of the two one-end results (one slip counted where the zones overlap) leaves about 195 MPa only
    const oneL = forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, ends: 'left', slip: 6, EpAp }).force
    const oneR = forceAfterLockOff({ x, frictionFromRight: c.fromRight, ends: 'right', slip: 6, EpAp }).force
    const envelope = oneL.map((f, i) => Math.max(f, oneR[i] as number))
    expect((mean(x, jacked) - mean(x, envelope)) / 1000).toBeLessThan(210)
  })

  it('one end then the other: the second jack re-stretches the whole tendon, so only its own slip remains (mean loss 195 MPa from its friction curve)', () => {
    // hand: after the left lock-off F = R0·e^(μkx) (whole length); the right friction curve Pj·e^(−μk(L − x)) has the same shape and
    // is higher at the right anchor, so the right jack lifts the whole tendon onto it; its lock-off then loses Δ·Ep/L = 195 MPa on average
    const r = forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, frictionFromRight: c.fromRight, ends: 'both', slip: 6, EpAp, sequence: 'left-first' })
    expect(r.stages.map((s) => `${s.action} ${s.end}`)).toEqual(['jack left', 'lock-off left', 'jack right', 'lock-off right'])
    const afterSecondJack = (r.stages[2] as { force: number[] }).force
    afterSecondJack.forEach((f, i) => expect(f).toBeCloseTo(c.fromRight[i] as number, 6))
    expect((mean(x, c.fromRight) - mean(x, r.force)) / 1000).toBeCloseTo(195, 6)
    // the right jack draws back the left slip: ∫(F_R − F_after left) dx = ∫F_R − (∫F_L − Δ·Ep·Ap) = Δ·Ep·Ap since ∫F_R = ∫F_L by
    // symmetry, so its extension is Δ = 6 mm, against ∫F_L/(Ep·Ap) = 43.0 mm at the first jack
    expect(r.extensionAtJack.right as number).toBeCloseTo(6, 6)
    expect(r.extensionAtJack.left as number).toBeCloseTo(area(x, c.fromLeft) / EpAp, 9)
  })

  it('zones that meet on a tendon with unequal jacking forces (closed form for a constant loss p, mirror law)', () => {
    // hand, linear friction p = 10 N/mm, L = 20 m, P_L = 1000 kN, P_R = 900 kN, Δ·Ep·Ap = 6 × 1.95e8 = 1.17e9 N·mm:
    // left lock-off: l1 = √(1.17e9/10) = 10 817 mm; force A1 + p·x with A1 = 1e6 − 2·p·l1 = 783 667 N for x < l1
    // right jack: F_R = 900 000 − p(L − x) meets F_L = 1e6 − p·x at xc = (1e6 − 9e5 + p·L)/(2p) = 15 000 mm; below A1 + p·x for x < l1
    // right lock-off (reverse slope −p against F_R of slope +p, then parallel to F_L, then against the left-reversed curve):
    // loss λc at xc, constant across [l1, xc], falling at 2p below l1 → λc²/(4p) + λc(L − l1) + p·d² = Δ·Ep·Ap, d = L − xc = 5000
    const Lb = 20000
    const xb = stations(Lb, 2000)
    const p = 10
    const Fl = xb.map((v) => 1e6 - p * v)
    const Fr = xb.map((v) => 9e5 - p * (Lb - v))
    const T = 6 * 1.95e8
    const l1 = Math.sqrt(T / p)
    const d = 5000
    const qa = 1 / (4 * p)
    const qb = Lb - l1
    const qc = p * d * d - T
    const lambdaC = (-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa)
    expect(lambdaC).toBeGreaterThan(8e4)
    const r = forceAfterLockOff({ x: xb, frictionFromLeft: Fl, frictionFromRight: Fr, ends: 'both', slip: 6, EpAp: 1.95e8, sequence: 'left-first', reverseFriction: 'mirror' })
    expect(r.setLength.left).toBeCloseTo(l1, -1)
    const at = (xv: number): number => r.force[Math.round(xv / 10)] as number
    expect(at(13000)).toBeCloseTo(1e6 - p * 13000 - lambdaC, -2) // constant loss over [l1, xc]
    expect(at(Lb)).toBeCloseTo(9e5 - lambdaC - 2 * p * d, -2) // at the right anchor
    expect(r.setLength.right as number).toBeCloseTo(Lb - (l1 - lambdaC / (2 * p)), -1) // reaches into the left zone
    // the larger of the two one-end results misses the second slip over the left zone
    const oneL = forceAfterLockOff({ x: xb, frictionFromLeft: Fl, ends: 'left', slip: 6, EpAp: 1.95e8, reverseFriction: 'mirror' }).force
    expect(oneL[Math.round(9000 / 10)] as number).toBeGreaterThan(at(9000) + 1000)
  })

  it('names the field at fault', () => {
    expect(fieldOf(() => forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, frictionFromRight: c.fromRight, ends: 'both', slip: 6, EpAp }))).toBe('sequence')
    expect(fieldOf(() => forceAfterLockOff({ x, frictionFromRight: c.fromRight, ends: 'left', slip: 6, EpAp }))).toBe('frictionFromLeft')
    expect(fieldOf(() => forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, ends: 'left', slip: -1, EpAp }))).toBe('slip')
    expect(fieldOf(() => forceAfterLockOff({ x, frictionFromLeft: c.fromLeft, ends: 'left', slip: 100, EpAp }))).toBe('slip') // 100 mm > the 43 mm extension
    expect(fieldOf(() => forceAfterLockOff({ x: [0, 0], frictionFromLeft: [1, 1], ends: 'left', slip: 1, EpAp }))).toBe('x')
  })
})
