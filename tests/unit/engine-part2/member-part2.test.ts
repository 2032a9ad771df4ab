import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember, inputFieldSpecs, specFor } from '../../../shared/engine/index'
import type { MemberInputDraft } from '../../../shared/engine/index'
import { fieldOf, rel } from './helpers'
import { mulberry32 } from './prng'

const twoSpan: MemberInputDraft = {
  geometry: { spans: [8000, 8000] },
  section: { kind: 'slab-strip', h: 250 },
  materials: { concreteClass: 'C32/40' },
  tendon: { strandsPerTendon: 3, spacing: 600, coverTop: 25, coverBottom: 25, stressing: 'both' },
  profile: { mode: 'deepest', inflection: 0.1 },
  loads: { superimposed: 1.5e-3, imposed: 4.0e-3 },
}

describe('part 2 in the member design', () => {
  const d = designMember(DEMO_PS2, { proposal: false })

  it('adds uls, deflection, cracking and site, with checks in the uls, sls, detailing and site groups', () => {
    expect(d.engineVersion).toBe('1.2.0')
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

  it('two equal spans: hogging design moment −0.125·(γG g + γQ q)L² plus γP·M2 (handbook coefficient; EN 1990 eq. (6.10))', () => {
    const m = designMember(twoSpan, { proposal: false })
    const L = 8000
    const G = m.loads.selfWeight + m.loads.superimposed
    const Q = m.loads.imposed
    const s = m.uls.sections.find((x) => x.id === 'support-2')!
    const M2 = Math.min(m.prestressMoments.transfer.secondary[1]!, m.prestressMoments.service.secondary[1]!)
    expect(rel(s.MEdMin, -0.125 * (1.35 * G + 1.5 * Q) * L * L + 1.0 * M2)).toBeLessThan(1e-6)
  })

  it('two equal spans: end shear 0.375·γG g L + 0.4375·γQ q L (one span loaded) plus the secondary shear (handbook coefficients)', () => {
    const m = designMember(twoSpan, { proposal: false })
    const L = 8000
    const G = m.loads.selfWeight + m.loads.superimposed
    const Q = m.loads.imposed
    const v = m.uls.shear.find((x) => x.id === 'support-1-right')!
    const M2 = Math.max(m.prestressMoments.transfer.secondary[1]!, m.prestressMoments.service.secondary[1]!)
    expect(rel(v.VEd, 0.375 * 1.35 * G * L + 0.4375 * 1.5 * Q * L + M2 / L)).toBeLessThan(1e-6)
  })

  it('the passive steel proposed, added to the input, makes the bending checks pass', () => {
    // the demo slab without its top bars is short over the supports at ULS
    const bare = designMember({ ...DEMO_PS2, uls: {} }, { proposal: false })
    expect(bare.checks.find((c) => c.id === 'uls.bending.hogging')!.pass).toBe(false)
    const again = designMember({ ...DEMO_PS2, uls: { barsTop: { area: Math.ceil(bare.uls.proposal.AsTop as number) }, barsBottom: { area: Math.ceil(bare.uls.proposal.AsBottom as number) } } }, { proposal: false })
    for (const id of ['uls.bending.sagging', 'uls.bending.hogging']) expect(again.checks.find((c) => c.id === id)?.pass, id).toBe(true)
  })

  it('long-term deflection of an uncracked member is (1 + φ) times the short-term one (EN 1992-1-1 eq. (7.20))', () => {
    for (const s of d.deflection.spans) {
      if (s.cracked) continue
      expect(rel(s.longTerm.down, (1 + d.deflection.phi) * s.shortTerm.down)).toBeLessThan(1e-9)
    }
  })

  it('tendon heights: the duct touches the covers at the high and low points of the deepest profile (geometry)', () => {
    const row = d.site.heights.spans[1]!.rows[0]!
    expect(row.kind).toBe('support')
    expect(row.centroid).toBeCloseTo(260 - d.eccentricity.dTop, 6) // the strand centroid at the top eccentricity limit
    expect(row.underside).toBeCloseTo(260 - 25 - 19, 6) // the duct touches the top cover: h − cover − duct height
    const low = d.site.heights.spans[1]!.rows.find((r) => r.kind === 'low')!
    expect(low.underside).toBeCloseTo(25, 6) // the duct rests on the bottom cover
  })

  it('stressing: the extension agrees with the integral of the part-1 friction curve (independent sampling)', () => {
    const b = designMember(DEMO_BB1, { proposal: false })
    const X = b.series.X
    const P = b.series.forceFriction
    let area = 0
    for (let i = 1; i < X.length; i++) area += ((P[i - 1]! + P[i]!) / 2) * (X[i]! - X[i - 1]!) // trapezoidal rule
    const perMember = area / (b.strand.Ep * b.jacking.Ap) // the whole member's tendons: the same extension per tendon
    const t = b.site.stressing.tendons[0]!
    expect(b.site.stressing.tendons).toHaveLength(4)
    expect(rel(t.extension.total, perMember)).toBeLessThan(0.01)
    expect(t.Pjack).toBeCloseTo(b.jacking.sigmaJack * 5 * 100, 6)
  })

  it('measured extensions outside the band fail a site check', () => {
    const calc = d.site.stressing.tendons[0]!.extension.total
    const ok = designMember({ ...DEMO_PS2, site: { measured: [calc * 1.03] } }, { proposal: false })
    expect(ok.checks.find((c) => c.id === 'site.extension.T1')?.pass).toBe(true)
    const bad = designMember({ ...DEMO_PS2, site: { measured: [calc * 0.85] } }, { proposal: false })
    const c = bad.checks.find((x) => x.id === 'site.extension.T1')!
    expect(c.pass).toBe(false)
    expect(c.actual).toBeCloseTo(0.15, 9)
  })

  it('punching at an interior column of the slab strip', () => {
    const p = designMember({ ...DEMO_PS2, punching: { column: 'interior', support: 2, c1: 500, c2: 500, panelWidth: 7000 } }, { proposal: false })
    const r = p.uls.punching!
    expect(r.u1).toBeCloseTo(2000 + 4 * Math.PI * r.d, 6) // EN 1992-1-1 Fig. 6.13
    expect(r.Vpd).toBeGreaterThan(0)
    expect(p.checks.some((c) => c.id === 'uls.punching')).toBe(true)
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => designMember({ ...DEMO_BB1, punching: { column: 'interior' } }, { proposal: false }))).toBe('punching.column')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, punching: { column: 'edge', support: 9 } }, { proposal: false }))).toBe('punching.support')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, site: { measured: [100, 120] } }, { proposal: false }))).toBe('site.measured')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, uls: { gammaG: 3 } }, { proposal: false }))).toBe('uls.gammaG')
    expect(fieldOf(() => designMember({ ...DEMO_PS2, site: { spacing: 0 } }, { proposal: false }))).toBe('site.spacing')
  })
})

describe('part 2 over varied members (seeded)', () => {
  it('finite results and a spec-complete shape for every option', () => {
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
