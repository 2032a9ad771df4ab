/**
 * Tendons built in segments: a long member cast and stressed bay by bay, with a joint over an
 * interior support — a construction joint with an intermediate anchorage (stressing pocket), or a
 * coupler that joins the next segment's strands to the anchorage of the segment stressed before it.
 *
 * Each segment is a tendon of its own for friction and draw-in: friction (EN 1992-1-1 eq. (5.45))
 * restarts at each of its stressing ends, with θ and x measured from there, and each stressed
 * anchorage draws in (5.10.5.3) over the segment alone. At a coupler the segment stressed later is
 * taken with its own jacking force less the friction from its own stressing end, as if the coupler
 * were a dead anchorage: the common practice of design, which leaves out the small share of the
 * second stressing that reaches back through the coupler into the first segment.
 *
 * Supports are numbered from 1 (the left end) to n + 1 (the right end) as on the drawings; spans
 * inside the engine from 0. Forces N, lengths mm (along the tendon), k in rad/mm.
 */
import { EngineInputError } from '../contract'
import { forceAfterLockOff } from './draw-in'
import type { LockOffResult, StressedEnds, StressingSequence } from './draw-in'
import { frictionCurves } from './friction'

export type JointKind = 'coupler' | 'intermediate-anchorage'
/** The segment stressed at the joint: the one on its left, on its right, both, or neither (dead anchorages). */
export type JointStressed = 'left' | 'right' | 'both' | 'neither'

export interface TendonJoint {
  /** support number, 1 at the left end of the member */
  support: number
  kind: JointKind
  stressed: JointStressed
}

export interface TendonSegment {
  /** 1 for the leftmost segment */
  number: number
  /** support numbers at its ends, from 1 */
  fromSupport: number
  toSupport: number
  /** spans it covers, from 0, first and last inclusive */
  firstSpan: number
  lastSpan: number
  ends: StressedEnds
  /** what ends it on either side: the member's end anchorage, or a joint */
  leftEnd: 'anchorage' | JointKind
  rightEnd: 'anchorage' | JointKind
}

export interface JointIssue {
  /** the joint at fault (0-based), or null for the member's own stressing ends */
  joint: number | null
  field: 'support' | 'kind' | 'stressed'
  message: string
}

const KIND_WORDS: Record<JointKind, string> = { coupler: 'coupler', 'intermediate-anchorage': 'intermediate anchorage' }

const leftOf = (s: StressedEnds): boolean => s === 'left' || s === 'both'
const rightOf = (s: StressedEnds): boolean => s === 'right' || s === 'both'
const endsOf = (left: boolean, right: boolean): StressedEnds | null => (left && right ? 'both' : left ? 'left' : right ? 'right' : null)

/**
 * What is wrong with the joints of a member of `spanCount` spans stressed at its own ends as
 * `memberEnds` says, in the engineer's words ("Joint 2: …", "Segment 1 …"); empty when nothing is.
 */
export function jointIssues(spanCount: number, memberEnds: StressedEnds, joints: readonly TendonJoint[]): JointIssue[] {
  const issues: JointIssue[] = []
  const last = spanCount + 1
  const seen = new Map<number, number>()
  joints.forEach((j, k) => {
    const name = `Joint ${k + 1}`
    if (!Number.isInteger(j.support) || j.support < 1) {
      issues.push({ joint: k, field: 'support', message: `${name}: give the number of the support it sits over, counted from 1 at the left end` })
    } else if (j.support > last) {
      issues.push({ joint: k, field: 'support', message: `${name}: there is no support ${j.support}; the member has ${last} supports` })
    } else if (j.support === 1 || j.support === last) {
      issues.push({ joint: k, field: 'support', message: spanCount === 1
        ? `${name}: support ${j.support} is an end of the member, and a single span has no interior support for a joint`
        : `${name}: support ${j.support} is an end of the member; a joint sits over an interior support, 2 to ${last - 1}` })
    } else if (seen.has(j.support)) {
      issues.push({ joint: k, field: 'support', message: `${name}: support ${j.support} already has joint ${(seen.get(j.support) as number) + 1}` })
    } else {
      seen.set(j.support, k)
    }
    if (j.kind !== 'coupler' && j.kind !== 'intermediate-anchorage') issues.push({ joint: k, field: 'kind', message: `${name}: a coupler or an intermediate anchorage` })
    if (!['left', 'right', 'both', 'neither'].includes(j.stressed)) {
      issues.push({ joint: k, field: 'stressed', message: `${name}: say which segment is stressed at the joint — the left, the right, both or neither` })
    } else if (j.kind === 'coupler' && (j.stressed === 'both' || j.stressed === 'neither')) {
      issues.push({ joint: k, field: 'stressed', message: `${name}: at a coupler the segment cast first is stressed at the joint and the coupled one from its other end; choose the left or the right segment` })
    }
  })
  if (issues.length > 0) return issues
  // every segment needs a live end
  const order = joints.map((j, k) => ({ ...j, k })).sort((a, b) => a.support - b.support)
  for (let i = 0; i <= order.length; i++) {
    const before = order[i - 1]
    const after = order[i]
    const left = before ? before.stressed === 'right' || before.stressed === 'both' : leftOf(memberEnds)
    const right = after ? after.stressed === 'left' || after.stressed === 'both' : rightOf(memberEnds)
    if (left || right) continue
    const from = before ? before.support : 1
    const to = after ? after.support : spanCount + 1
    const at = after ?? (before as (typeof order)[number])
    const where = [before ? `at joint ${before.k + 1}` : 'at the left end', after ? `at joint ${after.k + 1}` : 'at the right end'].join(' or ')
    issues.push({ joint: at.k, field: 'stressed', message: `Joint ${at.k + 1}: the segment from support ${from} to support ${to} is stressed at neither end; stress it ${where}` })
  }
  return issues
}

/**
 * The segments of a tendon with joints over interior supports (none: one segment, the whole
 * tendon, stressed at the member's ends). Throws an EngineInputError on the member's joints field
 * with the first issue of jointIssues.
 */
export function tendonSegments(spanCount: number, memberEnds: StressedEnds, joints: readonly TendonJoint[] = []): TendonSegment[] {
  if (!Number.isInteger(spanCount) || spanCount < 1) throw new EngineInputError('spans', 'give at least one span')
  if (!['left', 'right', 'both'].includes(memberEnds)) throw new EngineInputError('tendon.stressing', 'left, right or both')
  const issue = jointIssues(spanCount, memberEnds, joints)[0]
  if (issue) throw new EngineInputError(issue.joint === null ? 'tendon.stressing' : `tendon.joints.${issue.joint}.${issue.field}`, issue.message)
  const sorted = [...joints].sort((a, b) => a.support - b.support)
  const bounds = [1, ...sorted.map((j) => j.support), spanCount + 1]
  return bounds.slice(1).map((to, i) => {
    const from = bounds[i] as number
    const before = sorted[i - 1]
    const after = sorted[i]
    const left = before ? before.stressed === 'right' || before.stressed === 'both' : leftOf(memberEnds)
    const right = after ? after.stressed === 'left' || after.stressed === 'both' : rightOf(memberEnds)
    return {
      number: i + 1, fromSupport: from, toSupport: to, firstSpan: from - 1, lastSpan: to - 2,
      ends: endsOf(left, right) as StressedEnds, // jointIssues has made sure that every segment has a live end
      leftEnd: before ? before.kind : 'anchorage', rightEnd: after ? after.kind : 'anchorage',
    }
  })
}

/** A segment's words for the sheet: "supports 1 to 3, coupler at 3". */
export function segmentWords(s: TendonSegment): string {
  const end = (k: TendonSegment['leftEnd'], support: number): string => (k === 'anchorage' ? '' : `, ${KIND_WORDS[k]} at ${support}`)
  return `supports ${s.fromSupport} to ${s.toSupport}${end(s.leftEnd, s.fromSupport)}${end(s.rightEnd, s.toSupport)}`
}

export interface SegmentedForceInput {
  /** distance along the tendon at each station, mm, non-decreasing */
  s: readonly number[]
  /** de/dx at each station */
  slopes: readonly number[]
  /** the span (from 0) of each station; a support appears twice, as the end of one span and the start of the next */
  spanOf: readonly number[]
  segments: readonly TendonSegment[]
  /** force at the jack, N */
  Pjack: number
  mu: number
  /** wobble, rad/mm */
  k: number
  /** draw-in at each stressed anchorage, mm */
  slip: number
  /** Ep·Ap of the tendon, N */
  EpAp: number
  /** for a segment stressed at both ends; default both jacks together */
  sequence?: StressingSequence
}

export interface SegmentForce {
  segment: TendonSegment
  /** stations of the segment, first and last inclusive, in the member's numbering */
  first: number
  last: number
  /** length along the tendon and total angular deviation of the segment alone, mm and rad */
  length: number
  theta: number
  /** force after friction from the segment's stressed end(s), at its stations, N (eq. (5.45)) */
  afterFriction: number[]
  lockOff: LockOffResult
}

export interface SegmentedForce {
  /** at every station: after friction, and after lock-off with the draw-in, N */
  afterFriction: number[]
  afterLockOff: number[]
  segments: SegmentForce[]
}

/** A draw-in too large for a segment says which segment, on the same field. */
function inSegment<T>(seg: TendonSegment, count: number, f: () => T): T {
  try {
    return f()
  } catch (e) {
    if (count === 1 || !(e instanceof EngineInputError) || e.field !== 'slip') throw e
    const what = e.message.slice(e.field.length + 2).replace('the whole tendon', 'the whole segment')
    throw new EngineInputError('slip', `segment ${seg.number} (${segmentWords(seg)}): ${what}`)
  }
}

/** Friction and draw-in segment by segment, each from its own stressing end(s), on the member's stations. */
export function segmentedForce(i: SegmentedForceInput): SegmentedForce {
  const n = i.s.length
  if (i.slopes.length !== n || i.spanOf.length !== n) throw new EngineInputError('s', 'give the slope and the span of every station')
  if (i.segments.length === 0) throw new EngineInputError('segments', 'give at least one segment')
  const afterFriction: number[] = []
  const afterLockOff: number[] = []
  const segments = i.segments.map((seg) => {
    let first = -1
    let last = -1
    i.spanOf.forEach((sp, k) => {
      if (sp >= seg.firstSpan && sp <= seg.lastSpan) {
        if (first < 0) first = k
        last = k
      }
    })
    if (first < 0 || last - first < 1) throw new EngineInputError('segments', `segment ${seg.number} has no stations`)
    const x = i.s.slice(first, last + 1)
    // EN 1992-1-1 eq. (5.45): θ and x restart at the segment's own ends
    const curves = frictionCurves({ x, slopes: i.slopes.slice(first, last + 1), Pjack: i.Pjack, mu: i.mu, k: i.k })
    const lockOff = inSegment(seg, i.segments.length, () => forceAfterLockOff({
      x, frictionFromLeft: curves.fromLeft, frictionFromRight: curves.fromRight, ends: seg.ends, slip: i.slip, EpAp: i.EpAp,
      sequence: seg.ends === 'both' ? i.sequence ?? 'simultaneous' : undefined,
    }))
    const fr = seg.ends === 'left' ? curves.fromLeft : seg.ends === 'right' ? curves.fromRight : curves.fromLeft.map((v, j) => Math.max(v, curves.fromRight[j] as number))
    afterFriction.push(...fr)
    afterLockOff.push(...lockOff.force)
    return { segment: seg, first, last, length: (x[x.length - 1] as number) - (x[0] as number), theta: curves.theta, afterFriction: fr, lockOff }
  })
  if (afterFriction.length !== n) throw new EngineInputError('segments', 'the segments must cover the member once, span by span')
  return { afterFriction, afterLockOff, segments }
}
