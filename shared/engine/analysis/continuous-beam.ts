/**
 * Continuous beam by the stiffness (slope–deflection) method, one rotation per support, solved as a
 * tridiagonal system: O(n) time and memory in the number of spans. Sign conventions (fixed for the
 * whole engine): sagging moment positive, gravity loads positive downward, reactions positive
 * upward, couples positive counter-clockwise, rotations counter-clockwise positive. x is measured
 * from the left support of each span. momentAt(span, 0) is the value just inside the span (0⁺) and
 * momentAt(span, L) the value at L⁻, so anchorage couples at the ends show in the end moments.
 *
 * Supports: 'pinned' (free to rotate, with an optional rotational spring — the columns above and
 * below), 'fixed' (no rotation), 'free' (no support; only at an end: the span next to it is a
 * cantilever, statically determinate, whose root moment loads the rest of the beam).
 * Spans may be non-prismatic: EI given as segments { from, to, EI } covering the span; each span's
 * statics and flexibility coefficients come from span.ts.
 */
import { EngineInputError } from '../contract'
import { factorTridiagonal } from './linear'
import type { TridiagonalFactors } from './linear'
import { NO_LOADS, checkLoad, flexibility, loadIntegrals, simpleSpan, spanSegments } from './span'
import type { BeamLoad, EISegment, SimpleSpan, SpanEI, SpanFlexibility } from './span'

export type { BeamLoad, EISegment, SpanEI } from './span'

export type SupportKind = 'pinned' | 'fixed' | 'free'

/** The beam without its loads: spans, stiffness, supports and rotational springs. */
export interface BeamModelInput {
  spans: number[]
  /** one value for all spans, or one per span (a number or segments); default 1 (moments do not depend on a common EI) */
  EI?: number | SpanEI[]
  /** one per support (spans + 1); default all pinned; 'free' only at an end */
  supports?: SupportKind[]
  /**
   * rotational stiffness at each support, N·mm/rad (spans + 1 values; 0 = none): the columns
   * above and below the support, each from columnStiffness(); the caller adds them. Acts at pinned
   * supports; irrelevant at fixed ones; must be 0 at a free end.
   */
  springs?: number[]
}

export interface ContinuousBeamInput extends BeamModelInput {
  loads: BeamLoad[]
}

export interface ContinuousBeamResult {
  /** bending moment at each support (sagging positive), N·mm: momentAt(j, 0⁺), the last at L⁻ */
  supportMoments: number[]
  /** reaction at each support (upward positive), N; 0 at a free end */
  reactions: number[]
  /**
   * couple reaction of each support on the beam (counter-clockwise positive), N·mm: the fixed
   * support's or the columns' moment; it equals M(left of the support) − M(right of it)
   */
  reactionCouples: number[]
  /** rotation at each support (counter-clockwise positive), rad when EI is in N·mm² */
  rotations: number[]
  momentAt(span: number, x: number): number
  shearAt(span: number, x: number): number
}

/** Rotational stiffness of a column at the joint, N·mm/rad (slope–deflection: 4EI/H far end fixed, 3EI/H pinned). */
export function columnStiffness(input: { E: number; I: number; height: number; farEnd: 'fixed' | 'pinned' }): number {
  const { E, I, height, farEnd } = input
  if (!(E > 0) || !Number.isFinite(E)) throw new EngineInputError('E', 'the column modulus must be a positive number')
  if (!(I > 0) || !Number.isFinite(I)) throw new EngineInputError('I', 'the column second moment of area must be a positive number')
  if (!(height > 0) || !Number.isFinite(height)) throw new EngineInputError('height', 'the column height must be a positive number')
  if (farEnd !== 'fixed' && farEnd !== 'pinned') throw new EngineInputError('farEnd', "the column's far end must be 'fixed' or 'pinned'")
  return farEnd === 'fixed' ? (4 * E * I) / height : (3 * E * I) / height // slope–deflection: 4EI/H, 3EI/H
}

export interface ContinuousBeamModel {
  readonly spans: readonly number[]
  /** the beam's response to a set of loads: one O(n) back-substitution on the stored factors */
  analyse(loads: BeamLoad[]): ContinuousBeamResult
}

/** Validate the beam and factor its stiffness once; analyse any number of load sets with it. */
export function continuousBeamModel(input: BeamModelInput): ContinuousBeamModel {
  if (!Array.isArray(input.spans) || input.spans.length < 1) throw new EngineInputError('spans', 'at least one span is needed')
  const spans = [...input.spans]
  const n = spans.length
  spans.forEach((L, i) => {
    if (!(L > 0) || !Number.isFinite(L)) throw new EngineInputError(`spans.${i}`, 'span length must be positive')
  })
  const EIin = input.EI
  if (Array.isArray(EIin) && EIin.length !== n) throw new EngineInputError('EI', `give ${n} flexural stiffnesses for ${n} spans, or one for all`)
  const segments = spans.map((L, i) => spanSegments(Array.isArray(EIin) ? EIin[i] : EIin ?? 1, i, L))
  const supports: SupportKind[] = input.supports ? [...input.supports] : new Array<SupportKind>(n + 1).fill('pinned')
  if (supports.length !== n + 1) throw new EngineInputError('supports', `give ${n + 1} supports for ${n} spans`)
  supports.forEach((s, j) => {
    if (s !== 'pinned' && s !== 'fixed' && s !== 'free') throw new EngineInputError(`supports.${j}`, "a support must be 'pinned', 'fixed' or 'free'")
    if (s === 'free' && j > 0 && j < n) throw new EngineInputError(`supports.${j}`, 'a free end (cantilever) is possible only at the first or last support, not at an interior support')
  })
  if (input.springs !== undefined && input.springs.length !== n + 1) throw new EngineInputError('springs', `give ${n + 1} rotational spring stiffnesses (0 = none) for ${n + 1} supports`)
  const springs = supports.map((s, j) => {
    const k = input.springs?.[j] ?? 0
    if (!Number.isFinite(k) || k < 0) throw new EngineInputError(`springs.${j}`, 'the rotational spring stiffness must be zero or a positive number')
    if (s === 'free' && k !== 0) throw new EngineInputError(`springs.${j}`, 'a free end (cantilever tip) has no column: its spring must be 0')
    return s === 'pinned' ? k : 0 // at a fixed support the spring changes nothing
  })
  const leftCantilever = supports[0] === 'free'
  const rightCantilever = supports[n] === 'free'
  if (n === 1 && leftCantilever && rightCantilever) throw new EngineInputError('supports', 'a single span free at both ends is a mechanism: it has no support')
  // spans between two supports (the rest are cantilevers, statically determinate)
  const core = spans.map((_, i) => !(i === 0 && leftCantilever) && !(i === n - 1 && rightCantilever))
  if (!core.some(Boolean)) {
    // all spans are cantilevers: their root must take the moment by itself
    const root = leftCantilever ? 1 : 0
    if (supports[root] !== 'fixed' && !((springs[root] as number) > 0)) {
      throw new EngineInputError(`supports.${root}`, 'the cantilever(s) would turn about a pinned support with no rotational spring: a mechanism; fix the support or give it a spring')
    }
  }
  const flex = spans.map((L, i) => flexibility(segments[i] as EISegment[], L))
  const active = supports.map((s) => s === 'pinned')

  // Joint equilibrium at each active support j: M_A(span j) − M_B(span j−1) = k_j·θ_j, with the
  // member-end moments from the span stiffness (slope–deflection) — a tridiagonal system in θ.
  const diag = new Float64Array(n + 1)
  const sub = new Float64Array(n + 1)
  const sup = new Float64Array(n + 1)
  for (let j = 0; j <= n; j++) {
    if (!active[j]) {
      diag[j] = 1 // θ known (0 at a fixed support; at a free end found afterwards)
      continue
    }
    let d = springs[j] as number
    if (j < n && core[j]) {
      const f = flex[j] as SpanFlexibility
      d += f.S11
      if (active[j + 1]) sup[j] = -f.S12
    }
    if (j > 0 && core[j - 1]) {
      const f = flex[j - 1] as SpanFlexibility
      d += f.S22
      if (active[j - 1]) sub[j] = -f.S12
    }
    diag[j] = d
  }
  let factors: TridiagonalFactors
  try {
    factors = factorTridiagonal(sub, diag, sup)
  } catch {
    throw new EngineInputError('supports', 'the member is a mechanism: it cannot carry load with these supports')
  }

  const analyse = (loads: BeamLoad[]): ContinuousBeamResult => {
    if (!Array.isArray(loads)) throw new EngineInputError('loads', 'give a list of loads')
    loads.forEach((l, i) => checkLoad(l, i, spans))
    // only loaded spans get a list, so that many single-span load cases stay small
    const bySpan: Array<SimpleSpan[] | undefined> = new Array<SimpleSpan[] | undefined>(n)
    loads.forEach((l) => (bySpan[l.span] ??= []).push(simpleSpan(l, spans[l.span] as number)))
    const a0 = new Float64Array(n)
    const b0 = new Float64Array(n)
    const RA = new Float64Array(n)
    const RB = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      for (const p of bySpan[i] ?? NO_LOADS) {
        const g = loadIntegrals(p, segments[i] as EISegment[], spans[i] as number)
        a0[i] = (a0[i] as number) + g.a0
        b0[i] = (b0[i] as number) + g.b0
        RA[i] = (RA[i] as number) + p.RA
        RB[i] = (RB[i] as number) + p.RB
      }
    }
    // Fixed-end moments (θ = 0 at both ends): [MA, MB] = −S·[a0, b0] (unit-load compatibility)
    const MA = new Float64Array(n)
    const MB = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      const L = spans[i] as number
      const f = flex[i] as SpanFlexibility
      if (core[i]) {
        MA[i] = -f.S11 * (a0[i] as number) - f.S12 * (b0[i] as number)
        MB[i] = -f.S12 * (a0[i] as number) - f.S22 * (b0[i] as number)
      } else if (i === 0 && leftCantilever) {
        MB[i] = -(RA[i] as number) * L // statics: no reaction at the free tip, M = M0 − RA·x
      } else {
        MA[i] = -(RB[i] as number) * L // statics: no reaction at the free tip, M = M0 − RB·(L − x)
      }
    }
    const rhs = new Float64Array(n + 1)
    for (let j = 0; j <= n; j++) {
      if (!active[j]) continue
      rhs[j] = (j < n ? (MA[j] as number) : 0) - (j > 0 ? (MB[j - 1] as number) : 0)
    }
    const theta = factors.solve(rhs)
    for (let i = 0; i < n; i++) {
      if (!core[i]) continue
      const f = flex[i] as SpanFlexibility
      const tA = theta[i] as number
      const tB = theta[i + 1] as number
      MA[i] = (MA[i] as number) - f.S11 * tA + f.S12 * tB // slope–deflection from the span stiffness
      MB[i] = (MB[i] as number) - f.S12 * tA + f.S22 * tB
    }
    // rotation of a free tip: θB − θA = ∫M/EI dx over the cantilever (moment-area)
    const curvatureArea = (i: number): number => {
      const f = flex[i] as SpanFlexibility
      return (a0[i] as number) + (b0[i] as number) + (MA[i] as number) * (f.fAA + f.fAB) + (MB[i] as number) * (f.fAB + f.fBB)
    }
    const rotations = Array.from(theta)
    if (leftCantilever) rotations[0] = (theta[1] as number) - curvatureArea(0)
    if (rightCantilever) rotations[n] = (theta[n - 1] as number) + curvatureArea(n - 1)
    return beamResult(spans, bySpan, MA, MB, RA, RB, supports, springs, rotations)
  }
  return { spans, analyse }
}

/** Results from the per-span end moments and loads only (nothing else is kept alive). */
function beamResult(
  spans: number[], bySpan: Array<SimpleSpan[] | undefined>, MA: Float64Array, MB: Float64Array, RA: Float64Array, RB: Float64Array,
  supports: SupportKind[], springs: number[], rotations: number[],
): ContinuousBeamResult {
  const n = spans.length
  const spanAt = (span: number, x: number): number => {
    const L = spans[span]
    if (!Number.isInteger(span) || L === undefined) throw new EngineInputError('span', `no such span: the member has ${n} spans, numbered from 0`)
    if (!Number.isFinite(x) || x < -1e-9 * L || x > L * (1 + 1e-9)) throw new EngineInputError('x', 'x must lie within the span')
    return L
  }
  const momentAt = (span: number, x: number): number => {
    const L = spanAt(span, x)
    let M = (MA[span] as number) * (1 - x / L) + ((MB[span] as number) * x) / L
    for (const p of bySpan[span] ?? NO_LOADS) M += p.M0(x)
    return M
  }
  const shearAt = (span: number, x: number): number => {
    const L = spanAt(span, x)
    let V = ((MB[span] as number) - (MA[span] as number)) / L
    for (const p of bySpan[span] ?? NO_LOADS) V += p.V0(x)
    return V
  }
  const supportMoments = supports.map((_, j) => (j < n ? momentAt(j, 0) : momentAt(n - 1, spans[n - 1] as number)))
  // end reactions of each span: simple-span reactions plus the couple of the end moments (statics)
  const endA = (i: number): number => (RA[i] as number) + ((MB[i] as number) - (MA[i] as number)) / (spans[i] as number)
  const endB = (i: number): number => (RB[i] as number) - ((MB[i] as number) - (MA[i] as number)) / (spans[i] as number)
  const reactions = supports.map((s, j) => (s === 'free' ? 0 : (j < n ? endA(j) : 0) + (j > 0 ? endB(j - 1) : 0)))
  // couple reaction on the beam from joint equilibrium: M(left) − M(right) of the support (statics)
  const reactionCouples = supports.map((s, j) => {
    if (s === 'free') return 0
    if (s === 'pinned') return -(springs[j] as number) * (rotations[j] as number)
    return (j > 0 ? (MB[j - 1] as number) : 0) - (j < n ? (MA[j] as number) : 0)
  })
  return { supportMoments, reactions, reactionCouples, rotations, momentAt, shearAt }
}

export function analyseContinuousBeam(input: ContinuousBeamInput): ContinuousBeamResult {
  return continuousBeamModel(input).analyse(input.loads)
}

/**
 * Unit responses for pattern loading (EN 1992-1-1 5.1.3): the beam is factored once; unit(i) is
 * the response to a uniform load of 1 N/mm on span i alone (computed on first use and kept, O(n)
 * each), and combine(w) the response to w[i] N/mm on every span i together — by superposition
 * equal to Σ w[i]·unit(i), but found with one O(n) solve, so a pattern case costs O(n) whatever
 * the number of spans. Multiply a unit response by the case's line load to scale it.
 */
export interface SpanUnitResponses {
  readonly model: ContinuousBeamModel
  unit(span: number): ContinuousBeamResult
  combine(w: number[]): ContinuousBeamResult
}

export function spanUnitResponses(input: BeamModelInput): SpanUnitResponses {
  const model = continuousBeamModel(input)
  const n = model.spans.length
  const cache = new Map<number, ContinuousBeamResult>()
  return {
    model,
    unit(span) {
      if (!Number.isInteger(span) || span < 0 || span >= n) throw new EngineInputError('span', `no such span: the member has ${n} spans, numbered from 0`)
      let r = cache.get(span)
      if (!r) {
        r = model.analyse([{ kind: 'udl', span, w: 1 }])
        cache.set(span, r)
      }
      return r
    },
    combine(w) {
      if (!Array.isArray(w) || w.length !== n) throw new EngineInputError('w', `give ${n} line loads, one per span`)
      return model.analyse(w.map((wi, span) => ({ kind: 'udl' as const, span, w: wi })))
    },
  }
}
