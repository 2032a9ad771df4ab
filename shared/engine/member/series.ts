/** Per-station arrays of the member for the figures: profile, forces, moments of prestress, stresses, limits. */
import { at } from '../common/numeric'
import type { PrestressAnalysis } from './analysis'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { Station } from './stations'
import type { ServiceStresses } from './stress-limits'

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
}

export interface SeriesInput {
  stations: Station[]
  section: MemberSection
  profile: MemberProfile
  losses: MemberLosses
  analysis: PrestressAnalysis
  stresses: ServiceStresses
}

export function memberSeries({ stations, section, profile, losses, analysis, stresses }: SeriesInput): MemberSeries {
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
  }
}
