/**
 * Anchorage zones of post-tensioning tendons: the transverse (bursting) tie force behind an
 * anchorage and the resistance of the concrete under the anchor plate (a partially loaded area).
 * Forces in N, lengths in mm, areas in mm², stresses in MPa. For local effects of prestress the
 * force F is the design force — EN 1992-1-1 2.4.2.2(3) takes γP,unfav = 1.2 on the maximum
 * jacking force for anchorage zones (from memory, to be checked against the clause).
 */
import { EngineInputError } from '../contract'

function positive(v: number, field: string, what: string): void {
  if (!(v > 0) || !Number.isFinite(v)) throw new EngineInputError(field, `the ${what} must be a positive number`)
}

/**
 * Tie force where the discontinuity is partial (b ≤ H/2): the force F spreads from the width a of
 * the anchor plate to the width b. EN 1992-1-1 6.5.3(3) eq. (6.58): T = ¼·(b − a)/b·F.
 */
export function anchorageBurstingForce(input: { F: number; a: number; b: number }): number {
  const { F, a, b } = input
  if (!(F >= 0) || !Number.isFinite(F)) throw new EngineInputError('F', 'the anchorage force must be zero or a positive number')
  positive(a, 'a', 'width of the loaded area a')
  positive(b, 'b', 'width b the force spreads to')
  if (a > b) throw new EngineInputError('a', 'the loaded width a cannot exceed the width b the force spreads to')
  return (0.25 * (b - a) * F) / b // EN 1992-1-1 eq. (6.58)
}

/**
 * Tie force where the discontinuity is full (b > H/2), with h the length over which the force
 * spreads (the member depth at an end block). EN 1992-1-1 6.5.3(3) eq. (6.59): T = ¼·(1 − 0.7·a/h)·F.
 */
export function anchorageBurstingForceFull(input: { F: number; a: number; h: number }): number {
  const { F, a, h } = input
  if (!(F >= 0) || !Number.isFinite(F)) throw new EngineInputError('F', 'the anchorage force must be zero or a positive number')
  positive(a, 'a', 'width of the loaded area a')
  positive(h, 'h', 'depth h the force spreads over')
  if (a > h) throw new EngineInputError('a', 'the loaded width a cannot exceed the depth h the force spreads over')
  return 0.25 * (1 - (0.7 * a) / h) * F // EN 1992-1-1 eq. (6.59)
}

/**
 * Resistance of a partially loaded area: Ac0 the loaded area, Ac1 the largest design distribution
 * area similar in shape and concentric with it (6.7(2), Figure 6.29), fcd the design strength.
 * EN 1992-1-1 6.7 eq. (6.63): FRdu = Ac0·fcd·√(Ac1/Ac0) ≤ 3.0·fcd·Ac0.
 */
export function partiallyLoadedArea(input: { Ac0: number; Ac1: number; fcd: number }): number {
  const { Ac0, Ac1, fcd } = input
  positive(Ac0, 'Ac0', 'loaded area Ac0')
  positive(Ac1, 'Ac1', 'distribution area Ac1')
  positive(fcd, 'fcd', 'design compressive strength fcd')
  if (Ac1 < Ac0) throw new EngineInputError('Ac1', 'the distribution area Ac1 cannot be smaller than the loaded area Ac0')
  return Math.min(Ac0 * fcd * Math.sqrt(Ac1 / Ac0), 3.0 * fcd * Ac0) // EN 1992-1-1 eq. (6.63)
}

/** Angle of dispersal of the prestressing force from the anchorage, β = arctan(2/3), spread 2β from the anchor: EN 1992-1-1 8.10.3. */
export const ANCHORAGE_DISPERSAL_ANGLE = Math.atan(2 / 3)
