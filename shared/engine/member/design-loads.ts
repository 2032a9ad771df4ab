/**
 * The design loads table: each load on the member with its combination factors and its value in
 * each combination — ULS by EN 1990 eq. (6.10) or the less favourable of (6.10a)/(6.10b), and the
 * characteristic, frequent and quasi-permanent combinations of 6.5.3 — as line loads on the member.
 */
import type { MemberInput } from '../input/schema'
import { ulsExpressions } from '../loads/uls-combinations'
import type { MemberLoads } from './loads'
import { combinationFactor } from './added-loads'

export interface DesignLoad {
  name: string
  kind: 'permanent' | 'imposed'
  /** characteristic value: a line load on the member, N/mm (in designForces, a force on it, N) */
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

/** The line loads on the member: the uniform ones and the partial loads. */
export function designLoads(input: MemberInput, loads: MemberLoads): DesignLoad[] {
  return designTable(input, loads).filter((l) => !l.force).map(({ force: _, ...l }) => l)
}

/** The forces at points of the member: the point loads and the line loads across it. */
export function designForces(input: MemberInput, loads: MemberLoads): DesignLoad[] {
  return designTable(input, loads).filter((l) => l.force).map(({ force: _, ...l }) => l)
}

function designTable(input: MemberInput, loads: MemberLoads): Array<DesignLoad & { force: boolean }> {
  const u = input.uls
  const expressions = ulsExpressions(u.combination, { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP })
  const gammaG = Math.max(...expressions.map((e) => e.gG)) // EN 1990 Table A1.2(B)
  const gammaQ = Math.max(...expressions.map((e) => e.gQ))
  const row = (name: string, kind: DesignLoad['kind'], value: number): DesignLoad & { force: boolean } => {
    const gammaUls = kind === 'permanent' ? gammaG : gammaQ
    const psi1 = kind === 'permanent' ? 1 : input.loads.psi1 // EN 1990 eq. (6.15b)
    const psi2 = kind === 'permanent' ? 1 : input.loads.psi2 // EN 1990 eq. (6.16b)
    return {
      name, kind, value, gammaUls, uls: gammaUls * value, psiFrequent: psi1, psiQuasiPermanent: psi2,
      characteristic: value, frequent: psi1 * value, quasiPermanent: psi2 * value, force: false, // EN 1990 eqs. (6.14b)–(6.16b)
    }
  }
  const added = loads.added.map((l): DesignLoad & { force: boolean } => {
    const gammaUls = l.type === 'permanent' ? gammaG : gammaQ
    const psi1 = combinationFactor(l, 'frequent') // EN 1990 eq. (6.15b), ψ1 of this load
    const psi2 = combinationFactor(l, 'quasiPermanent') // EN 1990 eq. (6.16b), ψ2 of this load
    const at = l.kind === 'partial' ? `span ${l.span + 1}, ${(l.from / 1000).toFixed(2)}–${(l.to / 1000).toFixed(2)} m` : `span ${l.span + 1} at ${(l.from / 1000).toFixed(2)} m`
    return {
      name: `${l.name} (${at})`, kind: l.type, value: l.value, gammaUls, uls: gammaUls * l.value, psiFrequent: psi1, psiQuasiPermanent: psi2,
      characteristic: l.value, frequent: psi1 * l.value, quasiPermanent: psi2 * l.value, force: l.kind !== 'partial',
    }
  })
  return [
    row('Self-weight', 'permanent', loads.selfWeight),
    row('Superimposed dead load', 'permanent', loads.superimposed),
    row('Imposed load', 'imposed', loads.imposed),
    ...added,
  ]
}
