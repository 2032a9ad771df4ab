/**
 * Stressing schedule: per tendon the jacking force, the stressing end(s), the calculated extension
 * ΔL = ∫P(x)dx/(Ep·Ap) from the force along the tendon after friction (EN 1992-1-1 eq. (5.45)) at
 * the jack, and after lock-off with the draw-in (5.10.5.3, forceAfterLockOff: for both ends the
 * stressing sequence is an input, by default both jacks together as the extension split of each
 * end up to the meeting point of the friction curves implies), the acceptance band on measured
 * extensions (±7 % is common practice; an input) and the flag of each measured value outside it.
 * A tendon built in segments (joints over interior supports, prestress/segments.ts) lists each
 * segment's stressing: friction restarts at each segment's stressed end(s), each segment draws in
 * on its own, and each has its own extensions and band.
 * Forces N, lengths mm (measured along the tendon), k in rad/mm.
 */
import { EngineInputError } from '../contract'
import type { StressingSequence } from '../prestress/draw-in'
import { segmentWords, segmentedForce } from '../prestress/segments'
import type { TendonSegment } from '../prestress/segments'
import { evenPoints, tendonPath } from '../prestress/path'
import type { PathPoint } from '../prestress/path'
import { resolveProfile } from '../prestress/profile'
import type { TendonProfile } from '../prestress/profile'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'

export type StressingEnds = 'left' | 'right' | 'both'
export type TendonEnd = 'left' | 'right'

export interface StressingTendon {
  id: string
  /** the ends stressed; for a tendon in segments, those of the member's end anchorages (the segments' own govern) */
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
  /** for a tendon in segments, the segment (from 1) it was measured on; omit to compare with the tendon's total */
  segment?: number
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
  /** a tendon built in segments (tendonSegments); left out, each tendon is one length stressed at its ends */
  segments?: readonly TendonSegment[]
}

export interface MeasuredCheck {
  /** the segment measured on (from 1), or null for the tendon as a whole */
  segment: number | null
  end: TendonEnd | 'total'
  measured: number
  calculated: number
  /** (measured − calculated)/calculated */
  deviation: number
  within: boolean
}

/** One segment's stressing (the whole tendon where it has no joints). */
export interface SegmentSchedule {
  number: number
  /** support numbers at its ends, from 1 */
  from: number
  to: number
  /** its supports and joints in words */
  words: string
  ends: StressingEnds
  length: number
  theta: number
  /** at the jack, per stressed end of the segment (null when not stressed there) and total, mm */
  extension: { left: number | null; right: number | null; total: number }
  extensionAfterLockOff: number
  band: { lower: number; upper: number }
  forceAfterLockOff: { min: number; max: number }
}

export interface TendonSchedule {
  id: string
  ends: StressingEnds
  Pjack: number
  Ap: number
  /** tendon length along its profile, mm (all its segments) */
  length: number
  /** total angular deviation, rad (the sum over its segments) */
  theta: number
  /** calculated extension at the jack, at the member's left and right end anchorages (null when not stressed
   * there) and the total of all the tendon's stressing, mm; in a sequence the second jack's extension is what it
   * draws after the first lock-off. For a tendon without joints, total = left + right. */
  extension: { left: number | null; right: number | null; total: number }
  /** extension remaining after lock-off, ∫P dx/(Ep Ap) with the draw-in, mm */
  extensionAfterLockOff: number
  band: { lower: number; upper: number }
  /** force after lock-off, least and largest along the tendon, N */
  forceAfterLockOff: { min: number; max: number }
  checks: MeasuredCheck[]
  /** null when nothing was measured; false when any measured value is outside the band */
  accepted: boolean | null
  /** the segments in turn from the left; one for a tendon without joints */
  segments: SegmentSchedule[]
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
    if (m.segment !== undefined) {
      const seg = (i.segments ?? [])[m.segment - 1]
      if (!seg) throw new EngineInputError(`measured.${k}.segment`, `tendon ${m.id} has no segment ${m.segment}`)
      if (m.end !== undefined && seg.ends !== 'both' && seg.ends !== m.end) throw new EngineInputError(`measured.${k}.end`, `segment ${m.segment} of tendon ${m.id} is not stressed at its ${m.end} end`)
    } else if (m.end !== undefined && t.ends !== 'both' && t.ends !== m.end) throw new EngineInputError(`measured.${k}.end`, `tendon ${m.id} is not stressed at the ${m.end} end`)
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

interface SegmentedTendon {
  segments: SegmentSchedule[]
  lockOff: number[]
}

/** The stressing of one tendon, segment by segment (the same for every tendon of the same force, area and ends). */
function stressOne(i: StressingInput, path: { s: number[]; slopes: number[] }, spanOf: number[], t: StressingTendon, tol: number): SegmentedTendon {
  const EpAp = i.Ep * t.Ap
  const spans = i.profile.spans.length
  const segments = i.segments ?? [{ number: 1, fromSupport: 1, toSupport: spans + 1, firstSpan: 0, lastSpan: spans - 1, ends: t.ends, leftEnd: 'anchorage', rightEnd: 'anchorage' } satisfies TendonSegment]
  // eq. (5.45) from the stressed end(s) of each segment, and its lock-off (5.10.5.3)
  const f = asDrawIn(() => segmentedForce({ s: path.s, slopes: path.slopes, spanOf, segments, Pjack: t.Pjack, mu: i.mu, k: i.k, slip: i.drawIn, EpAp, sequence: i.sequence }))
  const jackPart = (t.Pjack * (i.jackLength ?? 0)) / EpAp // strand inside the jack, ΔL = P·l/(Ep Ap)
  return {
    lockOff: f.afterLockOff,
    segments: f.segments.map((g) => {
      // ΔL = ∫ΔP dx/(Ep Ap) drawn by each jack, plus the strand inside the jack
      const left = g.lockOff.extensionAtJack.left === undefined ? null : g.lockOff.extensionAtJack.left + jackPart
      const right = g.lockOff.extensionAtJack.right === undefined ? null : g.lockOff.extensionAtJack.right + jackPart
      const total = (left ?? 0) + (right ?? 0)
      const x = path.s.slice(g.first, g.last + 1)
      return {
        number: g.segment.number, from: g.segment.fromSupport, to: g.segment.toSupport, words: segmentWords(g.segment), ends: g.segment.ends,
        length: g.length, theta: g.theta,
        extension: { left, right, total },
        extensionAfterLockOff: integral(x, g.lockOff.force) / EpAp, // ΔL = ∫P dx/(Ep Ap)
        band: { lower: total * (1 - tol), upper: total * (1 + tol) }, // common practice: a band about the calculated extension
        forceAfterLockOff: { min: Math.min(...g.lockOff.force), max: Math.max(...g.lockOff.force) },
      }
    }),
  }
}

export function stressingSchedule(i: StressingInput): StressingSchedule {
  validate(i)
  const tol = i.tolerance ?? 0.07
  const points = i.points ?? evenPoints(i.profile.spans, Math.max(10, i.stations ?? 100))
  const path = tendonPath(resolveProfile(i.profile), i.profile.spans, points)
  const spanOf = points.map((p) => p.span)
  const series = { s: path.s, force: [] as number[][] }
  // tendons alike in force, area and ends stress alike: each kind is integrated once
  const done = new Map<string, SegmentedTendon>()
  const tendons = i.tendons.map((t) => {
    const key = `${t.ends}|${t.Pjack}|${t.Ap}`
    const one = done.get(key) ?? stressOne(i, path, spanOf, t, tol)
    done.set(key, one)
    const segs = one.segments
    const firstSeg = segs[0] as SegmentSchedule
    const lastSeg = segs[segs.length - 1] as SegmentSchedule
    const left = firstSeg.extension.left
    const right = lastSeg.extension.right
    const total = segs.reduce((a, g) => a + g.extension.total, 0)
    series.force.push([...one.lockOff])
    const checks: MeasuredCheck[] = (i.measured ?? [])
      .filter((m) => m.id === t.id)
      .map((m) => {
        const end: TendonEnd | 'total' = m.end ?? 'total'
        const seg = m.segment === undefined ? null : (segs[m.segment - 1] as SegmentSchedule)
        const ext = seg ? seg.extension : { left, right, total }
        const calculated = end === 'total' ? ext.total : ((end === 'left' ? ext.left : ext.right) as number)
        const deviation = (m.extension - calculated) / calculated
        return { segment: seg ? seg.number : null, end, measured: m.extension, calculated, deviation, within: Math.abs(deviation) <= tol + 1e-12 }
      })
    return {
      id: t.id,
      ends: t.ends,
      Pjack: t.Pjack,
      Ap: t.Ap,
      length: segs.reduce((a, g) => a + g.length, 0),
      theta: segs.reduce((a, g) => a + g.theta, 0),
      extension: { left, right, total },
      extensionAfterLockOff: segs.reduce((a, g) => a + g.extensionAfterLockOff, 0),
      band: { lower: total * (1 - tol), upper: total * (1 + tol) },
      forceAfterLockOff: { min: Math.min(...segs.map((g) => g.forceAfterLockOff.min)), max: Math.max(...segs.map((g) => g.forceAfterLockOff.max)) },
      checks,
      accepted: checks.length === 0 ? null : checks.every((c) => c.within),
      segments: segs.map((g) => ({ ...g, extension: { ...g.extension }, band: { ...g.band }, forceAfterLockOff: { ...g.forceAfterLockOff } })),
    }
  })
  return { tolerance: tol, tendons, series }
}
