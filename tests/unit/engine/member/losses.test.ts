import { describe, expect, it } from 'vitest'
import { designForService, ONE_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('losses stage', () => {
  it('friction from the left end of a single parabola: P(L) = Pjack·e^(−μ(θ + k·s)), θ = 2·atan(4a/L), s its arc length (EN 1992-1-1 eq. (5.45), 5.10.5.2(1))', () => {
    // θ is the true change of direction (the ends' slopes are ±4a/L), and x is measured along the tendon: the arc length
    // of the parabola, s = (L/2)(√(1 + m²) + asinh(m)/m), m = 4a/L (calculus). The former 8a/L (the sum of slopes) overstated θ.
    const d = designForService(parsed(ONE_SPAN_SLAB))
    const { mu, wobble } = d.input.losses
    const a = d.profile.drapes[0]!
    const m = (4 * a) / 8000
    const s = (8000 / 2) * (Math.sqrt(1 + m * m) + Math.asinh(m) / m)
    const far = d.losses.afterFriction[d.losses.afterFriction.length - 1]!
    expect(far / d.section.Pjack).toBeCloseTo(Math.exp(-mu * (2 * Math.atan(m) + wobble * s)), 7)
  })
  it('the percentage model takes the accepted share of the transfer force at every station', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB, { losses: { model: 'percentage', longTermShare: 0.12 } }))
    d.losses.service.P.forEach((P, k) => expect(P).toBeCloseTo(0.88 * d.losses.transfer.P[k]!, 6))
  })
  it('no draw-in and no friction leave the jacking force less elastic shortening (eq. (5.44))', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB, { losses: { mu: 0, wobble: 0, drawIn: 0 } }))
    d.losses.afterDrawIn.forEach((P) => expect(P).toBeCloseTo(d.section.Pjack, 6))
  })
})
