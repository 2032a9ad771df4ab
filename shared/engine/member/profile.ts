/**
 * Profile stage: the tendon's eccentricities at supports and low points (the deepest the covers
 * allow, or the engineer's), the parabolic pieces, e at every station, the checks that the tendon
 * stays inside the concrete, and the secondary moment of prestress per unit force.
 */
import { fail } from '../common/guards'
import { at, sum } from '../common/numeric'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { drapes, eccentricityIn, isCantileverSpan, resolveProfile, withCantilevers } from '../prestress/profile'
import type { ProfilePiece, TendonProfile } from '../prestress/profile'
import { prestressMoments } from '../prestress/secondary'
import type { MemberLoads } from './loads'
import type { MemberSection } from './section'
import { lowPointShares } from './stations'
import type { Station } from './stations'

export interface MemberProfile {
  profile: TendonProfile
  pieces: ProfilePiece[][]
  /** low point of each span, share of the span */
  lowAt: number[]
  /** eccentricity at each station, mm (below the centroid +) */
  e: number[]
  /** secondary moment of prestress at each station under P = 1 N (EN 1992-1-1 5.10.7), N·mm/N */
  secondaryPerUnitForce: number[]
  /** the share of secondaryPerUnitForce that the drops' steps of the centroid cause, N·mm/N (0 without drops) */
  shiftSecondaryPerUnitForce: number[]
  /** couple reaction of each support per unit force (the columns' share of the prestress), N·mm per N */
  couplesPerUnitForce: number[]
  drapes: number[]
  /** low points along the member, mm */
  lowPointX: number[]
  /** tendon length along the member, mm */
  length: number
}

const outside = (e: number, eTop: number, eBottom: number): string =>
  `e = ${e.toFixed(1)} mm leaves the concrete: it must lie between −${eTop.toFixed(1)} and +${eBottom.toFixed(1)} mm`

export function profileStage(input: MemberInput, section: MemberSection, loads: MemberLoads, stations: Station[]): StageOutcome<MemberProfile> {
  const spans = input.geometry.spans
  const n = spans.length
  const eTop = section.eccentricity.top
  const eBot = section.eccentricity.bottom
  const p = input.profile
  const supportEcc = p.mode === 'custom' && p.supportEcc
    ? [...p.supportEcc]
    : [p.anchorLeft, ...spans.slice(1).map(() => -eTop), p.anchorRight]
  const spanEcc = p.mode === 'custom' && p.spanEcc ? [...p.spanEcc] : spans.map(() => eBot)
  const eccField = (j: number, end: boolean): string =>
    p.mode === 'custom' ? `profile.supportEcc.${j}` : end ? (j === 0 ? 'profile.anchorLeft' : 'profile.anchorRight') : 'profile.mode'
  supportEcc.forEach((e, j) => {
    if (e < -eTop - 1e-9 || e > eBot + 1e-9) fail(eccField(j, j === 0 || j === n), outside(e, eTop, eBot))
  })
  spanEcc.forEach((e, i) => {
    if (e < -eTop - 1e-9 || e > eBot + 1e-9) fail(`profile.spanEcc.${i}`, outside(e, eTop, eBot))
  })
  const lowAt = lowPointShares(input)
  // a cantilever's tendon runs from its root to the anchorage at the tip (the end entry of supportEcc)
  const profile: TendonProfile = withCantilevers({ spans, supportEcc, spanEcc, lowPointAt: lowAt, inflection: p.inflection }, loads.supports)
  const pieces = resolveProfile(profile)
  // e from the local centroid: over a drop the centroid lies lower by its shift (the profile is drawn from the plain one's)
  const e = stations.map((s) => eccentricityIn(pieces[s.span] as ProfilePiece[], s.x) - section.at(s.span, s.x).shift)
  // parabolas stay between their end values, but a custom profile may still leave the section (a drop's own limits over it)
  e.forEach((v, k) => {
    const lim = section.at((stations[k] as Station).span, (stations[k] as Station).x).eccentricity
    if (v < -lim.top - 1e-6 || v > lim.bottom + 1e-6) {
      const st = stations[k] as Station
      fail('profile.inflection', `the tendon leaves the concrete in span ${st.span + 1} at x = ${(st.x / 1000).toFixed(2)} m`)
    }
  })

  // secondary moment per unit force (EN 1992-1-1 5.10.7), scaled later by the mean force of each stage
  const centroidShifts = section.drops.flatMap((d) => d.parts.map((p) => ({ ...p, shift: d.local.shift })))
  const unitPs = prestressMoments({ spans, EI: section.spanEI, supports: loads.supports, ...(loads.springs ? { springs: loads.springs } : {}), profile, P: 1, centroidShifts })
  const secondaryPerUnitForce = stations.map((s) => unitPs.secondaryAt(s.span, s.x))
  // the part of it that the drops' centroid steps cause alone (the proposal keeps it while it moves the profile)
  const flat: TendonProfile = { ...profile, supportEcc: supportEcc.map(() => 0), spanEcc: spanEcc.map(() => 0) }
  const shiftPs = centroidShifts.length > 0
    ? prestressMoments({ spans, EI: section.spanEI, supports: loads.supports, ...(loads.springs ? { springs: loads.springs } : {}), profile: flat, P: 1, centroidShifts })
    : null
  const shiftSecondaryPerUnitForce = stations.map((s) => (shiftPs ? shiftPs.secondaryAt(s.span, s.x) : 0))
  const couplesPerUnitForce = unitPs.reactionCouples // the columns' share of the prestress, per unit force

  let offset = 0
  // a cantilever's tendon falls from its root to the anchorage at its tip: its lowest point is the tip
  const tipShare = (i: number): number | null => (isCantileverSpan(profile, i) ? (i === 0 ? 0 : 1) : null)
  const lowPointX = spans.map((L, i) => {
    const x = offset + (tipShare(i) ?? at(lowAt, i)) * L
    offset += L
    return x
  })
  return {
    result: { profile, pieces, lowAt, e, secondaryPerUnitForce, shiftSecondaryPerUnitForce, couplesPerUnitForce, drapes: drapes(profile), lowPointX, length: sum(spans) },
    checks: [],
    warnings: [],
  }
}
