import type { H3Event } from 'h3'
import { and, asc, count, desc, eq, gte, inArray, like, lt, or, sql, type SQL } from 'drizzle-orm'
import { alias, type MySqlSelect } from 'drizzle-orm/mysql-core'
import Papa from 'papaparse'
import type { ArchiveQuery } from '../utils/records-schemas'
import { parseVerifyQuery, sha256Hex } from '../utils/hashing'
import { CSV_FORMULA_START } from '../../shared/utils/csv'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/** The projects whose records the user keeps; never empty, so it reads as an SQL list (no project has id 0). */
async function recordsProjects(userId: number) {
  const ids = await memberProjectIds(userId, 'records')
  return ids.length ? ids : [0]
}

const s = tables.seals
const r = tables.revisions

/** Sealed documents a page of the register shows unless the query asks for another number. */
export const REGISTER_PAGE_SIZE = 50

// The two facts a sealed revision's status rests on, read in the same query as the register (not
// derived per sheet and per request): its approval's contractual code, and whether a later
// revision of its sheet has been approved since (then it is superseded).
const approvalCode = sql<string | null>`(SELECT v.contract_code FROM reviews v WHERE v.revision_id = ${r.id} AND v.decision = 'approve' ORDER BY v.id LIMIT 1)`
const laterApproved = sql<number>`EXISTS (SELECT 1 FROM reviews v JOIN revisions later ON later.id = v.revision_id WHERE later.sheet_id = ${r.sheetId} AND later.seq > ${r.seq} AND v.decision = 'approve')`

/** A seal's chain up to its project: seals → revisions → sheets → projects, for the register and its count. */
function sealChain<T extends MySqlSelect>(query: T) {
  return query
    .innerJoin(r, eq(r.id, s.revisionId))
    .innerJoin(tables.sheets, eq(tables.sheets.id, r.sheetId))
    .innerJoin(tables.projects, eq(tables.projects.id, tables.sheets.projectId))
}

function registerQuery(where: SQL | undefined) {
  const sealer = alias(tables.users, 'sealer')
  const author = alias(tables.users, 'author')
  return sealChain(useDb().select({
    sealId: s.id, archiveRef: s.archiveRef, verificationRef: s.verificationRef, pdfSha256: s.pdfSha256, pdfBytes: s.pdfBytes,
    pages: s.pages, sealedAt: s.sealedAt, sealedByName: sealer.name,
    revisionId: r.id, code: r.code, contentHash: r.contentHash, issuedAt: r.issuedAt, authorName: author.name,
    sheetId: tables.sheets.id, sheetReference: tables.sheets.reference, sheetTitle: tables.sheets.title,
    projectId: tables.projects.id, jobNumber: tables.projects.jobNumber, projectName: tables.projects.name,
    approvalCode, laterApproved,
  }).from(s).$dynamic())
    .innerJoin(sealer, eq(sealer.id, s.sealedBy))
    .innerJoin(author, eq(author.id, r.authorId))
    .where(where)
    .orderBy(desc(s.sealedAt), desc(s.id))
}

type RegisterRow = Awaited<ReturnType<typeof registerQuery>>[number]

/** The status of an approved revision from the facts the queries read (`later`: 1 when a later revision is approved). */
function approvedRevisionStatus(contractCode: string | null, sealed: boolean, later: number | string) {
  const superseded = Boolean(Number(later))
  return deriveStatus({ decisions: [{ decision: 'approve', contractCode }], sealed, laterIssued: superseded, laterApproved: superseded })
}

/**
 * A row with its status, derived by the one rule every revision's status follows. A sealed revision
 * is approved, and an approved revision's status turns on later approvals only, not later issues.
 */
function withStatus({ approvalCode: contractCode, laterApproved: later, ...row }: RegisterRow) {
  const status = approvedRevisionStatus(contractCode, true, later)
  return { ...row, contractCode: status.contractCode, superseded: status.superseded, status: status.label }
}

/** The conditions of a register query: the user's projects, then the filters. */
async function registerFilter(q: ArchiveQuery, userId: number) {
  const conditions: Array<SQL | undefined> = [inArray(tables.projects.id, await recordsProjects(userId))]
  if (q.project) conditions.push(eq(tables.projects.id, q.project))
  if (q.from) conditions.push(gte(s.sealedAt, new Date(`${q.from}T00:00:00Z`)))
  if (q.to) conditions.push(lt(s.sealedAt, new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000)))
  if (q.q) {
    const text = `%${q.q.replace(/[%_\\]/g, c => `\\${c}`)}%`
    conditions.push(or(like(s.archiveRef, text), like(tables.sheets.title, text), like(tables.sheets.reference, text), like(tables.projects.name, text)))
  }
  if (q.status === 'current') conditions.push(sql`NOT ${laterApproved}`)
  if (q.status === 'superseded') conditions.push(laterApproved)
  return and(...conditions)
}

/**
 * One page of the register of sealed documents, newest first, filtered by project, sealing date,
 * status and text, with the number that match. A page past the last answers with no rows.
 */
export async function archiveRegister(q: ArchiveQuery, userId: number) {
  const where = await registerFilter(q, userId)
  const page = q.page ?? 1
  const pageSize = q.per ?? REGISTER_PAGE_SIZE
  const rows = await registerQuery(where).limit(pageSize).offset((page - 1) * pageSize)
  const [{ total }] = await sealChain(useDb().select({ total: count() }).from(s).$dynamic()).where(where)
  return { rows: rows.map(withStatus), total, page, pageSize }
}

/** Every row of the register that matches the filters (the CSV export), newest first. */
export async function wholeRegister(q: ArchiveQuery, userId: number) {
  return (await registerQuery(await registerFilter(q, userId))).map(withStatus)
}

/** The register as CSV; a text cell starting with = + - @, tab or CR gets a leading ' so no spreadsheet runs it as a formula. */
export function registerCsv(rows: Awaited<ReturnType<typeof wholeRegister>>) {
  return Papa.unparse(rows.map(x => ({
    'Archive ref.': x.archiveRef,
    'Verification ref.': x.verificationRef,
    'Job no.': x.jobNumber,
    'Project': x.projectName,
    'Calc ref.': x.sheetReference,
    'Title': x.sheetTitle,
    'Revision': x.contractCode ?? '',
    'Checked as': x.code,
    'Status': x.status,
    'Made by': x.authorName,
    'Sealed by': x.sealedByName,
    'Sealed at (UTC)': new Date(x.sealedAt).toISOString(),
    'Pages': x.pages,
    'PDF SHA-256': x.pdfSha256,
    'Content SHA-256': x.contentHash,
  })), { newline: '\r\n', escapeFormulae: CSV_FORMULA_START })
}

/**
 * Approved revisions that still wait for their seal: every approval without a seal, kept where the
 * one status rule (deriveStatus) calls it approved, so a later approval (superseded) drops it.
 */
export async function awaitingSeal(userId: number) {
  const author = alias(tables.users, 'author')
  const approvals = await useDb().select({
    revisionId: r.id, code: r.code, sheetId: r.sheetId, sheetReference: tables.sheets.reference, sheetTitle: tables.sheets.title,
    jobNumber: tables.projects.jobNumber, projectName: tables.projects.name, authorName: author.name, approvedAt: tables.reviews.createdAt,
    contractCode: tables.reviews.contractCode, laterApproved,
  }).from(tables.reviews)
    .innerJoin(r, eq(r.id, tables.reviews.revisionId))
    .innerJoin(author, eq(author.id, r.authorId))
    .innerJoin(tables.sheets, eq(tables.sheets.id, r.sheetId))
    .innerJoin(tables.projects, eq(tables.projects.id, tables.sheets.projectId))
    .where(and(
      eq(tables.reviews.decision, 'approve'), inArray(tables.projects.id, await recordsProjects(userId)),
      sql`NOT EXISTS (SELECT 1 FROM seals x WHERE x.revision_id = ${r.id})`,
    ))
    .orderBy(asc(tables.reviews.createdAt))
  return approvals
    .filter(({ contractCode, laterApproved: later }) => approvedRevisionStatus(contractCode, false, later).status === 'approved')
    .map(({ laterApproved: _, ...row }) => row)
}

/** The sealed document the condition finds among the user's projects: one of another project reads as none. */
async function sealMatch(userId: number, where: ReturnType<typeof eq>) {
  const [found] = await registerQuery(and(where, inArray(tables.projects.id, await recordsProjects(userId)))).limit(1)
  const row = found && withStatus(found)
  if (!row) return null
  const statuses = await sheetRevisionStatuses(useDb(), row.sheetId)
  const later = await useDb().select({ id: r.id, code: r.code, seq: r.seq }).from(r).where(eq(r.sheetId, row.sheetId)).orderBy(asc(r.seq))
  const replacement = row.superseded ? later.find(x => x.id !== row.revisionId && statuses.get(x.id)?.contractCode && (statuses.get(x.id)?.status === 'approved' || statuses.get(x.id)?.status === 'sealed')) : undefined
  return { ...row, supersededBy: replacement ? { revisionId: replacement.id, code: statuses.get(replacement.id)!.contractCode } : null }
}

export type VerifyResult = {
  match: boolean
  message: string
  sha256?: string
  query?: string
  document: Awaited<ReturnType<typeof sealMatch>>
  /** the seal's inclusion proof in the latest signed head of the history log */
  inclusion: Awaited<ReturnType<typeof sealInclusion>>
}

async function inclusionOf(doc: Awaited<ReturnType<typeof sealMatch>>) {
  return doc ? sealInclusion(doc.sealId, await publishHead()) : null
}

function describe(doc: NonNullable<Awaited<ReturnType<typeof sealMatch>>>) {
  const what = `${doc.archiveRef}: ${doc.sheetReference} ${doc.contractCode} "${doc.sheetTitle}", job ${doc.jobNumber}`
  return doc.superseded
    ? `A sealed document (${what}), but it has been superseded${doc.supersededBy ? ` by ${doc.supersededBy.code}` : ''}`
    : `A sealed document (${what}), current`
}

/** Hashes an uploaded file and says whether it is, byte for byte, a sealed document. */
export async function verifyUpload(event: H3Event, bytes: Uint8Array, user: SessionUser): Promise<VerifyResult> {
  const sha256 = sha256Hex(bytes)
  const doc = await sealMatch(user.id, eq(s.pdfSha256, sha256))
  const result: VerifyResult = doc
    ? { match: true, message: describe(doc), sha256, document: doc, inclusion: await inclusionOf(doc) }
    : { match: false, message: 'Not a sealed document: no sealed PDF of your projects has this SHA-256 (a single changed byte gives a different hash)', sha256, document: null, inclusion: null }
  await recordAudit(event, { action: 'verify.file', subject: sha256, actorId: user.id, detail: { match: result.match, archiveRef: doc?.archiveRef ?? null } })
  return result
}

/** Looks up a pasted PDF hash, revision content hash, verification reference or archive reference. */
export async function verifyText(event: H3Event, text: string, user: SessionUser): Promise<VerifyResult> {
  const parsed = parseVerifyQuery(text)
  let doc: Awaited<ReturnType<typeof sealMatch>> = null
  let message = ''
  if (parsed?.kind === 'hash') {
    doc = await sealMatch(user.id, eq(s.pdfSha256, parsed.value)) ?? await sealMatch(user.id, eq(r.contentHash, parsed.value))
    if (!doc) {
      const [rev] = await useDb().select({ code: r.code, ref: tables.sheets.reference }).from(r).innerJoin(tables.sheets, eq(tables.sheets.id, r.sheetId)).where(and(eq(r.contentHash, parsed.value), inArray(tables.sheets.projectId, await recordsProjects(user.id))))
      message = rev ? `This is the content hash of ${rev.ref} ${rev.code}, which has not been sealed` : 'Not a sealed document: no sealed PDF or revision of your projects has this hash'
    }
  }
  else if (parsed?.kind === 'ref') {
    doc = await sealMatch(user.id, eq(s.verificationRef, parsed.value))
    if (!doc) message = `No sealed document of your projects has the verification reference ${parsed.value}`
  }
  else {
    doc = await sealMatch(user.id, eq(s.archiveRef, text.trim()))
    if (!doc) message = 'Not found: paste a SHA-256 (64 hex digits), a verification reference (TB-XXXX-XXXX-XXXX) or an archive reference'
  }
  const result: VerifyResult = doc
    ? { match: true, message: describe(doc), query: text, document: doc, inclusion: await inclusionOf(doc) }
    : { match: false, message, query: text, document: null, inclusion: null }
  await recordAudit(event, { action: 'verify.reference', subject: text.slice(0, 200), actorId: user.id, detail: { match: result.match, archiveRef: doc?.archiveRef ?? null } })
  return result
}
