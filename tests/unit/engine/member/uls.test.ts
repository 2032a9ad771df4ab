import { readFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import type { MemberInputDraft } from '../../../../shared/engine/index'
import { rel } from '../../../helpers/engine'

const twoSpan: MemberInputDraft = {
  geometry: { spans: [8000, 8000] },
  section: { kind: 'slab-strip', h: 250 },
  materials: { concreteClass: 'C32/40' },
  tendon: { strandsPerTendon: 3, spacing: 600, coverTop: 25, coverBottom: 25, stressing: 'both' },
  profile: { mode: 'deepest', inflection: 0.1 },
  loads: { superimposed: 1.5e-3, imposed: 4.0e-3 },
}

describe('ULS stage in the member design', () => {
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

  it('punching at an interior column of the slab strip', () => {
    const p = designMember({ ...DEMO_PS2, punching: { column: 'interior', support: 2, c1: 500, c2: 500, panelWidth: 7000 } }, { proposal: false })
    const r = p.uls.punching!
    expect(r.u1).toBeCloseTo(2000 + 4 * Math.PI * r.d, 6) // EN 1992-1-1 Fig. 6.13
    expect(r.Vpd).toBeGreaterThan(0)
    expect(p.checks.some((c) => c.id === 'uls.punching')).toBe(true)
  })
})

describe('ULS faces at pinned ends', () => {
  it('a pinned end carries no moment (statics): MEd is exactly 0 there and neither face is checked', () => {
    for (const m of [DEMO_PS2, { ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, bond: 'unbonded' as const } }]) {
      const d = designMember(m, { proposal: false })
      const n = d.input.geometry.spans.length
      for (const id of ['support-1', `support-${n + 1}`]) {
        const s = d.uls.sections.find((x) => x.id === id)!
        expect(s.MEdMax, id).toBe(0)
        expect(s.MEdMin, id).toBe(0)
        expect(s.sagging, id).toBeNull()
        expect(s.hogging, id).toBeNull()
      }
    }
  })
})

describe('citations inside an EN 1992 sheet', () => {
  it('the results cite EN 1992-1-1, EN 1990, the national annex or common practice, never another national code', () => {
    // foreign design codes a checker would not accept as the basis of an EN 1992 calculation (common practice of review)
    const foreign = /\b(ACI ?3\d\d|BS ?8110|BS ?5400|AS ?3600|CSA ?A23|IS ?456|NZS ?3101|TR ?43|AASHTO|PTI)\b/
    for (const m of [DEMO_PS2, DEMO_BB1]) {
      const text = JSON.stringify(designMember(m, { proposal: false }))
      expect(text.match(foreign)?.[0] ?? null).toBeNull()
    }
    // the built-in templates and their browser copy
    const root = fileURLToPath(new URL('../../../../', import.meta.url))
    const texts = [...readdirSync(join(root, 'content-templates')).map((f) => join(root, 'content-templates', f)), join(root, 'shared/report/builtins/texts.ts')]
    for (const f of texts) expect(readFileSync(f, 'utf8').match(foreign)?.[0] ?? null, f).toBeNull()
  })
})
