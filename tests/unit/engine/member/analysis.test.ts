import { describe, expect, it } from 'vitest'
import { designForService, ONE_SPAN_SLAB, TWO_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('analysis stage (moments of prestress, EN 1992-1-1 5.10.7)', () => {
  it('primary moment −P·e at every station; a simple span has no secondary moment', () => {
    const d = designForService(parsed(ONE_SPAN_SLAB))
    d.stations.forEach((_, k) => {
      expect(d.analysis.transfer.primary[k]).toBeCloseTo(-d.losses.transfer.P[k]! * d.profile.e[k]!, 6)
      expect(d.analysis.service.total[k]).toBeCloseTo(d.analysis.service.primary[k]!, 3)
    })
  })
  it('two spans: the secondary moment is the unit secondary moment times the mean force and varies linearly between supports', () => {
    const d = designForService(parsed(TWO_SPAN_SLAB))
    const k = d.analysis.supportStations[1]!
    expect(d.analysis.service.secondary[k]).toBeCloseTo(d.profile.secondaryPerUnitForce[k]! * d.losses.service.Pmean, 3)
    expect(d.analysis.atSupports.service.secondary[0]).toBeCloseTo(0, 3)
    const mid = d.stations.findIndex((s) => s.span === 0 && s.x === 4000)
    expect(d.analysis.service.secondary[mid]).toBeCloseTo(d.analysis.service.secondary[k]! / 2, 3) // straight line from 0 at the end support
  })
})
