/**
 * Stressing schedule: per tendon the jacking force, the stressing end(s), the calculated extension
 * ΔL = ∫P(x)dx/(Ep·Ap) from the force along the tendon after friction (EN 1992-1-1 eq. (5.45)) at
 * the jack, and after lock-off with the draw-in (5.10.5.3), the acceptance band on measured
 * extensions (±7 % is common practice; an input) and the flag of each measured value outside it.
 * Forces N, lengths mm (measured along the tendon), k in rad/mm.
 */
import { EngineInputError } from '../contract'
import { drawInForces, frictionForce } from '../prestress/losses'
import { resolveProfile, slopeIn } from '../prestress/profile'
import type { TendonProfile } from '../prestress/profile'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'

export type StressingEnds = 'left' | 'right' | 'both'
export type TendonEnd = 'left' | 'right'

export interface StressingTendon {
  id: string
  ends: StressingEnds
  /** force at the jack, N */
  Pjack: number
  /** steel area of the tendon, mm² */
  Ap: number
}

export interface MeasuredExtension {
  id: string
  /** the end it was measured at; omit to compare with the total of both ends */
  end?: TendonEnd
  /** mm */
  extension: number
}

export interface StressingInput {
  profile: TendonProfile
  tendons: StressingTendon[]
  Ep: number
  mu: number
  /** wobble, rad/mm */
  k: number
  /** draw-in (wedge set) at each stressed end, mm */
  drawIn: number
  /** relative acceptance band on measured extensions, default 0.07 (common practice) */
  tolerance?: number
  /** strand length between the anchorage and the jack's grips, mm; its extension is added at each stressed end */
  jackLength?: number
  measured?: MeasuredExtension[]
  /** stations per span for the integration */
  stations?: number
}

export interface MeasuredCheck {
  end: TendonEnd | 'total'
  measured: number
  calculated: number
  /** (measured − calculated)/calculated */
  deviation: number
  within: boolean
}

export interface TendonSchedule {
  id: string
  ends: StressingEnds
  Pjack: number
  Ap: number
  /** tendon length along its profile, mm */
  length: number
  /** total angular deviation, rad */
  theta: number
  /** calculated extension at the jack, per stressed end (null when not stressed there) and total, mm */
  extension: { left: number | null; right: number | null; total: number }
  /** extension remaining after lock-off, ∫P dx/(Ep Ap) with the draw-in, mm */
  extensionAfterLockOff: number
  band: { lower: number; upper: number }
  /** force after lock-off, least and largest along the tendon, N */
  forceAfterLockOff: { min: number; max: number }
  checks: MeasuredCheck[]
  /** null when nothing was measured; false when any measured value is outside the band */
  accepted: boolean | null
}

export interface StressingSchedule {
  tolerance: number
  tendons: TendonSchedule[]
  /** stations along the tendon (s along the profile) with the lock-off force of each tendon, for figures */
  series: { s: number[]; force: number[][] }
}

interface Path {
  s: number[]
  thetaFromLeft: number[]
  length: number
  theta: number
}

/** Arc length and cumulative angle along the profile (kinks included by the doubled stations at the supports). */
function tendonPath(profile: TendonProfile, stations: number): Path {
  const pieces = resolveProfile(profile)
  const s: number[] = []
  const th: number[] = []
  let prevAngle: number | null = null
  let prevX = 0
  let prevSlope = 0
  let sAcc = 0
  let thAcc = 0
  profile.spans.forEach((L, span) => {
    for (let j = 0; j <= stations; j++) {
      const x = (L * j) / stations
      const slope = slopeIn(pieces[span] as NonNullable<(typeof pieces)[number]>, x)
      const angle = Math.atan(slope)
      if (prevAngle !== null) {
        const dx = j === 0 ? 0 : x - prevX
        sAcc += (dx * (Math.sqrt(1 + prevSlope * prevSlope) + Math.sqrt(1 + slope * slope))) / 2 // ds = √(1 + e'²) dx, trapezoidal
        thAcc += Math.abs(angle - prevAngle) // θ: sum of the angular deviations (5.10.5.2(1))
      }
      s.push(sAcc)
      th.push(thAcc)
      prevAngle = angle
      prevX = x
      prevSlope = slope
    }
  })
  return { s, thetaFromLeft: th, length: sAcc, theta: thAcc }
}

function integral(s: number[], P: number[], from = 0, to = s.length - 1): number {
  let sum = 0
  for (let j = from + 1; j <= to; j++) sum += (((P[j - 1] as number) + (P[j] as number)) / 2) * ((s[j] as number) - (s[j - 1] as number)) // trapezoidal rule
  return sum
}

function validate(i: StressingInput): void {
  requirePositive('Ep', i.Ep)
  requireNonNegative('mu', i.mu)
  requireNonNegative('k', i.k)
  requireNonNegative('drawIn', i.drawIn)
  requireRange('tolerance', i.tolerance ?? 0.07, 0, 0.5, 'the acceptance band must lie between 0 and 50 %')
  requireNonNegative('jackLength', i.jackLength ?? 0)
  if (i.tendons.length === 0) throw new EngineInputError('tendons', 'give at least one tendon')
  const ids = new Set<string>()
  i.tendons.forEach((t, k) => {
    if (!t.id) throw new EngineInputError(`tendons.${k}.id`, 'every tendon needs a mark')
    if (ids.has(t.id)) throw new EngineInputError(`tendons.${k}.id`, `the mark ${t.id} is used twice`)
    ids.add(t.id)
    if (!['left', 'right', 'both'].includes(t.ends)) throw new EngineInputError(`tendons.${k}.ends`, 'left, right or both')
    requirePositive(`tendons.${k}.Pjack`, t.Pjack)
    requirePositive(`tendons.${k}.Ap`, t.Ap)
  })
  ;(i.measured ?? []).forEach((m, k) => {
    const t = i.tendons.find((x) => x.id === m.id)
    if (!t) throw new EngineInputError(`measured.${k}.id`, `no tendon marked ${m.id}`)
    if (m.end !== undefined && t.ends !== 'both' && t.ends !== m.end) throw new EngineInputError(`measured.${k}.end`, `tendon ${m.id} is not stressed at the ${m.end} end`)
    requirePositive(`measured.${k}.extension`, m.extension)
  })
}

export function stressingSchedule(i: StressingInput): StressingSchedule {
  validate(i)
  const tol = i.tolerance ?? 0.07
  const path = tendonPath(i.profile, Math.max(10, i.stations ?? 100))
  const { s, thetaFromLeft, length, theta } = path
  const last = s.length - 1
  const series = { s, force: [] as number[][] }
  const tendons = i.tendons.map((t) => {
    const EpAp = i.Ep * t.Ap
    const fromLeft = s.map((x, j) => frictionForce(t.Pjack, i.mu, thetaFromLeft[j] as number, i.k, x)) // eq. (5.45)
    const fromRight = s.map((x, j) => frictionForce(t.Pjack, i.mu, theta - (thetaFromLeft[j] as number), i.k, length - x)) // eq. (5.45)
    const jackPart = (t.Pjack * (i.jackLength ?? 0)) / EpAp // strand inside the jack
    let left: number | null = null
    let right: number | null = null
    let atJack: number[]
    if (t.ends === 'left') {
      atJack = fromLeft
      left = integral(s, fromLeft) / EpAp + jackPart // ΔL = ∫P dx/(Ep Ap)
    } else if (t.ends === 'right') {
      atJack = fromRight
      right = integral(s, fromRight) / EpAp + jackPart
    } else {
      // both ends: each jack stretches the tendon up to the point where the two friction curves meet (common practice)
      atJack = fromLeft.map((p, j) => Math.max(p, fromRight[j] as number))
      let split = 0
      while (split < last && (fromLeft[split + 1] as number) >= (fromRight[split + 1] as number)) split++
      left = integral(s, fromLeft, 0, split) / EpAp + jackPart
      right = integral(s, fromRight, split, last) / EpAp + jackPart
    }
    let lockOff = atJack
    if (t.ends !== 'right') lockOff = drawInForces(s, lockOff, i.drawIn, EpAp).P
    if (t.ends !== 'left') {
      const rs = s.map((x) => length - x).reverse()
      lockOff = drawInForces(rs, [...lockOff].reverse(), i.drawIn, EpAp).P.reverse()
    }
    series.force.push(lockOff)
    const total = (left ?? 0) + (right ?? 0)
    const checks: MeasuredCheck[] = (i.measured ?? [])
      .filter((m) => m.id === t.id)
      .map((m) => {
        const end: TendonEnd | 'total' = m.end ?? 'total'
        const calculated = end === 'total' ? total : ((end === 'left' ? left : right) as number)
        const deviation = (m.extension - calculated) / calculated
        return { end, measured: m.extension, calculated, deviation, within: Math.abs(deviation) <= tol + 1e-12 }
      })
    return {
      id: t.id,
      ends: t.ends,
      Pjack: t.Pjack,
      Ap: t.Ap,
      length,
      theta,
      extension: { left, right, total },
      extensionAfterLockOff: integral(s, lockOff) / EpAp,
      band: { lower: total * (1 - tol), upper: total * (1 + tol) },
      forceAfterLockOff: { min: Math.min(...lockOff), max: Math.max(...lockOff) },
      checks,
      accepted: checks.length === 0 ? null : checks.every((c) => c.within),
    }
  })
  return { tolerance: tol, tendons, series }
}
