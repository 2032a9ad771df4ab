/**
 * Fibre stresses of an uncracked prestressed section and the stress limits of EN 1992-1-1
 * 5.10.2.2 and 7.2, with the tension limits after 7.1(2) and Table 7.1N.
 * Compression positive; e positive below the centroid; M sagging positive; tension limits are
 * positive magnitudes.
 */
export interface FibreStresses {
  top: number
  bottom: number
}

/** σ = P/A ∓ P·e/Z ± M/Z (engineering bending theory; Zt, Zb as positive moduli). */
export function fibreStresses(i: { A: number; Zt: number; Zb: number; P: number; e: number; M: number }): FibreStresses {
  return {
    top: i.P / i.A - (i.P * i.e) / i.Zt + i.M / i.Zt, // top fibre, compression +
    bottom: i.P / i.A + (i.P * i.e) / i.Zb - i.M / i.Zb, // bottom fibre, compression +
  }
}

export type ExposureClass =
  | 'X0' | 'XC1' | 'XC2' | 'XC3' | 'XC4' | 'XD1' | 'XD2' | 'XD3' | 'XS1' | 'XS2' | 'XS3'

export const EXPOSURE_CLASSES: readonly ExposureClass[] = ['X0', 'XC1', 'XC2', 'XC3', 'XC4', 'XD1', 'XD2', 'XD3', 'XS1', 'XS2', 'XS3']

export type ServiceCombination = 'characteristic' | 'frequent' | 'quasiPermanent'

export interface TensionRule {
  combination: ServiceCombination
  /** 'decompression' → no tension at all; 'uncracked' → tension ≤ fct,eff */
  kind: 'decompression' | 'uncracked'
  clause: string
}

/**
 * Service tension rules by exposure and bond (EN 1992-1-1 Table 7.1N, recommended values):
 * bonded XC2–XC4 decompression under quasi-permanent, XD/XS under frequent; otherwise the member is
 * kept uncracked (7.1(2)) under the combination for which Table 7.1N gives wmax, beyond which a crack
 * width calculation (7.3.4) applies.
 */
export function tensionRules(exposure: ExposureClass, bonded: boolean): TensionRule[] {
  if (!bonded) return [{ combination: 'quasiPermanent', kind: 'uncracked', clause: 'EN 1992-1-1 7.1(2), Table 7.1N' }]
  const rules: TensionRule[] = [{ combination: 'frequent', kind: 'uncracked', clause: 'EN 1992-1-1 7.1(2), Table 7.1N' }]
  if (exposure === 'XC2' || exposure === 'XC3' || exposure === 'XC4') {
    rules.push({ combination: 'quasiPermanent', kind: 'decompression', clause: 'EN 1992-1-1 Table 7.1N (decompression)' })
  }
  if (exposure.startsWith('XD') || exposure.startsWith('XS')) {
    rules[0] = { combination: 'frequent', kind: 'decompression', clause: 'EN 1992-1-1 Table 7.1N (decompression)' }
  }
  return rules
}

/** Utilisation of a compression check: σ / limit (0 when in tension). */
export function compressionUtilisation(sigma: number, limit: number): number {
  return limit > 0 ? Math.max(0, sigma) / limit : sigma > 0 ? Infinity : 0
}

/**
 * Utilisation of a tension check: tension / limit. With a zero limit (decompression) a fibre in
 * compression scores 0 and one in tension 1 + tension/fref, so that any tension fails.
 */
export function tensionUtilisation(sigma: number, limit: number, fref: number): number {
  const tension = Math.max(0, -sigma)
  if (limit > 0) return tension / limit
  return tension > 1e-9 ? 1 + tension / fref : 0
}
