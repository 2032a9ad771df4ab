import { describe, expect, it } from 'vitest'
import { alphaCw, nominalWebWidth, shearResistance, type ShearInput } from '../../../../shared/engine/uls/shear'
import { fieldOf, rel } from '../../../helpers/engine'

const slab: ShearInput = { VEd: 100e3, bw: 1000, d: 220, fck: 32, Asl: 1000, NEd: 260e3, Ac: 260e3 }

describe('VRd,c without shear reinforcement (EN 1992-1-1 6.2.2(1))', () => {
  it('a slab strip with 1 MPa precompression, by hand', () => {
    const r = shearResistance(slab)
    // by hand: k = 1 + √(200/220) = 1.9535; ρl = 1000/(1000·220) = 0.4545 %; CRd,c = 0.18/1.5 = 0.12
    expect(r.k).toBeCloseTo(1.95346, 4)
    expect(r.rhoL).toBeCloseTo(0.0045455, 6)
    // vmin = 0.035 k^1.5 √fck = 0.5406 MPa (eq. (6.3N))
    expect(r.vmin).toBeCloseTo(0.54057, 4)
    // eq. (6.2.a): (0.12·1.9535·(100·0.004545·32)^(1/3) + 0.15·1.0)·1000·220 = 158.9 kN
    expect(r.VRdc / 1e3).toBeCloseTo(158.89, 1)
    expect(r.linksNeeded).toBe(false)
  })

  it('the lower bound (6.2.b) governs for a lightly reinforced section', () => {
    const r = shearResistance({ ...slab, Asl: 100, NEd: 0 })
    expect(r.VRdc).toBeCloseTo(r.vmin * 1000 * 220, 6)
    expect(r.VRdcFormula).toBeLessThan(r.VRdcMin)
  })

  it('σcp is capped at 0.2 fcd and ρl at 2 %', () => {
    const r = shearResistance({ ...slab, NEd: 10e6, Asl: 10000 })
    expect(r.sigmaCp).toBeCloseTo(0.2 * 32 / 1.5, 9)
    expect(r.rhoL).toBe(0.02)
  })

  it('uncracked in flexure, eq. (6.4): for a rectangle I·b/S = 2bh/3 (elastic shear-stress distribution, textbook)', () => {
    const b = 300
    const h = 600
    const fctk005 = 0.7 * 0.3 * 40 ** (2 / 3) // Table 3.1, C40/50
    const fctd = fctk005 / 1.5
    const NEd = 2e6
    const r = shearResistance({ ...slab, bw: b, d: 540, fck: 40, Ac: b * h, NEd, uncracked: { I: (b * h ** 3) / 12, S: (b * h * h) / 8, bwCentroid: b, fctk005 } })
    const expected = ((2 * b * h) / 3) * Math.sqrt(fctd * fctd + (NEd / (b * h)) * fctd)
    expect(rel(r.VRdcUncracked as number, expected)).toBeLessThan(1e-12)
    expect(r.VRdcGoverning).toBeGreaterThanOrEqual(r.VRdc)
  })
})

describe('links by the variable strut inclination (EN 1992-1-1 6.2.3)', () => {
  it('αcw for prestressed members, eq. (6.11aN)', () => {
    const fcd = 20
    expect(alphaCw(0, fcd)).toBe(1)
    expect(alphaCw(4, fcd)).toBeCloseTo(1.2, 12) // 1 + σcp/fcd
    expect(alphaCw(8, fcd)).toBe(1.25)
    expect(alphaCw(15, fcd)).toBeCloseTo(2.5 * (1 - 0.75), 12)
  })

  it('web width with ducts, eqs. (6.16), (6.17)', () => {
    expect(nominalWebWidth(300, 30, 'grouted-metal')).toBe(300) // Σφ ≤ bw/8
    expect(nominalWebWidth(300, 80, 'grouted-metal')).toBe(260) // bw − 0.5Σφ
    expect(nominalWebWidth(300, 80, 'grouted-plastic')).toBeCloseTo(204, 9) // bw − 1.2Σφ
  })

  it('cot θ = 2.5 where the strut can carry it, Asw/s from eq. (6.8)', () => {
    const r = shearResistance({ VEd: 400e3, bw: 300, d: 540, fck: 40, Asl: 1500, NEd: 0, Ac: 300 * 600, links: { fywk: 500 } })
    const l = r.links!
    expect(r.linksNeeded).toBe(true)
    expect(l.cotTheta).toBe(2.5)
    const z = 0.9 * 540
    // by hand: VRd,max = 1.0·300·486·0.6(1 − 40/250)·26.67/(2.5 + 0.4) = 804 kN (eq. (6.9), (6.6N))
    expect(l.VRdMax / 1e3).toBeCloseTo((300 * z * 0.504 * (40 / 1.5)) / 2.9 / 1e3, 6)
    expect(l.AswPerS).toBeCloseTo(400e3 / (z * (500 / 1.15) * 2.5), 9)
  })

  it('a steeper strut when VEd exceeds VRd,max at cot θ = 2.5, with VRd,max = VEd there', () => {
    const r = shearResistance({ VEd: 900e3, bw: 300, d: 540, fck: 40, Asl: 1500, NEd: 0, Ac: 300 * 600 })
    const l = r.links!
    expect(l.cotTheta).toBeGreaterThan(1)
    expect(l.cotTheta).toBeLessThan(2.5)
    expect(rel(l.VRdMax, 900e3)).toBeLessThan(1e-9) // between 804 kN (cot θ = 2.5) and 980 kN (cot θ = 1), by hand
  })

  it('minimum links, eq. (9.5N)', () => {
    const r = shearResistance({ ...slab, links: {} })
    expect(r.links!.AswPerSMin).toBeCloseTo((0.08 * Math.sqrt(32)) / 500 * 1000, 9)
  })
})

describe('bad input names the field', () => {
  it('each bad value', () => {
    expect(fieldOf(() => shearResistance({ ...slab, d: 0 }))).toBe('d')
    expect(fieldOf(() => shearResistance({ ...slab, VEd: -1 }))).toBe('VEd')
    expect(fieldOf(() => shearResistance({ ...slab, NEd: Number.NaN }))).toBe('NEd')
    expect(fieldOf(() => shearResistance({ ...slab, links: { cotThetaMax: 3 } }))).toBe('links.cotThetaMax')
    expect(fieldOf(() => shearResistance({ ...slab, links: { ductDiameterSum: 2000 } }))).toBe('links.ductDiameterSum')
  })
})

describe('strut crushing', () => {
  it('cot θ = 1 and a utilisation above 1 when even the steepest strut is short', () => {
    const r = shearResistance({ VEd: 1000e3, bw: 300, d: 540, fck: 40, Asl: 1500, NEd: 0, Ac: 300 * 600 })
    expect(r.links!.cotTheta).toBe(1)
    expect(r.links!.utilisationStrut).toBeGreaterThan(1) // 1000 kN > 980 kN, by hand from eq. (6.9)
  })
})
