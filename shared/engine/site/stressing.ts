/**
 * Stressing schedule: per tendon the jacking force, the stressing end(s), the calculated extension
 * ΔL = ∫P(x)dx/(Ep·Ap) from the force along the tendon after friction (EN 1992-1-1 eq. (5.45)) at
 * the jack, and after lock-off with the draw-in (5.10.5.3, forceAfterLockOff: for both ends the
 * stressing sequence is an input, by default both jacks together as the extension split of each
 * end up to the meeting point of the friction curves implies), the acceptance band on measured
 * extensions (±7 % is common practice; an input) and the flag of each measured value outside it.
 * Forces N, lengths mm (measured along the tendon), k in rad/mm.
 */
import { EngineInputError } from '../contract'
import { forceAfterLockOff } from '../prestress/draw-in'
import type { StressingSequence } from '../prestress/draw-in'
import { frictionCurves } from '../prestress/friction'
import { evenPoints, tendonPath } from '../prestress/path'
import type { PathPoint } from '../prestress/path'
import { resolveProfile } from '../prestress/profile'
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
  /**
   * tendons stressed at both ends: 'simultaneous' (default; two jacks pull together, then both lock
   * off), or one end jacked and locked off before the other ('left-first', 'right-first')
   */
  sequence?: StressingSequence
  /** relative acceptance band on measured extensions, default 0.07 (common practice) */
  tolerance?: number
  /** strand length between the anchorage and the jack's grips, mm; its extension is added at each stressed end */
  jackLength?: number
  measured?: MeasuredExtension[]
  /** stations per span for the integration */
  stations?: number
  /** the points along the profile to integrate on instead (the member passes its own stations) */
  points?: readonly PathPoint[]
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
  /** calculated extension at the jack, per stressed end (null when not stressed there) and total, mm; in a
   * sequence the second jack's extension is what it draws after the first lock-off */
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

function integral(s: number[], P: number[]): number {
  let sum = 0
  for (let j = 1; j < s.length; j++) sum += (((P[j - 1] as number) + (P[j] as number)) / 2) * ((s[j] as number) - (s[j - 1] as number)) // trapezoidal rule
  return sum
}

function validate(i: StressingInput): void {
  requirePositive('Ep', i.Ep)
  requireNonNegative('mu', i.mu)
  requireNonNegative('k', i.k)
  requireNonNegative('drawIn', i.drawIn)
  if (i.sequence !== undefined && !['left-first', 'right-first', 'simultaneous'].includes(i.sequence)) {
    throw new EngineInputError('sequence', 'left-first, right-first or simultaneous')
  }
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

/** A draw-in too large for the tendon is reported against this schedule's own field. */
function asDrawIn<T>(f: () => T): T {
  try {
    return f()
  } catch (e) {
    if (e instanceof EngineInputError && e.field === 'slip') throw new EngineInputError('drawIn', e.message.replace(/^slip: /, ''))
    throw e
  }
}

export function stressingSchedule(i: StressingInput): StressingSchedule {
  validate(i)
  const tol = i.tolerance ?? 0.07
  const points = i.points ?? evenPoints(i.profile.spans, Math.max(10, i.stations ?? 100))
  const path = tendonPath(resolveProfile(i.profile), i.profile.spans, points)
  const { s, slopes, length, theta } = path
  const series = { s, force: [] as number[][] }
  const tendons = i.tendons.map((t) => {
    const EpAp = i.Ep * t.Ap
    const curves = frictionCurves({ x: s, slopes, Pjack: t.Pjack, mu: i.mu, k: i.k }) // eq. (5.45) from either end
    const jackPart = (t.Pjack * (i.jackLength ?? 0)) / EpAp // strand inside the jack
    const r = asDrawIn(() => forceAfterLockOff({
      x: s, frictionFromLeft: curves.fromLeft, frictionFromRight: curves.fromRight, ends: t.ends, slip: i.drawIn, EpAp,
      sequence: t.ends === 'both' ? i.sequence ?? 'simultaneous' : undefined,
    }))
    const lockOff = r.force
    // ΔL = ∫ΔP dx/(Ep Ap) drawn by each jack, plus the strand inside the jack
    const left = r.extensionAtJack.left === undefined ? null : r.extensionAtJack.left + jackPart
    const right = r.extensionAtJack.right === undefined ? null : r.extensionAtJack.right + jackPart
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
