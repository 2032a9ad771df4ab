/** Dense linear solve by Gaussian elimination with partial pivoting (small stiffness systems). */
export function solveLinear(A: number[][], b: number[]): number[] {
  const n = b.length
  const M = A.map((row, i) => [...row, b[i] as number])
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs((M[r] as number[])[c] as number) > Math.abs((M[p] as number[])[c] as number)) p = r
    const tmp = M[c] as number[]
    M[c] = M[p] as number[]
    M[p] = tmp
    const pivotRow = M[c] as number[]
    const pivot = pivotRow[c] as number
    if (Math.abs(pivot) < 1e-300) throw new Error('singular stiffness matrix')
    for (let r = c + 1; r < n; r++) {
      const row = M[r] as number[]
      const f = (row[c] as number) / pivot
      if (f === 0) continue
      for (let k = c; k <= n; k++) row[k] = (row[k] as number) - f * (pivotRow[k] as number)
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    const row = M[r] as number[]
    let s = row[n] as number
    for (let k = r + 1; k < n; k++) s -= (row[k] as number) * (x[k] as number)
    x[r] = s / (row[r] as number)
  }
  return x
}
