/**
 * Primary, total and secondary (hyperstatic) moments of prestress, EN 1992-1-1 5.10.7.
 * The member is analysed under the tendon's equivalent loads: the total moment comes out; the
 * primary moment is −P·e (e below the centroid, sagging positive); secondary = total − primary,
 * which varies linearly along each span (it comes from the support reactions alone). With columns
 * (rotational springs) the total moment steps at a support by the columns' moment, so each span
 * carries its own end values; a cantilever is statically determinate and has no secondary moment.
 */
import { continuousBeamModel } from '../analysis/continuous-beam'
import type { BeamLoad, SpanEI, SupportKind } from '../analysis/continuous-beam'
import { equivalentLoads } from './equivalent-loads'
import { eccentricityIn, resolveProfile } from './profile'
import type { ProfilePiece, TendonProfile } from './profile'

export interface PrestressMomentsInput {
  spans: number[]
  EI?: number | SpanEI[]
  /**
   * as analyseContinuousBeam; at a free end (cantilever) the tendon anchors at the tip (the end entry
   * of supportEcc) and follows the profile as given: its low point, or, with profile.cantilever set,
   * one parabola from the root
   */
  supports?: SupportKind[]
  /** rotational stiffness of the columns at each support, N·mm/rad (see columnStiffness) */
  springs?: number[]
  profile: TendonProfile
  P: number
  /**
   * where the section deepens (a drop): the local centroid lies lower by `shift` (mm) over [from, to]
   * of a span, so e measured from it is smaller by the shift; optional, none by default
   */
  centroidShifts?: CentroidShift[]
}

export interface CentroidShift { span: number; from: number; to: number; shift: number }

export interface PrestressMoments {
  /** at each support, N·mm: total and secondary are taken just right of the support (the last just left) */
  primary: number[]
  total: number[]
  secondary: number[]
  /** secondary moment at the two ends of each span (0⁺ and L⁻), N·mm */
  secondaryEnds: Array<{ start: number; end: number }>
  /** couple reaction of each support (counter-clockwise positive): the columns' share of the prestress, N·mm */
  reactionCouples: number[]
  /** vertical reactions of prestress (upward positive), N: the hyperstatic reactions, self-equilibrating */
  reactions: number[]
  /** total moment anywhere, N·mm */
  totalAt(span: number, x: number): number
  /** secondary moment anywhere (linear along each span), N·mm */
  secondaryAt(span: number, x: number): number
}

export function prestressMoments(input: PrestressMomentsInput): PrestressMoments {
  const shifts = input.centroidShifts ?? []
  const P = input.P
  // a step δ of the centroid steps e by −δ and M1 = −P·e by +P·δ: a couple −P·δ where the shift starts, +P·δ where it ends
  const steps: BeamLoad[] = shifts.flatMap((s) => [
    { kind: 'couple' as const, span: s.span, at: s.from, M: -P * s.shift },
    { kind: 'couple' as const, span: s.span, at: s.to, M: P * s.shift },
  ])
  const beam = continuousBeamModel({ spans: input.spans, EI: input.EI, supports: input.supports, springs: input.springs })
    .analyse([...equivalentLoads(input.profile, P), ...steps])
  const pieces = resolveProfile(input.profile)
  const shiftAt = (span: number, x: number): number => {
    const s = shifts.find((z) => z.span === span && x >= z.from - 1e-6 && x <= z.to + 1e-6)
    return s ? s.shift : 0
  }
  const eAt = (span: number, x: number): number => eccentricityIn(pieces[span] as ProfilePiece[], x) - shiftAt(span, x)
  const n = input.spans.length
  const primary = input.profile.supportEcc.map((e, j) => -P * (e - shiftAt(j < n ? j : n - 1, j < n ? 0 : (input.spans[n - 1] as number)))) // primary moment M1 = −P·e
  const total = beam.supportMoments
  const secondary = total.map((m, j) => m - (primary[j] as number)) // EN 1992-1-1 5.10.7: M2 = M − M1
  const secondaryEnds = input.spans.map((L, i) => {
    return {
      start: beam.momentAt(i, 0) + P * eAt(i, 0), // M2 = M − (−P·e)
      end: beam.momentAt(i, L) + P * eAt(i, L),
    }
  })
  const secondaryAt = (span: number, x: number): number => {
    const L = input.spans[span] as number
    const ends = secondaryEnds[span] as { start: number; end: number }
    return ends.start * (1 - x / L) + (ends.end * x) / L
  }
  const totalAt = (span: number, x: number): number => beam.momentAt(span, x)
  return { primary, total, secondary, secondaryEnds, reactionCouples: beam.reactionCouples, reactions: beam.reactions, totalAt, secondaryAt }
}
