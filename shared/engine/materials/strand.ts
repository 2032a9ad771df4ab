/**
 * Seven-wire strand Y1860S7 (prEN 10138-3), the jacking limits of EN 1992-1-1 5.10.2.1 / 5.10.3
 * and relaxation losses (3.3.2, eqs. (3.28)–(3.30)).
 */
import { EngineInputError } from '../contract'

export type StrandType = '12.5' | '12.9' | '15.2' | '15.7'

export interface Strand {
  /** nominal diameter, mm */
  diameter: number
  /** cross-section area, mm² */
  Ap: number
  /** characteristic tensile strength, MPa */
  fpk: number
  /** characteristic 0.1 % proof stress, MPa */
  fp01k: number
  /** modulus of elasticity, MPa */
  Ep: number
}

// prEN 10138-3 Y1860S7: Fpk and Fp0.1k per strand / Ap gives the stresses; Ep from EN 1992-1-1 3.3.6(3)
function strand(diameter: number, Ap: number, FpkKN: number, Fp01kKN: number): Strand {
  return { diameter, Ap, fpk: (FpkKN * 1000) / Ap, fp01k: (Fp01kKN * 1000) / Ap, Ep: 195000 }
}

export const STRANDS: Record<StrandType, Strand> = {
  '12.5': strand(12.5, 93, 173, 152), // prEN 10138-3 Y1860S7 12.5 mm
  '12.9': strand(12.9, 100, 186, 164), // prEN 10138-3 Y1860S7 12.9 mm
  '15.2': strand(15.2, 140, 260, 229), // prEN 10138-3 Y1860S7 15.2 mm, Fp0.1k ≈ 0.88 Fpk
  '15.7': strand(15.7, 150, 279, 246), // prEN 10138-3 Y1860S7 15.7 mm
}

export interface JackingLimits {
  sigmaPmax: number
  Pmax: number
  sigmaPm0: number
  Pm0: number
}

export function jackingLimits(
  s: { Ap: number; fpk: number; fp01k: number },
  k: { k1?: number; k2?: number; k7?: number; k8?: number } = {},
): JackingLimits {
  if (!(s.Ap > 0)) throw new EngineInputError('Ap', 'strand area must be positive')
  if (!(s.fpk > 0) || !(s.fp01k > 0)) throw new EngineInputError('fpk', 'strand strengths must be positive')
  const { k1 = 0.8, k2 = 0.9, k7 = 0.75, k8 = 0.85 } = k
  const sigmaPmax = Math.min(k1 * s.fpk, k2 * s.fp01k) // EN 1992-1-1 eq. (5.41), 5.10.2.1(1)
  const sigmaPm0 = Math.min(k7 * s.fpk, k8 * s.fp01k) // EN 1992-1-1 eq. (5.43), 5.10.3(2)
  return { sigmaPmax, Pmax: sigmaPmax * s.Ap, sigmaPm0, Pm0: sigmaPm0 * s.Ap }
}

/** ρ1000 of EN 1992-1-1 3.3.2(6) by relaxation class, %. */
export const RHO1000: Record<1 | 2 | 3, number> = { 1: 8, 2: 2.5, 3: 4 }

/**
 * Relaxation loss as a fraction of the initial stress, Δσpr/σpi.
 * rho1000 in %; mu = σpi/fpk; tHours after tensioning (500 000 h for the final value, 3.3.2(8)).
 */
export function relaxationLoss(cls: 1 | 2 | 3, rho1000: number, mu: number, tHours: number): number {
  if (!(rho1000 >= 0) || !Number.isFinite(rho1000)) throw new EngineInputError('rho1000', 'ρ1000 must be a non-negative percentage')
  if (!(mu > 0) || mu >= 1) throw new EngineInputError('mu', 'σpi/fpk must lie between 0 and 1')
  if (!(tHours > 0) || !Number.isFinite(tHours)) throw new EngineInputError('tHours', 'time must be positive (hours)')
  const t = tHours / 1000
  if (cls === 1) return 5.39 * rho1000 * Math.exp(6.7 * mu) * t ** (0.75 * (1 - mu)) * 1e-5 // EN 1992-1-1 eq. (3.28)
  if (cls === 2) return 0.66 * rho1000 * Math.exp(9.1 * mu) * t ** (0.75 * (1 - mu)) * 1e-5 // EN 1992-1-1 eq. (3.29)
  return 1.98 * rho1000 * Math.exp(8 * mu) * t ** (0.75 * (1 - mu)) * 1e-5 // EN 1992-1-1 eq. (3.30)
}
