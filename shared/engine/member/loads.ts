/**
 * Loads stage: line loads from the section and the loaded width, the imposed-load arrangements,
 * and the moments of the load cases at the stations: the beam is factored once, a load on every
 * span is one O(n) solve, and the arrangements' envelope at each station comes from the pattern
 * loading (analysis/pattern-loading.ts), linear in the spans.
 */
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { spanUnitResponses } from '../analysis/continuous-beam'
import type { SpanUnitResponses, SupportKind } from '../analysis/continuous-beam'
import { patternLoading } from '../analysis/pattern-loading'
import type { PatternLoading } from '../analysis/pattern-loading'
import type { MemberSection } from './section'
import { memberColumns } from './columns'
import type { MemberColumns } from './columns'
import type { Station } from './stations'

export interface LoadPattern { id: string; label: string; loadedSpans: number[] }

export interface CaseMoments {
  /** N·mm at each station */
  selfWeight: number[]
  superimposed: number[]
  /** the imposed load on every span */
  imposedAll: number[]
  /** least and greatest moment of the imposed load over the arrangements (an unloaded one not counted) */
  imposedRange: { min: number[]; max: number[] }
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
  const responses = spanUnitResponses({ spans, EI: section.EI, supports, ...(springs ? { springs } : {}) })
  const patterns = loadPatterns(input)
  const arrangements = patternLoading(responses, patterns.map((p) => p.loadedSpans))
  // linear elastic analysis (EN 1992-1-1 5.4): each case is the sum of the unit-span cases, found in one solve
  const along = (w: number): number[] => {
    const r = responses.combine(spans.map(() => w))
    return stations.map((st) => r.momentAt(st.span, st.x))
  }
  const ranges = stations.map((st) => arrangements.range({ kind: 'moment', span: st.span, x: st.x }))
  const cases: CaseMoments = {
    selfWeight: along(selfWeight),
    superimposed: along(superimposed),
    imposedAll: along(imposed),
    imposedRange: { min: ranges.map((r) => imposed * r.min), max: ranges.map((r) => imposed * r.max) },
  }
  return { result: { supports, columns, springs, selfWeight, superimposed, imposed, patterns, responses, patternLoading: arrangements, cases }, checks: [], warnings: [] }
}
