/**
 * The moments a member passes into its columns at each joint, for the column designer: from the
 * permanent load, from the imposed load over its arrangements (5.1.3), and from the prestress at
 * transfer and in service (the columns' share of its secondary effect, 5.10.7).
 */
import type { ColumnJoint } from './columns'
import type { MemberLoads } from './loads'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'

/** The moments the member passes into the columns at a joint, counter-clockwise positive, N·mm in the width designed. */
export interface ColumnMoments extends ColumnJoint {
  /** share of the joint's moment taken by the columns below (the rest by those above) */
  shareBelow: number
  /** self-weight and superimposed load on every span */
  permanent: number
  /** imposed load, the least and greatest over the arrangements (5.1.3) */
  imposedMin: number
  imposedMax: number
  /** prestress at transfer and in service (its secondary effect on the frame, 5.10.7) */
  prestressTransfer: number
  prestressService: number
}

/** The columns' moments at each joint, for the column designer, from each load kind. */
export function columnMoments(loads: MemberLoads, profile: MemberProfile, losses: MemberLosses): ColumnMoments[] {
  const cols = loads.columns
  if (!cols) return []
  const permanent = loads.permanent
  // the couple reaction acts on the member; the columns take it the other way round
  return cols.joints.map((j) => {
    const imposed = loads.imposedRange({ kind: 'couple', support: j.support }, 'characteristic')
    const k = j.kBelow + j.kAbove
    return {
      ...j,
      shareBelow: k > 0 ? j.kBelow / k : 0,
      permanent: -(permanent.reactionCouples[j.support] as number),
      imposedMin: -imposed.max,
      imposedMax: -imposed.min,
      prestressTransfer: -(profile.couplesPerUnitForce[j.support] as number) * losses.transfer.Pmean,
      prestressService: -(profile.couplesPerUnitForce[j.support] as number) * losses.service.Pmean,
    }
  })
}
