/** Small numeric helpers: indexed reads, sums, the mean along the tendon, Simpson's rule, bisection. */

/** a[i] for an index known to be in range (the arrays are built alongside their indices). */
export const at = (a: readonly number[], i: number): number => a[i] as number

export const sum = (a: readonly number[]): number => a.reduce((s, v) => s + v, 0)

/** Mean of f along the tendon by the trapezoidal rule. */
export function meanAlong(X: readonly number[], f: readonly number[]): number {
  let area = 0
  for (let i = 1; i < X.length; i++) area += ((at(f, i - 1) + at(f, i)) / 2) * (at(X, i) - at(X, i - 1))
  const Lt = at(X, X.length - 1) - at(X, 0)
  return Lt > 0 ? area / Lt : at(f, 0)
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
