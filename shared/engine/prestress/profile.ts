/**
 * Tendon profile of a continuous member: parabolic segments with slope continuity. In each span the
 * tendon runs from the support point down to the low point (zero slope) and up to the next support.
 * Over an interior support a reverse (hogging) parabola of length λ = inflection·L on each side has
 * its vertex at the support; it meets the sagging parabola with a common tangent at the inflection
 * point, which lies on the straight line joining the high and low points (Lin & Burns; Bhatt,
 * Prestressed Concrete Design to Eurocodes). At the end anchorages the sagging parabola runs
 * straight to the anchor. A cantilever (an end span whose outer end is free) has one parabola with
 * its vertex at the root support, where it meets the back span's reverse curve with zero slope,
 * running to the anchorage at the tip (the end entry of supportEcc); its low point is not used.
 * Eccentricity e is positive below the centroid, in mm.
 */
import { EngineInputError } from '../contract'

export interface TendonProfile {
  /** span lengths, mm */
  spans: number[]
  /** e at each support (anchorages at the two ends), mm, length spans + 1 */
  supportEcc: number[]
  /** e at each span's low point, mm */
  spanEcc: number[]
  /** low point as a fraction of the span from its left support (default 0.5), one value or one per span */
  lowPointAt?: number | number[]
  /** reverse-curve length each side of an interior support as a fraction of the span (default 0.1; 0 = kink) */
  inflection?: number
  /** the first and/or last span is a cantilever: free at its outer end, the tendon anchored at the tip */
  cantilever?: { left?: boolean; right?: boolean }
}

/** Whether span i of the profile is a cantilever (its outer end free). */
export function isCantileverSpan(profile: TendonProfile, span: number): boolean {
  const n = profile.spans.length
  return (span === 0 && profile.cantilever?.left === true) || (span === n - 1 && profile.cantilever?.right === true)
}

/** The profile with its cantilevers marked from the supports ('free' at an end). */
export function withCantilevers(profile: TendonProfile, supports: readonly string[] | undefined): TendonProfile {
  if (!supports) return profile
  const left = supports[0] === 'free'
  const right = supports[supports.length - 1] === 'free'
  if (!left && !right && !profile.cantilever) return profile
  return { ...profile, cantilever: { left, right } }
}

/** One parabolic piece: e(x) = ev + c·(x − xv)² on [x0, x1] (x from the span's left support). */
export interface ProfilePiece {
  x0: number
  x1: number
  xv: number
  ev: number
  c: number
}

export function lowPointFraction(profile: TendonProfile, span: number): number {
  const l = profile.lowPointAt
  const v = Array.isArray(l) ? l[span] : l
  return v ?? 0.5
}

function validate(profile: TendonProfile): void {
  const n = profile.spans.length
  if (n < 1) throw new EngineInputError('profile.spans', 'at least one span is needed')
  profile.spans.forEach((L, i) => {
    if (!(L > 0)) throw new EngineInputError(`profile.spans.${i}`, 'span length must be positive')
  })
  if (profile.supportEcc.length !== n + 1) throw new EngineInputError('profile.supportEcc', `give ${n + 1} support eccentricities for ${n} spans`)
  if (profile.spanEcc.length !== n) throw new EngineInputError('profile.spanEcc', `give ${n} span eccentricities`)
  profile.supportEcc.forEach((e, i) => {
    if (!Number.isFinite(e)) throw new EngineInputError(`profile.supportEcc.${i}`, 'must be a finite number')
  })
  profile.spanEcc.forEach((e, i) => {
    if (!Number.isFinite(e)) throw new EngineInputError(`profile.spanEcc.${i}`, 'must be a finite number')
  })
  if (n === 1 && profile.cantilever?.left && profile.cantilever?.right) throw new EngineInputError('profile.cantilever', 'a single span cannot be a cantilever at both ends')
  for (let i = 0; i < n; i++) {
    if (isCantileverSpan(profile, i)) continue
    const beta = lowPointFraction(profile, i)
    if (!(beta > 0 && beta < 1)) throw new EngineInputError(`profile.lowPointAt.${i}`, 'the low point must lie inside the span (0 < fraction < 1)')
  }
  const inflection = profile.inflection ?? 0.1
  if (!(inflection >= 0 && inflection < 0.5)) throw new EngineInputError('profile.inflection', 'the inflection fraction must lie between 0 and 0.5')
}

/** The parabolic pieces of one span, left to right. */
export function spanPieces(profile: TendonProfile, span: number): ProfilePiece[] {
  const n = profile.spans.length
  const L = profile.spans[span] as number
  const lambdaFrac = profile.inflection ?? 0.1
  const xl = lowPointFraction(profile, span) * L
  const eLow = profile.spanEcc[span] as number
  const eLeft = profile.supportEcc[span] as number
  const eRight = profile.supportEcc[span + 1] as number
  if (isCantileverSpan(profile, span)) {
    // one parabola, vertex (zero slope) at the root support, to the anchorage at the tip
    if (span === 0 && profile.cantilever?.left) return [{ x0: 0, x1: L, xv: L, ev: eRight, c: (eLeft - eRight) / (L * L) }]
    return [{ x0: 0, x1: L, xv: 0, ev: eLeft, c: (eRight - eLeft) / (L * L) }]
  }
  const pieces: ProfilePiece[] = []
  const lamL = span > 0 ? lambdaFrac * L : 0
  const lamR = span < n - 1 ? lambdaFrac * L : 0
  if (lamL >= xl || lamR >= L - xl) {
    throw new EngineInputError('profile.inflection', `the reverse curve is longer than the distance to the low point in span ${span + 1}`)
  }
  // left half: support (or anchorage) to the low point, length d
  const d = xl
  const h = eLow - eLeft
  if (lamL > 0) {
    pieces.push({ x0: 0, x1: lamL, xv: 0, ev: eLeft, c: h / (d * lamL) }) // hogging parabola, vertex at the support
    pieces.push({ x0: lamL, x1: xl, xv: xl, ev: eLow, c: -h / (d * (d - lamL)) }) // sagging parabola, vertex at the low point
  } else {
    pieces.push({ x0: 0, x1: xl, xv: xl, ev: eLow, c: -h / (d * d) }) // one parabola from the support point to the low point
  }
  const dr = L - xl
  const hr = eLow - eRight
  if (lamR > 0) {
    pieces.push({ x0: xl, x1: L - lamR, xv: xl, ev: eLow, c: -hr / (dr * (dr - lamR)) })
    pieces.push({ x0: L - lamR, x1: L, xv: L, ev: eRight, c: hr / (dr * lamR) })
  } else {
    pieces.push({ x0: xl, x1: L, xv: xl, ev: eLow, c: -hr / (dr * dr) })
  }
  return pieces
}

/** All pieces of every span, validated once. */
export function resolveProfile(profile: TendonProfile): ProfilePiece[][] {
  validate(profile)
  return profile.spans.map((_, i) => spanPieces(profile, i))
}

function pieceAt(pieces: ProfilePiece[], x: number): ProfilePiece {
  for (const p of pieces) if (x <= p.x1) return p
  return pieces[pieces.length - 1] as ProfilePiece
}

function spanCheck(profile: TendonProfile, span: number, x: number): void {
  const L = profile.spans[span]
  if (L === undefined) throw new EngineInputError('span', 'no such span')
  if (!(x >= 0 && x <= L)) throw new EngineInputError('x', 'x must lie within the span')
}

export function eccentricityIn(pieces: ProfilePiece[], x: number): number {
  const p = pieceAt(pieces, x)
  return p.ev + p.c * (x - p.xv) ** 2
}

export function slopeIn(pieces: ProfilePiece[], x: number): number {
  const p = pieceAt(pieces, x)
  return 2 * p.c * (x - p.xv)
}

export function tendonEccentricity(profile: TendonProfile, span: number, x: number): number {
  validate(profile)
  spanCheck(profile, span, x)
  return eccentricityIn(spanPieces(profile, span), x)
}

/** de/dx (positive when the tendon descends to the right). */
export function tendonSlope(profile: TendonProfile, span: number, x: number): number {
  validate(profile)
  spanCheck(profile, span, x)
  return slopeIn(spanPieces(profile, span), x)
}

/**
 * Per span: sag of the tendon at its low point below the chord joining its two support points; for
 * a cantilever, the fall of the tendon from the root support to the anchorage at the tip.
 */
export function drapes(profile: TendonProfile): number[] {
  validate(profile)
  return profile.spans.map((_, i) => {
    if (isCantileverSpan(profile, i)) {
      const root = i === 0 ? profile.supportEcc[1] : profile.supportEcc[i]
      const tip = i === 0 ? profile.supportEcc[0] : profile.supportEcc[i + 1]
      return (tip as number) - (root as number)
    }
    const beta = lowPointFraction(profile, i)
    const chord = (profile.supportEcc[i] as number) * (1 - beta) + (profile.supportEcc[i + 1] as number) * beta // straight chord
    return (profile.spanEcc[i] as number) - chord
  })
}
