/**
 * Punching shear at a column head of a prestressed flat slab, EN 1992-1-1 6.4: basic control
 * perimeter u1 at 2d (6.4.2), the simplified β of 6.4.3(6) (Fig. 6.21N), the vertical component of
 * the inclined tendons crossing the control section subtracted from VEd, vRd,c with k1·σcp
 * (6.4.4(1), eq. (6.47)) and vRd,max at the column face (6.4.5(3)). N, mm, MPa.
 */
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'
import { EngineInputError } from '../contract'

export type ColumnPosition = 'interior' | 'edge' | 'corner'

export interface PunchingInput {
  /** column reaction (magnitude), N */
  VEd: number
  /** vertical component of the tendons crossing the control perimeter, upward, N */
  Vpd: number
  position: ColumnPosition
  /** column dimensions: c1 perpendicular to the free edge (edge column), c2 parallel to it, mm */
  c1: number
  c2: number
  /** mean effective depth (dy + dz)/2, mm (eq. (6.32)) */
  d: number
  fck: number
  /** bonded tension steel ratios in y and z over the column width + 3d each side */
  rhoLy: number
  rhoLz: number
  /** mean precompression in y and z (compression +), MPa */
  sigmaCy: number
  sigmaCz: number
  /** override of the simplified β (6.4.3(6)) */
  beta?: number
  gammaC?: number
  /** 0.1 recommended (6.4.4(1) note) */
  k1?: number
  /** vRd,max = coefficient·ν·fcd; 0.4 recommended by EN 1992-1-1/A1:2014 (0.5 in the 2004 text) */
  vRdMaxCoefficient?: number
}

export interface PunchingResult {
  u0: number
  u1: number
  beta: number
  VEdRed: number
  vEdU1: number
  vEdU0: number
  k: number
  rhoL: number
  sigmaCp: number
  vmin: number
  vRdc: number
  vRdMax: number
  utilisation: number
  utilisationFace: number
  /** true when vEd > vRd,c: punching reinforcement (6.4.5) is needed */
  reinforcementNeeded: boolean
}

/** Simplified β of EN 1992-1-1 6.4.3(6), Fig. 6.21N. */
export const PUNCHING_BETA: Record<ColumnPosition, number> = { interior: 1.15, edge: 1.4, corner: 1.5 }

/** Basic control perimeter at 2d and the column-face perimeter (6.4.2 Fig. 6.13/6.15, 6.4.5(3)). */
export function controlPerimeters(position: ColumnPosition, c1: number, c2: number, d: number): { u0: number; u1: number } {
  if (position === 'interior') return { u0: 2 * (c1 + c2), u1: 2 * (c1 + c2) + 4 * Math.PI * d } // Fig. 6.13
  if (position === 'edge') return { u0: Math.min(c2 + 3 * d, c2 + 2 * c1), u1: c2 + 2 * c1 + 2 * Math.PI * d } // Fig. 6.15, 6.4.5(3)
  return { u0: Math.min(3 * d, c1 + c2), u1: c1 + c2 + Math.PI * d } // Fig. 6.15, 6.4.5(3)
}

export function punchingCheck(i: PunchingInput): PunchingResult {
  requireNonNegative('VEd', i.VEd)
  requireNonNegative('Vpd', i.Vpd)
  requirePositive('c1', i.c1)
  requirePositive('c2', i.c2)
  requirePositive('d', i.d)
  requireRange('fck', i.fck, 12, 90, 'fck must lie between 12 and 90 MPa (EN 1992-1-1 Table 3.1)')
  requireNonNegative('rhoLy', i.rhoLy)
  requireNonNegative('rhoLz', i.rhoLz)
  if (!Number.isFinite(i.sigmaCy)) throw new EngineInputError('sigmaCy', 'must be a finite number')
  if (!Number.isFinite(i.sigmaCz)) throw new EngineInputError('sigmaCz', 'must be a finite number')
  if (!(i.position in PUNCHING_BETA)) throw new EngineInputError('position', 'interior, edge or corner')
  if (i.beta !== undefined) requireRange('beta', i.beta, 1, 2, 'β must lie between 1.0 and 2.0')
  const gammaC = i.gammaC ?? 1.5
  const fcd = i.fck / gammaC // EN 1992-1-1 eq. (3.15), αcc = 1.0
  const { u0, u1 } = controlPerimeters(i.position, i.c1, i.c2, i.d)
  const beta = i.beta ?? PUNCHING_BETA[i.position]
  const VEdRed = Math.max(0, i.VEd - i.Vpd) // 6.4.3 (from memory): favourable vertical tendon component within the control section
  const vEdU1 = (beta * VEdRed) / (u1 * i.d) // EN 1992-1-1 eq. (6.38)
  const vEdU0 = (beta * i.VEd) / (u0 * i.d) // eq. (6.38) at the column face, without the tendon relief
  const k = Math.min(2, 1 + Math.sqrt(200 / i.d)) // 6.4.4(1)
  const rhoL = Math.min(0.02, Math.sqrt(i.rhoLy * i.rhoLz)) // 6.4.4(1): ρl = √(ρly ρlz) ≤ 0.02
  const sigmaCp = (i.sigmaCy + i.sigmaCz) / 2 // 6.4.4(1)
  const k1 = i.k1 ?? 0.1 // 6.4.4(1) note
  const vmin = 0.035 * k ** 1.5 * Math.sqrt(i.fck) // eq. (6.3N)
  const vRdc = Math.max((0.18 / gammaC) * k * (100 * rhoL * i.fck) ** (1 / 3) + k1 * sigmaCp, vmin + k1 * sigmaCp) // EN 1992-1-1 eq. (6.47)
  const nu = 0.6 * (1 - i.fck / 250) // EN 1992-1-1 eq. (6.6N)
  const vRdMax = (i.vRdMaxCoefficient ?? 0.4) * nu * fcd // 6.4.5(3) note (A1:2014)
  return {
    u0, u1, beta, VEdRed, vEdU1, vEdU0, k, rhoL, sigmaCp, vmin, vRdc, vRdMax,
    utilisation: vRdc > 0 ? vEdU1 / vRdc : 1e9,
    utilisationFace: vEdU0 / vRdMax,
    reinforcementNeeded: vEdU1 > vRdc,
  }
}
