import { describe, expect, it } from 'vitest'
import { tendonHeightSchedule } from '../../../../shared/engine/site/tendon-heights'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import { fieldOf } from '../../../helpers/engine'

const single: TendonProfile = { spans: [8000], supportEcc: [0, 0], spanEcc: [80] }

describe('tendon height schedule', () => {
  it('heights of a single parabola e = 4a·x(L − x)/L² above the soffit', () => {
    const r = tendonHeightSchedule({ profile: single, h: 260, centroidHeight: 130, spacing: 1000, centroidToUnderside: 10 })
    const low = r.rows.find((p) => p.kind === 'low')!
    expect(low.x).toBe(4000)
    expect(low.centroid).toBeCloseTo(50, 9) // 130 − 80
    expect(low.underside).toBeCloseTo(40, 9)
    const quarter = r.rows.find((p) => p.x === 2000)!
    expect(quarter.centroid).toBeCloseTo(130 - 60, 9) // parabola: e(L/4) = 0.75·a
    expect(r.rows.map((p) => p.x)).toEqual([0, 1000, 2000, 3000, 4000, 5000, 6000, 7000, 8000])
    expect(r.rows[0]!.kind).toBe('support')
    expect(r.outside).toBe(0)
  })

  it('adds the high, low and inflection points of a continuous profile and rounds the chairs', () => {
    const profile: TendonProfile = { spans: [7800, 9600], supportEcc: [0, -90, 0], spanEcc: [85, 85], lowPointAt: [0.42, 0.58], inflection: 0.1 }
    const r = tendonHeightSchedule({ profile, h: 260, centroidHeight: 130, spacing: 500, centroidToUnderside: 9, roundTo: 5 })
    const span1 = r.spans[0]!.rows
    expect(span1.some((p) => p.kind === 'low' && Math.abs(p.x - 0.42 * 7800) < 1e-6)).toBe(true)
    expect(span1.some((p) => p.kind === 'inflection' && Math.abs(p.x - 0.9 * 7800) < 1e-6)).toBe(true)
    const high = r.spans[1]!.rows[0]!
    expect(high.kind).toBe('support')
    expect(high.centroid).toBeCloseTo(220, 9) // 130 + 90 over the interior support
    for (const p of r.rows) expect(p.chair % 5).toBe(0)
    expect(r.spans[1]!.rows.at(-1)!.xGlobal).toBeCloseTo(17400, 9)
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => tendonHeightSchedule({ profile: single, h: 260, centroidHeight: 130, spacing: 0, centroidToUnderside: 10 }))).toBe('spacing')
    expect(fieldOf(() => tendonHeightSchedule({ profile: { ...single, spanEcc: [] }, h: 260, centroidHeight: 130, spacing: 500, centroidToUnderside: 10 }))).toBe('profile.spanEcc')
  })
})
