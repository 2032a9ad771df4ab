import { describe, expect, it } from 'vitest'
import { jointIssues, segmentedForce, tendonSegments } from '../../../../shared/engine/prestress/segments'
import type { TendonJoint } from '../../../../shared/engine/prestress/segments'
import { frictionCurves } from '../../../../shared/engine/prestress/friction'
import { forceAfterLockOff } from '../../../../shared/engine/prestress/draw-in'
import { evenPoints, tendonPath } from '../../../../shared/engine/prestress/path'
import { resolveProfile } from '../../../../shared/engine/prestress/profile'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import { EngineInputError } from '../../../../shared/engine/contract'
import { fieldOf, rel } from '../../../helpers/engine'

const Pjack = 600e3
const EpAp = 195000 * 400
const mu = 0.19
const k = 0.01 / 1000

/** The path of a profile on `perSpan` equal parts of each span, with the span of each point. */
function pathOf(profile: TendonProfile, perSpan = 200): { s: number[]; slopes: number[]; spanOf: number[] } {
  const points = evenPoints(profile.spans, perSpan)
  const p = tendonPath(resolveProfile(profile), profile.spans, points)
  return { s: p.s, slopes: p.slopes, spanOf: points.map((q) => q.span) }
}

function trapezoid(x: readonly number[], v: readonly number[]): number {
  let a = 0
  for (let j = 1; j < x.length; j++) a += ((v[j - 1]! + v[j]!) / 2) * (x[j]! - x[j - 1]!) // trapezoidal rule
  return a
}

const joint = (support: number, stressed: TendonJoint['stressed'], kind: TendonJoint['kind'] = 'intermediate-anchorage'): TendonJoint => ({ support, kind, stressed })

describe('segments of a tendon with joints', () => {
  it('no joints: one segment over the whole member, stressed at the member\'s ends', () => {
    expect(tendonSegments(3, 'both')).toEqual([{ number: 1, fromSupport: 1, toSupport: 4, firstSpan: 0, lastSpan: 2, ends: 'both', leftEnd: 'anchorage', rightEnd: 'anchorage' }])
  })

  it('a joint stressed from the left: the left segment has its live end at the joint, the right one is stressed from its far end', () => {
    const s = tendonSegments(4, 'right', [joint(3, 'left', 'coupler')])
    expect(s.map((x) => [x.fromSupport, x.toSupport, x.ends, x.leftEnd, x.rightEnd])).toEqual([[1, 3, 'right', 'anchorage', 'coupler'], [3, 5, 'right', 'coupler', 'anchorage']])
  })

  it('joints given out of order are taken along the member', () => {
    const s = tendonSegments(4, 'both', [joint(4, 'neither'), joint(2, 'both')])
    expect(s.map((x) => [x.fromSupport, x.toSupport, x.ends])).toEqual([[1, 2, 'both'], [2, 4, 'left'], [4, 5, 'right']])
  })

  it('refuses a joint at an end support, past the member, twice at one support, a coupler stressed both sides, a segment with no live end — in words, never field paths', () => {
    const first = (ends: 'left' | 'right' | 'both', joints: TendonJoint[], spans = 4): string => jointIssues(spans, ends, joints)[0]?.message ?? 'none'
    expect(first('both', [joint(1, 'left')])).toBe('Joint 1: support 1 is an end of the member; a joint sits over an interior support, 2 to 4')
    expect(first('both', [joint(3, 'left'), joint(5, 'left')])).toBe('Joint 2: support 5 is an end of the member; a joint sits over an interior support, 2 to 4')
    expect(first('both', [joint(9, 'left')])).toBe('Joint 1: there is no support 9; the member has 5 supports')
    expect(first('both', [joint(2, 'left')], 1)).toMatch(/^Joint 1: there is no support 2|^Joint 1: support 2 is an end of the member, and a single span/)
    expect(first('both', [joint(3, 'left'), joint(3, 'right')])).toBe('Joint 2: support 3 already has joint 1')
    expect(first('both', [joint(3, 'both', 'coupler')])).toMatch(/^Joint 1: at a coupler the segment cast first is stressed at the joint/)
    expect(first('left', [joint(3, 'left')])).toBe('Joint 1: the segment from support 3 to support 5 is stressed at neither end; stress it at joint 1 or at the right end')
    expect(first('right', [joint(3, 'right')])).toBe('Joint 1: the segment from support 1 to support 3 is stressed at neither end; stress it at the left end or at joint 1')
    expect(first('both', [joint(2, 'left'), joint(4, 'right')])).toBe('Joint 2: the segment from support 2 to support 4 is stressed at neither end; stress it at joint 1 or at joint 2')
    expect(first('both', [joint(2, 'neither'), joint(4, 'both')])).toBe('none')
    for (const m of jointIssues(4, 'left', [joint(1, 'both', 'coupler'), joint(3, 'left')]).map((x) => x.message)) expect(m).not.toMatch(/tendon\.|joints\.|support\b.*undefined/)
    expect(fieldOf(() => tendonSegments(4, 'both', [joint(5, 'left')]))).toBe('tendon.joints.0.support')
    expect(() => tendonSegments(4, 'both', [joint(5, 'left')])).toThrow(EngineInputError)
  })
})

describe('force along a tendon in segments', () => {
  // two equal spans, one parabola each (no reverse curve: inflection 0), drape a: the ends' slopes are ±m, m = 4a/L
  const L = 10000
  const a = 80
  const twoSpans: TendonProfile = { spans: [L, L], supportEcc: [0, 0, 0], spanEcc: [a, a], inflection: 0 }
  const path = pathOf(twoSpans)
  const base = { ...path, Pjack, mu, k, slip: 6, EpAp }

  it('friction restarts at the joint: the far end of the segment stressed there is P0·e^(−μ(θ + kx)) of that segment alone (EN 1992-1-1 eq. (5.45))', () => {
    // hand: θ over one parabola = 2·atan(m) (the true change of direction); x its arc length
    // s = (L/2)(√(1 + m²) + asinh(m)/m) (calculus); joint at support 2 stressed on its right side, the member from the left
    const m = (4 * a) / L
    const sL = (L / 2) * (Math.sqrt(1 + m * m) + Math.asinh(m) / m)
    const hand = Pjack * Math.exp(-mu * (2 * Math.atan(m) + k * sL))
    const r = segmentedForce({ ...base, segments: tendonSegments(2, 'left', [joint(2, 'right')]) })
    const [one, two] = r.segments
    expect(two!.segment.ends).toBe('left')
    expect(rel(two!.afterFriction.at(-1)!, hand)).toBeLessThan(1e-6)
    expect(two!.afterFriction[0]).toBe(Pjack) // the jack at the joint
    expect(rel(one!.afterFriction.at(-1)!, hand)).toBeLessThan(1e-6) // the same segment from the member's end
    expect(two!.theta).toBeCloseTo(2 * Math.atan(m), 9)
    // without the joint the force at the right end has lost the whole tendon's friction: both parabolas and the kink, 6·atan(m)
    const whole = segmentedForce({ ...base, segments: tendonSegments(2, 'left') })
    expect(rel(whole.afterFriction.at(-1)!, Pjack * Math.exp(-mu * (6 * Math.atan(m) + k * 2 * sL)))).toBeLessThan(1e-6)
    // the two stations at the joint carry the end of one segment and the jacked start of the next
    expect(r.afterFriction[one!.last]).toBeCloseTo(hand, 3)
    expect(r.afterFriction[two!.first]).toBe(Pjack)
  })

  it('two equal segments, each stressed from its outer end, are the mirror image of one another (symmetry)', () => {
    // low points at 0.4 L and 0.6 L: each segment is lopsided, the member is symmetric about the joint
    const lopsided: TendonProfile = { ...twoSpans, lowPointAt: [0.4, 0.6], inflection: 0.1, supportEcc: [0, -60, 0] }
    const r = segmentedForce({ ...pathOf(lopsided), Pjack, mu, k, slip: 6, EpAp, segments: tendonSegments(2, 'both', [joint(2, 'neither')]) })
    expect(r.segments.map((x) => x.segment.ends)).toEqual(['left', 'right'])
    const n = r.afterLockOff.length
    const worst = Math.max(...r.afterLockOff.map((v, j) => Math.abs(v - r.afterLockOff[n - 1 - j]!) / v))
    expect(worst).toBeLessThan(1e-9)
    const worstFriction = Math.max(...r.afterFriction.map((v, j) => Math.abs(v - r.afterFriction[n - 1 - j]!) / v))
    expect(worstFriction).toBeLessThan(1e-9)
  })

  it('one segment is the tendon without joints: friction (eq. (5.45)) and lock-off (5.10.5.3) on the whole length', () => {
    const direct = frictionCurves({ x: path.s, slopes: path.slopes, Pjack, mu, k })
    const lock = forceAfterLockOff({ x: path.s, frictionFromLeft: direct.fromLeft, frictionFromRight: direct.fromRight, ends: 'both', slip: 6, EpAp, sequence: 'simultaneous' })
    const r = segmentedForce({ ...base, segments: tendonSegments(2, 'both') })
    expect(r.afterLockOff).toEqual(lock.force)
    expect(r.afterFriction).toEqual(direct.fromLeft.map((v, j) => Math.max(v, direct.fromRight[j]!)))
  })

  it('a coupler is designed as the intermediate anchorage stressed on the same side: the coupled segment from its own stressing end (common practice)', () => {
    const coupled = segmentedForce({ ...base, segments: tendonSegments(2, 'right', [joint(2, 'left', 'coupler')]) })
    const anchored = segmentedForce({ ...base, segments: tendonSegments(2, 'right', [joint(2, 'left')]) })
    expect(coupled.afterLockOff).toEqual(anchored.afterLockOff)
  })

  it('each segment draws in on its own: ∫(P after friction − P after lock-off) dx = Δ·Ep·Ap per segment, and its length (area method, textbook)', () => {
    // straight tendon, 2 × 12 m, wobble only: friction P0·e^(−αx), α = μk (eq. (5.45)); the reverse friction R0·e^(αx) meets
    // it at l where R0 = P0·e^(−2αl); the area ∫₀ˡ(P0e^(−αx) − R0e^(αx))dx = (P0/α)(1 − e^(−αl))² = Δ·Ep·Ap gives
    // l = −ln(1 − s)/α, s = √(Δ·Ep·Ap·α/P0) (derived here); the textbook l_set = √(Δ·Ep·Ap/p), p = αP0, is its
    // linearisation (within 5 % here, where αl ≈ 0.09)
    const kk = 0.05 / 1000
    const alpha = mu * kk
    const straight: TendonProfile = { spans: [12000, 12000], supportEcc: [0, 0, 0], spanEcc: [0, 0] }
    const p = pathOf(straight, 600)
    const r = segmentedForce({ ...p, Pjack, mu, k: kk, slip: 6, EpAp, segments: tendonSegments(2, 'both', [joint(2, 'neither')]) })
    const s = Math.sqrt((6 * EpAp * alpha) / Pjack)
    const exact = -Math.log(1 - s) / alpha // 9.48 m < 12 m: the draw-in stays within each segment
    const textbook = Math.sqrt((6 * EpAp) / (alpha * Pjack))
    for (const g of r.segments) {
      const x = p.s.slice(g.first, g.last + 1)
      expect(rel(trapezoid(x, g.afterFriction.map((v, j) => v - g.lockOff.force[j]!)), 6 * EpAp)).toBeLessThan(1e-6)
      const set = g.segment.ends === 'left' ? g.lockOff.setLength.left! : g.lockOff.setLength.right!
      expect(rel(set, exact)).toBeLessThan(1e-3)
      expect(rel(set, textbook)).toBeLessThan(0.05)
    }
  })

  it('a draw-in larger than a short segment\'s extension names the segment', () => {
    // 10 kN over 10 m stretches the tendon about 10e3 × 10 000/(195 000 × 400) ≈ 1.3 mm (ΔL = PL/(Ep Ap)) < 6 mm of draw-in
    const segments = tendonSegments(2, 'both', [joint(2, 'neither')])
    expect(fieldOf(() => segmentedForce({ ...base, Pjack: 10e3, segments }))).toBe('slip')
    expect(() => segmentedForce({ ...base, Pjack: 10e3, segments })).toThrow('slip: segment 1 (supports 1 to 2, intermediate anchorage at 2): the draw-in is larger than the extension of the whole segment')
  })

  it('bad segments name the field', () => {
    expect(fieldOf(() => segmentedForce({ ...base, spanOf: [0], segments: tendonSegments(2, 'both') }))).toBe('s')
    expect(fieldOf(() => segmentedForce({ ...base, segments: [] }))).toBe('segments')
  })
})
