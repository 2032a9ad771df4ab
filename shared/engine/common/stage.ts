import type { CheckResult } from '../contract'

/** What every stage of the member design returns: its result, the checks it makes and its warnings. */
export interface StageOutcome<R> {
  result: R
  checks: CheckResult[]
  warnings: string[]
}
