/**
 * Input guards for the leaf formula modules: each names the field by its dot path so that a bad
 * value gives an EngineInputError, never a NaN further down.
 */
import { EngineInputError } from '../contract'

export function requirePositive(field: string, v: number): number {
  if (!(v > 0) || !Number.isFinite(v)) throw new EngineInputError(field, 'must be a positive number')
  return v
}

export function requireNonNegative(field: string, v: number): number {
  if (!(v >= 0) || !Number.isFinite(v)) throw new EngineInputError(field, 'must not be negative')
  return v
}

export function requireFinite(field: string, v: number): number {
  if (!Number.isFinite(v)) throw new EngineInputError(field, 'must be a finite number')
  return v
}

export function requireRange(field: string, v: number, lo: number, hi: number, why: string): number {
  if (!(v >= lo && v <= hi) || !Number.isFinite(v)) throw new EngineInputError(field, why)
  return v
}

/** Throw the EngineInputError that names the input at fault. */
export function fail(field: string, message: string): never {
  throw new EngineInputError(field, message)
}
