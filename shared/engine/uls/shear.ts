/**
 * Shear resistance at the ultimate limit state, EN 1992-1-1 6.2: members without shear
 * reinforcement with the precompression (6.2.2(1), eqs. (6.2.a/b)), the uncracked-in-flexure case
 * (6.2.2(2), eq. (6.4)), and vertical links by the variable strut-inclination method (6.2.3) with
 * αcw for prestressed members and the web width reduced for ducts (6.2.3(6)).
 * N, mm, MPa; σcp positive in compression.
 */
import { EngineInputError } from '../contract'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'

export type DuctKind = 'grouted-metal' | 'grouted-plastic' | 'unbonded'

export interface ShearInput {
  /** design shear force (magnitude), N */
  VEd: number
  /** smallest web width in the tension area, mm */
  bw: number
  /** effective depth, mm */
  d: number
  fck: number
  /** bonded tension steel extending ≥ lbd + d beyond the section, mm² (6.2.2(1)) */
  Asl: number
  /** axial force from prestress and loading (compression +), N */
  NEd: number
  /** gross concrete area, mm² */
  Ac: number
  gammaC?: number
  /** CRd,c = 0.18/γc recommended (6.2.2(1) note) */
  CRdc?: number
  /** 0.15 recommended (6.2.2(1) note) */
  k1?: number
  /** 1.0 recommended (3.1.6(1)) */
  alphaCC?: number
  /** uncracked in flexure (6.2.2(2)): second moment I, first moment S above the centroid and the width there */
  uncracked?: { I: number; S: number; bwCentroid: number; fctk005: number; alphaL?: number }
  /** links and ducts (6.2.3) */
  links?: {
    fywk?: number
    gammaS?: number
    /** limits of cot θ (6.2.3(2) note: 1 ≤ cot θ ≤ 2.5) */
    cotThetaMax?: number
    /** lever arm, default 0.9 d (6.2.3(1)) */
    z?: number
    /** sum of duct diameters at the most unfavourable level, mm (6.2.3(6)) */
    ductDiameterSum?: number
    ductKind?: DuctKind
  }
}

export interface ShearResult {
  k: number
  rhoL: number
  sigmaCp: number
  vmin: number
  /** eq. (6.2.a) value, N */
  VRdcFormula: number
  /** eq. (6.2.b) lower bound, N */
  VRdcMin: number
  VRdc: number
  /** eq. (6.4), when the uncracked data are given, N */
  VRdcUncracked: number | null
  /** the resistance without shear reinforcement used for the check (the larger where the region is uncracked) */
  VRdcGoverning: number
  utilisationConcrete: number
  linksNeeded: boolean
  links: {
    bwNom: number
    z: number
    nu1: number
    alphaCw: number
    cotTheta: number
    VRdMax: number
    /** required Asw/s, mm²/mm, at least the minimum of 9.2.2(5) */
    AswPerS: number
    AswPerSMin: number
    /** VEd / VRd,max at the chosen angle */
    utilisationStrut: number
  } | null
}

function validate(i: ShearInput): void {
  requireNonNegative('VEd', i.VEd)
  requirePositive('bw', i.bw)
  requirePositive('d', i.d)
  requireRange('fck', i.fck, 12, 90, 'fck must lie between 12 and 90 MPa (EN 1992-1-1 Table 3.1)')
  requireNonNegative('Asl', i.Asl)
  if (!Number.isFinite(i.NEd)) throw new EngineInputError('NEd', 'must be a finite number')
  requirePositive('Ac', i.Ac)
  if (i.gammaC !== undefined) requireRange('gammaC', i.gammaC, 1, 2, 'γc must lie between 1.0 and 2.0')
  if (i.CRdc !== undefined) requirePositive('CRdc', i.CRdc)
  if (i.k1 !== undefined) requireNonNegative('k1', i.k1)
  if (i.uncracked) {
    requirePositive('uncracked.I', i.uncracked.I)
    requirePositive('uncracked.S', i.uncracked.S)
    requirePositive('uncracked.bwCentroid', i.uncracked.bwCentroid)
    requirePositive('uncracked.fctk005', i.uncracked.fctk005)
    if (i.uncracked.alphaL !== undefined) requireRange('uncracked.alphaL', i.uncracked.alphaL, 0, 1, 'αl must lie between 0 and 1')
  }
  if (i.links) {
    if (i.links.fywk !== undefined) requireRange('links.fywk', i.links.fywk, 200, 700, 'fywk must lie between 200 and 700 MPa')
    if (i.links.cotThetaMax !== undefined) requireRange('links.cotThetaMax', i.links.cotThetaMax, 1, 2.5, 'cot θ must lie between 1 and 2.5 (6.2.3(2))')
    if (i.links.z !== undefined) requirePositive('links.z', i.links.z)
    if (i.links.ductDiameterSum !== undefined) {
      requireNonNegative('links.ductDiameterSum', i.links.ductDiameterSum)
      if (i.links.ductDiameterSum >= i.bw) throw new EngineInputError('links.ductDiameterSum', 'the ducts are wider than the web')
    }
  }
}

/** αcw for prestressed members, EN 1992-1-1 eq. (6.11aN) and the two following lines. */
export function alphaCw(sigmaCp: number, fcd: number): number {
  if (sigmaCp <= 0) return 1 // non-prestressed or in tension
  if (sigmaCp <= 0.25 * fcd) return 1 + sigmaCp / fcd // (6.11.aN)
  if (sigmaCp <= 0.5 * fcd) return 1.25 // (6.11.bN)
  return Math.max(0, 2.5 * (1 - sigmaCp / fcd)) // (6.11.cN)
}

/** Nominal web width with ducts, EN 1992-1-1 6.2.3(6), eqs. (6.16), (6.17). */
export function nominalWebWidth(bw: number, ductSum: number, kind: DuctKind): number {
  if (kind === 'grouted-metal') return ductSum > bw / 8 ? bw - 0.5 * ductSum : bw // eq. (6.16)
  return bw - 1.2 * ductSum // eq. (6.17): plastic ducts and unbonded tendons
}

export function shearResistance(i: ShearInput): ShearResult {
  validate(i)
  const gammaC = i.gammaC ?? 1.5
  const fcd = ((i.alphaCC ?? 1.0) * i.fck) / gammaC // EN 1992-1-1 eq. (3.15)
  const CRdc = i.CRdc ?? 0.18 / gammaC // 6.2.2(1) note: CRd,c = 0.18/γc
  const k1 = i.k1 ?? 0.15 // 6.2.2(1) note
  const k = Math.min(2, 1 + Math.sqrt(200 / i.d)) // EN 1992-1-1 6.2.2(1): k = 1 + √(200/d) ≤ 2.0
  const rhoL = Math.min(0.02, i.Asl / (i.bw * i.d)) // 6.2.2(1): ρl = Asl/(bw d) ≤ 0.02
  const sigmaCp = Math.min(i.NEd / i.Ac, 0.2 * fcd) // 6.2.2(1): σcp = NEd/Ac < 0.2 fcd
  const vmin = 0.035 * k ** 1.5 * Math.sqrt(i.fck) // EN 1992-1-1 eq. (6.3N)
  const VRdcFormula = (CRdc * k * (100 * rhoL * i.fck) ** (1 / 3) + k1 * sigmaCp) * i.bw * i.d // eq. (6.2.a)
  const VRdcMin = (vmin + k1 * sigmaCp) * i.bw * i.d // eq. (6.2.b)
  const VRdc = Math.max(0, VRdcFormula, VRdcMin)
  let VRdcUncracked: number | null = null
  if (i.uncracked) {
    const u = i.uncracked
    const fctd = u.fctk005 / gammaC // 3.1.6(2) with αct = 1.0
    const alphaL = u.alphaL ?? 1 // 6.2.2(2): αl = 1.0 for post-tensioning
    const under = fctd * fctd + alphaL * Math.max(0, i.NEd / i.Ac) * fctd
    VRdcUncracked = ((u.I * u.bwCentroid) / u.S) * Math.sqrt(under) // EN 1992-1-1 eq. (6.4)
  }
  const VRdcGoverning = Math.max(VRdc, VRdcUncracked ?? 0)
  const utilisationConcrete = VRdcGoverning > 0 ? i.VEd / VRdcGoverning : 0
  const linksNeeded = i.VEd > VRdcGoverning
  let links: ShearResult['links'] = null
  if (i.links || linksNeeded) {
    const l = i.links ?? {}
    const fywk = l.fywk ?? 500
    const fywd = fywk / (l.gammaS ?? 1.15) // 3.2.7(2)
    const z = l.z ?? 0.9 * i.d // 6.2.3(1): z = 0.9 d
    const bwNom = nominalWebWidth(i.bw, l.ductDiameterSum ?? 0, l.ductKind ?? 'grouted-plastic')
    const nu1 = 0.6 * (1 - i.fck / 250) // EN 1992-1-1 eq. (6.6N), ν1 = ν (6.2.3(3) note 1)
    const aCw = alphaCw(i.NEd / i.Ac, fcd)
    const VRdMaxAt = (c: number): number => (aCw * bwNom * z * nu1 * fcd) / (c + 1 / c) // EN 1992-1-1 eq. (6.9)
    const cotMax = l.cotThetaMax ?? 2.5
    // the flattest strut the web can carry: VRd,max falls as cot θ rises above 1
    let cotTheta = cotMax
    if (VRdMaxAt(cotMax) < i.VEd) {
      const ratio = (aCw * bwNom * z * nu1 * fcd) / Math.max(i.VEd, 1e-9) // cot θ + tan θ = ratio
      cotTheta = ratio >= 2 ? Math.max(1, (ratio + Math.sqrt(ratio * ratio - 4)) / 2) : 1
    }
    const VRdMax = VRdMaxAt(cotTheta)
    const AswPerSMin = ((0.08 * Math.sqrt(i.fck)) / fywk) * i.bw // EN 1992-1-1 eq. (9.5N), α = 90°
    const AswPerS = Math.max(AswPerSMin, i.VEd / (z * fywd * cotTheta)) // from eq. (6.8)
    links = { bwNom, z, nu1, alphaCw: aCw, cotTheta, VRdMax, AswPerS, AswPerSMin, utilisationStrut: VRdMax > 0 ? i.VEd / VRdMax : 1e9 }
  }
  return { k, rhoL, sigmaCp, vmin, VRdcFormula, VRdcMin, VRdc, VRdcUncracked, VRdcGoverning, utilisationConcrete, linksNeeded, links }
}
