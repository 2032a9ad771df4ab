import { describe, expect, it } from 'vitest'
import { designForService, ONE_SPAN_SLAB, TWO_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('profile stage', () => {
  it('deepest profile of a simple span: e = 4a·x(L − x)/L² with a = 86.45 mm (parabola through the anchors at the centroid)', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB))
    const a = d.section.eccentricity.bottom
    d.stations.forEach((s, k) => expect(d.profile.e[k]).toBeCloseTo((4 * a * s.x * (8000 - s.x)) / 8000 ** 2, 9))
    expect(d.profile.drapes[0]).toBeCloseTo(a, 9)
  })
  it('a simple span has no secondary moment (statically determinate, EN 1992-1-1 5.10.7)', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB))
    for (const m of d.profile.secondaryPerUnitForce) expect(Math.abs(m)).toBeLessThan(1e-9)
  })
  it('two spans: the tendon is at −e_top over the middle support and +e_bot at the low points', () => {
    const d = designForService(parsed(TWO_SPAN_SLAB))
    expect(d.profile.profile.supportEcc).toEqual([0, -d.section.eccentricity.top, 0])
    expect(d.profile.profile.spanEcc).toEqual([d.section.eccentricity.bottom, d.section.eccentricity.bottom])
  })
})
