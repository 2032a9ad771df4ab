/**
 * Pattern loading (EN 1992-1-1 5.1.3) on a beam factored once, at a cost linear in the spans: the
 * imposed load on all spans and on alternate spans is solved once per pattern; a pattern loading
 * one or two spans (adjacent pairs) is the sum of those spans' unit responses (superposition), and
 * since the response of a continuous beam to a load on one span dies away geometrically with the
 * distance, only the pairs near a point can decide its envelope: the rest give 0 to within
 * FAR_SHARE of the nearest responses, and are counted as 0.
 *
 * What a span carries when it is loaded is by default 1 N/mm over it; `spanLoads` may give each span
 * its own set instead (the uniform imposed load with the point, line and partial loads on that span,
 * each at its combination value), and the values are then those of the sets, not per N/mm.
 */
import type { BeamLoad, ContinuousBeamResult, SpanUnitResponses } from './continuous-beam'
import { simpleSpan } from './span'
import type { SimpleSpan } from './span'

/** A response quantity linear in the loads: a moment or shear at x in a span, a support's reaction or its couple (the columns' moment). */
export type ResponseQuantity =
  | { kind: 'moment'; span: number; x: number }
  | { kind: 'shear'; span: number; x: number }
  | { kind: 'reaction'; support: number }
  | { kind: 'couple'; support: number }

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
  if (q.kind === 'couple') return r.reactionCouples[q.support] as number
  return r.reactions[q.support] as number
}

/**
 * The response to 1 N/mm on one span, kept only where it is not nil: the end moments of spans
 * lo…hi and the reactions of supports lo…hi + 1 (elsewhere below FAR_SHARE of its largest value).
 */
interface UnitTrace { span: number; lo: number; hi: number; MA: Float64Array; MB: Float64Array; R: Float64Array; C: Float64Array }

export function patternLoading(responses: SpanUnitResponses, patterns: ReadonlyArray<readonly number[]>, spanLoads?: (span: number) => BeamLoad[]): PatternLoading {
  const spans = responses.model.spans
  const n = spans.length
  // the loads a loaded span carries, and their simple-span statics (kept once computed)
  const setOf = (span: number): BeamLoad[] => (spanLoads ? spanLoads(span) : [{ kind: 'udl', span, w: 1 }])
  const statics = new Map<number, SimpleSpan[]>()
  const staticsOf = (span: number): SimpleSpan[] => {
    let list = statics.get(span)
    if (!list) {
      list = setOf(span).map((l) => simpleSpan(l, spans[span] as number))
      statics.set(span, list)
    }
    return list
  }
  // patterns of one or two spans are local; the others are solved once each
  const local = patterns.map((p) => p.length <= 2 && p.length > 0)
  const solved = patterns.map((p, i) => {
    if (local[i]) return null
    if (!spanLoads) return responses.combine(Array.from({ length: n }, (_, s) => (p.includes(s) ? 1 : 0)))
    return responses.model.analyse(p.flatMap((s) => setOf(s)))
  })
  const byFirst = new Map<number, number[]>()
  let localCount = 0
  patterns.forEach((p, i) => {
    if (!local[i]) return
    localCount++
    const first = Math.min(...p)
    byFirst.set(first, [...(byFirst.get(first) ?? []), i])
  })
  const traces = new Map<number, UnitTrace>()
  const trace = (span: number): UnitTrace => {
    const known = traces.get(span)
    if (known) return known
    const r = responses.model.analyse(setOf(span))
    const MA = new Float64Array(n)
    const MB = new Float64Array(n)
    let peak = 0
    for (let t = 0; t < n; t++) {
      MA[t] = r.momentAt(t, 0)
      MB[t] = r.momentAt(t, spans[t] as number)
      peak = Math.max(peak, Math.abs(MA[t] as number), Math.abs(MB[t] as number))
    }
    for (const v of r.reactions) peak = Math.max(peak, Math.abs(v))
    const C = r.reactionCouples
    const alive = (t: number): boolean => t === span || Math.max(Math.abs(MA[t] as number), Math.abs(MB[t] as number), Math.abs(r.reactions[t] as number), Math.abs(r.reactions[t + 1] as number), Math.abs(C[t] as number), Math.abs(C[t + 1] as number)) > FAR_SHARE * peak
    let lo = span
    let hi = span
    while (lo > 0 && alive(lo - 1)) lo--
    while (hi < n - 1 && alive(hi + 1)) hi++
    const t: UnitTrace = { span, lo, hi, MA: MA.slice(lo, hi + 1), MB: MB.slice(lo, hi + 1), R: Float64Array.from(r.reactions.slice(lo, hi + 2)), C: Float64Array.from(C.slice(lo, hi + 2)) }
    traces.set(span, t)
    return t
  }
  // q of the unit response of a span: end moments between the supports plus the loaded span's own
  // simple-span moment w·x(L − x)/2 and shear w(L/2 − x) (statics), or its set's, 0 beyond the trace
  const ownMoment = (s: number, x: number, L: number): number => (spanLoads ? staticsOf(s).reduce((m, p) => m + p.M0(x), 0) : (x * (L - x)) / 2)
  const ownShear = (s: number, x: number, L: number): number => (spanLoads ? staticsOf(s).reduce((v, p) => v + p.V0(x), 0) : L / 2 - x)
  const unitValue = (s: number, q: ResponseQuantity): number => {
    const t = trace(s)
    if (q.kind === 'reaction') return q.support >= t.lo && q.support <= t.hi + 1 ? (t.R[q.support - t.lo] as number) : 0
    if (q.kind === 'couple') return q.support >= t.lo && q.support <= t.hi + 1 ? (t.C[q.support - t.lo] as number) : 0
    if (q.span < t.lo || q.span > t.hi) return 0
    const L = spans[q.span] as number
    const a = t.MA[q.span - t.lo] as number
    const b = t.MB[q.span - t.lo] as number
    if (q.kind === 'moment') return a * (1 - q.x / L) + (b * q.x) / L + (q.span === s ? ownMoment(s, q.x, L) : 0)
    return (b - a) / L + (q.span === s ? ownShear(s, q.x, L) : 0)
  }
  const value = (q: ResponseQuantity, p: number): number => {
    const r = solved[p]
    if (r) return quantityOf(r, q)
    return (patterns[p] as readonly number[]).reduce((sum, s) => sum + unitValue(s, q), 0) // superposition
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
      const home = q.kind === 'reaction' || q.kind === 'couple' ? Math.min(q.support, n - 1) : q.span
      const unit = new Map<number, number>()
      let peak = 0
      const scan = (from: number, step: number): number => {
        let quiet = 0
        let s = from
        for (; s >= 0 && s < n; s += step) {
          const v = unitValue(s, q)
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
          const ps = patterns[p] as readonly number[]
          if (ps.every((s) => unit.has(s))) {
            take(ps.reduce((sum, s) => sum + (unit.get(s) as number), 0)) // superposition of the unit responses
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
