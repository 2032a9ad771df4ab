/**
 * Load balancing (T. Y. Lin, ACI Journal 1963): a parabola of sag a over L under force P exerts
 * w = 8Pa/L² on the concrete. The complete set of equivalent loads of a tendon — every parabola's
 * uniform load, any kink force, and at each anchorage the vertical component and the couple P·e —
 * is self-equilibrating. Gravity (downward) positive; couples counter-clockwise positive.
 */
import { EngineInputError } from '../contract'
import type { BeamLoad } from '../analysis/continuous-beam'
import { drapes, isCantileverSpan, resolveProfile, slopeIn, spanPieces } from './profile'
import type { ProfilePiece, TendonProfile } from './profile'

export interface BalancingForce {
  perSpan: number[]
  governing: number
}

/**
 * Force per span to balance the line load w (N/mm): P = w L² / (8 a) (Lin); a cantilever is half a
 * parabola of span 2L, so P = w L² / (2 a) with a its fall from root to tip.
 */
export function balancingForce(profile: TendonProfile, w: number | number[]): BalancingForce {
  const a = drapes(profile)
  const perSpan = profile.spans.map((L, i) => {
    const wi = Array.isArray(w) ? w[i] : w
    if (wi === undefined || !Number.isFinite(wi)) throw new EngineInputError(`w.${i}`, 'the balanced load must be a finite number')
    const ai = a[i] as number
    if (isCantileverSpan(profile, i)) {
      if (!(ai > 0)) throw new EngineInputError(`profile.supportEcc.${i === 0 ? 0 : i + 1}`, `the cantilever (span ${i + 1}) has no drape: the anchorage at its tip must lie below the tendon at the root`)
      return (wi * L * L) / (2 * ai) // Lin, half a parabola of span 2L: P = w L² / 2a
    }
    if (!(ai > 0)) throw new EngineInputError(`profile.spanEcc.${i}`, `span ${i + 1} has no drape: the low point must lie below the chord of its support points`)
    return (wi * L * L) / (8 * ai) // Lin: P = w L² / 8a
  })
  return { perSpan, governing: Math.max(...perSpan) }
}

/** Equivalent loads of the tendon on the concrete under a constant force P (N). */
export function equivalentLoads(profile: TendonProfile, P: number): BeamLoad[] {
  if (!Number.isFinite(P)) throw new EngineInputError('P', 'the force must be a finite number')
  const all = resolveProfile(profile)
  return loadsOf(profile, P, all.map((pieces, span) => [span, pieces] as const))
}

/**
 * The equivalent loads of some spans' curvature, with the kinks and anchorages that touch them: for
 * a profile whose other spans lie on the centroid (e = 0), the same loads as equivalentLoads, at a
 * cost that does not grow with the number of spans (the unit profiles of the proposal).
 */
export function equivalentLoadsOfSpans(profile: TendonProfile, P: number, spans: number[]): BeamLoad[] {
  if (!Number.isFinite(P)) throw new EngineInputError('P', 'the force must be a finite number')
  return loadsOf(profile, P, [...new Set(spans)].sort((a, b) => a - b).map((span) => [span, spanPieces(profile, span)] as const))
}

function loadsOf(profile: TendonProfile, P: number, bySpan: ReadonlyArray<readonly [number, ProfilePiece[]]>): BeamLoad[] {
  const n = profile.spans.length
  const pieces = new Map(bySpan)
  const loads: BeamLoad[] = []
  for (const [span, ps] of bySpan) {
    for (const p of ps) {
      if (p.c !== 0 && p.x1 > p.x0) loads.push({ kind: 'patch', span, from: p.x0, to: p.x1, w: 2 * p.c * P }) // w = P·e'' (curvature load)
    }
  }
  // kinks at interior supports: downward force P·(e'right − e'left); a span not given lies on the centroid (slope 0)
  const slopeAt = (span: number, x: number): number => {
    const ps = pieces.get(span)
    return ps ? slopeIn(ps, x) : 0
  }
  const kinkAt = [...new Set(bySpan.flatMap(([span]) => [span, span + 1]))].filter((j) => j >= 1 && j < n).sort((a, b) => a - b)
  for (const j of kinkAt) {
    const kink = P * (slopeAt(j, 0) - slopeAt(j - 1, profile.spans[j - 1] as number))
    if (Math.abs(kink) > 0) loads.push({ kind: 'point', span: j, at: 0, P: kink })
  }
  const Llast = profile.spans[n - 1] as number
  // anchorages: vertical component of P along the tendon, and the couple of the horizontal force at e
  if (pieces.has(0)) {
    loads.push({ kind: 'point', span: 0, at: 0, P: P * slopeAt(0, 0) })
    loads.push({ kind: 'couple', span: 0, at: 0, M: P * (profile.supportEcc[0] as number) })
  }
  if (pieces.has(n - 1)) {
    loads.push({ kind: 'point', span: n - 1, at: Llast, P: -P * slopeAt(n - 1, Llast) })
    loads.push({ kind: 'couple', span: n - 1, at: Llast, M: -P * (profile.supportEcc[n] as number) })
  }
  return loads
}

/** Uniform balanced load per span implied by P and the drapes, w = 8Pa/L² (Lin); 2Pa/L² on a cantilever. */
export function balancedLoad(profile: TendonProfile, P: number): number[] {
  const a = drapes(profile)
  return profile.spans.map((L, i) => ((isCantileverSpan(profile, i) ? 2 : 8) * P * (a[i] as number)) / (L * L)) // Lin: w = 8Pa/L²; half parabola 2Pa/L²
}
