import { randomProfile } from '../../../helpers/profiles'
import { describe, expect, it } from 'vitest'
import { analyseContinuousBeam, equivalentLoads, prestressMoments, tendonEccentricity } from '../../../../shared/engine/index'
import type { TendonProfile } from '../../../../shared/engine/index'
import { between, prng } from '../../../helpers/prng'

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
