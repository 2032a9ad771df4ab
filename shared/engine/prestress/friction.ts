/**
 * Friction along a post-tensioned tendon, EN 1992-1-1 5.10.5.2: the cumulative angular deviation
 * θ(x) from the stressing end, taken as the true change of the tendon's direction (the sum of
 * |Δ arctan(de/dx)|, so that a steep profile is not overstated by summing slopes), and the force
 * after friction P(x) = Pmax·e^(−μ(θ + k·x)), eq. (5.45). Forces N, x in mm, k in rad/mm.
 */
import { EngineInputError } from '../contract'

/** Force at x after friction: P(x) = Pmax·e^(−μ(θ + kx)), EN 1992-1-1 eq. (5.45). */
export function frictionForce(Pmax: number, mu: number, theta: number, k: number, x: number): number {
  if (!(Pmax >= 0) || !Number.isFinite(Pmax)) throw new EngineInputError('Pmax', 'the jacking force must be a non-negative number')
  if (!(mu >= 0) || !Number.isFinite(mu)) throw new EngineInputError('mu', 'the friction coefficient must not be negative')
  if (!(theta >= 0) || !Number.isFinite(theta)) throw new EngineInputError('theta', 'the angular deviation must not be negative')
  if (!(k >= 0) || !Number.isFinite(k)) throw new EngineInputError('k', 'the wobble coefficient must not be negative')
  if (!(x >= 0) || !Number.isFinite(x)) throw new EngineInputError('x', 'the distance must not be negative')
  return Pmax * Math.exp(-mu * (theta + k * x)) // EN 1992-1-1 eq. (5.45): Pmax − ΔPμ(x)
}

/**
 * Cumulative angular deviation from the first station, rad: θ_i = θ_(i−1) + |atan(s_i) − atan(s_(i−1))|
 * (EN 1992-1-1 5.10.5.2(1): θ is the sum of the angular displacements over the distance x,
 * irrespective of direction or sign). `slopes` are de/dx at the stations; a kink is given by two
 * stations at the same x with the slopes either side.
 */
export function cumulativeAngle(slopes: readonly number[]): number[] {
  if (slopes.length === 0) throw new EngineInputError('slopes', 'give the slope at one station at least')
  const theta: number[] = []
  let acc = 0
  slopes.forEach((s, i) => {
    if (!Number.isFinite(s)) throw new EngineInputError(`slopes.${i}`, 'must be a finite number')
    if (i > 0) acc += Math.abs(Math.atan(s) - Math.atan(slopes[i - 1] as number)) // true change of direction, rad
    theta.push(acc)
  })
  return theta
}

export interface FrictionCurvesInput {
  /** stations along the tendon from the left end, mm, non-decreasing (a repeated x marks a kink) */
  x: readonly number[]
  /** de/dx at each station */
  slopes: readonly number[]
  /** force at the jack, N; the same at either end unless PjackRight is given */
  Pjack: number
  PjackRight?: number
  mu: number
  /** wobble, rad/mm */
  k: number
}

export interface FrictionCurves {
  /** θ from the left end at each station, rad */
  thetaFromLeft: number[]
  /** total angular deviation over the tendon, rad */
  theta: number
  /** force with the jack at the left end, N (eq. (5.45)) */
  fromLeft: number[]
  /** force with the jack at the right end, N (eq. (5.45)) */
  fromRight: number[]
}

/** The two one-end friction curves of a tendon, eq. (5.45) with θ from cumulativeAngle. */
export function frictionCurves(i: FrictionCurvesInput): FrictionCurves {
  if (i.x.length !== i.slopes.length || i.x.length < 2) throw new EngineInputError('x', 'give at least two stations, each with its slope')
  i.x.forEach((v, j) => {
    if (!Number.isFinite(v)) throw new EngineInputError(`x.${j}`, 'must be a finite number')
    if (j > 0 && v < (i.x[j - 1] as number)) throw new EngineInputError(`x.${j}`, 'stations must not decrease along the tendon')
  })
  const thetaFromLeft = cumulativeAngle(i.slopes)
  const theta = thetaFromLeft[thetaFromLeft.length - 1] as number
  const x0 = i.x[0] as number
  const L = (i.x[i.x.length - 1] as number) - x0
  const PR = i.PjackRight ?? i.Pjack
  const fromLeft = i.x.map((x, j) => frictionForce(i.Pjack, i.mu, thetaFromLeft[j] as number, i.k, x - x0)) // eq. (5.45)
  const fromRight = i.x.map((x, j) => frictionForce(PR, i.mu, Math.max(0, theta - (thetaFromLeft[j] as number)), i.k, Math.max(0, L - (x - x0)))) // eq. (5.45)
  return { thetaFromLeft, theta, fromLeft, fromRight }
}
