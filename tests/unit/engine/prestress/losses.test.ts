import { describe, expect, it } from 'vitest'
import { drawInForces, drawInLength, elasticShorteningLoss, frictionForce, timeDependentLoss, timeDependentParts } from '../../../../shared/engine/index'

describe('friction, EN 1992-1-1 eq. (5.45)', () => {
  it('P(x) = Pmax·e^(−μ(θ + kx)): 1000 kN, μ = 0.19, θ = 0.2 rad, k = 0.005 rad/m, x = 20 m → 944.6 kN', () => {
    // hand: exp(−0.19 × (0.2 + 0.005 × 20)) = exp(−0.057) = 0.94459
    expect(frictionForce(1e6, 0.19, 0.2, 5e-6, 20000)).toBeCloseTo(944594, -1)
  })
  it('k is multiplied by μ as the clause writes it (references: "note k is multiplied by μ")', () => {
    const withWobble = frictionForce(1e6, 0.2, 0, 1e-5, 10000)
    expect(withWobble).toBeCloseTo(1e6 * Math.exp(-0.2 * 0.1), 6)
  })
  it('rejects a negative angle with a typed error naming θ', () => {
    expect(() => frictionForce(1e6, 0.19, -0.1, 0, 0)).toThrow(/theta/)
  })
})

describe('anchorage draw-in (textbook method: l_set = √(Δ·Ep·Ap/p))', () => {
  it('for a linear friction loss the affected length and the anchor loss 2·p·l_set come out exactly', () => {
    const p = 10 // N/mm friction loss per unit length
    const P0 = 1e6
    const x = Array.from({ length: 401 }, (_, i) => i * 100)
    const P = x.map((v) => P0 - p * v)
    const EpAp = 195000 * 700
    const slip = 6
    const r = drawInForces(x, P, slip, EpAp)
    const l = drawInLength(slip, EpAp, p)
    expect(r.lset).toBeCloseTo(l, 0)
    expect(r.lossAtAnchor).toBeCloseTo(2 * p * l, -1)
    expect(r.wholeLength).toBe(false)
    // beyond l_set the force is untouched
    expect(r.P[400] as number).toBeCloseTo(P[400] as number, 6)
  })
  it('the area of the loss diagram equals Δ·Ep·Ap (compatibility of the slip)', () => {
    const x = Array.from({ length: 201 }, (_, i) => i * 50)
    const P = x.map((v) => 9e5 * Math.exp(-0.19 * 1e-5 * v))
    const r = drawInForces(x, P, 6, 195000 * 600)
    let area = 0
    for (let i = 1; i < x.length; i++) area += (((P[i - 1] as number) - (r.P[i - 1] as number) + (P[i] as number) - (r.P[i] as number)) / 2) * 50
    expect(area / (6 * 195000 * 600)).toBeCloseTo(1, 6)
  })
})

describe('elastic shortening, EN 1992-1-1 eq. (5.44)', () => {
  it('ΔPel = Ap·Ep·j·Δσc/Ecm(t) with j = (n − 1)/2n', () => {
    // hand: 1000 × 195000 × (3/8) × 5 / 30000 = 12 187.5 N for n = 4
    expect(elasticShorteningLoss({ Ap: 1000, Ep: 195000, EcmT: 30000, sigmaC: 5, n: 4 })).toBeCloseTo(12187.5, 6)
    expect(elasticShorteningLoss({ Ap: 1000, Ep: 195000, EcmT: 30000, sigmaC: 5, n: 1 })).toBe(0)
    expect(elasticShorteningLoss({ Ap: 1000, Ep: 195000, EcmT: 30000, sigmaC: 5, n: Infinity })).toBeCloseTo(16250, 6)
  })
})

describe('time-dependent loss, EN 1992-1-1 eq. (5.46)', () => {
  const base = { epsCs: 0.0003, Ep: 195000, Ecm: 33000, phi: 2, sigmaCQP: 5, dSigmaPr: 40, Ap: 1000, Ac: 250000, Ic: 1.3e9, zcp: 80 }
  it('hand calculation: (58.5 + 32 + 59.09)/(1 + 5.909·0.004·2.2308·2.6) = 131.6 MPa', () => {
    // numerator: εcs·Ep = 58.5; 0.8·Δσpr = 32; (Ep/Ecm)·φ·σc,QP = 59.09
    // denominator: 1 + (Ep/Ecm)(Ap/Ac)(1 + Ac·zcp²/Ic)(1 + 0.8φ) = 1.13709
    expect(timeDependentLoss(base)).toBeCloseTo(131.56, 1)
  })
  it('splits into shrinkage, relaxation and creep terms that add up', () => {
    const p = timeDependentParts(base)
    expect(p.shrinkage + p.relaxation + p.creep).toBeCloseTo(p.total, 10)
    expect(p.shrinkage).toBeCloseTo(58.5 / 1.13709, 2)
  })
  it('bad input names the field', () => {
    expect(() => timeDependentLoss({ ...base, Ac: 0 })).toThrow(/Ac/)
    expect(() => timeDependentLoss({ ...base, phi: Number.NaN })).toThrow(/phi/)
  })
})
