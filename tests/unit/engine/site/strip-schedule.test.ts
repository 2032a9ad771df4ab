import { describe, expect, it } from 'vitest'
import { DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { parseMemberInput } from '../../../../shared/engine/input/schema'
import { stressingSchedule } from '../../../../shared/engine/site/stressing'
import type { StressingInput } from '../../../../shared/engine/site/stressing'
import { tendonSegments } from '../../../../shared/engine/prestress/segments'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import { fieldOf, rel } from '../../../helpers/engine'

describe('stressing schedule of a slab strip, tendon by tendon across the width', () => {
  it('width / spacing tendons, rounded, each with its mark, ends, jacking force and extension', () => {
    // demo strip: tendons at 750 mm; 6.0 m of slab → 6000/750 = 8 tendons
    const d = designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, stressing: 'left' }, site: { stripWidth: 6000, alternateEnds: 'yes' } }, { proposal: false })
    const t = d.site.stressing.tendons
    expect(t.map((x) => x.id)).toEqual(['T1', 'T2', 'T3', 'T4', 'T5', 'T6', 'T7', 'T8'])
    expect(t.map((x) => x.ends)).toEqual(['left', 'right', 'left', 'right', 'left', 'right', 'left', 'right'])
    for (const x of t) expect(x.Pjack).toBeCloseTo(d.jacking.sigmaJack * 3 * 100, 6) // σ at the jack × 3 strands × 100 mm² (prEN 10138-3)
    // a tendon from the right is the mirror of one from the left on this symmetric strip: the same extension
    expect(rel(t[1]!.extension.total, t[0]!.extension.total)).toBeLessThan(1e-9)
    expect(t[0]!.extension.right).toBeNull()
    expect(t[1]!.extension.left).toBeNull()
  })

  it('rounds to the nearest tendon: 6.4 m / 750 mm = 8.53 → 9 tendons; the explicit count overrides the width', () => {
    expect(designMember({ ...DEMO_PS2, site: { stripWidth: 6400 } }, { proposal: false }).site.stressing.tendons).toHaveLength(9)
    expect(designMember({ ...DEMO_PS2, site: { stripWidth: 6400, tendons: 3 } }, { proposal: false }).site.stressing.tendons).toHaveLength(3)
    expect(designMember(DEMO_PS2, { proposal: false }).site.stressing.tendons).toHaveLength(1) // no width: one typical tendon
  })

  it('a width that holds no tendon, or too many, is refused in words', () => {
    const wide = { ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, spacing: 1500 } }
    expect(fieldOf(() => designMember({ ...wide, site: { stripWidth: 600 } }, { proposal: false }))).toBe('site.stripWidth')
    expect(() => designMember({ ...wide, site: { stripWidth: 600 } }, { proposal: false })).toThrow('a width of 0.60 m holds no tendon at 1500 mm spacing; give at least 0.75 m')
    expect(() => designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, spacing: 300 }, site: { stripWidth: 99000 } }, { proposal: false })).toThrow(/holds 330 tendons at 300 mm spacing; the schedule lists at most 200/)
    expect(() => parseMemberInput({ ...DEMO_PS2, site: { stripWidth: 100 } })).toThrow('Width of slab on the stressing schedule (slab strips) must be at least 0.5 m')
  })
})

describe('stressing schedule of a tendon in segments', () => {
  // straight tendon over two 10 m spans, wobble only: from one end ΔL = P0(1 − e^(−μkL))/(μk·Ep·Ap) (hand integral of eq. (5.45))
  const straight: TendonProfile = { spans: [10000, 10000], supportEcc: [0, 0, 0], spanEcc: [0, 0] }
  const base: StressingInput = { profile: straight, tendons: [{ id: 'T1', ends: 'both', Pjack: 600e3, Ap: 400 }], Ep: 195000, mu: 0.19, k: 0.01 / 1000, drawIn: 6 }
  const mk = 0.19 * 0.01 / 1000
  const oneSegment = (600e3 * (1 - Math.exp(-mk * 10000))) / (mk * 195000 * 400)

  it('two segments stressed from their outer ends: each extends as a 10 m tendon alone', () => {
    const r = stressingSchedule({ ...base, segments: tendonSegments(2, 'both', [{ support: 2, kind: 'intermediate-anchorage', stressed: 'neither' }]) })
    const t = r.tendons[0]!
    expect(t.segments.map((s) => [s.number, s.from, s.to, s.ends])).toEqual([[1, 1, 2, 'left'], [2, 2, 3, 'right']])
    expect(rel(t.segments[0]!.extension.left!, oneSegment)).toBeLessThan(1e-6)
    expect(t.segments[0]!.extension.right).toBeNull()
    expect(rel(t.segments[1]!.extension.right!, oneSegment)).toBeLessThan(1e-6)
    expect(rel(t.extension.total, 2 * oneSegment)).toBeLessThan(1e-6)
    // each segment's lock-off extension is its jack extension less its own draw-in (area method: ∫ΔP dx = Δ·Ep·Ap)
    for (const s of t.segments) expect(s.extensionAfterLockOff).toBeCloseTo(s.extension.total - 6, 3)
    expect(t.length).toBeCloseTo(20000, 9)
  })

  it('a coupler stressed from the left: segment 1 at the coupler, the coupled segment from the far end; a measured value per segment', () => {
    const segments = tendonSegments(2, 'right', [{ support: 2, kind: 'coupler', stressed: 'left' }])
    const r = stressingSchedule({ ...base, segments, measured: [{ id: 'T1', segment: 2, end: 'right', extension: oneSegment * 1.1 }] })
    const t = r.tendons[0]!
    expect(t.segments.map((s) => s.ends)).toEqual(['right', 'right'])
    expect(t.segments[0]!.words).toBe('supports 1 to 2, coupler at 2')
    expect(t.extension.left).toBeNull()
    expect(t.checks[0]!.segment).toBe(2)
    expect(t.checks[0]!.deviation).toBeCloseTo(0.1, 6)
    expect(t.accepted).toBe(false)
    expect(fieldOf(() => stressingSchedule({ ...base, segments, measured: [{ id: 'T1', segment: 3, extension: 100 }] }))).toBe('measured.0.segment')
    expect(fieldOf(() => stressingSchedule({ ...base, segments, measured: [{ id: 'T1', segment: 1, end: 'left', extension: 100 }] }))).toBe('measured.0.end')
  })
})
