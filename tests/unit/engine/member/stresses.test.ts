import { describe, expect, it } from 'vitest'
import { fibreStresses } from '../../../../shared/engine/checks/stresses'
import { designForService, ONE_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('stresses stage', () => {
  const d = designForService(parsed(ONE_SPAN_SLAB))
  it('limits: 0.6 fck(t) at transfer, 0.6 fck characteristic, 0.45 fck quasi-permanent, 0.75 fpk in the tendon (EN 1992-1-1 5.10.2.2(5), 7.2(2), 7.2(3), 7.2(5))', () => {
    expect(d.stresses.limits.transfer.compression).toBeCloseTo(0.6 * d.section.atTransfer.fck, 9)
    expect(d.stresses.limits.characteristic.compression).toBeCloseTo(0.6 * 32, 9)
    expect(d.stresses.limits.quasiPermanent.compression).toBeCloseTo(0.45 * 32, 9)
    expect(d.stresses.limits.tendonService).toBeCloseTo(0.75 * 1860, 9)
  })
  it('mid-span stress at transfer from Navier with rsup·P and rinf·P (EN 1992-1-1 5.10.9: 1.1 and 0.9 for bonded post-tensioning)', () => {
    const r = d.stresses.sections.findIndex((s) => s.x === 4000)
    const s = d.stresses.sections[r]!
    const k = d.stresses.sectionStations[r]!
    const sec = d.section.properties
    const top = [1.1, 0.9].map((f) => fibreStresses({ A: sec.A, Zt: sec.Zt, Zb: sec.Zb, P: f * d.losses.transfer.P[k]!, e: s.e, M: s.moments.selfWeight }).top)
    expect(s.envelope.transfer.topMin).toBeCloseTo(Math.min(...top), 9)
    expect(s.envelope.transfer.topMax).toBeCloseTo(Math.max(...top), 9)
  })
  it('the checks name the section where each limit is most used', () => {
    const c = d.checks.find((k) => k.id === 'characteristic.top.compression')!
    expect(c.location).toMatch(/Span 1|Support/)
    expect(c.limit).toBeCloseTo(0.6 * 32, 9)
  })
})

describe('the force at a kink over a support (inflection 0)', () => {
  it('the support section takes the mean of the forces just left and just right of the kink (friction at the kink, eq. (5.45), split evenly)', () => {
    const input = parsed(ONE_SPAN_SLAB, { geometry: { spans: [7000, 9000] }, profile: { mode: 'deepest', inflection: 0 }, tendon: { ...ONE_SPAN_SLAB.tendon, stressing: 'left' }, losses: { drawIn: 0 } })
    const d = designForService(input)
    const right = d.stations.findIndex((s) => s.span === 1 && s.x === 0)
    const left = right - 1
    expect(d.stations[left]!.X).toBe(d.stations[right]!.X)
    const Pl = d.losses.transfer.P[left]!
    const Pr = d.losses.transfer.P[right]!
    expect(Pl).toBeGreaterThan(Pr) // stressed from the left without draw-in: the kink's friction lies between them
    const s = d.stresses.sections.find((x) => x.id === 'support-2')!
    expect(s.force.transfer).toBeCloseTo((Pl + Pr) / 2, 6)
  })
})
