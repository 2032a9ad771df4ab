/**
 * The tally of a list of checks — how many, how many fail, the governing one — and the tally per
 * check group. One routine for the report's check tables, its front page, the check queue and the
 * revision lists, so they always agree.
 */
import type { CheckResult } from '../engine/contract'

export interface CheckTally {
  count: number
  pass: number
  fail: number
  /** the check with the highest utilisation, null for an empty list */
  governing: Pick<CheckResult, 'id' | 'group' | 'title' | 'location' | 'utilisation' | 'pass'> | null
}

export function tallyChecks(checks: readonly CheckResult[]): CheckTally {
  const fail = checks.filter((c) => !c.pass).length
  const worst = checks.reduce<CheckResult | null>((a, c) => (!a || c.utilisation > a.utilisation ? c : a), null)
  return {
    count: checks.length,
    pass: checks.length - fail,
    fail,
    governing: worst ? { id: worst.id, group: worst.group, title: worst.title, location: worst.location, utilisation: worst.utilisation, pass: worst.pass } : null,
  }
}

/** The tally of each group, in the order the groups first occur. */
export function tallyByGroup(checks: readonly CheckResult[]): Array<{ group: string } & CheckTally> {
  const groups = [...new Set(checks.map((c) => c.group))]
  return groups.map((group) => ({ group, ...tallyChecks(checks.filter((c) => c.group === group)) }))
}

/** "29 checks: 27 pass, 2 fail; highest utilisation 1.12 (Service: bottom fibre tension, Span 2)" */
export function tallyText(t: CheckTally): string {
  const worst = t.governing
  return `${t.count} check${t.count === 1 ? '' : 's'}: ${t.pass} pass, ${t.fail} fail`
    + (worst ? `; highest utilisation ${worst.utilisation.toFixed(2)} (${worst.title}${worst.location ? `, ${worst.location}` : ''})` : '')
}
