/**
 * Loads stage: line loads from the section and the loaded width, the point, line and partial loads
 * (added-loads.ts), the imposed-load arrangements, and the moments of the load cases at the
 * stations: the beam is factored once, a load on every span is one O(n) solve, and the
 * arrangements' envelope at each station comes from the pattern loading (analysis/pattern-loading.ts),
 * linear in the spans. An imposed point, line or partial load follows the arrangement of its span,
 * at its own ψ in each combination.
 */
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { spanUnitResponses } from '../analysis/continuous-beam'
import type { BeamLoad, ContinuousBeamResult, SpanUnitResponses, SupportKind } from '../analysis/continuous-beam'
import { patternLoading } from '../analysis/pattern-loading'
import type { PatternLoading, ResponseQuantity } from '../analysis/pattern-loading'
import { addedLoads, combinationFactor, scaledLoad } from './added-loads'
import type { AddedLoad, CombinationValue } from './added-loads'
import type { MemberSection } from './section'
import { memberColumns } from './columns'
import type { MemberColumns } from './columns'
import type { Station } from './stations'

export interface LoadPattern { id: string; label: string; loadedSpans: number[] }

export interface CaseMoments {
  /** N·mm at each station */
  selfWeight: number[]
  superimposed: number[]
  /** the permanent point, line and partial loads */
  addedPermanent: number[]
  /** the imposed loads on every span at their quasi-permanent values ψ2·Qk (EN 1990 eq. (6.16b)) */
  imposedAllQuasiPermanent: number[]
  /** least and greatest moment of the imposed loads over the arrangements (an unloaded one not counted), characteristic */
  imposedRange: { min: number[]; max: number[] }
  /** the same at the frequent (ψ1) and quasi-permanent (ψ2) values of each imposed load */
  imposedRangeFrequent: { min: number[]; max: number[] }
  imposedRangeQuasiPermanent: { min: number[]; max: number[] }
}

export interface MemberLoads {
  supports: SupportKind[]
  /** the columns at the supports and their rotational springs (EN 1992-1-1 5.3, Annex I), or null */
  columns: MemberColumns | null
  /** rotational spring at each support, N·mm/rad (0 = none) */
  springs: number[] | undefined
  /** line loads, N/mm */
  selfWeight: number
  superimposed: number
  imposed: number
  patterns: LoadPattern[]
  /** the member factored once: its response to 1 N/mm on one span, or to any set of span loads in one O(n) solve */
  responses: SpanUnitResponses
  /** the arrangements of the imposed load on that beam, per N/mm on the loaded spans */
  patternLoading: PatternLoading
  /** the point, line and partial loads */
  added: AddedLoad[]
  /** the drops' own weight, N/mm over each drop's length (part of the self-weight) */
  dropWeights: BeamLoad[]
  /** the member under its permanent loads: self-weight, superimposed and the added permanent loads */
  permanent: ContinuousBeamResult
  /** the arrangements of all imposed loads, each at its value in the combination: N and N·mm, not per N/mm */
  arrangements(c: CombinationValue): PatternLoading
  /** least and greatest value of q over the arrangements of the imposed loads in the combination */
  imposedRange(q: ResponseQuantity, c: CombinationValue): { min: number; max: number }
  cases: CaseMoments
}

/** Supports as given, or all pinned. */
export function memberSupports(input: MemberInput): SupportKind[] {
  const spans = input.geometry.spans
  return input.geometry.supports ?? spans.map(() => 'pinned' as SupportKind).concat('pinned')
}

/** The imposed-load arrangements of EN 1992-1-1 5.1.3: all spans, alternate spans, adjacent pairs. */
export function loadPatterns(input: MemberInput): LoadPattern[] {
  const n = input.geometry.spans.length
  const all = input.geometry.spans.map((_, i) => i)
  const patterns: LoadPattern[] = [{ id: 'all', label: 'All spans', loadedSpans: all }]
  if (input.loads.pattern === 'alternate-and-adjacent' && n > 1) {
    patterns.push({ id: 'odd', label: 'Alternate spans 1, 3, …', loadedSpans: all.filter((i) => i % 2 === 0) })
    patterns.push({ id: 'even', label: 'Alternate spans 2, 4, …', loadedSpans: all.filter((i) => i % 2 === 1) })
    for (let j = 1; j < n; j++) {
      if (n > 2) patterns.push({ id: `adjacent-${j}`, label: `Adjacent spans ${j} and ${j + 1}`, loadedSpans: [j - 1, j] })
    }
  }
  return patterns
}

export function loadsStage(input: MemberInput, section: MemberSection, stations: Station[]): StageOutcome<MemberLoads> {
  const spans = input.geometry.spans
  const supports = memberSupports(input)
  const s = input.section
  const width = section.width
  const trib = section.tributaryWidth

  // line loads (N/mm): self-weight of the section and of any slab beyond the flange within the loaded width
  const extraSlab = !section.isSlab && s.hf !== undefined && trib > width && s.kind !== 'rectangle' ? s.hf * (trib - width) : 0
  const selfWeight = input.materials.density * (section.properties.A + extraSlab) // EN 1991-1-1 5.2: self-weight from the nominal dimensions
  const superimposed = input.loads.superimposed * trib
  const imposed = input.loads.imposed * trib

  const columns = memberColumns(input, section)
  const springs = columns?.springs
  const responses = spanUnitResponses({ spans, EI: section.spanEI, supports, ...(springs ? { springs } : {}) })
  // a drop's own weight: the area it adds, over its length (EN 1991-1-1 5.2, nominal dimensions)
  const dropWeights: BeamLoad[] = section.drops.flatMap((d) => d.parts.map((p) => ({
    kind: 'patch' as const, span: p.span, from: p.from, to: p.to, w: input.materials.density * (d.local.properties.A - section.properties.A),
  })))
  const patterns = loadPatterns(input)
  const unitArrangements = patternLoading(responses, patterns.map((p) => p.loadedSpans))
  const added = addedLoads(input, trib)
  const addedImposed = added.filter((l) => l.type === 'imposed')
  const addedPermanentLoads = added.filter((l) => l.type === 'permanent').map((l) => l.beam)
  const psiOf: Record<CombinationValue, number> = { characteristic: 1, psi0: input.loads.psi0, frequent: input.loads.psi1, quasiPermanent: input.loads.psi2 } // EN 1990 Table A1.1
  // each combination's arrangements: with no added imposed load, the unit arrangements scaled by ψ·q;
  // otherwise each loaded span carries ψ·q and its own added imposed loads at their own ψ
  const byCombination = new Map<CombinationValue, PatternLoading>()
  const arrangements = (c: CombinationValue): PatternLoading => {
    let a = byCombination.get(c)
    if (a) return a
    const q = psiOf[c] * imposed
    if (addedImposed.length === 0) {
      a = {
        patterns: unitArrangements.patterns,
        value: (x, p) => q * unitArrangements.value(x, p),
        range: (x) => {
          const r = unitArrangements.range(x)
          return q >= 0 ? { min: q * r.min, max: q * r.max } : { min: q * r.max, max: q * r.min }
        },
      }
    } else {
      const onSpan = new Map<number, BeamLoad[]>()
      for (const l of addedImposed) onSpan.set(l.span, [...(onSpan.get(l.span) ?? []), scaledLoad(l.beam, combinationFactor(l, c))])
      a = patternLoading(responses, patterns.map((p) => p.loadedSpans), (span) => [{ kind: 'udl', span, w: q }, ...(onSpan.get(span) ?? [])])
    }
    byCombination.set(c, a)
    return a
  }
  const imposedRange = (q: ResponseQuantity, c: CombinationValue): { min: number; max: number } => arrangements(c).range(q)
  // linear elastic analysis (EN 1992-1-1 5.4): each case is the sum of the unit-span cases, found in one solve
  const along = (r: ContinuousBeamResult): number[] => stations.map((st) => r.momentAt(st.span, st.x))
  const uniform = (w: number): ContinuousBeamResult => responses.combine(spans.map(() => w))
  const permanent = responses.model.analyse([...spans.map((_, span) => ({ kind: 'udl' as const, span, w: selfWeight + superimposed })), ...dropWeights, ...addedPermanentLoads])
  const rangesOf = (c: CombinationValue): { min: number[]; max: number[] } => {
    const r = stations.map((st) => imposedRange({ kind: 'moment', span: st.span, x: st.x }, c))
    return { min: r.map((v) => v.min), max: r.map((v) => v.max) }
  }
  const qp = responses.model.analyse([
    ...spans.map((_, span) => ({ kind: 'udl' as const, span, w: psiOf.quasiPermanent * imposed })),
    ...addedImposed.map((l) => scaledLoad(l.beam, combinationFactor(l, 'quasiPermanent'))),
  ]) // EN 1990 eq. (6.16b): ψ2·Qk of every imposed load
  const characteristic = rangesOf('characteristic')
  const cases: CaseMoments = {
    selfWeight: along(dropWeights.length > 0 ? responses.model.analyse([...spans.map((_, span) => ({ kind: 'udl' as const, span, w: selfWeight })), ...dropWeights]) : uniform(selfWeight)),
    superimposed: along(uniform(superimposed)),
    addedPermanent: addedPermanentLoads.length > 0 ? along(responses.model.analyse(addedPermanentLoads)) : stations.map(() => 0),
    imposedAllQuasiPermanent: along(qp),
    imposedRange: characteristic,
    imposedRangeFrequent: addedImposed.length > 0 ? rangesOf('frequent') : scaleRange(characteristic, psiOf.frequent),
    imposedRangeQuasiPermanent: addedImposed.length > 0 ? rangesOf('quasiPermanent') : scaleRange(characteristic, psiOf.quasiPermanent),
  }
  return {
    result: { supports, columns, springs, selfWeight, superimposed, imposed, patterns, responses, patternLoading: unitArrangements, added, dropWeights, permanent, arrangements, imposedRange, cases },
    checks: [],
    warnings: [],
  }
}

/** A range at a factor ψ ≥ 0. */
function scaleRange(r: { min: number[]; max: number[] }, psi: number): { min: number[]; max: number[] } {
  return { min: r.min.map((v) => psi * v), max: r.max.map((v) => psi * v) }
}
