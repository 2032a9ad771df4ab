import { describe, expect, it } from 'vitest'
import { CanonicalPiece, storedJson, storedText } from '../../../shared/log/canonical'
import { entryLeafHash, logEntry, rowLeafHash } from '../../../shared/log/entry'
import { normaliseRow } from '../../../server/database/history-log'
import { revisionHash, type RevisionHashFields } from '../../../server/utils/hashing'

// a revision as the issue writes it (values invented for the test, not engineering results)
const issued: RevisionHashFields = {
  sheetId: 3, seq: 1, code: 'P01', note: '', failingChecksReason: '', replies: null,
  inputs: { member: { spans: [{ length: 7.8 }, { length: 9.6 }] }, label: 'Grid 1–5' },
  results: { checks: [{ id: 'sls-a', pass: true, ratio: 0.83 }], headline: { '10': 'x', '2': 'y' } },
  templateId: 1, templateSlug: 'pt-slab-strip', templateVersion: 2, templateTitle: 'Slab strip', model: 'pt-member',
  templateBody: '# Slab strip', engineVersion: '3.1.0', reportHtml: '<h1>Slab strip</h1><p>σ = 4.2 MPa</p>',
  reportSections: [{ id: 'slab-strip', title: 'Slab strip', level: 1 }],
  authorId: 7, issuedAt: new Date('2026-11-30T09:00:00.000Z'), prevHash: null,
}
const written = { inputs: storedJson(issued.inputs), results: storedJson(issued.results), reportSections: storedJson(issued.reportSections), reportHtml: storedText(issued.reportHtml as string) }
const contentHash = revisionHash(issued)

/** The row as MariaDB hands it back: its JSON columns as the text stored. */
function readBack(texts: Partial<Record<keyof typeof written, string>> = {}) {
  return {
    id: 12, ...issued, contentHash,
    inputs: texts.inputs ?? written.inputs.stored, results: texts.results ?? written.results.stored, reportSections: texts.reportSections ?? written.reportSections.stored,
    reportHtml: texts.reportHtml ?? written.reportHtml.stored,
  } as unknown as Record<string, unknown>
}

describe('a history row read back after it was written', () => {
  it('takes the canonical pieces for JSON columns stored unchanged, with the hashes of a full parse', () => {
    const fast = normaliseRow('revision', readBack(), written)
    const parsed = normaliseRow('revision', readBack())
    expect(fast.results).toBeInstanceOf(CanonicalPiece)
    expect(fast.reportHtml).toBeInstanceOf(CanonicalPiece)
    expect(parsed.reportHtml).toBe(issued.reportHtml)
    expect(parsed.results).toEqual(issued.results)
    expect(revisionHash(fast as unknown as RevisionHashFields)).toBe(contentHash)
    expect(revisionHash(parsed as unknown as RevisionHashFields)).toBe(contentHash)
    expect(rowLeafHash('revision', fast)).toBe(entryLeafHash(logEntry('revision', parsed)))
  })

  it('parses a column whose text came back otherwise: the same value keeps its hash, a changed one does not', () => {
    // the same value written with other spacing and member order (as a database that reformats JSON would give it)
    const reformatted = JSON.stringify(JSON.parse(written.results.stored), null, 2)
    const same = normaliseRow('revision', readBack({ results: reformatted }), written)
    expect(same.results).toEqual(issued.results)
    expect(revisionHash(same as unknown as RevisionHashFields)).toBe(contentHash)
    // a character lost on the way in (a database storing text in a narrower character set)
    const damaged = normaliseRow('revision', readBack({ inputs: written.inputs.stored.replace('–', '?') }), written)
    expect(revisionHash(damaged as unknown as RevisionHashFields)).not.toBe(contentHash)
    const damagedText = normaliseRow('revision', readBack({ reportHtml: written.reportHtml.stored.replace('σ', '?') }), written)
    expect(damagedText.reportHtml).toBe('<h1>Slab strip</h1><p>? = 4.2 MPa</p>')
    expect(revisionHash(damagedText as unknown as RevisionHashFields)).not.toBe(contentHash)
  })
})
