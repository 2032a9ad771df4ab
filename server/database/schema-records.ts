// Tables of the records side: revisions, reviews, seals, attachments, audit events, outbox.
// Revisions, reviews, seals and audit events only grow: triggers (drizzle/*_immutable-history.sql)
// refuse UPDATE and DELETE, and the application user has SELECT and INSERT only on them.
import { sql } from 'drizzle-orm'
import {
  bigint, char, datetime, index, int, json, longtext, mediumtext, mysqlEnum, mysqlTable, text, uniqueIndex, varchar,
} from 'drizzle-orm/mysql-core'
import { LOG_KINDS } from '../../shared/log/entry'
import { sheets, templates, users } from './schema'

const ms = (name: string) => datetime(name, { mode: 'date', fsp: 3 })
const sha256 = (name: string) => char(name, { length: 64 })

/**
 * One frozen, issued run of a calc sheet. `seq` numbers a sheet's revisions 1, 2, 3… with no gap
 * (checked by a trigger) and `code` is P01, P02… from it; `prev_hash` is the previous revision's
 * `content_hash` on the same sheet (checked by the same trigger), so each sheet's history is a chain.
 */
export const revisions = mysqlTable('revisions', {
  id: int('id').autoincrement().primaryKey(),
  sheetId: int('sheet_id').notNull().references(() => sheets.id, { onDelete: 'restrict' }),
  seq: int('seq').notNull(),
  code: varchar('code', { length: 8 }).notNull(),
  note: varchar('note', { length: 500 }).notNull().default(''),
  // why the author issued although checks fail (required then); frozen with the run
  failingChecksReason: varchar('failing_checks_reason', { length: 2000 }).notNull().default(''),
  // the author's replies to the checker's comments on the revision before, as FrozenReply of
  // shared/schemas/review.ts: [{ reviewId, index, text, anchor, commentText }]; null when none
  replies: json('replies'),
  inputs: json('inputs').notNull(),
  results: json('results').notNull(),
  templateId: int('template_id').notNull().references(() => templates.id, { onDelete: 'restrict' }),
  templateSlug: varchar('template_slug', { length: 80 }).notNull(),
  templateVersion: int('template_version').notNull(),
  templateTitle: varchar('template_title', { length: 200 }).notNull(),
  model: varchar('model', { length: 60 }).notNull(),
  templateBody: mediumtext('template_body').notNull(),
  engineVersion: varchar('engine_version', { length: 32 }).notNull(),
  // the report as rendered at issue, so a later renderer never changes a frozen document
  reportHtml: longtext('report_html').notNull(),
  reportSections: json('report_sections').notNull(),
  authorId: int('author_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  issuedAt: ms('issued_at').notNull(),
  contentHash: sha256('content_hash').notNull(),
  prevHash: sha256('prev_hash'),
}, t => [
  uniqueIndex('revisions_sheet_seq_unique').on(t.sheetId, t.seq),
  uniqueIndex('revisions_sheet_code_unique').on(t.sheetId, t.code),
  uniqueIndex('revisions_content_hash_unique').on(t.contentHash),
  index('revisions_issued_idx').on(t.issuedAt),
])

/**
 * The office's details for the title block of printed revisions, one row per version (the newest is
 * in force). The logo is a stored file, typed by its content, with its SHA-256.
 */
export const officeDetails = mysqlTable('office_details', {
  id: int('id').autoincrement().primaryKey(),
  name: varchar('name', { length: 160 }).notNull(),
  logoStorageKey: varchar('logo_storage_key', { length: 200 }),
  logoMime: varchar('logo_mime', { length: 40 }),
  logoBytes: int('logo_bytes'),
  logoSha256: sha256('logo_sha256'),
  createdBy: int('created_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: ms('created_at').notNull(),
})

export const REVIEW_DECISIONS = ['comment', 'return', 'approve'] as const
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number]

/**
 * A decision or a comment on a revision. An approval carries the sheet's next contractual code
 * (C01, C02…), unique per sheet.
 */
export const reviews = mysqlTable('reviews', {
  id: int('id').autoincrement().primaryKey(),
  revisionId: int('revision_id').notNull().references(() => revisions.id, { onDelete: 'restrict' }),
  sheetId: int('sheet_id').notNull().references(() => sheets.id, { onDelete: 'restrict' }),
  decision: mysqlEnum('decision', REVIEW_DECISIONS).notNull(),
  contractCode: varchar('contract_code', { length: 8 }),
  // [{ anchor: section id or '', text }]
  comments: json('comments').notNull(),
  reviewerId: int('reviewer_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: ms('created_at').notNull(),
  // an approval freezes the office details in force (title block name and logo), so a re-print matches
  officeVersion: int('office_version').references(() => officeDetails.id, { onDelete: 'restrict' }),
  contentHash: sha256('content_hash').notNull(),
}, t => [
  uniqueIndex('reviews_sheet_contract_code_unique').on(t.sheetId, t.contractCode),
  index('reviews_revision_idx').on(t.revisionId),
])

export const COMMENT_STATES = ['open', 'closed'] as const

/**
 * A checker closes a comment (or opens it again): each change of state is a new row, the newest
 * row of a comment is its state. A comment is (review, position in that review's comments).
 */
export const commentStates = mysqlTable('comment_states', {
  id: int('id').autoincrement().primaryKey(),
  reviewId: int('review_id').notNull().references(() => reviews.id, { onDelete: 'restrict' }),
  commentIndex: int('comment_index').notNull(),
  state: mysqlEnum('state', COMMENT_STATES).notNull(),
  actorId: int('actor_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: ms('created_at').notNull(),
}, t => [index('comment_states_comment_idx').on(t.reviewId, t.commentIndex, t.id)])

/** The sealed PDF of an approved revision: one per revision. */
export const seals = mysqlTable('seals', {
  id: int('id').autoincrement().primaryKey(),
  revisionId: int('revision_id').notNull().references(() => revisions.id, { onDelete: 'restrict' }),
  archiveRef: varchar('archive_ref', { length: 80 }).notNull(),
  verificationRef: varchar('verification_ref', { length: 24 }).notNull(),
  storageKey: varchar('storage_key', { length: 200 }).notNull(),
  pdfSha256: sha256('pdf_sha256').notNull(),
  pdfBytes: int('pdf_bytes').notNull(),
  pages: int('pages').notNull(),
  sealedBy: int('sealed_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  sealedAt: ms('sealed_at').notNull(),
  // printed on the PDF: the revision's leaf in the history log and the signed head it was sealed
  // under (null on seals made before the log existed)
  logLeafIndex: bigint('log_leaf_index', { mode: 'number' }),
  headTreeSize: bigint('head_tree_size', { mode: 'number' }),
  headRootHash: sha256('head_root_hash'),
}, t => [
  uniqueIndex('seals_revision_unique').on(t.revisionId),
  uniqueIndex('seals_archive_ref_unique').on(t.archiveRef),
  uniqueIndex('seals_verification_ref_unique').on(t.verificationRef),
  uniqueIndex('seals_pdf_sha256_unique').on(t.pdfSha256),
])

/** Supporting files of a sheet, stored under generated keys and typed by their content. */
export const attachments = mysqlTable('attachments', {
  id: int('id').autoincrement().primaryKey(),
  sheetId: int('sheet_id').notNull().references(() => sheets.id, { onDelete: 'restrict' }),
  storageKey: varchar('storage_key', { length: 200 }).notNull(),
  filename: varchar('filename', { length: 200 }).notNull(),
  mime: varchar('mime', { length: 80 }).notNull(),
  bytes: int('bytes').notNull(),
  sha256: sha256('sha256').notNull(),
  uploadedBy: int('uploaded_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: ms('created_at').notNull(),
}, t => [
  uniqueIndex('attachments_storage_key_unique').on(t.storageKey),
  index('attachments_sheet_idx').on(t.sheetId),
])

/**
 * Hash-chained audit trail: `hash` = SHA-256 over the canonical JSON of the event and `prev_hash`;
 * `seq` and `prev_hash` are unique, so the chain cannot fork.
 */
export const auditEvents = mysqlTable('audit_events', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  seq: bigint('seq', { mode: 'number' }).notNull(),
  action: varchar('action', { length: 60 }).notNull(),
  subject: varchar('subject', { length: 200 }).notNull(),
  actorId: int('actor_id').references(() => users.id, { onDelete: 'restrict' }),
  address: varchar('address', { length: 64 }).notNull().default(''),
  detail: json('detail').notNull(),
  createdAt: ms('created_at').notNull(),
  prevHash: sha256('prev_hash'),
  hash: sha256('hash').notNull(),
}, t => [
  uniqueIndex('audit_events_seq_unique').on(t.seq),
  uniqueIndex('audit_events_prev_hash_unique').on(t.prevHash),
  index('audit_events_action_idx').on(t.action, t.createdAt),
])

/** Head of the audit chain: one row, locked FOR UPDATE while an event is appended. */
export const chainHeads = mysqlTable('chain_heads', {
  name: varchar('name', { length: 32 }).primaryKey(),
  seq: bigint('seq', { mode: 'number' }).notNull(),
  hash: sha256('hash'),
})

/**
 * The history log (design.md §7 "History as one log"): every history row is one leaf, appended in
 * the transaction that writes the row. `leaf_index` runs 0, 1, 2… without a gap because appends
 * hold the `log` row of chain_heads FOR UPDATE; `batch` is the first leaf index of that
 * transaction, so a decision and its audit event can be shown to have been written together.
 */
export const logLeaves = mysqlTable('log_leaves', {
  leafIndex: bigint('leaf_index', { mode: 'number' }).primaryKey(),
  kind: mysqlEnum('kind', LOG_KINDS).notNull(),
  rowId: bigint('row_id', { mode: 'number' }).notNull(),
  batch: bigint('batch', { mode: 'number' }).notNull(),
  leafHash: sha256('leaf_hash').notNull(),
  createdAt: ms('created_at').notNull(),
  // the row form (shared/log/row-form.ts) the leaf's entry was written in; part of the entry too
  form: int('form').notNull().default(1),
}, t => [
  uniqueIndex('log_leaves_kind_row_unique').on(t.kind, t.rowId),
  index('log_leaves_batch_idx').on(t.batch),
])

/** Every tree head the server has signed and published: (size, root, time), Ed25519-signed. */
export const logHeads = mysqlTable('log_heads', {
  id: int('id').autoincrement().primaryKey(),
  treeSize: bigint('tree_size', { mode: 'number' }).notNull(),
  rootHash: sha256('root_hash').notNull(),
  signedAt: ms('signed_at').notNull(),
  signature: varchar('signature', { length: 100 }).notNull(),
  keyId: sha256('key_id').notNull(),
}, t => [uniqueIndex('log_heads_tree_size_unique').on(t.treeSize)])

export const OUTBOX_STATES = ['pending', 'sent', 'failed'] as const

/** Mail to send, written in the same transaction as the act it tells about. */
export const outbox = mysqlTable('outbox', {
  id: int('id').autoincrement().primaryKey(),
  kind: varchar('kind', { length: 40 }).notNull(),
  toAddresses: text('to_addresses').notNull(),
  subject: varchar('subject', { length: 250 }).notNull(),
  bodyText: text('body_text').notNull(),
  state: mysqlEnum('state', OUTBOX_STATES).notNull().default('pending'),
  attempts: int('attempts').notNull().default(0),
  nextAttemptAt: ms('next_attempt_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  lastError: varchar('last_error', { length: 500 }).notNull().default(''),
  sentAt: ms('sent_at'),
  createdAt: ms('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [index('outbox_state_idx').on(t.state, t.nextAttemptAt)])

export type Revision = typeof revisions.$inferSelect
export type Review = typeof reviews.$inferSelect
export type Seal = typeof seals.$inferSelect
export type Attachment = typeof attachments.$inferSelect
export type AuditEvent = typeof auditEvents.$inferSelect
export type OutboxMessage = typeof outbox.$inferSelect
export type LogLeaf = typeof logLeaves.$inferSelect
export type LogHead = typeof logHeads.$inferSelect
export type OfficeDetails = typeof officeDetails.$inferSelect
export type CommentState = typeof commentStates.$inferSelect
