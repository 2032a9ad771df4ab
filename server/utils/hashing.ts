// Content hashes of the records side: SHA-256 over RFC 8785 canonical JSON (shared/log/canonical.ts).
// Pure functions (no Nitro auto-imports) so unit tests can check them against independent values.
import { assertPlainJson, type CanonicalPiece, canonicalJson, canonicalSha256, sha256Hex, storedJson, storedText } from '../../shared/log/canonical'
import { laterFields } from '../../shared/log/row-form'
import { verificationRef } from '../../shared/utils/verification-ref'

export { canonicalJson, sha256Hex, storedJson, storedText }

export function hashCanonical(value: unknown): string {
  return canonicalSha256(value)
}

/**
 * The value exactly as it will read back from a JSON column: hashing this form (not the live
 * object) means a later re-hash of the stored row gives the same digest.
 */
export function plainJson<T>(value: T): T {
  assertPlainJson(value, '')
  return JSON.parse(JSON.stringify(value)) as T
}

/** The fields of a revision that its content hash covers (everything that makes it what it is). */
export interface RevisionHashFields {
  sheetId: number
  seq: number
  code: string
  note: string
  /** added later (shared/log/row-form.ts LATER_COLUMNS): covered unless absent, so revisions issued before it keep their hash */
  failingChecksReason?: string | null
  replies?: unknown
  inputs: unknown
  results: unknown
  templateId: number
  templateSlug: string
  templateVersion: number
  templateTitle: string
  model: string
  templateBody: string
  engineVersion: string
  /** the text, or its canonical piece (storedText) where the caller has one */
  reportHtml: string | CanonicalPiece
  reportSections: unknown
  authorId: number
  issuedAt: Date
  prevHash: string | null
}

export function revisionHash(r: RevisionHashFields): string {
  return hashCanonical({
    kind: 'tendonbook.revision',
    sheetId: r.sheetId,
    seq: r.seq,
    code: r.code,
    note: r.note,
    ...laterFields('revision', { failingChecksReason: r.failingChecksReason, replies: r.replies }),
    inputs: r.inputs,
    results: r.results,
    template: { id: r.templateId, slug: r.templateSlug, version: r.templateVersion, title: r.templateTitle, model: r.model, body: r.templateBody },
    engineVersion: r.engineVersion,
    report: { html: r.reportHtml, sections: r.reportSections },
    authorId: r.authorId,
    issuedAt: r.issuedAt.toISOString(),
    prevHash: r.prevHash,
  })
}

export interface ReviewHashFields {
  revisionId: number
  sheetId: number
  decision: string
  contractCode: string | null
  comments: unknown
  reviewerId: number
  createdAt: Date
  /** the office details frozen by an approval; added later (LATER_COLUMNS): absent from the hash when null, so older rows keep theirs */
  officeVersion?: number | null
}

export function reviewHash(r: ReviewHashFields): string {
  return hashCanonical({
    kind: 'tendonbook.review',
    revisionId: r.revisionId,
    sheetId: r.sheetId,
    decision: r.decision,
    contractCode: r.contractCode,
    comments: r.comments,
    reviewerId: r.reviewerId,
    createdAt: r.createdAt.toISOString(),
    ...laterFields('review', { officeVersion: r.officeVersion }),
  })
}

export interface AuditHashFields {
  seq: number
  action: string
  subject: string
  actorId: number | null
  address: string
  detail: unknown
  createdAt: Date
  prevHash: string | null
}

export function auditHash(e: AuditHashFields): string {
  return hashCanonical({
    kind: 'tendonbook.audit',
    seq: e.seq,
    action: e.action,
    subject: e.subject,
    actorId: e.actorId,
    address: e.address,
    detail: e.detail,
    createdAt: e.createdAt.toISOString(),
    prevHash: e.prevHash,
  })
}


/** What a person might paste: a 64-hex hash or a verification reference, normalised. */
export function parseVerifyQuery(text: string): { kind: 'hash', value: string } | { kind: 'ref', value: string } | null {
  const t = text.trim()
  if (/^[0-9a-f]{64}$/i.test(t)) return { kind: 'hash', value: t.toLowerCase() }
  const compact = t.toUpperCase().replace(/[\s-]/g, '')
  const m = /^TB([0-9A-F]{12})$/.exec(compact)
  if (m) return { kind: 'ref', value: verificationRef(m[1]!.toLowerCase()) }
  return null
}
