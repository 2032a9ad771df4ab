/**
 * Analysis stage: the moments of prestress at transfer and in service — primary −P·e, secondary
 * (EN 1992-1-1 5.10.7: the restraint of the supports to the free deformation, proportional to the
 * mean force of the stage) and their total — at every station and at the supports.
 */
import { at } from '../common/numeric'
import type { StageOutcome } from '../common/stage'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'
import { stationFinder } from './stations'
import type { Station } from './stations'

export interface PrestressMomentLine { primary: number[]; secondary: number[]; total: number[] }

export interface PrestressAnalysis {
  /** N·mm at each station */
  transfer: PrestressMomentLine
  service: PrestressMomentLine
  /** the same at each support, left to right */
  atSupports: Record<'transfer' | 'service', PrestressMomentLine>
  /** station index of each support */
  supportStations: number[]
  /** station indices at the two ends of each span (0⁺ and L⁻): with columns the secondary moment steps at a support */
  spanEndStations: Array<[number, number]>
}

export function analysisStage(stations: Station[], profile: MemberProfile, losses: MemberLosses): StageOutcome<PrestressAnalysis> {
  const n = stations.length === 0 ? 0 : (stations[stations.length - 1] as Station).span + 1
  const find = stationFinder(stations)
  const supportStations = Array.from({ length: n + 1 }, (_, j) => (j < n ? find(j, 0) : stations.length - 1))
  const spanEndStations = Array.from({ length: n }, (_, i): [number, number] => {
    const ks = stations.flatMap((st, k) => (st.span === i ? [k] : []))
    return [ks[0] as number, ks[ks.length - 1] as number]
  })
  const line = (P: number[], Pmean: number): PrestressMomentLine => {
    const primary = stations.map((_, k) => -at(P, k) * at(profile.e, k)) // primary moment −P·e
    const secondary = profile.secondaryPerUnitForce.map((m) => m * Pmean)
    return { primary, secondary, total: primary.map((v, k) => v + at(secondary, k)) }
  }
  const transfer = line(losses.transfer.P, losses.transfer.Pmean)
  const service = line(losses.service.P, losses.service.Pmean)
  const pick = (l: PrestressMomentLine): PrestressMomentLine => ({
    primary: supportStations.map((k) => at(l.primary, k)),
    secondary: supportStations.map((k) => at(l.secondary, k)),
    total: supportStations.map((k) => at(l.primary, k) + at(l.secondary, k)),
  })
  return {
    result: { transfer, service, atSupports: { transfer: pick(transfer), service: pick(service) }, supportStations, spanEndStations },
    checks: [],
    warnings: [],
  }
}
