import { randomProfile } from '../../../helpers/profiles'
import { describe, expect, it } from 'vitest'
import { analyseContinuousBeam, balancingForce, equivalentLoads, tendonEccentricity } from '../../../../shared/engine/index'
import type { BeamLoad, TendonProfile } from '../../../../shared/engine/index'
import { between, prng } from '../../../helpers/prng'

function resultants(loads: BeamLoad[], spans: number[]): { V: number; M: number } {
  const offsets = spans.map((_, i) => spans.slice(0, i).reduce((s, v) => s + v, 0))
  let V = 0
  let M = 0 // about the left end, counter-clockwise +
  for (const l of loads) {
    const o = offsets[l.span] as number
    if (l.kind === 'patch') {
      const F = l.w * (l.to - l.from)
      V += F
      M -= F * (o + (l.from + l.to) / 2)
    } else if (l.kind === 'udl') {
      const F = l.w * (spans[l.span] as number)
      V += F
      M -= F * (o + (spans[l.span] as number) / 2)
    } else if (l.kind === 'point') {
      V += l.P
      M -= l.P * (o + l.at)
    } else {
      M += l.M
    }
  }
  return { V, M }
}

describe('load balancing (Lin, ACI Journal 1963)', () => {
  it('P = wL²/8a for a simple parabola; its equivalent load is w = 8Pa/L² upward', () => {
    const p: TendonProfile = { spans: [10000], supportEcc: [0, 0], spanEcc: [100] }
    const b = balancingForce(p, 20)
    expect(b.governing).toBeCloseTo((20 * 10000 ** 2) / (8 * 100), 6)
    const loads = equivalentLoads(p, b.governing)
    const total = loads.filter((l) => l.kind === 'patch').reduce((s, l) => s + (l.kind === 'patch' ? l.w * (l.to - l.from) : 0), 0)
    expect(total / 10000).toBeCloseTo(-20, 9)
  })
  it('a span without drape cannot balance: typed error naming the span eccentricity', () => {
    expect(() => balancingForce({ spans: [8000], supportEcc: [50, 50], spanEcc: [50] }, 10)).toThrow(/profile\.spanEcc\.0/)
  })
})

describe('equivalent loads are self-equilibrating (random profiles, seeded)', () => {
  it('zero vertical force and zero moment; reactions to them sum to zero', () => {
    const r = prng(314159)
    for (let trial = 0; trial < 100; trial++) {
      const p = randomProfile(r)
      const P = between(r, 1e5, 3e6)
      const loads = equivalentLoads(p, P)
      const { V, M } = resultants(loads, p.spans)
      const Ltot = p.spans.reduce((s, v) => s + v, 0)
      expect(Math.abs(V) / P).toBeLessThan(1e-9)
      expect(Math.abs(M) / (P * Ltot)).toBeLessThan(1e-9)
      const beam = analyseContinuousBeam({ spans: p.spans, loads })
      expect(Math.abs(beam.reactions.reduce((s, v) => s + v, 0)) / P).toBeLessThan(1e-9)
    }
  })
  it('on a simple span the total moment of the equivalent loads is the primary moment −P·e everywhere (statically determinate)', () => {
    const r = prng(2718)
    for (let trial = 0; trial < 30; trial++) {
      const L = between(r, 5000, 12000)
      const p: TendonProfile = { spans: [L], supportEcc: [between(r, -40, 40), between(r, -40, 40)], spanEcc: [between(r, 50, 120)], lowPointAt: between(r, 0.3, 0.7) }
      const P = 1e6
      const beam = analyseContinuousBeam({ spans: [L], loads: equivalentLoads(p, P) })
      for (const f of [0, 0.1, 0.33, 0.5, 0.77, 1]) {
        expect(beam.momentAt(0, f * L) / (P * 100)).toBeCloseTo((-P * tendonEccentricity(p, 0, f * L)) / (P * 100), 8)
      }
    }
  })
})
