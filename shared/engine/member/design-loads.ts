/**
 * The design loads table: each load on the member with its combination factors and its value in
 * each combination — ULS by EN 1990 eq. (6.10) or the less favourable of (6.10a)/(6.10b), and the
 * characteristic, frequent and quasi-permanent combinations of 6.5.3 — as line loads on the member.
 */
import type { MemberInput } from '../input/schema'
import { ulsExpressions } from '../loads/uls-combinations'
import type { MemberLoads } from './loads'

export interface DesignLoad {
  name: string
  kind: 'permanent' | 'imposed'
  /** characteristic line load, N/mm */
  value: number
  /** factor and value in the ULS combination (the larger of (6.10a) and (6.10b) where both apply) */
  gammaUls: number
  uls: number
  /** ψ factor and value in each SLS combination (1 for permanent loads) */
  psiFrequent: number
  psiQuasiPermanent: number
  characteristic: number
  frequent: number
  quasiPermanent: number
}

export function designLoads(input: MemberInput, loads: MemberLoads): DesignLoad[] {
  const u = input.uls
  const expressions = ulsExpressions(u.combination, { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP })
  const gammaG = Math.max(...expressions.map((e) => e.gG)) // EN 1990 Table A1.2(B)
  const gammaQ = Math.max(...expressions.map((e) => e.gQ))
  const row = (name: string, kind: DesignLoad['kind'], value: number): DesignLoad => {
    const gammaUls = kind === 'permanent' ? gammaG : gammaQ
    const psi1 = kind === 'permanent' ? 1 : input.loads.psi1 // EN 1990 eq. (6.15b)
    const psi2 = kind === 'permanent' ? 1 : input.loads.psi2 // EN 1990 eq. (6.16b)
    return {
      name, kind, value, gammaUls, uls: gammaUls * value, psiFrequent: psi1, psiQuasiPermanent: psi2,
      characteristic: value, frequent: psi1 * value, quasiPermanent: psi2 * value, // EN 1990 eqs. (6.14b)–(6.16b)
    }
  }
  return [
    row('Self-weight', 'permanent', loads.selfWeight),
    row('Superimposed dead load', 'permanent', loads.superimposed),
    row('Imposed load', 'imposed', loads.imposed),
  ]
}
