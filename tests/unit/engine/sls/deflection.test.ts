import { describe, expect, it } from 'vitest'
import { distributionCoefficient, interpolate, memberDeflection } from '../../../../shared/engine/sls/deflection'
import { rel } from '../../../helpers/engine'

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
