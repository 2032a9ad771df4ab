/**
 * The sheet's own text: a newer template merged into the engineer's edits (three-way, node-diff3),
 * with and without conflicts, and the checker's prose diff section by section (jsdiff).
 */
import { describe, expect, it } from 'vitest'
import { CONFLICT_MARKERS, hasConflictMarkers, mergeTemplateText } from '../../../shared/sheet/text-merge'
import { proseDiff } from '../../../shared/sheet/prose-diff'

const BASE = ['# Loads', '', 'Imposed load by EN 1991-1-1.', '', '# Stresses', '', 'Stresses at transfer.'].join('\n')

describe('a newer template merged into the sheet', () => {
  it('without a conflict: the engineer\'s paragraph and the template\'s new one both stand', () => {
    const mine = BASE.replace('Imposed load by EN 1991-1-1.', 'Imposed load by EN 1991-1-1, category C3 (office note).')
    const theirs = BASE.replace('Stresses at transfer.', 'Stresses at transfer, 5.10.2.2.')
    const r = mergeTemplateText(BASE, mine, theirs)
    expect(r.conflicts).toEqual([])
    expect(r.text).toContain('category C3 (office note)')
    expect(r.text).toContain('Stresses at transfer, 5.10.2.2.')
    expect(r.taken).toBe(1)
    expect(hasConflictMarkers(r.text)).toBe(false)
  })

  it('with a conflict: both versions kept between markers, the line of the conflict given', () => {
    const mine = BASE.replace('Imposed load by EN 1991-1-1.', 'Imposed load as the client\'s brief.')
    const theirs = BASE.replace('Imposed load by EN 1991-1-1.', 'Imposed load by EN 1991-1-1 Table 6.2.')
    const r = mergeTemplateText(BASE, mine, theirs)
    expect(r.conflicts).toHaveLength(1)
    expect(r.conflicts[0]!.mine).toEqual(['Imposed load as the client\'s brief.'])
    expect(r.conflicts[0]!.theirs).toEqual(['Imposed load by EN 1991-1-1 Table 6.2.'])
    const at = r.text.split('\n')[r.conflicts[0]!.line - 1]
    expect(at).toBe(CONFLICT_MARKERS.mine)
    expect(hasConflictMarkers(r.text)).toBe(true)
  })

  it('the same change on both sides is no conflict', () => {
    const changed = BASE.replace('Stresses at transfer.', 'Stresses at transfer (5.10.2.2).')
    expect(mergeTemplateText(BASE, changed, changed)).toEqual({ text: changed, conflicts: [], taken: 0 })
  })
})

describe('the checker\'s prose diff', () => {
  it('words added and removed, by section; unchanged sections left out; added and removed sections named', () => {
    const after = ['# Loads', '', 'Imposed load by EN 1991-1-1, category C3.', '', '# Façade', '', 'A line load of 7.5 kN/m.'].join('\n')
    const d = proseDiff(BASE, after)
    expect(d.map((s) => [s.title, s.kind])).toEqual([['Loads', 'changed'], ['Façade', 'added'], ['Stresses', 'removed']])
    const loads = d[0]!.parts
    expect(loads.filter((p) => p.kind === 'added').map((p) => p.text).join('')).toContain('category C3')
    expect(loads.filter((p) => p.kind === 'same').map((p) => p.text).join('')).toContain('Imposed load by EN')
  })
})
