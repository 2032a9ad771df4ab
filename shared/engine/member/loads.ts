/**
 * Loads stage: line loads from the section and the loaded width, the imposed-load arrangements,
 * and the moments of each load case at the stations, from one analysis per span under a unit load.
 */
import { at, sum } from '../common/numeric'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { analyseContinuousBeam } from '../analysis/continuous-beam'
import type { ContinuousBeamResult, SupportKind } from '../analysis/continuous-beam'
import type { MemberSection } from './section'
import type { Station } from './stations'

export interface LoadPattern { id: string; label: string; loadedSpans: number[] }

export interface CaseMoments {
  /** N·mm at each station */
  selfWeight: number[]
  superimposed: number[]
  /** one row of station moments per imposed-load arrangement */
  imposedByPattern: number[][]
}

export interface MemberLoads {
  supports: SupportKind[]
  /** line loads, N/mm */
  selfWeight: number
  superimposed: number
  imposed: number
  patterns: LoadPattern[]
  /** the member under 1 N/mm on one span, span by span (load cases are combinations of these) */
  unitSpan: ContinuousBeamResult[]
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

  const unitSpan = spans.map((_, i) => analyseContinuousBeam({ spans, EI: section.EI, supports, loads: [{ kind: 'udl', span: i, w: 1 }] }))
  const unitMoments = stations.map((st) => unitSpan.map((b) => b.momentAt(st.span, st.x)))
  const patterns = loadPatterns(input)
  // linear elastic analysis (EN 1992-1-1 5.4): every case is a sum of the unit-load cases
  const cases: CaseMoments = {
    selfWeight: unitMoments.map((u) => selfWeight * sum(u)),
    superimposed: unitMoments.map((u) => superimposed * sum(u)),
    imposedByPattern: patterns.map((pt) => unitMoments.map((u) => imposed * sum(pt.loadedSpans.map((i) => at(u, i))))),
  }
  return { result: { supports, selfWeight, superimposed, imposed, patterns, unitSpan, cases }, checks: [], warnings: [] }
}
