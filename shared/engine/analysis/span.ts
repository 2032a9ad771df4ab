/**
 * One span between two supports: its loads, its simple-span statics (moment, shear and end
 * reactions of the span simply supported) and its flexibility, the unit-load (virtual work)
 * integrals ∫ m·m'/EI dx by Simpson's rule between segment ends and load discontinuities — exact
 * for piecewise-constant EI, every integrand being a polynomial of degree ≤ 3 on each interval.
 * The continuous beam (continuous-beam.ts) joins the spans at the supports.
 */
import { EngineInputError } from '../contract'

/** A length of span with constant flexural stiffness, x from the span's left support, mm and N·mm². */
export interface EISegment {
  from: number
  to: number
  EI: number
}

/** Flexural stiffness of one span: a constant, or segments covering the span (drop panel, haunch). */
export type SpanEI = number | EISegment[]

export type BeamLoad =
  | { kind: 'udl'; span: number; w: number }
  | { kind: 'patch'; span: number; from: number; to: number; w: number }
  | { kind: 'point'; span: number; at: number; P: number }
  | { kind: 'couple'; span: number; at: number; M: number }

export const NO_LOADS: readonly SimpleSpan[] = []

/** Simply supported span under one load: moment, shear, end reactions and its breakpoints. */
export interface SimpleSpan {
  /** moment at x; at a couple the value on its left, except at x = 0 where it is 0⁺ */
  M0(x: number): number
  /** one-sided moment: side −1 the limit from the left, +1 from the right */
  M0side(x: number, side: -1 | 1): number
  V0(x: number): number
  /** ∫M0 dx and ∫M0·x dx over the span (closed forms, for prismatic spans) */
  area: number
  firstMoment: number
  /** end reactions of the simple span (upward +); a load right at a support goes to that support */
  RA: number
  RB: number
  /** interior points where M0 is not a single polynomial */
  breaks: number[]
}

export function simpleSpan(load: BeamLoad, L: number): SimpleSpan {
  switch (load.kind) {
    case 'udl':
      return simpleSpan({ kind: 'patch', span: load.span, from: 0, to: L, w: load.w }, L)
    case 'patch': {
      const a = load.from
      const b = load.to
      const w = load.w
      const W = w * (b - a)
      const RA = (W * (L - (a + b) / 2)) / L // statics of the simple span
      const loadedLeft = (x: number): number => Math.max(0, Math.min(x, b) - a)
      const M0 = (x: number): number => {
        const l = loadedLeft(x)
        return RA * x - w * l * (x - (a + l / 2))
      }
      // integrals of the point-load results a(L−a)/2 and a(L²−a²)/6 over the loaded length (statics)
      const F1 = (t: number): number => (L * t * t) / 2 - (t * t * t) / 3
      const F2 = (t: number): number => (L * L * t * t) / 2 - (t * t * t * t) / 4
      return {
        M0, M0side: M0, V0: (x) => RA - w * loadedLeft(x), RA, RB: W - RA, breaks: [a, b],
        area: (w / 2) * (F1(b) - F1(a)),
        firstMoment: (w / 6) * (F2(b) - F2(a)),
      }
    }
    case 'point': {
      const a = load.at
      const P = load.P
      const RA = (P * (L - a)) / L // statics of the simple span
      const M0 = (x: number): number => (x <= a ? RA * x : RA * x - P * (x - a))
      return {
        M0, M0side: M0, V0: (x) => (x < a ? RA : RA - P), RA, RB: P - RA, breaks: [a],
        area: (P * a * (L - a)) / 2,
        firstMoment: (P * a * (L - a) * (L + a)) / 6,
      }
    }
    case 'couple': {
      const c = load.at
      const M = load.M
      // a counter-clockwise couple M: RA = M/L up, RB = −M/L; the moment drops by M across c
      const value = (x: number, included: boolean): number => (included ? (M * x) / L - M : (M * x) / L)
      return {
        M0: (x) => value(x, c < x || c === 0),
        M0side: (x, side) => value(x, side > 0 ? c <= x : c < x),
        V0: () => M / L,
        RA: M / L,
        RB: -M / L,
        breaks: [c],
        area: (M * (2 * c - L)) / 2,
        firstMoment: (M * c * c * c) / (3 * L) - (M / L) * ((L * (L * L - c * c)) / 2 - (L * L * L - c * c * c) / 3),
      }
    }
  }
}

export function checkLoad(load: BeamLoad, i: number, spans: number[]): void {
  const field = `loads.${i}`
  if (!Number.isInteger(load.span) || spans[load.span] === undefined) throw new EngineInputError(`${field}.span`, `no such span: the member has ${spans.length} spans, numbered from 0`)
  const L = spans[load.span] as number
  const finite = (v: number, f: string, what: string): void => {
    if (!Number.isFinite(v)) throw new EngineInputError(`${field}.${f}`, `the ${what} must be a finite number`)
  }
  switch (load.kind) {
    case 'udl':
      finite(load.w, 'w', 'line load')
      return
    case 'patch':
      finite(load.w, 'w', 'line load')
      if (!(load.from >= 0 && load.to <= L && load.from <= load.to)) throw new EngineInputError(`${field}.from`, 'the patch must lie within the span (0 ≤ from ≤ to ≤ span length)')
      return
    case 'point':
      finite(load.P, 'P', 'point load')
      if (!(load.at >= 0 && load.at <= L)) throw new EngineInputError(`${field}.at`, 'the load must lie within the span')
      return
    case 'couple':
      finite(load.M, 'M', 'couple')
      if (!(load.at >= 0 && load.at <= L)) throw new EngineInputError(`${field}.at`, 'the couple must lie within the span')
      return
    default:
      throw new EngineInputError(`${field}.kind`, "the load kind must be 'udl', 'patch', 'point' or 'couple'")
  }
}

/** The segments of one span's EI, checked to cover the span without gaps or overlaps. */
export function spanSegments(value: SpanEI | undefined, i: number, L: number): EISegment[] {
  const field = `EI.${i}`
  if (typeof value === 'number') {
    if (!(value > 0) || !Number.isFinite(value)) throw new EngineInputError(field, 'flexural stiffness must be positive')
    return [{ from: 0, to: L, EI: value }]
  }
  if (!Array.isArray(value) || value.length === 0) throw new EngineInputError(field, 'give the flexural stiffness as a positive number or as segments covering the span')
  const tol = 1e-9 * L
  let at = 0
  return value.map((s, k) => {
    const f = `${field}.${k}`
    if (!(s.EI > 0) || !Number.isFinite(s.EI)) throw new EngineInputError(`${f}.EI`, 'flexural stiffness must be positive')
    if (!Number.isFinite(s.from) || Math.abs(s.from - at) > tol) throw new EngineInputError(`${f}.from`, `the segment must start where the previous one ends (at ${at} mm from the left support): the segments must cover the span without gaps or overlaps`)
    if (!Number.isFinite(s.to) || !(s.to > s.from)) throw new EngineInputError(`${f}.to`, 'the segment must end after it starts')
    const last = k === value.length - 1
    if (last && Math.abs(s.to - L) > tol) throw new EngineInputError(`${f}.to`, `the last segment must end at the span length (${L} mm): the segments must cover the span`)
    if (!last && s.to > L + tol) throw new EngineInputError(`${f}.to`, 'the segment runs past the end of the span')
    at = s.to
    return { from: k === 0 ? 0 : s.from, to: last ? L : s.to, EI: s.EI }
  })
}

/** Simpson's rule of f over [p, q] with one-sided end values: exact for cubics. */
function simpson(p: number, q: number, fp: number, fm: number, fq: number): number {
  return ((q - p) / 6) * (fp + 4 * fm + fq)
}

/** Flexibility of a simple span: rotations of its ends under unit end moments (unit-load method). */
export interface SpanFlexibility {
  /** ∫(1−ξ)²/EI, ∫ξ(1−ξ)/EI, ∫ξ²/EI dx */
  fAA: number
  fAB: number
  fBB: number
  /** stiffness, the inverse of [[fAA, fAB], [fAB, fBB]] */
  S11: number
  S12: number
  S22: number
}

export function flexibility(segs: EISegment[], L: number): SpanFlexibility {
  const only = segs.length === 1 ? (segs[0] as EISegment) : undefined
  if (only) {
    const k = only.EI / L
    return { fAA: L / (3 * only.EI), fAB: L / (6 * only.EI), fBB: L / (3 * only.EI), S11: 4 * k, S12: -2 * k, S22: 4 * k } // prismatic: 4EI/L, 2EI/L
  }
  let fAA = 0
  let fAB = 0
  let fBB = 0
  for (const s of segs) {
    const xi = (x: number): number => x / L
    const m = (s.from + s.to) / 2
    const g = (h: (t: number) => number): number => simpson(s.from, s.to, h(xi(s.from)), h(xi(m)), h(xi(s.to))) / s.EI
    fAA += g((t) => (1 - t) * (1 - t))
    fAB += g((t) => t * (1 - t))
    fBB += g((t) => t * t)
  }
  const det = fAA * fBB - fAB * fAB
  return { fAA, fAB, fBB, S11: fBB / det, S12: -fAB / det, S22: fAA / det }
}

/**
 * ∫(1−ξ)·M0/EI dx and ∫ξ·M0/EI dx of one load's simple-span moment (unit-load method), split at the
 * segment ends and the load's breakpoints so that every piece is a polynomial.
 */
export function loadIntegrals(p: SimpleSpan, segs: EISegment[], L: number): { a0: number; b0: number } {
  const only = segs.length === 1 ? (segs[0] as EISegment) : undefined
  if (only) return { a0: (p.area - p.firstMoment / L) / only.EI, b0: p.firstMoment / (L * only.EI) } // prismatic: closed forms
  let a0 = 0
  let b0 = 0
  for (const s of segs) {
    const cuts = [s.from, ...p.breaks.filter((x) => x > s.from && x < s.to), s.to].sort((u, v) => u - v)
    for (let k = 0; k < cuts.length - 1; k++) {
      const x0 = cuts[k] as number
      const x1 = cuts[k + 1] as number
      if (!(x1 > x0)) continue
      const xm = (x0 + x1) / 2
      const m0 = p.M0side(x0, 1)
      const mm = p.M0side(xm, 1)
      const m1 = p.M0side(x1, -1)
      a0 += simpson(x0, x1, (1 - x0 / L) * m0, (1 - xm / L) * mm, (1 - x1 / L) * m1) / s.EI
      b0 += simpson(x0, x1, (x0 / L) * m0, (xm / L) * mm, (x1 / L) * m1) / s.EI
    }
  }
  return { a0, b0 }
}
