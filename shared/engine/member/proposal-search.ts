/**
 * The search for the least force and a profile that pass every stress check at every section
 * (transfer and service, EN 1992-1-1 5.10.2.2, 7.2, 7.1(2)), on the stress conditions linearised in
 * proposal-model.ts and verified by full runs of the service design.
 */
import { parseMemberInput } from '../input/schema'
import { mergeInputPatch } from '../input/patch'
import type { InputPatch } from '../input/patch'
import { requiredModuli } from '../checks/magnel'
import type { MagnelResult } from '../checks/magnel'
import { linearModel, profileBasis, project } from './proposal-model'
import type { LinearModel } from './proposal-model'
import { designForService, stressesPass } from './service-design'
import type { ServiceDesign } from './service-design'
import type { MomentRange, ServiceSection, Stage } from './stress-limits'

/** Where a section's Magnel region is empty, the moduli it would need (Magnel's inequalities solved for Z). */
function sectionTooSmallReason(d: ServiceDesign, magnel: MagnelResult[]): string | null {
  const { limits } = d.stresses
  const sec = d.section.properties
  const { top: eTop, bottom: eBot } = d.section.eccentricity
  for (let r = 0; r < d.stresses.sections.length; r++) {
    const s = d.stresses.sections[r] as ServiceSection
    if ((magnel[r] as MagnelResult).feasible) continue
    const M = d.stresses.momentsBySection[r] as Record<Stage, MomentRange>
    const eta = s.force.service / s.force.transfer
    const fcs = limits.characteristic.compression ?? limits.quasiPermanent.compression ?? Infinity
    const fts = limits.frequent.tension ?? limits.quasiPermanent.tension ?? 0
    const need = requiredModuli({
      Mmin: M.transfer.min, Mmax: M.characteristic.max, eta,
      fct: limits.transfer.compression ?? 0, ftt: limits.transfer.tension ?? 0, fcs, fts,
    })
    const kNm = (v: number): string => (v / 1e6).toFixed(1)
    return `No prestress force satisfies the stress limits at ${s.label} within the eccentricity limits −${eTop.toFixed(0)} mm … +${eBot.toFixed(0)} mm`
      + ` (moments ${kNm(M.transfer.min)} kNm at transfer to ${kNm(M.characteristic.max)} kNm in service): the section is too small`
      + ` — it would need about Zt ≥ ${(Math.abs(need.Zt) / 1e6).toFixed(1)}·10⁶ mm³ and Zb ≥ ${(Math.abs(need.Zb) / 1e6).toFixed(1)}·10⁶ mm³`
      + ` against ${(sec.Zt / 1e6).toFixed(1)}·10⁶ and ${(sec.Zb / 1e6).toFixed(1)}·10⁶ mm³. Deepen the section or raise the concrete class.`
  }
  return null
}

export type Candidate = { spacing: number | null; count: number | null; strands: number }

/** Candidate arrangements, fewest strands first. */
function candidates(d: ServiceDesign): Candidate[] {
  const perTendon = d.input.tendon.strandsPerTendon
  const out: Candidate[] = []
  if (d.input.section.kind === 'slab-strip') {
    for (let s = 3000; s >= 150; s -= 25) out.push({ spacing: s, count: null, strands: (1000 / s) * perTendon })
  } else {
    for (let n = 1; n <= 60; n++) out.push({ spacing: null, count: n, strands: n * perTendon })
  }
  return out
}

/** To 0.1 mm, but never past the eccentricity limits: a profile on a limit must not round out of the concrete. */
function round1(v: number, lo: number, hi: number): number {
  const r = Math.round(v * 10) / 10
  if (r > hi) return Math.floor(hi * 10) / 10
  if (r < lo) return Math.ceil(lo * 10) / 10
  return r
}

/** An arrangement whose stresses pass: its index among the candidates, its profile and the run that passed. */
export interface StressFound { index: number; candidate: Candidate; supportEcc: number[]; spanEcc: number[]; run: ServiceDesign }

export interface StressSearch {
  candidates: Candidate[]
  /** the least force that passes every stress check, or null */
  least: StressFound | null
  /** why none passes, where least is null */
  reason: string | null
  /** a profile that passes the stresses with the strands of candidate index, linearised about a run, or null */
  at: (index: number, about: ServiceDesign) => StressFound | null
  patchOf: (cand: Candidate, supportEcc: number[], spanEcc: number[]) => InputPatch
}

/**
 * The least force and a profile that pass every stress check. The fibre stresses are linear in the
 * eccentricities at a given force, but the force per strand (friction, elastic shortening, creep)
 * moves with the strands and the profile, so a linearisation holds only near the member it was made
 * about: bracket with it, verify by full runs, then linearise again about the verified member and look
 * below it, until no smaller force verifies.
 */
export function stressSearch(first: ServiceDesign, magnel: MagnelResult[]): StressSearch {
  const cands = candidates(first)
  const n = first.input.geometry.spans.length
  const strandsOf = (d: ServiceDesign): number => d.section.strands
  // the eccentricity limits follow the section and covers only, never the strands or the profile
  const eLo = -first.section.eccentricity.top
  const eHi = first.section.eccentricity.bottom
  // the unit profiles keep the input's low points and inflection, so one basis serves every run
  const basis = profileBasis(first, first.stresses.sectionStations)
  // a margin (MPa) below the limits absorbs what the linearisation leaves out: wide far from the
  // input's force, narrow about a verified member, where little is left out
  const WIDE = 0.03
  const NARROW = 0.002
  // a linearisation about another force misjudges the force per strand (elastic shortening, creep) by
  // about this much (MPa): a rejection by less is tried by a run at the candidate's own force
  const MISJUDGED = 0.1
  const modelCache = new WeakMap<ServiceDesign, Map<number, LinearModel>>() // a design no longer in use is freed with its models
  const modelOf = (d: ServiceDesign, margin: number): LinearModel => {
    const byMargin = modelCache.get(d) ?? new Map<number, LinearModel>()
    const mdl = byMargin.get(margin) ?? linearModel(d, basis, margin)
    byMargin.set(margin, mdl)
    modelCache.set(d, byMargin)
    return mdl
  }
  const profileOf = (d: ServiceDesign): number[] => [...d.profile.profile.supportEcc, ...d.profile.profile.spanEcc]
  const patchOf = (cand: Candidate, supportEcc: number[], spanEcc: number[]): InputPatch => ({
    tendon: cand.spacing !== null ? { spacing: cand.spacing } : { count: cand.count as number },
    profile: { mode: 'custom', supportEcc, spanEcc, lowPointAt: first.profile.lowAt },
  })
  const accepted = (index: number, supportEcc: number[], spanEcc: number[], run: ServiceDesign): StressFound => ({
    index, candidate: cands[index] as Candidate, supportEcc, spanEcc, run,
  })
  // the last full run of a failed verification: a member nearer the answer than the input
  let nearest: ServiceDesign | null = null
  // one arrangement: solve the linearised conditions, verify by a full run, linearise again if needed
  const attempt = (index: number, about: ServiceDesign, margin: number): StressFound | null => {
    const cand = cands[index] as Candidate
    let d = about
    let start = profileOf(about)
    for (let t = 0; t < 3; t++) {
      const res = project(modelOf(d, margin), cand.strands / strandsOf(d), start, eLo, eHi, 150)
      const sameForce = Math.abs(strandsOf(d) - cand.strands) < 1e-9
      if (res.violation > (sameForce ? 1e-6 : MISJUDGED)) return null
      const supportEcc = res.p.slice(0, n + 1).map((v) => round1(v, eLo, eHi))
      const spanEcc = res.p.slice(n + 1).map((v) => round1(v, eLo, eHi))
      let rerun: ServiceDesign
      try {
        rerun = designForService(parseMemberInput(mergeInputPatch(first.input, patchOf(cand, supportEcc, spanEcc))))
      } catch {
        return null
      }
      if (stressesPass(rerun)) return accepted(index, supportEcc, spanEcc, rerun)
      nearest = rerun
      // friction, losses and the secondary moment follow the new profile: linearise again about it
      d = rerun
      start = res.p
    }
    return null
  }
  // feasibility of the conditions linearised about a member: cheap, used to bracket the least force
  const linearOK = (about: ServiceDesign, i: number, margin: number): boolean =>
    project(modelOf(about, margin), (cands[i] as Candidate).strands / strandsOf(about), profileOf(about), eLo, eHi, 150).violation <= 1e-6
  // least index from lo up that the linearisation about a member accepts, or −1; the feasible forces
  // form an interval (the conditions are convex in e and 1/P), so gallop up to one and bisect below it
  const leastLinear = (about: ServiceDesign, from: number, margin: number): number => {
    let lo = from
    let hi = -1
    for (let i = lo, step = 1; i < cands.length; i += step, step *= 2) {
      if (linearOK(about, i, margin)) { hi = i; break }
      lo = i + 1
    }
    if (hi < 0) for (let i = lo; i < cands.length && hi < 0; i++) if (linearOK(about, i, margin)) hi = i
    if (hi < 0) return -1
    let failed = Math.min(lo, hi) - 1
    while (hi - failed > 1) {
      const mid = Math.floor((hi + failed) / 2)
      if (linearOK(about, mid, margin)) hi = mid
      else failed = mid
    }
    return hi
  }
  // least index below a verified one that the linearisation about it accepts, or −1: gallop down, bisect
  const leastBelow = (about: ServiceDesign, top: number, margin: number): number => {
    let ok = top
    let failed = -1
    for (let step = 1; top - step >= 0; step *= 2) {
      if (linearOK(about, top - step, margin)) ok = top - step
      else { failed = top - step; break }
    }
    if (ok === top) return -1
    while (ok - failed > 1) {
      const mid = Math.floor((ok + failed) / 2)
      if (linearOK(about, mid, margin)) ok = mid
      else failed = mid
    }
    return ok
  }
  // verify from the bracketed force upwards, stepping up where friction and losses moved with the profile
  const verifyFrom = (about: ServiceDesign, i0: number, limit: number, margin: number): StressFound | null => {
    for (let i = i0; i >= 0 && i < Math.min(cands.length, limit); i++) {
      const f = attempt(i, about, margin)
      if (f) return f
    }
    return null
  }

  // the per-section Magnel regions give the least force each section needs on its own: a start
  const need = Math.max(0, ...first.stresses.sections.map((s, r) => ((magnel[r] as MagnelResult).minP ?? 0) / s.force.transfer))
  const start = Math.max(0, cands.findIndex((k) => k.strands >= 0.9 * need * strandsOf(first)))
  let about: ServiceDesign = first
  let best: StressFound | null = null
  for (let round = 0; round < 3 && best === null; round++) {
    const i0 = leastLinear(about, start, WIDE)
    if (i0 < 0) break
    nearest = null
    best = verifyFrom(about, i0, i0 + 6, WIDE)
    // far from the input its linearisation misjudges the force per strand: start again about the last run
    const next: ServiceDesign | null = nearest
    if (best === null && next === null) break
    if (next !== null) about = next
  }
  // linearise about the verified member, whose force is near the least, and look below it
  for (let round = 0; best !== null && best.index > 0 && round < 4; round++) {
    const lower = leastBelow(best.run, best.index, NARROW)
    // none below by this linearisation: the next smaller force may still pass, judged about its own run
    const found = lower >= 0
      ? verifyFrom(best.run, lower, Math.min(best.index, lower + 3), NARROW)
      : attempt(best.index - 1, best.run, NARROW)
    if (found === null) break
    best = found
  }

  const current = cands.findIndex((k) => Math.abs(k.strands - strandsOf(first)) < 1e-9)
  const at = (index: number, about: ServiceDesign): StressFound | null => attempt(index, about, NARROW) ?? attempt(index, about, WIDE)
  if (current >= 0 && stressesPass(first) && (best === null || best.candidate.strands > strandsOf(first))) {
    return { candidates: cands, least: accepted(current, first.profile.profile.supportEcc, first.profile.profile.spanEcc, first), reason: null, at, patchOf }
  }
  const reason = best === null
    ? sectionTooSmallReason(first, magnel) ?? 'No single force and profile satisfies every section at once within the eccentricity limits: revise the section, the spans or the concrete class.'
    : null
  return { candidates: cands, least: best, reason, at, patchOf }
}
