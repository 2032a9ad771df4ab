/**
 * Serviceability beyond the stress checks for a designed member (design.md §1 step 10): deflection
 * under the unbalanced quasi-permanent load, short and long term (7.4), and crack control by
 * exposure (7.3, Table 7.1N): crack widths where the tension passes fct,eff and the decompression
 * check for bonded tendons. Works on the part-1 result (Design).
 */
import type { CheckResult } from '../contract'
import type { DesignPartOne as Design } from '../uls/design-part-one'
import { equivalentLoads } from '../prestress/equivalent-loads'
import type { TendonProfile } from '../prestress/profile'
import type { BeamLoad, SupportKind } from '../analysis/continuous-beam'
import { creepCoefficient } from '../materials/creep-shrinkage'
import type { Part2Input } from '../uls/input-groups'
import type { SectionOutline } from '../uls/bending'
import { memberDeflection } from './deflection'
import type { SpanCracking, SpanDeflection } from './deflection'
import { crackedSection } from './cracked-section'
import { outline } from '../uls/member-uls'
import type { CrackedSectionInput, CrackedSectionResult } from './cracked-section'
import { EngineInputError } from '../contract'
import type { SteelLayer } from './cracked-section'
import { crackRequirement, crackWidth, decompressionCheck } from './cracking'
import type { Combination } from './cracking'

const CAP = 999

export interface MemberDeflection {
  phi: number
  EcEff: number
  /** unbalanced quasi-permanent line load per span: gravity less the balanced load of the mean service force, N/mm */
  unbalanced: number[]
  spans: Array<SpanDeflection & { McrSagging: number; McrHogging: number; IcrSagging: number; IcrHogging: number }>
  series: { x: number[]; span: number[]; shortTerm: number[]; longTerm: number[] }
}

export interface CrackSection {
  id: string
  label: string
  X: number
  face: 'top' | 'bottom' | null
  /** greatest tensile stress of the uncracked section under the combination, MPa (0 when none) */
  tension: number
  cracked: boolean
  sigmaS: number | null
  x: number | null
  srMax: number | null
  wk: number | null
}

export interface DecompressionSection {
  id: string
  label: string
  X: number
  level: number
  stress: number
  pass: boolean
}

export interface MemberCracking {
  exposure: string
  wmax: number | null
  combination: Combination
  decompression: Combination | null
  note: string
  fctEff: number
  sections: CrackSection[]
  decompressionSections: DecompressionSection[]
}

export interface SlsOutcome {
  deflection: MemberDeflection
  cracking: MemberCracking
  checks: CheckResult[]
  warnings: string[]
}


function check(id: string, group: string, title: string, clause: string, actual: number, limit: number, unit: CheckResult['unit'], location?: string, note?: string): CheckResult {
  const u = Math.min(CAP, limit > 0 ? actual / limit : actual > 0 ? CAP : 0)
  return { id, group, title, clause, actual, limit, unit, utilisation: u, pass: u <= 1 + 1e-9, ...(location ? { location } : {}), ...(note ? { note } : {}) }
}

const STAGE_OF: Record<Combination, 'frequent' | 'quasiPermanent'> = { frequent: 'frequent', 'quasi-permanent': 'quasiPermanent' }

export function memberSls(d: Design, opt: Part2Input): SlsOutcome {
  const input = d.input
  const warnings: string[] = []
  const spans = input.geometry.spans
  const supports: SupportKind[] = input.geometry.supports ?? [...spans.map(() => 'pinned' as SupportKind), 'pinned']
  const h = d.section.h
  const yt = d.section.yt
  const A = d.section.A
  const c28 = d.concrete.at28
  const bonded = input.tendon.bond === 'bonded'
  const strand = d.strand
  const Ap = d.jacking.Ap
  const P = d.force.meanService
  const bb = opt.uls.barsBottom
  const bt = opt.uls.barsTop
  const Es = 200000 // EN 1992-1-1 3.2.7(4)
  const o = outline(d)

  // deflection under the unbalanced quasi-permanent load (load balancing, Lin)
  const phi = opt.deflection.phi ?? d.losses.phi ?? creepCoefficient({
    fck: c28.fck, RH: input.materials.RH * 100, h0: d.section.h0, t0: input.materials.ageAtStressing, t: input.losses.serviceLife, cement: input.materials.cement,
  })
  const wQP = d.loads.selfWeight + d.loads.superimposed + input.loads.psi2 * d.loads.imposed // EN 1990 eq. (6.16b)
  const profile: TendonProfile = { spans, supportEcc: d.profile.supportEcc, spanEcc: d.profile.spanEcc, lowPointAt: d.profile.lowPointAt, inflection: d.profile.inflection }
  const loads: BeamLoad[] = [...spans.map((_, i) => ({ kind: 'udl' as const, span: i, w: wQP })), ...equivalentLoads(profile, P)]
  const Icr = (faceName: 'sagging' | 'hogging', e: number): number => {
    const steel: SteelLayer[] = []
    const dBars = faceName === 'sagging' ? h - bb.cover - bb.diameter / 2 : h - bt.cover - bt.diameter / 2
    const area = faceName === 'sagging' ? bb.area : bt.area
    if (area > 0) steel.push({ A: area, d: dBars, E: Es })
    const dp = faceName === 'sagging' ? yt + e : h - (yt + e)
    if (bonded && dp > 0 && dp < h) steel.push({ A: Ap, d: dp, E: strand.Ep })
    if (steel.length === 0) return d.section.I // no bonded steel: no cracked state to fall back on
    const M = 1e6
    const r = crackedOrNull({ section: o, face: faceName, Ec: c28.Ecm, steel, N: 0, M })
    if (!r) return d.section.I
    return M / (c28.Ecm * r.curvature) // cracked second moment from the curvature (transformed section, N = 0: common practice)
  }
  const cracking: SpanCracking[] = spans.map((_, i) => {
    const eSup = Math.min(d.profile.supportEcc[i] as number, d.profile.supportEcc[i + 1] as number)
    return {
      McrSagging: d.section.Zb * (P / A + c28.fctm), // net moment at which the bottom fibre reaches fctm (7.4.3(3))
      McrHogging: d.section.Zt * (P / A + c28.fctm),
      IcrSagging: Icr('sagging', d.profile.spanEcc[i] as number),
      IcrHogging: Icr('hogging', eSup),
    }
  })
  const def = memberDeflection({
    spans, supports, loads, Ecm: c28.Ecm, phi, I: d.section.I, cracking, beta: opt.deflection.beta,
    ratioTotal: opt.deflection.ratioTotal, ratioAfter: opt.deflection.ratioAfter, limit: opt.deflection.limit ?? null,
  })
  if (def.spans.some((s) => s.cracked)) warnings.push('Deflection: part of the member cracks under the quasi-permanent load; the curvature there is interpolated by 7.4.3.')
  const balanced = spans.map((L, i) => (8 * P * (d.profile.drapes[i] as number)) / (L * L)) // Lin: w = 8Pa/L²
  const deflection: MemberDeflection = {
    phi, EcEff: def.EcEff, unbalanced: balanced.map((w) => wQP - w),
    spans: def.spans.map((s, i) => ({ ...s, ...(cracking[i] as SpanCracking) })),
    series: def.series,
  }

  // crack control by exposure
  const req = crackRequirement(input.limits.exposure, bonded ? 'bonded' : 'unbonded')
  const wmax = opt.cracking.wmax ?? req.wmax
  const stage = STAGE_OF[req.combination]
  const fctEff = c28.fctm // 7.3.2(2): fct,eff = fctm
  const perTendon = input.tendon.strandsPerTendon * strand.Ap
  const phiP = 1.6 * Math.sqrt(perTendon) // 6.8.2(2): equivalent diameter of a bundle
  const crackSections: CrackSection[] = d.sections.map((s) => {
    const env = s.envelope[stage]
    const tBottom = Math.max(0, -env.bottomMin)
    const tTop = Math.max(0, -env.topMin)
    const faceT: 'top' | 'bottom' | null = tBottom === 0 && tTop === 0 ? null : tBottom >= tTop ? 'bottom' : 'top'
    const tension = Math.max(tBottom, tTop)
    const base = { id: s.id, label: s.label, X: s.X, face: faceT, tension }
    if (faceT === null || tension <= fctEff) return { ...base, cracked: false, sigmaS: null, x: null, srMax: null, wk: faceT === null ? null : 0 }
    const sag = faceT === 'bottom'
    const Mext = sag ? s.moments[stage].max : s.moments[stage].min
    const Mnet = Mext + s.moments.totalService // external + total moment of prestress, about the centroid
    const bars = sag ? bb : bt
    const dBars = h - bars.cover - bars.diameter / 2
    const dp = sag ? yt + s.e : h - (yt + s.e)
    const steel: SteelLayer[] = []
    if (bars.area > 0) steel.push({ A: bars.area, d: dBars, E: Es })
    if (bonded) steel.push({ A: Ap, d: dp, E: strand.Ep })
    if (steel.length === 0 || !(sag ? Mnet > 0 : Mnet < 0)) return { ...base, cracked: true, sigmaS: null, x: null, srMax: null, wk: null }
    const r = crackedOrNull({ section: o, face: sag ? 'sagging' : 'hogging', Ec: c28.Ecm, steel, N: s.force.service, M: Math.abs(Mnet) })
    // no neutral axis inside the section: the prestress keeps the whole section in compression
    if (!r || !r.cracked) return { ...base, cracked: false, sigmaS: null, x: null, srMax: null, wk: 0 }
    const sigmaS = Math.max(0, r.steelStress[0] as number) // bars first; the tendon's Δσp where only tendons are bonded (7.3.4(1))
    const dSteel = bars.area > 0 ? dBars : dp
    const x = Math.min(r.x as number, dSteel - 1)
    const w = crackWidth({
      sigmaS, Es: bars.area > 0 ? Es : strand.Ep, Ecm: c28.Ecm, fctEff, duration: opt.cracking.duration,
      As: bars.area, ...(bars.area > 0 ? { phiS: bars.diameter } : {}), Ap: bonded ? Ap : 0, ...(bonded ? { phiP } : {}),
      fck: c28.fck, b: sag ? d.section.bBottom : d.section.bTop, h, d: dSteel, x,
      c: bars.area > 0 ? bars.cover : sag ? input.tendon.coverBottom : input.tendon.coverTop,
    })
    return { ...base, cracked: true, sigmaS, x: r.x, srMax: w.srMax, wk: w.wk }
  })

  const decompressionSections: DecompressionSection[] = []
  if (req.decompression && bonded) {
    // the strands may sit off the duct centre: take the duct as reaching that offset further either side (conservative)
    const offset = Math.max(0, d.eccentricity.dTop - input.tendon.coverTop - input.tendon.ductHeight / 2)
    const ductReach = input.tendon.ductHeight + 2 * offset
    const st = STAGE_OF[req.decompression]
    for (const s of d.sections) {
      const env = s.envelope[st]
      // the two linear distributions of the extreme moments: sagging (top max, bottom min) and hogging
      const pairs: Array<[number, number]> = [[env.topMax, env.bottomMin], [env.topMin, env.bottomMax]]
      const results = pairs.map(([top, bottom]) => decompressionCheck({ sigmaTop: top, sigmaBottom: bottom, h, tendonDepth: Math.min(h, Math.max(0, yt + s.e)), ductHeight: ductReach }))
      const worst = results.reduce((a, b) => (b.stress < a.stress ? b : a))
      decompressionSections.push({ id: s.id, label: s.label, X: s.X, level: worst.level, stress: worst.stress, pass: worst.pass })
    }
  }

  const checks: CheckResult[] = []
  const where = (label: string, X: number): string => `${label}, x = ${(X / 1000).toFixed(2)} m`
  const worstSpan = (f: (s: SpanDeflection) => number): SpanDeflection => def.spans.reduce((a, b) => (f(b) > f(a) ? b : a))
  const longMax = (s: SpanDeflection): number => Math.max(s.longTerm.down, -s.longTerm.up)
  const wt = worstSpan((s) => longMax(s) / s.limitTotal)
  checks.push(check('sls.deflection.total', 'sls', 'Long-term deflection, quasi-permanent', 'EN 1992-1-1 7.4.1(4)', longMax(wt), wt.limitTotal, 'mm', `Span ${wt.span + 1}`, `span/${opt.deflection.ratioTotal}; Ec,eff = Ecm/(1 + φ), eq. (7.20)`))
  const wa = worstSpan((s) => s.afterConstruction / s.limitAfter)
  checks.push(check('sls.deflection.after', 'sls', 'Deflection after construction', 'EN 1992-1-1 7.4.1(5)', wa.afterConstruction, wa.limitAfter, 'mm', `Span ${wa.span + 1}`, `span/${opt.deflection.ratioAfter}; taken as the long-term less the short-term deflection (common practice)`))
  if (opt.deflection.limit !== undefined) {
    const lim = opt.deflection.limit
    const we = worstSpan(longMax)
    checks.push(check('sls.deflection.limit', 'sls', 'Long-term deflection against the engineer\'s limit', 'engineer\'s limit', longMax(we), lim, 'mm', `Span ${we.span + 1}`))
  }
  if (wmax !== null) {
    const cracked = crackSections.filter((s) => s.cracked)
    if (cracked.length === 0) {
      checks.push(check('sls.crackWidth', 'sls', `Crack width, ${req.combination}`, 'EN 1992-1-1 7.3.4, Table 7.1N', 0, wmax, 'mm', undefined, 'uncracked: the tension stays within fct,eff = fctm'))
    } else {
      const none = cracked.find((s) => s.wk === null)
      if (none) {
        checks.push({ ...check('sls.crackWidth', 'sls', `Crack width, ${req.combination}`, 'EN 1992-1-1 7.3.4, Table 7.1N', wmax * CAP, wmax, 'mm', where(none.label, none.X), 'the section cracks without bonded steel in its tension zone: add bonded bars'), utilisation: CAP, pass: false })
      } else {
        const worst = cracked.reduce((a, b) => ((b.wk as number) > (a.wk as number) ? b : a))
        checks.push(check('sls.crackWidth', 'sls', `Crack width, ${req.combination}`, 'EN 1992-1-1 7.3.4 eq. (7.8), Table 7.1N', worst.wk as number, wmax, 'mm', where(worst.label, worst.X)))
      }
    }
  }
  if (decompressionSections.length > 0) {
    const worst = decompressionSections.reduce((a, b) => (b.stress < a.stress ? b : a))
    const tension = Math.max(0, -worst.stress)
    const u = Math.min(CAP, tension > 1e-9 ? 1 + tension / c28.fctm : 0)
    checks.push({
      id: 'sls.decompression', group: 'sls', title: `Decompression, ${req.decompression}`, clause: 'EN 1992-1-1 7.3.1(5), Table 7.1N',
      location: where(worst.label, worst.X), actual: tension, limit: 0, unit: 'MPa', utilisation: u, pass: worst.pass,
      note: 'the duct and 25 mm beyond it towards the tension face stay in compression',
    })
  }
  return {
    deflection,
    cracking: { exposure: input.limits.exposure, wmax, combination: req.combination, decompression: req.decompression, note: req.note, fctEff, sections: crackSections, decompressionSections },
    checks, warnings,
  }
}

/** The cracked state, or null where none exists (the section stays in compression under N and M). */
function crackedOrNull(i: CrackedSectionInput): CrackedSectionResult | null {
  try {
    return crackedSection(i)
  } catch (error) {
    if (error instanceof EngineInputError && error.field === 'M') return null
    throw error
  }
}
