/**
 * Shear at both sides of every support (EN 1992-1-1 6.2, with the precompression and, where the
 * section stays uncracked in flexure, eq. (6.4)) and punching at a column head (6.4), each with the
 * secondary effects of prestress at γP.
 */
import { EngineInputError } from '../contract'
import { UTILISATION_CAP, capUtilisation } from '../common/check'
import type { MemberInput } from '../input/schema'
import { fibreStresses } from '../checks/stresses'
import { tendonSlope } from '../prestress/profile'
import type { SectionOutline } from '../uls/bending'
import { shearResistance } from '../uls/shear'
import type { DuctKind } from '../uls/shear'
import { punchingCheck } from '../uls/punching'
import type { ColumnPosition } from '../uls/punching'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { ServiceSection } from './stress-limits'
import type { UlsActions } from './uls-actions'

export interface UlsShear {
  id: string
  label: string
  support: number
  side: 'left' | 'right'
  span: number
  x: number
  VEd: number
  /** γP × the secondary shear (secondary moments vary linearly over the span) */
  Vsecondary: number
  d: number
  sigmaCp: number
  VRdc: number
  VRdcUncracked: number | null
  /** the resistance the check uses: VRd,c, or VRd,max with links for beams */
  VRd: number
  linksNeeded: boolean
  AswPerS: number | null
  cotTheta: number | null
  VRdMax: number | null
  utilisation: number
}

export interface UlsPunching {
  support: number
  position: ColumnPosition
  VEd: number
  Vpd: number
  d: number
  u0: number
  u1: number
  beta: number
  rhoL: number
  sigmaCp: number
  vEd: number
  vRdc: number
  vEdFace: number
  vRdMax: number
  utilisation: number
  utilisationFace: number
}

export interface UlsShearInput {
  input: MemberInput
  section: MemberSection
  profile: MemberProfile
  losses: MemberLosses
  sections: ServiceSection[]
  actions: UlsActions
}

/** Web width, and first moment of area above the centroid with the width there (for eq. (6.4)). */
function shearGeometry(o: SectionOutline, yt: number): { bw: number; S: number; bCentroid: number } {
  if (o.kind === 'rectangle') return { bw: o.b, S: (o.b * yt * yt) / 2, bCentroid: o.b }
  const S = yt <= o.hf ? (o.bf * yt * yt) / 2 : o.bf * o.hf * (yt - o.hf / 2) + (o.bw * (yt - o.hf) ** 2) / 2 // first moment of the area above the centroid
  return { bw: o.bw, S, bCentroid: yt <= o.hf ? o.bf : o.bw }
}

export function shearAtSupports({ input, section, profile, losses, sections, actions }: UlsShearInput): UlsShear[] {
  const spans = input.geometry.spans
  const n = spans.length
  const u = input.uls
  const sec = section.properties
  const { h, yt } = sec
  const c28 = section.at28
  const bonded = section.bonded
  const bb = u.barsBottom
  const bt = u.barsTop
  const { envelope, secondaryEnds, secondaryAt, dBottomBars, dTopBars } = actions
  const slope2 = (stage: 'transfer' | 'service', span: number): number => {
    const e = secondaryEnds[stage][span] as { start: number; end: number }
    return (e.end - e.start) / (spans[span] as number) // secondary shear ΔM2/L
  }
  const shearG = shearGeometry(section.outline, yt)
  const fctd = c28.fctk005 / u.gammaC // 3.1.6(2), αct = 1.0
  const t = input.tendon
  const ductSum = section.isSlab ? 0 : t.count * (t.ductShape === 'flat' ? t.ductWidth : t.ductHeight)
  if (ductSum >= shearG.bw) throw new EngineInputError('tendon.count', 'the ducts side by side are wider than the web')
  const ductKind: DuctKind = !bonded ? 'unbonded' : input.shear.ductMaterial === 'metal' ? 'grouted-metal' : 'grouted-plastic'
  const byId = new Map(sections.map((s) => [s.id, s]))
  const shear: UlsShear[] = []
  for (let j = 0; j <= n; j++) {
    if (input.geometry.supports?.[j] === 'free') continue // the tip of a cantilever: no support, no shear there
    const sides: Array<{ side: 'left' | 'right'; span: number; x: number }> = []
    if (j > 0) sides.push({ side: 'left', span: j - 1, x: spans[j - 1] as number })
    if (j < n) sides.push({ side: 'right', span: j, x: 0 })
    const s = byId.get(`support-${j + 1}`)
    // the plain section's depth (a drop's is left out of the shear check: conservative), e from its centroid
    const e = s ? s.e + section.at(s.span, s.x).shift : (profile.profile.supportEcc[j] as number)
    const P = s?.force.service ?? losses.service.Pmean
    for (const sd of sides) {
      const V2 = (['transfer', 'service'] as const).map((stage) => u.gammaP * slope2(stage, sd.span))
      const V = envelope({ kind: 'shear', span: sd.span, x: sd.x })
      const candidates = [V.min, V.max].flatMap((v) => V2.map((w) => v + w)) // |v + w| is greatest at an end of the range
      const VEd = Math.max(...candidates.map(Math.abs))
      const Vsecondary = V2.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a))
      const Mext = envelope({ kind: 'moment', span: sd.span, x: sd.x }).min + u.gammaP * secondaryAt('service', sd.span, sd.x)
      const hog = Mext < 0
      const dp = hog ? h - (yt + e) : yt + e
      const dBars = hog ? (bt.area > 0 ? dTopBars : 0) : bb.area > 0 ? dBottomBars : 0
      const dv = Math.max(dp, dBars)
      const Asl = (bonded ? section.Ap : 0) + (hog ? bt.area : bb.area) // bonded tendons counted in ρl (common practice)
      const fs = fibreStresses({ A: sec.A, Zt: sec.Zt, Zb: sec.Zb, P, e, M: Mext })
      const uncracked = Math.max(-fs.top, -fs.bottom) <= fctd // 6.2.2(2): flexural tension below fctd at ULS
      const r = shearResistance({
        VEd, bw: shearG.bw, d: dv, fck: c28.fck, Asl, NEd: P, Ac: sec.A, gammaC: u.gammaC, k1: input.shear.k1, alphaCC: u.alphaCC,
        ...(uncracked ? { uncracked: { I: sec.I, S: shearG.S, bwCentroid: shearG.bCentroid, fctk005: c28.fctk005 } } : {}),
        links: { fywk: input.shear.fywk, gammaS: u.gammaS, cotThetaMax: input.shear.cotThetaMax, ductDiameterSum: ductSum, ductKind },
      })
      const useLinks = r.linksNeeded && !section.isSlab && r.links !== null
      const VRd = useLinks ? (r.links?.VRdMax as number) : r.VRdcGoverning
      const label = `Support ${j + 1}, ${sd.side === 'left' ? 'left' : 'right'} side`
      shear.push({
        id: `support-${j + 1}-${sd.side}`, label, support: j, side: sd.side, span: sd.span, x: sd.x, VEd, Vsecondary, d: dv, sigmaCp: r.sigmaCp,
        VRdc: r.VRdc, VRdcUncracked: r.VRdcUncracked, VRd, linksNeeded: r.linksNeeded,
        AswPerS: r.linksNeeded && r.links ? r.links.AswPerS : null, cotTheta: useLinks && r.links ? r.links.cotTheta : null, VRdMax: r.links ? r.links.VRdMax : null,
        utilisation: capUtilisation(VRd > 0 ? VEd / VRd : UTILISATION_CAP),
      })
    }
  }
  return shear
}

/** Punching at the column the input names, or null where none is asked for. */
export function punchingAtColumn({ input, section, profile, losses, sections, actions }: UlsShearInput): { punching: UlsPunching | null; warnings: string[] } {
  const p = input.punching
  if (p.column === 'none') return { punching: null, warnings: [] }
  if (!section.isSlab) throw new EngineInputError('punching.column', 'the punching check applies to a slab strip over columns')
  const spans = input.geometry.spans
  const n = spans.length
  const u = input.uls
  const { h, yt } = section.properties
  const bt = u.barsTop
  const { envelope, secondaryEnds, dTopBars } = actions
  const j = p.support - 1
  if (j > n) throw new EngineInputError('punching.support', `the member has ${n + 1} supports`)
  if (input.geometry.supports?.[j] === 'free') throw new EngineInputError('punching.support', `support ${j + 1} is the free tip of a cantilever: it has no column`)
  const R2 = (['transfer', 'service'] as const).map((stage) => {
    const slope = (span: number): number => {
      const e = secondaryEnds[stage][span] as { start: number; end: number }
      return (e.end - e.start) / (spans[span] as number)
    }
    return u.gammaP * ((j < n ? slope(j) : 0) - (j > 0 ? slope(j - 1) : 0)) // secondary reaction: jump of the secondary shear
  })
  const perWidth = (envelope({ kind: 'reaction', support: j }).max + Math.max(...R2)) / 1000 // N per mm of strip width
  const VEd = perWidth * p.panelWidth // the strip reaction over the panel width (common practice)
  const s = sections.find((x) => x.id === `support-${j + 1}`)
  const e = s ? s.e + section.at(s.span, s.x).shift : (profile.profile.supportEcc[j] as number) // from the plain centroid
  // a drop over the column counts where the basic control perimeter (2d from the column face) lies within it
  // (EN 1992-1-1 6.4.2(8)); otherwise the slab's own depth is taken, the perimeter outside the drop (conservative)
  const drop = section.drops.find((d) => d.support === j)
  const reachOf = (d: number): boolean => drop !== undefined && drop.parts.every((pt) => (pt.to - pt.from) - p.c1 / 2 >= 2 * d) && drop.parts.length === (j > 0 && j < n ? 2 : 1)
  const dDrop = drop ? drop.local.properties.h - (yt + e) : 0
  const dTendon = drop && reachOf(dDrop) ? dDrop : h - (yt + e)
  const dp = Math.max(dTendon, bt.area > 0 ? dTopBars : 0)
  const P = s?.force.service ?? losses.service.Pmean
  const pPerMm = P / 1000
  const reach = 2 * dp
  const slopes: number[] = []
  if (j > 0) slopes.push(Math.abs(tendonSlope(profile.profile, j - 1, Math.max(0, (spans[j - 1] as number) - reach))))
  if (j < n) slopes.push(Math.abs(tendonSlope(profile.profile, j, Math.min(spans[j] as number, reach))))
  // tendons of the strip direction crossing the control perimeter within c2 + 4d (common practice; the orthogonal tendons are ignored)
  const Vpd = pPerMm * (p.c2 + 2 * reach) * slopes.reduce((sum, v) => sum + Math.sin(Math.atan(v)), 0)
  const bondedTendon = section.bonded ? section.Ap : 0
  const rho = ((bt.area + bondedTendon) / 1000) / dp
  const sigma = P / section.properties.A
  const r = punchingCheck({
    VEd, Vpd: Math.min(Vpd, VEd), position: p.column, c1: p.c1, c2: p.c2, d: dp, fck: section.at28.fck,
    rhoLy: rho, rhoLz: rho, sigmaCy: sigma, sigmaCz: sigma, gammaC: u.gammaC, k1: p.k1, vRdMaxCoefficient: p.vRdMaxFactor,
  })
  return {
    punching: {
      support: j, position: p.column, VEd, Vpd: Math.min(Vpd, VEd), d: dp, u0: r.u0, u1: r.u1, beta: r.beta, rhoL: r.rhoL, sigmaCp: r.sigmaCp,
      vEd: r.vEdU1, vRdc: r.vRdc, vEdFace: r.vEdU0, vRdMax: r.vRdMax, utilisation: capUtilisation(r.utilisation), utilisationFace: capUtilisation(r.utilisationFace),
    },
    warnings: ['Punching: the reinforcement ratio and the precompression across the strip are taken equal to those along it.'],
  }
}
