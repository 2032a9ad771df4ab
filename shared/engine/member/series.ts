/** Per-station arrays of the member for the figures: profile, forces, moments of prestress, stresses, limits, ULS envelopes. */
import { at } from '../common/numeric'
import type { MemberInput } from '../input/schema'
import type { PrestressAnalysis } from './analysis'
import type { MemberLoads } from './loads'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { Station } from './stations'
import type { ServiceStresses } from './stress-limits'
import { ulsActions } from './uls-actions'

export interface MemberSeries {
  X: number[]
  span: number[]
  x: number[]
  e: number[]
  eLimitTop: number[]
  eLimitBottom: number[]
  depth: number[]
  centroid: number[]
  forceFriction: number[]
  forceDrawIn: number[]
  forceTransfer: number[]
  forceService: number[]
  primaryTransfer: number[]
  secondaryTransfer: number[]
  totalTransfer: number[]
  primaryService: number[]
  secondaryService: number[]
  totalService: number[]
  momentTransfer: number[]
  momentServiceMax: number[]
  momentServiceMin: number[]
  stressTransferTopMin: number[]
  stressTransferTopMax: number[]
  stressTransferBottomMin: number[]
  stressTransferBottomMax: number[]
  stressServiceTopMin: number[]
  stressServiceTopMax: number[]
  stressServiceBottomMin: number[]
  stressServiceBottomMax: number[]
  limitTransferCompression: number[]
  limitTransferTension: number[]
  limitServiceCompression: number[]
  limitServiceTension: number[]
  /** greatest and least design moment at ULS over the load arrangements, with γP × the secondary moment (as uls.sections) */
  momentUlsMax: number[]
  momentUlsMin: number[]
  /** greatest and least design shear at ULS over the load arrangements, with γP × the secondary shear (as uls.shear) */
  shearUlsMax: number[]
  shearUlsMin: number[]
}

export interface SeriesInput {
  input: MemberInput
  stations: Station[]
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  losses: MemberLosses
  analysis: PrestressAnalysis
  stresses: ServiceStresses
}

/**
 * The ULS envelopes of moment and shear at every station, from the same actions as the bending and
 * shear checks (uls-actions.ts), so that the figures draw the values the checks use at their sections.
 */
function ulsEnvelopes(input: MemberInput, stations: Station[], section: MemberSection, loads: MemberLoads, analysis: PrestressAnalysis): Pick<MemberSeries, 'momentUlsMax' | 'momentUlsMin' | 'shearUlsMax' | 'shearUlsMin'> {
  const actions = ulsActions(input, section, loads, analysis)
  const gammaP = input.uls.gammaP
  const spans = input.geometry.spans
  const stages = ['transfer', 'service'] as const
  const out = { momentUlsMax: [] as number[], momentUlsMin: [] as number[], shearUlsMax: [] as number[], shearUlsMin: [] as number[] }
  stations.forEach((s, k) => {
    const M = actions.envelope({ kind: 'moment', span: s.span, x: s.x })
    const M2 = stages.map((stage) => gammaP * at(analysis[stage].secondary, k)) // γP M2, EN 1992-1-1 2.4.2.2(1), 5.10.8(1)
    out.momentUlsMax.push(M.max + Math.max(...M2))
    out.momentUlsMin.push(M.min + Math.min(...M2))
    const V = actions.envelope({ kind: 'shear', span: s.span, x: s.x })
    const V2 = stages.map((stage) => {
      const e = actions.secondaryEnds[stage][s.span] as { start: number; end: number }
      return (gammaP * (e.end - e.start)) / at(spans, s.span) // secondary shear ΔM2/L (5.10.7: M2 linear along a span)
    })
    out.shearUlsMax.push(V.max + Math.max(...V2))
    out.shearUlsMin.push(V.min + Math.min(...V2))
  })
  return out
}

export function memberSeries({ input, stations, section, loads, profile, losses, analysis, stresses }: SeriesInput): MemberSeries {
  const X = stations.map((s) => s.X)
  const lines = stresses.lines
  const limits = stresses.limits
  const serviceTensionLimit = limits.frequent.tension ?? limits.quasiPermanent.tension ?? 0
  const local = stations.map((s) => section.at(s.span, s.x)) // over a drop, its own section
  return {
    X,
    span: stations.map((s) => s.span),
    x: stations.map((s) => s.x),
    e: profile.e,
    eLimitTop: local.map((l) => -l.eccentricity.top),
    eLimitBottom: local.map((l) => l.eccentricity.bottom),
    depth: local.map((l) => l.properties.h),
    centroid: local.map((l) => l.properties.yt),
    forceFriction: losses.afterFriction,
    forceDrawIn: losses.afterDrawIn,
    forceTransfer: losses.transfer.P,
    forceService: losses.service.P,
    primaryTransfer: analysis.transfer.primary,
    secondaryTransfer: analysis.transfer.secondary,
    totalTransfer: analysis.transfer.primary.map((v, k) => v + at(analysis.transfer.secondary, k)),
    primaryService: analysis.service.primary,
    secondaryService: analysis.service.secondary,
    totalService: analysis.service.primary.map((v, k) => v + at(analysis.service.secondary, k)),
    momentTransfer: lines.momentTransfer,
    momentServiceMax: lines.momentServiceMax,
    momentServiceMin: lines.momentServiceMin,
    stressTransferTopMin: lines.transfer.topMin,
    stressTransferTopMax: lines.transfer.topMax,
    stressTransferBottomMin: lines.transfer.bottomMin,
    stressTransferBottomMax: lines.transfer.bottomMax,
    stressServiceTopMin: lines.service.topMin,
    stressServiceTopMax: lines.service.topMax,
    stressServiceBottomMin: lines.service.bottomMin,
    stressServiceBottomMax: lines.service.bottomMax,
    limitTransferCompression: X.map(() => limits.transfer.compression as number),
    limitTransferTension: X.map(() => -(limits.transfer.tension as number)),
    limitServiceCompression: X.map(() => limits.characteristic.compression as number),
    limitServiceTension: X.map(() => -serviceTensionLimit),
    ...ulsEnvelopes(input, stations, section, loads, analysis),
  }
}
