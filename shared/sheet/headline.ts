/**
 * The headline of the check summary: the governing check among those the design controls, and the
 * highest utilisations. Some checks restate a fixed choice rather than judge the design: the stress
 * at jacking is the chosen share of σp,max (at 100 % it always reads 100 %), the stress after
 * lock-off follows from it and the friction of the hardware, and the cover to the duct is the cover
 * given. They still pass or fail with the rest; they never govern the headline.
 */
import type { CheckResult } from '../engine/index'

const FIXED_BY_INPUT = ['tendon.jacking', 'tendon.lockOff', 'tendon.coverBond']

/** Whether changing the design (force, profile, section, steel) moves this check. */
export function isControlledByDesign(check: Pick<CheckResult, 'id'>): boolean {
  return !FIXED_BY_INPUT.some(prefix => check.id === prefix || check.id.startsWith(`${prefix}.`))
}

function byUtilisation(a: CheckResult, b: CheckResult): number {
  return b.utilisation - a.utilisation || a.id.localeCompare(b.id)
}

/** The governing check (a failing one first) and the `count` highest utilisations, the governing first. */
export function checkHeadline(checks: readonly CheckResult[], count = 3): { governing: CheckResult | null, highest: CheckResult[] } {
  const controlled = checks.filter(isControlledByDesign)
  const ranked = [...controlled.filter(c => !c.pass).sort(byUtilisation), ...controlled.filter(c => c.pass).sort(byUtilisation)]
  const governing = ranked[0] ?? null
  const highest = governing ? [governing, ...controlled.filter(c => c !== governing).sort(byUtilisation).slice(0, count - 1)] : []
  return { governing, highest }
}
