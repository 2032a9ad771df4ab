import { describe, expect, it } from 'vitest'
import { crackSteelFaces } from '../../../../shared/engine/member/crack-steel'
import type { CrackSteelInput } from '../../../../shared/engine/member/crack-steel'
import { maxBarDiameterTable, steelStressForBarSize } from '../../../../shared/engine/sls/crack-control-steel'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { prng } from '../../../helpers/prng'

/**
 * A section, its characteristic stresses and its bars, as the SLS stage hands them over; only what
 * eq. (7.1) reads. Stresses: compression +, tension −. Values invented for the hand calculation.
 */
function member(o: { outline: CrackSteelInput['section']['outline']; A: number; yt: number; yb: number; isSlab: boolean; fctm: number; topMin: number; bottomMin: number; sigmaC: number; top: { area: number; diameter: number }; bottom: { area: number; diameter: number } }, wmax: number | null): CrackSteelInput {
  const rinf = 0.95
  return {
    input: { uls: { fyk: 500, barsTop: { ...o.top, cover: 30 }, barsBottom: { ...o.bottom, cover: 30 } } } as unknown as CrackSteelInput['input'],
    section: { properties: { A: o.A, h: o.outline.h, yt: o.yt, yb: o.yb }, outline: o.outline, isSlab: o.isSlab, at28: { fctm: o.fctm } } as unknown as CrackSteelInput['section'],
    stresses: { rinf, sections: [{ label: 'Span 1, low point', X: 4000, envelope: { characteristic: { topMin: o.topMin, bottomMin: o.bottomMin } } }] } as unknown as CrackSteelInput['stresses'],
    Pmean: (o.sigmaC * o.A) / rinf, // so that rinf·Pm/A = σc
    wmax,
  }
}

// 250 mm slab strip, 1 m wide, C35/45: fctm = 3.2 MPa (EN 1992-1-1 Table 3.1), mean precompression 1.5 MPa
const slab = (topMin: number, wmax: number | null, topBar = { area: 524, diameter: 10 }) => member({
  outline: { kind: 'rectangle', b: 1000, h: 250 }, A: 250e3, yt: 125, yb: 125, isSlab: true, fctm: 3.2,
  topMin, bottomMin: 1.0, sigmaC: 1.5, top: topBar, bottom: { area: 0, diameter: 12 },
}, wmax)

describe('least steel for crack control of a member, EN 1992-1-1 7.3.2 (hand calculations)', () => {
  it('a slab strip in hogging, no crack width limit: σs = fyk', () => {
    // hct = (h/2)·fct/(fct + σc) = 125 × 3.2/4.7 = 85.106 mm; Act = 1000 × 85.106 = 85 106 mm²
    // kc = 0.4 × (1 − 1.5/(1.5 × 3.2)) = 0.275 (eq. (7.2), h < 1 m); k = 1.0 (h ≤ 300 mm)
    // As,min = 0.275 × 1.0 × 3.2 × 85 106 / 500 = 149.79 mm² (eq. (7.1))
    const { faces, checks } = crackSteelFaces(slab(-4.0, null))
    expect(faces).toHaveLength(1)
    const top = faces[0]!
    expect(top.face).toBe('top')
    expect(top.hct).toBeCloseTo(85.106, 3)
    expect(top.kc).toBeCloseTo(0.275, 12)
    expect(top.k).toBe(1)
    expect(top.sigmaS).toBe(500)
    expect(top.AsMin).toBeCloseTo(149.79, 2)
    expect(top.spacing).toBeCloseTo(149.9, 1) // φ10 at 524 mm²/m: 78.54 × 1000/524
    const c = checks.find((k) => k.id === 'sls.crackSteel.top')!
    expect(c.pass).toBe(true)
    expect(c.utilisation).toBeCloseTo(149.79 / 524, 3)
  })

  it('with wk = 0.3 mm the φ10 bars lower σs by Table 7.2N and eq. (7.6N)', () => {
    // eq. (7.6N): φs = φ*s·(fct/2.9)·kc·hcr/(2(h − d)), h − d = 30 + 5 = 35 mm
    //   φs/φ*s = (3.2/2.9) × 0.275 × 85.106/70 = 0.36893 → φ*s = 10/0.36893 = 27.105 mm
    // Table 7.2N, wk = 0.3: 32 mm at 160 MPa, 25 mm at 200 MPa → σs = 160 + 40 × (32 − 27.105)/7 = 187.97 MPa
    // As,min = 0.275 × 3.2 × 85 106/187.97 = 398.4 mm²; Table 7.3N (0.3) at 187.97 MPa: 300 − 50 × 27.97/40 = 265.0 mm
    const { faces, checks } = crackSteelFaces(slab(-4.0, 0.3))
    const top = faces[0]!
    expect(top.sigmaS).toBeCloseTo(187.97, 1)
    expect(top.AsMin).toBeCloseTo(398.4, 0)
    expect(top.maxSpacing).toBeCloseTo(265.0, 0)
    expect(checks[0]!.pass).toBe(true) // 524 ≥ 398
    // fewer bars fail, and say by how much through actual and limit
    const short = crackSteelFaces(slab(-4.0, 0.3, { area: 314, diameter: 10 })).checks[0]!
    expect(short.pass).toBe(false)
    expect(short.limit - short.actual).toBeCloseTo(398.4 - 314, 0)
  })

  it('7.3.2(4): no steel where the characteristic tension stays within fct,eff; no check where a face is never in tension', () => {
    const { faces, checks } = crackSteelFaces(slab(-3.0, 0.3))
    expect(faces[0]!.required).toBe(false)
    expect(checks[0]!.pass).toBe(true)
    expect(checks[0]!.clause).toContain('7.3.2(4)')
    expect(crackSteelFaces(slab(0.5, 0.3)).faces).toHaveLength(0)
  })

  it('a flanged beam in hogging: the flange by eq. (7.3) with k by its width, the web below it by eq. (7.2)', () => {
    // T: bf = 2000, hf = 150, bw = 400, h = 600; A = 2000×150 + 400×450 = 480 000 mm²
    // centroid from the top: (300 000 × 75 + 180 000 × 375)/480 000 = 187.5 mm (yt), yb = 412.5 mm
    // C30/37 fctm = 2.9 (Table 3.1), σc = 2.0 → hct = 187.5 × 2.9/4.9 = 110.97 mm < hf: flange only
    // Fcr = 2000 × 110.97 × 2.9/2 (triangle) → kc = max(0.5, 0.9 × 0.5) = 0.5 (eq. (7.3)); k = 0.65 (bf ≥ 800 mm)
    // As,min = 0.5 × 0.65 × 2.9 × (2000 × 110.97)/500 = 418.4 mm²
    const tee = member({
      outline: { kind: 'flanged', bw: 400, h: 600, bf: 2000, hf: 150 }, A: 480e3, yt: 187.5, yb: 412.5, isSlab: false, fctm: 2.9,
      topMin: -3.5, bottomMin: -3.2, sigmaC: 2.0, top: { area: 1000, diameter: 16 }, bottom: { area: 200, diameter: 12 },
    }, null)
    const { faces } = crackSteelFaces(tee)
    const top = faces.find((f) => f.face === 'top')!
    expect(top.hct).toBeCloseTo(110.97, 2)
    expect(top.kc).toBe(0.5)
    expect(top.k).toBe(0.65)
    expect(top.AsMin).toBeCloseTo(418.4, 1)
    // sagging: the web, hct = 412.5 × 2.9/4.9 = 244.13 mm within the web (450 mm); Act = 400 × 244.13 = 97 653 mm²
    // kc = 0.4 × (1 − 2.0/(1.5 × 2.9)) = 0.21609 (eq. (7.2) on the web); k = 1 − 0.35 × 300/500 = 0.79 (h = 600)
    // As,min = 0.21609 × 0.79 × 2.9 × 97 653/500 = 96.69 mm²
    const bottom = faces.find((f) => f.face === 'bottom')!
    expect(bottom.hct).toBeCloseTo(244.13, 2)
    expect(bottom.kc).toBeCloseTo(0.21609, 4)
    expect(bottom.k).toBeCloseTo(0.79, 12)
    expect(bottom.AsMin).toBeCloseTo(96.69, 1)
  })
})

describe('Table 7.2N read both ways', () => {
  it('published rows come back exactly (EN 1992-1-1 Table 7.2N, from memory)', () => {
    expect(steelStressForBarSize({ phiStar: 16, wk: 0.3 }).sigmaS).toBe(240)
    expect(steelStressForBarSize({ phiStar: 8, wk: 0.4 }).sigmaS).toBe(400)
    expect(steelStressForBarSize({ phiStar: 41, wk: 0.4 })).toEqual({ sigmaS: 160, beyondTable: true })
    expect(steelStressForBarSize({ phiStar: 3, wk: 0.2 }).sigmaS).toBe(400) // the 0.2 column ends at 400 MPa
  })

  it('σs → φ*s → σs is the identity over the table (seeded)', () => {
    const rand = prng(7301)
    for (let n = 0; n < 200; n++) {
      const wk = ([0.2, 0.3, 0.4] as const)[Math.floor(rand() * 3)]!
      const sigma = 160 + rand() * (wk === 0.2 ? 240 : 290)
      const phi = maxBarDiameterTable({ sigmaS: sigma, wk })!
      expect(steelStressForBarSize({ phiStar: phi, wk }).sigmaS).toBeCloseTo(sigma, 6)
    }
  })
})

describe('the member checks eq. (7.1) and a proposal provides it', () => {
  it('the demo members pass with their bars; without bars the cracked face fails', () => {
    for (const demo of [DEMO_PS2, DEMO_BB1]) {
      const d = designMember(demo, { proposal: false })
      for (const c of d.checks.filter((k) => k.id.startsWith('sls.crackSteel'))) expect(c.pass, c.id).toBe(true)
    }
    const bare = designMember({ ...DEMO_BB1, uls: { barsTop: { area: 0, diameter: 16, cover: 30 } } }, { proposal: false })
    expect(bare.checks.find((c) => c.id === 'sls.crackSteel.bottom')!.pass).toBe(false)
  })
})
