/**
 * Pattern loading (EN 1992-1-1 5.1.3) on a beam factored once, at a cost linear in the spans: the
 * imposed load on all spans and on alternate spans is solved once per pattern; a pattern loading
 * one or two spans (adjacent pairs) is the sum of those spans' unit responses (superposition), and
 * since the response of a continuous beam to a load on one span dies away geometrically with the
 * distance, only the pairs near a point can decide its envelope: the rest give 0 to within
 * FAR_SHARE of the nearest responses, and are counted as 0.
 */
import type { ContinuousBeamResult, SpanUnitResponses } from './continuous-beam'

/** A response quantity linear in the loads: a moment or shear at x in a span, or a support's reaction. */
export type ResponseQuantity =
  | { kind: 'moment'; span: number; x: number }
  | { kind: 'shear'; span: number; x: number }
  | { kind: 'reaction'; support: number }

export interface PatternLoading {
  /** the loaded spans of each pattern, as given */
  readonly patterns: ReadonlyArray<readonly number[]>
  /** q under 1 N/mm on the spans of pattern p */
  value(q: ResponseQuantity, p: number): number
  /** least and greatest q over the patterns, per N/mm on the loaded spans */
  range(q: ResponseQuantity): { min: number; max: number }
}

/** A unit response below this share of the largest one met at a point is taken as nil (round-off scale). */
const FAR_SHARE = 1e-12
/** Spans met in a row below FAR_SHARE before the scan stops (the decay is monotonic away from the point). */
const QUIET_SPANS = 3

export function quantityOf(r: ContinuousBeamResult, q: ResponseQuantity): number {
  if (q.kind === 'moment') return r.momentAt(q.span, q.x)
  if (q.kind === 'shear') return r.shearAt(q.span, q.x)
  return r.reactions[q.support] as number
}

export function patternLoading(responses: SpanUnitResponses, patterns: ReadonlyArray<readonly number[]>): PatternLoading {
  const n = responses.model.spans.length
  // patterns of one or two spans are local; the others are solved once each
  const local = patterns.map((p) => p.length <= 2 && p.length > 0)
  const solved = patterns.map((p, i) => (local[i] ? null : responses.combine(Array.from({ length: n }, (_, s) => (p.includes(s) ? 1 : 0)))))
  const byFirst = new Map<number, number[]>()
  let localCount = 0
  patterns.forEach((p, i) => {
    if (!local[i]) return
    localCount++
    const first = Math.min(...p)
    byFirst.set(first, [...(byFirst.get(first) ?? []), i])
  })
  const value = (q: ResponseQuantity, p: number): number => {
    const r = solved[p]
    if (r) return quantityOf(r, q)
    return (patterns[p] as readonly number[]).reduce((sum, s) => sum + quantityOf(responses.unit(s), q), 0) // superposition
  }
  const range = (q: ResponseQuantity): { min: number; max: number } => {
    let min = Infinity
    let max = -Infinity
    const take = (v: number): void => {
      if (v < min) min = v
      if (v > max) max = v
    }
    solved.forEach((r) => r && take(quantityOf(r, q)))
    if (localCount > 0) {
      // unit responses outward from the point's span until they die away
      const home = q.kind === 'reaction' ? Math.min(q.support, n - 1) : q.span
      const unit = new Map<number, number>()
      let peak = 0
      const scan = (from: number, step: number): number => {
        let quiet = 0
        let s = from
        for (; s >= 0 && s < n; s += step) {
          const v = quantityOf(responses.unit(s), q)
          unit.set(s, v)
          peak = Math.max(peak, Math.abs(v))
          quiet = Math.abs(v) <= FAR_SHARE * peak ? quiet + 1 : 0
          if (quiet >= QUIET_SPANS) return s
        }
        return s - step
      }
      const lo = scan(home, -1)
      const hi = scan(home + 1, 1)
      let counted = 0
      for (let first = lo; first <= hi; first++) {
        for (const p of byFirst.get(first) ?? []) {
          const spans = patterns[p] as readonly number[]
          if (spans.every((s) => unit.has(s))) {
            take(spans.reduce((sum, s) => sum + (unit.get(s) as number), 0)) // superposition of the unit responses
            counted++
          }
        }
      }
      if (counted < localCount) take(0) // the far patterns: nil to within FAR_SHARE of the near ones
    }
    return { min, max }
  }
  return { patterns, value, range }
}
