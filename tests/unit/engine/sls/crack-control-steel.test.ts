import { fieldOf } from '../../../helpers/engine'
import { describe, expect, it } from 'vitest'
import {
  bondAdjustedRatio, bondRatioPostTensioned, crackSizeFactor, kcFlange, kcWeb, maxBarDiameter, maxBarDiameterTable, maxBarSpacing,
  minimumCrackSteel, tendonEquivalentDiameter, tensileDepthAtCracking,
} from '../../../../shared/engine/sls/crack-control-steel'
import { EngineInputError } from '../../../../shared/engine/contract'

describe('factors of EN 1992-1-1 7.3.2(2)', () => {
  it('k = 1.0 up to 300 mm, 0.65 from 800 mm, interpolated between', () => {
    expect(crackSizeFactor(260)).toBe(1.0)
    expect(crackSizeFactor(300)).toBe(1.0)
    expect(crackSizeFactor(800)).toBe(0.65)
    expect(crackSizeFactor(1200)).toBe(0.65)
    expect(crackSizeFactor(400)).toBeCloseTo(0.93, 12) // 1 − 0.35 × 100/500
    expect(crackSizeFactor(550)).toBeCloseTo(0.825, 12) // midway
  })

  it('kc of eq. (7.2): 0.4 in pure bending, lower with precompression (k1 = 1.5), higher with tension (k1·h/h* = 2/3)', () => {
    expect(kcWeb({ b: 1000, h: 260, NEd: 0, fctEff: 2.9 })).toBeCloseTo(0.4, 12)
    // σc = 260 000 / (1000 × 260) = 1.0 MPa; kc = 0.4 × (1 − 1.0/(1.5 × 1 × 2.9)) = 0.30805
    expect(kcWeb({ b: 1000, h: 260, NEd: 260e3, fctEff: 2.9 })).toBeCloseTo(0.4 * (1 - 1 / 4.35), 12)
    // h = 1200 mm: h* = 1000, k1 = 2h*/(3h) = 0.5556 for tension; σc = −0.5 → kc = 0.4 × (1 + 0.5/(0.5556 × 1.2 × 2.9)) = 0.50345
    expect(kcWeb({ b: 500, h: 1200, NEd: -0.5 * 500 * 1200, fctEff: 2.9 })).toBeCloseTo(0.4 * (1 + 0.5 / ((2 / 3) * 2.9)), 12)
    // precompression beyond 1.5·fct,eff: no minimum steel from eq. (7.2) (kc not below 0); strong tension: kc ≤ 1
    expect(kcWeb({ b: 1000, h: 260, NEd: 5 * 260e3, fctEff: 2.9 })).toBe(0)
    expect(kcWeb({ b: 1000, h: 260, NEd: -10 * 260e3, fctEff: 2.9 })).toBe(1)
  })

  it('kc of eq. (7.3) for flanges: 0.9·Fcr/(Act·fct,eff), not below 0.5', () => {
    // 0.9 × 300 000 / (120 000 × 2.9) = 0.7759
    expect(kcFlange({ Fcr: 300e3, Act: 120e3, fctEff: 2.9 })).toBeCloseTo(0.9 * 300e3 / (120e3 * 2.9), 12)
    expect(kcFlange({ Fcr: 100e3, Act: 120e3, fctEff: 2.9 })).toBe(0.5)
  })

  it('tendons: ξ of Table 6.2 (bonded post-tensioned, from memory), φp of 7.3.2(3), ξ1 of eq. (7.5)', () => {
    expect(bondRatioPostTensioned('strands', 40)).toBe(0.5)
    expect(bondRatioPostTensioned('strands', 80)).toBe(0.25)
    expect(bondRatioPostTensioned('ribbed bars', 30)).toBe(0.7)
    expect(tendonEquivalentDiameter({ kind: 'bundle', Ap: 600 })).toBeCloseTo(1.6 * Math.sqrt(600), 12) // 39.19 mm
    expect(tendonEquivalentDiameter({ kind: '7-wire strand', wireDiameter: 5.2 })).toBeCloseTo(9.1, 12) // 1.75 × 5.2
    expect(bondAdjustedRatio({ xi: 0.5, phiP: 1.6 * Math.sqrt(600), phiS: 12 })).toBeCloseTo(Math.sqrt((0.5 * 12) / 39.1918), 4) // 0.3913
    expect(bondAdjustedRatio({ xi: 0.5, phiP: 39.19 })).toBeCloseTo(Math.SQRT1_2, 12) // only tendons: √ξ
  })
})

describe('As,min of eq. (7.1)', () => {
  // 260 mm slab strip, 1 m wide, C30/37: fctm = 2.9 MPa (Table 3.1), precompression P/A = 1.0 MPa
  // hcr = (h/2)·fct/(fct + σc) = 130 × 2.9/3.9 = 96.67 mm (linear stress: +2.9 at the soffit, −1.0 at mid-depth)
  // Act = 1000 × 96.67 = 96 667 mm²; kc = 0.30805 (above); k = 1.0 (h ≤ 300)
  const hcr = tensileDepthAtCracking({ h: 260, fctEff: 2.9, sigmaC: 1.0 })
  const slab = { Act: 1000 * hcr, fctEff: 2.9, sigmaS: 500, kDimension: 260, stress: { kind: 'web' as const, b: 1000, h: 260, NEd: 260e3 } }

  it('260 mm slab strip: As,min = kc·k·fct,eff·Act/σs = 0.30805 × 1.0 × 2.9 × 96 667/500 = 172.7 mm²/m', () => {
    expect(hcr).toBeCloseTo((130 * 2.9) / 3.9, 9)
    const r = minimumCrackSteel(slab)
    const hand = (0.4 * (1 - 1 / 4.35) * 1.0 * 2.9 * ((130 * 2.9) / 3.9) * 1000) / 500
    expect(hand).toBeCloseTo(172.7, 1)
    expect(r.AsMin).toBeCloseTo(hand, 9)
    expect(r.required).toBe(true)
    // with σs = 280 MPa (Table 7.2N: φ*s = 12 mm at wk = 0.3) the same force needs 500/280 times the steel: 308.4 mm²/m
    expect(minimumCrackSteel({ ...slab, sigmaS: 280 }).AsMin).toBeCloseTo((hand * 500) / 280, 9)
  })

  it('260 mm slab strip with a bonded 4-strand tendon per 1.2 m: ξ1·Ap\'·Δσp comes off the left side (7.3.2(3))', () => {
    // Ap' = 600/1.2 = 500 mm²/m, Δσp = 200 MPa, ξ = 0.5 (Table 6.2), φp = 1.6√600 = 39.19 mm, φs = 12 → ξ1 = 0.3913
    // tendon share 0.3913 × 500 × 200 = 39 130 N; cracking force 0.30805 × 2.9 × 96 667 = 86 357 N → As,min = 47 227/500 = 94.5 mm²/m
    const r = minimumCrackSteel({ ...slab, tendons: { ApPrime: 500, deltaSigmaP: 200, xi: 0.5, phiP: 1.6 * Math.sqrt(600), phiS: 12 } })
    const xi1 = Math.sqrt((0.5 * 12) / (1.6 * Math.sqrt(600)))
    expect(r.xi1).toBeCloseTo(xi1, 12)
    expect(r.tendonForce).toBeCloseTo(xi1 * 500 * 200, 6)
    expect(r.crackingForce).toBeCloseTo(86357, -1)
    expect(r.AsMin).toBeCloseTo((r.crackingForce - xi1 * 500 * 200) / 500, 9)
    expect(r.AsMin).toBeCloseTo(94.5, 0)
    // enough tendon steel leaves nothing to add, never a negative area
    expect(minimumCrackSteel({ ...slab, tendons: { ApPrime: 5000, deltaSigmaP: 200, xi: 0.5, phiP: 39.19 } }).AsMin).toBe(0)
  })

  it('7.3.2(4): no minimum steel where the characteristic tension stays within fct,eff', () => {
    expect(minimumCrackSteel({ ...slab, sigmaCtCharacteristic: 2.5 }).AsMin).toBe(0)
    expect(minimumCrackSteel({ ...slab, sigmaCtCharacteristic: 2.5 }).required).toBe(false)
    expect(minimumCrackSteel({ ...slab, sigmaCtCharacteristic: 3.1 }).AsMin).toBeCloseTo(minimumCrackSteel(slab).AsMin, 12)
    expect(minimumCrackSteel({ ...slab, sigmaCtCharacteristic: 2.5, sigmaCtP: 2.0 }).required).toBe(true) // a national σct,p
  })

  it('400 mm band beam, 2400 mm wide, C40/50 (fctm = 3.5, Table 3.1), P/A = 2.0 MPa: As,min = 492.4 mm²', () => {
    // NEd = 2.0 × 2400 × 400 = 1 920 kN; kc = 0.4 × (1 − 2.0/(1.5 × 3.5)) = 0.24762; k = 1 − 0.35 × 100/500 = 0.93
    // hcr = 200 × 3.5/5.5 = 127.27 mm; Act = 2400 × 127.27 = 305 455 mm²; As,min = 0.24762 × 0.93 × 3.5 × 305 455/500 = 492.4 mm²
    const h = tensileDepthAtCracking({ h: 400, fctEff: 3.5, sigmaC: 2.0 })
    const r = minimumCrackSteel({ Act: 2400 * h, fctEff: 3.5, sigmaS: 500, kDimension: 400, stress: { kind: 'web', b: 2400, h: 400, NEd: 2.0 * 2400 * 400 } })
    expect(r.kc).toBeCloseTo(0.4 * (1 - 2.0 / 5.25), 12)
    expect(r.k).toBeCloseTo(0.93, 12)
    const hand = (0.4 * (1 - 2 / 5.25) * 0.93 * 3.5 * 2400 * ((200 * 3.5) / 5.5)) / 500
    expect(hand).toBeCloseTo(492.4, 1)
    expect(r.AsMin).toBeCloseTo(hand, 9)
  })

  it('pure tension kc = 1.0 and flanges by eq. (7.3)', () => {
    // 1.0 × 1.0 × 2.9 × 100 000/500 = 580 mm²
    expect(minimumCrackSteel({ Act: 100e3, fctEff: 2.9, sigmaS: 500, kDimension: 200, stress: { kind: 'tension' } }).AsMin).toBeCloseTo(580, 9)
    const f = minimumCrackSteel({ Act: 120e3, fctEff: 2.9, sigmaS: 500, kDimension: 1000, stress: { kind: 'flange', Fcr: 300e3 } })
    expect(f.AsMin).toBeCloseTo((0.9 * 300e3 * 0.65) / 500, 9) // kc·fct·Act = 0.9·Fcr, k = 0.65 for a flange over 800 mm wide
  })

  it('bad input names the field, never NaN', () => {
    expect(fieldOf(() => minimumCrackSteel({ ...slab, Act: 0 }))).toBe('Act')
    expect(fieldOf(() => minimumCrackSteel({ ...slab, sigmaS: Number.NaN }))).toBe('sigmaS')
    expect(fieldOf(() => minimumCrackSteel({ ...slab, stress: { kind: 'web', b: 1000, h: 260, NEd: Number.POSITIVE_INFINITY } }))).toBe('NEd')
    expect(fieldOf(() => minimumCrackSteel({ ...slab, tendons: { ApPrime: 500, deltaSigmaP: 200, xi: 0.5, phiP: 0 } }))).toBe('phiP')
    expect(fieldOf(() => maxBarDiameterTable({ sigmaS: 240, wk: 0.25 }))).toBe('wk')
    expect(fieldOf(() => maxBarDiameter({ phiStar: 12, fctEff: 2.9, hcr: 100, h: 260, d: 260, loading: 'tension' }))).toBe('d')
  })
})

describe('Tables 7.2N and 7.3N (values from memory of EN 1992-1-1:2004 — check against the standard)', () => {
  it('Table 7.2N maximum bar diameter φ*s at wk = 0.4 / 0.3 / 0.2 mm', () => {
    const rows: Array<[number, number, number, number | null]> = [
      [160, 40, 32, 25], [200, 32, 25, 16], [240, 20, 16, 12], [280, 16, 12, 8], [320, 12, 10, 6], [360, 10, 8, 5], [400, 8, 6, 4], [450, 6, 5, null],
    ]
    for (const [s, a, b, c] of rows) {
      expect(maxBarDiameterTable({ sigmaS: s, wk: 0.4 })).toBe(a)
      expect(maxBarDiameterTable({ sigmaS: s, wk: 0.3 })).toBe(b)
      expect(maxBarDiameterTable({ sigmaS: s, wk: 0.2 })).toBe(c)
    }
    expect(maxBarDiameterTable({ sigmaS: 260, wk: 0.3 })).toBeCloseTo(14, 12) // between 240 (16) and 280 (12), linear (common practice)
    expect(maxBarDiameterTable({ sigmaS: 120, wk: 0.3 })).toBe(32) // below the first row: the first row
    expect(maxBarDiameterTable({ sigmaS: 500, wk: 0.4 })).toBeNull() // beyond the table
    expect(maxBarDiameterTable({ sigmaS: 420, wk: 0.2 })).toBeNull() // towards an empty cell
  })

  it('Table 7.3N maximum bar spacing at wk = 0.4 / 0.3 / 0.2 mm', () => {
    const rows: Array<[number, number, number, number | null]> = [
      [160, 300, 300, 200], [200, 300, 250, 150], [240, 250, 200, 100], [280, 200, 150, 50], [320, 150, 100, null], [360, 100, 50, null],
    ]
    for (const [s, a, b, c] of rows) {
      expect(maxBarSpacing({ sigmaS: s, wk: 0.4 })).toBe(a)
      expect(maxBarSpacing({ sigmaS: s, wk: 0.3 })).toBe(b)
      expect(maxBarSpacing({ sigmaS: s, wk: 0.2 })).toBe(c)
    }
    expect(maxBarSpacing({ sigmaS: 220, wk: 0.3 })).toBeCloseTo(225, 12)
    expect(maxBarSpacing({ sigmaS: 400, wk: 0.4 })).toBeNull()
  })

  it('bar size correction: the tables\' own basis (kc = 0.4, hcr = 0.5h, h − d = 0.1h, fct,eff = 2.9) leaves φ*s unchanged', () => {
    // eq. (7.6N): φs = φ*s·(2.9/2.9)·0.4·0.5h/(2·0.1h) = φ*s
    expect(maxBarDiameter({ phiStar: 16, fctEff: 2.9, kc: 0.4, hcr: 130, h: 260, d: 234, loading: 'bending' })).toBeCloseTo(16, 12)
    // 260 mm slab: kc = 0.30805, hcr = 96.67, d = 224 → φs = 12 × 0.30805 × 96.67/72 = 4.96 mm
    expect(maxBarDiameter({ phiStar: 12, fctEff: 2.9, kc: 0.4 * (1 - 1 / 4.35), hcr: (130 * 2.9) / 3.9, h: 260, d: 224, loading: 'bending' })).toBeCloseTo((12 * 0.4 * (1 - 1 / 4.35) * ((130 * 2.9) / 3.9)) / 72, 12)
    // eq. (7.7N), tension: φs = φ*s·(fct,eff/2.9)·hcr/(8(h − d)) = 20 × (3.5/2.9) × 200/(8 × 40) = 15.09 mm
    expect(maxBarDiameter({ phiStar: 20, fctEff: 3.5, hcr: 200, h: 400, d: 360, loading: 'tension' })).toBeCloseTo((20 * (3.5 / 2.9) * 200) / 320, 12)
  })
})
