import { describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { SUPPORT_STEEL_RULE, reinforcementLimits, supportBondedSteel, tensionZoneSteel } from '../../../../shared/engine/uls/reinforcement'

describe('minimum and maximum reinforcement (EN 1992-1-1 9.2.1.1, 9.3.1.1)', () => {
  it('eq. (9.1N) for C32/40 and B500: 0.26·fctm/fyk governs over 0.0013', () => {
    const fctm = 0.3 * 32 ** (2 / 3) // Table 3.1: 3.02 MPa
    const r = reinforcementLimits({ member: 'slab', fctm, fyk: 500, bt: 1000, d: 220, h: 260, Ac: 260e3 })
    expect(r.AsMin).toBeCloseTo(345.9, 1) // by hand: 0.26·3.024/500·1000·220
    expect(r.AsMax).toBeCloseTo(0.04 * 260e3, 9) // 9.2.1.1(3)
    expect(r.secondaryFraction).toBe(0.2) // 9.3.1.1(2)
    // 9.3.1.1(3) for h = 260 mm: 3h → 400, 3.5h → 450, 2h → 250, 3h → 400
    expect(r.maxSpacing).toEqual({ principal: 400, secondary: 450, principalAtMaxMoment: 250, secondaryAtMaxMoment: 400 })
  })

  it('the 0.0013·bt·d floor governs for low-strength concrete', () => {
    const r = reinforcementLimits({ member: 'beam', fctm: 2.2, fyk: 500, bt: 300, d: 500, h: 550, Ac: 300 * 550 })
    expect(r.AsMin).toBeCloseTo(0.0013 * 300 * 500, 9) // 0.26·2.2/500 = 0.00114 < 0.0013
    expect(r.maxSpacing).toBeNull()
  })

  it('bonded top steel over the columns (common practice: 0.075 % of h·l2)', () => {
    const r = supportBondedSteel({ h: 260, panelWidth: 7800, columnWidth: 400 })
    expect(r.As).toBeCloseTo(0.00075 * 260 * 7800, 9)
    expect(r.bandWidth).toBe(400 + 3 * 260)
  })

  it('tension-zone steel Nc/(0.5 fyk) (common practice)', () => {
    // a triangle of stress: 2 MPa tension at the bottom, 6 MPa compression at the top of a 260 mm strip
    const r = tensionZoneSteel({ sigmaTension: 2, sigmaCompression: 6, h: 260, b: 1000, fyk: 500 })
    expect(r.depthInTension).toBeCloseTo(65, 9)
    expect(r.Nc).toBeCloseTo(0.5 * 2 * 65 * 1000, 6)
    expect(r.As).toBeCloseTo(65000 / 250, 6)
  })
})

describe('sources of the reinforcement rules', () => {
  // Tendonbook designs to EN 1992-1-1: a rule it does not set is common practice, never another country's code
  const foreign = /\b(ACI|AS ?3600|BS ?8110|CSA|IS ?456|NZS|GB ?50010|AASHTO|PTI)\b/
  it('the support-steel rule cites common practice and no foreign code', () => {
    expect(SUPPORT_STEEL_RULE).toContain('common practice')
    expect(SUPPORT_STEEL_RULE).not.toMatch(foreign)
    expect(supportBondedSteel({ h: 250, panelWidth: 8000, columnWidth: 400 }).rule).toBe(SUPPORT_STEEL_RULE)
  })
  it('the module names no foreign code anywhere', () => {
    const source = readFileSync(new URL('../../../../shared/engine/uls/reinforcement.ts', import.meta.url), 'utf8')
    expect(source).not.toMatch(foreign)
  })
})
