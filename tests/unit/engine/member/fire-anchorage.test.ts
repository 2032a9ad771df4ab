import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { fieldOf } from '../../../helpers/engine'
import { ONE_SPAN_SLAB } from '../../../helpers/members'

describe('fire resistance of the member (EN 1992-1-2 5, tabulated data)', () => {
  it('a flat slab at R90: hs 200 mm and a = 25 mm (Table 5.9, from memory), the strands 15 mm more (5.2(5))', () => {
    const d = designMember({ ...DEMO_PS2, fire: { rating: 'R90' } }, { proposal: false })
    expect(d.fire).not.toBeNull()
    const f = d.fire!
    expect(f.table).toBe('EN 1992-1-2 Table 5.9')
    expect(f.minDimension).toBe(200)
    expect(f.axisBars).toBe(25)
    expect(f.axisTendons).toBe(40) // 25 + 15
    // the strands' centroid at the low point: cover + duct height − strand/2 when they bear on the duct's top (the engine's dBottom)
    expect(f.tendonAxisProvided).toBeCloseTo(d.eccentricity.dBottom, 12)
    const axis = d.checks.find((c) => c.id === 'fire.axisTendons')!
    expect(axis.pass).toBe(f.tendonAxisProvided >= 40)
    expect(axis.note).toContain('from memory')
    expect(d.checks.find((c) => c.id === 'fire.thickness')!.pass).toBe(true) // 260 ≥ 200
  })

  it('a band beam takes the beam table by its web width; no rating, no fire checks', () => {
    const d = designMember(DEMO_BB1, { proposal: false })
    expect(d.fire!.member).toBe('beam')
    expect(d.fire!.table).toBe('EN 1992-1-2 Table 5.6') // continuous beam
    expect(d.checks.filter((c) => c.group === 'fire').every((c) => c.pass)).toBe(true)
    const none = designMember({ ...DEMO_BB1, fire: { rating: 'none' } }, { proposal: false })
    expect(none.fire).toBeNull()
    expect(none.checks.some((c) => c.group === 'fire')).toBe(false)
  })

  it('a rating outside the list names the field', () => {
    expect(fieldOf(() => designMember({ ...DEMO_PS2, fire: { rating: 'R75' } }, { proposal: false }))).toBe('fire.rating')
  })
})

describe('anchorage zones (EN 1992-1-1 8.10.3, 6.5.3, 6.7) by hand', () => {
  it('an 8 m slab strip, anchors on the centroid, flat-duct plates 250 × 90 mm', () => {
    const d = designMember(ONE_SPAN_SLAB, { proposal: false })
    const [left, right] = d.anchorages
    // FEd = 1.2 · σjack · Ap1 · 3 strands (2.4.2.2(3))
    const FEd = 1.2 * d.jacking.sigmaJack * d.strand.Ap * 3
    expect(left!.FEd).toBeCloseTo(FEd, 6)
    // across: each tendon's share is its spacing, 600 mm → T1 = ¼ · (600 − 250)/600 · FEd (eq. (6.58))
    expect(left!.bAcross).toBe(600)
    expect(left!.tieAcross).toBeCloseTo(0.25 * (350 / 600) * FEd, 6)
    // up and down: the plate centre at mid-depth (e = 0), so b2 = 250 mm → T2 = ¼ · (250 − 90)/250 · FEd
    expect(left!.bDepth).toBeCloseTo(250, 9)
    expect(left!.tieDepth).toBeCloseTo(0.25 * (160 / 250) * FEd, 6)
    expect(left!.AsDepth).toBeCloseTo(left!.tieDepth / (500 / 1.15), 6) // fyd = fyk/γs (3.2.7(2))
    // Ac1 similar and concentric, limited by 600/250 = 2.4 (< 250/90 and < 3): Ac1 = 2.4² Ac0; FRdu = Ac0·fcd(t)·2.4 (eq. (6.63))
    const fcdT = d.concrete.atTransfer.fck / 1.5
    expect(left!.Ac1).toBeCloseTo(22500 * 2.4 ** 2, 6)
    expect(left!.FRdu).toBeCloseTo(22500 * fcdT * 2.4, 3)
    expect(right!.FRdu).toBeCloseTo(left!.FRdu, 9) // both ends alike
    const c = d.checks.find((k) => k.id === 'detailing.anchorageBearing')!
    expect(c.utilisation).toBeCloseTo(FEd / (22500 * fcdT * 2.4), 9)
  })

  it('a plate larger than the tendon\'s share of the concrete is said in a warning', () => {
    const d = designMember({ ...ONE_SPAN_SLAB, tendon: { ...ONE_SPAN_SLAB.tendon, spacing: 200 } }, { proposal: false })
    expect(d.warnings.some((w) => w.includes('anchor plate is larger'))).toBe(true)
  })
})

describe('quantities and the strands in their duct (common practice)', () => {
  it('strand mass = strands · Ap · length · 7850 kg/m³ (EN 1991-1-1 Table A.4); a flat duct holds its strands side by side', () => {
    const d = designMember(ONE_SPAN_SLAB, { proposal: false })
    const q = d.quantities
    // 3 strands of 12.9 mm (Ap 100 mm², prEN 10138-3) over 8 m: 3 × 100e-6 m² × 8 m × 7850 kg/m³ = 18.84 kg
    expect(q.strandPerTendon).toBeCloseTo(3 * 100e-6 * 8 * 7850, 6)
    // at 600 mm centres the 1 m strip holds 1000/600 tendons: 18.84 × 1.667 / 8 m² = 3.925 kg/m²
    expect(q.strandRate).toBeCloseTo((18.84 * (1000 / 600)) / 8, 6)
    expect(q.anchorages).toBeCloseTo(2 * (1000 / 600), 12)
    const fit = d.checks.find((c) => c.id === 'tendon.ductFit')!
    expect(fit.actual).toBeCloseTo(3 * 12.9, 9)
    expect(designMember({ ...ONE_SPAN_SLAB, tendon: { ...ONE_SPAN_SLAB.tendon, strandsPerTendon: 5, ductWidth: 60 } }, { proposal: false }).checks.find((c) => c.id === 'tendon.ductFit')!.pass).toBe(false) // 64.5 mm > 60 mm
  })
})
