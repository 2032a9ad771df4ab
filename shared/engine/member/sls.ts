/**
 * SLS stage, beyond the stress checks: deflection under the unbalanced quasi-permanent load, short
 * and long term (EN 1992-1-1 7.4), and crack control by exposure (7.3, Table 7.1N): crack widths
 * where the tension passes fct,eff and the decompression check for bonded tendons.
 */
import type { CheckResult } from '../contract'
import { EngineInputError } from '../contract'
import { UTILISATION_CAP, atStation, ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { balancedLoad, equivalentLoads } from '../prestress/equivalent-loads'
import type { BeamLoad } from '../analysis/continuous-beam'
import { creepCoefficient } from '../materials/creep-shrinkage'
import { memberDeflection } from '../sls/deflection'
import type { SpanCracking, SpanDeflection } from '../sls/deflection'
import { crackedSection } from '../sls/cracked-section'
import type { CrackedSectionInput, CrackedSectionResult, SteelLayer } from '../sls/cracked-section'
import { crackRequirement, crackWidth, decompressionCheck } from '../sls/cracking'
import type { Combination } from '../sls/cracking'
import type { MemberLoads } from './loads'
import { combinationFactor, scaledLoad } from './added-loads'
import type { MemberLosses } from './losses'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { ServiceStresses } from './stress-limits'
import { crackSteelFaces } from './crack-steel'
import type { CrackSteelFace } from './crack-steel'

/** One sign throughout: deflection positive downward, an upward deflection (camber) negative, mm. */
export interface SignedExtreme {
  down: number
  up: number
  at: number
  /** the extreme of larger magnitude with its sign: downward +, upward (camber) − */
  value: number
  direction: 'downward' | 'upward (camber)'
}

export interface SignedSpanDeflection extends Omit<SpanDeflection, 'shortTerm' | 'longTerm'> {
  shortTerm: SignedExtreme
  longTerm: SignedExtreme
  /** span / ratioCamber: the limit on an upward long-term deflection (common practice, appearance), mm */
  limitCamber: number
}

export interface MemberDeflection {
  phi: number
  EcEff: number
  /** unbalanced quasi-permanent line load per span: gravity less the balanced load of the mean service force, N/mm */
  unbalanced: number[]
  spans: Array<SignedSpanDeflection & { McrSagging: number; McrHogging: number; IcrSagging: number; IcrHogging: number }>
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
  /** least steel for crack control of each face in tension, eq. (7.1) */
  minSteel: CrackSteelFace[]
}

export interface SlsResult {
  deflection: MemberDeflection
  cracking: MemberCracking
}

export interface SlsInput {
  input: MemberInput
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  losses: MemberLosses
  stresses: ServiceStresses
}

const STAGE_OF: Record<Combination, 'frequent' | 'quasiPermanent'> = { frequent: 'frequent', 'quasi-permanent': 'quasiPermanent' }

export function slsStage({ input, section, loads, profile, losses, stresses }: SlsInput): StageOutcome<SlsResult> {
  const opt = input
  const warnings: string[] = []
  const spans = input.geometry.spans
  const supports = loads.supports
  const sec = section.properties
  const h = sec.h
  const yt = sec.yt
  const A = sec.A
  const c28 = section.at28
  const bonded = input.tendon.bond === 'bonded'
  const strand = section.strand
  const Ap = section.Ap
  const P = losses.service.Pmean
  const bb = opt.uls.barsBottom
  const bt = opt.uls.barsTop
  const Es = 200000 // EN 1992-1-1 3.2.7(4)
  const o = section.outline

  // deflection under the unbalanced quasi-permanent load (load balancing, Lin)
  const phi = opt.deflection.phi ?? losses.phi ?? creepCoefficient({
    fck: c28.fck, RH: input.materials.RH * 100, h0: sec.h0, t0: input.materials.ageAtStressing, t: input.losses.serviceLife, cement: input.materials.cement,
  })
  const wQP = loads.selfWeight + loads.superimposed + input.loads.psi2 * loads.imposed // EN 1990 eq. (6.16b)
  // the added loads: permanent ones whole, imposed ones at their own ψ2 (EN 1990 eq. (6.16b))
  const addedQP = loads.added.map((l) => scaledLoad(l.beam, combinationFactor(l, 'quasiPermanent')))
  // the drops: their weight (their stiffness and the step of the centroid under them are left out: the plain member's deflection)
  const beamLoads: BeamLoad[] = [...spans.map((_, i) => ({ kind: 'udl' as const, span: i, w: wQP })), ...loads.dropWeights, ...addedQP, ...equivalentLoads(profile.profile, P)]
  const Icr = (faceName: 'sagging' | 'hogging', e: number): number => {
    const steel: SteelLayer[] = []
    const dBars = faceName === 'sagging' ? h - bb.cover - bb.diameter / 2 : h - bt.cover - bt.diameter / 2
    const area = faceName === 'sagging' ? bb.area : bt.area
    if (area > 0) steel.push({ A: area, d: dBars, E: Es })
    const dp = faceName === 'sagging' ? yt + e : h - (yt + e)
    if (bonded && dp > 0 && dp < h) steel.push({ A: Ap, d: dp, E: strand.Ep })
    if (steel.length === 0) return sec.I // no bonded steel: no cracked state to fall back on
    const M = 1e6
    const r = crackedOrNull({ section: o, face: faceName, Ec: c28.Ecm, steel, N: 0, M })
    if (!r) return sec.I
    return M / (c28.Ecm * r.curvature) // cracked second moment from the curvature (transformed section, N = 0: common practice)
  }
  const cracking: SpanCracking[] = spans.map((_, i) => {
    const eSup = Math.min(profile.profile.supportEcc[i] as number, profile.profile.supportEcc[i + 1] as number)
    return {
      McrSagging: sec.Zb * (P / A + c28.fctm), // net moment at which the bottom fibre reaches fctm (7.4.3(3))
      McrHogging: sec.Zt * (P / A + c28.fctm),
      IcrSagging: Icr('sagging', profile.profile.spanEcc[i] as number),
      IcrHogging: Icr('hogging', eSup),
    }
  })
  const def = memberDeflection({
    spans, supports, ...(loads.springs ? { springs: loads.springs.map((k) => k / c28.Ecm) } : {}), loads: beamLoads, Ecm: c28.Ecm, phi, I: sec.I, cracking, beta: opt.deflection.beta,
    ratioTotal: opt.deflection.ratioTotal, ratioAfter: opt.deflection.ratioAfter, limit: opt.deflection.limit ?? null,
  })
  if (def.spans.some((s) => s.cracked)) warnings.push('Deflection: part of the member cracks under the quasi-permanent load; the curvature there is interpolated by 7.4.3.')
  const balanced = balancedLoad(profile.profile, P) // Lin: w = 8Pa/L² (2Pa/L² on a cantilever)
  const deflection: MemberDeflection = {
    phi, EcEff: def.EcEff, unbalanced: balanced.map((w) => wQP - w),
    spans: def.spans.map((s, i) => {
      const limitCamber = (s.cantilever ? 2 * s.L : s.L) / opt.deflection.ratioCamber // a cantilever: twice the overhang (common practice)
      const longMax = Math.max(s.longTerm.down, -s.longTerm.up)
      return {
        ...s,
        shortTerm: signed(s.shortTerm),
        longTerm: signed(s.longTerm),
        limitCamber,
        // sag against span/250 (7.4.1(4)), camber against its own limit, the change after construction, the engineer's limit
        utilisation: Math.max(s.longTerm.down / s.limitTotal, -s.longTerm.up / limitCamber, s.afterConstruction / s.limitAfter, s.limitEngineer ? longMax / s.limitEngineer : 0),
        ...(cracking[i] as SpanCracking),
      }
    }),
    series: def.series,
  }

  // crack control by exposure
  const req = crackRequirement(input.limits.exposure, bonded ? 'bonded' : 'unbonded')
  const wmax = opt.cracking.wmax ?? req.wmax
  const stage = STAGE_OF[req.combination]
  const fctEff = c28.fctm // 7.3.2(2): fct,eff = fctm
  const perTendon = input.tendon.strandsPerTendon * strand.Ap
  const phiP = 1.6 * Math.sqrt(perTendon) // 6.8.2(2): equivalent diameter of a bundle
  const crackSections: CrackSection[] = stresses.sections.map((s) => {
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
    // over a drop: its depth, outline and centroid (e is measured from it)
    const ls = section.at(s.span, s.x)
    const h = ls.properties.h
    const yt = ls.properties.yt
    const o = ls.outline
    const sec = ls.properties
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
      fck: c28.fck, b: sag ? sec.bBottom : sec.bTop, h, d: dSteel, x,
      c: bars.area > 0 ? bars.cover : sag ? input.tendon.coverBottom : input.tendon.coverTop,
    })
    return { ...base, cracked: true, sigmaS, x: r.x, srMax: w.srMax, wk: w.wk }
  })

  const decompressionSections: DecompressionSection[] = []
  if (req.decompression && bonded) {
    // the strands may sit off the duct centre: take the duct as reaching that offset further either side (conservative)
    const offset = Math.max(0, section.eccentricity.dTop - input.tendon.coverTop - input.tendon.ductHeight / 2)
    const ductReach = input.tendon.ductHeight + 2 * offset
    const st = STAGE_OF[req.decompression]
    for (const s of stresses.sections) {
      const env = s.envelope[st]
      // the two linear distributions of the extreme moments: sagging (top max, bottom min) and hogging
      const pairs: Array<[number, number]> = [[env.topMax, env.bottomMin], [env.topMin, env.bottomMax]]
      const ls = section.at(s.span, s.x).properties // over a drop, its own depth and centroid
      const results = pairs.map(([top, bottom]) => decompressionCheck({ sigmaTop: top, sigmaBottom: bottom, h: ls.h, tendonDepth: Math.min(ls.h, Math.max(0, ls.yt + s.e)), ductHeight: ductReach }))
      const worst = results.reduce((a, b) => (b.stress < a.stress ? b : a))
      decompressionSections.push({ id: s.id, label: s.label, X: s.X, level: worst.level, stress: worst.stress, pass: worst.pass })
    }
  }

  const checks: CheckResult[] = []
  const worstSpan = (f: (s: SpanDeflection) => number): SpanDeflection => def.spans.reduce((a, b) => (f(b) > f(a) ? b : a))
  const longMax = (s: SpanDeflection): number => Math.max(s.longTerm.down, -s.longTerm.up)
  // 7.4.1(4) limits the sag, the downward deflection relative to the supports
  // a cantilever's tip against twice its overhang (common practice), where the table names the basis
  const where = (s: SpanDeflection): string => (s.cantilever ? `Span ${s.span + 1} (cantilever tip)` : `Span ${s.span + 1}`)
  const basis = (s: SpanDeflection, ratio: number): string => (s.cantilever ? `2 × overhang/${ratio} (common practice for a cantilever)` : `span/${ratio}`)
  const wt = worstSpan((s) => s.longTerm.down / s.limitTotal)
  checks.push(ratioCheck({ id: 'sls.deflection.total', group: 'sls', title: 'Long-term deflection (sag, downward), quasi-permanent', clause: 'EN 1992-1-1 7.4.1(4)', actual: wt.longTerm.down, limit: wt.limitTotal, unit: 'mm', location: where(wt), note: `${basis(wt, opt.deflection.ratioTotal)}; downward positive; Ec,eff = Ecm/(1 + φ), eq. (7.20)` }))
  // an upward long-term deflection is a camber: checked against its own limit (common practice, appearance)
  const camberLimit = (s: SpanDeflection): number => (s.cantilever ? 2 * s.L : s.L) / opt.deflection.ratioCamber
  const wc = worstSpan((s) => -s.longTerm.up / camberLimit(s))
  if (wc.longTerm.up < -1e-3) { // below a micrometre an upward deflection is round-off
    checks.push(ratioCheck({ id: 'sls.deflection.camber', group: 'sls', title: 'Long-term upward deflection (camber), quasi-permanent', clause: 'common practice (appearance): span/250 upward, as 7.4.1(4) for the sag', actual: -wc.longTerm.up, limit: camberLimit(wc), unit: 'mm', location: where(wc), note: `${basis(wc, opt.deflection.ratioCamber)}; the camber is shown negative in the table (downward positive)` }))
  }
  const wa = worstSpan((s) => s.afterConstruction / s.limitAfter)
  checks.push(ratioCheck({ id: 'sls.deflection.after', group: 'sls', title: 'Deflection after construction', clause: 'EN 1992-1-1 7.4.1(5)', actual: wa.afterConstruction, limit: wa.limitAfter, unit: 'mm', location: where(wa), note: `${basis(wa, opt.deflection.ratioAfter)}; taken as the long-term less the short-term deflection (common practice)` }))
  if (opt.deflection.limit !== undefined) {
    const lim = opt.deflection.limit
    const we = worstSpan(longMax)
    checks.push(ratioCheck({ id: 'sls.deflection.limit', group: 'sls', title: 'Long-term deflection against the engineer\'s limit', clause: 'engineer\'s limit', actual: longMax(we), limit: lim, unit: 'mm', location: `Span ${we.span + 1}` }))
  }
  if (wmax !== null) {
    const cracked = crackSections.filter((s) => s.cracked)
    if (cracked.length === 0) {
      checks.push(ratioCheck({ id: 'sls.crackWidth', group: 'sls', title: `Crack width, ${req.combination}`, clause: 'EN 1992-1-1 7.3.4, Table 7.1N', actual: 0, limit: wmax, unit: 'mm', note: 'uncracked: the tension stays within fct,eff = fctm' }))
    } else {
      const none = cracked.find((s) => s.wk === null)
      if (none) {
        checks.push({ ...ratioCheck({ id: 'sls.crackWidth', group: 'sls', title: `Crack width, ${req.combination}`, clause: 'EN 1992-1-1 7.3.4, Table 7.1N', actual: wmax * UTILISATION_CAP, limit: wmax, unit: 'mm', location: atStation(none.label, none.X), note: 'the section cracks without bonded steel in its tension zone: add bonded bars' }), utilisation: UTILISATION_CAP, pass: false })
      } else {
        const worst = cracked.reduce((a, b) => ((b.wk as number) > (a.wk as number) ? b : a))
        checks.push(ratioCheck({ id: 'sls.crackWidth', group: 'sls', title: `Crack width, ${req.combination}`, clause: 'EN 1992-1-1 7.3.4 eq. (7.8), Table 7.1N', actual: worst.wk as number, limit: wmax, unit: 'mm', location: atStation(worst.label, worst.X) }))
      }
    }
  }
  if (decompressionSections.length > 0) {
    const worst = decompressionSections.reduce((a, b) => (b.stress < a.stress ? b : a))
    const tension = Math.max(0, -worst.stress)
    const u = Math.min(UTILISATION_CAP, tension > 1e-9 ? 1 + tension / c28.fctm : 0)
    checks.push({
      id: 'sls.decompression', group: 'sls', title: `Decompression, ${req.decompression}`, clause: 'EN 1992-1-1 7.3.1(5), Table 7.1N',
      location: atStation(worst.label, worst.X), actual: tension, limit: 0, unit: 'MPa', utilisation: u, pass: worst.pass,
      note: 'the duct and 25 mm beyond it towards the tension face stay in compression',
    })
  }
  const minSteel = crackSteelFaces({ input, section, stresses, Pmean: P, wmax })
  checks.push(...minSteel.checks)
  return {
    result: {
      deflection,
      cracking: { exposure: input.limits.exposure, wmax, combination: req.combination, decompression: req.decompression, note: req.note, fctEff, sections: crackSections, decompressionSections, minSteel: minSteel.faces },
    },
    checks, warnings,
  }
}

/** The extreme of larger magnitude with its sign (downward +, upward −) and its direction. */
function signed(e: { down: number; up: number; at: number }): SignedExtreme {
  const upward = -e.up > e.down
  return { ...e, value: upward ? e.up : e.down, direction: upward ? 'upward (camber)' : 'downward' }
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
