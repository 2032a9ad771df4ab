/**
 * Balancing stage (load balancing, T. Y. Lin 1963): the load the tendon is to carry and the force
 * each span needs for it, P = w·L²/(8a). The comparison with the strands provided follows in the
 * losses stage, where the force per strand is known.
 */
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { balancingForce } from '../prestress/equivalent-loads'
import type { MemberLoads } from './loads'
import type { MemberProfile } from './profile'

export interface BalancingNeed {
  /** the load chosen for balancing, N/mm */
  load: number
  /** force each span needs to balance it, N */
  perSpan: number[]
  /** the largest of them, N */
  governing: number
}

export function balancingStage(input: MemberInput, loads: MemberLoads, profile: MemberProfile): StageOutcome<BalancingNeed> {
  const l = input.loads
  const load = l.balanceSelfWeight * loads.selfWeight + l.balanceSuperimposed * loads.superimposed + l.balanceImposed * loads.imposed
  const bal = balancingForce(profile.profile, load)
  return { result: { load, perSpan: bal.perSpan, governing: bal.governing }, checks: [], warnings: [] }
}
