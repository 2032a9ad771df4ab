/**
 * The loads beyond the uniform ones, as loads on the member: a point load as given, a line load
 * across the member times the width loaded (a wall or façade crossing a slab strip becomes a point
 * load on the strip), a uniform load over part of a span times the width loaded (a patch). Each keeps
 * its action (permanent or imposed) and its own ψ factors (EN 1990 Table A1.1), so that each
 * combination takes it at its own value (EN 1990 6.4.3.2, 6.5.3).
 */
import type { BeamLoad } from '../analysis/continuous-beam'
import type { MemberInput } from '../input/schema'

export interface AddedLoad {
  /** "Point load 1", "Line load 2", "Partial load 1" */
  name: string
  kind: 'point' | 'line' | 'partial'
  type: 'permanent' | 'imposed'
  /** span index from 0 */
  span: number
  /** position on the span from its left support, mm: the point, the line, or the start of the patch */
  from: number
  to: number
  /** the load on the member at its characteristic value: N for a point or line, N/mm for a patch */
  value: number
  psi0: number
  psi1: number
  psi2: number
  /** the load on the member at its characteristic value */
  beam: BeamLoad
}

/** Combination factor of an added load: 1 (characteristic, ULS leading), ψ0, ψ1 or ψ2; permanent loads 1. */
export type CombinationValue = 'characteristic' | 'psi0' | 'frequent' | 'quasiPermanent'

export function combinationFactor(l: AddedLoad, c: CombinationValue): number {
  if (l.type === 'permanent' || c === 'characteristic') return 1
  return c === 'psi0' ? l.psi0 : c === 'frequent' ? l.psi1 : l.psi2 // EN 1990 Table A1.1
}

/** The member's added loads; positions are checked against the spans by the input schema. */
export function addedLoads(input: MemberInput, loadedWidth: number): AddedLoad[] {
  const out: AddedLoad[] = []
  input.loads.points.forEach((l, k) => {
    const span = l.span - 1
    out.push({ name: `Point load ${k + 1}`, kind: 'point', type: l.type, span, from: l.at, to: l.at, value: l.P, psi0: l.psi0, psi1: l.psi1, psi2: l.psi2, beam: { kind: 'point', span, at: l.at, P: l.P } })
  })
  input.loads.lines.forEach((l, k) => {
    const span = l.span - 1
    const P = l.w * loadedWidth // a line across the member: its load per metre over the width loaded
    out.push({ name: `Line load ${k + 1}`, kind: 'line', type: l.type, span, from: l.at, to: l.at, value: P, psi0: l.psi0, psi1: l.psi1, psi2: l.psi2, beam: { kind: 'point', span, at: l.at, P } })
  })
  input.loads.partials.forEach((l, k) => {
    const span = l.span - 1
    const w = l.q * loadedWidth // load per unit area over the width loaded
    const to = l.from + l.length
    out.push({ name: `Partial load ${k + 1}`, kind: 'partial', type: l.type, span, from: l.from, to, value: w, psi0: l.psi0, psi1: l.psi1, psi2: l.psi2, beam: { kind: 'patch', span, from: l.from, to, w } })
  })
  return out
}

/** The load at a factor: the same load scaled. */
export function scaledLoad(l: BeamLoad, f: number): BeamLoad {
  switch (l.kind) {
    case 'udl':
    case 'patch':
      return { ...l, w: l.w * f }
    case 'point':
      return { ...l, P: l.P * f }
    case 'couple':
      return { ...l, M: l.M * f }
  }
}
