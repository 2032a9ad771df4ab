import { describe, expect, it } from 'vitest'
import {
  DEMO_BB1, DEMO_PS2, DEMO_PS3, RESULT_SPECS, STAGES, designMember, inputFieldSpecs, mergeInputPatch, prestressMoments, specFor,
} from '../../../../shared/engine/index'
import type { Design, MemberInputDraft } from '../../../../shared/engine/index'
import { between, mulberry32, prng } from '../../../helpers/prng'
import { fieldOf } from '../../../helpers/engine'
import { stressProposal } from '../../../helpers/members'

const twoSpan: MemberInputDraft = {
  geometry: { spans: [8000, 8000] },
  section: { kind: 'slab-strip', h: 250 },
  materials: { concreteClass: 'C32/40' },
  tendon: { strandsPerTendon: 3, spacing: 600, coverTop: 25, coverBottom: 25, stressing: 'both' },
  profile: { mode: 'deepest', inflection: 0.1 },
  loads: { superimposed: 1.5e-3, imposed: 4.0e-3 },
}

function numericLeaves(v: unknown, path: string, out: Array<[string, number]>): void {
  if (typeof v === 'number') out.push([path, v])
  else if (Array.isArray(v)) v.forEach((x, i) => numericLeaves(x, `${path}.${i}`, out))
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) numericLeaves(x, path ? `${path}.${k}` : k, out)
}

const stressChecksPass = (d: Design): boolean => d.checks.filter((c) => c.group === 'transfer' || c.group === 'service').every((c) => c.pass)

const demos: Array<[string, MemberInputDraft]> = [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1], ['PS-3', DEMO_PS3]]

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
    const Ec = d.concrete.at28.Ecm
    // the drops from the record: their stretch of each span, their stiffness and the step of the centroid
    const starts = spans.map((_, i) => spans.slice(0, i).reduce((a, b) => a + b, 0))
    const parts = d.drops.flatMap((z) => spans.flatMap((L, i) => {
      const from = Math.max(0, z.from - (starts[i] as number))
      const to = Math.min(L, z.to - (starts[i] as number))
      return to > from ? [{ span: i, from, to, I: z.I, shift: z.shift }] : []
    }))
    const EI = spans.map((L, i) => {
      const mine = parts.filter((p) => p.span === i)
      if (mine.length === 0) return Ec * d.section.I
      const cuts = [0, ...mine.flatMap((p) => [p.from, p.to]), L].filter((x, k, a) => k === 0 || x > (a[k - 1] as number))
      return cuts.slice(0, -1).map((from, k) => ({ from, to: cuts[k + 1] as number, EI: Ec * (mine.find((p) => from >= p.from && from < p.to)?.I ?? d.section.I) }))
    })
    const springs = d.columns ? spans.concat(0).map((_, j) => { const c = d.columns!.joints.find((q) => q.support === j); return c ? c.kBelow + c.kAbove : 0 }) : undefined
    const m = prestressMoments({
      spans, EI, ...(d.input.geometry.supports ? { supports: d.input.geometry.supports } : {}), ...(springs ? { springs } : {}),
      profile: { spans, supportEcc: d.profile.supportEcc, spanEcc: d.profile.spanEcc, lowPointAt: d.profile.lowPointAt, inflection: d.profile.inflection, cantilever: { left: d.input.geometry.supports?.[0] === 'free', right: d.input.geometry.supports?.[spans.length] === 'free' } },
      P: d.force.meanService, centroidShifts: parts.map((p) => ({ span: p.span, from: p.from, to: p.to, shift: p.shift })),
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
  it('the inputPatch makes every transfer and service check pass', { timeout: 60_000 }, () => {
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
  it('a section far too small gets no proposal and a clear reason', { timeout: 60_000 }, () => {
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

describe('stress proposal on random band beams (seeded)', () => {
  it('the inputPatch makes every transfer and service check pass, with no more strands than a passing input', { timeout: 60_000 }, () => {
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
      const d = designMember(input, { proposal: false })
      // the stress search, the proposal's first step: no more strands than a start whose stresses pass
      const p = stressProposal(input)
      if (!p.feasible) continue
      proposed++
      const again = designMember(mergeInputPatch(input, p.inputPatch ?? {}), { proposal: false })
      expect(stressChecksPass(again)).toBe(true)
      if (stressChecksPass(d)) expect(p.strands as number).toBeLessThanOrEqual(d.jacking.strands)
    }
    expect(proposed).toBeGreaterThan(2)
  })
})

const L = 8000
const threeSpans: MemberInputDraft = {
  geometry: { spans: [L, L, L] },
  section: { kind: 'slab-strip', h: 220 },
  materials: { concreteClass: 'C32/40' },
  tendon: { coverTop: 25, coverBottom: 25, ductHeight: 19, ductWidth: 50, strandsPerTendon: 4, spacing: 900 },
  profile: { lowPointAt: [0.45, 0.5, 0.55] },
  loads: { superimposed: 1.5e-3, imposed: 4e-3 },
}

describe('pattern loading in the member design (EN 1992-1-1 5.1.3) against handbook coefficients for three equal spans', () => {
  const d = designMember(threeSpans, { proposal: false })
  const q = 4e-3 * 1000 // N/mm on the 1 m strip
  it('greatest imposed sagging in an end span: 0.101 qL² near 0.45L with spans 1 and 3 loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'span-1-low')
    expect(s).toBeDefined()
    expect((s?.moments.imposed.max as number) / (q * L * L)).toBeCloseTo(0.10125, 4)
  })
  it('greatest imposed hogging at an interior support: −0.117 qL² with the two adjacent spans loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'support-2')
    expect((s?.moments.imposed.min as number) / (q * L * L)).toBeCloseTo(-0.1167, 3)
  })
  it('the middle span\'s greatest imposed sagging is 0.075 qL² with only the middle span loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'span-2-low')
    expect((s?.moments.imposed.max as number) / (q * L * L)).toBeCloseTo(0.075, 4)
  })
  it('self-weight moments follow the all-spans coefficients: −0.100 gL² at the supports (handbook)', () => {
    const g = 25e-6 * 220 * 1000
    expect((d.loadCases.supportMoments.selfWeight[1] as number) / (g * L * L)).toBeCloseTo(-0.1, 6)
  })
})

describe('custom profile equal to the deepest one gives the same design', () => {
  it('same stresses at every section', () => {
    const a = designMember(threeSpans, { proposal: false })
    const b = designMember({
      ...threeSpans,
      profile: { ...threeSpans.profile, mode: 'custom', supportEcc: a.profile.supportEcc, spanEcc: a.profile.spanEcc },
    }, { proposal: false })
    a.sections.forEach((s, i) => expect(b.sections[i]?.stress.characteristic.top).toBeCloseTo(s.stress.characteristic.top, 9))
  })
})

describe('losses in the member', () => {
  it('stressing from both ends gives a higher mean force after friction than from one end (eq. (5.45))', () => {
    const both = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, stressing: 'both' } }, { proposal: false })
    const one = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, stressing: 'left' } }, { proposal: false })
    expect(both.force.meanAfterFriction).toBeGreaterThan(one.force.meanAfterFriction)
    // from one end the force falls monotonically along the tendon
    const f = one.series.forceFriction
    for (let k = 1; k < f.length; k++) expect(f[k] as number).toBeLessThanOrEqual((f[k - 1] as number) + 1e-6)
  })
  it('the percentage model takes the accepted share of the transfer force as the long-term loss', () => {
    const d = designMember({ ...threeSpans, losses: { model: 'percentage', longTermShare: 0.15 } }, { proposal: false })
    expect(d.force.meanService / d.force.meanTransfer).toBeCloseTo(0.85, 9)
    expect(d.losses.creep.force).toBeNull()
  })
  it('unbonded tendons take one long-term loss along the whole tendon (mean strain, 5.10.6(3))', () => {
    const d = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, bond: 'unbonded' } }, { proposal: false })
    const loss = d.series.forceTransfer.map((p, k) => p - (d.series.forceService[k] as number))
    for (const v of loss) expect(v).toBeCloseTo(loss[0] as number, 6)
  })
})

describe('the later stages in the member design', () => {
  const d = designMember(DEMO_PS2, { proposal: false })

  it('adds uls, deflection, cracking and site, with checks in the uls, sls, detailing and site groups', () => {
    // 1.3.0: draw-in of both ends together, friction with the true angle; 1.4.0: least crack-control steel of eq. (7.1); 1.5.0: fire resistance and anchorage zones; 1.6.0: tendons in segments, the strip's tendons on the stressing schedule; 1.7.0: the proposal names what bounds it and what fails in words
    expect(d.engineVersion).toBe('1.7.0')
    expect(d.uls.sections).toHaveLength(d.sections.length)
    expect(d.deflection.spans).toHaveLength(4)
    expect(d.site.heights.spans).toHaveLength(4)
    const groups = new Set(d.checks.map((c) => c.group))
    for (const g of ['uls', 'sls', 'detailing']) expect(groups.has(g)).toBe(true)
    expect(new Set(d.checks.map((c) => c.id)).size).toBe(d.checks.length)
    for (const c of d.checks) expect(Number.isFinite(c.utilisation)).toBe(true)
  })

  it('the input form carries the new groups', () => {
    const specs = inputFieldSpecs()
    const bars = specs.find((f) => f.path === 'uls.barsBottom.area')
    expect(bars?.spec.group).toBe('uls')
    expect(specs.find((f) => f.path === 'site.measured')?.kind).toBe('array')
    expect(specs.find((f) => f.path === 'deflection.ratioTotal')?.spec.group).toBe('sls')
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => designMember({ ...DEMO_BB1, punching: { column: 'interior' } }, { proposal: false }))).toBe('punching.column')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, punching: { column: 'edge', support: 9 } }, { proposal: false }))).toBe('punching.support')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, site: { measured: [100, 120] } }, { proposal: false }))).toBe('site.measured')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, uls: { gammaG: 3 } }, { proposal: false }))).toBe('uls.gammaG')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, site: { spacing: 0 } }, { proposal: false }))).toBe('site.spacing')
  })
})

describe('ULS, SLS and site over varied members (seeded)', () => {
  it('finite results and a spec-complete shape for every option', { timeout: 60_000 }, () => {
    const rnd = mulberry32(2417)
    const exposures = ['XC1', 'XC3', 'XD1', 'XS1'] as const
    for (let k = 0; k < 12; k++) {
      const slab = rnd() < 0.5
      const spans = Array.from({ length: 1 + Math.floor(rnd() * 4) }, () => 6000 + Math.round(rnd() * 4000))
      const input: MemberInputDraft = slab
        ? { ...twoSpan, geometry: { spans }, section: { kind: 'slab-strip', h: 220 + Math.round(rnd() * 80) } }
        : { ...DEMO_BB1, geometry: { spans }, profile: { mode: 'deepest', inflection: 0.1 } }
      const d = designMember({
        ...input,
        tendon: { ...input.tendon, bond: rnd() < 0.3 ? 'unbonded' : 'bonded' },
        limits: { exposure: exposures[Math.floor(rnd() * exposures.length)] },
        losses: { model: rnd() < 0.5 ? 'detailed' : 'percentage' },
        uls: { combination: rnd() < 0.5 ? '6.10' : '6.10a/b', branch: rnd() < 0.5 ? 'inclined' : 'horizontal', barsBottom: { area: Math.round(rnd() * 600) }, barsTop: { area: Math.round(rnd() * 600) } },
        ...(slab && spans.length > 1 ? { punching: { column: 'interior' as const, support: 2 } } : {}),
        site: { spacing: rnd() < 0.5 ? 500 : 1000 },
      }, { proposal: false })
      const leaves: Array<[string, number]> = []
      const walk = (v: unknown, p: string): void => {
        if (typeof v === 'number') leaves.push([p, v])
        else if (Array.isArray(v)) v.forEach((x, i) => walk(x, `${p}.${i}`))
        else if (v && typeof v === 'object') for (const [key, x] of Object.entries(v)) walk(x, p ? `${p}.${key}` : key)
      }
      walk({ uls: d.uls, deflection: d.deflection, cracking: d.cracking, site: d.site }, '')
      for (const [p, v] of leaves) {
        expect(Number.isFinite(v), p).toBe(true)
        expect(specFor(p), p).toBeDefined()
      }
      expect(d.uls.sections.every((s) => s.sagging === null || s.sagging.MRd > 0)).toBe(true)
    }
  })
})

describe('members with more prestress than they need', () => {
  // A fully compressed section has no cracked state: it is simply uncracked (EN 1992-1-1 7.1(2)).
  it('design without error when the prestress keeps the section in compression', () => {
    const cases = [
      { ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, spacing: 300 } },
      { ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, spacing: 500 } },
      { ...DEMO_BB1, tendon: { ...DEMO_BB1.tendon, count: 8 } },
      { ...DEMO_BB1, tendon: { ...DEMO_BB1.tendon, count: 12 } },
    ]
    for (const input of cases) {
      const design = designMember(input, { proposal: false })
      expect(design.cracking.sections.every((s) => s.wk === null || Number.isFinite(s.wk))).toBe(true)
      expect(design.checks.every((c) => Number.isFinite(c.utilisation))).toBe(true)
    }
  })
})

/** The same member drawn the other way round: spans, supports, low points, anchors and stressed end mirrored. */
function mirrored(m: MemberInputDraft): MemberInputDraft {
  const s = m.tendon.stressing ?? 'both'
  return {
    ...m,
    geometry: { ...m.geometry, spans: [...m.geometry.spans].reverse(), ...(m.geometry.supports ? { supports: [...m.geometry.supports].reverse() } : {}) },
    profile: {
      ...m.profile,
      ...(m.profile?.lowPointAt ? { lowPointAt: [...m.profile.lowPointAt].reverse().map((b) => 1 - b) } : {}),
      anchorLeft: m.profile?.anchorRight ?? 0, anchorRight: m.profile?.anchorLeft ?? 0,
    },
    tendon: { ...m.tendon, stressing: s === 'left' ? 'right' : s === 'right' ? 'left' : 'both' },
  }
}

describe('a member and its mirror image give the same checks (statics: mirrored member, mirrored actions)', () => {
  const variants: MemberInputDraft[] = []
  for (const base of [DEMO_PS2, DEMO_BB1]) {
    for (const inflection of [0, 0.1]) {
      for (const stressing of ['left', 'both'] as const) {
        for (const bond of ['bonded', 'unbonded'] as const) variants.push({ ...base, profile: { ...base.profile, inflection }, tendon: { ...base.tendon, stressing, bond } })
      }
    }
  }
  it('every check has the same actual value, limit and utilisation (kinks over supports included)', { timeout: 60_000 }, () => {
    for (const m of variants) {
      const a = designMember(m, { proposal: false })
      const b = designMember(mirrored(m), { proposal: false })
      expect(b.checks.map((c) => c.id).sort()).toEqual(a.checks.map((c) => c.id).sort())
      for (const c of a.checks) {
        const d = b.checks.find((x) => x.id === c.id)!
        for (const k of ['actual', 'limit', 'utilisation'] as const) {
          expect(Math.abs(c[k] - d[k]) / Math.max(1e-9, Math.abs(c[k])), `${c.id}.${k}, inflection ${m.profile?.inflection}, ${m.tendon.stressing}, ${m.tendon.bond}`).toBeLessThan(1e-6)
        }
      }
    }
  })
})
