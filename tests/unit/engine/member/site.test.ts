import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { rel } from '../../../helpers/engine'

describe('site stage in the member design', () => {
  const d = designMember(DEMO_PS2, { proposal: false })

  it('tendon heights: the duct touches the covers at the high and low points of the deepest profile (geometry)', () => {
    const row = d.site.heights.spans[1]!.rows[0]!
    expect(row.kind).toBe('support')
    expect(row.centroid).toBeCloseTo(260 - d.eccentricity.dTop, 6) // the strand centroid at the top eccentricity limit
    expect(row.underside).toBeCloseTo(260 - 25 - 19, 6) // the duct touches the top cover: h − cover − duct height
    const low = d.site.heights.spans[1]!.rows.find((r) => r.kind === 'low')!
    expect(low.underside).toBeCloseTo(25, 6) // the duct rests on the bottom cover
  })

  it('stressing: the extension agrees with the integral of the friction curve of the member (independent sampling)', () => {
    const b = designMember(DEMO_BB1, { proposal: false })
    const X = b.series.X
    const P = b.series.forceFriction
    let area = 0
    for (let i = 1; i < X.length; i++) area += ((P[i - 1]! + P[i]!) / 2) * (X[i]! - X[i - 1]!) // trapezoidal rule
    const perMember = area / (b.strand.Ep * b.jacking.Ap) // the whole member's tendons: the same extension per tendon
    const t = b.site.stressing.tendons[0]!
    expect(b.site.stressing.tendons).toHaveLength(4)
    expect(rel(t.extension.total, perMember)).toBeLessThan(0.01)
    expect(t.Pjack).toBeCloseTo(b.jacking.sigmaJack * 5 * 100, 6)
  })

  it('measured extensions outside the band fail a site check', () => {
    const calc = d.site.stressing.tendons[0]!.extension.total
    const ok = designMember({ ...DEMO_PS2, site: { measured: [calc * 1.03] } }, { proposal: false })
    expect(ok.checks.find((c) => c.id === 'site.extension.T1')?.pass).toBe(true)
    const bad = designMember({ ...DEMO_PS2, site: { measured: [calc * 0.85] } }, { proposal: false })
    const c = bad.checks.find((x) => x.id === 'site.extension.T1')!
    expect(c.pass).toBe(false)
    expect(c.actual).toBeCloseTo(0.15, 9)
  })
})
