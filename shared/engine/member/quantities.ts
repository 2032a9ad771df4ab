/**
 * Post-tensioning quantities and the strands in their duct: strand mass per unit of floor, anchorages
 * and a passive-steel estimate for the cost plan, and whether the strands fit the duct chosen —
 * side by side in a flat duct, by the ratio of areas in a round one (common practice; the
 * supplier's data govern).
 */
import type { CheckResult } from '../contract'
import { ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'

/** Density of prestressing strand and reinforcing steel, kg/m³ (EN 1991-1-1 Table A.4: 77–78.5 kN/m³). */
const STEEL_DENSITY = 7850
/** Least ratio of a round duct's area to its strands' area (common practice for threading and grouting). */
const ROUND_DUCT_RATIO = 2

export interface MemberQuantities {
  /** length of one tendon along the member, m */
  tendonLength: number
  /** strand per tendon and in the width designed, kg */
  strandPerTendon: number
  /** strand per m² of floor (a beam over the floor width it carries), kg/m² */
  strandRate: number
  /** anchorages (live and dead) in the width designed, those at the joints included */
  anchorages: number
  /** couplers in the width designed */
  couplers: number
  /** passive bars provided per m² of floor, each layer taken over the whole length (an upper estimate), kg/m² */
  barRate: number
  /** the duct's room for its strands: the strands' width side by side (flat duct) or the area ratio (round duct) */
  ductFill: number
}

export function quantitiesStage(input: MemberInput, section: MemberSection, profile: MemberProfile): StageOutcome<MemberQuantities> {
  const t = input.tendon
  const length = profile.length // mm, along the member (the drape adds well under 1 %)
  const Ap1 = section.strand.Ap
  const strandPerTendon = (t.strandsPerTendon * Ap1 * length * STEEL_DENSITY) / 1e9 // mm³ → m³ × kg/m³
  const strandInWidth = strandPerTendon * section.tendonsPerWidth
  const floor = (length / 1000) * (section.tributaryWidth / 1000) // m² of floor: the 1 m strip, or the width a beam carries
  const bars = input.uls.barsBottom.area + input.uls.barsTop.area
  const barRate = (bars * STEEL_DENSITY) / 1e6 / (section.tributaryWidth / 1000) // mm² → kg per m run, over the floor width
  // per tendon: its two end anchorages; an intermediate anchorage anchors both segments at the joint, a coupler
  // joins the next segment's strands to the one anchorage of the segment stressed before it
  const intermediate = t.joints.filter((j) => j.kind === 'intermediate-anchorage').length
  const coupled = t.joints.length - intermediate
  const anchoragesPerTendon = 2 + 2 * intermediate + coupled
  const flat = t.ductShape === 'flat'
  const ductFill = flat ? t.strandsPerTendon * section.strand.diameter : (Math.PI * t.ductHeight ** 2) / 4 / (t.strandsPerTendon * Ap1)
  const checks: CheckResult[] = [flat
    ? ratioCheck({ id: 'tendon.ductFit', group: 'tendon', title: 'Strands side by side in the flat duct', clause: 'common practice; the supplier\'s data govern', actual: ductFill, limit: t.ductWidth, unit: 'mm', note: `${t.strandsPerTendon} strands of ${section.strand.diameter} mm across a duct ${t.ductWidth} mm wide` })
    : ratioCheck({ id: 'tendon.ductFit', group: 'tendon', title: 'Duct area to strand area, round duct', clause: 'common practice (at least 2); the supplier\'s data govern', actual: ductFill, limit: ROUND_DUCT_RATIO, unit: '', atLeast: true })]
  return {
    result: {
      tendonLength: length / 1000, strandPerTendon, strandRate: strandInWidth / floor, anchorages: anchoragesPerTendon * section.tendonsPerWidth, couplers: coupled * section.tendonsPerWidth, barRate, ductFill,
    },
    checks, warnings: [],
  }
}
