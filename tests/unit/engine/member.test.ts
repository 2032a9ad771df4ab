import { describe, expect, it } from 'vitest'
import {
  DEMO_BB1, DEMO_PS2, designMember, mergeInputPatch, prestressMoments, specFor, RESULT_SPECS, STAGES,
} from '../../../shared/engine/index'
import type { Design, MemberInputDraft } from '../../../shared/engine/index'
import { between, prng } from './prng'

function numericLeaves(v: unknown, path: string, out: Array<[string, number]>): void {
  if (typeof v === 'number') out.push([path, v])
  else if (Array.isArray(v)) v.forEach((x, i) => numericLeaves(x, `${path}.${i}`, out))
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) numericLeaves(x, path ? `${path}.${k}` : k, out)
}

const stressChecksPass = (d: Design): boolean => d.checks.filter((c) => c.group === 'transfer' || c.group === 'service').every((c) => c.pass)

const demos: Array<[string, MemberInputDraft]> = [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]]

describe.each(demos)('demo %s', (_, demo) => {
  const d = designMember(demo)
  it('is plain JSON with finite numbers only (JSON round trip is lossless)', () => {
    const leaves: Array<[string, number]> = []
    numericLeaves(d, '', leaves)
    for (const [p, v] of leaves) expect(Number.isFinite(v), p).toBe(true)
    // no functions, class instances or undefined values: the round trip keeps everything (−0 reads back as 0)
    const zeroed = JSON.parse(JSON.stringify(d), (_k, v: unknown) => v) as unknown
    const plain = (v: unknown): unknown => (typeof v === 'number' && Object.is(v, -0) ? 0 : Array.isArray(v) ? v.map(plain) : v && typeof v === 'object' ? Object.fromEntries(Object.entries(v).filter(([, x]) => x !== undefined).map(([k, x]) => [k, plain(x)])) : v)
    expect(zeroed).toStrictEqual(plain(d))
  })
  it('every numeric leaf has a spec in the catalogue', () => {
    const leaves: Array<[string, number]> = []
    numericLeaves(d, '', leaves)
    const missing = [...new Set(leaves.map(([p]) => p).filter((p) => !specFor(p)).map((p) => p.replace(/\.\d+/g, '[]')))]
    expect(missing).toEqual([])
    expect(specFor('sections.3.stress.transfer.top')).toBe(RESULT_SPECS['sections[].stress.transfer.top'])
  })
  it('the proposal\'s patch, merged and run again, passes every transfer and service check', () => {
    expect(d.proposal.feasible).toBe(true)
    const again = designMember(mergeInputPatch(demo, d.proposal.inputPatch ?? {}))
    expect(stressChecksPass(again)).toBe(true)
  })
  it('the average precompression is P/A (common practice definition)', () => {
    expect(d.precompression.service).toBeCloseTo(d.force.meanService / d.section.A, 12)
  })
  it('the losses add up to the jacking force less the mean service force', () => {
    const l = d.losses
    const sum = (l.friction.force ?? 0) + (l.drawIn.force ?? 0) + (l.elasticShortening.force ?? 0) + (l.longTerm.force ?? 0)
    expect(sum).toBeCloseTo(l.total.force ?? Number.NaN, 3)
    expect(l.longTerm.force as number).toBeCloseTo((l.creep.force ?? 0) + (l.shrinkage.force ?? 0) + (l.relaxation.force ?? 0), 3)
  })
  it('pattern loading follows EN 1992-1-1 5.1.3: all spans, alternate spans and each pair of adjacent spans', () => {
    const n = d.input.geometry.spans.length
    expect(d.loadCases.patterns.length).toBe(3 + (n - 1))
    expect(d.loadCases.patterns.map((p) => p.id)).toContain('adjacent-1')
  })
  it('checks cover transfer and service per combination with utilisation, and ids are unique', () => {
    const ids = d.checks.map((c) => c.id)
    expect(new Set(ids).size).toBe(ids.length)
    expect(ids).toContain('transfer.bottom.compression')
    expect(ids).toContain('quasiPermanent.top.compression')
    for (const c of d.checks) expect(c.utilisation).toBeGreaterThanOrEqual(0)
    for (const s of d.sections) for (const st of STAGES) expect(s.stress[st]).toBeDefined()
  })
  it('the secondary moment at the interior supports equals the prestress analysis at the mean service force (EN 1992-1-1 5.10.7)', () => {
    const spans = d.input.geometry.spans
    const m = prestressMoments({
      spans, EI: d.concrete.at28.Ecm * d.section.I,
      profile: { spans, supportEcc: d.profile.supportEcc, spanEcc: d.profile.spanEcc, lowPointAt: d.profile.lowPointAt, inflection: d.profile.inflection },
      P: d.force.meanService,
    })
    for (let j = 1; j < spans.length; j++) expect(d.prestressMoments.service.secondary[j] as number).toBeCloseTo(m.secondary[j] as number, -2)
  })
})

describe('symmetric member', () => {
  it('BB-1 (symmetric spans and profile) gives mirrored stresses at mirrored sections', () => {
    const d = designMember(DEMO_BB1, { proposal: false })
    const Ltot = d.profile.length
    for (const s of d.sections) {
      const mirror = d.sections.find((o) => Math.abs(o.X - (Ltot - s.X)) < 1e-6)
      if (!mirror) continue
      expect(s.stress.quasiPermanent.top).toBeCloseTo(mirror.stress.quasiPermanent.top, 2)
      expect(s.moments.characteristic.max).toBeCloseTo(mirror.moments.characteristic.max, -3)
    }
  })
})

describe('proposal on random feasible members (seeded)', () => {
  it('the inputPatch makes every transfer and service check pass', () => {
    const r = prng(777)
    let proposed = 0
    for (let trial = 0; trial < 8; trial++) {
      const n = 1 + Math.floor(r() * 4)
      const L = between(r, 6000, 9000)
      const spans = Array.from({ length: n }, (_, i) => Math.round(L * (i === 0 || i === n - 1 ? between(r, 0.8, 1) : 1)))
      const h = Math.round(Math.max(...spans) / between(r, 30, 38) / 10) * 10
      const input: MemberInputDraft = {
        geometry: { spans },
        section: { kind: 'slab-strip', h },
        materials: { concreteClass: r() < 0.5 ? 'C32/40' : 'C35/45' },
        tendon: { strandsPerTendon: 4, spacing: Math.round(between(r, 600, 1400) / 25) * 25, coverTop: 25, coverBottom: 25, ductWidth: 50, ductHeight: 19 },
        loads: { superimposed: between(r, 1, 2) * 1e-3, imposed: between(r, 1.5, 4) * 1e-3 },
      }
      const d = designMember(input)
      if (!d.proposal.feasible) {
        expect(d.proposal.reason).toMatch(/\w/)
        continue
      }
      proposed++
      const again = designMember(mergeInputPatch(input, d.proposal.inputPatch ?? {}))
      expect(stressChecksPass(again)).toBe(true)
    }
    expect(proposed).toBeGreaterThan(4)
  })
  it('a section far too small gets no proposal and a clear reason', () => {
    const d = designMember({
      geometry: { spans: [12000, 12000] },
      section: { kind: 'slab-strip', h: 150 },
      materials: { concreteClass: 'C25/30' },
      tendon: { coverTop: 25, coverBottom: 25, ductHeight: 19, ductWidth: 50 },
      loads: { superimposed: 5e-3, imposed: 10e-3 },
    })
    expect(d.proposal.feasible).toBe(false)
    expect(d.proposal.inputPatch).toBeNull()
    expect(d.proposal.reason).toMatch(/too small|No single force/)
  })
})

describe('proposal on random band beams (seeded)', () => {
  it('the inputPatch makes every transfer and service check pass, with no more strands than a passing input', () => {
    const r = prng(4242)
    let proposed = 0
    for (let trial = 0; trial < 5; trial++) {
      const L = between(r, 7000, 10000)
      const spans = [Math.round(0.8 * L), Math.round(L), Math.round(0.8 * L)]
      const input: MemberInputDraft = {
        geometry: { spans },
        section: { kind: 'tee-beam', h: Math.round(L / between(r, 22, 27) / 10) * 10, bw: 2400, bf: 4400, hf: 220, tributaryWidth: Math.round(between(r, 6000, 8000)) },
        materials: { concreteClass: 'C40/50' },
        tendon: { strandsPerTendon: 5, count: 1 + Math.floor(r() * 8), coverTop: 40, coverBottom: 40, ductWidth: 75 },
        loads: { superimposed: between(r, 1, 2) * 1e-3, imposed: between(r, 2.5, 5) * 1e-3 },
      }
      const d = designMember(input)
      if (!d.proposal.feasible) continue
      proposed++
      const again = designMember(mergeInputPatch(input, d.proposal.inputPatch ?? {}))
      expect(stressChecksPass(again)).toBe(true)
      if (stressChecksPass(d)) expect(d.proposal.strands as number).toBeLessThanOrEqual(d.jacking.strands)
    }
    expect(proposed).toBeGreaterThan(2)
  })
})
