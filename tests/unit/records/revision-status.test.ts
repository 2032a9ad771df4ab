import { describe, expect, it } from 'vitest'
import { deriveStatus, revisionCode, type StatusFacts } from '../../../server/utils/revision-status'

const none: StatusFacts = { decisions: [], sealed: false, laterIssued: false, laterApproved: false }

describe('derived revision status', () => {
  it.each([
    ['just issued', none, 'issued', 'S3'],
    ['returned', { ...none, decisions: [{ decision: 'return' as const, contractCode: null }] }, 'returned', 'S0'],
    ['returned, then re-issued', { ...none, decisions: [{ decision: 'return' as const, contractCode: null }], laterIssued: true }, 'superseded', '—'],
    ['issued, overtaken by a newer issue', { ...none, laterIssued: true }, 'superseded', '—'],
    ['approved', { ...none, decisions: [{ decision: 'approve' as const, contractCode: 'C01' }] }, 'approved', 'A1'],
    ['approved, newer work issued but not approved', { ...none, decisions: [{ decision: 'approve' as const, contractCode: 'C01' }], laterIssued: true }, 'approved', 'A1'],
    ['sealed', { ...none, decisions: [{ decision: 'approve' as const, contractCode: 'C01' }], sealed: true }, 'sealed', 'A1'],
    ['sealed, a later revision approved', { ...none, decisions: [{ decision: 'approve' as const, contractCode: 'C01' }], sealed: true, laterIssued: true, laterApproved: true }, 'superseded', '—'],
  ])('%s', (_name, facts, status, suitability) => {
    const derived = deriveStatus(facts)
    expect(derived.status).toBe(status)
    expect(derived.suitability).toBe(suitability)
    expect(derived.superseded).toBe(status === 'superseded')
  })

  it('carries the contractual code of the approval', () => {
    expect(deriveStatus({ ...none, decisions: [{ decision: 'approve', contractCode: 'C02' }] }).contractCode).toBe('C02')
  })

  it('writes codes as the document-control practice does (P01…, C01…, then three digits)', () => {
    expect([revisionCode('P', 1), revisionCode('P', 12), revisionCode('C', 3), revisionCode('P', 100)]).toEqual(['P01', 'P12', 'C03', 'P100'])
  })
})
