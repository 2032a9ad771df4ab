/**
 * ULS stage: design moments from the EN 1990 fundamental combinations with pattern loading plus
 * the secondary effects of prestress at γP, the bending resistance at every critical section
 * (sagging and hogging), shear at both sides of every support, the passive steel proposed where a
 * section is short, the detailing limits and the optional punching check. It uses the same
 * unit-span analyses as the service stages, so both work on one analysis model.
 */
import type { CheckResult } from '../contract'
import { UTILISATION_CAP, atStation, capUtilisation, ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { bendingResistance } from '../uls/bending'
import type { BarLayer, BendingResult, TendonLayer } from '../uls/bending'
import { reinforcementLimits, supportBondedSteel } from '../uls/reinforcement'
import type { PrestressAnalysis } from './analysis'
import type { MemberLoads } from './loads'
import type { MemberLosses } from './losses'
import type { LocalSection } from './section'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { ServiceStresses } from './stress-limits'
import { ulsActions } from './uls-actions'
import { punchingAtColumn, shearAtSupports } from './uls-shear'
import type { UlsPunching, UlsShear } from './uls-shear'

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

/**
 * The rule for bonded top steel over the supports of a post-tensioned slab, as the sheet states it:
 * EN 1992-1-1 sets no such amount, so it is cited as common practice only.
 */
export const SUPPORT_TOP_STEEL_RULE = 'As ≥ 0.00075·h·l2 over the column, within the column width plus 1.5h each side (common practice for post-tensioned flat slabs; EN 1992-1-1 sets no such amount)'

export interface UlsInput {
  input: MemberInput
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  losses: MemberLosses
  analysis: PrestressAnalysis
  stresses: ServiceStresses
}

export function ulsStage({ input, section, loads, profile, losses, analysis, stresses }: UlsInput): StageOutcome<MemberUls> {
  const warnings: string[] = []
  const n = input.geometry.spans.length
  const sec = section.properties
  const { h, yt } = sec
  const bonded = section.bonded
  const u = input.uls
  const factors = { gammaG: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP }
  const actions = ulsActions(input, section, loads, analysis)
  const { cases, envelope, dBottomBars, dTopBars } = actions

  // the bar layers, depths from the compression face
  const bb = u.barsBottom
  const bt = u.barsTop
  const barProps = { fyk: u.fyk, k: 1.08, epsUk: 0.05 } // B500 class B, EN 1992-1-1 Annex C Table C.1
  const strand = section.strand
  const Ap = section.Ap
  const epsUk = u.epsUdTendon / 0.9 // 3.3.6(7) note: εud = 0.9 εuk

  const face = (faceName: 'sagging' | 'hogging', local: LocalSection, e: number, Pservice: number, MEd: number): UlsBendingFace => {
    // over a drop: its depth and outline, e from its centroid, the bottom bars at its soffit
    const hl = local.properties.h
    const dh = hl - h
    const dBottomBars = actions.dBottomBars + dh
    const dTopBars = actions.dTopBars + dh
    const dp = faceName === 'sagging' ? local.properties.yt + e : hl - (local.properties.yt + e)
    const tendon: TendonLayer = {
      Ap, d: Math.min(hl, Math.max(0, dp)), fpk: strand.fpk, fp01k: strand.fp01k, Ep: strand.Ep,
      sigmaPmInf: Math.min(strand.fp01k, Math.max(0, Pservice / Ap)), bonded, epsUk, deltaSigmaULS: u.deltaSigmaUnbonded,
    }
    const tension = faceName === 'sagging' ? { area: bb.area, d: dBottomBars } : { area: bt.area, d: dTopBars }
    const compression = faceName === 'sagging' ? { area: bt.area, d: hl - dTopBars } : { area: bb.area, d: hl - dBottomBars }
    const bars: BarLayer[] = []
    if (tension.area > 0) bars.push({ As: tension.area, d: tension.d, ...barProps })
    if (compression.area > 0) bars.push({ As: compression.area, d: compression.d, ...barProps })
    const r: BendingResult = bendingResistance({
      section: local.outline, face: faceName, fck: section.at28.fck, tendons: [tendon], bars, branch: u.branch,
      gammaC: u.gammaC, gammaS: u.gammaS, alphaCC: u.alphaCC, MEd, addedBar: { d: tension.d, fyk: u.fyk },
    })
    const t = r.tendons[0] as { stress: number; strain: number }
    return {
      MEd, MRd: r.MRd, x: r.x, d: r.dTension, xOverD: r.xOverD, xOverDLimit: r.xOverDLimit,
      tendonStress: t.stress, tendonStrain: t.strain, utilisation: capUtilisation(r.utilisation ?? 0), AsRequired: r.AsRequired,
      equilibrium: r.equilibrium, strainLimited: r.strainLimited,
    }
  }

  const envelopes = stresses.sections.map((s) => {
    const values = envelope({ kind: 'moment', span: s.span, x: s.x })
    const m2 = [s.moments.secondaryTransfer, s.moments.secondaryService].map((v) => u.gammaP * v) // γP M2 (2.4.2.2(1), 5.10.8(1))
    const secondary = { min: Math.min(...m2), max: Math.max(...m2) }
    return { secondary, max: values.max + secondary.max, min: values.min + secondary.min }
  })
  // a pinned end carries no moment, yet the sums of unit-span cases leave ±1e-8 N·mm there whose sign
  // would pick the face; below a millionth of the member's largest design moment a moment is zero
  const momentScale = Math.max(0, ...envelopes.map((m) => Math.max(Math.abs(m.max), Math.abs(m.min))))
  const zeroBelow = 1e-6 * momentScale
  const rounded = (M: number): number => (Math.abs(M) <= zeroBelow ? 0 : M)
  const sections: UlsSection[] = stresses.sections.map((s, r) => {
    const { secondary, max, min } = envelopes[r] as (typeof envelopes)[number]
    const MEdMax = rounded(max)
    const MEdMin = rounded(min)
    const local = section.at(s.span, s.x)
    const sagging = MEdMax > 0 ? face('sagging', local, s.e, s.force.service, MEdMax) : null
    const hogging = MEdMin < 0 ? face('hogging', local, s.e, s.force.service, -MEdMin) : null
    return {
      id: s.id, label: s.label, span: s.span, x: s.x, X: s.X, MEdMax, MEdMin, secondary, sagging, hogging,
      utilisation: Math.max(sagging?.utilisation ?? 0, hogging?.utilisation ?? 0),
    }
  })

  const shearInput = { input, section, profile, losses, sections: stresses.sections, actions }
  const shear = shearAtSupports(shearInput)

  // detailing limits
  const member = section.isSlab ? 'slab' : 'beam'
  const fctm = section.at28.fctm
  const limBottom = reinforcementLimits({ member, fctm, fyk: u.fyk, bt: sec.bBottom, d: dBottomBars, h, Ac: sec.A })
  const limTop = reinforcementLimits({ member, fctm, fyk: u.fyk, bt: sec.bTop, d: dTopBars, h, Ac: sec.A })
  const bondedTendon = bonded ? Ap : 0
  const supportSteel = section.isSlab ? supportBondedSteel({ h, panelWidth: 1000, columnWidth: input.punching.c2 }) : null

  const column = punchingAtColumn(shearInput)
  const punching = column.punching
  warnings.push(...column.warnings)

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
    checks.push(ratioCheck({ id: `uls.bending.${f}`, group: 'uls', title: `Bending resistance, ${f}`, clause: 'EN 1992-1-1 6.1, 3.1.7(3), 3.3.6(7)', actual: r.MEd, limit: r.MRd, unit: 'kNm', location: atStation(worst.label, worst.X), ...(extra ? { note: extra } : {}) }))
    const duct = withFace.reduce((a, b) => ((b[f] as UlsBendingFace).xOverD > (a[f] as UlsBendingFace).xOverD ? b : a))
    const rd = duct[f] as UlsBendingFace
    checks.push(ratioCheck({ id: `detailing.ductility.${f}`, group: 'detailing', title: `Neutral-axis depth ratio x/d, ${f}`, clause: 'EN 1992-1-1 5.6.3(2)', actual: rd.xOverD, limit: rd.xOverDLimit, unit: '', location: atStation(duct.label, duct.X), note: 'ductility for the plastic rotation the analysis assumes' }))
  }
  if (shear.length > 0) {
    const worst = shear.reduce((a, b) => (b.utilisation > a.utilisation ? b : a))
    const note = worst.linksNeeded
      ? section.isSlab ? 'VEd exceeds VRd,c: a slab strip without links needs more depth, prestress or bonded steel' : `links needed: Asw/s ≥ ${((worst.AswPerS as number) * 1000).toFixed(0)} mm²/m at cot θ = ${(worst.cotTheta as number).toFixed(2)}`
      : undefined
    const clause = worst.linksNeeded && !section.isSlab ? 'EN 1992-1-1 6.2.3 eq. (6.9)' : worst.VRdcUncracked !== null && worst.VRd === worst.VRdcUncracked ? 'EN 1992-1-1 6.2.2(2) eq. (6.4)' : 'EN 1992-1-1 6.2.2(1) eq. (6.2)'
    checks.push(ratioCheck({ id: 'uls.shear', group: 'uls', title: 'Shear resistance', clause, actual: worst.VEd, limit: worst.VRd, unit: 'kN', location: worst.label, ...(note ? { note } : {}) }))
  }
  if (punching) {
    const loc = `Support ${punching.support + 1}`
    checks.push(ratioCheck({ id: 'uls.punching', group: 'uls', title: 'Punching at the basic control perimeter', clause: 'EN 1992-1-1 6.4.3 eq. (6.38), 6.4.4 eq. (6.47)', actual: punching.vEd, limit: punching.vRdc, unit: 'MPa', location: loc, note: 'VEd reduced by the vertical component of the tendons' }))
    checks.push(ratioCheck({ id: 'uls.punching.face', group: 'uls', title: 'Punching at the column face', clause: 'EN 1992-1-1 6.4.5(3)', actual: punching.vEdFace, limit: punching.vRdMax, unit: 'MPa', location: loc }))
  }
  const providedBottom = bb.area + bondedTendon
  const providedTop = bt.area + bondedTendon
  const minNote = bonded ? { note: 'bonded tendons counted with the bars (common practice)' } : {}
  if (sections.some((s) => s.sagging)) checks.push(ratioCheck({ id: 'detailing.minSteel.bottom', group: 'detailing', title: 'Least tension steel, bottom', clause: 'EN 1992-1-1 eq. (9.1N)', actual: providedBottom, limit: limBottom.AsMin, unit: 'mm²', ...minNote, atLeast: true }))
  if (sections.some((s) => s.hogging)) checks.push(ratioCheck({ id: 'detailing.minSteel.top', group: 'detailing', title: 'Least tension steel, top', clause: 'EN 1992-1-1 eq. (9.1N)', actual: providedTop, limit: limTop.AsMin, unit: 'mm²', ...minNote, atLeast: true }))
  checks.push(ratioCheck({ id: 'detailing.maxSteel', group: 'detailing', title: 'Greatest longitudinal steel', clause: 'EN 1992-1-1 9.2.1.1(3)', actual: bb.area + bt.area + Ap, limit: limBottom.AsMax, unit: 'mm²' }))
  if (supportSteel && n > 1) checks.push(ratioCheck({ id: 'detailing.supportSteel', group: 'detailing', title: 'Bonded top steel over the supports', clause: 'common practice (0.075 % of h × panel width)', actual: bt.area, limit: supportSteel.As, unit: 'mm²', note: `${SUPPORT_TOP_STEEL_RULE}; per metre of strip`, atLeast: true }))
  if (!bonded) {
    const serviceById = new Map(stresses.sections.map((x) => [x.id, x]))
    // 9.2.1.1(4) (from memory): unbonded tendons, MRd ≥ 1.15 Mcr
    let worst: { u: number; MRd: number; Mcr: number; label: string } | null = null
    for (const s of sections) {
      const ss = serviceById.get(s.id)
      if (!ss) continue
      const P = ss.force.service
      for (const f of ['sagging', 'hogging'] as const) {
        const r = s[f]
        if (!r) continue
        const ls = section.at(s.span, s.x).properties // over a drop, its own section
        const Mcr = f === 'sagging' ? ls.Zb * (fctm + P / ls.A) + P * ss.e : ls.Zt * (fctm + P / ls.A) - P * ss.e // moment at first cracking with the primary prestress
        // a resistance or a cracking moment that is not positive leaves no meaningful ratio: that section governs and fails
        const uu = r.MRd > 0 && Mcr > 0 ? (1.15 * Mcr) / r.MRd : UTILISATION_CAP
        if (!worst || uu > worst.u) worst = { u: uu, MRd: r.MRd, Mcr, label: atStation(s.label, s.X) }
      }
    }
    if (worst) checks.push(ratioCheck({ id: 'detailing.unbondedCapacity', group: 'detailing', title: 'Bending resistance at least 1.15 × cracking moment (unbonded tendons)', clause: 'EN 1992-1-1 9.2.1.1(4)', actual: worst.MRd, limit: 1.15 * worst.Mcr, unit: 'kNm', location: worst.label, atLeast: true }))
  }

  return {
    result: {
      combination: u.combination, factors, cases: cases.map((c) => ({ id: c.id, label: c.label, clause: c.clause })), sections, shear,
      reinforcement: {
        AsMinBottom: limBottom.AsMin, AsMinTop: limTop.AsMin, AsMax: limBottom.AsMax, providedBottom: bb.area, providedTop: bt.area, bondedTendon,
        supportSteel: supportSteel ? { As: supportSteel.As, bandWidth: supportSteel.bandWidth, perWidth: supportSteel.perWidth } : null,
        supportSteelRule: supportSteel ? SUPPORT_TOP_STEEL_RULE : null,
      },
      proposal, punching,
    },
    checks,
    warnings,
  }
}
