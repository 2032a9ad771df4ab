/**
 * Stresses stage: the stress limits of each stage, the critical sections (supports, low points,
 * tenth points), the external moments of each combination with pattern loading, the fibre stresses
 * under the characteristic forces rsup·P and rinf·P (5.10.9) with the secondary moment, and the
 * stress envelope at every station for the figures.
 */
import { at } from '../common/numeric'
import { UTILISATION_CAP } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { compressionUtilisation, fibreStresses, tensionUtilisation } from '../checks/stresses'
import type { PrestressAnalysis } from './analysis'
import type { MemberLoads } from './loads'
import type { MemberLosses, StageForce } from './losses'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import { stationFinder } from './stations'
import type { Station } from './stations'
import { stressChecks } from './stress-checks'
import { SERVICE, STAGES, forceFactors, stressLimits } from './stress-limits'
import type { FibrePair, MomentRange, ServiceSection, ServiceStresses, Stage, StageStress, StressEnvelope, StressEnvelopeLines, StressLimits, StressLines } from './stress-limits'

export interface StressesInput {
  input: MemberInput
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  losses: MemberLosses
  analysis: PrestressAnalysis
  stations: Station[]
}

/** External moment at a station for each stage: [min, max]; transfer carries self-weight only. */
export function stageMoments(input: MemberInput, loads: MemberLoads, k: number): Record<Stage, MomentRange> {
  const c = loads.cases
  const G = at(c.selfWeight, k) + at(c.superimposed, k) + at(c.addedPermanent, k)
  // each imposed load at its value in the combination (ψ per load); an unloaded arrangement is always possible (imposed load absent)
  const range = (r: { min: number[]; max: number[] }): { qMin: number; qMax: number } => ({ qMin: Math.min(0, at(r.min, k)), qMax: Math.max(0, at(r.max, k)) })
  const ch = range(c.imposedRange)
  const fr = range(c.imposedRangeFrequent)
  const qp = range(c.imposedRangeQuasiPermanent)
  const t = at(c.selfWeight, k)
  return {
    transfer: { min: t, max: t },
    characteristic: { min: G + ch.qMin, max: G + ch.qMax }, // EN 1990 eq. (6.14b)
    frequent: { min: G + fr.qMin, max: G + fr.qMax }, // EN 1990 eq. (6.15b): ψ1 of each imposed load
    quasiPermanent: { min: G + qp.qMin, max: G + qp.qMax }, // EN 1990 eq. (6.16b): ψ2 of each imposed load
  }
}

interface StressContext { section: MemberSection; stations: Station[]; limits: StressLimits; rs: number[]; e: number[]; force: Record<'transfer' | 'service', StageForce>; secondary: Record<'transfer' | 'service', number[]> }

function stressAt(ctx: StressContext, k: number, stage: Stage, M: MomentRange): StageStress {
  const which = stage === 'transfer' ? 'transfer' : 'service'
  const P = at(ctx.force[which].P, k)
  const e = at(ctx.e, k)
  const M2 = at(ctx.secondary[which], k)
  const st = ctx.stations[k] as Station
  const sec = ctx.section.at(st.span, st.x).properties // over a drop, its own section
  let topMin = Infinity
  let topMax = -Infinity
  let bottomMin = Infinity
  let bottomMax = -Infinity
  for (const r of ctx.rs) {
    for (const m of [M.min, M.max]) {
      // EN 1992-1-1 5.10.9: characteristic force r·Pm,t; the secondary moment scales with the force
      const s = fibreStresses({ A: sec.A, Zt: sec.Zt, Zb: sec.Zb, P: r * P, e, M: m + r * M2 })
      topMin = Math.min(topMin, s.top)
      topMax = Math.max(topMax, s.top)
      bottomMin = Math.min(bottomMin, s.bottom)
      bottomMax = Math.max(bottomMax, s.bottom)
    }
  }
  const L = ctx.limits[stage]
  const fref = ctx.section.at28.fctm
  const uC = (s: number): number => (L.compression === null ? 0 : compressionUtilisation(s, L.compression))
  const uT = (s: number): number => (L.tension === null ? 0 : tensionUtilisation(s, L.tension, fref))
  const cap = (u: number): number => Math.min(UTILISATION_CAP, u)
  const utilisation = { topC: cap(uC(topMax)), topT: cap(uT(topMin)), botC: cap(uC(bottomMax)), botT: cap(uT(bottomMin)) }
  return {
    envelope: { topMin, topMax, bottomMin, bottomMax },
    governing: {
      top: utilisation.topT > utilisation.topC ? topMin : topMax,
      bottom: utilisation.botT > utilisation.botC ? bottomMin : bottomMax,
    },
    utilisation,
  }
}

/**
 * The force a section takes where the tendon kinks over a support (inflection 0): the station just
 * left and the one just right of the support share the point, and friction at the kink (eq. (5.45),
 * θ the kink angle) gives them different forces. The section takes the mean of both sides: the kink
 * stands for a short curve over the support whose friction acts along it, the mean is the force at
 * its middle to first order in μθ, and it is the same whichever way the member is drawn or stressed.
 */
export function forceAtSections(P: number[], stations: Station[]): number[] {
  const out = [...P]
  for (let k = 1; k < stations.length; k++) {
    if (Math.abs((stations[k] as Station).X - (stations[k - 1] as Station).X) < 1e-6) {
      const mean = (at(P, k - 1) + at(P, k)) / 2
      out[k - 1] = mean
      out[k] = mean
    }
  }
  return out
}

interface SectionSite { id: string; label: string; kind: ServiceSection['kind']; k: number }

/**
 * Supports, then per span its low point and tenth points in order along the span. Where columns
 * meet an interior support its moment steps by the columns' moment, so the support is checked on
 * both sides: the left side as a section of its own.
 */
function criticalSites(spans: number[], lowAt: number[], stations: Station[], framed: (support: number) => boolean, free: (support: number) => boolean): SectionSite[] {
  const n = spans.length
  // a free end is the tip of a cantilever, not a support; a cantilever has no low point
  const supportLabel = (j: number): string => (free(j) ? `Tip of the cantilever (span ${j === 0 ? 1 : n})` : `Support ${j + 1}`)
  const cantilever = (i: number): boolean => (i === 0 && free(0)) || (i === n - 1 && free(n))
  const out: SectionSite[] = []
  const find = stationFinder(stations)
  const seen = new Set<number>()
  const add = (site: SectionSite): void => {
    if (site.k < 0 || seen.has(site.k)) return
    seen.add(site.k)
    out.push(site)
  }
  for (let i = 0; i < n; i++) {
    const L = at(spans, i)
    if (i > 0 && framed(i)) add({ id: `support-${i + 1}-left`, label: `Support ${i + 1}, left side`, kind: 'support', k: find(i - 1, at(spans, i - 1)) })
    add({ id: `support-${i + 1}`, label: framed(i) && i > 0 ? `Support ${i + 1}, right side` : supportLabel(i), kind: 'support', k: find(i, 0) })
    const lowX = at(lowAt, i) * L
    const tenths = [1, 2, 3, 4, 5, 6, 7, 8, 9].map((t) => ({ t, x: (t * L) / 10 }))
    const items: SectionSite[] = cantilever(i) ? [] : [{ id: `span-${i + 1}-low`, label: `Span ${i + 1}, low point`, kind: 'lowPoint', k: find(i, lowX) }]
    for (const { t, x } of tenths) items.push({ id: `span-${i + 1}-${t}`, label: `Span ${i + 1}, ${t / 10}L`, kind: 'tenth', k: find(i, x) })
    items.sort((a, b) => a.k - b.k)
    items.forEach(add)
  }
  add({ id: `support-${n + 1}`, label: supportLabel(n), kind: 'support', k: find(n - 1, at(spans, n - 1)) })
  return out
}

export function stressesStage(i: StressesInput): StageOutcome<ServiceStresses> {
  const { input, section, loads, profile, losses, analysis, stations } = i
  const limits = stressLimits(input, section)
  const bonded = section.bonded
  const rsup = bonded ? input.annex.rsupBonded : input.annex.rsupUnbonded
  const rinf = bonded ? input.annex.rinfBonded : input.annex.rinfUnbonded
  const ctx: StressContext = {
    section, stations, limits, rs: forceFactors(rsup, rinf), e: profile.e,
    force: { transfer: losses.transfer, service: losses.service },
    secondary: { transfer: analysis.transfer.secondary, service: analysis.service.secondary },
  }
  // at a kink over a support both sides' stations carry the mean force (forceAtSections)
  const atSections = { transfer: forceAtSections(losses.transfer.P, stations), service: forceAtSections(losses.service.P, stations) }
  const sectionCtx: StressContext = {
    ...ctx,
    force: { transfer: { ...losses.transfer, P: atSections.transfer }, service: { ...losses.service, P: atSections.service } },
  }
  const stressAll = (k: number, M: Record<Stage, MomentRange>, c: StressContext = ctx): Record<Stage, StageStress> => {
    const s = {} as Record<Stage, StageStress>
    for (const stage of STAGES) s[stage] = stressAt(c, k, stage, M[stage])
    return s
  }
  const sites = criticalSites(input.geometry.spans, profile.lowAt, stations, (j) => (loads.springs?.[j] ?? 0) > 0, (j) => loads.supports[j] === 'free')
  const stressBySection: Array<Record<Stage, StageStress>> = []
  const momentsBySection: Array<Record<Stage, MomentRange>> = []
  const sections: ServiceSection[] = sites.map((site) => {
    const k = site.k
    const st = stations[k] as Station
    const M = stageMoments(input, loads, k)
    const s = stressAll(k, M, sectionCtx)
    stressBySection.push(s)
    momentsBySection.push(M)
    const u = Math.max(...STAGES.flatMap((stage) => Object.values(s[stage].utilisation)))
    const P0 = at(atSections.transfer, k)
    const Pi = at(atSections.service, k)
    const stress = {} as Record<Stage, FibrePair>
    const envelope = {} as Record<Stage, StressEnvelope>
    for (const stage of STAGES) {
      stress[stage] = s[stage].governing
      envelope[stage] = s[stage].envelope
    }
    return {
      id: site.id, label: site.label, kind: site.kind, span: st.span, x: st.x, X: st.X, e: at(profile.e, k),
      force: { transfer: P0, service: Pi },
      moments: {
        selfWeight: at(loads.cases.selfWeight, k),
        superimposed: at(loads.cases.superimposed, k),
        imposed: { min: Math.min(0, at(loads.cases.imposedRange.min, k)), max: Math.max(0, at(loads.cases.imposedRange.max, k)) },
        transfer: M.transfer.min,
        characteristic: M.characteristic,
        frequent: M.frequent,
        quasiPermanent: M.quasiPermanent,
        primaryTransfer: -P0 * at(profile.e, k), // primary moment −P·e
        secondaryTransfer: at(analysis.transfer.secondary, k),
        totalTransfer: -P0 * at(profile.e, k) + at(analysis.transfer.secondary, k),
        primaryService: -Pi * at(profile.e, k),
        secondaryService: at(analysis.service.secondary, k),
        totalService: -Pi * at(profile.e, k) + at(analysis.service.secondary, k),
      },
      stress, envelope, utilisation: u,
    }
  })
  // the lines of the figures, station by station, kept as plain numbers
  const envelopeLines = (): StressEnvelopeLines => ({ topMin: [], topMax: [], bottomMin: [], bottomMax: [] })
  const lines: StressLines = { momentTransfer: [], momentServiceMax: [], momentServiceMin: [], transfer: envelopeLines(), service: envelopeLines() }
  stations.forEach((_, k) => {
    const moments = stageMoments(input, loads, k)
    const stress = stressAll(k, moments)
    lines.momentTransfer.push(moments.transfer.min)
    lines.momentServiceMax.push(moments.characteristic.max)
    lines.momentServiceMin.push(moments.characteristic.min)
    const t = stress.transfer.envelope
    lines.transfer.topMin.push(t.topMin)
    lines.transfer.topMax.push(t.topMax)
    lines.transfer.bottomMin.push(t.bottomMin)
    lines.transfer.bottomMax.push(t.bottomMax)
    lines.service.topMin.push(Math.min(...SERVICE.map((st) => stress[st].envelope.topMin)))
    lines.service.topMax.push(Math.max(...SERVICE.map((st) => stress[st].envelope.topMax)))
    lines.service.bottomMin.push(Math.min(...SERVICE.map((st) => stress[st].envelope.bottomMin)))
    lines.service.bottomMax.push(Math.max(...SERVICE.map((st) => stress[st].envelope.bottomMax)))
  })
  const result: ServiceStresses = {
    limits, rsup, rinf, sections, sectionStations: sites.map((s) => s.k), stressBySection, momentsBySection, lines,
  }
  return { result, checks: stressChecks({ input, section, losses, stresses: result }), warnings: [] }
}
