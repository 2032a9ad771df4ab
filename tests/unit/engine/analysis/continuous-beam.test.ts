import { describe, expect, it } from 'vitest'
import { Matrix, solve } from 'ml-matrix'
import { analyseContinuousBeam } from '../../../../shared/engine/index'
import type { BeamLoad } from '../../../../shared/engine/index'
import { between, prng } from '../../../helpers/prng'

describe('continuous beams under UDL: handbook coefficients (Reynolds & Steedman; Steel Designers\' Manual)', () => {
  const L = 8000
  const w = 10
  const udlAll = (n: number): BeamLoad[] => Array.from({ length: n }, (_, span) => ({ kind: 'udl' as const, span, w }))
  it('2 spans: M_B = −0.125 wL², reactions 0.375 / 1.25 / 0.375 wL', () => {
    const r = analyseContinuousBeam({ spans: [L, L], loads: udlAll(2) })
    expect(r.supportMoments[1] as number).toBeCloseTo(-0.125 * w * L * L, 0)
    expect((r.reactions[0] as number) / (w * L)).toBeCloseTo(0.375, 10)
    expect((r.reactions[1] as number) / (w * L)).toBeCloseTo(1.25, 10)
  })
  it('3 spans: M_B = M_C = −0.100 wL², +0.080 wL² at 0.4L of an end span, +0.025 wL² mid-span, reactions 0.40 / 1.10 wL', () => {
    const r = analyseContinuousBeam({ spans: [L, L, L], loads: udlAll(3) })
    expect((r.supportMoments[1] as number) / (w * L * L)).toBeCloseTo(-0.1, 10)
    expect((r.supportMoments[2] as number) / (w * L * L)).toBeCloseTo(-0.1, 10)
    expect(r.momentAt(0, 0.4 * L) / (w * L * L)).toBeCloseTo(0.08, 10)
    expect(r.momentAt(1, 0.5 * L) / (w * L * L)).toBeCloseTo(0.025, 10)
    expect((r.reactions[0] as number) / (w * L)).toBeCloseTo(0.4, 10)
    expect((r.reactions[1] as number) / (w * L)).toBeCloseTo(1.1, 10)
  })
  it('4 spans: M_B = −0.1071, M_C = −0.0714 wL²; reactions 0.393 / 1.143 / 0.929 wL (handbook, from memory)', () => {
    const r = analyseContinuousBeam({ spans: [L, L, L, L], loads: udlAll(4) })
    expect((r.supportMoments[1] as number) / (w * L * L)).toBeCloseTo(-3 / 28, 10)
    expect((r.supportMoments[2] as number) / (w * L * L)).toBeCloseTo(-2 / 28, 10)
    expect((r.reactions[0] as number) / (w * L)).toBeCloseTo(0.393, 3)
    expect((r.reactions[1] as number) / (w * L)).toBeCloseTo(1.143, 3)
    expect((r.reactions[2] as number) / (w * L)).toBeCloseTo(0.929, 3)
  })
  it('5 spans: M_B = −0.105, M_C = −0.079 wL²; reactions 0.395 / 1.132 / 0.974 wL (handbook, from memory)', () => {
    const r = analyseContinuousBeam({ spans: [L, L, L, L, L], loads: udlAll(5) })
    expect((r.supportMoments[1] as number) / (w * L * L)).toBeCloseTo(-0.105, 3)
    expect((r.supportMoments[2] as number) / (w * L * L)).toBeCloseTo(-0.079, 3)
    expect((r.reactions[0] as number) / (w * L)).toBeCloseTo(0.395, 3)
    expect((r.reactions[1] as number) / (w * L)).toBeCloseTo(1.132, 3)
    expect((r.reactions[2] as number) / (w * L)).toBeCloseTo(0.974, 3)
  })
  it('2 spans, central point load on each span: M_B = −3PL/16, reactions 5P/16 / 11P/8 (handbook)', () => {
    const P = 50000
    const r = analyseContinuousBeam({ spans: [L, L], loads: [{ kind: 'point', span: 0, at: L / 2, P }, { kind: 'point', span: 1, at: L / 2, P }] })
    expect((r.supportMoments[1] as number) / (P * L)).toBeCloseTo(-3 / 16, 10)
    expect((r.reactions[0] as number) / P).toBeCloseTo(5 / 16, 10)
    expect((r.reactions[1] as number) / P).toBeCloseTo(11 / 8, 10)
  })
  it('2 spans, one span loaded: M_B = −0.0625 wL² (handbook)', () => {
    const r = analyseContinuousBeam({ spans: [L, L], loads: [{ kind: 'udl', span: 0, w }] })
    expect((r.supportMoments[1] as number) / (w * L * L)).toBeCloseTo(-0.0625, 10)
  })
})

describe('fixed-end cases (any structural analysis textbook)', () => {
  const L = 6000
  it('fixed–fixed UDL: −wL²/12 at the ends, +wL²/24 at mid-span', () => {
    const r = analyseContinuousBeam({ spans: [L], supports: ['fixed', 'fixed'], loads: [{ kind: 'udl', span: 0, w: 12 }] })
    expect(r.supportMoments[0] as number).toBeCloseTo((-12 * L * L) / 12, 3)
    expect(r.supportMoments[1] as number).toBeCloseTo((-12 * L * L) / 12, 3)
    expect(r.momentAt(0, L / 2)).toBeCloseTo((12 * L * L) / 24, 3)
  })
  it('fixed–fixed central point load: −PL/8 at the ends, +PL/8 at mid-span', () => {
    const r = analyseContinuousBeam({ spans: [L], supports: ['fixed', 'fixed'], loads: [{ kind: 'point', span: 0, at: L / 2, P: 1000 }] })
    expect(r.supportMoments[0] as number).toBeCloseTo((-1000 * L) / 8, 3)
    expect(r.momentAt(0, L / 2)).toBeCloseTo((1000 * L) / 8, 3)
  })
  it('fixed–fixed eccentric point load: M_A = −Pab²/L², M_B = −Pa²b/L²', () => {
    const a = 2000
    const b = L - a
    const r = analyseContinuousBeam({ spans: [L], supports: ['fixed', 'fixed'], loads: [{ kind: 'point', span: 0, at: a, P: 1000 }] })
    expect(r.supportMoments[0] as number).toBeCloseTo((-1000 * a * b * b) / (L * L), 3)
    expect(r.supportMoments[1] as number).toBeCloseTo((-1000 * a * a * b) / (L * L), 3)
  })
  it('propped cantilever UDL: −wL²/8 at the fixed end, reaction 3wL/8 at the prop', () => {
    const r = analyseContinuousBeam({ spans: [L], supports: ['fixed', 'pinned'], loads: [{ kind: 'udl', span: 0, w: 10 }] })
    expect(r.supportMoments[0] as number).toBeCloseTo((-10 * L * L) / 8, 3)
    expect(r.reactions[1] as number).toBeCloseTo((3 * 10 * L) / 8, 6)
  })
  it('a couple at mid-span of a simple span gives a jump of M in the moment diagram and reactions ±M/L (statics)', () => {
    const r = analyseContinuousBeam({ spans: [L], loads: [{ kind: 'couple', span: 0, at: L / 2, M: 6e6 }] })
    expect(r.momentAt(0, L / 2 - 1e-6) - r.momentAt(0, L / 2 + 1e-6)).toBeCloseTo(6e6, 0)
    expect(r.reactions[0] as number).toBeCloseTo(6e6 / L, 9)
  })
})

describe('symmetry and equilibrium', () => {
  it('a symmetric beam under a symmetric load gives symmetric moments and reactions', () => {
    const spans = [7800, 9600, 9600, 7800]
    const loads: BeamLoad[] = spans.map((_, span) => ({ kind: 'udl' as const, span, w: 9 }))
    const r = analyseContinuousBeam({ spans, loads })
    const n = spans.length
    for (let j = 0; j <= n; j++) {
      expect(r.supportMoments[j] as number).toBeCloseTo(r.supportMoments[n - j] as number, 3)
      expect(r.reactions[j] as number).toBeCloseTo(r.reactions[n - j] as number, 6)
    }
  })
})

/** Independent dense model: Euler–Bernoulli beam elements (4 DOF each), solved with ml-matrix. */
function denseBeam(spans: number[], EI: number[], supports: Array<'pinned' | 'fixed'>, w: number[], points: Array<{ span: number; at: number; P: number }>, m: number): { supportMoments: number[]; reactions: number[] } {
  const nodesX: number[] = []
  const nodeSpan: Array<{ span: number; x: number }> = []
  const supportNode: number[] = []
  spans.forEach((L, i) => {
    const cuts = new Set<number>()
    for (let k = 0; k <= m; k++) cuts.add((L * k) / m)
    points.filter((p) => p.span === i).forEach((p) => cuts.add(p.at))
    const xs = [...cuts].sort((a, b) => a - b)
    const offset = spans.slice(0, i).reduce((s, v) => s + v, 0)
    xs.forEach((x, k) => {
      if (i > 0 && k === 0) return
      if (k === 0) supportNode.push(nodesX.length)
      nodesX.push(offset + x)
      nodeSpan.push({ span: i, x })
    })
    supportNode.push(nodesX.length - 1)
  })
  const uniqueSupports = [...new Set(supportNode)].sort((a, b) => a - b)
  const N = nodesX.length
  const K = Matrix.zeros(2 * N, 2 * N)
  const F = Matrix.zeros(2 * N, 1)
  const elems: Array<{ a: number; l: number; EI: number; w: number }> = []
  for (let a = 0; a < N - 1; a++) {
    const l = (nodesX[a + 1] as number) - (nodesX[a] as number)
    const span = (nodeSpan[a + 1] as { span: number }).span
    const ei = EI[span] as number
    const ww = w[span] as number
    elems.push({ a, l, EI: ei, w: ww })
    const k = [
      [12, 6 * l, -12, 6 * l], [6 * l, 4 * l * l, -6 * l, 2 * l * l], [-12, -6 * l, 12, -6 * l], [6 * l, 2 * l * l, -6 * l, 4 * l * l],
    ].map((row) => row.map((v) => (v * ei) / l ** 3))
    const fe = [(ww * l) / 2, (ww * l * l) / 12, (ww * l) / 2, (-ww * l * l) / 12] // consistent nodal loads (upward DOF sign handled below)
    const dofs = [2 * a, 2 * a + 1, 2 * a + 2, 2 * a + 3]
    dofs.forEach((r, i) => {
      F.set(r, 0, F.get(r, 0) - (fe[i] as number))
      dofs.forEach((c, j) => K.set(r, c, K.get(r, c) + ((k[i] as number[])[j] as number)))
    })
  }
  for (const p of points) {
    const node = nodeSpan.findIndex((s) => s.span === p.span && Math.abs(s.x - p.at) < 1e-9)
    F.set(2 * node, 0, F.get(2 * node, 0) - p.P)
  }
  const fixed = new Set<number>()
  uniqueSupports.forEach((node, j) => {
    fixed.add(2 * node)
    if (supports[j] === 'fixed') fixed.add(2 * node + 1)
  })
  const free = Array.from({ length: 2 * N }, (_, i) => i).filter((i) => !fixed.has(i))
  const Kff = new Matrix(free.map((r) => free.map((c) => K.get(r, c))))
  const Ff = new Matrix(free.map((r) => [F.get(r, 0)]))
  const uf = solve(Kff, Ff)
  const u = new Array<number>(2 * N).fill(0)
  free.forEach((r, i) => { u[r] = uf.get(i, 0) })
  const reactions = uniqueSupports.map((node) => {
    const r = 2 * node
    let s = -F.get(r, 0)
    for (let c = 0; c < 2 * N; c++) s += K.get(r, c) * (u[c] as number)
    return s
  })
  // bending moment (sagging +) at a node from the element to its right (or left at the last node)
  const momentAtNode = (node: number): number => {
    const e = elems[Math.min(node, elems.length - 1)] as { a: number; l: number; EI: number; w: number }
    const [v1, t1, v2, t2] = [u[2 * e.a] as number, u[2 * e.a + 1] as number, u[2 * e.a + 2] as number, u[2 * e.a + 3] as number]
    const xi = node === e.a ? 0 : 1
    // curvature of the Hermite interpolation, M = EI·v''
    const l = e.l
    const d2 = ((-6 + 12 * xi) * v1 + l * (-4 + 6 * xi) * t1 + (6 - 12 * xi) * v2 + l * (-2 + 6 * xi) * t2) / (l * l)
    return e.EI * d2 - (e.w * l * l) / 12 // plus the fixed-end moment of the element's own load
  }
  return { supportMoments: uniqueSupports.map(momentAtNode), reactions }
}

describe('stiffness solver against a dense finite-element solve with ml-matrix, random beams', () => {
  it('support moments and reactions agree for 60 random beams', () => {
    const r = prng(20260101)
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + Math.floor(r() * 5)
      const spans = Array.from({ length: n }, () => Math.round(between(r, 3000, 12000)))
      const EI = spans.map(() => between(r, 0.5, 3) * 1e13)
      const supports = Array.from({ length: n + 1 }, () => (r() < 0.2 ? 'fixed' as const : 'pinned' as const))
      const w = spans.map(() => between(r, 0, 30))
      const points = spans.map((L, span) => ({ span, at: Math.round(between(r, 0.1, 0.9) * L), P: between(r, -20000, 50000) }))
      const loads: BeamLoad[] = [
        ...w.map((ww, span) => ({ kind: 'udl' as const, span, w: ww })),
        ...points.map((p) => ({ kind: 'point' as const, ...p })),
      ]
      const mine = analyseContinuousBeam({ spans, EI, supports, loads })
      const dense = denseBeam(spans, EI, supports, w, points, 8)
      const scaleM = Math.max(...dense.supportMoments.map(Math.abs), 1e6)
      const scaleR = Math.max(...dense.reactions.map(Math.abs), 1)
      dense.supportMoments.forEach((m, j) => expect(Math.abs((mine.supportMoments[j] as number) - m) / scaleM).toBeLessThan(1e-6))
      dense.reactions.forEach((v, j) => expect(Math.abs((mine.reactions[j] as number) - v) / scaleR).toBeLessThan(1e-6))
    }
  })
  it('bad input names the field', () => {
    expect(() => analyseContinuousBeam({ spans: [5000, -1], loads: [] })).toThrow(/spans\.1/)
    expect(() => analyseContinuousBeam({ spans: [5000], supports: ['pinned'], loads: [] })).toThrow(/supports/)
    expect(() => analyseContinuousBeam({ spans: [5000], loads: [{ kind: 'point', span: 0, at: 6000, P: 1 }] })).toThrow(/loads\.0\.at/)
  })
})
