/**
 * Creep coefficient (EN 1992-1-1 Annex B.1) and shrinkage strain (3.1.4, Annex B.2).
 * Ages in days, RH in %, notional size h0 = 2Ac/u in mm.
 */
import { EngineInputError } from '../contract'
import type { CementClass } from './concrete'

export interface CreepInput {
  fck: number
  RH: number
  h0: number
  t0: number
  t: number
  cement: CementClass
}

function guard(field: string, ok: boolean, message: string): void {
  if (!ok) throw new EngineInputError(field, message)
}

function checkCommon(i: { fck: number; RH: number; h0: number }): void {
  guard('fck', Number.isFinite(i.fck) && i.fck >= 12 && i.fck <= 90, 'fck must lie between 12 and 90 MPa')
  guard('RH', Number.isFinite(i.RH) && i.RH >= 20 && i.RH <= 100, 'relative humidity must lie between 20 and 100 %')
  guard('h0', Number.isFinite(i.h0) && i.h0 > 0, 'notional size h0 must be positive')
}

/** Creep coefficient φ(t, t0) of EN 1992-1-1 Annex B eq. (B.1). */
export function creepCoefficient(i: CreepInput): number {
  checkCommon(i)
  guard('t0', Number.isFinite(i.t0) && i.t0 > 0, 'age at loading must be positive')
  guard('t', Number.isFinite(i.t) && i.t >= i.t0, 'age t must not be less than the age at loading t0')
  const fcm = i.fck + 8 // EN 1992-1-1 Table 3.1
  const a1 = Math.min(1, (35 / fcm) ** 0.7) // EN 1992-1-1 eq. (B.8c)
  const a2 = Math.min(1, (35 / fcm) ** 0.2) // EN 1992-1-1 eq. (B.8c)
  const a3 = Math.min(1, (35 / fcm) ** 0.5) // EN 1992-1-1 eq. (B.8c)
  const phiRH = fcm <= 35
    ? 1 + (1 - i.RH / 100) / (0.1 * Math.cbrt(i.h0)) // EN 1992-1-1 eq. (B.3a)
    : (1 + ((1 - i.RH / 100) / (0.1 * Math.cbrt(i.h0))) * a1) * a2 // EN 1992-1-1 eq. (B.3b)
  const betaFcm = 16.8 / Math.sqrt(fcm) // EN 1992-1-1 eq. (B.4)
  const alphaCem = i.cement === 'S' ? -1 : i.cement === 'N' ? 0 : 1 // EN 1992-1-1 B.1(2)
  const t0 = Math.max(0.5, i.t0 * (9 / (2 + i.t0 ** 1.2) + 1) ** alphaCem) // EN 1992-1-1 eq. (B.9)
  const betaT0 = 1 / (0.1 + t0 ** 0.2) // EN 1992-1-1 eq. (B.5)
  const betaH = fcm <= 35
    ? Math.min(1500, 1.5 * (1 + (0.012 * i.RH) ** 18) * i.h0 + 250) // EN 1992-1-1 eq. (B.8a)
    : Math.min(1500 * a3, 1.5 * (1 + (0.012 * i.RH) ** 18) * i.h0 + 250 * a3) // EN 1992-1-1 eq. (B.8b)
  const dt = i.t - i.t0
  const betaC = (dt / (betaH + dt)) ** 0.3 // EN 1992-1-1 eq. (B.7)
  return phiRH * betaFcm * betaT0 * betaC // EN 1992-1-1 eqs. (B.1), (B.2)
}

/** kh of EN 1992-1-1 Table 3.3, interpolated linearly between its rows. */
export function khFactor(h0: number): number {
  const rows: Array<[number, number]> = [[100, 1.0], [200, 0.85], [300, 0.75], [500, 0.7]] // EN 1992-1-1 Table 3.3
  const first = rows[0] as [number, number]
  const last = rows[rows.length - 1] as [number, number]
  if (h0 <= first[0]) return first[1]
  if (h0 >= last[0]) return last[1]
  for (let k = 1; k < rows.length; k++) {
    const [x1, y1] = rows[k] as [number, number]
    const [x0, y0] = rows[k - 1] as [number, number]
    if (h0 <= x1) return y0 + ((y1 - y0) * (h0 - x0)) / (x1 - x0)
  }
  return last[1]
}

export interface ShrinkageInput {
  fck: number
  RH: number
  h0: number
  /** age at the start of drying (end of curing), days */
  ts: number
  /** age considered, days */
  t: number
  cement: CementClass
}

export interface ShrinkageResult {
  /** drying shrinkage εcd(t) */
  drying: number
  /** autogenous shrinkage εca(t) */
  autogenous: number
  /** total εcs = εcd + εca, positive as shortening */
  total: number
}

/** Shrinkage strain of EN 1992-1-1 3.1.4 with Annex B.2 (shortening positive). */
export function shrinkageStrain(i: ShrinkageInput): ShrinkageResult {
  checkCommon(i)
  guard('ts', Number.isFinite(i.ts) && i.ts >= 0, 'age at the start of drying must not be negative')
  guard('t', Number.isFinite(i.t) && i.t >= 0, 'age must not be negative')
  const fcm = i.fck + 8 // EN 1992-1-1 Table 3.1
  const ads1 = i.cement === 'S' ? 3 : i.cement === 'N' ? 4 : 6 // EN 1992-1-1 B.2(1)
  const ads2 = i.cement === 'S' ? 0.13 : i.cement === 'N' ? 0.12 : 0.11 // EN 1992-1-1 B.2(1)
  const betaRH = 1.55 * (1 - (i.RH / 100) ** 3) // EN 1992-1-1 eq. (B.12)
  const epsCd0 = 0.85 * ((220 + 110 * ads1) * Math.exp(-ads2 * (fcm / 10))) * 1e-6 * betaRH // EN 1992-1-1 eq. (B.11)
  const dt = Math.max(0, i.t - i.ts)
  const betaDs = dt / (dt + 0.04 * Math.sqrt(i.h0 ** 3)) // EN 1992-1-1 eq. (3.10): exponent 3/2 on h0
  const drying = betaDs * khFactor(i.h0) * epsCd0 // EN 1992-1-1 eq. (3.9)
  const epsCaInf = 2.5 * (i.fck - 10) * 1e-6 // EN 1992-1-1 eq. (3.12)
  const betaAs = 1 - Math.exp(-0.2 * Math.sqrt(Math.max(0, i.t))) // EN 1992-1-1 eq. (3.13)
  const autogenous = Math.max(0, betaAs * epsCaInf) // EN 1992-1-1 eq. (3.11)
  return { drying, autogenous, total: drying + autogenous } // EN 1992-1-1 eq. (3.8)
}
