import { describe, expect, it } from 'vitest'
import { memberDeflection } from '../../../../shared/engine/sls/deflection'
import { crackedSection } from '../../../../shared/engine/sls/cracked-section'
import { fieldOf, rel } from '../../../helpers/engine'
import { mulberry32 } from '../../../helpers/prng'

const E = 33346
const I = (1000 * 260 ** 3) / 12

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
