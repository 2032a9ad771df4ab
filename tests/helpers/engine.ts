/** Helpers for the engine tests: the field an EngineInputError names, and the relative difference. */
import { EngineInputError } from '../../shared/engine/contract'

/** The field an EngineInputError names, or 'no error'. */
export function fieldOf(f: () => unknown): string {
  try {
    f()
  } catch (e) {
    if (e instanceof EngineInputError) return e.field
    throw e
  }
  return 'no error'
}

export function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b)
}
