/**
 * The path of a tendon along its profile: the distance along the tendon (arc length) and the slope
 * de/dx at given points of the spans. Friction (eq. (5.45)) and draw-in are measured along the
 * tendon, so the member's losses and the stressing schedule read both from here, on the same points.
 */
import { EngineInputError } from '../contract'
import { cumulativeAngle } from './friction'
import { slopeIn } from './profile'
import type { ProfilePiece } from './profile'

/** A point of the profile: the span and the distance from its left support, mm. */
export interface PathPoint { span: number; x: number }

export interface TendonPath {
  /** distance along the tendon from its left end at each point, mm */
  s: number[]
  /** de/dx at each point (two points at one support carry the slopes either side of a kink) */
  slopes: number[]
  /** length of the tendon, mm */
  length: number
  /** total angular deviation, rad */
  theta: number
}

/** `perSpan` equal parts of every span (a support appears twice: the end of one span and the start of the next). */
export function evenPoints(spans: readonly number[], perSpan: number): PathPoint[] {
  return spans.flatMap((L, span) => Array.from({ length: perSpan + 1 }, (_, j) => ({ span, x: (L * j) / perSpan })))
}

/** Arc length and slopes at the points, which run along the member (span by span, x rising within a span). */
export function tendonPath(pieces: ProfilePiece[][], spans: readonly number[], points: readonly PathPoint[]): TendonPath {
  if (points.length < 2) throw new EngineInputError('points', 'give at least two points along the tendon')
  const offsets: number[] = []
  spans.reduce((acc, L) => (offsets.push(acc), acc + L), 0)
  const s: number[] = []
  const slopes: number[] = []
  let prevX = 0
  let sAcc = 0
  points.forEach((p, k) => {
    const span = pieces[p.span]
    if (!span || !(p.x >= 0) || !(p.x <= (spans[p.span] as number) + 1e-6)) throw new EngineInputError(`points.${k}`, 'the point lies outside the spans')
    const X = (offsets[p.span] as number) + p.x
    if (k > 0 && X < prevX - 1e-9) throw new EngineInputError(`points.${k}`, 'points must run along the member')
    const slope = slopeIn(span, p.x)
    const prevSlope = slopes[k - 1]
    if (prevSlope !== undefined) sAcc += ((X - prevX) * (Math.sqrt(1 + prevSlope * prevSlope) + Math.sqrt(1 + slope * slope))) / 2 // ds = √(1 + e'²) dx, trapezoidal
    s.push(sAcc)
    slopes.push(slope)
    prevX = X
  })
  const theta = cumulativeAngle(slopes).at(-1) as number // θ: sum of the true angular deviations (5.10.5.2(1))
  return { s, slopes, length: sAcc, theta }
}
