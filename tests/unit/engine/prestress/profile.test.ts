import { describe, expect, it } from 'vitest'
import { drapes, tendonEccentricity, tendonSlope } from '../../../../shared/engine/index'
import type { TendonProfile } from '../../../../shared/engine/index'

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
