/**
 * A newer version of a sheet's template brought into the sheet's own text: a three-way merge
 * (node-diff3) of the template's old text (the base the sheet started from), the engineer's edited
 * text and the template's new text, line by line. Where both changed the same lines it is a
 * conflict, for the engineer to resolve; nothing is applied silently.
 */
import { diff3Merge } from 'node-diff3'

export interface MergeConflict {
  /** 1-based line in the merged text where the conflict's markers start */
  line: number
  /** the engineer's lines, the template's old lines, the template's new lines */
  mine: string[]
  base: string[]
  theirs: string[]
}

export interface TextMerge {
  /** the merged text; where lines conflict, both versions between markers for the engineer to choose */
  text: string
  conflicts: MergeConflict[]
  /** the template's changes that went in without a conflict, as counts of lines */
  taken: number
}

export const CONFLICT_MARKERS = {
  mine: '<<<<<<< this sheet',
  base: '||||||| the template as this sheet began',
  theirs: '=======',
  end: '>>>>>>> the new version of the template',
} as const

const lines = (text: string): string[] => text.replace(/\r\n?/g, '\n').split('\n')

/** Merges the template's change (base → theirs) into the engineer's text (mine). */
export function mergeTemplateText(base: string, mine: string, theirs: string): TextMerge {
  const regions = diff3Merge(lines(mine), lines(base), lines(theirs), { excludeFalseConflicts: true })
  const out: string[] = []
  const conflicts: MergeConflict[] = []
  let taken = 0
  const mineLines = lines(mine)
  for (const region of regions) {
    if ('ok' in region && region.ok) {
      out.push(...region.ok)
      continue
    }
    const c = region.conflict!
    conflicts.push({ line: out.length + 1, mine: c.a, base: c.o, theirs: c.b })
    out.push(CONFLICT_MARKERS.mine, ...c.a, CONFLICT_MARKERS.base, ...c.o, CONFLICT_MARKERS.theirs, ...c.b, CONFLICT_MARKERS.end)
  }
  // lines of the result that are not the engineer's: what the template brought in
  const kept = new Set(mineLines)
  taken = out.filter((l) => !kept.has(l) && !Object.values(CONFLICT_MARKERS).includes(l as never)).length
  return { text: out.join('\n'), conflicts, taken }
}

/** Whether a text still holds a conflict's markers (a sheet is not issued with one). */
export function hasConflictMarkers(text: string): boolean {
  return lines(text).some((l) => l === CONFLICT_MARKERS.mine || l === CONFLICT_MARKERS.end)
}
