import { fieldOf } from '../../../helpers/engine'
import { describe, expect, it } from 'vitest'
import { bendingResistance, stressBlock, tendonDesignStress, type BendingInput } from '../../../../shared/engine/uls/bending'
import { EngineInputError } from '../../../../shared/engine/contract'
import { mulberry32 } from '../../../helpers/prng'

const fcd32 = 32 / 1.5 // EN 1992-1-1 eq. (3.15), αcc = 1.0, γc = 1.5
const fyd = 500 / 1.15 // 3.2.7(2)

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b)
}

describe('stress block and design curves', () => {
  it('λ, η and εcu3 for normal and high-strength concrete', () => {
    // EN 1992-1-1 3.1.7(3): λ = 0.8, η = 1.0 up to C50/60; Table 3.1: εcu3 = 3.5 ‰
    expect(stressBlock(32)).toEqual({ lambda: 0.8, eta: 1.0, epsCu: 0.0035 })
    // C70/85: λ = 0.8 − 20/400 = 0.75, η = 1 − 20/200 = 0.9 (eqs. (3.20), (3.22)); Table 3.1 εcu3 = 2.7 ‰ (tabulated, rounded)
    const b = stressBlock(70)
    expect(b.lambda).toBeCloseTo(0.75, 10)
    expect(b.eta).toBeCloseTo(0.9, 10)
    expect(b.epsCu * 1000).toBeCloseTo(2.7, 1)
    // C90/105: Table 3.1 εcu3 = 2.6 ‰
    expect(stressBlock(90).epsCu * 1000).toBeCloseTo(2.6, 6)
  })

  it('tendon curve of 3.3.6(7): fpd = fp0.1k/γs, the inclined branch reaches fpk/γs at εuk', () => {
    const t = { fpk: 1860, fp01k: 1640, Ep: 195000, epsUk: 0.035 }
    expect(tendonDesignStress(0.004, t, 'inclined', 1.15).stress).toBeCloseTo(195000 * 0.004, 6) // elastic, Ep·ε
    expect(tendonDesignStress(0.03, t, 'horizontal', 1.15).stress).toBeCloseTo(1640 / 1.15, 6) // horizontal branch
    // at εud = 0.9 εuk the inclined branch is 0.9·(εuk − εpd)/(εuk − εpd) of the way, by the straight line of Fig. 3.10
    const epsPd = 1640 / 1.15 / 195000
    const expected = 1640 / 1.15 + ((0.0315 - epsPd) * (1860 / 1.15 - 1640 / 1.15)) / (0.035 - epsPd)
    const r = tendonDesignStress(0.05, t, 'inclined', 1.15)
    expect(r.stress).toBeCloseTo(expected, 6)
    expect(r.limited).toBe(true)
  })
})

describe('bending resistance by hand (rectangular stress block, EN 1992-1-1 3.1.7(3))', () => {
  it('reinforced rectangle: x = As·fyd/(0.8·b·fcd), MRd = As·fyd·(d − 0.4x)', () => {
    const r = bendingResistance({ section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', fck: 32, tendons: [], bars: [{ As: 1000, d: 220 }], branch: 'horizontal' })
    const T = 1000 * fyd
    const x = T / (0.8 * 1000 * fcd32) // by hand: 25.47 mm
    expect(rel(r.x, x)).toBeLessThan(1e-6)
    expect(rel(r.MRd, T * (220 - 0.4 * x))).toBeLessThan(1e-6) // by hand: 91.2 kNm
    expect(r.MRd / 1e6).toBeCloseTo(91.22, 1)
  })

  it('unbonded tendons at σpm,∞ + 100 MPa (EN 1992-1-1 5.10.8(2))', () => {
    const r = bendingResistance({
      section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', fck: 32,
      tendons: [{ Ap: 1000, d: 200, fpk: 1860, fp01k: 1640, Ep: 195000, sigmaPmInf: 1000, bonded: false }],
    })
    const F = 1000 * 1100 // (1000 + 100 MPa) × Ap, below fpd = 1426 MPa
    const x = F / (0.8 * 1000 * fcd32)
    expect(r.tendons[0]?.stress).toBeCloseTo(1100, 9)
    expect(rel(r.MRd, F * (200 - 0.4 * x))).toBeLessThan(1e-6)
  })

  it('bonded tendon on the horizontal branch: yields, MRd = Ap·fpd·(dp − 0.4x)', () => {
    const r = bendingResistance({
      section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', fck: 32, branch: 'horizontal',
      tendons: [{ Ap: 500, d: 200, fpk: 1860, fp01k: 1640, Ep: 195000, sigmaPmInf: 1000, bonded: true }],
    })
    const fpd = 1640 / 1.15
    const x = (500 * fpd) / (0.8 * 1000 * fcd32) // by hand: 41.78 mm
    expect(rel(r.x, x)).toBeLessThan(1e-6)
    expect(r.MRd / 1e6).toBeCloseTo(130.69, 1) // by hand: 713.0 kN × (200 − 16.71) mm
    // strain compatibility: prestrain σpm∞/Ep plus εcu3 (dp − x)/x (plane sections, 6.1(2))
    expect(r.tendons[0]?.strain).toBeCloseTo(1000 / 195000 + (0.0035 * (200 - x)) / x, 9)
  })

  it('T section with the block in the web (x > hf): flange and web forces by hand', () => {
    const r = bendingResistance({ section: { kind: 'flanged', bw: 300, h: 500, bf: 1000, hf: 100 }, face: 'sagging', fck: 32, tendons: [], bars: [{ As: 6000, d: 450 }], branch: 'horizontal' })
    const T = 6000 * fyd
    const Cf = fcd32 * 1000 * 100
    const web = (T - Cf) / (fcd32 * 300) // depth of block below the flange
    expect(rel(r.x, (100 + web) / 0.8)).toBeLessThan(1e-6)
    expect(rel(r.MRd, Cf * (450 - 50) + (T - Cf) * (450 - (100 + web / 2)))).toBeLessThan(1e-6) // by hand: 1002 kNm
  })

  it('hogging puts the web of a T in compression', () => {
    const r = bendingResistance({ section: { kind: 'flanged', bw: 300, h: 500, bf: 1000, hf: 100 }, face: 'hogging', fck: 32, tendons: [], bars: [{ As: 1000, d: 450 }], branch: 'horizontal' })
    const s = (1000 * fyd) / (fcd32 * 300)
    expect(rel(r.MRd, 1000 * fyd * (450 - s / 2))).toBeLessThan(1e-6) // by hand: 180.9 kNm
  })

  it('compression bars with the concrete they displace', () => {
    const r = bendingResistance({ section: { kind: 'rectangle', b: 300, h: 500 }, face: 'sagging', fck: 32, tendons: [], bars: [{ As: 2000, d: 450 }, { As: 500, d: 40 }], branch: 'horizontal' })
    const Cs = 500 * (fyd - fcd32)
    const Cc = 2000 * fyd - Cs
    const s = Cc / (fcd32 * 300)
    expect(r.bars[1]?.strain).toBeLessThan(-fyd / 200000) // the top bars yield in compression
    expect(rel(r.MRd, Cc * (450 - s / 2) + Cs * 410)).toBeLessThan(1e-6) // by hand: 348.7 kNm
  })
})

describe('strain compatibility on random sections (seeded)', () => {
  it('satisfies force equilibrium and the plane-section strains', () => {
    const rnd = mulberry32(20417)
    for (let n = 0; n < 60; n++) {
      const h = 200 + 600 * rnd()
      const fck = [25, 32, 40, 50, 60, 70, 90][Math.floor(rnd() * 7)] as number
      const flanged = rnd() < 0.5
      const input: BendingInput = {
        section: flanged ? { kind: 'flanged', bw: 300 + 500 * rnd(), h, bf: 1200 + 1200 * rnd(), hf: 0.2 * h + 0.3 * h * rnd() } : { kind: 'rectangle', b: 300 + 1000 * rnd(), h },
        face: rnd() < 0.5 ? 'sagging' : 'hogging',
        fck,
        branch: rnd() < 0.5 ? 'inclined' : 'horizontal',
        tendons: [{ Ap: 200 + 1500 * rnd(), d: h * (0.6 + 0.3 * rnd()), fpk: 1860, fp01k: 1640, Ep: 195000, sigmaPmInf: 900 + 300 * rnd(), bonded: true }],
        bars: [{ As: 1500 * rnd(), d: h * (0.85 + 0.1 * rnd()) }, { As: 800 * rnd(), d: 0.1 * h }],
      }
      const r = bendingResistance(input)
      if (!r.equilibrium) continue
      const steel = [...r.tendons, ...r.bars].reduce((s, l) => s + l.force, 0)
      expect(Math.abs(r.Cc - steel) / Math.max(1, steel)).toBeLessThan(1e-6) // ΣF = 0
      for (const b of r.bars) expect(b.strain).toBeCloseTo((r.epsCu * (b.d - r.x)) / r.x, 9)
      expect(r.MRd).toBeGreaterThan(0)
      expect(Number.isFinite(r.xOverD)).toBe(true)
    }
  })

  it('proposes the passive steel that brings MRd up to MEd', () => {
    const base: BendingInput = {
      section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', fck: 32,
      tendons: [{ Ap: 400, d: 200, fpk: 1860, fp01k: 1640, Ep: 195000, sigmaPmInf: 1050, bonded: true }],
    }
    const plain = bendingResistance(base)
    const MEd = plain.MRd * 1.4
    const short = bendingResistance({ ...base, MEd, addedBar: { d: 225 } })
    expect(short.utilisation).toBeGreaterThan(1)
    const As = short.AsRequired as number
    expect(As).toBeGreaterThan(0)
    const fixed = bendingResistance({ ...base, bars: [{ As, d: 225 }] })
    expect(rel(fixed.MRd, MEd)).toBeLessThan(1e-4)
    expect(bendingResistance({ ...base, MEd: plain.MRd * 0.5 }).AsRequired).toBe(0)
  })
})

describe('bad input names the field', () => {
  const ok: BendingInput = { section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', fck: 32, tendons: [{ Ap: 500, d: 200, fpk: 1860, fp01k: 1640, Ep: 195000, sigmaPmInf: 1000, bonded: true }] }
  it('each bad value', () => {
    expect(fieldOf(() => bendingResistance({ ...ok, fck: 100 }))).toBe('fck')
    expect(fieldOf(() => bendingResistance({ ...ok, section: { kind: 'rectangle', b: -1, h: 260 } }))).toBe('section.b')
    expect(fieldOf(() => bendingResistance({ ...ok, tendons: [{ ...ok.tendons[0]!, d: 300 }] }))).toBe('tendons.0.d')
    expect(fieldOf(() => bendingResistance({ ...ok, bars: [{ As: Number.NaN, d: 200 }] }))).toBe('bars.0.As')
    expect(fieldOf(() => bendingResistance({ ...ok, section: { kind: 'flanged', bw: 300, h: 260, bf: 1000, hf: 300 } }))).toBe('section.hf')
  })
})
