/**
 * Tendon height schedule for the site: height of the tendon centroid and of the tendon's underside
 * (what the chairs support) above the member soffit, per span, at regular stations and at every high
 * point, low point and point of inflection of the profile. Heights in mm, x in mm from the left
 * support of the span; e positive below the centroid (prestress/profile.ts).
 */
import { EngineInputError } from '../contract'
import { eccentricityIn, isCantileverSpan, lowPointFraction, resolveProfile } from '../prestress/profile'
import type { ProfilePiece, TendonProfile } from '../prestress/profile'
import { requireNonNegative, requirePositive } from '../common/guards'

/** 'tip': the free end of a cantilever, where the tendon is anchored */
export type HeightPointKind = 'support' | 'tip' | 'low' | 'inflection' | 'station'

export interface TendonHeightInput {
  profile: TendonProfile
  /** member depth, mm */
  h: number
  /** height of the section centroid above the soffit, mm */
  centroidHeight: number
  /** distance between stations, mm (typically 500 or 1000) */
  spacing: number
  /**
   * distance from the tendon centroid down to the underside of the strand or duct, mm; two values where
   * the strands sit off the duct centre: 'sagging' where the profile curves upwards (strands pressed to
   * the top of the duct), 'hogging' where it curves downwards (strands on the bottom of the duct)
   */
  centroidToUnderside: number | { sagging: number; hogging: number }
  /** the schedule rounds heights to this, mm (5 mm is common practice); 0 leaves them unrounded */
  roundTo?: number
  /**
   * where a drop deepens the section: the depth below the plain soffit at (span, x), mm, and the ends
   * of each drop within its spans; the heights there are taken from the drop's soffit, where its chairs stand
   */
  drops?: { depthAt(span: number, x: number): number; edges: Array<{ span: number; x: number }> }
}

export interface HeightRow {
  span: number
  /** from the span's left support, mm */
  x: number
  /** from the first support, mm */
  xGlobal: number
  kind: HeightPointKind
  e: number
  /** tendon centroid above the soffit, mm */
  centroid: number
  /** underside of the strand or duct above the soffit (chair height), mm */
  underside: number
  /** underside rounded for the schedule, mm */
  chair: number
}

export interface TendonHeightSchedule {
  spacing: number
  roundTo: number
  rows: HeightRow[]
  /** per span, the rows of that span */
  spans: Array<{ span: number; L: number; rows: HeightRow[] }>
  /** rows where the tendon would leave the section (should not happen with a checked profile) */
  outside: number
}

export function tendonHeightSchedule(i: TendonHeightInput): TendonHeightSchedule {
  const pieces = resolveProfile(i.profile)
  requirePositive('h', i.h)
  requirePositive('centroidHeight', i.centroidHeight)
  if (i.centroidHeight >= i.h) throw new EngineInputError('centroidHeight', 'the centroid must lie within the section')
  requirePositive('spacing', i.spacing)
  const below = typeof i.centroidToUnderside === 'number' ? { sagging: i.centroidToUnderside, hogging: i.centroidToUnderside } : i.centroidToUnderside
  requireNonNegative('centroidToUnderside.sagging', below.sagging)
  requireNonNegative('centroidToUnderside.hogging', below.hogging)
  const roundTo = requireNonNegative('roundTo', i.roundTo ?? 5)
  const lambda = i.profile.inflection ?? 0.1
  const n = i.profile.spans.length
  const rows: HeightRow[] = []
  const spans: TendonHeightSchedule['spans'] = []
  let x0 = 0
  let outside = 0
  i.profile.spans.forEach((L, s) => {
    const points = new Map<number, HeightPointKind>()
    const add = (x: number, kind: HeightPointKind): void => {
      const key = Math.round(x * 1000) / 1000
      const near = [...points.keys()].find((k) => Math.abs(k - key) < 1)
      if (near !== undefined) {
        if ((points.get(near) as HeightPointKind) === 'station') points.set(near, kind)
        return
      }
      points.set(key, kind)
    }
    for (let x = 0; x < L - 1e-6; x += i.spacing) add(x, 'station')
    const cantilever = isCantileverSpan(i.profile, s)
    add(0, cantilever && s === 0 ? 'tip' : 'support')
    add(L, cantilever && s !== 0 ? 'tip' : 'support')
    if (cantilever) {
      // a cantilever's tendon is one parabola from the root to the anchorage at its tip: no low point or inflection
    } else {
      add(lowPointFraction(i.profile, s) * L, 'low')
      if (lambda > 0 && s > 0) add(lambda * L, 'inflection')
      if (lambda > 0 && s < n - 1) add(L - lambda * L, 'inflection')
    }
    for (const edge of i.drops?.edges ?? []) if (edge.span === s) add(edge.x, 'station')
    const spanRows = [...points.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([x, kind]) => {
        const spanPieces = pieces[s] as NonNullable<(typeof pieces)[number]>
        const e = eccentricityIn(spanPieces, x)
        const dropDepth = i.drops ? i.drops.depthAt(s, x) : 0
        const centroid = i.centroidHeight + dropDepth - e // e below the centroid lowers the tendon; over a drop its soffit is lower
        const c = (spanPieces.find((p) => x <= p.x1) ?? (spanPieces[spanPieces.length - 1] as ProfilePiece)).c
        // e'' < 0: the tendon curves upwards (sagging), e'' > 0 downwards; a straight piece takes the mean
        const drop = c < 0 ? below.sagging : c > 0 ? below.hogging : (below.sagging + below.hogging) / 2
        const underside = centroid - drop
        if (underside < 0 || centroid > i.h + dropDepth) outside++
        const chair = roundTo > 0 ? Math.round(underside / roundTo) * roundTo : underside
        return { span: s, x, xGlobal: x0 + x, kind, e, centroid, underside, chair }
      })
    rows.push(...spanRows)
    spans.push({ span: s, L, rows: spanRows })
    x0 += L
  })
  return { spacing: i.spacing, roundTo, rows, spans, outside }
}
