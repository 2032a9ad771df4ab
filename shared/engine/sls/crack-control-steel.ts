/**
 * Minimum reinforcement for crack control, EN 1992-1-1 7.3.2, and the tables that limit crack
 * widths without calculating them, 7.3.3: Table 7.2N (maximum bar diameter) with the bar-size
 * correction eqs. (7.6N)/(7.7N), and Table 7.3N (maximum bar spacing). Recommended values; the
 * table entries are transcribed from memory of EN 1992-1-1:2004 and should be checked against the
 * standard (and its national annex). N, mm, MPa; compression positive for NEd and σc.
 */
import { EngineInputError } from '../contract'
import { requireFinite, requireNonNegative, requirePositive } from '../common/guards'

/** k of 7.3.2(2): 1.0 up to 300 mm, 0.65 from 800 mm, linear between (web depth or flange width). */
export function crackSizeFactor(dimension: number): number {
  requirePositive('h', dimension)
  if (dimension <= 300) return 1.0 // EN 1992-1-1 7.3.2(2)
  if (dimension >= 800) return 0.65 // EN 1992-1-1 7.3.2(2)
  return 1.0 - (0.35 * (dimension - 300)) / 500 // EN 1992-1-1 7.3.2(2): intermediate values interpolated
}

export interface WebStressInput {
  /** width and depth of the part considered (rectangular section or web), mm */
  b: number
  h: number
  /** axial force on that part at SLS, characteristic prestress included, N, compression + */
  NEd: number
  fctEff: number
}

/** kc for rectangular sections and webs, eq. (7.2), within 0…1. */
export function kcWeb(i: WebStressInput): number {
  requirePositive('b', i.b)
  requirePositive('h', i.h)
  requireFinite('NEd', i.NEd)
  requirePositive('fctEff', i.fctEff)
  const hStar = Math.min(i.h, 1000) // EN 1992-1-1 7.3.2(2): h* = h below 1.0 m, 1.0 m above
  const k1 = i.NEd >= 0 ? 1.5 : (2 * hStar) / (3 * i.h) // EN 1992-1-1 7.3.2(2): 1.5 compressive, 2h*/3h tensile
  const sigmaC = i.NEd / (i.b * i.h) // EN 1992-1-1 eq. (7.4)
  const kc = 0.4 * (1 - sigmaC / (k1 * (i.h / hStar) * i.fctEff)) // EN 1992-1-1 eq. (7.2)
  return Math.min(1, Math.max(0, kc)) // ≤ 1 by eq. (7.2); a precompression above the cracking level needs no steel (kc ≥ 0)
}

/** kc for flanges of box and T sections, eq. (7.3): 0.9·Fcr/(Act·fct,eff) ≥ 0.5. */
export function kcFlange(i: { Fcr: number; Act: number; fctEff: number }): number {
  requireNonNegative('Fcr', i.Fcr)
  requirePositive('Act', i.Act)
  requirePositive('fctEff', i.fctEff)
  return Math.max(0.5, (0.9 * i.Fcr) / (i.Act * i.fctEff)) // EN 1992-1-1 eq. (7.3)
}

/**
 * Depth of the tensile zone of a rectangular section just before cracking under bending with a
 * mean precompression σc (Navier: tension fct,eff at one face, mean −σc at mid-depth):
 * hcr = (h/2)·fct,eff/(fct,eff + σc); h/2 in pure bending. Also the hcr of eqs. (7.6N)/(7.7N).
 */
export function tensileDepthAtCracking(i: { h: number; fctEff: number; sigmaC: number }): number {
  requirePositive('h', i.h)
  requirePositive('fctEff', i.fctEff)
  requireFinite('sigmaC', i.sigmaC)
  if (i.sigmaC <= -i.fctEff) return i.h // the whole section is in tension before it cracks
  return Math.min(i.h, ((i.h / 2) * i.fctEff) / (i.fctEff + i.sigmaC)) // linear stress: fct at the face, −σc at h/2
}

/** Table 6.2 bond ratio ξ, bonded post-tensioned tendons (recommended values, from memory). */
export type TendonBondKind = 'smooth bars and wires' | 'strands' | 'indented wires' | 'ribbed bars'

export function bondRatioPostTensioned(kind: TendonBondKind, fck: number): number {
  requirePositive('fck', fck)
  const upTo50: Record<TendonBondKind, number> = { 'smooth bars and wires': 0.3, strands: 0.5, 'indented wires': 0.6, 'ribbed bars': 0.7 } // EN 1992-1-1 Table 6.2, ≤ C50/60
  const from70: Record<TendonBondKind, number> = { 'smooth bars and wires': 0.15, strands: 0.25, 'indented wires': 0.3, 'ribbed bars': 0.35 } // EN 1992-1-1 Table 6.2, ≥ C70/85
  const lo = upTo50[kind]
  const hi = from70[kind]
  if (lo === undefined || hi === undefined) throw new EngineInputError('kind', 'smooth bars and wires, strands, indented wires or ribbed bars')
  if (fck <= 50) return lo
  if (fck >= 70) return hi
  return lo + ((hi - lo) * (fck - 50)) / 20 // between the two columns, linear (common practice)
}

/** Equivalent tendon diameter φp of 7.3.2(3): 1.6·√Ap for bundles, 1.75·φwire for a 7-wire strand, 1.20·φwire for a 3-wire strand. */
export function tendonEquivalentDiameter(t: { kind: 'bundle'; Ap: number } | { kind: '7-wire strand' | '3-wire strand'; wireDiameter: number }): number {
  if (t.kind === 'bundle') return 1.6 * Math.sqrt(requirePositive('Ap', t.Ap)) // EN 1992-1-1 7.3.2(3)
  if (t.kind === '7-wire strand') return 1.75 * requirePositive('wireDiameter', t.wireDiameter) // EN 1992-1-1 7.3.2(3)
  if (t.kind === '3-wire strand') return 1.2 * requirePositive('wireDiameter', t.wireDiameter) // EN 1992-1-1 7.3.2(3)
  throw new EngineInputError('kind', 'bundle, 7-wire strand or 3-wire strand')
}

/** ξ1 = √(ξ·φs/φp), eq. (7.5); √ξ where only prestressing steel controls cracking (φs omitted). */
export function bondAdjustedRatio(i: { xi: number; phiP: number; phiS?: number }): number {
  requirePositive('xi', i.xi)
  requirePositive('phiP', i.phiP)
  if (i.phiS === undefined) return Math.sqrt(i.xi) // EN 1992-1-1 7.3.2(3): only prestressing steel
  return Math.sqrt((i.xi * requirePositive('phiS', i.phiS)) / i.phiP) // EN 1992-1-1 eq. (7.5)
}

export type CrackStressState =
  | { kind: 'tension' }
  | ({ kind: 'web' } & Omit<WebStressInput, 'fctEff'>)
  | { kind: 'flange'; Fcr: number }

export interface MinimumCrackSteelInput {
  /** concrete in the tensile zone just before the first crack, mm² */
  Act: number
  /** fct,eff = fctm, or fctm(t) where cracking is expected before 28 days (7.3.2(2)), MPa */
  fctEff: number
  /** steel stress allowed just after cracking: fyk, or less to meet Table 7.2N/7.3N, MPa */
  sigmaS: number
  /** web depth or flange width for k, mm */
  kDimension: number
  stress: CrackStressState
  /** bonded tendons within 150 mm of the reinforcement (7.3.2(3)) */
  tendons?: {
    /** Ap' inside Ac,eff, mm² */
    ApPrime: number
    /** stress change in the tendons from zero concrete strain at their level, MPa */
    deltaSigmaP: number
    /** ξ of Table 6.2 */
    xi: number
    /** equivalent tendon diameter, mm */
    phiP: number
    /** largest bar diameter, mm; omit where only tendons control cracking */
    phiS?: number
  }
  /** concrete tension under the characteristic combination with characteristic prestress, MPa (tension +); 7.3.2(4) */
  sigmaCtCharacteristic?: number
  /** σct,p of 7.3.2(4), recommended fct,eff */
  sigmaCtP?: number
}

export interface MinimumCrackSteel {
  /** As,min, mm² (0 where 7.3.2(4) waives it or the tendons suffice) */
  AsMin: number
  required: boolean
  kc: number
  k: number
  /** ξ1 of eq. (7.5), null without tendons */
  xi1: number | null
  /** kc·k·fct,eff·Act, N */
  crackingForce: number
  /** ξ1·Ap'·Δσp, N */
  tendonForce: number
  clause: string
}

/** As,min·σs + ξ1·Ap'·Δσp = kc·k·fct,eff·Act, EN 1992-1-1 eq. (7.1) with 7.3.2(3); waived by 7.3.2(4). */
export function minimumCrackSteel(i: MinimumCrackSteelInput): MinimumCrackSteel {
  requirePositive('Act', i.Act)
  requirePositive('fctEff', i.fctEff)
  requirePositive('sigmaS', i.sigmaS)
  const k = crackSizeFactor(i.kDimension)
  let kc: number
  if (i.stress.kind === 'tension') kc = 1.0 // EN 1992-1-1 7.3.2(2): pure tension
  else if (i.stress.kind === 'web') kc = kcWeb({ b: i.stress.b, h: i.stress.h, NEd: i.stress.NEd, fctEff: i.fctEff })
  else if (i.stress.kind === 'flange') kc = kcFlange({ Fcr: i.stress.Fcr, Act: i.Act, fctEff: i.fctEff })
  else throw new EngineInputError('stress.kind', 'tension, web or flange')
  let xi1: number | null = null
  let tendonForce = 0
  if (i.tendons) {
    const t = i.tendons
    requireNonNegative('tendons.ApPrime', t.ApPrime)
    requireNonNegative('tendons.deltaSigmaP', t.deltaSigmaP)
    xi1 = bondAdjustedRatio({ xi: t.xi, phiP: t.phiP, phiS: t.phiS })
    tendonForce = xi1 * t.ApPrime * t.deltaSigmaP // EN 1992-1-1 7.3.2(3): ξ1·Ap'·Δσp
  }
  const crackingForce = kc * k * i.fctEff * i.Act // EN 1992-1-1 eq. (7.1), right-hand side
  if (i.sigmaCtCharacteristic !== undefined) {
    requireFinite('sigmaCtCharacteristic', i.sigmaCtCharacteristic)
    const limit = i.sigmaCtP ?? i.fctEff // EN 1992-1-1 7.3.2(4): σct,p = fct,eff recommended
    requirePositive('sigmaCtP', limit)
    if (i.sigmaCtCharacteristic <= limit) {
      return { AsMin: 0, required: false, kc, k, xi1, crackingForce, tendonForce, clause: 'EN 1992-1-1 7.3.2(4): tension under the characteristic combination within σct,p' }
    }
  }
  const AsMin = Math.max(0, (crackingForce - tendonForce) / i.sigmaS) // EN 1992-1-1 eq. (7.1) with 7.3.2(3)
  return { AsMin, required: true, kc, k, xi1, crackingForce, tendonForce, clause: i.tendons ? 'EN 1992-1-1 eq. (7.1), 7.3.2(3)' : 'EN 1992-1-1 eq. (7.1)' }
}

export type CrackWidthColumn = 0.4 | 0.3 | 0.2

/** Steel stress rows of Tables 7.2N and 7.3N, MPa. */
const STRESS_7_2 = [160, 200, 240, 280, 320, 360, 400, 450]
/** EN 1992-1-1 Table 7.2N, maximum bar diameter φ*s, mm (from memory); null = no entry. */
const TABLE_7_2N: Record<CrackWidthColumn, Array<number | null>> = {
  0.4: [40, 32, 20, 16, 12, 10, 8, 6],
  0.3: [32, 25, 16, 12, 10, 8, 6, 5],
  0.2: [25, 16, 12, 8, 6, 5, 4, null],
}
const STRESS_7_3 = [160, 200, 240, 280, 320, 360]
/** EN 1992-1-1 Table 7.3N, maximum bar spacing, mm (from memory); null = no entry. */
const TABLE_7_3N: Record<CrackWidthColumn, Array<number | null>> = {
  0.4: [300, 300, 250, 200, 150, 100],
  0.3: [300, 250, 200, 150, 100, 50],
  0.2: [200, 150, 100, 50, null, null],
}

/** Linear interpolation in steel stress (common practice); below the first row the first row applies; null beyond the table. */
function lookUp(rows: number[], values: Array<number | null>, sigmaS: number): number | null {
  const first = rows[0] as number
  if (sigmaS <= first) return values[0] ?? null
  for (let j = 1; j < rows.length; j++) {
    const hi = rows[j] as number
    if (sigmaS <= hi) {
      const a = values[j - 1]
      const b = values[j]
      if (a === null || a === undefined || b === null || b === undefined) return sigmaS === hi && b !== undefined ? b : null
      const lo = rows[j - 1] as number
      return a + ((b - a) * (sigmaS - lo)) / (hi - lo) // between rows, linear (common practice)
    }
  }
  return null
}

function column(wk: number): CrackWidthColumn {
  if (wk !== 0.4 && wk !== 0.3 && wk !== 0.2) throw new EngineInputError('wk', 'Tables 7.2N and 7.3N give columns for wk = 0.4, 0.3 and 0.2 mm')
  return wk
}

/** φ*s of Table 7.2N for the steel stress σs and the crack width wk; null where the table has no entry. */
export function maxBarDiameterTable(i: { sigmaS: number; wk: number }): number | null {
  requirePositive('sigmaS', i.sigmaS)
  return lookUp(STRESS_7_2, TABLE_7_2N[column(i.wk)], i.sigmaS) // EN 1992-1-1 Table 7.2N
}

/**
 * Table 7.2N read the other way: the greatest steel stress at which bars of φ*s are allowed (linear
 * between rows, common practice); beyondTable where the bars are larger than even its least stress allows.
 */
export function steelStressForBarSize(i: { phiStar: number; wk: number }): { sigmaS: number; beyondTable: boolean } {
  requirePositive('phiStar', i.phiStar)
  const values = TABLE_7_2N[column(i.wk)] // EN 1992-1-1 Table 7.2N
  if (i.phiStar > (values[0] as number)) return { sigmaS: STRESS_7_2[0] as number, beyondTable: true }
  for (let j = 1; j < STRESS_7_2.length; j++) {
    const a = values[j - 1] as number
    const b = values[j]
    const lo = STRESS_7_2[j - 1] as number
    if (b === null || b === undefined) return { sigmaS: lo, beyondTable: false }
    const hi = STRESS_7_2[j] as number
    if (i.phiStar >= b) return { sigmaS: a === b ? hi : lo + ((a - i.phiStar) * (hi - lo)) / (a - b), beyondTable: false }
  }
  return { sigmaS: STRESS_7_2[STRESS_7_2.length - 1] as number, beyondTable: false }
}

/** Largest bar spacing of Table 7.3N (cracks mainly due to loading); null where the table has no entry. */
export function maxBarSpacing(i: { sigmaS: number; wk: number }): number | null {
  requirePositive('sigmaS', i.sigmaS)
  return lookUp(STRESS_7_3, TABLE_7_3N[column(i.wk)], i.sigmaS) // EN 1992-1-1 Table 7.3N
}

/**
 * Largest bar diameter φs from φ*s: bending (part of the section in compression)
 * φs = φ*s·(fct,eff/2.9)·kc·hcr/(2(h − d)), eq. (7.6N); tension φs = φ*s·(fct,eff/2.9)·hcr/(8(h − d)), eq. (7.7N).
 */
export function maxBarDiameter(i: { phiStar: number; fctEff: number; hcr: number; h: number; d: number; loading: 'bending'; kc: number } | { phiStar: number; fctEff: number; hcr: number; h: number; d: number; loading: 'tension' }): number {
  requirePositive('phiStar', i.phiStar)
  requirePositive('fctEff', i.fctEff)
  requirePositive('hcr', i.hcr)
  requirePositive('h', i.h)
  requirePositive('d', i.d)
  if (!(i.d < i.h)) throw new EngineInputError('d', 'the effective depth must be less than h')
  if (i.loading === 'bending') {
    requireNonNegative('kc', i.kc)
    return (i.phiStar * (i.fctEff / 2.9) * i.kc * i.hcr) / (2 * (i.h - i.d)) // EN 1992-1-1 eq. (7.6N)
  }
  if (i.loading === 'tension') return (i.phiStar * (i.fctEff / 2.9) * i.hcr) / (8 * (i.h - i.d)) // EN 1992-1-1 eq. (7.7N)
  throw new EngineInputError('loading', 'bending or tension')
}
