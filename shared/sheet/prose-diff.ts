/**
 * The change of a sheet's text between two revisions as a checker reads it: section by section (a
 * section runs from one heading to the next), words added and removed (jsdiff's word diff), the
 * sections that did not change left out.
 */
import { diffWordsWithSpace } from 'diff'

export interface ProsePart { kind: 'same' | 'added' | 'removed'; text: string }

export interface SectionChange {
  /** the section's heading as written (without the #), or '' for the text before the first heading */
  title: string
  kind: 'changed' | 'added' | 'removed'
  parts: ProsePart[]
}

interface Section { title: string; text: string }

function sections(text: string): Section[] {
  const out: Section[] = []
  let current: Section = { title: '', text: '' }
  for (const line of text.replace(/\r\n?/g, '\n').split('\n')) {
    const heading = /^(#{1,6})\s+(.*)$/.exec(line)
    if (heading) {
      if (current.title !== '' || current.text.trim() !== '') out.push(current)
      current = { title: heading[2]!.trim(), text: '' }
    } else current.text += `${line}\n`
  }
  if (current.title !== '' || current.text.trim() !== '') out.push(current)
  return out
}

/** Section-by-section word changes from the old text to the new. */
export function proseDiff(oldText: string, newText: string): SectionChange[] {
  const before = sections(oldText)
  const after = sections(newText)
  const out: SectionChange[] = []
  const used = new Set<number>()
  after.forEach((s) => {
    const k = before.findIndex((b, i) => !used.has(i) && b.title === s.title)
    if (k < 0) {
      out.push({ title: s.title, kind: 'added', parts: [{ kind: 'added', text: s.text.trim() }] })
      return
    }
    used.add(k)
    const old = before[k]!
    if (old.text.trim() === s.text.trim()) return
    const parts: ProsePart[] = diffWordsWithSpace(old.text.trim(), s.text.trim()).map((c) => ({ kind: c.added ? 'added' : c.removed ? 'removed' : 'same', text: c.value }))
    out.push({ title: s.title, kind: 'changed', parts })
  })
  before.forEach((b, i) => {
    if (!used.has(i)) out.push({ title: b.title, kind: 'removed', parts: [{ kind: 'removed', text: b.text.trim() }] })
  })
  return out
}
