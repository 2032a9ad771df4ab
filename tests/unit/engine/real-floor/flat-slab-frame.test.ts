/**
 * A real floor: one line of a post-tensioned flat slab as an equivalent frame (EN 1992-1-1 Annex I,
 * full panel width for vertical loads — from memory, check the text): four 8.4 m spans and a 1.8 m
 * edge cantilever, drop panels over the columns (non-prismatic spans), columns above and below each
 * support as rotational springs. Checked against an independent dense ml-matrix stiffness model,
 * statics, and the hand rules for the anchorage zone and the fire table.
 */
import { describe, expect, it } from 'vitest'
import { analyseContinuousBeam, columnStiffness, spanUnitResponses } from '../../../../shared/engine/analysis/continuous-beam'
import type { EISegment, SupportKind } from '../../../../shared/engine/analysis/continuous-beam'
import { prestressMoments } from '../../../../shared/engine/prestress/secondary'
import { equivalentLoads } from '../../../../shared/engine/prestress/equivalent-loads'
import { tendonEccentricity } from '../../../../shared/engine/prestress/profile'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import { anchorageBurstingForce } from '../../../../shared/engine/detailing/anchorage'
import { fireTabulated } from '../../../../shared/engine/fire/tabulated'
import { denseBeam } from '../analysis/dense-beam'

const Ecm = 33000 // MPa, C30/37 (EN 1992-1-1 Table 3.1)
const width = 7200 // panel width, mm
const h = 250 // slab, mm
const hDrop = 400 // slab + drop panel, mm
const drop = 1400 // drop panel each side of a column line, mm
const spans = [8400, 8400, 8400, 8400, 1800]
const supports: SupportKind[] = ['pinned', 'pinned', 'pinned', 'pinned', 'pinned', 'free']
const EIslab = (Ecm * width * h ** 3) / 12 // gross section (Annex I)
const EIdrop = (Ecm * width * hDrop ** 3) / 12
// drop panels either side of every interior column line (the cantilever's root included)
const EI: EISegment[][] = spans.map((L, i) => {
  const left = i === 0 ? 0 : drop // no drop panel at the edge column line
  const right = i < spans.length - 1 ? drop : 0
  const cuts: EISegment[] = []
  if (left > 0) cuts.push({ from: 0, to: left, EI: EIdrop })
  cuts.push({ from: left, to: L - right, EI: EIslab })
  if (right > 0) cuts.push({ from: L - right, to: L, EI: EIdrop })
  return cuts
})
const Icol = 400 ** 4 / 12
// columns above and below add (storey 3.2 m, far ends fixed); none at the cantilever tip
const kColumn = 2 * columnStiffness({ E: Ecm, I: Icol, height: 3200, farEnd: 'fixed' })
const springs = supports.map((s) => (s === 'free' ? 0 : kColumn))
const gk = 25e-6 * h * width + 1.5e-3 * width // self-weight 25 kN/m³ and 1.5 kPa finishes, N/mm
const qk = 3.0e-3 * width // 3 kPa imposed, N/mm

describe('flat-slab frame with drop panels, columns and an edge cantilever', () => {
  it('gravity: agrees with a dense ml-matrix stiffness model at every node, reactions and column moments', () => {
    const loads = spans.map((_, span) => ({ kind: 'udl' as const, span, w: gk }))
    const mine = analyseContinuousBeam({ spans, EI, supports, springs, loads })
    const dense = denseBeam(spans, EI, supports, springs, loads, 12)
    const scale = Math.max(...spans.flatMap((_, i) => dense.nodesOf(i).map((x) => Math.abs(dense.momentAt(i, x)))))
    spans.forEach((_, i) => dense.nodesOf(i).forEach((x) => expect(Math.abs(mine.momentAt(i, x) - dense.momentAt(i, x)) / scale).toBeLessThan(1e-7)))
    dense.reactionCouples.forEach((c, j) => expect(Math.abs((mine.reactionCouples[j] as number) - c) / scale).toBeLessThan(1e-7))
    // the cantilever root carries −w·a²/2 (statics) on its side of the column
    expect(mine.momentAt(4, 0)).toBeCloseTo((-gk * 1800 ** 2) / 2, 0)
    // total reaction = total load (statics)
    expect(mine.reactions.reduce((s, v) => s + v, 0)).toBeCloseTo(gk * spans.reduce((s, v) => s + v, 0), 3)
  })

  it('pattern loading (EN 1992-1-1 5.1.3) from unit responses: alternate spans equal a direct analysis', () => {
    const u = spanUnitResponses({ spans, EI, supports, springs })
    const pattern = spans.map((_, i) => gk + (i % 2 === 0 ? qk : 0))
    const direct = analyseContinuousBeam({ spans, EI, supports, springs, loads: pattern.map((w, span) => ({ kind: 'udl' as const, span, w })) })
    const viaUnits = (j: number): number => pattern.reduce((s, w, i) => s + w * (u.unit(i).supportMoments[j] as number), 0)
    supports.forEach((_, j) => expect(viaUnits(j)).toBeCloseTo(direct.supportMoments[j] as number, 0))
    expect(u.combine(pattern).momentAt(2, 4200)).toBeCloseTo(direct.momentAt(2, 4200), 0)
  })

  it('prestress: secondary moments include the columns; the dense model gives the same total moments', () => {
    const profile: TendonProfile = { spans, supportEcc: [0, -85, -85, -85, -85, 0], spanEcc: [85, 85, 85, 85, -30], lowPointAt: [0.45, 0.5, 0.5, 0.5, 0.5], inflection: 0.1 }
    const P = 7200 * 1.0 * h // precompression 1.0 MPa over the panel (common practice range)
    const m = prestressMoments({ spans, EI, supports, springs, profile, P })
    const dense = denseBeam(spans, EI, supports, springs, equivalentLoads(profile, P), 12)
    const scale = P * 85
    spans.forEach((_, i) => dense.nodesOf(i).forEach((x) => expect(Math.abs(m.totalAt(i, x) - dense.momentAt(i, x)) / scale).toBeLessThan(1e-7)))
    // the cantilever is determinate: no secondary moment along it (statics)
    expect(Math.abs(m.secondaryAt(4, 900))).toBeLessThan(1e-6 * scale)
    // with columns the secondary moment steps across an interior support by the column couple (joint equilibrium)
    const jump = (m.secondaryEnds[2] as { start: number }).start - (m.secondaryEnds[1] as { end: number }).end
    expect(jump).toBeCloseTo(-(m.reactionCouples[2] as number), 0)
    expect(Math.abs(m.reactionCouples[2] as number)).toBeGreaterThan(1e3)
    // total = primary + secondary at mid-span of span 2 (5.10.7)
    expect(m.totalAt(1, 4200)).toBeCloseTo(-P * tendonEccentricity(profile, 1, 4200) + m.secondaryAt(1, 4200), 0)
  })

  it('anchorage at the cantilever tip and fire resistance of the slab (hand rules)', () => {
    // a tendon of 4 strands at 0.75·fpk·Ap = 0.75 × 1860 × 150 × 4 = 836.9 kN, ×1.2 for local effects
    // (2.4.2.2(3), from memory); anchor plate 150 mm wide spreading to 250 mm (slab depth):
    // T = ¼·(250 − 150)/250·F (eq. (6.58))
    const F = 1.2 * 0.75 * 1860 * 150 * 4
    expect(anchorageBurstingForce({ F, a: 150, b: h })).toBeCloseTo(0.25 * (100 / 250) * F, 6)
    // R90 flat slab with strands (Table 5.9 from memory, to be checked: hs 200, a 25 + 15 mm)
    const fire = fireTabulated({ member: 'flat-slab', rating: 'R90', tendon: 'strand', thickness: h, axisDistance: 45 })
    expect(fire.axisDistance).toBe(40)
    // thickness 200/250 = 0.80, axis distance 40/45 = 0.89: the axis distance governs
    expect(fire.governs).toBe('axis distance')
    expect(fire.utilisation).toBeCloseTo(40 / 45, 12)
  })
})
