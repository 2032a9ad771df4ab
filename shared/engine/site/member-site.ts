/**
 * What the site needs from a designed member (design.md §1 step 11): the tendon height schedule
 * (chair heights to the duct underside, the tendon centroid taken at the duct centre as in the
 * eccentricity limits) and the stressing schedule with the acceptance of measured extensions.
 */
import type { CheckResult } from '../contract'
import { EngineInputError } from '../contract'
import type { DesignPartOne as Design } from '../uls/design-part-one'
import type { TendonProfile } from '../prestress/profile'
import type { Part2Input } from '../uls/input-groups'
import { tendonHeightSchedule } from './tendon-heights'
import type { TendonHeightSchedule } from './tendon-heights'
import { stressingSchedule } from './stressing'
import type { MeasuredExtension, StressingEnds, StressingSchedule, StressingTendon } from './stressing'

export interface MemberSite {
  heights: TendonHeightSchedule
  stressing: StressingSchedule
}

export interface SiteOutcome {
  site: MemberSite
  checks: CheckResult[]
  warnings: string[]
}

export function memberSite(d: Design, opt: Part2Input): SiteOutcome {
  const input = d.input
  const warnings: string[] = []
  const s = opt.site
  const profile: TendonProfile = { spans: input.geometry.spans, supportEcc: d.profile.supportEcc, spanEcc: d.profile.spanEcc, lowPointAt: d.profile.lowPointAt, inflection: d.profile.inflection }
  // the strands sit off the duct centre by the offset the eccentricity limits allow for (towards the centre of curvature)
  const offset = Math.max(0, d.eccentricity.dTop - input.tendon.coverTop - input.tendon.ductHeight / 2)
  const half = input.tendon.ductHeight / 2
  const heights = tendonHeightSchedule({
    profile, h: d.section.h, centroidHeight: d.section.yb, spacing: s.spacing,
    centroidToUnderside: { sagging: half + offset, hogging: Math.max(0, half - offset) }, roundTo: s.roundTo,
  })
  if (heights.outside > 0) warnings.push('Tendon heights: the duct leaves the section at some station; check the profile and covers.')

  const count = s.tendons ?? (input.section.kind === 'slab-strip' ? 1 : input.tendon.count)
  const perTendon = input.tendon.strandsPerTendon * d.strand.Ap
  const first = input.tendon.stressing
  const endsOf = (i: number): StressingEnds => {
    if (first === 'both' || s.alternateEnds === 'no') return first
    return i % 2 === 0 ? first : first === 'left' ? 'right' : 'left'
  }
  const tendons: StressingTendon[] = Array.from({ length: count }, (_, i) => ({ id: `T${i + 1}`, ends: endsOf(i), Pjack: d.jacking.sigmaJack * perTendon, Ap: perTendon }))
  const values = s.measured ?? []
  if (values.length > count) throw new EngineInputError('site.measured', `give at most one measured extension per tendon (${count})`)
  const measured: MeasuredExtension[] = values.flatMap((v, i) => (v > 0 ? [{ id: `T${i + 1}`, extension: v }] : []))
  const stressing = stressingSchedule({
    profile, tendons, Ep: d.strand.Ep, mu: input.losses.mu, k: input.losses.wobble, drawIn: input.losses.drawIn,
    tolerance: s.tolerance, jackLength: s.jackLength, measured,
  })
  const checks: CheckResult[] = stressing.tendons.flatMap((t) => t.checks.map((c) => {
    const u = s.tolerance > 0 ? Math.abs(c.deviation) / s.tolerance : Math.abs(c.deviation) > 0 ? 999 : 0
    return {
      id: `site.extension.${t.id}`, group: 'site', title: `Measured extension of tendon ${t.id}`, clause: 'common practice: acceptance band on the calculated extension',
      location: `Tendon ${t.id}`, actual: Math.abs(c.deviation), limit: s.tolerance, unit: '%' as const, utilisation: Math.min(999, u), pass: c.within,
      note: `measured ${c.measured.toFixed(0)} mm against ${c.calculated.toFixed(0)} mm calculated`,
    }
  }))
  return { site: { heights, stressing }, checks, warnings }
}
