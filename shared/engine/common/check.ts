/**
 * The one builder of a ratio check (actual against limit) and the cap that keeps every
 * utilisation finite JSON. Every stage builds its checks here so that a check passes or fails by
 * the same rule wherever it is made.
 */
import type { CheckResult } from '../contract'

/** Utilisations are capped so that the result stays finite JSON; a capped check always fails. */
export const UTILISATION_CAP = 999

/** A utilisation held within [0, UTILISATION_CAP]; anything not finite becomes the cap. */
export function capUtilisation(u: number): number {
  return Number.isFinite(u) ? Math.min(UTILISATION_CAP, Math.max(0, u)) : UTILISATION_CAP
}

export interface RatioCheckInput {
  id: string
  group: string
  title: string
  clause: string
  actual: number
  limit: number
  unit: CheckResult['unit']
  location?: string
  note?: string
  /** the actual value must reach the limit (a resistance or a least amount): utilisation limit/actual */
  atLeast?: boolean
}

/**
 * Why a check cannot be judged by its ratio, or null: a limit (a resistance, a stress limit, a
 * requirement) or a value provided (with atLeast: a resistance, an area, a cover) that is not
 * positive leaves no meaningful ratio, and such a check fails rather than pass with utilisation 0.
 */
function notPositive(i: RatioCheckInput): string | null {
  if (!(i.limit > 0)) return i.atLeast
    ? `the required value ${i.limit} is not positive, so the ratio means nothing here`
    : `the limit ${i.limit} is not positive: nothing can stay within it`
  if (i.atLeast && !(i.actual > 0)) return `the value provided ${i.actual} is not positive`
  return null
}

/**
 * actual ≤ limit (utilisation actual/limit), or with atLeast actual ≥ limit (utilisation limit/actual).
 * A limit, or with atLeast a value provided, that is not positive fails the check and says why.
 */
export function ratioCheck(i: RatioCheckInput): CheckResult {
  const why = notPositive(i)
  const utilisation = why !== null ? UTILISATION_CAP : capUtilisation(i.atLeast ? i.limit / i.actual : i.actual / i.limit)
  const note = why !== null ? `fails: ${why}${i.note ? `; ${i.note}` : ''}` : i.note
  return {
    id: i.id, group: i.group, title: i.title, clause: i.clause, actual: i.actual, limit: i.limit, unit: i.unit,
    utilisation, pass: why === null && utilisation <= 1 + 1e-9,
    ...(i.location ? { location: i.location } : {}),
    ...(note ? { note } : {}),
  }
}

/** 'Span 2, low point, x = 4.80 m': where a check is made along the member. */
export function atStation(label: string, X: number): string {
  return `${label}, x = ${(X / 1000).toFixed(2)} m`
}
