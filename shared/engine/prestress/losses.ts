/**
 * Losses of prestress in post-tensioned tendons: friction (EN 1992-1-1 5.10.5.2, in friction.ts), anchorage
 * draw-in (5.10.5.3, in draw-in.ts), elastic shortening
 * (5.10.5.1) and the time-dependent loss from creep, shrinkage and relaxation (5.10.6).
 * Forces in N, stresses in MPa, x in mm, k in rad/mm.
 */
import { EngineInputError } from '../contract'
import { forceAfterLockOff } from './draw-in'

export { cumulativeAngle, frictionCurves, frictionForce } from './friction'
export type { FrictionCurves, FrictionCurvesInput } from './friction'
export { forceAfterLockOff } from './draw-in'
export type { LockOffInput, LockOffResult, LockOffStage, PerEnd, StressedEnds, StressingSequence } from './draw-in'

export interface DrawInResult {
  /** force after lock-off at each station */
  P: number[]
  /** length affected by the draw-in from the live end, mm (the whole length when it reaches the far end) */
  lset: number
  /** loss at the live anchorage, N */
  lossAtAnchor: number
  /** true when the draw-in reaches the far end of the tendon */
  wholeLength: boolean
}

/**
 * Draw-in at the live end x[0] against the friction curve P (the tendon stressed from that end
 * only): forceAfterLockOff with ends = 'left' and the textbook mirror image of P for the reverse
 * friction (P may be any friction curve, of eq. (5.45) or not). The slip fixes the affected length through
 * ∫ΔP dx = Δ·Ep·Ap (textbook method; l_set = √(Δ·Ep·Ap/p) for a constant loss p per unit length).
 */
export function drawInForces(x: number[], P: number[], slip: number, EpAp: number): DrawInResult {
  if (x.length !== P.length || x.length < 2) throw new EngineInputError('x', 'give at least two stations with their forces')
  if (!(slip >= 0) || !Number.isFinite(slip)) throw new EngineInputError('drawIn', 'the draw-in must not be negative')
  if (!(EpAp > 0)) throw new EngineInputError('Ap', 'Ep·Ap must be positive')
  let r: ReturnType<typeof forceAfterLockOff>
  try {
    r = forceAfterLockOff({ x, frictionFromLeft: P, ends: 'left', slip, EpAp, reverseFriction: 'mirror' })
  } catch (e) {
    if (e instanceof EngineInputError && e.field === 'slip') throw new EngineInputError('drawIn', e.message.replace(/^slip: /, '')) // this function's own name for it
    throw e
  }
  return { P: r.force, lset: r.setLength.left as number, lossAtAnchor: r.lossAtAnchor.left as number, wholeLength: r.wholeLength.left as boolean }
}

/** Draw-in length for a linear friction loss p (N/mm): l_set = √(Δ·Ep·Ap/p) (textbook, from memory). */
export function drawInLength(slip: number, EpAp: number, p: number): number {
  if (!(p > 0)) throw new EngineInputError('p', 'the friction loss per unit length must be positive')
  return Math.sqrt((slip * EpAp) / p) // l_set = √(Δ Ep Ap / p)
}

/**
 * Elastic shortening when n tendons are stressed one after another:
 * ΔPel = Ap·Ep·j·Δσc/Ecm(t), j = (n − 1)/2n, EN 1992-1-1 eq. (5.44); n = Infinity gives j = 1/2.
 */
export function elasticShorteningLoss(i: { Ap: number; Ep: number; EcmT: number; sigmaC: number; n: number }): number {
  if (!(i.n >= 1)) throw new EngineInputError('n', 'the number of tendons stressed in turn must be at least 1')
  if (!(i.EcmT > 0)) throw new EngineInputError('Ecm', 'Ecm(t) must be positive')
  const j = Number.isFinite(i.n) ? (i.n - 1) / (2 * i.n) : 0.5 // EN 1992-1-1 5.10.5.1(2)
  return (i.Ap * i.Ep * j * Math.max(0, i.sigmaC)) / i.EcmT // EN 1992-1-1 eq. (5.44)
}

export interface TimeDependentInput {
  /** shrinkage strain, positive as shortening */
  epsCs: number
  Ep: number
  Ecm: number
  /** creep coefficient φ(t, t0) */
  phi: number
  /** concrete stress at the tendon under self-weight, initial prestress and quasi-permanent actions, compression + */
  sigmaCQP: number
  /** relaxation loss, MPa (positive) */
  dSigmaPr: number
  Ap: number
  Ac: number
  Ic: number
  /** distance between the centroid of the concrete section and the tendons */
  zcp: number
}

export interface TimeDependentParts {
  shrinkage: number
  relaxation: number
  creep: number
  total: number
}

/** The three terms of eq. (5.46), each over the common denominator, MPa. */
export function timeDependentParts(i: TimeDependentInput): TimeDependentParts {
  const positive: Array<[keyof TimeDependentInput, number]> = [['Ep', i.Ep], ['Ecm', i.Ecm], ['Ap', i.Ap], ['Ac', i.Ac], ['Ic', i.Ic]]
  for (const [k, v] of positive) if (!(v > 0) || !Number.isFinite(v)) throw new EngineInputError(k, 'must be positive')
  const finite: Array<[keyof TimeDependentInput, number]> = [['epsCs', i.epsCs], ['phi', i.phi], ['sigmaCQP', i.sigmaCQP], ['dSigmaPr', i.dSigmaPr], ['zcp', i.zcp]]
  for (const [k, v] of finite) if (!Number.isFinite(v)) throw new EngineInputError(k, 'must be a finite number')
  const ratio = i.Ep / i.Ecm
  // EN 1992-1-1 eq. (5.46) denominator
  const den = 1 + ratio * (i.Ap / i.Ac) * (1 + (i.Ac / i.Ic) * i.zcp * i.zcp) * (1 + 0.8 * i.phi)
  const shrinkage = (i.epsCs * i.Ep) / den // EN 1992-1-1 eq. (5.46), shrinkage term
  const relaxation = (0.8 * i.dSigmaPr) / den // EN 1992-1-1 eq. (5.46), relaxation term
  const creep = (ratio * i.phi * i.sigmaCQP) / den // EN 1992-1-1 eq. (5.46), creep term
  return { shrinkage, relaxation, creep, total: shrinkage + relaxation + creep }
}

/** Δσp,c+s+r of EN 1992-1-1 eq. (5.46), MPa (a loss is positive). */
export function timeDependentLoss(i: TimeDependentInput): number {
  return timeDependentParts(i).total
}
