/**
 * Demo inputs for the invented scenario "Alder Yard podium", job 2417 (fictional project and job).
 * Engine units: mm, N/mm², fractions.
 */
import type { MemberInputDraft } from './schema'

/** PS-2: podium slab strip 1 m wide, four spans 7.8 / 9.6 / 9.6 / 7.8 m, 260 mm, C32/40. */
export const DEMO_PS2: MemberInputDraft = {
  geometry: { spans: [7800, 9600, 9600, 7800] },
  section: { kind: 'slab-strip', h: 260 },
  materials: { concreteClass: 'C32/40', cement: 'N', ageAtStressing: 5, RH: 0.6 },
  tendon: {
    strand: '12.9', strandsPerTendon: 3, spacing: 750, ductShape: 'flat', ductHeight: 19, ductWidth: 50,
    bond: 'bonded', coverTop: 25, coverBottom: 25, stressing: 'both',
  },
  profile: { mode: 'deepest', anchorLeft: 0, anchorRight: 0, lowPointAt: [0.42, 0.5, 0.5, 0.58], inflection: 0.1 },
  loads: {
    superimposed: 2.0e-3, imposed: 5.0e-3, psi0: 0.7, psi1: 0.7, psi2: 0.6,
    balanceSelfWeight: 0.9, balanceSuperimposed: 0, balanceImposed: 0,
  },
  limits: { exposure: 'XC1' },
  // H12 at 200 top over the supports (invented demo detailing)
  uls: { barsTop: { area: 565, diameter: 12, cover: 25 } },
}

/** BB-1: band beam, three spans 8.1 / 10.2 / 8.1 m, band 2400 × 400 with a 220 mm slab, C40/50. */
export const DEMO_BB1: MemberInputDraft = {
  geometry: { spans: [8100, 10200, 8100] },
  section: { kind: 'tee-beam', h: 400, bw: 2400, bf: 4400, hf: 220, tributaryWidth: 8000 },
  materials: { concreteClass: 'C40/50', cement: 'N', ageAtStressing: 5, RH: 0.6 },
  tendon: {
    strand: '12.9', strandsPerTendon: 5, count: 4, ductShape: 'flat', ductHeight: 20, ductWidth: 75,
    bond: 'bonded', coverTop: 40, coverBottom: 40, stressing: 'both',
  },
  profile: { mode: 'deepest', anchorLeft: 0, anchorRight: 0, lowPointAt: [0.42, 0.5, 0.58], inflection: 0.1 },
  loads: {
    superimposed: 2.0e-3, imposed: 5.0e-3, psi0: 0.7, psi1: 0.7, psi2: 0.6,
    balanceSelfWeight: 0.9, balanceSuperimposed: 0, balanceImposed: 0,
  },
  limits: { exposure: 'XC1' },
  // 16 H16 top over the supports and 16 H12 bottom within the band (invented demo detailing)
  uls: { barsTop: { area: 3217, diameter: 16, cover: 30 }, barsBottom: { area: 1810, diameter: 12, cover: 30 } },
  // the podium's transfer level: two hours (invented demo requirement)
  fire: { rating: 'R120' },
}

/**
 * PS-3: the podium's edge strip on grid A, 1 m wide: spans 7.8 / 9.6 m and a 2.4 m cantilever at the
 * east edge carrying the façade, 260 mm, C32/40, on 400 × 400 columns below (3.6 m, far end fixed),
 * a 140 mm drop 330 mm wide per metre of strip over the column at support 2, R90.
 */
export const DEMO_PS3: MemberInputDraft = {
  geometry: { spans: [7800, 9600, 2400], supports: ['pinned', 'pinned', 'pinned', 'free'] },
  columns: { where: 'all', c1: 400, c2: 400, heightBelow: 3600, farEndBelow: 'fixed', heightAbove: 0, panelWidth: 8400 },
  section: { kind: 'slab-strip', h: 260, drops: [{ support: 2, left: 1400, right: 1400, depth: 140, width: 330 }] },
  materials: { concreteClass: 'C32/40', cement: 'N', ageAtStressing: 5, RH: 0.6 },
  tendon: {
    strand: '12.9', strandsPerTendon: 3, spacing: 700, ductShape: 'flat', ductHeight: 19, ductWidth: 50,
    bond: 'bonded', coverTop: 25, coverBottom: 30, stressing: 'left',
  },
  profile: { mode: 'deepest', anchorLeft: 0, anchorRight: 0, lowPointAt: [0.42, 0.5, 0.5], inflection: 0.1 },
  loads: {
    superimposed: 2.0e-3, imposed: 5.0e-3, psi0: 0.7, psi1: 0.7, psi2: 0.6,
    balanceSelfWeight: 0.9, balanceSuperimposed: 0, balanceImposed: 0,
    // the façade along the cantilever's edge, 7.5 kN per metre of edge (invented demo load)
    lines: [{ span: 3, at: 2300, w: 7.5, type: 'permanent', psi0: 1, psi1: 1, psi2: 1 }],
  },
  limits: { exposure: 'XC1' },
  // H12 at 200 top, H10 at 200 bottom (invented demo detailing)
  uls: { barsTop: { area: 565, diameter: 12, cover: 25 }, barsBottom: { area: 393, diameter: 10, cover: 30 } },
  fire: { rating: 'R90' },
  // the strip's tendons on the stressing schedule: half the bay to grid B plus the edge, 4.2 m (invented)
  site: { stripWidth: 4200 },
}
