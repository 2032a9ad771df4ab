/**
 * Types shared by the engine, the report renderer and the app. Pure TypeScript, no imports from
 * Nuxt or Vue. Display units come from shared/utils/units.ts; every engine number is in N, mm, MPa.
 */
import type { DisplayUnit } from '../utils/units'

/** How a number (input or result) is labelled, shown and cited. */
export interface QuantitySpec {
  label: string
  /** TeX symbol, e.g. 'f_{ck}' or '\\sigma_{p,max}' */
  symbol?: string
  /** the unit it is shown in; the engine value is in base units */
  unit: DisplayUnit
  /** decimals in the display unit */
  precision: number
  /** clause or formula it comes from, e.g. 'EN 1992-1-1 eq. (5.45)' */
  clause?: string
}

/** One verification: actual against limit, with its clause. */
export interface CheckResult {
  /** stable id, e.g. 'transfer.top.S2-support' */
  id: string
  /** 'transfer' | 'service' | 'uls' | 'sls' | 'detailing' | 'site' | … */
  group: string
  title: string
  /** where: 'Span 2, x = 4.80 m', 'Support 3' */
  location?: string
  clause: string
  actual: number
  limit: number
  unit: DisplayUnit
  /** actual / limit, ≥ 0; > 1 fails */
  utilisation: number
  pass: boolean
  note?: string
}

/** A typed error that names the input field at fault (dot path into the input). */
export class EngineInputError extends Error {
  readonly field: string
  constructor(field: string, message: string) {
    super(`${field}: ${message}`)
    this.name = 'EngineInputError'
    this.field = field
  }
}
