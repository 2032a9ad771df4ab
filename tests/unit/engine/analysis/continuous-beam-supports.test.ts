/**
 * Cantilevers, rotational springs (columns), fixed ends, non-prismatic spans and long beams, each
 * against a hand calculation written out beside it.
 */
import { describe, expect, it } from 'vitest'
import { analyseContinuousBeam, columnStiffness } from '../../../../shared/engine/analysis/continuous-beam'
import type { BeamLoad } from '../../../../shared/engine/analysis/continuous-beam'
import { EngineInputError } from '../../../../shared/engine/contract'

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30)

describe('cantilevers (statics)', () => {
  const w = 12 // N/mm
  const P = 30000 // N
  it('a cantilever fixed at its root: M = −w·a²/2 and −P·a at the root; tip rotation w·a³/(6EI) (handbook cantilever)', () => {
    const a = 2500
    const EI = 4e13
    const r = analyseContinuousBeam({ spans: [a], EI, supports: ['fixed', 'free'], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.supportMoments[0] as number, (-w * a * a) / 2)).toBeLessThan(1e-12) // −w·a²/2
    expect(rel(r.reactions[0] as number, w * a)).toBeLessThan(1e-12) // all the load at the root
    expect(r.reactions[1]).toBe(0)
    expect(rel(r.reactionCouples[0] as number, (w * a * a) / 2)).toBeLessThan(1e-12) // the wall's counter-clockwise couple
    expect(rel(r.rotations[1] as number, (-w * a ** 3) / (6 * EI))).toBeLessThan(1e-10) // tip turns clockwise by w·a³/6EI
    expect(Math.abs(r.supportMoments[1] as number)).toBeLessThan(1e-6) // nothing at the free tip
    const p = analyseContinuousBeam({ spans: [a], EI, supports: ['fixed', 'free'], loads: [{ kind: 'point', span: 0, at: a, P }] })
    expect(rel(p.supportMoments[0] as number, -P * a)).toBeLessThan(1e-12) // −P·a
    expect(rel(p.rotations[1] as number, (-P * a * a) / (2 * EI))).toBeLessThan(1e-10) // P·a²/2EI
  })

  it('a cantilever beyond the end of a continuous beam: root moment −w·a²/2 and −P·a, the back span carries it linearly', () => {
    const L = 7000
    const a = 2000
    const loads: BeamLoad[] = [{ kind: 'udl', span: 1, w }, { kind: 'point', span: 1, at: a, P }]
    const r = analyseContinuousBeam({ spans: [L, a], supports: ['pinned', 'pinned', 'free'], loads })
    const root = (-w * a * a) / 2 - P * a // statics of the cantilever
    expect(rel(r.supportMoments[1] as number, root)).toBeLessThan(1e-12)
    expect(rel(r.momentAt(0, L), root)).toBeLessThan(1e-12) // continuous through the pinned support
    expect(rel(r.momentAt(0, L / 2), root / 2)).toBeLessThan(1e-12) // unloaded back span: linear from 0
    expect(rel(r.reactions[0] as number, root / L)).toBeLessThan(1e-12) // uplift −(w·a²/2 + P·a)/L at the far end
    expect(rel(r.reactions[1] as number, w * a + P - root / L)).toBeLessThan(1e-12)
  })

  it('a cantilever at the left end mirrors one at the right', () => {
    const r = analyseContinuousBeam({ spans: [1800, 6000, 6000], supports: ['free', 'pinned', 'pinned', 'pinned'], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.momentAt(0, 1800), (-w * 1800 * 1800) / 2)).toBeLessThan(1e-12)
    expect(r.reactions[0]).toBe(0)
  })

  it('a cantilever on a column (rotational spring k) turns by M/k and keeps its statically determinate moment', () => {
    const a = 3000
    const k = 5e10
    const r = analyseContinuousBeam({ spans: [a], supports: ['free', 'pinned'], springs: [0, k], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.supportMoments[1] as number, (-w * a * a) / 2)).toBeLessThan(1e-12)
    expect(rel(r.rotations[1] as number, (w * a * a) / 2 / k)).toBeLessThan(1e-12) // θ = M/k, tip down to the left: counter-clockwise
  })
})

describe('rotational springs (slope–deflection)', () => {
  const w = 15
  const L = 8000
  const EI = 3e13
  it('one span between equal springs k under UDL: end moment −(wL²/12)·k/(k + 2EI/L)', () => {
    for (const k of [0.3 * EI / L, EI / L, 10 * EI / L]) {
      const r = analyseContinuousBeam({ spans: [L], EI, springs: [k, k], loads: [{ kind: 'udl', span: 0, w }] })
      // slope–deflection with θB = −θA = −θ: M = −wL²/12 + (EI/L)(4θ − 2θ)…, spring kθ = M ⇒ M = −(wL²/12)·k/(k + 2EI/L)
      const end = ((-w * L * L) / 12) * (k / (k + (2 * EI) / L))
      expect(rel(r.supportMoments[0] as number, end)).toBeLessThan(1e-12)
      expect(rel(r.supportMoments[1] as number, end)).toBeLessThan(1e-12)
      expect(rel(r.momentAt(0, L / 2), (w * L * L) / 8 + end)).toBeLessThan(1e-12) // free-body: wL²/8 + M_end
      expect(rel(r.reactionCouples[0] as number, -end)).toBeLessThan(1e-12)
    }
  })

  it('a fixed end is the limit of a very stiff spring: −wL²/12 (handbook fixed–fixed)', () => {
    const r = analyseContinuousBeam({ spans: [L], EI, springs: [1e8 * EI / L, 1e8 * EI / L], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.supportMoments[0] as number, (-w * L * L) / 12)).toBeLessThan(1e-7)
    const mixed: BeamLoad[] = [{ kind: 'udl', span: 0, w }, { kind: 'point', span: 1, at: 2100, P: 40000 }, { kind: 'couple', span: 2, at: 3000, M: 2e7 }]
    const spans = [L, 6000, 7000]
    const fixed = analyseContinuousBeam({ spans, EI, supports: ['fixed', 'pinned', 'fixed', 'pinned'], loads: mixed })
    const stiff = analyseContinuousBeam({ spans, EI, springs: [1e9 * EI / L, 0, 1e9 * EI / L, 0], loads: mixed })
    const scale = Math.max(...fixed.supportMoments.map(Math.abs))
    fixed.supportMoments.forEach((m, j) => expect(Math.abs(m - (stiff.supportMoments[j] as number)) / scale).toBeLessThan(1e-7))
    fixed.reactionCouples.forEach((c, j) => expect(Math.abs(c - (stiff.reactionCouples[j] as number)) / scale).toBeLessThan(1e-7))
  })

  it('two equal spans with a spring only at the middle support: unchanged by symmetry (θ = 0 there), M_B = −0.125wL² (handbook)', () => {
    const loads: BeamLoad[] = [{ kind: 'udl', span: 0, w }, { kind: 'udl', span: 1, w }]
    const r = analyseContinuousBeam({ spans: [L, L], EI, springs: [0, 5 * EI / L, 0], loads })
    expect(rel(r.supportMoments[1] as number, -0.125 * w * L * L)).toBeLessThan(1e-12) // Reynolds & Steedman: −0.125wL²
    expect(rel(r.reactions[1] as number, 1.25 * w * L)).toBeLessThan(1e-12) // 1.25wL
    expect(Math.abs(r.reactionCouples[1] as number)).toBeLessThan(1e-6 * w * L * L)
  })

  it('the spring does change the middle moment under a load on one span only (the check above can fail)', () => {
    const loads: BeamLoad[] = [{ kind: 'udl', span: 0, w }]
    const free = analyseContinuousBeam({ spans: [L, L], EI, loads })
    const col = analyseContinuousBeam({ spans: [L, L], EI, springs: [0, 5 * EI / L, 0], loads })
    expect(rel(free.supportMoments[1] as number, -0.0625 * w * L * L)).toBeLessThan(1e-12) // handbook: one span loaded, −wL²/16
    // hand (far ends pinned, stiffness 3EI/L each side): θB = (wL²/8)/(6EI/L + k), propped-cantilever fixed-end moment −wL²/8
    const k = 5 * EI / L
    const theta = (w * L * L) / 8 / ((6 * EI) / L + k)
    expect(rel(col.momentAt(0, L), (-w * L * L) / 8 + (3 * EI / L) * theta)).toBeLessThan(1e-12)
    expect(rel(col.reactionCouples[1] as number, -k * theta)).toBeLessThan(1e-12) // the column resists the counter-clockwise turn θ
  })

  it('equal spans, UDL on all, no springs: 2 and 3 span handbook coefficients (Reynolds & Steedman)', () => {
    const two = analyseContinuousBeam({ spans: [L, L], loads: [0, 1].map((span) => ({ kind: 'udl' as const, span, w })) })
    expect(rel(two.supportMoments[1] as number, -0.125 * w * L * L)).toBeLessThan(1e-12)
    expect(rel(two.reactions[0] as number, 0.375 * w * L)).toBeLessThan(1e-12)
    const three = analyseContinuousBeam({ spans: [L, L, L], loads: [0, 1, 2].map((span) => ({ kind: 'udl' as const, span, w })) })
    expect(rel(three.supportMoments[1] as number, -0.1 * w * L * L)).toBeLessThan(1e-12)
    expect(rel(three.momentAt(1, L / 2), 0.025 * w * L * L)).toBeLessThan(1e-9)
    expect(rel(three.reactions[1] as number, 1.1 * w * L)).toBeLessThan(1e-12)
  })

  it('columnStiffness: 4EI/H far end fixed, 3EI/H far end pinned; columns above and below add', () => {
    const E = 33000 // MPa, C30/37 (EN 1992-1-1 Table 3.1)
    const I = 400 ** 4 / 12 // 400 mm square column
    const H = 3200
    expect(rel(columnStiffness({ E, I, height: H, farEnd: 'fixed' }), (4 * E * I) / H)).toBeLessThan(1e-15)
    expect(rel(columnStiffness({ E, I, height: H, farEnd: 'pinned' }), (3 * E * I) / H)).toBeLessThan(1e-15)
    const k = columnStiffness({ E, I, height: H, farEnd: 'fixed' }) + columnStiffness({ E, I, height: 3600, farEnd: 'pinned' })
    const r = analyseContinuousBeam({ spans: [L], EI, springs: [k, k], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.supportMoments[0] as number, ((-w * L * L) / 12) * (k / (k + (2 * EI) / L)))).toBeLessThan(1e-12)
  })
})

describe('non-prismatic spans (moment-area)', () => {
  it('fixed–fixed span with stiffer end quarters (EI₂ = 2EI₁): M_end = −∫M0/EI ÷ ∫1/EI = −27wL²/288', () => {
    // symmetry and θA = θB = 0 ⇒ ∫(M0 + M_e)/EI dx = 0. ∫ over an end quarter of w·x(L−x)/2 = 5wL³/384,
    // the middle half 22wL³/384; ∫M0/EI = (2·5/2 + 22)·wL³/(384·EI₁) = 27wL³/(384EI₁); ∫1/EI = 3L/(4EI₁)
    const L = 9000
    const w = 20
    const EI1 = 2e13
    const segs = [{ from: 0, to: L / 4, EI: 2 * EI1 }, { from: L / 4, to: (3 * L) / 4, EI: EI1 }, { from: (3 * L) / 4, to: L, EI: 2 * EI1 }]
    const r = analyseContinuousBeam({ spans: [L], EI: [segs], supports: ['fixed', 'fixed'], loads: [{ kind: 'udl', span: 0, w }] })
    expect(rel(r.supportMoments[0] as number, (-27 * w * L * L) / 288)).toBeLessThan(1e-12)
    expect(rel(r.supportMoments[1] as number, (-27 * w * L * L) / 288)).toBeLessThan(1e-12)
  })

  it('segments of one EI give the prismatic result', () => {
    const loads: BeamLoad[] = [{ kind: 'udl', span: 0, w: 9 }, { kind: 'point', span: 1, at: 1234, P: 5e4 }, { kind: 'couple', span: 1, at: 4000, M: 1e7 }]
    const prismatic = analyseContinuousBeam({ spans: [6000, 7000], EI: 2e13, springs: [1e10, 2e10, 0], loads })
    const split = analyseContinuousBeam({ spans: [6000, 7000], EI: [[{ from: 0, to: 1000, EI: 2e13 }, { from: 1000, to: 6000, EI: 2e13 }], 2e13], springs: [1e10, 2e10, 0], loads })
    prismatic.supportMoments.forEach((m, j) => expect(Math.abs(m - (split.supportMoments[j] as number))).toBeLessThan(1e-6 * Math.abs(m) + 1))
  })
})

describe('long beams: cost linear in the number of spans', () => {
  // Clapeyron's three-moment equation for equal spans under UDL: M(j−1) + 4M(j) + M(j+1) = −wL²/2;
  // particular solution −wL²/12, homogeneous rʲ with r² + 4r + 1 = 0, r = √3 − 2; M(0) = 0 ⇒
  // M(j) = −(wL²/12)(1 − rʲ) far from the other end.
  const w = 10
  const L = 6000
  const r3 = Math.sqrt(3) - 2
  const clapeyron = (j: number): number => ((-w * L * L) / 12) * (1 - r3 ** j)
  it('1,000 equal spans: support moments follow the three-moment solution; interior reactions wL', () => {
    const n = 1000
    const spans = new Array<number>(n).fill(L)
    const r = analyseContinuousBeam({ spans, loads: spans.map((_, span) => ({ kind: 'udl' as const, span, w })) })
    for (const j of [1, 2, 3, 500, n - 1]) expect(rel(r.supportMoments[j] as number, clapeyron(Math.min(j, n - j)))).toBeLessThan(1e-9)
    expect(rel(r.reactions[500] as number, w * L)).toBeLessThan(1e-9)
    expect(rel(r.momentAt(500, L / 2), (w * L * L) / 24)).toBeLessThan(1e-9) // fixed–fixed interior span: wL²/24
  })
  it('10,000 spans with columns at every support and cantilevers at both ends solve', () => {
    const n = 10000
    const spans = new Array<number>(n).fill(L)
    spans[0] = 1500
    spans[n - 1] = 1500
    const supports = Array.from({ length: n + 1 }, (_, j) => (j === 0 || j === n ? 'free' as const : 'pinned' as const))
    const springs = supports.map((s) => (s === 'free' ? 0 : 1e11))
    const r = analyseContinuousBeam({ spans, EI: 3e13, supports, springs, loads: spans.map((_, span) => ({ kind: 'udl' as const, span, w })) })
    expect(rel(r.momentAt(0, 1500), (-w * 1500 * 1500) / 2)).toBeLessThan(1e-12) // cantilever root, statics
    expect(rel(r.supportMoments[5000] as number, (-w * L * L) / 12)).toBeLessThan(1e-9) // deep inside: θ = 0 by symmetry
    const total = spans.reduce((s, v) => s + w * v, 0)
    expect(rel(r.reactions.reduce((s, v) => s + v, 0), total)).toBeLessThan(1e-9)
  })
})

describe('bad input names the field (EngineInputError)', () => {
  const cases: Array<[string, () => unknown, RegExp]> = [
    ['a cantilever at an interior support', () => analyseContinuousBeam({ spans: [5000, 5000], supports: ['pinned', 'free', 'pinned'], loads: [] }), /supports\.1/],
    ['a single span free at both ends', () => analyseContinuousBeam({ spans: [5000], supports: ['free', 'free'], loads: [] }), /supports/],
    ['a cantilever on a pin without a spring', () => analyseContinuousBeam({ spans: [5000], supports: ['free', 'pinned'], loads: [] }), /supports\.1/],
    ['two cantilevers balanced on one pin', () => analyseContinuousBeam({ spans: [2000, 2000], supports: ['free', 'pinned', 'free'], loads: [] }), /supports\.1/],
    ['a column of zero height', () => columnStiffness({ E: 33000, I: 1e9, height: 0, farEnd: 'fixed' }), /height/],
    ['a negative spring', () => analyseContinuousBeam({ spans: [5000], springs: [-1, 0], loads: [] }), /springs\.0/],
    ['a spring at a free end', () => analyseContinuousBeam({ spans: [5000, 2000], supports: ['pinned', 'pinned', 'free'], springs: [0, 0, 1e9], loads: [] }), /springs\.2/],
    ['springs of the wrong length', () => analyseContinuousBeam({ spans: [5000], springs: [0], loads: [] }), /springs/],
    ['segments with a gap', () => analyseContinuousBeam({ spans: [5000], EI: [[{ from: 0, to: 2000, EI: 1e13 }, { from: 2500, to: 5000, EI: 1e13 }]], loads: [] }), /EI\.0\.1\.from/],
    ['segments short of the span', () => analyseContinuousBeam({ spans: [5000], EI: [[{ from: 0, to: 4000, EI: 1e13 }]], loads: [] }), /EI\.0\.0\.to/],
    ['a segment of zero stiffness', () => analyseContinuousBeam({ spans: [5000], EI: [[{ from: 0, to: 5000, EI: 0 }]], loads: [] }), /EI\.0\.0\.EI/],
    ['a load outside its span', () => analyseContinuousBeam({ spans: [5000], loads: [{ kind: 'point', span: 0, at: 5001, P: 1 }] }), /loads\.0\.at/],
    ['a patch outside its span', () => analyseContinuousBeam({ spans: [5000], loads: [{ kind: 'patch', span: 0, from: 4000, to: 6000, w: 1 }] }), /loads\.0\.from/],
    ['a load on a span that does not exist', () => analyseContinuousBeam({ spans: [5000], loads: [{ kind: 'udl', span: 1, w: 1 }] }), /loads\.0\.span/],
    ['a load that is not a number', () => analyseContinuousBeam({ spans: [5000], loads: [{ kind: 'udl', span: 0, w: Number.NaN }] }), /loads\.0\.w/],
    ['a moment asked outside the span', () => analyseContinuousBeam({ spans: [5000], loads: [] }).momentAt(0, 5100), /^x/],
  ]
  for (const [what, run, field] of cases) {
    it(what, () => {
      expect(run).toThrow(EngineInputError)
      expect(run).toThrow(field)
    })
  }
})
