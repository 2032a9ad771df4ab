/**
 * Concrete properties to EN 1992-1-1:2004 Table 3.1 and their development with age (3.1.2).
 * MPa throughout; Ecm in MPa (not GPa).
 */
import { EngineInputError } from '../contract'

export type CementClass = 'R' | 'N' | 'S'

export interface ConcreteProperties {
  fck: number
  fcm: number
  fctm: number
  fctk005: number
  fctk095: number
  Ecm: number
}

/** Strength classes of Table 3.1 by name, with their characteristic cylinder strength. */
export const CONCRETE_CLASSES = {
  'C12/15': 12, 'C16/20': 16, 'C20/25': 20, 'C25/30': 25, 'C30/37': 30, 'C32/40': 32, 'C35/45': 35,
  'C40/50': 40, 'C45/55': 45, 'C50/60': 50, 'C55/67': 55, 'C60/75': 60, 'C70/85': 70, 'C80/95': 80,
  'C90/105': 90,
} as const

export type ConcreteClass = keyof typeof CONCRETE_CLASSES

export function concreteProperties(fck: number): ConcreteProperties {
  if (!Number.isFinite(fck) || fck < 12 || fck > 90) {
    throw new EngineInputError('fck', 'fck must lie between 12 and 90 MPa (EN 1992-1-1 Table 3.1)')
  }
  const fcm = fck + 8 // EN 1992-1-1 Table 3.1: fcm = fck + 8
  const fctm = fck <= 50 ? 0.3 * fck ** (2 / 3) : 2.12 * Math.log(1 + fcm / 10) // EN 1992-1-1 Table 3.1
  return {
    fck,
    fcm,
    fctm,
    fctk005: 0.7 * fctm, // EN 1992-1-1 Table 3.1: fctk,0.05 = 0.7 fctm
    fctk095: 1.3 * fctm, // EN 1992-1-1 Table 3.1: fctk,0.95 = 1.3 fctm
    Ecm: 22000 * (fcm / 10) ** 0.3, // EN 1992-1-1 Table 3.1: Ecm = 22 (fcm/10)^0.3 GPa
  }
}

/** Coefficient s of eq. (3.2) for the cement class. */
export function cementS(cement: CementClass): number {
  return cement === 'R' ? 0.2 : cement === 'N' ? 0.25 : 0.38 // EN 1992-1-1 3.1.2(6)
}

export interface ConcreteAtAge {
  betaCC: number
  fcm: number
  fck: number
  fctm: number
  Ecm: number
}

export function concreteAtAge(fck: number, tDays: number, cement: CementClass): ConcreteAtAge {
  if (!Number.isFinite(tDays) || tDays <= 0) throw new EngineInputError('t', 'the age must be positive (days)')
  const c = concreteProperties(fck)
  const betaCC = Math.exp(cementS(cement) * (1 - Math.sqrt(28 / tDays))) // EN 1992-1-1 eq. (3.2)
  const fcmT = betaCC * c.fcm // EN 1992-1-1 eq. (3.1)
  // EN 1992-1-1 3.1.2(5): fck(t) = fcm(t) − 8 for 3 < t < 28 d, fck at 28 d and later
  const fckT = tDays >= 28 ? fck : Math.min(fck, Math.max(0, fcmT - 8))
  const alpha = tDays < 28 ? 1 : 2 / 3 // EN 1992-1-1 3.1.2(9)
  const fctmT = betaCC ** alpha * c.fctm // EN 1992-1-1 eq. (3.4)
  const EcmT = (fcmT / c.fcm) ** 0.3 * c.Ecm // EN 1992-1-1 eq. (3.5)
  return { betaCC, fcm: fcmT, fck: fckT, fctm: fctmT, Ecm: EcmT }
}
