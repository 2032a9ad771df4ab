import { describe, expect, it } from 'vitest'
import { bondRatioStrand, crackRequirement, crackWidth, decompressionCheck } from '../../../../shared/engine/sls/cracking'
import { fieldOf } from '../../../helpers/engine'

describe('EN 1992-1-1 Table 7.1N (recommended values)', () => {
  it('reinforced members and unbonded tendons: 0.4 / 0.3 / 0.3 mm, quasi-permanent', () => {
    expect(crackRequirement('XC1', 'none')).toMatchObject({ wmax: 0.4, combination: 'quasi-permanent', decompression: null })
    expect(crackRequirement('XC3', 'unbonded')).toMatchObject({ wmax: 0.3, combination: 'quasi-permanent' })
    expect(crackRequirement('XS2', 'none').wmax).toBe(0.3)
  })
  it('bonded tendons: 0.2 mm frequent; XC2–XC4 also decompression quasi-permanent; XD/XS decompression frequent', () => {
    expect(crackRequirement('X0', 'bonded')).toMatchObject({ wmax: 0.2, combination: 'frequent', decompression: null })
    expect(crackRequirement('XC4', 'bonded')).toMatchObject({ wmax: 0.2, combination: 'frequent', decompression: 'quasi-permanent' })
    expect(crackRequirement('XD1', 'bonded')).toMatchObject({ wmax: null, decompression: 'frequent' })
    expect(crackRequirement('XS3', 'bonded').decompression).toBe('frequent')
  })
  it('a class outside the table names the field', () => {
    expect(fieldOf(() => crackRequirement('XF1', 'bonded'))).toBe('exposure')
  })
})

describe('crack width, EN 1992-1-1 7.3.4', () => {
  it('a reinforced slab strip by hand: eqs. (7.8)–(7.11)', () => {
    const Ecm = 22000 * (40 / 10) ** 0.3 // Table 3.1 for C32/40: 33.3 GPa
    const r = crackWidth({ sigmaS: 250, Ecm, fctEff: 3.0, duration: 'long', As: 1000, phiS: 12, Ap: 0, fck: 32, b: 1000, h: 260, d: 220, x: 50, c: 30 })
    // hc,ef = min(2.5·40, 210/3, 130) = 70 mm (7.3.2(3)); ρp,eff = 1000/70 000
    expect(r.hcEff).toBeCloseTo(70, 9)
    expect(r.rhoPEff).toBeCloseTo(1000 / 70000, 12)
    // εsm − εcm = (250 − 0.4·3.0/ρ·(1 + αe ρ))/200 000 = 7.940e-4 (by hand)
    expect(r.strainDifference).toBeCloseTo(7.940e-4, 7)
    // sr,max = 3.4·30 + 0.8·0.5·0.425·12/ρ = 244.8 mm (by hand)
    expect(r.srMax).toBeCloseTo(244.8, 6)
    expect(r.wk).toBeCloseTo(0.1944, 4)
  })

  it('the 0.6 σs/Es floor of eq. (7.9) and the wide-spacing rule (7.14)', () => {
    const r = crackWidth({ sigmaS: 100, Ecm: 33000, fctEff: 3.0, duration: 'short', As: 500, phiS: 12, Ap: 0, fck: 32, b: 1000, h: 260, d: 220, x: 50, c: 30, spacing: 400 })
    expect(r.strainDifference).toBeCloseTo((0.6 * 100) / 200000, 12)
    expect(r.wideSpacing).toBe(true) // 400 > 5(30 + 6) = 180
    expect(r.srMax).toBeCloseTo(1.3 * 210, 9)
  })

  it('bonded strands count through ξ1: √ξ alone, √(ξ φs/φp) with bars (eq. (7.5), Table 6.2)', () => {
    expect(bondRatioStrand(32)).toBe(0.5) // Table 6.2, strands, bonded post-tensioned, ≤ C50/60
    expect(bondRatioStrand(80)).toBe(0.25) // Table 6.2, ≥ C70/85
    const alone = crackWidth({ sigmaS: 150, Ecm: 33000, fctEff: 3.0, duration: 'long', As: 0, Ap: 400, phiP: 1.6 * Math.sqrt(400), fck: 32, b: 1000, h: 260, d: 200, x: 60, c: 40 })
    expect(alone.xi1).toBeCloseTo(Math.sqrt(0.5), 12)
    expect(alone.k1).toBe(1.6)
    const mixed = crackWidth({ sigmaS: 150, Ecm: 33000, fctEff: 3.0, duration: 'long', As: 500, phiS: 12, Ap: 400, phiP: 32, fck: 32, b: 1000, h: 260, d: 220, x: 60, c: 30 })
    expect(mixed.xi1).toBeCloseTo(Math.sqrt((0.5 * 12) / 32), 12)
    expect(mixed.rhoPEff).toBeCloseTo((500 + ((0.5 * 12) / 32) * 400) / mixed.AcEff, 12)
  })

  it('bad input names the field', () => {
    const ok = { sigmaS: 150, Ecm: 33000, fctEff: 3.0, duration: 'long' as const, As: 500, phiS: 12, Ap: 0, fck: 32, b: 1000, h: 260, d: 220, x: 60, c: 30 }
    expect(fieldOf(() => crackWidth({ ...ok, x: 240 }))).toBe('x')
    expect(fieldOf(() => crackWidth({ ...ok, phiS: undefined }))).toBe('phiS')
    expect(fieldOf(() => crackWidth({ ...ok, As: 0 }))).toBe('As')
  })
})

describe('decompression (7.3.1(5): 25 mm beyond the duct stays in compression)', () => {
  it('linear stress at the duct edge + 25 mm towards the tension face', () => {
    // 260 mm strip, tendon at 200 mm, duct 20 mm high: level 200 + 10 + 25 = 235 mm
    const r = decompressionCheck({ sigmaTop: 3, sigmaBottom: -0.5, h: 260, tendonDepth: 200, ductHeight: 20 })
    expect(r.level).toBe(235)
    expect(r.stress).toBeCloseTo(3 - (3.5 * 235) / 260, 12)
    expect(r.pass).toBe(false)
    const top = decompressionCheck({ sigmaTop: -0.2, sigmaBottom: 4, h: 260, tendonDepth: 60, ductHeight: 20 })
    expect(top.level).toBe(25)
    expect(top.pass).toBe(true)
  })
})
