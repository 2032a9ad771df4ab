/**
 * Section stage: gross section, concrete at 28 days and at stressing, strand and jacking, the
 * strands in the width modelled, and the eccentricity limits the covers and ducts leave.
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

  return {
    result: {
      properties: sec, outline: sectionOutline(input), isSlab, width, tributaryWidth: trib, spanDepth,
      fck, at28, atTransfer, EI: at28.Ecm * sec.I, strand, jacking, tendonsPerWidth, strands, Ap, sigmaJack, Pjack,
      eccentricity: { top: eTop, bottom: eBottom, dTop, dBottom, coverForBond },
      bonded: t.bond === 'bonded',
    },
    checks: [],
    warnings,
  }
}
