/**
 * The member from its section to its service stresses — section, loads, profile, balancing,
 * losses, prestress moments and stresses — composed in the order of the job. designMember builds
 * on it; the proposal re-runs it for every arrangement it verifies.
 */
import type { CheckResult } from '../contract'
import type { MemberInput } from '../input/schema'
import { analysisStage } from './analysis'
import type { PrestressAnalysis } from './analysis'
import { balancingStage } from './balancing'
import type { BalancingNeed } from './balancing'
import { loadsStage } from './loads'
import type { MemberLoads } from './loads'
import { lossesStage } from './losses'
import type { MemberLosses } from './losses'
import { profileStage } from './profile'
import type { MemberProfile } from './profile'
import { sectionStage } from './section'
import type { MemberSection } from './section'
import { stationGrid } from './stations'
import type { Station } from './stations'
import { stressesStage } from './stresses'
import type { ServiceStresses } from './stress-limits'

export interface ServiceDesign {
  input: MemberInput
  stations: Station[]
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  balancing: BalancingNeed
  losses: MemberLosses
  analysis: PrestressAnalysis
  stresses: ServiceStresses
  /** the stress, tendon and precompression checks, then the balancing check */
  checks: CheckResult[]
  warnings: string[]
}

export function designForService(input: MemberInput): ServiceDesign {
  const section = sectionStage(input)
  const stations = stationGrid(input)
  const loads = loadsStage(input, section.result, stations)
  const profile = profileStage(input, section.result, loads.result, stations)
  const balancing = balancingStage(input, loads.result, profile.result)
  const losses = lossesStage({ input, section: section.result, loads: loads.result, profile: profile.result, balancing: balancing.result, stations })
  const analysis = analysisStage(stations, profile.result, losses.result)
  const stresses = stressesStage({
    input, section: section.result, loads: loads.result, profile: profile.result, losses: losses.result, analysis: analysis.result, stations,
  })
  const stages = [section, loads, profile, balancing, losses, analysis, stresses]
  return {
    input, stations,
    section: section.result, loads: loads.result, profile: profile.result, balancing: balancing.result,
    losses: losses.result, analysis: analysis.result, stresses: stresses.result,
    // the stress checks lead, as the sheet lists them; the balancing check follows
    checks: [...stresses.checks, ...losses.checks],
    warnings: stages.flatMap((s) => s.warnings),
  }
}

/** Transfer and service stress checks all pass. */
export function stressesPass(d: Pick<ServiceDesign, 'checks'>): boolean {
  return d.checks.filter((k) => k.group === 'transfer' || k.group === 'service').every((k) => k.pass)
}
