/**
 * The stages of the stress checks (transfer and the three service combinations), their limits from
 * the exposure class, the bond and the national-annex factors, and the shapes of the stress results.
 */
import type { MemberInput } from '../input/schema'
import { tensionRules } from '../checks/stresses'
import type { ExposureClass, ServiceCombination, TensionRule } from '../checks/stresses'
import type { MagnelResult } from '../checks/magnel'
import type { MemberSection } from './section'

export type Stage = 'transfer' | ServiceCombination
export const STAGES: readonly Stage[] = ['transfer', 'characteristic', 'frequent', 'quasiPermanent']
export const SERVICE: readonly ServiceCombination[] = ['characteristic', 'frequent', 'quasiPermanent']

export interface FibrePair { top: number; bottom: number }
export interface StressEnvelope { topMin: number; topMax: number; bottomMin: number; bottomMax: number }
export interface MomentRange { min: number; max: number }
export interface StageLimits { compression: number | null; tension: number | null; tensionClause: string | null }
export type StressLimits = Record<Stage, StageLimits> & { tendonService: number }

export interface ServiceSection {
  id: string
  label: string
  kind: 'support' | 'lowPoint' | 'tenth'
  span: number
  /** from the span's left support, mm */
  x: number
  /** along the member from its left end, mm */
  X: number
  e: number
  force: { transfer: number; service: number }
  moments: {
    selfWeight: number
    superimposed: number
    imposed: MomentRange
    transfer: number
    characteristic: MomentRange
    frequent: MomentRange
    quasiPermanent: MomentRange
    primaryTransfer: number
    secondaryTransfer: number
    totalTransfer: number
    primaryService: number
    secondaryService: number
    totalService: number
  }
  /** the governing stress per stage and fibre (the one nearest its limit) */
  stress: Record<Stage, FibrePair>
  envelope: Record<Stage, StressEnvelope>
  utilisation: number
}

/** A critical section with its Magnel region (added by the Magnel stage). */
export interface CriticalSection extends ServiceSection { magnel: MagnelResult }

export type UtilisationKey = 'topC' | 'topT' | 'botC' | 'botT'
export interface StageStress { envelope: StressEnvelope; governing: FibrePair; utilisation: Record<UtilisationKey, number> }

/** The figures' lines along the member: the transfer and characteristic moments, and the stress envelopes at transfer and over the service combinations. */
export interface StressLines {
  momentTransfer: number[]
  momentServiceMax: number[]
  momentServiceMin: number[]
  transfer: StressEnvelopeLines
  service: StressEnvelopeLines
}
export interface StressEnvelopeLines { topMin: number[]; topMax: number[]; bottomMin: number[]; bottomMax: number[] }

export interface ServiceStresses {
  limits: StressLimits
  /** characteristic values of the prestress, EN 1992-1-1 5.10.9(1) */
  rsup: number
  rinf: number
  sections: ServiceSection[]
  /** station index of each critical section */
  sectionStations: number[]
  stressBySection: Array<Record<Stage, StageStress>>
  momentsBySection: Array<Record<Stage, MomentRange>>
  /** external moments and stress envelopes at every station, one value per station (for the figures) */
  lines: StressLines
}

/** Stress limits of each stage from the exposure class, the bond and the national-annex factors. */
export function stressLimits(input: MemberInput, section: MemberSection): StressLimits {
  const rules = tensionRules(input.limits.exposure as ExposureClass, section.bonded)
  const tensionFor = (c: ServiceCombination): { limit: number | null; clause: string | null } => {
    const r = rules.filter((t) => t.combination === c)
    if (r.length === 0) return { limit: null, clause: null }
    const strict = r.find((t) => t.kind === 'decompression')
    if (strict) return { limit: 0, clause: strict.clause }
    return { limit: input.limits.serviceTension * section.at28.fctm, clause: (r[0] as TensionRule).clause } // EN 1992-1-1 7.1(2): fct,eff = fctm
  }
  const lim = (compression: number | null, c: ServiceCombination): StageLimits => {
    const t = tensionFor(c)
    return { compression, tension: t.limit, tensionClause: t.clause }
  }
  return {
    transfer: {
      compression: input.annex.transferCompression * section.atTransfer.fck, // EN 1992-1-1 5.10.2.2(5): 0.6 fck(t)
      tension: input.limits.transferTension * section.atTransfer.fctm, // EN 1992-1-1 7.1(2) with fctm(t), eq. (3.4)
      tensionClause: 'EN 1992-1-1 7.1(2), fctm(t) eq. (3.4)',
    },
    characteristic: lim(input.annex.k1Service * section.fck, 'characteristic'), // EN 1992-1-1 7.2(2): k1 fck
    frequent: lim(null, 'frequent'),
    quasiPermanent: lim(input.annex.k2Service * section.fck, 'quasiPermanent'), // EN 1992-1-1 7.2(3): k2 fck
    tendonService: input.annex.k5 * section.strand.fpk, // EN 1992-1-1 7.2(5): k5 fpk
  }
}

/** The characteristic force factors of 5.10.9: one where rsup = rinf. */
export function forceFactors(rsup: number, rinf: number): number[] {
  return rsup === rinf ? [rsup] : [rsup, rinf]
}

export const STAGE_LABEL: Record<Stage, string> = {
  transfer: 'Transfer',
  characteristic: 'Characteristic',
  frequent: 'Frequent',
  quasiPermanent: 'Quasi-permanent',
}

/** The clause of a stage's compression or tension limit. */
export function stageClause(stage: Stage, bound: 'compression' | 'tension', limits: StressLimits): string {
  if (stage === 'transfer') return bound === 'compression' ? 'EN 1992-1-1 5.10.2.2(5)' : (limits.transfer.tensionClause as string)
  if (bound === 'compression') return stage === 'characteristic' ? 'EN 1992-1-1 7.2(2)' : 'EN 1992-1-1 7.2(3)'
  return limits[stage].tensionClause ?? 'EN 1992-1-1 7.1(2)'
}
