/**
 * Drops and thickened bands over supports: the deeper section's properties, the secondary moment of
 * the centroid's step, the member's self-weight, the local section in the stresses and the ULS,
 * and the messages for a drop in the wrong place — each against statics, the flexibility method
 * written out by hand, or textbook section properties.
 */
import { describe, expect, it } from 'vitest'
import { designMember } from '../../../../shared/engine/member/design'
import { prestressMoments } from '../../../../shared/engine/prestress/secondary'
import { parseMemberInput } from '../../../../shared/engine/input/schema'
import type { MemberInputDraft } from '../../../../shared/engine/input/schema'
import { sectionStage } from '../../../../shared/engine/member/section'
import { loadsStage } from '../../../../shared/engine/member/loads'
import { stationGrid } from '../../../../shared/engine/member/stations'
import { TWO_SPAN_SLAB } from '../../../helpers/members'

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30)

/** Invented: the two 8 m spans of 250 mm slab with a 1.6 m drop each side of the middle support, 150 mm deep. */
const DROPPED: MemberInputDraft = {
  ...TWO_SPAN_SLAB,
  section: { kind: 'slab-strip', h: 250, drops: [{ support: 2, left: 1600, right: 1600, depth: 150 }] },
}

describe('the section over a drop', () => {
  it('a full-width drop is a deeper rectangle: A = b·h, I = b·h³/12 (textbook)', () => {
    const s = sectionStage(parseMemberInput(DROPPED)).result
    const d = s.drops[0]!
    const h = 250 + 150
    expect(d.local.properties.A).toBeCloseTo(1000 * h, 6) // b·h
    expect(rel(d.local.properties.I, (1000 * h ** 3) / 12)).toBeLessThan(1e-12) // b·h³/12
    expect(d.local.shift).toBeCloseTo(h / 2 - 250 / 2, 9) // the centroid drops by half the added depth
    // the top limit is the plain section's; the bottom one reaches down into the drop
    expect(d.local.eccentricity.top - d.local.shift).toBeCloseTo(s.eccentricity.top, 9)
    expect(d.local.eccentricity.bottom).toBeCloseTo(s.eccentricity.bottom + 150 - d.local.shift, 9)
  })

  it('a drop narrower than the strip is a T: A and the centroid by hand', () => {
    const s = sectionStage(parseMemberInput({ ...DROPPED, section: { kind: 'slab-strip', h: 250, drops: [{ support: 2, left: 1600, right: 1600, depth: 150, width: 400 }] } })).result
    const p = s.drops[0]!.local.properties
    // hand calculation: flange 1000 × 250 (centroid 125 down), web 400 × 150 (centroid 325 down)
    const A = 1000 * 250 + 400 * 150 // = 310 000 mm²
    const yt = (1000 * 250 * 125 + 400 * 150 * 325) / A // = 163.71 mm
    const I = (1000 * 250 ** 3) / 12 + 1000 * 250 * (yt - 125) ** 2 + (400 * 150 ** 3) / 12 + 400 * 150 * (325 - yt) ** 2 // parallel axes
    expect(p.A).toBeCloseTo(A, 6)
    expect(p.yt).toBeCloseTo(yt, 6)
    expect(rel(p.I, I)).toBeLessThan(1e-12)
  })

  it('the stations inside the drop take its section, its ends within the span the plain one', () => {
    const s = sectionStage(parseMemberInput(DROPPED)).result
    expect(s.at(0, 8000).properties.h).toBe(400) // over the support
    expect(s.at(1, 0).properties.h).toBe(400)
    expect(s.at(0, 7000).properties.h).toBe(400)
    expect(s.at(0, 6400).properties.h).toBe(250) // the drop's edge: the plain section (the shallower side governs)
    expect(s.at(1, 1600).properties.h).toBe(250)
    expect(s.at(0, 4000).properties.h).toBe(250)
    expect(s.spanEI[0]).toEqual([{ from: 0, to: 6400, EI: s.EI }, { from: 6400, to: 8000, EI: s.drops[0]!.local.EI }])
  })
})

describe('the secondary moment of a drop (the step of the centroid)', () => {
  const P = 1000e3 // N
  const shift = 75 // mm

  it('a simply supported span: determinate, no secondary moment; the total is the primary P·δ over the drop (statics)', () => {
    const r = prestressMoments({ spans: [8000], profile: { spans: [8000], supportEcc: [0, 0], spanEcc: [0], inflection: 0 }, P, centroidShifts: [{ span: 0, from: 3000, to: 5000, shift }] })
    expect(Math.abs(r.secondaryAt(0, 4000))).toBeLessThan(1e-6 * P * shift)
    expect(r.totalAt(0, 4000)).toBeCloseTo(P * shift, 3) // M1 = −P·e, e = −δ from the local centroid
    expect(Math.abs(r.totalAt(0, 2000))).toBeLessThan(1e-6 * P * shift)
  })

  it('two equal prismatic spans, a drop a = L/5 each side of the middle support: M2 = −3Pδ(2aL − a²)/(2L²) (flexibility method, by hand)', () => {
    const L = 8000
    const a = 1600
    const r = prestressMoments({
      spans: [L, L], profile: { spans: [L, L], supportEcc: [0, 0, 0], spanEcc: [0, 0], inflection: 0 }, P,
      centroidShifts: [{ span: 0, from: L - a, to: L, shift }, { span: 1, from: 0, to: a, shift }],
    })
    // δ10 = 2·Pδ/EI·∫(x/L)dx over [L − a, L] = Pδ(2aL − a²)/(EI·L); δ11 = 2L/(3EI); X = −δ10/δ11
    const X = (-3 * P * shift * (2 * a * L - a * a)) / (2 * L * L) // = −0.54·Pδ for a = L/5
    expect(rel(r.secondary[1]!, X)).toBeLessThan(1e-9)
    expect(rel(X, -0.54 * P * shift)).toBeLessThan(1e-12)
    // the prestress reactions are self-equilibrating (no external load)
    expect(Math.abs(r.reactions.reduce((s, v) => s + v, 0))).toBeLessThan(1e-6 * P)
  })

  it('the same with the drop stiffer (EI_d = 4 EI): the flexibility integrals over the two stiffnesses (by hand)', () => {
    const L = 8000
    const a = 1600
    const EI = 1
    const EId = 4
    const r = prestressMoments({
      spans: [L, L], EI: [[{ from: 0, to: L - a, EI }, { from: L - a, to: L, EI: EId }], [{ from: 0, to: a, EI: EId }, { from: a, to: L, EI }]],
      profile: { spans: [L, L], supportEcc: [0, 0, 0], spanEcc: [0, 0], inflection: 0 }, P,
      centroidShifts: [{ span: 0, from: L - a, to: L, shift }, { span: 1, from: 0, to: a, shift }],
    })
    const d10 = (2 * P * shift * (2 * a * L - a * a)) / (2 * L * EId)
    const d11 = (2 / (3 * L * L)) * ((L - a) ** 3 / EI + (L ** 3 - (L - a) ** 3) / EId)
    expect(rel(r.secondary[1]!, -d10 / d11)).toBeLessThan(1e-9)
  })
})

describe('a member with a drop', () => {
  it('its self-weight: the reactions add up to ρ·(A·ΣL + ΔA·length of the drop) (equilibrium)', () => {
    const input = parseMemberInput(DROPPED)
    const section = sectionStage(input).result
    const loads = loadsStage(input, section, stationGrid(input)).result
    const total = loads.permanent.reactions.reduce((s, v) => s + v, 0)
    const rho = input.materials.density
    const expected = rho * 1000 * 250 * 16000 + rho * 1000 * 150 * 3200 + input.loads.superimposed * 1000 * 16000
    expect(rel(total, expected)).toBeLessThan(1e-9)
  })

  it('the support is checked on the deeper section: its top-fibre tension is lower than without the drop, and the report carries the drop', () => {
    const plain = designMember(TWO_SPAN_SLAB)
    const dropped = designMember(DROPPED)
    const at = (d: typeof plain): number => -d.sections.find((s) => s.id === 'support-2')!.envelope.characteristic.topMin
    expect(at(dropped)).toBeLessThan(at(plain))
    const k = dropped.series.X.findIndex((x) => Math.abs(x - 8000) < 1e-6)
    expect(dropped.series.depth[k]).toBe(400)
    expect(dropped.series.depth[0]).toBe(250)
    // the absolute height of the tendon is the same with and without the drop: yt + e
    expect(dropped.series.centroid[k]! + dropped.series.e[k]!).toBeCloseTo(plain.series.centroid[k]! + plain.series.e[k]!, 6)
  })

  it('the hogging resistance over the support grows with the drop (a deeper lever arm)', () => {
    const plain = designMember(TWO_SPAN_SLAB)
    const dropped = designMember(DROPPED)
    const MRd = (d: typeof plain): number => d.uls.sections.find((s) => s.id === 'support-2')!.hogging!.MRd
    expect(MRd(dropped)).toBeGreaterThan(1.2 * MRd(plain))
  })

  it('the chairs over a drop stand on its soffit: their heights grow by the drop\'s depth where the tendon is the same (geometry)', () => {
    const plain = designMember(TWO_SPAN_SLAB, { proposal: false })
    const dropped = designMember(DROPPED, { proposal: false })
    const row = (d: typeof plain, span: number, x: number) => d.site.heights.rows.find((r) => r.span === span && Math.abs(r.x - x) < 1)!
    expect(row(dropped, 0, 8000).underside - row(plain, 0, 8000).underside).toBeCloseTo(150, 6) // over the support, inside the drop
    expect(row(dropped, 0, 4000).underside).toBeCloseTo(row(plain, 0, 4000).underside, 6) // mid-span, plain soffit
    expect(dropped.site.heights.rows.some((r) => r.span === 0 && Math.abs(r.x - 6400) < 1)).toBe(true) // a row at the drop's edge
    expect(dropped.site.heights.outside).toBe(0)
  })

  it('mirror symmetry: the symmetric member with its symmetric drop has symmetric stresses', () => {
    const d = designMember(DROPPED)
    const find = (id: string) => d.sections.find((s) => s.id === id)!
    const left = d.sections.filter((s) => s.span === 0 && s.kind === 'tenth')
    let checked = 0
    for (const s of left) {
      const m = d.sections.find((o) => o.span === 1 && Math.abs(o.x - (8000 - s.x)) < 1e-6 && o.kind === 'tenth')
      if (!m) continue
      expect(Math.abs(s.envelope.characteristic.topMin - m.envelope.characteristic.topMin)).toBeLessThan(1e-6)
      checked++
    }
    expect(checked).toBeGreaterThan(5)
    expect(find('support-2')).toBeDefined()
  })
})

describe('messages for a drop in the wrong place', () => {
  const message = (draft: MemberInputDraft): string => {
    try { parseMemberInput(draft); return '' } catch (e) { return String((e as Error).message) }
  }
  const withDrops = (drops: unknown[], extra: Partial<MemberInputDraft> = {}): MemberInputDraft => ({ ...DROPPED, ...extra, section: { kind: 'slab-strip', h: 250, drops } as MemberInputDraft['section'] })

  it('longer than its span, beyond the ends, on a missing support, at a free tip, meeting another', () => {
    expect(message(withDrops([{ support: 2, left: 8000, right: 1000, depth: 150 }]))).toMatch(/Drop 1: 8\.00 m to the left is not shorter than span 1 \(8\.00 m\)/)
    expect(message(withDrops([{ support: 1, left: 500, right: 1000, depth: 150 }]))).toMatch(/Drop 1: support 1 is the left end/)
    expect(message(withDrops([{ support: 3, left: 500, right: 1000, depth: 150 }]))).toMatch(/Drop 1: support 3 is the right end/)
    expect(message(withDrops([{ support: 5, left: 500, right: 0, depth: 150 }]))).toMatch(/Drop 1: there is no support 5/)
    expect(message(withDrops([{ support: 3, left: 500, right: 0, depth: 150 }], { geometry: { spans: [8000, 2000], supports: ['pinned', 'pinned', 'free'] } }))).toMatch(/free tip of a cantilever/)
    expect(message(withDrops([{ support: 1, left: 0, right: 4500, depth: 150 }, { support: 2, left: 4000, right: 0, depth: 150 }]))).toMatch(/Drop 2: it meets drop 1 in span 1/)
    expect(message(withDrops([{ support: 2, left: 1000, right: 1000, depth: 150, width: 1200 }]))).toMatch(/exceeds the strip's 1000 mm/)
    expect(message(withDrops([{ support: 2, left: 1000, right: 1000, depth: 150 }]))).toBe('')
  })
})
