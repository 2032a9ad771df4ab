import { describe, expect, it } from 'vitest'
import { canonicalJson } from '../../../shared/log/canonical'
import { entryLeafHash, logEntry } from '../../../shared/log/entry'
import { LATER_COLUMNS, ROW_FORM, rowForm } from '../../../shared/log/row-form'
import { reviewHash, revisionHash } from '../../../server/utils/hashing'

const at = new Date('2026-03-01T10:00:00.000Z')
// a review as the log's first version read it back, before reviews had an office_version column
const reviewBefore = { id: 7, revisionId: 1, sheetId: 2, decision: 'approve', contractCode: 'C01', comments: [{ anchor: '', text: 'Fine' }], reviewerId: 3, createdAt: at, contentHash: 'ab'.repeat(32) }

describe('the canonical form of a history row', () => {
  it('is the row as read back: every column, dates in ISO 8601 UTC, in RFC 8785 order', () => {
    expect(logEntry('review', reviewBefore)).toBe(canonicalJson({ form: ROW_FORM, kind: 'review', row: { ...reviewBefore, createdAt: '2026-03-01T10:00:00.000Z' } }))
    expect(logEntry('review', reviewBefore).startsWith('{"form":1,"kind":"review","row":{"comments"')).toBe(true)
  })

  it('keeps the hash of rows written before a column was added, while they read back its default', () => {
    const before = entryLeafHash(logEntry('review', reviewBefore))
    expect(entryLeafHash(logEntry('review', { ...reviewBefore, officeVersion: null }))).toBe(before)
    expect(reviewHash({ ...reviewBefore, officeVersion: null })).toBe(reviewHash(reviewBefore))
    const revision = { id: 1, seq: 1, note: '', issuedAt: at }
    expect(logEntry('revision', { ...revision, failingChecksReason: '', replies: null })).toBe(logEntry('revision', revision))
  })

  it('covers a later column once it holds a value, so setting it on an old row behind the app\'s back shows', () => {
    const before = entryLeafHash(logEntry('review', reviewBefore))
    expect(entryLeafHash(logEntry('review', { ...reviewBefore, officeVersion: 4 }))).not.toBe(before)
    expect(reviewHash({ ...reviewBefore, officeVersion: 4 })).not.toBe(reviewHash(reviewBefore))
    expect(rowForm('revision', { failingChecksReason: 'for the meeting', replies: [] })).toEqual({ failingChecksReason: 'for the meeting', replies: [] })
  })

  it('leaves out only the listed later columns, never a first-form column that happens to be null or empty', () => {
    expect(rowForm('review', { contractCode: null, comments: [], officeVersion: null })).toEqual({ contractCode: null, comments: [] })
    expect(rowForm('revision', { note: '', prevHash: null, failingChecksReason: '' })).toEqual({ note: '', prevHash: null })
    for (const columns of Object.values(LATER_COLUMNS)) for (const name of Object.keys(columns)) expect(name).toMatch(/^[a-z][A-Za-z]+$/)
  })

  it('names the form in the entry, and refuses a form it does not know', () => {
    expect(JSON.parse(logEntry('seal', { id: 1 })).form).toBe(1)
    expect(() => logEntry('seal', { id: 1 }, 2)).toThrow('row form 2')
  })
})
