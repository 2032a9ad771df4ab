import { describe, expect, it } from 'vitest'
import {
  analyseContinuousBeam, balancingForce, drapes, equivalentLoads, prestressMoments, tendonEccentricity, tendonSlope,
} from '../../../shared/engine/index'
import type { BeamLoad, TendonProfile } from '../../../shared/engine/index'
import { between, prng } from './prng'

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

function randomProfile(r: () => number): TendonProfile {
  const n = 1 + Math.floor(r() * 4)
  const spans = Array.from({ length: n }, () => Math.round(between(r, 4000, 12000)))
  return {
    spans,
    supportEcc: Array.from({ length: n + 1 }, (_, j) => (j === 0 || j === n ? between(r, -30, 30) : between(r, -120, -40))),
    spanEcc: spans.map(() => between(r, 40, 120)),
    lowPointAt: spans.map(() => between(r, 0.35, 0.65)),
    inflection: r() < 0.3 ? 0 : between(r, 0.05, 0.15),
  }
}

describe('tendon profile', () => {
  it('passes through its support and low points with zero slope at the low point and at interior supports', () => {
    const p: TendonProfile = { spans: [8000, 10000], supportEcc: [0, -90, 10], spanEcc: [90, 95], lowPointAt: [0.4, 0.55], inflection: 0.1 }
    expect(tendonEccentricity(p, 0, 0)).toBeCloseTo(0, 9)
    expect(tendonEccentricity(p, 0, 3200)).toBeCloseTo(90, 9)
    expect(tendonEccentricity(p, 0, 8000)).toBeCloseTo(-90, 9)
    expect(tendonEccentricity(p, 1, 0)).toBeCloseTo(-90, 9)
    expect(tendonEccentricity(p, 1, 5500)).toBeCloseTo(95, 9)
    expect(tendonSlope(p, 0, 3200)).toBeCloseTo(0, 12)
    expect(tendonSlope(p, 0, 8000)).toBeCloseTo(0, 12)
    expect(tendonSlope(p, 1, 0)).toBeCloseTo(0, 12)
  })
  it('the inflection point lies on the straight line joining the high and low points (Lin & Burns; Bhatt)', () => {
    const p: TendonProfile = { spans: [8000, 8000], supportEcc: [0, -80, 0], spanEcc: [100, 100], lowPointAt: 0.5, inflection: 0.1 }
    // right half of span 1: low point at 4000 (e = 100), support at 8000 (e = −80); inflection 800 mm before the support
    const onLine = 100 + ((-80 - 100) * (8000 - 800 - 4000)) / 4000
    expect(tendonEccentricity(p, 0, 7200)).toBeCloseTo(onLine, 9)
  })
  it('drape is the sag at the low point below the chord of the support points', () => {
    const p: TendonProfile = { spans: [8000, 10000], supportEcc: [0, -90, 10], spanEcc: [90, 95], lowPointAt: [0.4, 0.55] }
    const a = drapes(p)
    expect(a[0] as number).toBeCloseTo(90 - (0 * 0.6 + -90 * 0.4), 9)
    expect(a[1] as number).toBeCloseTo(95 - (-90 * 0.45 + 10 * 0.55), 9)
  })
  it('rejects a reverse curve longer than the distance to the low point, naming the field', () => {
    expect(() => tendonEccentricity({ spans: [8000, 8000], supportEcc: [0, -80, 0], spanEcc: [90, 90], lowPointAt: [0.5, 0.2], inflection: 0.25 }, 1, 100)).toThrow(/profile\.inflection/)
    expect(() => tendonEccentricity({ spans: [8000], supportEcc: [0], spanEcc: [90] }, 0, 100)).toThrow(/profile\.supportEcc/)
  })
})

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

describe('secondary (hyperstatic) moments, EN 1992-1-1 5.10.7', () => {
  it('two equal spans, straight tendon at constant e: secondary +1.5·P·e, total +0.5·P·e at the interior support (Lin & Burns; Collins & Mitchell)', () => {
    const e = 80
    const P = 1e6
    // a straight tendon: support and span eccentricities equal, so every parabola is flat
    const m = prestressMoments({ spans: [9000, 9000], profile: { spans: [9000, 9000], supportEcc: [e, e, e], spanEcc: [e, e], inflection: 0 }, P })
    expect((m.secondary[1] as number) / (P * e)).toBeCloseTo(1.5, 9)
    expect((m.total[1] as number) / (P * e)).toBeCloseTo(0.5, 9)
    expect((m.primary[1] as number) / (P * e)).toBeCloseTo(-1, 12)
    expect(m.secondary[0] as number).toBeCloseTo(0, 3)
  })
  it('a concordant profile (shaped like the two-span UDL moment diagram) gives zero secondary moment', () => {
    const L = 8000
    const alpha = 100 / (9 / 128) // scales 9wL²/128 (the span's greatest sagging, with wL² = 1) to 100 mm
    // e = α·M(x)/(wL²): 0 at the ends, −α/8 at the interior support, +9α/128 at 3L/8 (handbook two-span moments)
    const profile: TendonProfile = { spans: [L, L], supportEcc: [0, -alpha / 8, 0], spanEcc: [(9 * alpha) / 128, (9 * alpha) / 128], lowPointAt: [0.375, 0.625], inflection: 0 }
    const m = prestressMoments({ spans: [L, L], profile, P: 1e6 })
    expect(Math.abs(m.secondary[1] as number) / (1e6 * 100)).toBeLessThan(1e-9)
  })
  it('symmetric member and profile: symmetric secondary moments', () => {
    const spans = [7800, 9600, 9600, 7800]
    const profile: TendonProfile = { spans, supportEcc: [0, -95, -95, -95, 0], spanEcc: [95, 95, 95, 95], lowPointAt: [0.42, 0.5, 0.5, 0.58], inflection: 0.1 }
    const m = prestressMoments({ spans, profile, P: 1e6 })
    expect(m.secondary[1] as number).toBeCloseTo(m.secondary[3] as number, 0)
  })
  it('secondary moments vary linearly between supports (they come from reactions only)', () => {
    const r = prng(99)
    for (let trial = 0; trial < 20; trial++) {
      const p = randomProfile(r)
      const m = prestressMoments({ spans: p.spans, profile: p, P: 1e6 })
      const beam = analyseContinuousBeam({ spans: p.spans, loads: equivalentLoads(p, 1e6) })
      p.spans.forEach((L, i) => {
        for (const f of [0.25, 0.5, 0.8]) {
          const secondary = beam.momentAt(i, f * L) + 1e6 * tendonEccentricity(p, i, f * L)
          expect(Math.abs(secondary - m.secondaryAt(i, f * L)) / 1e8).toBeLessThan(1e-7)
        }
      })
    }
  })
})
