/**
 * Anchorage zones, EN 1992-1-1 8.10.3 and 6.7: at each end of the tendon the design force of a
 * local effect, γP,unfav = 1.2 on the jacking force (2.4.2.2(3)), spreads from the anchor plate
 * into the prism the member offers it: across the member to the tendon's share of the width, up
 * and down to twice the plate centre's distance from the nearer face. The tie force behind the
 * plate in each direction (eq. (6.58)) needs bars at fyd; the concrete under the plate is a
 * partially loaded area at the strength at stressing (eq. (6.63)). A tendon built in segments has
 * an anchor plate at each joint too (an intermediate anchorage or the plate a coupler bears on),
 * checked alike at the tendon's depth there, in the section the joint sits in.
 */
import type { CheckResult } from '../contract'
import { ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import { anchorageBurstingForce, partiallyLoadedArea } from '../detailing/anchorage'
import type { MemberInput } from '../input/schema'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'

export interface AnchorageEnd {
  /** the member's end, or a joint of a tendon built in segments */
  end: 'left' | 'right' | 'joint'
  /** where, in words: 'Left end', 'Right end', 'Joint at support 3' */
  label: string
  /** design force of the anchorage, 1.2·Pjack of one tendon, N */
  FEd: number
  plateWidth: number
  plateHeight: number
  /** depth of the plate centre below the top face, mm */
  depth: number
  /** widths the force spreads to across and up-and-down, mm */
  bAcross: number
  bDepth: number
  /** tie forces behind the plate, eq. (6.58), N */
  tieAcross: number
  tieDepth: number
  /** bars for the ties at fyd, mm² */
  AsAcross: number
  AsDepth: number
  /** concrete under the plate: loaded area, distribution area, fcd at stressing, resistance */
  Ac0: number
  Ac1: number
  fcdTransfer: number
  FRdu: number
  utilisation: number
}

export const ANCHORAGE_FACTOR = 1.2 // EN 1992-1-1 2.4.2.2(3): γP,unfav for local effects

export function anchorageStage(input: MemberInput, section: MemberSection, profile: MemberProfile): StageOutcome<AnchorageEnd[]> {
  const t = input.tendon
  const flat = t.ductShape === 'flat'
  const plateWidth = input.anchorage.plateWidth ?? (flat ? 250 : 180) // common practice; the supplier's data govern
  const plateHeight = input.anchorage.plateHeight ?? (flat ? 90 : 180)
  const sec = section.properties
  const width = section.isSlab ? 1000 : input.section.kind === 'rectangle' ? (input.section.b as number) : (input.section.bw as number)
  const bAcross = section.isSlab ? t.spacing : width / t.count // each tendon's share of the width its anchors sit in
  const FEd = ANCHORAGE_FACTOR * section.sigmaJack * section.strand.Ap * t.strandsPerTendon
  const fyd = input.uls.fyk / input.uls.gammaS // EN 1992-1-1 3.2.7(2)
  const fcdTransfer = (input.uls.alphaCC * section.atTransfer.fck) / input.uls.gammaC // EN 1992-1-1 3.1.6(1) with fck(t), 3.1.2(5)
  const warnings: string[] = []
  const ecc = profile.profile.supportEcc
  const n = input.geometry.spans.length
  const places: Array<{ end: AnchorageEnd['end']; label: string; support: number }> = [
    { end: 'left', label: 'Left end', support: 0 },
    { end: 'right', label: 'Right end', support: n },
    ...input.tendon.joints.map((j) => ({ end: 'joint' as const, label: `Joint at support ${j.support}`, support: j.support - 1 })),
  ]
  const ends: AnchorageEnd[] = places.map(({ end, label, support }) => {
    // the plate centre at the tendon's depth below the top face (the top face is the same over a drop)
    const local = section.at(Math.min(support, n - 1), support < n ? 0 : (input.geometry.spans[n - 1] as number))
    const h = local.properties.h
    const depth = sec.yt + (ecc[support] as number)
    const bDepth = Math.min(h, 2 * Math.min(depth, h - depth)) // symmetric prism about the plate centre
    const aAcross = Math.min(plateWidth, bAcross)
    const aDepth = Math.min(plateHeight, bDepth)
    if (plateWidth > bAcross || plateHeight > bDepth) warnings.push(`Anchorage, ${label.toLowerCase()}: the anchor plate is larger than the concrete the tendon has there; widen the spacing or use a smaller anchor.`)
    const tieAcross = anchorageBurstingForce({ F: FEd, a: aAcross, b: bAcross }) // EN 1992-1-1 eq. (6.58)
    const tieDepth = anchorageBurstingForce({ F: FEd, a: aDepth, b: bDepth }) // EN 1992-1-1 eq. (6.58)
    // Ac1: similar to the plate and concentric with it, within the prism, at most 3 times its sides (6.7(2), Figure 6.29)
    const scale = Math.max(1, Math.min(3, bAcross / plateWidth, bDepth / plateHeight))
    const Ac0 = plateWidth * plateHeight
    const Ac1 = Ac0 * scale * scale
    const FRdu = partiallyLoadedArea({ Ac0, Ac1, fcd: fcdTransfer }) // EN 1992-1-1 eq. (6.63)
    return {
      end, label, FEd, plateWidth, plateHeight, depth, bAcross, bDepth, tieAcross, tieDepth, AsAcross: tieAcross / fyd, AsDepth: tieDepth / fyd,
      Ac0, Ac1, fcdTransfer, FRdu, utilisation: FEd / FRdu,
    }
  })
  const worst = ends.reduce((a, b) => (b.utilisation > a.utilisation ? b : a))
  const checks: CheckResult[] = [ratioCheck({
    id: 'detailing.anchorageBearing', group: 'detailing', title: 'Concrete under the anchor plate at stressing', clause: 'EN 1992-1-1 6.7 eq. (6.63), 2.4.2.2(3)',
    actual: worst.FEd, limit: worst.FRdu, unit: 'kN', location: worst.label,
    note: `1.2·Pjack of one tendon against fcd(t) = ${fcdTransfer.toFixed(1)} MPa at ${input.materials.ageAtStressing} days; the anchor's approval (ETA) governs where it asks for more`,
  })]
  return { result: ends, checks, warnings }
}
