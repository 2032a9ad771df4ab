import { describe, expect, it } from 'vitest'
import { cumulativeAngle, frictionCurves, frictionForce } from '../../../../shared/engine/prestress/friction'
import { frictionForce as viaLosses } from '../../../../shared/engine/prestress/losses'
import { EngineInputError } from '../../../../shared/engine/contract'

describe('friction angle θ(x), EN 1992-1-1 5.10.5.2(1)', () => {
  it('a single parabola of sag a over L turns the tendon by 2·atan(4a/L), not by the slope change 8a/L', () => {
    // e = 4a·x(L − x)/L² → e′ = 4a(L − 2x)/L², e′(0) = 4a/L, e′(L) = −4a/L: angle change atan(4a/L) − atan(−4a/L) (geometry)
    const L = 2000
    const a = 400 // a steep profile (a/L = 0.2) where the two differ: 2·atan(0.8) = 1.3495 rad against 1.6
    const n = 400
    const slopes = Array.from({ length: n + 1 }, (_, i) => (4 * a * (L - (2 * i * L) / n)) / (L * L))
    const theta = cumulativeAngle(slopes)
    expect(theta.at(-1) as number).toBeCloseTo(2 * Math.atan(0.8), 12)
    expect(theta.at(-1) as number).toBeLessThan(1.6 - 0.2)
    expect(theta[n / 2] as number).toBeCloseTo(Math.atan(0.8), 12)
  })

  it('a kink (two stations at one x) counts its angle once, whatever its sign; θ never falls along the tendon', () => {
    const theta = cumulativeAngle([0.1, 0.1, -0.05, -0.05, 0.02])
    const kink = Math.atan(0.1) + Math.atan(0.05) // from +0.1 to −0.05: |atan(−0.05) − atan(0.1)|
    ;[0, 0, kink, kink, kink + Math.atan(0.02) + Math.atan(0.05)].forEach((v, i) => expect(theta[i] as number).toBeCloseTo(v, 14))
    for (let i = 1; i < theta.length; i++) expect(theta[i] as number).toBeGreaterThanOrEqual(theta[i - 1] as number)
  })

  it('names a bad slope', () => {
    expect(() => cumulativeAngle([0, Number.NaN])).toThrow(EngineInputError)
    expect(() => cumulativeAngle([0, Number.NaN])).toThrow(/slopes\.1/)
  })
})

describe('friction curves from either end, EN 1992-1-1 eq. (5.45)', () => {
  it('P(x) = Pmax·e^(−μ(θ + kx)) from the left and from the right; their product is the same at every station', () => {
    const L = 10000
    const x = Array.from({ length: 101 }, (_, i) => i * 100)
    const slopes = x.map((v) => (4 * 100 * (L - 2 * v)) / (L * L)) // parabola of sag 100 mm
    const c = frictionCurves({ x, slopes, Pjack: 1e6, mu: 0.19, k: 1e-5 })
    const thetaTotal = 2 * Math.atan(0.04) // 2·atan(4a/L)
    expect(c.theta).toBeCloseTo(thetaTotal, 12)
    // hand: far end from the left: 1e6·exp(−0.19 × (0.07996 + 0.1)) = 966 390 N
    expect(c.fromLeft.at(-1) as number).toBeCloseTo(1e6 * Math.exp(-0.19 * (thetaTotal + 0.1)), 6)
    expect(c.fromRight[0] as number).toBeCloseTo(c.fromLeft.at(-1) as number, 6)
    // F_L·F_R = Pj²·e^(−μ(θ_total + kL)) everywhere (the exponents of the two ends add up to the whole tendon)
    c.fromLeft.forEach((f, i) => expect((f * (c.fromRight[i] as number)) / (1e12 * Math.exp(-0.19 * (thetaTotal + 0.1)))).toBeCloseTo(1, 12))
    // the old entry point still answers, through the same function
    expect(viaLosses).toBe(frictionForce)
  })

  it('names the field at fault', () => {
    expect(() => frictionCurves({ x: [0, 100, 50], slopes: [0, 0, 0], Pjack: 1e6, mu: 0.19, k: 0 })).toThrow(/x\.2/)
    expect(() => frictionCurves({ x: [0, 100], slopes: [0, 0], Pjack: 1e6, mu: -1, k: 0 })).toThrow(/mu/)
  })
})
