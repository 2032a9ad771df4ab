/**
 * Continuous beam on rigid supports by the stiffness (slope-deflection) method, one rotation per
 * support. Sign conventions (fixed for the whole engine): sagging moment positive, gravity loads
 * positive downward, reactions positive upward, couples positive counter-clockwise. x is measured
 * from the left support of each span. momentAt(span, 0) is the value just inside the span (0⁺) and
 * momentAt(span, L) the value at L⁻, so anchorage couples at the ends show in the end moments.
 */
import { EngineInputError } from '../contract'
import { solveLinear } from './linear'

export type SupportKind = 'pinned' | 'fixed'

export type BeamLoad =
  | { kind: 'udl'; span: number; w: number }
  | { kind: 'patch'; span: number; from: number; to: number; w: number }
  | { kind: 'point'; span: number; at: number; P: number }
  | { kind: 'couple'; span: number; at: number; M: number }

export interface ContinuousBeamInput {
  spans: number[]
  EI?: number | number[]
  supports?: SupportKind[]
  loads: BeamLoad[]
}

export interface ContinuousBeamResult {
  /** bending moment at each support (sagging positive), N·mm */
  supportMoments: number[]
  /** reaction at each support (upward positive), N */
  reactions: number[]
  momentAt(span: number, x: number): number
  shearAt(span: number, x: number): number
}

/** Simply supported span: moment M0(x), shear V0(x), ∫M0 dx and ∫M0·x dx of one load. */
interface SimpleSpan {
  M0(x: number): number
  V0(x: number): number
  area: number
  firstMoment: number
  /** end reactions of the simple span (upward +); a load right at a support goes to that support */
  RA: number
  RB: number
}

function simpleSpan(load: BeamLoad, L: number): SimpleSpan {
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
      // Integrals of the point-load results a(L−a)/2 and a(L²−a²)/6 over the loaded length (statics)
      const F1 = (s: number): number => (L * s * s) / 2 - (s * s * s) / 3
      const F2 = (s: number): number => (L * L * s * s) / 2 - (s * s * s * s) / 4
      return {
        M0: (x) => {
          const l = loadedLeft(x)
          return RA * x - w * l * (x - (a + l / 2))
        },
        V0: (x) => RA - w * loadedLeft(x),
        area: (w / 2) * (F1(b) - F1(a)),
        RA,
        RB: W - RA,
        firstMoment: (w / 6) * (F2(b) - F2(a)),
      }
    }
    case 'point': {
      const a = load.at
      const P = load.P
      const RA = (P * (L - a)) / L // statics of the simple span
      return {
        M0: (x) => (x <= a ? RA * x : RA * x - P * (x - a)),
        V0: (x) => (x < a ? RA : RA - P),
        area: (P * a * (L - a)) / 2,
        RA,
        RB: P - RA,
        firstMoment: (P * a * (L - a) * (L + a)) / 6,
      }
    }
    case 'couple': {
      const c = load.at
      const M = load.M
      // a counter-clockwise couple M: RA = M/L up, RB = −M/L; the moment drops by M across c
      const included = (x: number): boolean => c < x || c === 0
      return {
        M0: (x) => (included(x) ? (M * x) / L - M : (M * x) / L),
        V0: () => M / L,
        area: (M * (2 * c - L)) / 2,
        RA: M / L,
        RB: -M / L,
        firstMoment: (M * c * c * c) / (3 * L) - (M / L) * ((L * (L * L - c * c)) / 2 - (L * L * L - c * c * c) / 3),
      }
    }
  }
}

function checkLoad(load: BeamLoad, i: number, spans: number[]): void {
  const field = `loads.${i}`
  const L = spans[load.span]
  if (!Number.isInteger(load.span) || L === undefined) throw new EngineInputError(`${field}.span`, 'no such span')
  const finite = (v: number, f: string): void => {
    if (!Number.isFinite(v)) throw new EngineInputError(`${field}.${f}`, 'must be a finite number')
  }
  if (load.kind === 'udl') finite(load.w, 'w')
  if (load.kind === 'patch') {
    finite(load.w, 'w')
    if (!(load.from >= 0 && load.to <= L && load.from <= load.to)) throw new EngineInputError(`${field}.from`, 'the patch must lie within the span')
  }
  if (load.kind === 'point') {
    finite(load.P, 'P')
    if (!(load.at >= 0 && load.at <= L)) throw new EngineInputError(`${field}.at`, 'the load must lie within the span')
  }
  if (load.kind === 'couple') {
    finite(load.M, 'M')
    if (!(load.at >= 0 && load.at <= L)) throw new EngineInputError(`${field}.at`, 'the couple must lie within the span')
  }
}

export function analyseContinuousBeam(input: ContinuousBeamInput): ContinuousBeamResult {
  const { spans, loads } = input
  const n = spans.length
  if (n < 1) throw new EngineInputError('spans', 'at least one span is needed')
  spans.forEach((L, i) => {
    if (!(L > 0) || !Number.isFinite(L)) throw new EngineInputError(`spans.${i}`, 'span length must be positive')
  })
  const EIs = spans.map((_, i) => (Array.isArray(input.EI) ? input.EI[i] : input.EI ?? 1))
  EIs.forEach((v, i) => {
    if (v === undefined || !(v > 0) || !Number.isFinite(v)) throw new EngineInputError(`EI.${i}`, 'flexural stiffness must be positive')
  })
  const supports = input.supports ?? spans.map(() => 'pinned' as SupportKind).concat('pinned')
  if (supports.length !== n + 1) throw new EngineInputError('supports', `give ${n + 1} supports for ${n} spans`)
  loads.forEach((l, i) => checkLoad(l, i, spans))

  const bySpan: SimpleSpan[][] = spans.map(() => [])
  loads.forEach((l) => bySpan[l.span]?.push(simpleSpan(l, spans[l.span] as number)))

  // Fixed-end bending moments from zero end rotations: ∫M dx = 0 and ∫M·x dx = 0 (moment-area)
  const fixedEnd = spans.map((L, i) => {
    const parts = bySpan[i] as SimpleSpan[]
    const A0 = parts.reduce((s, p) => s + p.area, 0)
    const S0 = parts.reduce((s, p) => s + p.firstMoment, 0)
    // Solve MA·L/2 + MB·L/2 = −A0 ; MA·L²/6 + MB·L²/3 = −S0
    const MB = (-6 * S0) / (L * L) + (2 * A0) / L
    const MA = (-2 * A0) / L - MB
    return { MA, MB }
  })

  // Unknown rotations (counter-clockwise positive) at the supports that are not fixed
  const dof: number[] = supports.map(() => -1)
  let m = 0
  supports.forEach((s, j) => {
    if (s !== 'fixed') dof[j] = m++
  })
  const K: number[][] = Array.from({ length: m }, () => new Array<number>(m).fill(0))
  const F: number[] = new Array<number>(m).fill(0)
  spans.forEach((L, i) => {
    const k = (EIs[i] as number) / L
    const fe = fixedEnd[i] as { MA: number; MB: number }
    // member-end moments acting on the member, counter-clockwise positive: left = −MA, right = +MB
    const ends: Array<[number, number]> = [[dof[i] as number, -fe.MA], [dof[i + 1] as number, fe.MB]]
    const local = [[4 * k, 2 * k], [2 * k, 4 * k]]
    ends.forEach(([a, mf], r) => {
      if (a < 0) return
      F[a] = (F[a] as number) - mf
      ends.forEach(([b], c) => {
        if (b < 0) return
        const row = K[a] as number[]
        row[b] = (row[b] as number) + ((local[r] as number[])[c] as number)
      })
    })
  })
  const theta = m > 0 ? solveLinear(K, F) : []
  const rot = (j: number): number => (dof[j] as number) >= 0 ? (theta[dof[j] as number] as number) : 0

  const endMoments = spans.map((L, i) => {
    const k = (EIs[i] as number) / L
    const fe = fixedEnd[i] as { MA: number; MB: number }
    const ta = rot(i)
    const tb = rot(i + 1)
    return { left: fe.MA - k * (4 * ta + 2 * tb), right: fe.MB + k * (2 * ta + 4 * tb) }
  })

  const momentAt = (span: number, x: number): number => {
    const L = spans[span]
    const em = endMoments[span]
    if (L === undefined || em === undefined) throw new EngineInputError('span', 'no such span')
    const parts = bySpan[span] as SimpleSpan[]
    let M = em.left * (1 - x / L) + (em.right * x) / L
    for (const p of parts) M += p.M0(x)
    return M
  }
  const shearAt = (span: number, x: number): number => {
    const L = spans[span]
    const em = endMoments[span]
    if (L === undefined || em === undefined) throw new EngineInputError('span', 'no such span')
    const parts = bySpan[span] as SimpleSpan[]
    let V = (em.right - em.left) / L
    for (const p of parts) V += p.V0(x)
    return V
  }

  const supportMoments = supports.map((_, j) => (j < n ? momentAt(j, 0) : momentAt(n - 1, spans[n - 1] as number)))
  // end reactions of each span: simple-span reactions plus the couple of the end moments (statics)
  const endReaction = (i: number, end: 'A' | 'B'): number => {
    const L = spans[i] as number
    const em = endMoments[i] as { left: number; right: number }
    const parts = bySpan[i] as SimpleSpan[]
    const simple = parts.reduce((s, p) => s + (end === 'A' ? p.RA : p.RB), 0)
    const fromMoments = (em.right - em.left) / L
    return end === 'A' ? simple + fromMoments : simple - fromMoments
  }
  const reactions = supports.map((_, j) => (j < n ? endReaction(j, 'A') : 0) + (j > 0 ? endReaction(j - 1, 'B') : 0))
  return { supportMoments, reactions, momentAt, shearAt }
}
