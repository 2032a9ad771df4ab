/**
 * Independent check model: a dense finite-element stiffness model of the same beam, built from many
 * prismatic Euler–Bernoulli (Hermite) elements and solved with ml-matrix. Nodes at every support,
 * segment end, load position and m equal divisions of each span; with consistent nodal loads the
 * nodal results are exact for piecewise-constant EI (any structural-analysis text, e.g. Przemieniecki,
 * Theory of Matrix Structural Analysis, ch. 5). DOFs: v upward, θ counter-clockwise.
 */
import { Matrix, solve } from 'ml-matrix'
import type { BeamLoad, EISegment, SpanEI, SupportKind } from '../../../../shared/engine/analysis/continuous-beam'

export interface DenseBeam {
  /** sagging moment at a node of span `span` at x, from the element on its left (x > 0) or right (x = 0) */
  momentAt(span: number, x: number): number
  /** the x of every node of a span */
  nodesOf(span: number): number[]
  reactions: number[]
  reactionCouples: number[]
  rotations: number[]
}

export function denseBeam(spans: number[], EI: SpanEI[], supports: SupportKind[], springs: number[], loads: BeamLoad[], m: number): DenseBeam {
  const segsOf = (i: number): EISegment[] => {
    const v = EI[i] as SpanEI
    return typeof v === 'number' ? [{ from: 0, to: spans[i] as number, EI: v }] : v
  }
  // node positions per span
  const spanNodes = spans.map((L, i) => {
    const needed = new Set<number>([0, L])
    segsOf(i).forEach((s) => { needed.add(s.from); needed.add(s.to) })
    for (const l of loads) {
      if (l.span !== i) continue
      if (l.kind === 'point' || l.kind === 'couple') needed.add(l.at)
      if (l.kind === 'patch') { needed.add(l.from); needed.add(l.to) }
    }
    // equal divisions, less any that would make a very short element next to a needed node (conditioning)
    const cuts = new Set(needed)
    for (let k = 1; k < m; k++) {
      const x = (L * k) / m
      if ([...needed].every((y) => Math.abs(y - x) > L / (4 * m))) cuts.add(x)
    }
    return [...cuts].sort((a, b) => a - b).filter((x, k, xs) => k === 0 || x - (xs[k - 1] as number) > 1e-9 * L)
  })
  // global node index of span i, local node k
  const first: number[] = []
  let N = 0
  spanNodes.forEach((xs, i) => {
    first.push(i === 0 ? 0 : N - 1)
    N = (i === 0 ? 0 : N - 1) + xs.length
  })
  const g = (i: number, k: number): number => (first[i] as number) + k
  const K = Matrix.zeros(2 * N, 2 * N)
  const F = Matrix.zeros(2 * N, 1)
  interface Elem { span: number; k: number; l: number; ei: number; w: number; dofs: number[]; fe: number[] }
  const elems: Elem[] = []
  spanNodes.forEach((xs, i) => {
    for (let k = 0; k < xs.length - 1; k++) {
      const x0 = xs[k] as number
      const x1 = xs[k + 1] as number
      const l = x1 - x0
      const xm = (x0 + x1) / 2
      const seg = segsOf(i).find((s) => xm >= s.from && xm <= s.to) as EISegment
      let w = 0
      for (const ld of loads) {
        if (ld.span !== i) continue
        if (ld.kind === 'udl') w += ld.w
        if (ld.kind === 'patch' && xm > ld.from && xm < ld.to) w += ld.w
      }
      const ei = seg.EI
      const ke = [
        [12, 6 * l, -12, 6 * l], [6 * l, 4 * l * l, -6 * l, 2 * l * l], [-12, -6 * l, 12, -6 * l], [6 * l, 2 * l * l, -6 * l, 4 * l * l],
      ].map((row) => row.map((v) => (v * ei) / l ** 3))
      const fe = [(-w * l) / 2, (-w * l * l) / 12, (-w * l) / 2, (w * l * l) / 12] // consistent loads of a downward w
      const a = g(i, k)
      const dofs = [2 * a, 2 * a + 1, 2 * a + 2, 2 * a + 3]
      dofs.forEach((r, p) => {
        F.set(r, 0, F.get(r, 0) + (fe[p] as number))
        dofs.forEach((c, q) => K.set(r, c, K.get(r, c) + ((ke[p] as number[])[q] as number)))
      })
      elems.push({ span: i, k, l, ei, w, dofs, fe })
    }
  })
  for (const ld of loads) {
    if (ld.kind === 'point' || ld.kind === 'couple') {
      const k = (spanNodes[ld.span] as number[]).findIndex((x) => Math.abs(x - ld.at) <= 1e-9 * (spans[ld.span] as number))
      const node = g(ld.span, k)
      if (ld.kind === 'point') F.set(2 * node, 0, F.get(2 * node, 0) - ld.P)
      else F.set(2 * node + 1, 0, F.get(2 * node + 1, 0) + ld.M)
    }
  }
  const supportNode = supports.map((_, j) => (j < spans.length ? g(j, 0) : N - 1))
  const restrained = new Set<number>()
  supports.forEach((s, j) => {
    const node = supportNode[j] as number
    if (s !== 'free') restrained.add(2 * node)
    if (s === 'fixed') restrained.add(2 * node + 1)
    if (s === 'pinned') K.set(2 * node + 1, 2 * node + 1, K.get(2 * node + 1, 2 * node + 1) + (springs[j] ?? 0))
  })
  const freeDofs = Array.from({ length: 2 * N }, (_, d) => d).filter((d) => !restrained.has(d))
  const Kff = new Matrix(freeDofs.map((r) => freeDofs.map((c) => K.get(r, c))))
  const Ff = new Matrix(freeDofs.map((r) => [F.get(r, 0)]))
  const uf = solve(Kff, Ff)
  const u = new Array<number>(2 * N).fill(0)
  freeDofs.forEach((r, p) => { u[r] = uf.get(p, 0) })
  const residual = (r: number): number => {
    let s = -F.get(r, 0)
    for (let c = 0; c < 2 * N; c++) s += K.get(r, c) * (u[c] as number)
    return s
  }
  const reactions = supports.map((s, j) => (s === 'free' ? 0 : residual(2 * (supportNode[j] as number))))
  const reactionCouples = supports.map((s, j) => {
    const node = supportNode[j] as number
    if (s === 'fixed') return residual(2 * node + 1)
    if (s === 'pinned') return -(springs[j] ?? 0) * (u[2 * node + 1] as number)
    return 0
  })
  const rotations = supportNode.map((node) => u[2 * node + 1] as number)
  // element end forces f = k·u − f_load; the sagging moment is −(end couple) at its left end and +(end couple) at its right
  const endCouple = (e: Elem, end: 0 | 1): number => {
    const r = end === 0 ? 1 : 3
    const l = e.l
    const ke = [
      [12, 6 * l, -12, 6 * l], [6 * l, 4 * l * l, -6 * l, 2 * l * l], [-12, -6 * l, 12, -6 * l], [6 * l, 2 * l * l, -6 * l, 4 * l * l],
    ][r] as number[]
    let s = -(e.fe[r] as number)
    e.dofs.forEach((d, q) => { s += ((ke[q] as number) * e.ei * (u[d] as number)) / l ** 3 })
    return s
  }
  const momentAt = (span: number, x: number): number => {
    const xs = spanNodes[span] as number[]
    const k = xs.findIndex((v) => Math.abs(v - x) <= 1e-9 * (spans[span] as number))
    if (k < 0) throw new Error(`no node at x = ${x} in span ${span}`)
    if (k === 0) return -endCouple(elems.find((e) => e.span === span && e.k === 0) as Elem, 0)
    return endCouple(elems.find((e) => e.span === span && e.k === k - 1) as Elem, 1)
  }
  return { momentAt, nodesOf: (span) => [...(spanNodes[span] as number[])], reactions, reactionCouples, rotations }
}
