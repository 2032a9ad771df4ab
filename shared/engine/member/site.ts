/**
 * Site stage: what the site needs from the member — the tendon height schedule (chair heights to
 * the duct underside, the tendon centroid taken at the duct centre as in the eccentricity limits)
 * and the stressing schedule with the acceptance of measured extensions.
 */
import type { CheckResult } from '../contract'
import { EngineInputError } from '../contract'
import { ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { tendonHeightSchedule } from '../site/tendon-heights'
import type { TendonHeightSchedule } from '../site/tendon-heights'
import { tendonSegments } from '../prestress/segments'
import { stressingSchedule } from '../site/stressing'
import type { MeasuredExtension, StressingEnds, StressingSchedule, StressingTendon } from '../site/stressing'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { Station } from './stations'

export interface MemberSite {
  heights: TendonHeightSchedule
  stressing: StressingSchedule
}

/** The most tendons one schedule lists (the input's own bound on an explicit count). */
const MAX_TENDONS = 200

/** The stressing schedule integrates on the member's stations, so its forces after lock-off are the losses stage's. */
export function siteStage(input: MemberInput, section: MemberSection, profile: MemberProfile, stations: readonly Station[]): StageOutcome<MemberSite> {
  const warnings: string[] = []
  const s = input.site
  // the strands sit off the duct centre by the offset the eccentricity limits allow for (towards the centre of curvature)
  const offset = Math.max(0, section.eccentricity.dTop - input.tendon.coverTop - input.tendon.ductHeight / 2)
  const half = input.tendon.ductHeight / 2
  const heights = tendonHeightSchedule({
    profile: profile.profile, h: section.properties.h, centroidHeight: section.properties.yb, spacing: s.spacing,
    centroidToUnderside: { sagging: half + offset, hogging: Math.max(0, half - offset) }, roundTo: s.roundTo,
    ...(section.drops.length > 0 ? { drops: { depthAt: (span: number, x: number) => section.at(span, x).properties.h - section.properties.h, edges: section.drops.flatMap((d) => d.parts.flatMap((p) => [{ span: p.span, x: p.from }, { span: p.span, x: p.to }])) } } : {}),
  })
  if (heights.outside > 0) warnings.push('Tendon heights: the duct leaves the section at some station; check the profile and covers.')

  // the tendons the schedule covers: an explicit count, else a beam's own tendons, else for a slab strip the tendons at
  // their spacing across the width of slab the schedule is for (one typical tendon where no width is given)
  const spacing = input.tendon.spacing
  const acrossWidth = section.isSlab && s.stripWidth !== undefined ? Math.round(s.stripWidth / spacing) : null // n = b/s tendons at centres s across b, to the nearest whole tendon
  if (s.tendons === undefined && acrossWidth !== null && acrossWidth < 1) {
    throw new EngineInputError('site.stripWidth', `a width of ${(s.stripWidth as number / 1000).toFixed(2)} m holds no tendon at ${spacing.toFixed(0)} mm spacing; give at least ${(spacing / 2000).toFixed(2)} m`)
  }
  if (s.tendons === undefined && acrossWidth !== null && acrossWidth > MAX_TENDONS) {
    throw new EngineInputError('site.stripWidth', `a width of ${(s.stripWidth as number / 1000).toFixed(2)} m holds ${acrossWidth} tendons at ${spacing.toFixed(0)} mm spacing; the schedule lists at most ${MAX_TENDONS}: give the width of one stressing stage`)
  }
  if (!section.isSlab && s.stripWidth !== undefined) warnings.push('Stressing schedule: a beam lists its own tendons; the width of slab on the schedule applies to slab strips only.')
  const count = s.tendons ?? acrossWidth ?? (section.isSlab ? 1 : input.tendon.count)
  const perTendon = input.tendon.strandsPerTendon * section.strand.Ap
  const first = input.tendon.stressing
  const joints = input.tendon.joints
  const segments = joints.length > 0 ? tendonSegments(input.geometry.spans.length, first, joints) : undefined
  if (segments && s.alternateEnds === 'yes' && first !== 'both') {
    warnings.push('Stressing schedule: with joints in the tendon each segment is stressed at the ends the joints give, so the ends are not alternated tendon by tendon.')
  }
  const endsOf = (i: number): StressingEnds => {
    if (segments || first === 'both' || s.alternateEnds === 'no') return first
    return i % 2 === 0 ? first : first === 'left' ? 'right' : 'left'
  }
  const tendons: StressingTendon[] = Array.from({ length: count }, (_, i) => ({ id: `T${i + 1}`, ends: endsOf(i), Pjack: section.sigmaJack * perTendon, Ap: perTendon }))
  const values = s.measured ?? []
  if (values.length > count) throw new EngineInputError('site.measured', `give at most one measured extension per tendon (${count})`)
  // with joints, a measured value is the tendon's total over all its segments
  const measured: MeasuredExtension[] = values.flatMap((v, i) => (v > 0 ? [{ id: `T${i + 1}`, extension: v }] : []))
  const stressing = stressingSchedule({
    profile: profile.profile, tendons, Ep: section.strand.Ep, mu: input.losses.mu, k: input.losses.wobble, drawIn: input.losses.drawIn,
    tolerance: s.tolerance, jackLength: s.jackLength, measured, points: stations, ...(segments ? { segments } : {}),
  })
  // common practice: the measured extension within a band about the calculated one; the schedule decides the pass
  const checks: CheckResult[] = stressing.tendons.flatMap((t) => t.checks.map((c) => ({
    ...ratioCheck({
      id: `site.extension.${t.id}`, group: 'site', title: `Measured extension of tendon ${t.id}`, clause: 'common practice: acceptance band on the calculated extension',
      location: `Tendon ${t.id}`, actual: Math.abs(c.deviation), limit: s.tolerance, unit: '%',
      note: `measured ${c.measured.toFixed(0)} mm against ${c.calculated.toFixed(0)} mm calculated`,
    }),
    pass: c.within,
  })))
  return { result: { heights, stressing }, checks, warnings }
}
