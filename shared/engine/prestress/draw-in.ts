/**
 * Anchorage draw-in (wedge set, EN 1992-1-1 5.10.5.3) of a post-tensioned tendon stressed from one
 * end or from both, following the stressing sequence on site.
 *
 * Each lock-off lets the anchor slip by Δ (the draw-in). Over the affected length the tendon slides
 * back towards the anchor and friction reverses, so from the anchor the force rises again as
 * R(x) = R0·e^(μ(θ(x) + k·x)) with θ, x measured from that anchor — the same law as eq. (5.45)
 * with the sign of the movement reversed; the textbook mirror 2Q − P(x) is its linearisation. The
 * slip fixes R0: Δ·Ep·Ap = ∫ (P_before − P_after) dx over the affected length (compatibility of
 * the slip, textbook method; l_set = √(Δ·Ep·Ap/p) for a constant loss p per unit length). Where
 * the affected length reaches the far end, the whole tendon slides and the force falls further
 * along the whole length. R0 is found by bisection on that area, which falls steadily as R0 rises.
 *
 * The reverse-friction factor e^(μ(θ + kx)) is read from the one-end friction curve of the same
 * anchor, F(anchor)/F(x), so the caller passes the friction curves and not the geometry again.
 *
 * Sequences for a tendon stressed at both ends:
 * - 'left-first' / 'right-first': jack end 1 (its friction curve), lock off end 1, jack end 2 (the
 *   force rises only where end 2's friction curve exceeds the current force: max(current, F2)),
 *   lock off end 2 against the force as it then stands. The second jack re-stretches the tendon
 *   wherever its curve is higher, so on a short tendon it recovers the first slip.
 * - 'simultaneous': both jacks pull together (force max(F1, F2)), then both anchors lock off
 *   together; each anchor slips Δ. Where the two affected lengths overlap the whole tendon moves,
 *   away from a stationary point where the two reverse-friction curves meet.
 * Because every curve here is a multiple of e^(±μ(θ + kx)), the ratio of two of them is monotonic
 * along the tendon: the max/min above each change the force over one length from an end only.
 * The order of the ends matters only where the affected lengths meet: then, on a tendon that is
 * not symmetric, it changes the mean force after lock-off (by several per cent on short, strongly
 * curved tendons), so it is an input and not an assumption. Where the lengths do not meet, all
 * three sequences give max(one-end result from the left, from the right).
 *
 * Forces N, x in mm (along the tendon), Ep·Ap in N.
 */
import { EngineInputError } from '../contract'

export type StressedEnds = 'left' | 'right' | 'both'
export type StressingSequence = 'left-first' | 'right-first' | 'simultaneous'
type End = 'left' | 'right'

export interface LockOffInput {
  /** stations along the tendon from the left end, mm, non-decreasing */
  x: readonly number[]
  /** force after jacking at the left end alone, N (eq. (5.45)); needed when the left end is stressed */
  frictionFromLeft?: readonly number[]
  /** force after jacking at the right end alone, N (eq. (5.45)); needed when the right end is stressed */
  frictionFromRight?: readonly number[]
  ends: StressedEnds
  /** draw-in at each stressed anchor, mm */
  slip: number
  /** Ep·Ap of the tendon, N */
  EpAp: number
  /** for ends = 'both' (required there): the order of jacking and lock-off */
  sequence?: StressingSequence
  /**
   * law of the reverse friction during the slip: 'proportional' (default) R0·e^(μ(θ + kx)), friction
   * proportional to the force as in eq. (5.45); 'mirror' R0 + (F(anchor) − F(x)), the textbook
   * mirror image, exact for a friction loss per unit length that does not depend on the force
   */
  reverseFriction?: 'proportional' | 'mirror'
}

export interface LockOffStage {
  action: 'jack' | 'lock-off'
  end: End | 'both'
  /** force after this stage, N */
  force: number[]
}

export interface PerEnd<T> {
  left?: T
  right?: T
}

export interface LockOffResult {
  /** force after the last lock-off, N */
  force: number[]
  /** length affected by the draw-in, from that anchor, mm (the tendon length when it reaches the far end) */
  setLength: PerEnd<number>
  /** true when the draw-in from that end moves the whole tendon */
  wholeLength: PerEnd<boolean>
  /** ∫ ΔP dx of that lock-off, N·mm; equals slip·Ep·Ap */
  lossArea: PerEnd<number>
  /** force lost at that anchor by its lock-off, N */
  lossAtAnchor: PerEnd<number>
  /** extension drawn by the jack at that end, ∫ (P_after − P_before) dx/(Ep·Ap), mm */
  extensionAtJack: PerEnd<number>
  stages: LockOffStage[]
}

/** Trapezoidal integral of v over s. */
function trapezoid(s: readonly number[], v: readonly number[]): number {
  let area = 0
  for (let i = 1; i < s.length; i++) area += (((v[i - 1] as number) + (v[i] as number)) / 2) * ((s[i] as number) - (s[i - 1] as number)) // trapezoidal rule
  return area
}

function bisect(f: (v: number) => number, lo: number, hi: number): number {
  // f decreasing in v; returns v with f(v) ≈ 0
  let a = lo
  let b = hi
  for (let it = 0; it < 200 && b - a > 1e-13 * Math.max(1, Math.abs(hi)); it++) {
    const m = (a + b) / 2
    if (f(m) > 0) a = m
    else b = m
  }
  return (a + b) / 2
}

interface Seat {
  force: number[]
  setLength: number
  wholeLength: boolean
  area: number
}

/**
 * Lock-off at s[0] against the current force P: after = R0·g over the affected length, which ends
 * where R0·g first reaches P (beyond it nothing moves); R0 from ∫(P − after) ds = target.
 */
function seatAtStart(s: readonly number[], P: readonly number[], g: Reverse, target: number): Seat {
  const n = s.length
  const length = (s[n - 1] as number) - (s[0] as number)
  const loss = (R0: number): { loss: number[]; end: number; whole: boolean } => {
    const out = new Array<number>(n).fill(0)
    for (let i = 0; i < n; i++) {
      const l = (P[i] as number) - g(R0, i)
      if (l <= 0 && i > 0) {
        const lp = out[i - 1] as number
        const si = s[i - 1] as number
        return { loss: out, end: si + ((s[i] as number) - si) * (lp / (lp - l)) - (s[0] as number), whole: false } // crossing by linear interpolation
      }
      out[i] = Math.max(0, l)
    }
    return { loss: out, end: length, whole: true }
  }
  if (target === 0) return { force: [...P], setLength: 0, wholeLength: false, area: 0 }
  const P0 = P[0] as number
  // the same area as trapezoid(s, loss(R0).loss), without building the arrays (bisection runs it often)
  const lossArea = (R0: number): number => {
    let sum = 0
    let prev = Math.max(0, P0 - g(R0, 0))
    for (let i = 1; i < n; i++) {
      const l = (P[i] as number) - g(R0, i)
      const h = (s[i] as number) - (s[i - 1] as number)
      if (l <= 0) return sum + (prev / 2) * h // trapezoidal rule, zero loss from the first crossing on
      sum += ((prev + l) / 2) * h // trapezoidal rule
      prev = l
    }
    return sum
  }
  if (target >= lossArea(0)) throw new EngineInputError('slip', 'the draw-in is larger than the extension of the whole tendon')
  const R0 = bisect((r) => lossArea(r) - target, 0, P0)
  const r = loss(R0)
  return { force: P.map((p, i) => p - (r.loss[i] as number)), setLength: r.end, wholeLength: r.whole, area: trapezoid(s, r.loss) }
}

/** The same lock-off at either end (the right end by mirroring the stations). */
function seat(end: End, x: readonly number[], P: readonly number[], g: Reverse, target: number): Seat {
  if (end === 'left') return seatAtStart(x.map((v) => v - (x[0] as number)), P, g, target)
  const xn = x[x.length - 1] as number
  const n = x.length
  const r = seatAtStart([...x].reverse().map((v) => xn - v), [...P].reverse(), (R0, j) => g(R0, n - 1 - j), target)
  return { ...r, force: r.force.reverse() }
}

/** Force at station i after a slip that leaves R0 at the anchor. */
type Reverse = (R0: number, i: number) => number

/** Reverse friction from an anchor, read off that anchor's friction curve F (see the module note). */
function reverse(end: End, F: readonly number[], law: 'proportional' | 'mirror'): Reverse {
  const a = (end === 'left' ? F[0] : F[F.length - 1]) as number
  if (law === 'mirror') return (R0, i) => Math.max(0, R0 + a - (F[i] as number)) // textbook mirror image of the friction curve
  return (R0, i) => (R0 * a) / (F[i] as number) // R0·e^(μ(θ + kx)), e^(μ(θ + kx)) = F(anchor)/F(x) by eq. (5.45)
}

/** Both anchors lock off together against the jacked force J (see the module note). */
function seatBoth(x: readonly number[], J: readonly number[], gl: Reverse, gr: Reverse, target: number): { force: number[]; left: Seat; right: Seat } {
  const left = seat('left', x, J, gl, target)
  const right = seat('right', x, J, gr, target)
  const length = (x[x.length - 1] as number) - (x[0] as number)
  const overlap = J.some((p, i) => (left.force[i] as number) < p && (right.force[i] as number) < p) || left.setLength + right.setLength > length
  if (!overlap) return { force: J.map((_, i) => Math.min(left.force[i] as number, right.force[i] as number)), left, right }
  // the whole tendon slides, each part towards its own anchor: F = min(J, left reverse curve, right reverse curve)
  const n = x.length
  if (2 * target >= trapezoid(x, J)) throw new EngineInputError('slip', 'the two draw-ins are larger than the extension of the whole tendon')
  const curve = (A: number, B: number): number[] => J.map((p, i) => Math.min(p, gl(A, i), gr(B, i)))
  const parts = (A: number, B: number): { left: number; right: number; xs: number } => {
    const loss = curve(A, B).map((f, i) => (J[i] as number) - f)
    let k = 0
    while (k < n && gl(A, k) < gr(B, k)) k++ // first station on the right part
    if (k === 0) return { left: 0, right: trapezoid(x, loss), xs: x[0] as number }
    if (k === n) return { left: trapezoid(x, loss), right: 0, xs: x[n - 1] as number }
    const d0 = gl(A, k - 1) - gr(B, k - 1)
    const d1 = gl(A, k) - gr(B, k)
    const t = d0 / (d0 - d1) // stationary point by linear interpolation
    const xa = x[k - 1] as number
    const xs = xa + ((x[k] as number) - xa) * t
    const ls = (loss[k - 1] as number) + ((loss[k] as number) - (loss[k - 1] as number)) * t
    const leftArea = trapezoid(x.slice(0, k), loss.slice(0, k)) + (((loss[k - 1] as number) + ls) / 2) * (xs - xa)
    return { left: leftArea, right: trapezoid(x, loss) - leftArea, xs }
  }
  const J0 = J[0] as number
  const Jn = J[n - 1] as number
  const totalFor = (A: number): number => bisect((B) => trapezoid(x, curve(A, B).map((f, i) => (J[i] as number) - f)) - 2 * target, 0, Jn)
  const A = bisect((a) => parts(a, totalFor(a)).left - target, 0, J0)
  const B = totalFor(A)
  const force = curve(A, B)
  const p = parts(A, B)
  return {
    force,
    left: { force, setLength: p.xs - (x[0] as number), wholeLength: true, area: p.left },
    right: { force, setLength: (x[n - 1] as number) - p.xs, wholeLength: true, area: p.right },
  }
}

function checkCurve(field: string, x: readonly number[], F: readonly number[] | undefined): readonly number[] {
  if (!F) throw new EngineInputError(field, 'give the friction curve of the stressed end')
  if (F.length !== x.length) throw new EngineInputError(field, 'give one force per station')
  F.forEach((f, i) => {
    if (!(f > 0) || !Number.isFinite(f)) throw new EngineInputError(`${field}.${i}`, 'the force must be a positive number')
  })
  return F
}

/**
 * Force along the tendon after lock-off at the stressed end(s), stage by stage (see the module
 * note for the sequence and the reverse-friction law).
 */
export function forceAfterLockOff(i: LockOffInput): LockOffResult {
  const { x } = i
  if (x.length < 2) throw new EngineInputError('x', 'give at least two stations')
  x.forEach((v, j) => {
    if (!Number.isFinite(v)) throw new EngineInputError(`x.${j}`, 'must be a finite number')
    if (j > 0 && v < (x[j - 1] as number)) throw new EngineInputError(`x.${j}`, 'stations must not decrease along the tendon')
  })
  if (!((x[x.length - 1] as number) > (x[0] as number))) throw new EngineInputError('x', 'the tendon must have a length')
  if (!['left', 'right', 'both'].includes(i.ends)) throw new EngineInputError('ends', 'left, right or both')
  if (!(i.slip >= 0) || !Number.isFinite(i.slip)) throw new EngineInputError('slip', 'the draw-in must not be negative')
  if (!(i.EpAp > 0) || !Number.isFinite(i.EpAp)) throw new EngineInputError('EpAp', 'Ep·Ap must be positive')
  const law = i.reverseFriction ?? 'proportional'
  if (law !== 'proportional' && law !== 'mirror') throw new EngineInputError('reverseFriction', 'proportional or mirror')
  const target = i.slip * i.EpAp // Δ·Ep·Ap, N·mm: area of the loss diagram of one lock-off
  const FL = i.ends !== 'right' ? checkCurve('frictionFromLeft', x, i.frictionFromLeft) : undefined
  const FR = i.ends !== 'left' ? checkCurve('frictionFromRight', x, i.frictionFromRight) : undefined
  const result: LockOffResult = { force: [], setLength: {}, wholeLength: {}, lossArea: {}, lossAtAnchor: {}, extensionAtJack: {}, stages: [] }
  const friction = (end: End): readonly number[] => (end === 'left' ? FL : FR) as readonly number[]
  const record = (end: End, before: readonly number[], s: Seat): void => {
    result.setLength[end] = s.setLength
    result.wholeLength[end] = s.wholeLength
    result.lossArea[end] = s.area
    const k = end === 'left' ? 0 : x.length - 1
    result.lossAtAnchor[end] = (before[k] as number) - (s.force[k] as number)
  }
  let P: number[] = x.map(() => 0)
  const jack = (end: End): void => {
    const F = friction(end)
    const after = P.map((p, j) => Math.max(p, F[j] as number)) // the jack raises the force only where its curve is higher
    result.extensionAtJack[end] = trapezoid(x, after.map((p, j) => p - (P[j] as number))) / i.EpAp // ΔL = ∫ΔP dx/(Ep·Ap)
    P = after
    result.stages.push({ action: 'jack', end, force: [...P] })
  }
  const lockOff = (end: End): void => {
    const s = seat(end, x, P, reverse(end, friction(end), law), target)
    record(end, P, s)
    P = s.force
    result.stages.push({ action: 'lock-off', end, force: [...P] })
  }
  if (i.ends !== 'both') {
    jack(i.ends)
    lockOff(i.ends)
  } else {
    const sequence = i.sequence
    if (sequence === undefined || !['left-first', 'right-first', 'simultaneous'].includes(sequence)) {
      throw new EngineInputError('sequence', 'for a tendon stressed at both ends say left-first, right-first or simultaneous')
    }
    if (sequence === 'simultaneous') {
      const Fl = FL as readonly number[]
      const Fr = FR as readonly number[]
      const J = x.map((_, j) => Math.max(Fl[j] as number, Fr[j] as number)) // each jack pulls its part up to where the curves meet
      // each jack draws the part on its side of the point where the two curves meet (Fl − Fr falls along x)
      let k = 1
      while (k < x.length - 1 && (Fl[k] as number) > (Fr[k] as number)) k++
      const d0 = (Fl[k - 1] as number) - (Fr[k - 1] as number)
      const d1 = (Fl[k] as number) - (Fr[k] as number)
      const t = d0 > 0 && d1 < 0 ? d0 / (d0 - d1) : d0 <= 0 ? 0 : 1 // meeting point by linear interpolation
      const xa = x[k - 1] as number
      const xc = xa + ((x[k] as number) - xa) * t
      const Jc = (J[k - 1] as number) + ((J[k] as number) - (J[k - 1] as number)) * t
      const leftPart = trapezoid(x.slice(0, k), J.slice(0, k)) + (((J[k - 1] as number) + Jc) / 2) * (xc - xa)
      result.extensionAtJack.left = leftPart / i.EpAp // ΔL = ∫P dx/(Ep·Ap)
      result.extensionAtJack.right = (trapezoid(x, J) - leftPart) / i.EpAp
      result.stages.push({ action: 'jack', end: 'both', force: [...J] })
      const b = seatBoth(x, J, reverse('left', Fl, law), reverse('right', Fr, law), target)
      record('left', J, b.left)
      record('right', J, b.right)
      P = b.force
      result.stages.push({ action: 'lock-off', end: 'both', force: [...P] })
    } else {
      const [first, second]: [End, End] = sequence === 'left-first' ? ['left', 'right'] : ['right', 'left']
      jack(first)
      lockOff(first)
      jack(second)
      lockOff(second)
    }
  }
  result.force = P
  return result
}
