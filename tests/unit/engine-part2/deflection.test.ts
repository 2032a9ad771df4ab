import { describe, expect, it } from 'vitest'
import { distributionCoefficient, interpolate, memberDeflection } from '../../../shared/engine/sls/deflection'
import { crackedSection } from '../../../shared/engine/sls/cracked-section'
import { fieldOf, rel } from './helpers'
import { mulberry32 } from './prng'

const E = 33346
const I = (1000 * 260 ** 3) / 12
const w = 5 // N/mm = kN/m

describe('deflection against closed-form results', () => {
  it('simply supported span under UDL: 5wL⁴/384EI (any structural handbook)', () => {
    const L = 8000
    const r = memberDeflection({ spans: [L], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi: 0, I })
    const s = r.spans[0]!
    expect(rel(s.shortTerm.down, (5 * w * L ** 4) / (384 * E * I))).toBeLessThan(1e-3)
    expect(s.shortTerm.at).toBeCloseTo(L / 2, 6)
  })

  it('fixed-ended span under UDL: wL⁴/384EI (handbook)', () => {
    const L = 6000
    const r = memberDeflection({ spans: [L], supports: ['fixed', 'fixed'], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi: 0, I })
    expect(rel(r.spans[0]!.shortTerm.down, (w * L ** 4) / (384 * E * I))).toBeLessThan(2e-3)
  })

  it('two equal spans under UDL: wL⁴/185EI at 0.4215 L from the end support (handbook coefficient)', () => {
    const L = 9600
    const r = memberDeflection({ spans: [L, L], loads: [{ kind: 'udl', span: 0, w }, { kind: 'udl', span: 1, w }], Ecm: E, phi: 0, I, stations: 200 })
    const s = r.spans[0]!
    expect(rel(s.shortTerm.down, (w * L ** 4) / (185 * E * I))).toBeLessThan(3e-3) // 1/185 is 0.005405 rounded; exact 0.005416
    expect(Math.abs(s.shortTerm.at / L - 0.4215)).toBeLessThan(0.01)
    expect(rel(r.spans[1]!.shortTerm.down, s.shortTerm.down)).toBeLessThan(1e-9) // symmetry
  })

  it('long term with Ec,eff = Ecm/(1 + φ) (eq. (7.20)) and the span/250, span/500 limits (7.4.1)', () => {
    const L = 8000
    const phi = 2.2
    const r = memberDeflection({ spans: [L], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi, I, limit: 20 })
    const s = r.spans[0]!
    expect(r.EcEff).toBeCloseTo(E / 3.2, 9)
    expect(rel(s.longTerm.down, s.shortTerm.down * (1 + phi))).toBeLessThan(1e-9)
    expect(s.limitTotal).toBe(32)
    expect(s.limitAfter).toBe(16)
    expect(s.afterConstruction).toBeCloseTo(s.longTerm.down - s.shortTerm.down, 6)
    const expected = Math.max(s.longTerm.down / 32, s.afterConstruction / 16, s.longTerm.down / 20)
    expect(s.utilisation).toBeCloseTo(expected, 12)
  })

  it('a fully cracked span (Mcr = 0, ζ = 1) deflects as the cracked section', () => {
    const L = 8000
    const Icr = I / 4
    const r = memberDeflection({ spans: [L], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi: 0, I, beta: 1, cracking: { McrSagging: 0, McrHogging: 0, IcrSagging: Icr, IcrHogging: Icr } })
    expect(rel(r.spans[0]!.shortTerm.down, (5 * w * L ** 4) / (384 * E * Icr))).toBeLessThan(1e-3)
    expect(r.spans[0]!.cracked).toBe(true)
  })

  it('an uplift (negative unbalanced load) gives an upward deflection', () => {
    const r = memberDeflection({ spans: [8000], loads: [{ kind: 'udl', span: 0, w: -2 }], Ecm: E, phi: 0, I })
    expect(r.spans[0]!.shortTerm.down).toBe(0)
    expect(r.spans[0]!.shortTerm.up).toBeLessThan(0)
  })
})

describe('7.4.3 interpolation', () => {
  it('ζ = 1 − β(σsr/σs)², eq. (7.19); zero below cracking', () => {
    expect(distributionCoefficient(0.5, 0.8)).toBeCloseTo(1 - 0.5 * 0.64, 12)
    expect(distributionCoefficient(1, 0.5)).toBeCloseTo(0.75, 12)
    expect(distributionCoefficient(0.5, 1.2)).toBe(0)
    expect(interpolate(0.25, 4, 8)).toBe(5) // eq. (7.18)
  })
})

describe('cracked section (7.3.4(1), transformed section)', () => {
  it('pure bending of a reinforced rectangle: the classical quadratic for x and σs = αe·M(d − x)/Icr', () => {
    const b = 1000
    const d = 220
    const As = 1000
    const ae = 200000 / E
    const M = 40e6
    const r = crackedSection({ section: { kind: 'rectangle', b, h: 260 }, face: 'sagging', Ec: E, steel: [{ A: As, d, E: 200000 }], N: 0, M })
    // b x²/2 = αe As (d − x) (textbook transformed section)
    const x = (-ae * As + Math.sqrt((ae * As) ** 2 + 2 * b * ae * As * d)) / b
    const Icr = (b * x ** 3) / 3 + ae * As * (d - x) ** 2
    expect(r.cracked).toBe(true)
    expect(rel(r.x as number, x)).toBeLessThan(1e-6)
    expect(rel(r.steelStress[0]!, (ae * M * (d - x)) / Icr)).toBeLessThan(1e-6)
    expect(rel(r.curvature, M / (E * Icr))).toBeLessThan(1e-6)
  })

  it('with an axial compression: the stresses balance N and M (random sections, seeded)', () => {
    const rnd = mulberry32(7)
    for (let k = 0; k < 40; k++) {
      const h = 200 + 600 * rnd()
      const b = 300 + 1000 * rnd()
      const steel = [{ A: 300 + 2000 * rnd(), d: h * (0.75 + 0.2 * rnd()), E: 200000 }]
      const N = 1e5 + 2e6 * rnd()
      const M = N * h * (0.2 + 2 * rnd())
      const r = crackedSection({ section: { kind: 'rectangle', b, h }, face: 'sagging', Ec: E, steel, N, M })
      const x = r.cracked ? (r.x as number) : h
      const kappa = r.curvature
      // integrate the stresses back: concrete triangle (or trapezoid when uncracked) plus steel
      const topStress = r.sigmaCFace
      const botStress = r.sigmaCOther
      const Nc = r.cracked ? (topStress * x * b) / 2 : ((topStress + botStress) / 2) * h * b
      const Mc = r.cracked ? Nc * (h / 2 - x / 3) : ((topStress - botStress) * b * h * h) / 12
      const Ns = steel.reduce((s, l, j) => s - l.A * (r.steelStress[j] as number), 0)
      const Ms = steel.reduce((s, l, j) => s - l.A * (r.steelStress[j] as number) * (h / 2 - l.d), 0)
      expect(rel(Nc + Ns, N)).toBeLessThan(1e-6)
      expect(rel(Mc + Ms, M)).toBeLessThan(1e-6)
      expect(kappa).toBeGreaterThan(0)
    }
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => crackedSection({ section: { kind: 'rectangle', b: 1000, h: 260 }, face: 'sagging', Ec: E, steel: [{ A: 100, d: 300, E: 200000 }], N: 0, M: 1e6 }))).toBe('steel.0.d')
    expect(fieldOf(() => memberDeflection({ spans: [8000], loads: [], Ecm: E, phi: -1, I }))).toBe('phi')
    expect(fieldOf(() => memberDeflection({ spans: [8000, 8000], loads: [], Ecm: E, phi: 1, I: [I] }))).toBe('I')
    expect(fieldOf(() => memberDeflection({ spans: [-1], loads: [], Ecm: E, phi: 1, I }))).toBe('spans.0')
  })
})
