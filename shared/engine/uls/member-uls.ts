/**
 * The ultimate limit state of a designed member (design.md §1 step 9): design moments and shears
 * from the EN 1990 combinations with pattern loading plus the secondary effects of prestress at γP,
 * the bending resistance at every critical section (sagging and hogging), shear at both sides of
 * every support, the passive steel proposed where a section is short, the detailing limits and the
 * optional punching check. Works on the part-1 result (Design) so that both use one analysis model.
 */
import type { CheckResult } from '../contract'
import { EngineInputError } from '../contract'
import type { DesignPartOne as Design } from './design-part-one'
import { analyseContinuousBeam } from '../analysis/continuous-beam'
import type { SupportKind } from '../analysis/continuous-beam'
import { fibreStresses } from '../checks/stresses'
import { tendonSlope } from '../prestress/profile'
import type { TendonProfile } from '../prestress/profile'
import { ulsLoadCases } from '../loads/uls-combinations'
import type { UlsCase } from '../loads/uls-combinations'
import { bendingResistance } from './bending'
import type { BarLayer, BendingResult, SectionOutline, TendonLayer } from './bending'
import { shearResistance } from './shear'
import type { DuctKind } from './shear'
import { reinforcementLimits, supportBondedSteel, SUPPORT_STEEL_RULE } from './reinforcement'
import { punchingCheck } from './punching'
import type { ColumnPosition } from './punching'
import type { Part2Input } from './input-groups'

const CAP = 999
const cap = (u: number): number => (Number.isFinite(u) ? Math.min(CAP, Math.max(0, u)) : CAP)

export interface UlsBendingFace {
  MEd: number
  MRd: number
  x: number
  d: number
  xOverD: number
  xOverDLimit: number
  tendonStress: number
  tendonStrain: number
  utilisation: number
  /** extra bars at the tension face to reach MEd, mm²; 0 when not short; null when no amount up to 0.04 Ac suffices */
  AsRequired: number | null
  equilibrium: boolean
  strainLimited: boolean
}

export interface UlsSection {
  id: string
  label: string
  span: number
  x: number
  X: number
  MEdMax: number
  MEdMin: number
  /** γP × the secondary moment, over transfer and service forces */
  secondary: { min: number; max: number }
  sagging: UlsBendingFace | null
  hogging: UlsBendingFace | null
  utilisation: number
}

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

export interface MemberUls {
  combination: '6.10' | '6.10a/b'
  factors: { gammaG: number; gammaQ: number; psi0: number; xi: number; gammaP: number }
  cases: Array<{ id: string; label: string; clause: string }>
  sections: UlsSection[]
  shear: UlsShear[]
  reinforcement: {
    AsMinBottom: number
    AsMinTop: number
    AsMax: number
    providedBottom: number
    providedTop: number
    /** bonded tendon area counted with the bars (common practice); 0 for unbonded tendons */
    bondedTendon: number
    supportSteel: { As: number; bandWidth: number; perWidth: number } | null
    supportSteelRule: string | null
  }
  proposal: { AsBottom: number | null; AsTop: number | null }
  punching: UlsPunching | null
}

export interface UlsOutcome {
  uls: MemberUls
  checks: CheckResult[]
  warnings: string[]
}

/** The section's outline for the section-level checks (a slab strip is a 1 m wide rectangle). */
export function outline(d: Design): SectionOutline {
  const s = d.input.section
  if (s.kind === 'slab-strip') return { kind: 'rectangle', b: 1000, h: s.h }
  if (s.kind === 'rectangle') return { kind: 'rectangle', b: s.b as number, h: s.h }
  return { kind: 'flanged', bw: s.bw as number, h: s.h, bf: s.bf as number, hf: s.hf as number }
}

/** Web width, and first moment of area above the centroid with the width there (for eq. (6.4)). */
function shearGeometry(o: SectionOutline, yt: number): { bw: number; S: number; bCentroid: number } {
  if (o.kind === 'rectangle') return { bw: o.b, S: (o.b * yt * yt) / 2, bCentroid: o.b }
  const S = yt <= o.hf ? (o.bf * yt * yt) / 2 : o.bf * o.hf * (yt - o.hf / 2) + (o.bw * (yt - o.hf) ** 2) / 2 // first moment of the area above the centroid
  return { bw: o.bw, S, bCentroid: yt <= o.hf ? o.bf : o.bw }
}

function ratioCheck(id: string, group: string, title: string, clause: string, actual: number, limit: number, unit: CheckResult['unit'], location?: string, note?: string, atLeast = false): CheckResult {
  const u = cap(atLeast ? (actual > 0 ? limit / actual : limit > 0 ? CAP : 0) : limit > 0 ? actual / limit : actual > 0 ? CAP : 0)
  return { id, group, title, clause, actual, limit, unit, utilisation: u, pass: u <= 1 + 1e-9, ...(location ? { location } : {}), ...(note ? { note } : {}) }
}

const where = (label: string, X: number): string => `${label}, x = ${(X / 1000).toFixed(2)} m`

export function memberUls(d: Design, opt: Part2Input): UlsOutcome {
  const input = d.input
  const warnings: string[] = []
  const spans = input.geometry.spans
  const n = spans.length
  const supports: SupportKind[] = input.geometry.supports ?? [...spans.map(() => 'pinned' as SupportKind), 'pinned']
  const o = outline(d)
  const h = d.section.h
  const yt = d.section.yt
  const bonded = input.tendon.bond === 'bonded'
  const u = opt.uls
  const factors = { gammaG: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP }
  const cases: UlsCase[] = ulsLoadCases(n, u.combination, { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP })
    .filter((c) => input.loads.pattern !== 'all-spans' || c.id.endsWith('.all'))

  const EI = d.concrete.at28.Ecm * d.section.I
  const unit = spans.map((_, i) => analyseContinuousBeam({ spans, EI, supports, loads: [{ kind: 'udl', span: i, w: 1 }] }))
  const G = d.loads.selfWeight + d.loads.superimposed
  const Q = d.loads.imposed
  const caseValue = (c: UlsCase, f: (i: number) => number): number => spans.reduce((s, _, i) => s + ((c.g[i] as number) * G + (c.q[i] as number) * Q) * f(i), 0)

  // secondary moments at the supports, transfer and service; they vary linearly along each span (5.10.7)
  const M2t = d.prestressMoments.transfer.secondary
  const M2s = d.prestressMoments.service.secondary
  const M2at = (m: number[], span: number, x: number): number => (m[span] as number) * (1 - x / (spans[span] as number)) + ((m[span + 1] as number) * x) / (spans[span] as number)

  // the bar layers, depths from the compression face
  const bb = u.barsBottom
  const bt = u.barsTop
  const dBotBar = h - bb.cover - bb.diameter / 2
  const dTopBar = h - bt.cover - bt.diameter / 2
  const barProps = { fyk: u.fyk, k: 1.08, epsUk: 0.05 } // B500 class B, EN 1992-1-1 Annex C Table C.1
  const strand = d.strand
  const Ap = d.jacking.Ap
  const epsUk = u.epsUdTendon / 0.9 // 3.3.6(7) note: εud = 0.9 εuk

  const face = (faceName: 'sagging' | 'hogging', e: number, Pservice: number, MEd: number): UlsBendingFace => {
    const dp = faceName === 'sagging' ? yt + e : h - (yt + e)
    const tendon: TendonLayer = {
      Ap, d: Math.min(h, Math.max(0, dp)), fpk: strand.fpk, fp01k: strand.fp01k, Ep: strand.Ep,
      sigmaPmInf: Math.min(strand.fp01k, Math.max(0, Pservice / Ap)), bonded, epsUk, deltaSigmaULS: u.deltaSigmaUnbonded,
    }
    const tension = faceName === 'sagging' ? { area: bb.area, d: dBotBar } : { area: bt.area, d: dTopBar }
    const compression = faceName === 'sagging' ? { area: bt.area, d: h - dTopBar } : { area: bb.area, d: h - dBotBar }
    const bars: BarLayer[] = []
    if (tension.area > 0) bars.push({ As: tension.area, d: tension.d, ...barProps })
    if (compression.area > 0) bars.push({ As: compression.area, d: compression.d, ...barProps })
    const r: BendingResult = bendingResistance({
      section: o, face: faceName, fck: d.concrete.at28.fck, tendons: [tendon], bars, branch: u.branch,
      gammaC: u.gammaC, gammaS: u.gammaS, alphaCC: u.alphaCC, MEd, addedBar: { d: tension.d, fyk: u.fyk },
    })
    const t = r.tendons[0] as { stress: number; strain: number }
    return {
      MEd, MRd: r.MRd, x: r.x, d: r.dTension, xOverD: r.xOverD, xOverDLimit: r.xOverDLimit,
      tendonStress: t.stress, tendonStrain: t.strain, utilisation: cap(r.utilisation ?? 0), AsRequired: r.AsRequired,
      equilibrium: r.equilibrium, strainLimited: r.strainLimited,
    }
  }

  const sections: UlsSection[] = d.sections.map((s) => {
    const values = cases.map((c) => caseValue(c, (i) => (unit[i] as ReturnType<typeof analyseContinuousBeam>).momentAt(s.span, s.x)))
    const m2 = [s.moments.secondaryTransfer, s.moments.secondaryService].map((v) => u.gammaP * v) // γP M2 (2.4.2.2(1), 5.10.8(1))
    const secondary = { min: Math.min(...m2), max: Math.max(...m2) }
    const MEdMax = Math.max(...values) + secondary.max
    const MEdMin = Math.min(...values) + secondary.min
    const sagging = MEdMax > 0 ? face('sagging', s.e, s.force.service, MEdMax) : null
    const hogging = MEdMin < 0 ? face('hogging', s.e, s.force.service, -MEdMin) : null
    return {
      id: s.id, label: s.label, span: s.span, x: s.x, X: s.X, MEdMax, MEdMin, secondary, sagging, hogging,
      utilisation: Math.max(sagging?.utilisation ?? 0, hogging?.utilisation ?? 0),
    }
  })

  // shear both sides of every support
  const shearG = shearGeometry(o, yt)
  const fctd = d.concrete.at28.fctk005 / u.gammaC // 3.1.6(2), αct = 1.0
  const t = input.tendon
  const ductSum = input.section.kind === 'slab-strip' ? 0 : t.count * (t.ductShape === 'flat' ? t.ductWidth : t.ductHeight)
  if (ductSum >= shearG.bw) throw new EngineInputError('tendon.count', 'the ducts side by side are wider than the web')
  const ductKind: DuctKind = !bonded ? 'unbonded' : opt.shear.ductMaterial === 'metal' ? 'grouted-metal' : 'grouted-plastic'
  const isSlab = input.section.kind === 'slab-strip'
  const byId = new Map(d.sections.map((s) => [s.id, s]))
  const shear: UlsShear[] = []
  for (let j = 0; j <= n; j++) {
    const sides: Array<{ side: 'left' | 'right'; span: number; x: number }> = []
    if (j > 0) sides.push({ side: 'left', span: j - 1, x: spans[j - 1] as number })
    if (j < n) sides.push({ side: 'right', span: j, x: 0 })
    const sec = byId.get(`support-${j + 1}`)
    const e = sec?.e ?? (d.profile.supportEcc[j] as number)
    const P = sec?.force.service ?? d.force.meanService
    for (const sd of sides) {
      const L = spans[sd.span] as number
      const V2 = [M2t, M2s].map((m) => (u.gammaP * ((m[sd.span + 1] as number) - (m[sd.span] as number))) / L) // secondary shear ΔM2/L
      const Vcases = cases.map((c) => caseValue(c, (i) => (unit[i] as ReturnType<typeof analyseContinuousBeam>).shearAt(sd.span, sd.x)))
      const candidates = Vcases.flatMap((v) => V2.map((w) => v + w))
      const VEd = Math.max(...candidates.map(Math.abs))
      const Vsecondary = V2.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a))
      const Mcases = cases.map((c) => caseValue(c, (i) => (unit[i] as ReturnType<typeof analyseContinuousBeam>).momentAt(sd.span, sd.x)))
      const Mext = Math.min(...Mcases) + u.gammaP * M2at(M2s, sd.span, sd.x)
      const hog = Mext < 0
      const dp = hog ? h - (yt + e) : yt + e
      const dBars = hog ? (bt.area > 0 ? dTopBar : 0) : bb.area > 0 ? dBotBar : 0
      const dv = Math.max(dp, dBars)
      const Asl = (bonded ? Ap : 0) + (hog ? bt.area : bb.area) // bonded tendons counted in ρl (common practice)
      const fs = fibreStresses({ A: d.section.A, Zt: d.section.Zt, Zb: d.section.Zb, P, e, M: Mext })
      const uncracked = Math.max(-fs.top, -fs.bottom) <= fctd // 6.2.2(2): flexural tension below fctd at ULS
      const r = shearResistance({
        VEd, bw: shearG.bw, d: dv, fck: d.concrete.at28.fck, Asl, NEd: P, Ac: d.section.A, gammaC: u.gammaC, k1: opt.shear.k1, alphaCC: u.alphaCC,
        ...(uncracked ? { uncracked: { I: d.section.I, S: shearG.S, bwCentroid: shearG.bCentroid, fctk005: d.concrete.at28.fctk005 } } : {}),
        links: { fywk: opt.shear.fywk, gammaS: u.gammaS, cotThetaMax: opt.shear.cotThetaMax, ductDiameterSum: ductSum, ductKind },
      })
      const useLinks = r.linksNeeded && !isSlab && r.links !== null
      const VRd = useLinks ? (r.links?.VRdMax as number) : r.VRdcGoverning
      const label = `Support ${j + 1}, ${sd.side === 'left' ? 'left' : 'right'} side`
      shear.push({
        id: `support-${j + 1}-${sd.side}`, label, support: j, side: sd.side, span: sd.span, x: sd.x, VEd, Vsecondary, d: dv, sigmaCp: r.sigmaCp,
        VRdc: r.VRdc, VRdcUncracked: r.VRdcUncracked, VRd, linksNeeded: r.linksNeeded,
        AswPerS: r.linksNeeded && r.links ? r.links.AswPerS : null, cotTheta: useLinks && r.links ? r.links.cotTheta : null, VRdMax: r.links ? r.links.VRdMax : null,
        utilisation: cap(VRd > 0 ? VEd / VRd : CAP),
      })
    }
  }

  // detailing limits
  const member = isSlab ? 'slab' : 'beam'
  const fctm = d.concrete.at28.fctm
  const limBottom = reinforcementLimits({ member, fctm, fyk: u.fyk, bt: d.section.bBottom, d: dBotBar, h, Ac: d.section.A })
  const limTop = reinforcementLimits({ member, fctm, fyk: u.fyk, bt: d.section.bTop, d: dTopBar, h, Ac: d.section.A })
  const bondedTendon = bonded ? Ap : 0
  const supportSteel = isSlab ? supportBondedSteel({ h, panelWidth: 1000, columnWidth: opt.punching.c2 }) : null

  // punching (slab strips over columns)
  let punching: UlsPunching | null = null
  if (opt.punching.column !== 'none') {
    if (!isSlab) throw new EngineInputError('punching.column', 'the punching check applies to a slab strip over columns')
    const j = opt.punching.support - 1
    if (j > n) throw new EngineInputError('punching.support', `the member has ${n + 1} supports`)
    const reactionCase = (c: UlsCase): number => caseValue(c, (i) => (unit[i] as ReturnType<typeof analyseContinuousBeam>).reactions[j] as number)
    const R2 = [M2t, M2s].map((m) => {
      const right = j < n ? ((m[j + 1] as number) - (m[j] as number)) / (spans[j] as number) : 0
      const left = j > 0 ? ((m[j] as number) - (m[j - 1] as number)) / (spans[j - 1] as number) : 0
      return u.gammaP * (right - left) // secondary reaction: jump of the secondary shear
    })
    const perWidth = Math.max(...cases.flatMap((c) => R2.map((r) => reactionCase(c) + r))) / 1000 // N per mm of strip width
    const VEd = perWidth * opt.punching.panelWidth // the strip reaction over the panel width (common practice)
    const sec = byId.get(`support-${j + 1}`)
    const e = sec?.e ?? (d.profile.supportEcc[j] as number)
    const dTendon = h - (yt + e)
    const dp = Math.max(dTendon, bt.area > 0 ? dTopBar : 0)
    const profile: TendonProfile = { spans, supportEcc: d.profile.supportEcc, spanEcc: d.profile.spanEcc, lowPointAt: d.profile.lowPointAt, inflection: d.profile.inflection }
    const P = sec?.force.service ?? d.force.meanService
    const pPerMm = P / 1000
    const reach = 2 * dp
    const slopes: number[] = []
    if (j > 0) slopes.push(Math.abs(tendonSlope(profile, j - 1, Math.max(0, (spans[j - 1] as number) - reach))))
    if (j < n) slopes.push(Math.abs(tendonSlope(profile, j, Math.min(spans[j] as number, reach))))
    // tendons of the strip direction crossing the control perimeter within c2 + 4d (common practice; the orthogonal tendons are ignored)
    const Vpd = pPerMm * (opt.punching.c2 + 2 * reach) * slopes.reduce((s, v) => s + Math.sin(Math.atan(v)), 0)
    const rho = ((bt.area + bondedTendon) / 1000) / dp
    const sigma = P / d.section.A
    const r = punchingCheck({
      VEd, Vpd: Math.min(Vpd, VEd), position: opt.punching.column, c1: opt.punching.c1, c2: opt.punching.c2, d: dp, fck: d.concrete.at28.fck,
      rhoLy: rho, rhoLz: rho, sigmaCy: sigma, sigmaCz: sigma, gammaC: u.gammaC, k1: opt.punching.k1, vRdMaxCoefficient: opt.punching.vRdMaxFactor,
    })
    warnings.push('Punching: the reinforcement ratio and the precompression across the strip are taken equal to those along it.')
    punching = {
      support: j, position: opt.punching.column, VEd, Vpd: Math.min(Vpd, VEd), d: dp, u0: r.u0, u1: r.u1, beta: r.beta, rhoL: r.rhoL, sigmaCp: r.sigmaCp,
      vEd: r.vEdU1, vRdc: r.vRdc, vEdFace: r.vEdU0, vRdMax: r.vRdMax, utilisation: cap(r.utilisation), utilisationFace: cap(r.utilisationFace),
    }
  }

  // proposal: the largest extra bars any section needs at each face
  const need = (f: 'sagging' | 'hogging'): number | null => {
    const v = sections.map((s) => s[f]).filter((x): x is UlsBendingFace => x !== null)
    if (v.some((x) => x.AsRequired === null)) return null
    return Math.max(0, ...v.map((x) => x.AsRequired as number))
  }
  const proposal = { AsBottom: need('sagging'), AsTop: need('hogging') }
  if (proposal.AsBottom === null || proposal.AsTop === null) warnings.push('ULS bending: no amount of passive steel up to 4 % of the section suffices at some section; deepen the section or add prestress.')
  if (sections.some((s) => s.sagging?.strainLimited || s.hogging?.strainLimited)) warnings.push('ULS bending: the steel strain passes εud at some section; its stress is held at the value at εud.')

  // checks
  const checks: CheckResult[] = []
  for (const f of ['sagging', 'hogging'] as const) {
    const withFace = sections.filter((s) => s[f] !== null)
    if (withFace.length === 0) continue
    const worst = withFace.reduce((a, b) => ((b[f] as UlsBendingFace).utilisation > (a[f] as UlsBendingFace).utilisation ? b : a))
    const r = worst[f] as UlsBendingFace
    const extra = r.AsRequired !== null && r.AsRequired > 0 ? `add ${r.AsRequired.toFixed(0)} mm² of ${f === 'sagging' ? 'bottom' : 'top'} bars` : undefined
    checks.push(ratioCheck(`uls.bending.${f}`, 'uls', `Bending resistance, ${f}`, 'EN 1992-1-1 6.1, 3.1.7(3), 3.3.6(7)', r.MEd, r.MRd, 'kNm', where(worst.label, worst.X), extra))
    const duct = withFace.reduce((a, b) => ((b[f] as UlsBendingFace).xOverD > (a[f] as UlsBendingFace).xOverD ? b : a))
    const rd = duct[f] as UlsBendingFace
    checks.push(ratioCheck(`detailing.ductility.${f}`, 'detailing', `Neutral-axis depth ratio x/d, ${f}`, 'EN 1992-1-1 5.6.3(2)', rd.xOverD, rd.xOverDLimit, '', where(duct.label, duct.X), 'ductility for the plastic rotation the analysis assumes'))
  }
  if (shear.length > 0) {
    const worst = shear.reduce((a, b) => (b.utilisation > a.utilisation ? b : a))
    const note = worst.linksNeeded
      ? isSlab ? 'VEd exceeds VRd,c: a slab strip without links needs more depth, prestress or bonded steel' : `links needed: Asw/s ≥ ${((worst.AswPerS as number) * 1000).toFixed(0)} mm²/m at cot θ = ${(worst.cotTheta as number).toFixed(2)}`
      : undefined
    const clause = worst.linksNeeded && !isSlab ? 'EN 1992-1-1 6.2.3 eq. (6.9)' : worst.VRdcUncracked !== null && worst.VRd === worst.VRdcUncracked ? 'EN 1992-1-1 6.2.2(2) eq. (6.4)' : 'EN 1992-1-1 6.2.2(1) eq. (6.2)'
    checks.push(ratioCheck('uls.shear', 'uls', 'Shear resistance', clause, worst.VEd, worst.VRd, 'kN', worst.label, note))
  }
  if (punching) {
    const loc = `Support ${punching.support + 1}`
    checks.push(ratioCheck('uls.punching', 'uls', 'Punching at the basic control perimeter', 'EN 1992-1-1 6.4.3 eq. (6.38), 6.4.4 eq. (6.47)', punching.vEd, punching.vRdc, 'MPa', loc, 'VEd reduced by the vertical component of the tendons'))
    checks.push(ratioCheck('uls.punching.face', 'uls', 'Punching at the column face', 'EN 1992-1-1 6.4.5(3)', punching.vEdFace, punching.vRdMax, 'MPa', loc))
  }
  const providedBottom = bb.area + bondedTendon
  const providedTop = bt.area + bondedTendon
  const minNote = bonded ? 'bonded tendons counted with the bars (common practice)' : undefined
  if (sections.some((s) => s.sagging)) checks.push(ratioCheck('detailing.minSteel.bottom', 'detailing', 'Least tension steel, bottom', 'EN 1992-1-1 eq. (9.1N)', providedBottom, limBottom.AsMin, 'mm²', undefined, minNote, true))
  if (sections.some((s) => s.hogging)) checks.push(ratioCheck('detailing.minSteel.top', 'detailing', 'Least tension steel, top', 'EN 1992-1-1 eq. (9.1N)', providedTop, limTop.AsMin, 'mm²', undefined, minNote, true))
  checks.push(ratioCheck('detailing.maxSteel', 'detailing', 'Greatest longitudinal steel', 'EN 1992-1-1 9.2.1.1(3)', bb.area + bt.area + Ap, limBottom.AsMax, 'mm²'))
  if (supportSteel && n > 1) checks.push(ratioCheck('detailing.supportSteel', 'detailing', 'Bonded top steel over the supports', 'common practice (0.075 % of h × panel width)', bt.area, supportSteel.As, 'mm²', undefined, `${SUPPORT_STEEL_RULE}; per metre of strip`, true))
  if (!bonded) {
    // 9.2.1.1(4) (from memory): unbonded tendons, MRd ≥ 1.15 Mcr
    let worst: { u: number; MRd: number; Mcr: number; label: string } | null = null
    for (const s of sections) {
      const sec = d.sections.find((x) => x.id === s.id)
      if (!sec) continue
      const P = sec.force.service
      for (const f of ['sagging', 'hogging'] as const) {
        const r = s[f]
        if (!r) continue
        const Mcr = f === 'sagging' ? d.section.Zb * (fctm + P / d.section.A) + P * sec.e : d.section.Zt * (fctm + P / d.section.A) - P * sec.e // moment at first cracking with the primary prestress
        const uu = r.MRd > 0 ? (1.15 * Mcr) / r.MRd : CAP
        if (!worst || uu > worst.u) worst = { u: uu, MRd: r.MRd, Mcr, label: where(s.label, s.X) }
      }
    }
    if (worst) checks.push(ratioCheck('detailing.unbondedCapacity', 'detailing', 'Bending resistance at least 1.15 × cracking moment (unbonded tendons)', 'EN 1992-1-1 9.2.1.1(4)', worst.MRd, 1.15 * worst.Mcr, 'kNm', worst.label, undefined, true))
  }

  return {
    uls: {
      combination: u.combination, factors, cases: cases.map((c) => ({ id: c.id, label: c.label, clause: c.clause })), sections, shear,
      reinforcement: {
        AsMinBottom: limBottom.AsMin, AsMinTop: limTop.AsMin, AsMax: limBottom.AsMax, providedBottom: bb.area, providedTop: bt.area, bondedTendon,
        supportSteel: supportSteel ? { As: supportSteel.As, bandWidth: supportSteel.bandWidth, perWidth: supportSteel.perWidth } : null,
        supportSteelRule: supportSteel ? SUPPORT_STEEL_RULE : null,
      },
      proposal, punching,
    },
    checks, warnings,
  }
}
