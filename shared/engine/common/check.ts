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

/** actual ≤ limit (utilisation actual/limit), or with atLeast actual ≥ limit (utilisation limit/actual). */
export function ratioCheck(i: RatioCheckInput): CheckResult {
  const raw = i.atLeast
    ? (i.actual > 0 ? i.limit / i.actual : i.limit > 0 ? UTILISATION_CAP : 0)
    : i.limit > 0 ? i.actual / i.limit : i.actual > 0 ? UTILISATION_CAP : 0
  const utilisation = capUtilisation(raw)
  return {
    id: i.id, group: i.group, title: i.title, clause: i.clause, actual: i.actual, limit: i.limit, unit: i.unit,
    utilisation, pass: utilisation <= 1 + 1e-9,
    ...(i.location ? { location: i.location } : {}),
    ...(i.note ? { note: i.note } : {}),
  }
}

/** 'Span 2, low point, x = 4.80 m': where a check is made along the member. */
export function atStation(label: string, X: number): string {
  return `${label}, x = ${(X / 1000).toFixed(2)} m`
}
