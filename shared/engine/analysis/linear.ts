/**
 * Tridiagonal solve (the Thomas algorithm: Gaussian elimination without pivoting on a band of
 * width three), O(n) time and memory. Safe without pivoting for the symmetric positive definite
 * stiffness matrices of a continuous beam (Golub & Van Loan, Matrix Computations, 4.3).
 * The factors are kept so that many load cases reuse one elimination.
 */
export interface TridiagonalFactors {
  /** solve A·x = rhs with the factored matrix; rhs is not changed */
  solve(rhs: ArrayLike<number>): Float64Array
}

/**
 * Factor A with sub-diagonal `sub` (sub[i] = A[i][i−1], sub[0] unused), diagonal `diag` and
 * super-diagonal `sup` (sup[i] = A[i][i+1], the last unused).
 */
export function factorTridiagonal(sub: ArrayLike<number>, diag: ArrayLike<number>, sup: ArrayLike<number>): TridiagonalFactors {
  const n = diag.length
  const c = new Float64Array(n) // modified super-diagonal
  const pivot = new Float64Array(n)
  const a = Float64Array.from(sub)
  for (let i = 0; i < n; i++) {
    const d = (diag[i] as number) - (i > 0 ? (a[i] as number) * (c[i - 1] as number) : 0)
    // a zero pivot on a positive definite matrix means the structure is a mechanism
    if (!(Math.abs(d) > 1e-14 * Math.abs(diag[i] as number)) || !Number.isFinite(d)) throw new Error(`singular stiffness matrix at row ${i}`)
    pivot[i] = d
    c[i] = i < n - 1 ? (sup[i] as number) / d : 0
  }
  return {
    solve(rhs) {
      const x = new Float64Array(n)
      for (let i = 0; i < n; i++) x[i] = ((rhs[i] as number) - (i > 0 ? (a[i] as number) * (x[i - 1] as number) : 0)) / (pivot[i] as number)
      for (let i = n - 2; i >= 0; i--) x[i] = (x[i] as number) - (c[i] as number) * (x[i + 1] as number)
      return x
    },
  }
}
