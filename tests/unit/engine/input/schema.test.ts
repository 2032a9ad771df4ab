import { describe, expect, it } from 'vitest'
import { EngineInputError, INPUT_GROUPS, designMember, inputFieldSpecs, memberInputSchema, DEMO_PS2 } from '../../../../shared/engine/index'
import { isDisplayUnit } from '../../../../shared/utils/units'

const minimal = {
  geometry: { spans: [8000, 8000] },
  section: { kind: 'slab-strip', h: 250 },
  materials: { concreteClass: 'C30/37' },
  tendon: { coverTop: 25, coverBottom: 25 },
  loads: { superimposed: 1.5e-3, imposed: 2.5e-3 },
}

function fieldOf(fn: () => unknown): string {
  try {
    fn()
  } catch (e) {
    if (e instanceof EngineInputError) return e.field
    throw e
  }
  throw new Error('no error thrown')
}

describe('member input schema', () => {
  it('parsing a minimal input fills in the recommended EN values', () => {
    const v = memberInputSchema.parse(minimal)
    // EN 1992-1-1 5.10.2.1(1) and 5.10.3(2) recommended values
    expect([v.annex.k1, v.annex.k2, v.annex.k7, v.annex.k8]).toEqual([0.8, 0.9, 0.75, 0.85])
    // EN 1992-1-1 5.10.9(1) recommended values for post-tensioning
    expect([v.annex.rsupBonded, v.annex.rinfBonded, v.annex.rsupUnbonded, v.annex.rinfUnbonded]).toEqual([1.1, 0.9, 1.05, 0.95])
    // EN 1992-1-1 5.10.2.2(5) 0.6, 7.2(2) k1 = 0.6, 7.2(3) k2 = 0.45, 7.2(5) k5 = 0.75
    expect([v.annex.transferCompression, v.annex.k1Service, v.annex.k2Service, v.annex.k5]).toEqual([0.6, 0.6, 0.45, 0.75])
    // EN 1992-1-1 Table 5.1: μ = 0.19 for internal strand (from memory); wobble 0.005 /m within 0.005–0.01 (5.10.5.2(3))
    expect(v.losses.mu).toBe(0.19)
    expect(v.losses.wobble).toBeCloseTo(0.005 / 1000, 12)
    // EN 1990 Table A1.1, category A: ψ0 = 0.7, ψ1 = 0.5, ψ2 = 0.3
    expect([v.loads.psi0, v.loads.psi1, v.loads.psi2]).toEqual([0.7, 0.5, 0.3])
    expect(v.losses.drawIn).toBe(6) // common practice for wedge draw-in
  })
  it('every leaf field carries label, display unit, precision and a group of the fixed list', () => {
    const specs = inputFieldSpecs()
    expect(specs.length).toBeGreaterThan(40)
    for (const f of specs) {
      expect(f.spec.label.length).toBeGreaterThan(0)
      expect(isDisplayUnit(f.spec.unit)).toBe(true)
      expect(Number.isInteger(f.spec.precision)).toBe(true)
      expect(INPUT_GROUPS as readonly string[]).toContain(f.spec.group)
      if (f.kind === 'enum') expect((f.options ?? []).length).toBeGreaterThan(1)
    }
    const paths = specs.map((f) => f.path)
    expect(paths).toContain('geometry.spans')
    expect(paths).toContain('materials.concreteClass')
    expect(paths).toContain('annex.rsupBonded')
    expect(specs.find((f) => f.path === 'geometry.spans')?.spec.unit).toBe('m')
    expect(specs.find((f) => f.path === 'loads.imposed')?.spec.unit).toBe('kN/m²')
    expect(specs.find((f) => f.path === 'materials.concreteClass')?.options).toContain('C32/40')
  })
  it('a refinement that fails names the field path', () => {
    const r = memberInputSchema.safeParse({ ...minimal, geometry: { spans: [8000, 8000], supports: ['pinned', 'pinned'] } })
    expect(r.success).toBe(false)
    expect(r.error?.issues[0]?.path).toEqual(['geometry', 'supports'])
  })
})

describe('bad input gives a typed error naming the field, never NaN', () => {
  it('negative span', () => {
    expect(fieldOf(() => designMember({ ...minimal, geometry: { spans: [8000, -3000] } }))).toBe('geometry.spans.1')
  })
  it('unknown concrete class', () => {
    expect(fieldOf(() => designMember({ ...minimal, materials: { concreteClass: 'C33/41' } }))).toBe('materials.concreteClass')
  })
  it('zero strands', () => {
    expect(fieldOf(() => designMember({ ...minimal, tendon: { ...minimal.tendon, strandsPerTendon: 0 } }))).toBe('tendon.strandsPerTendon')
  })
  it('eccentricity outside the section', () => {
    const input = { ...minimal, profile: { mode: 'custom', supportEcc: [0, -80, 0], spanEcc: [80, 140] } }
    expect(fieldOf(() => designMember(input))).toBe('profile.spanEcc.1')
  })
  it('a custom profile without its eccentricities', () => {
    expect(fieldOf(() => designMember({ ...minimal, profile: { mode: 'custom' } }))).toBe('profile.supportEcc')
  })
  it('a band beam without its flange', () => {
    expect(fieldOf(() => designMember({ ...minimal, section: { kind: 'tee-beam', h: 400, bw: 2400 } }))).toBe('section.bf')
  })
  it('covers that leave no room in the depth', () => {
    expect(fieldOf(() => designMember({ ...minimal, section: { kind: 'slab-strip', h: 120 }, tendon: { coverTop: 40, coverBottom: 40 } }))).toBe('tendon.coverBottom')
  })
  it('a wrong type names its field', () => {
    expect(fieldOf(() => designMember({ ...DEMO_PS2, loads: { ...(DEMO_PS2.loads as object), imposed: 'five' } }))).toBe('loads.imposed')
  })
})
