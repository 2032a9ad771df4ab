/**
 * Part 2 of the member design in one call: ULS, deflection, cracking and the site schedules, on top of
 * the part-1 result; withPartTwo adds them (and their checks and warnings) to make the Design.
 */
import type { CheckResult } from '../contract'
import type { Design } from '../design/member'
import type { DesignPartOne } from './design-part-one'
import type { Part2Input } from './input-groups'
import { memberUls } from './member-uls'
import type { MemberUls } from './member-uls'
import { memberSls } from '../sls/member-sls'
import type { MemberCracking, MemberDeflection } from '../sls/member-sls'
import { memberSite } from '../site/member-site'
import type { MemberSite } from '../site/member-site'

export interface PartTwo {
  uls: MemberUls
  deflection: MemberDeflection
  cracking: MemberCracking
  site: MemberSite
  checks: CheckResult[]
  warnings: string[]
}

export function designPartTwo(d: DesignPartOne, opt: Part2Input): PartTwo {
  const u = memberUls(d, opt)
  const s = memberSls(d, opt)
  const site = memberSite(d, opt)
  return {
    uls: u.uls, deflection: s.deflection, cracking: s.cracking, site: site.site,
    checks: [...u.checks, ...s.checks, ...site.checks],
    warnings: [...u.warnings, ...s.warnings, ...site.warnings],
  }
}

/** The part-1 result with the part-2 results, checks and warnings added; options come from its input. */
export function withPartTwo(d: DesignPartOne): Design {
  const two = designPartTwo(d, d.input)
  return {
    ...d,
    uls: two.uls, deflection: two.deflection, cracking: two.cracking, site: two.site,
    checks: [...d.checks, ...two.checks],
    warnings: [...d.warnings, ...two.warnings],
  }
}
