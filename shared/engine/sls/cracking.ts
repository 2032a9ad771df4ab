/**
 * Control of cracking, EN 1992-1-1 7.3: the limiting crack width and the decompression requirement
 * of Table 7.1N by exposure class, the crack width of 7.3.4 (eqs. (7.8)–(7.11), (7.14)) with bonded
 * tendons counted through ξ1 (7.3.2(3), eq. (7.5), Table 6.2), and the decompression check of
 * 7.3.1(5) (bonded tendons or ducts at least 25 mm inside concrete in compression). N, mm, MPa.
 */
import { EngineInputError } from '../contract'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'

export const CRACK_EXPOSURE_CLASSES = ['X0', 'XC1', 'XC2', 'XC3', 'XC4', 'XD1', 'XD2', 'XD3', 'XS1', 'XS2', 'XS3'] as const
export type CrackExposure = (typeof CRACK_EXPOSURE_CLASSES)[number]

export type Combination = 'quasi-permanent' | 'frequent'

export interface CrackRequirement {
  /** wmax, mm; null where decompression governs instead */
  wmax: number | null
  /** combination under which wmax applies */
  combination: Combination
  /** combination under which decompression must be checked, or null */
  decompression: Combination | null
  note: string
}

/** EN 1992-1-1 Table 7.1N (recommended values); XD3 is grouped with XD1/XD2 (from memory). */
export function crackRequirement(exposure: string, tendons: 'bonded' | 'unbonded' | 'none'): CrackRequirement {
  if (!(CRACK_EXPOSURE_CLASSES as readonly string[]).includes(exposure)) {
    throw new EngineInputError('exposure', `Table 7.1N covers ${CRACK_EXPOSURE_CLASSES.join(', ')}`)
  }
  const dry = exposure === 'X0' || exposure === 'XC1'
  const carbonation = /^XC[234]$/.test(exposure)
  if (tendons !== 'bonded') {
    // reinforced members and members with unbonded tendons, quasi-permanent combination
    return { wmax: dry ? 0.4 : 0.3, combination: 'quasi-permanent', decompression: null, note: dry ? 'Table 7.1N note 1: for appearance only' : 'Table 7.1N' }
  }
  if (dry) return { wmax: 0.2, combination: 'frequent', decompression: null, note: 'Table 7.1N, bonded tendons' }
  if (carbonation) return { wmax: 0.2, combination: 'frequent', decompression: 'quasi-permanent', note: 'Table 7.1N note 2: decompression under the quasi-permanent combination as well' }
  return { wmax: null, combination: 'frequent', decompression: 'frequent', note: 'Table 7.1N: decompression under the frequent combination' }
}

/** ξ of Table 6.2 for bonded post-tensioned strands: 0.5 up to C50/60, 0.25 from C70/85 (linear between). */
export function bondRatioStrand(fck: number): number {
  if (fck <= 50) return 0.5 // EN 1992-1-1 Table 6.2
  if (fck >= 70) return 0.25 // EN 1992-1-1 Table 6.2
  return 0.5 - (0.25 * (fck - 50)) / 20 // linear between the two columns (interpolation, common practice)
}

export interface CrackWidthInput {
  /** stress in the tension bars of the cracked section, or Δσp where only tendons are bonded, MPa */
  sigmaS: number
  /** default 200 000 MPa */
  Es?: number
  Ecm: number
  /** fct,eff = fctm (7.3.2(2)) at the age of cracking */
  fctEff: number
  /** 'long' kt = 0.4, 'short' kt = 0.6 (7.3.4(2)) */
  duration: 'long' | 'short'
  /** bonded bars inside Ac,eff, mm² */
  As: number
  /** bar diameter, mm (needed when As > 0) */
  phiS?: number
  /** bonded tendons inside Ac,eff, mm² */
  Ap: number
  /** equivalent tendon diameter φp, mm: 1.6√Ap for a bundle, 1.75 φwire for a single 7-wire strand (6.8.2) */
  phiP?: number
  fck: number
  /** width of the tension zone, mm */
  b: number
  h: number
  /** effective depth of the bonded steel, mm */
  d: number
  /** neutral-axis depth of the cracked section, mm */
  x: number
  /** cover to the longitudinal bonded steel, mm */
  c: number
  /** centre spacing of the bonded steel; above 5(c + φ/2) eq. (7.14) applies, mm */
  spacing?: number
  /** 0.5 bending (default), 1.0 pure tension (7.3.4(3)) */
  k2?: number
}

export interface CrackWidthResult {
  hcEff: number
  AcEff: number
  xi1: number
  rhoPEff: number
  kt: number
  k1: number
  phi: number
  /** εsm − εcm, eq. (7.9) */
  strainDifference: number
  srMax: number
  /** true where the wide-spacing rule (7.14) gave sr,max */
  wideSpacing: boolean
  wk: number
}

export function crackWidth(i: CrackWidthInput): CrackWidthResult {
  requireNonNegative('sigmaS', i.sigmaS)
  const Es = requirePositive('Es', i.Es ?? 200000)
  requirePositive('Ecm', i.Ecm)
  requirePositive('fctEff', i.fctEff)
  requireNonNegative('As', i.As)
  requireNonNegative('Ap', i.Ap)
  if (i.As === 0 && i.Ap === 0) throw new EngineInputError('As', 'give the bonded steel in the tension zone')
  if (i.As > 0) requirePositive('phiS', i.phiS ?? NaN)
  if (i.Ap > 0) requirePositive('phiP', i.phiP ?? NaN)
  requireRange('fck', i.fck, 12, 90, 'fck must lie between 12 and 90 MPa (EN 1992-1-1 Table 3.1)')
  requirePositive('b', i.b)
  requirePositive('h', i.h)
  requireRange('d', i.d, 0, i.h, 'the effective depth must lie within the section depth')
  requireRange('x', i.x, 0, i.d, 'the neutral axis must lie above the bonded steel')
  requireNonNegative('c', i.c)
  if (i.spacing !== undefined) requirePositive('spacing', i.spacing)
  const hcEff = Math.min(2.5 * (i.h - i.d), (i.h - i.x) / 3, i.h / 2) // EN 1992-1-1 7.3.2(3)
  const AcEff = hcEff * i.b
  const xi = bondRatioStrand(i.fck)
  const xi1 = i.As > 0 && i.Ap > 0 ? Math.sqrt((xi * (i.phiS as number)) / (i.phiP as number)) : Math.sqrt(xi) // EN 1992-1-1 eq. (7.5); √ξ with tendons alone
  const rhoPEff = (i.As + xi1 * xi1 * i.Ap) / AcEff // EN 1992-1-1 eq. (7.10)
  const kt = i.duration === 'long' ? 0.4 : 0.6 // 7.3.4(2)
  const alphaE = Es / i.Ecm
  const strainDifference = Math.max(
    (i.sigmaS - ((kt * i.fctEff) / rhoPEff) * (1 + alphaE * rhoPEff)) / Es, // EN 1992-1-1 eq. (7.9)
    (0.6 * i.sigmaS) / Es, // eq. (7.9) lower bound
  )
  const barsGovern = i.As > 0
  const k1 = barsGovern ? 0.8 : 1.6 // 7.3.4(3): 0.8 high-bond bars, 1.6 effectively plain surface (tendons)
  const phi = barsGovern ? (i.phiS as number) : (i.phiP as number)
  const k2 = i.k2 ?? 0.5
  const wideSpacing = i.spacing !== undefined && i.spacing > 5 * (i.c + phi / 2) // 7.3.4(3)
  const srMax = wideSpacing
    ? 1.3 * (i.h - i.x) // EN 1992-1-1 eq. (7.14)
    : 3.4 * i.c + (k1 * k2 * 0.425 * phi) / rhoPEff // EN 1992-1-1 eq. (7.11), k3 = 3.4, k4 = 0.425
  return { hcEff, AcEff, xi1, rhoPEff, kt, k1, phi, strainDifference, srMax, wideSpacing, wk: srMax * strainDifference } // EN 1992-1-1 eq. (7.8)
}

export interface DecompressionInput {
  /** fibre stresses under the combination, compression +, MPa */
  sigmaTop: number
  sigmaBottom: number
  h: number
  /** depth of the tendon centroid below the top fibre, mm */
  tendonDepth: number
  /** vertical size of the duct (or tendon), mm */
  ductHeight: number
  /** 25 mm recommended (7.3.1(5) note) */
  margin?: number
}

export interface DecompressionResult {
  /** depth below the top fibre where the stress is checked, mm */
  level: number
  /** concrete stress there, compression +, MPa */
  stress: number
  pass: boolean
}

/** Decompression, 7.3.1(5): the duct and 25 mm beyond it towards the tension face stay in compression. */
export function decompressionCheck(i: DecompressionInput): DecompressionResult {
  requirePositive('h', i.h)
  requireRange('tendonDepth', i.tendonDepth, 0, i.h, 'the tendon must lie within the section')
  requireNonNegative('ductHeight', i.ductHeight)
  if (!Number.isFinite(i.sigmaTop)) throw new EngineInputError('sigmaTop', 'must be a finite number')
  if (!Number.isFinite(i.sigmaBottom)) throw new EngineInputError('sigmaBottom', 'must be a finite number')
  const margin = i.margin ?? 25 // 7.3.1(5) note: 25 mm recommended
  const towardsBottom = i.sigmaBottom <= i.sigmaTop
  const reach = i.ductHeight / 2 + margin
  const level = Math.min(i.h, Math.max(0, i.tendonDepth + (towardsBottom ? reach : -reach)))
  const stress = i.sigmaTop + ((i.sigmaBottom - i.sigmaTop) * level) / i.h // linear over the depth
  return { level, stress, pass: stress >= 0 }
}
