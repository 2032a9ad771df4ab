/**
 * Input guards shared by the part-2 modules (ULS, SLS, site): each names the field by its dot path
 * so that a bad value gives an EngineInputError, never a NaN further down.
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

/** Simpson's rule over n (even) equal intervals of [a, b]. */
export function simpson(f: (x: number) => number, a: number, b: number, n = 200): number {
  const m = n % 2 === 0 ? n : n + 1
  const h = (b - a) / m
  let s = f(a) + f(b)
  for (let i = 1; i < m; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h)
  return (s * h) / 3 // Simpson's rule
}

/** Bisection for a root of a continuous g on [lo, hi] where g(lo) and g(hi) differ in sign. */
export function bisect(g: (x: number) => number, lo: number, hi: number, iterations = 100): number {
  let a = lo
  let b = hi
  let ga = g(a)
  for (let i = 0; i < iterations; i++) {
    const m = (a + b) / 2
    const gm = g(m)
    if (gm === 0) return m
    if (Math.sign(gm) === Math.sign(ga)) {
      a = m
      ga = gm
    } else b = m
  }
  return (a + b) / 2
}
