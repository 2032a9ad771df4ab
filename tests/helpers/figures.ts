// The hardening suites add their figures here (one JSON line per suite) under the test data folder;
// `npm test` (scripts/test.mjs) sums them into the closing table once vitest is done.
import { appendFileSync } from 'node:fs'
import { join } from 'node:path'

export interface HardeningFigures {
  suite: string
  routes?: number
  bodiesTried?: number
  serverErrors?: number
  tamperingsTried?: number
  tamperingsDetected?: number
  faultsInjected?: number
  faultsSurvived?: number
  rowsLost?: number
  attacksTried?: number
  attacksSucceeded?: number
}

export const FIGURES_FILE = 'hardening-figures.jsonl'

export function recordFigures(figures: HardeningFigures) {
  const base = process.env.TENDONBOOK_TEST_BASE
  if (!base) return
  appendFileSync(join(base, FIGURES_FILE), `${JSON.stringify(figures)}\n`)
}
