/**
 * Primary, total and secondary (hyperstatic) moments of prestress, EN 1992-1-1 5.10.7.
 * The member is analysed under the tendon's equivalent loads: the total moment comes out; the
 * primary moment is −P·e (e below the centroid, sagging positive); secondary = total − primary,
 * which varies linearly between supports.
 */
import { analyseContinuousBeam } from '../analysis/continuous-beam'
import type { SupportKind } from '../analysis/continuous-beam'
import { equivalentLoads } from './equivalent-loads'
import type { TendonProfile } from './profile'

export interface PrestressMomentsInput {
  spans: number[]
  EI?: number | number[]
  supports?: SupportKind[]
  profile: TendonProfile
  P: number
}

export interface PrestressMoments {
  /** at each support, N·mm */
  primary: number[]
  total: number[]
  secondary: number[]
  /** total moment anywhere, N·mm */
  totalAt(span: number, x: number): number
  /** secondary moment anywhere (linear between supports), N·mm */
  secondaryAt(span: number, x: number): number
}

export function prestressMoments(input: PrestressMomentsInput): PrestressMoments {
  const beam = analyseContinuousBeam({
    spans: input.spans,
    EI: input.EI,
    supports: input.supports,
    loads: equivalentLoads(input.profile, input.P),
  })
  const primary = input.profile.supportEcc.map((e) => -input.P * e) // primary moment M1 = −P·e
  const total = beam.supportMoments
  const secondary = total.map((m, j) => m - (primary[j] as number)) // EN 1992-1-1 5.10.7: M2 = M − M1
  const secondaryAt = (span: number, x: number): number => {
    const L = input.spans[span] as number
    return (secondary[span] as number) * (1 - x / L) + ((secondary[span + 1] as number) * x) / L
  }
  const totalAt = (span: number, x: number): number => beam.momentAt(span, x)
  return { primary, total, secondary, totalAt, secondaryAt }
}
