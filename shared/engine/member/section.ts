/**
 * Section stage: gross section, concrete at 28 days and at stressing, strand and jacking, the
 * strands in the width modelled, and the eccentricity limits the covers and ducts leave. A drop or
 * thickened band over a support deepens the section below its soffit over a length each side: its
 * own properties, stiffness, outline and eccentricity limits, with e measured from its own centroid.
 */
import { fail } from '../common/guards'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { sectionProperties } from '../section'
import type { SectionProperties } from '../section'
import { CONCRETE_CLASSES, concreteAtAge, concreteProperties } from '../materials/concrete'
import type { ConcreteAtAge, ConcreteProperties } from '../materials/concrete'
import { STRANDS, jackingLimits } from '../materials/strand'
import type { JackingLimits, Strand } from '../materials/strand'
import type { SectionOutline } from '../uls/bending'

export interface EccentricityLimits {
  /** greatest eccentricity above the centroid (a positive distance), mm */
  top: number
  /** greatest eccentricity below the centroid, mm */
  bottom: number
  /** top face to the tendon centroid at a high point, mm */
  dTop: number
  /** bottom face to the tendon centroid at a low point, mm */
  dBottom: number
  /** least cover to the duct for bond, EN 1992-1-1 Table 4.2, mm */
  coverForBond: number
}

/** The section over a drop (or the plain one): what the stages take at a point of the member. */
export interface LocalSection {
  properties: SectionProperties
  outline: SectionOutline
  /** Ecm·Ic of the local gross section, N·mm² */
  EI: number
  /** how far the local centroid lies below the plain section's, mm (0 outside a drop) */
  shift: number
  eccentricity: EccentricityLimits
}

export interface DropZone {
  /** the support it sits over, from 0 */
  support: number
  depth: number
  width: number
  /** the stretch of each span it covers, x from the span's left support, mm */
  parts: Array<{ span: number; from: number; to: number }>
  local: LocalSection
}

export interface MemberSection {
  properties: SectionProperties
  /** the outline the ULS and SLS section checks integrate over */
  outline: SectionOutline
  isSlab: boolean
  /** width of the member's section (slab strip: 1000 mm) */
  width: number
  /** width whose area loads the member, mm */
  tributaryWidth: number
  /** span / overall depth per span */
  spanDepth: number[]
  fck: number
  at28: ConcreteProperties
  atTransfer: ConcreteAtAge
  /** flexural stiffness of the gross section, Ecm·Ic, N·mm² */
  EI: number
  strand: Strand
  jacking: JackingLimits
  tendonsPerWidth: number
  /** strands in the width modelled */
  strands: number
  /** prestressing steel in the width modelled, mm² */
  Ap: number
  sigmaJack: number
  /** jacking force of all strands in the width modelled, N */
  Pjack: number
  eccentricity: EccentricityLimits
  bonded: boolean
  /** drops and thickened bands over supports, left to right */
  drops: DropZone[]
  /** the section at a point of a span: a drop's inside it (its ends at a support included, its ends in the span not), else the plain one */
  at(span: number, x: number): LocalSection
  /** each span's flexural stiffness: a number, or segments where drops deepen it */
  spanEI: Array<number | Array<{ from: number; to: number; EI: number }>>
}

/** The section's outline for the section-level checks (a slab strip is a 1 m wide rectangle). */
export function sectionOutline(input: MemberInput): SectionOutline {
  const s = input.section
  if (s.kind === 'slab-strip') return { kind: 'rectangle', b: 1000, h: s.h }
  if (s.kind === 'rectangle') return { kind: 'rectangle', b: s.b as number, h: s.h }
  return { kind: 'flanged', bw: s.bw as number, h: s.h, bf: s.bf as number, hf: s.hf as number }
}

export function sectionStage(input: MemberInput): StageOutcome<MemberSection> {
  const warnings: string[] = []
  const spans = input.geometry.spans
  const sec = sectionProperties(input.section)
  const isSlab = input.section.kind === 'slab-strip'
  const width = isSlab ? 1000 : input.section.kind === 'rectangle' ? (input.section.b as number) : (input.section.bf as number)
  const trib = isSlab ? 1000 : input.section.tributaryWidth ?? width
  if (trib < width && !isSlab) warnings.push('The loaded width is less than the section width: loads come only from the tributary width given.')

  const fck = CONCRETE_CLASSES[input.materials.concreteClass]
  const at28 = concreteProperties(fck)
  const atTransfer = concreteAtAge(fck, input.materials.ageAtStressing, input.materials.cement)

  const strand = STRANDS[input.tendon.strand]
  const jacking = jackingLimits(strand, input.annex)
  const tendonsPerWidth = isSlab ? 1000 / input.tendon.spacing : input.tendon.count // slab strip: 1000 mm / spacing
  const strands = tendonsPerWidth * input.tendon.strandsPerTendon
  const Ap = strands * strand.Ap
  const sigmaJack = input.tendon.jackingFactor * jacking.sigmaPmax // EN 1992-1-1 5.10.2.1: a share of σp,max
  const Pjack = sigmaJack * Ap

  // eccentricity limits: practice e = h/2 − cover − duct/2, less the strands' offset in the duct, since at high
  // and low points the tendon is pulled towards the centre of curvature, against the far side of the duct
  const t = input.tendon
  const offset = t.centroidOffset ?? Math.max(0, (t.ductHeight - strand.diameter) / 2)
  const dTop = t.coverTop + t.ductHeight / 2 + offset
  const dBottom = t.coverBottom + t.ductHeight / 2 + offset
  const eTop = sec.yt - dTop
  const eBottom = sec.yb - dBottom
  if (!(eTop > 0)) fail('tendon.coverTop', 'the top cover and duct reach below the centroid of the section')
  if (!(eBottom > 0)) fail('tendon.coverBottom', 'the bottom cover and duct reach above the centroid of the section')
  // EN 1992-1-1 Table 4.2: post-tensioned ducts — round: diameter; rectangular: greater of the smaller dimension or half the larger, at most 80 mm
  const coverForBond = Math.min(80, t.ductShape === 'round' ? t.ductHeight : Math.max(t.ductHeight, t.ductWidth / 2))

  // span/depth against the usual practice (from memory: slabs 35–45, band beams 20–30)
  const spanDepth = spans.map((L) => L / input.section.h)
  const sdMax = isSlab ? 45 : 30
  spanDepth.forEach((r, i) => {
    if (r > sdMax) warnings.push(`Span ${i + 1}: span/depth ${r.toFixed(1)} exceeds the usual ${sdMax} for this kind of member; check deflection.`)
  })

  const eccentricity = { top: eTop, bottom: eBottom, dTop, dBottom, coverForBond }
  const plain: LocalSection = { properties: sec, outline: sectionOutline(input), EI: at28.Ecm * sec.I, shift: 0, eccentricity }
  const drops = dropZones(input, plain, at28.Ecm)
  const at = (span: number, x: number): LocalSection => {
    for (const d of drops) {
      for (const p of d.parts) {
        if (p.span !== span) continue
        const L = spans[span] as number
        // the ends at a support belong to the drop; its ends within the span to the plain section
        const fromOk = p.from === 0 ? x >= -1e-6 : x > p.from + 1e-6
        const toOk = p.to === L ? x <= L + 1e-6 : x < p.to - 1e-6
        if (fromOk && toOk) return d.local
      }
    }
    return plain
  }
  const spanEI = spans.map((L, i) => {
    const parts = drops.flatMap((d) => d.parts.filter((p) => p.span === i).map((p) => ({ ...p, EI: d.local.EI }))).sort((a, b) => a.from - b.from)
    if (parts.length === 0) return plain.EI
    const segs: Array<{ from: number; to: number; EI: number }> = []
    let x = 0
    for (const p of parts) {
      if (p.from > x) segs.push({ from: x, to: p.from, EI: plain.EI })
      segs.push({ from: p.from, to: p.to, EI: p.EI })
      x = p.to
    }
    if (x < L) segs.push({ from: x, to: L, EI: plain.EI })
    return segs
  })

  return {
    result: {
      properties: sec, outline: plain.outline, isSlab, width, tributaryWidth: trib, spanDepth,
      fck, at28, atTransfer, EI: plain.EI, strand, jacking, tendonsPerWidth, strands, Ap, sigmaJack, Pjack,
      eccentricity,
      bonded: t.bond === 'bonded',
      drops, at, spanEI,
    },
    checks: [],
    warnings,
  }
}

/**
 * The drops of the member: each a deeper section (the plain one with a thickening of depth h_d and
 * width b_d below its soffit) over its stretch of the spans each side of its support. e is measured
 * from the local centroid, which lies lower by the shift; the top limit is the plain one's, the
 * bottom limit comes from the drop's soffit (the tendon may follow it).
 */
function dropZones(input: MemberInput, plain: LocalSection, Ecm: number): DropZone[] {
  const spans = input.geometry.spans
  const g = input.section
  const base = plain.properties
  return [...g.drops].sort((a, b) => a.support - b.support).map((d) => {
    const j = d.support - 1
    const beam = g.kind !== 'slab-strip' && g.kind !== 'rectangle'
    const b = g.kind === 'slab-strip' ? 1000 : g.kind === 'rectangle' ? (g.b as number) : (g.bw as number)
    const width = beam ? b : Math.min(d.width ?? b, b)
    const h = g.h + d.depth
    // a slab or rectangle with a narrower drop is a flanged section: the slab the flange, the drop its web
    const properties = beam ? sectionProperties({ ...g, h }) : width >= b ? sectionProperties({ kind: g.kind, h, b }) : { ...sectionProperties({ kind: 'flanged', h, bw: width, bf: b, hf: g.h }), kind: g.kind, u: base.u, h0: base.h0 }
    const outline: SectionOutline = beam
      ? { kind: 'flanged', bw: g.bw as number, h, bf: g.bf as number, hf: g.hf as number }
      : width >= b ? { kind: 'rectangle', b, h } : { kind: 'flanged', bw: width, h, bf: b, hf: g.h }
    const shift = properties.yt - base.yt
    const e = plain.eccentricity
    const local: LocalSection = {
      properties, outline, EI: Ecm * properties.I, shift,
      eccentricity: { ...e, top: properties.yt - e.dTop, bottom: properties.yb - e.dBottom },
    }
    const parts: DropZone['parts'] = []
    if (j > 0 && d.left > 0) parts.push({ span: j - 1, from: (spans[j - 1] as number) - d.left, to: spans[j - 1] as number })
    if (j < spans.length && d.right > 0) parts.push({ span: j, from: 0, to: d.right })
    return { support: j, depth: d.depth, width, parts, local }
  })
}
