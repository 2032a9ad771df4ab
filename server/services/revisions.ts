import type { H3Event } from 'h3'
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { EngineInputError, type CheckResult } from '../../shared/engine/index'
import { tallyChecks } from '../../shared/report/tally'
import { checkSectionsIn } from '../../shared/report/render'
import type { Db } from '../utils/db'
import type { Tx } from '../utils/audit'
import { revisionHash, storedJson, storedText } from '../utils/hashing'
import { deriveStatus, revisionCode, type DerivedStatus } from '../utils/revision-status'
import { diffRevisions } from '../utils/revision-diff'
import type { IssueRevisionBody } from '../../shared/schemas/issue'
import type { CommentReply, FrozenReply } from '../../shared/schemas/review'
import { describeInputError } from '../../shared/sheet/labels'
import { hasConflictMarkers } from '../../shared/sheet/text-merge'
import { proseDiff } from '../../shared/sheet/prose-diff'
import { MODELS } from '../../shared/report/models'

type DbLike = Db | Tx
type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/** Columns of a revision without its large frozen payload. */
const r = tables.revisions
const revisionSummary = {
  id: r.id, sheetId: r.sheetId, seq: r.seq, code: r.code, note: r.note, failingChecksReason: r.failingChecksReason, templateTitle: r.templateTitle,
  templateVersion: r.templateVersion, engineVersion: r.engineVersion, authorId: r.authorId,
  issuedAt: r.issuedAt, contentHash: r.contentHash, prevHash: r.prevHash,
}

/** Only the check list of a revision's results, not its figure samples: enough for a tally. */
const checksJson = sql<unknown>`JSON_EXTRACT(${r.results}, '$.checks')`

/** Pass/fail counts and the governing utilisation of a revision, from its checks column. */
function tallyOf(checks: unknown) {
  const list = typeof checks === 'string' ? JSON.parse(checks) as unknown : checks
  return tallyChecks(Array.isArray(list) ? list as CheckResult[] : [])
}

/** Derived status of every revision of a sheet, from the reviews, seals and later revisions. */
export async function sheetRevisionStatuses(db: DbLike, sheetId: number): Promise<Map<number, DerivedStatus>> {
  const revs = await db.select({ id: r.id, seq: r.seq }).from(r).where(eq(r.sheetId, sheetId)).orderBy(asc(r.seq))
  const reviews = await db.select({ revisionId: tables.reviews.revisionId, decision: tables.reviews.decision, contractCode: tables.reviews.contractCode })
    .from(tables.reviews).where(eq(tables.reviews.sheetId, sheetId)).orderBy(asc(tables.reviews.id))
  const ids = revs.map(x => x.id)
  const seals = ids.length ? await db.select({ revisionId: tables.seals.revisionId }).from(tables.seals).where(inArray(tables.seals.revisionId, ids)) : []
  const sealed = new Set(seals.map(s => s.revisionId))
  const approvedSeqs = revs.filter(x => reviews.some(v => v.revisionId === x.id && v.decision === 'approve')).map(x => x.seq)
  const maxSeq = revs.at(-1)?.seq ?? 0
  const out = new Map<number, DerivedStatus>()
  for (const rev of revs) {
    const decisions = reviews.filter(v => v.revisionId === rev.id && v.decision !== 'comment')
      .map(v => ({ decision: v.decision as 'return' | 'approve', contractCode: v.contractCode }))
    out.set(rev.id, deriveStatus({ decisions, sealed: sealed.has(rev.id), laterIssued: rev.seq < maxSeq, laterApproved: approvedSeqs.some(s => s > rev.seq) }))
  }
  return out
}

function mailLink(event: H3Event, path: string) {
  return `${getRequestURL(event).origin}${path}`
}

export type { FrozenReply }

/**
 * The replies, checked against the comments of the sheet's latest revision (the one they answer).
 * @throws 400 naming `replies` when a reply answers a comment that revision does not have.
 */
async function frozenReplies(tx: Tx, sheetId: number, latestRevisionId: number | undefined, replies: CommentReply[]): Promise<FrozenReply[]> {
  if (!replies.length) return []
  const reviews = latestRevisionId === undefined
    ? []
    : await tx.select({ id: tables.reviews.id, comments: tables.reviews.comments }).from(tables.reviews)
      .where(and(eq(tables.reviews.revisionId, latestRevisionId), eq(tables.reviews.sheetId, sheetId)))
  return replies.map((reply) => {
    const comments = reviews.find(v => v.id === reply.reviewId)?.comments as Array<{ anchor?: string, text: string }> | undefined
    const comment = comments?.[reply.index]
    if (!comment) {
      const message = 'A reply answers a comment that the latest revision does not have; reload the sheet'
      throw createError({ statusCode: 400, message: `Replies to the comments: ${message}`, data: { fields: { replies: message } } })
    }
    return { ...reply, anchor: comment.anchor ?? '', commentText: comment.text }
  })
}

/** An attached image is frozen into the revision's report up to this size (its bytes go into the HTML). */
const FROZEN_IMAGE_MAX_BYTES = 3 * 1024 * 1024

/**
 * The images the sheet's text shows (::: figure{image=name}), read from storage and checked against
 * their recorded SHA-256, as data: URIs: the frozen report and its print carry the picture itself.
 * @throws 400 naming the image when it is too large to freeze into the report.
 */
async function frozenImages(tx: Tx, sheetId: number, text: string): Promise<Record<string, { src: string, sha256: string }>> {
  const names = new Set([...text.matchAll(/^:::\s*figure\{[^}\n]*\bimage=(?:"([^"]*)"|([^\s}]+))/gm)].map(m => m[1] ?? m[2]!))
  if (names.size === 0) return {}
  const rows = await tx.select({ id: tables.attachments.id, filename: tables.attachments.filename, mime: tables.attachments.mime, bytes: tables.attachments.bytes })
    .from(tables.attachments).where(and(eq(tables.attachments.sheetId, sheetId), inArray(tables.attachments.filename, [...names])))
  const out: Record<string, { src: string, sha256: string }> = {}
  // the newest upload of a name is the one shown
  for (const row of rows.sort((a, b) => a.id - b.id)) {
    if (row.mime !== 'image/png' && row.mime !== 'image/jpeg') continue
    if (row.bytes > FROZEN_IMAGE_MAX_BYTES) {
      const message = `${row.filename} is ${(row.bytes / 1048576).toFixed(1)} MB; an image in the sheet is at most 3 MB: attach a smaller copy`
      throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: `Image: ${message}`, data: { fields: { body: message } } })
    }
    // through the issue's own transaction: it holds the sheet's lock, so it must not wait for another pooled connection
    const { row: file, bytes } = await attachmentFile(row.id, tx)
    out[row.filename] = { src: `data:${file.mime};base64,${Buffer.from(bytes).toString('base64')}`, sha256: file.sha256 }
  }
  return out
}

/** @throws 400 naming `failingChecksReason` when checks fail and no reason is given. */
function requireReasonForFailingChecks(checks: readonly CheckResult[], reason: string) {
  const failing = checks.filter(c => !c.pass)
  if (!failing.length || reason) return
  const list = failing.slice(0, 5).map(c => `${c.title}${c.location ? ` (${c.location})` : ''}`).join('; ')
  const message = `${failing.length} check${failing.length === 1 ? ' fails' : 's fail'} (${list}${failing.length > 5 ? '; …' : ''}): give the reason for issuing all the same`
  throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: `Reason for issuing with failing checks: ${message}`, data: { fields: { failingChecksReason: message } } })
}

/**
 * Freezes the draft the engineer is looking at as the sheet's next revision: the server runs the engine itself,
 * renders the report from the sheet's own template version, and writes the row, its audit event and
 * the notice to the checkers in one transaction. The sheet row is locked first, so concurrent issues
 * of one sheet queue up and get consecutive codes (the unique index and the chain trigger back that up).
 * Issuing with failing checks needs a reason, frozen with the revision; replies to the checker's
 * comments on the revision before go with it.
 * @throws 404 unknown sheet, 409 when a newer draft was saved than `draftVersion`, 422 naming the
 * input at fault, 400 failing checks without a reason.
 */
export async function issueRevision(event: H3Event, sheetId: number, body: IssueRevisionBody, user: SessionUser) {
  const { note, failingChecksReason, draftVersion } = body
  const created = await historyTransaction(async (tx) => {
    const [sheet] = await tx.select().from(tables.sheets).where(eq(tables.sheets.id, sheetId)).for('update')
    if (!sheet) throw createError({ statusCode: 404, message: `No calc sheet with id ${sheetId}` })
    if (sheet.draftVersion !== draftVersion) {
      const [editor] = await tx.select({ name: tables.users.name }).from(tables.users).where(eq(tables.users.id, sheet.updatedBy))
      throw createError({
        statusCode: 409,
        message: `${editor?.name ?? 'Someone'} saved a newer draft of ${sheet.reference} (version ${sheet.draftVersion}; you are looking at version ${draftVersion}) at ${sheet.updatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC. Reload the sheet and check it before issuing.`,
        data: { draftVersion: sheet.draftVersion },
      })
    }
    const [template] = await tx.select().from(tables.templates).where(eq(tables.templates.id, sheet.templateId))
    const [project] = await tx.select().from(tables.projects).where(eq(tables.projects.id, sheet.projectId))
    if (!template || !project) throw createError({ statusCode: 500, message: 'The sheet refers to a missing template or project' })

    // the sheet's own text where the engineer wrote one, else its template's; a merge left unresolved is refused
    const text = sheet.body ?? template.body
    if (hasConflictMarkers(text)) {
      const message = 'The sheet\'s text still holds a conflict from the newer template version: choose between the two versions between the markers, then issue'
      throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: `Sheet text: ${message}`, data: { fields: { body: message } } })
    }
    const images = await frozenImages(tx, sheetId, text)
    let frozen
    try {
      frozen = freezeRun(template.model, text, sheet.inputs, images)
    }
    catch (error) {
      if (error instanceof EngineInputError) {
        const message = error.message.replace(`${error.field}: `, '')
        throw createError({ statusCode: 422, message: describeInputError(error.field, message), data: { fields: { [`inputs.${error.field}`]: message } } })
      }
      throw error
    }
    requireReasonForFailingChecks(frozen.results.checks, failingChecksReason)
    const [last] = await tx.select({ id: r.id, seq: r.seq, contentHash: r.contentHash }).from(r).where(eq(r.sheetId, sheetId)).orderBy(desc(r.seq)).limit(1).for('update')
    const replies = await frozenReplies(tx, sheetId, last?.id, body.replies)
    const seq = (last?.seq ?? 0) + 1
    // the large columns, each put into its stored text and its canonical JSON once: the content hash,
    // the log's leaf and the check of the row read back all take those, none walks them again
    const written = {
      inputs: storedJson(frozen.inputs), results: storedJson(frozen.results), reportSections: storedJson(frozen.sections),
      reportHtml: storedText(frozen.html), ...(replies.length ? { replies: storedJson(replies) } : {}),
    }
    const fields = {
      sheetId, seq, code: revisionCode('P', seq), note, failingChecksReason,
      templateId: template.id, templateSlug: template.slug, templateVersion: template.version, templateTitle: template.title,
      model: template.model, templateBody: text, engineVersion: frozen.engineVersion, reportHtml: frozen.html,
      authorId: user.id, issuedAt: new Date(), prevHash: last?.contentHash ?? null,
    }
    const pieces = { replies: written.replies?.canonical ?? null, inputs: written.inputs.canonical, results: written.results.canonical, reportSections: written.reportSections.canonical, reportHtml: written.reportHtml.canonical }
    const contentHash = revisionHash({ ...fields, ...pieces })
    const texts = { replies: written.replies ? sql`${written.replies.stored}` : null, inputs: sql`${written.inputs.stored}`, results: sql`${written.results.stored}`, reportSections: sql`${written.reportSections.stored}` }
    const [{ id }] = await tx.insert(r).values({ ...fields, ...texts, contentHash }).$returningId()
    await logWrittenRow(tx, 'revision', id, { hash: contentHash, of: revisionHash, written })
    await recordAudit(event, { action: 'revision.issued', subject: `${project.jobNumber}/${sheet.reference} ${fields.code}`, actorId: user.id, detail: { revisionId: id, contentHash } }, tx)
    await enqueueMail(tx, {
      kind: 'revision.issued',
      to: await membersWithRole(tx, project.id, 'checker'),
      subject: `[Tendonbook] ${sheet.reference} ${fields.code} issued for check - job ${project.jobNumber} ${project.name}`,
      text: `${user.name} issued ${sheet.reference} ${fields.code} "${sheet.title}" for check.\n${note ? `Note: ${note}\n` : ''}${failingChecksReason ? `Issued with failing checks: ${failingChecksReason}\n` : ''}\nOpen it: ${mailLink(event, `/revisions/${id}`)}\n\nContent hash: ${contentHash}\n`,
    })
    return { id, code: fields.code, contentHash }
  }, { isolationLevel: 'read committed' })
  // what the editor needs to say so and link to it; the revision itself reads from GET /api/revisions/:id
  return created
}

export async function listSheetRevisions(sheetId: number) {
  const db = useDb()
  const [sheet] = await db.select({ id: tables.sheets.id }).from(tables.sheets).where(eq(tables.sheets.id, sheetId))
  if (!sheet) throw createError({ statusCode: 404, message: `No calc sheet with id ${sheetId}` })
  const author = alias(tables.users, 'author')
  const rows = await db.select({ ...revisionSummary, authorName: author.name, checks: checksJson }).from(r).innerJoin(author, eq(author.id, r.authorId))
    .where(eq(r.sheetId, sheetId)).orderBy(desc(r.seq))
  const statuses = await sheetRevisionStatuses(db, sheetId)
  return rows.map(({ checks, ...row }) => ({ ...row, status: statuses.get(row.id)!, tally: tallyOf(checks) }))
}

/**
 * A revision as stored, checked against its content hash before anything shows or prints it.
 * @throws 404 unknown, 409 when the stored revision no longer matches its hash.
 */
async function loadRevision(id: number) {
  const [row] = await useDb().select().from(r).where(eq(r.id, id)).limit(1)
  if (!row) throw createError({ statusCode: 404, message: `No revision with id ${id}` })
  if (revisionHash(row) !== row.contentHash) {
    throw createError({ statusCode: 409, message: `Revision ${row.code} no longer matches its content hash: it was changed after issue, so it is not shown or printed. The records office can run the chain verification.` })
  }
  return row
}

/** Everything the revision page shows: the frozen report, status, reviews, seal, neighbours, what the user may do. */
export async function getRevisionDetail(id: number, user: SessionUser) {
  const db = useDb()
  const rev = await loadRevision(id)
  const [ctx] = await db.select({ sheet: tables.sheets, project: tables.projects, authorName: tables.users.name })
    .from(tables.sheets).innerJoin(tables.projects, eq(tables.projects.id, tables.sheets.projectId))
    .innerJoin(tables.users, eq(tables.users.id, rev.authorId)).where(eq(tables.sheets.id, rev.sheetId))
  const statuses = await sheetRevisionStatuses(db, rev.sheetId)
  const status = statuses.get(rev.id)!
  const reviewer = alias(tables.users, 'reviewer')
  const reviews = await db.select({ id: tables.reviews.id, decision: tables.reviews.decision, contractCode: tables.reviews.contractCode, comments: tables.reviews.comments, reviewerId: tables.reviews.reviewerId, reviewerName: reviewer.name, createdAt: tables.reviews.createdAt, officeVersion: tables.reviews.officeVersion })
    .from(tables.reviews).innerJoin(reviewer, eq(reviewer.id, tables.reviews.reviewerId)).where(eq(tables.reviews.revisionId, id)).orderBy(asc(tables.reviews.id))
  const sealer = alias(tables.users, 'sealer')
  const [seal] = await db.select({ id: tables.seals.id, archiveRef: tables.seals.archiveRef, verificationRef: tables.seals.verificationRef, pdfSha256: tables.seals.pdfSha256, pdfBytes: tables.seals.pdfBytes, pages: tables.seals.pages, sealedAt: tables.seals.sealedAt, sealedByName: sealer.name, logLeafIndex: tables.seals.logLeafIndex, headTreeSize: tables.seals.headTreeSize, headRootHash: tables.seals.headRootHash })
    .from(tables.seals).innerJoin(sealer, eq(sealer.id, tables.seals.sealedBy)).where(eq(tables.seals.revisionId, id))
  const siblings = await db.select({ id: r.id, seq: r.seq, code: r.code }).from(r).where(eq(r.sheetId, rev.sheetId)).orderBy(asc(r.seq))
  const results = rev.results as { checks?: unknown[] }
  const checks = (Array.isArray(results.checks) ? results.checks : []) as CheckResult[]
  const homes = checkSectionsIn(rev.reportHtml)
  const model = Object.hasOwn(MODELS, rev.model) ? MODELS[rev.model] : undefined
  const approval = reviews.find(v => v.decision === 'approve')
  const canDecide = status.status === 'issued' && user.role === 'checker'
  return {
    id: rev.id, seq: rev.seq, code: rev.code, note: rev.note, failingChecksReason: rev.failingChecksReason,
    replies: (Array.isArray(rev.replies) ? rev.replies : []) as FrozenReply[], issuedAt: rev.issuedAt, contentHash: rev.contentHash, prevHash: rev.prevHash,
    engineVersion: rev.engineVersion, template: { id: rev.templateId, slug: rev.templateSlug, version: rev.templateVersion, title: rev.templateTitle, model: rev.model },
    reportHtml: rev.reportHtml, sections: rev.reportSections as Array<{ id: string, title: string, level: number }>,
    checks: checks.map(c => ({ ...c, sectionId: homes[c.id] ?? null })),
    tally: tallyChecks(checks),
    groupLabels: model?.groupLabels ?? {},
    threads: await sheetCommentThreads(db, rev.sheetId, rev.seq),
    author: { id: rev.authorId, name: ctx?.authorName ?? '' },
    sheet: { id: rev.sheetId, reference: ctx?.sheet.reference ?? '', title: ctx?.sheet.title ?? '', partOfStructure: ctx?.sheet.partOfStructure ?? '' },
    project: { id: ctx?.project.id ?? 0, jobNumber: ctx?.project.jobNumber ?? '', name: ctx?.project.name ?? '', client: ctx?.project.client ?? '', site: ctx?.project.site ?? '' },
    status, reviews,
    approvedBy: approval ? { name: approval.reviewerName, at: approval.createdAt, officeVersion: approval.officeVersion } : null,
    seal: seal ?? null,
    previous: siblings.filter(s => s.seq < rev.seq).at(-1) ?? null,
    next: siblings.find(s => s.seq > rev.seq) ?? null,
    can: {
      decide: canDecide && user.id !== rev.authorId,
      approve: canDecide && user.id !== rev.authorId,
      comment: user.role !== 'records',
      seal: status.status === 'approved' && user.role === 'records',
      closeComments: user.role === 'checker',
    },
  }
}

/** Diff against an earlier revision of the same sheet (default: the one just before). */
export async function revisionDiff(id: number, againstId?: number) {
  const rev = await loadRevision(id)
  let base
  if (againstId !== undefined) {
    base = await loadRevision(againstId)
    if (base.sheetId !== rev.sheetId) throw createError({ statusCode: 400, message: 'Compared with: that revision belongs to another sheet', data: { fields: { against: 'Another sheet' } } })
  }
  else {
    [base] = await useDb().select().from(r).where(and(eq(r.sheetId, rev.sheetId), eq(r.seq, rev.seq - 1)))
  }
  if (!base) return { against: null, diff: null }
  const model = Object.hasOwn(MODELS, rev.model) ? MODELS[rev.model] : undefined
  if (!model) throw createError({ statusCode: 409, message: `${rev.code} binds to the model "${rev.model}", which this version of Tendonbook does not know` })
  const side = (row: typeof rev) => ({ inputs: row.inputs, results: row.results, ...reportMapOf(row) })
  // the sheet's text as the checker reads a change of it: words added and removed, section by section
  return { against: { id: base.id, code: base.code }, diff: diffRevisions(model, side(base), side(rev)), text: proseDiff(base.templateBody, rev.templateBody) }
}

/** Revisions waiting for a decision on the projects the user checks: the latest of their sheet and neither returned nor approved. */
export async function checkQueue(user: SessionUser) {
  const db = useDb()
  const author = alias(tables.users, 'author')
  const rows = await db.select({ ...revisionSummary, authorName: author.name, checks: checksJson, sheetReference: tables.sheets.reference, sheetTitle: tables.sheets.title, jobNumber: tables.projects.jobNumber, projectName: tables.projects.name })
    .from(r).innerJoin(author, eq(author.id, r.authorId)).innerJoin(tables.sheets, eq(tables.sheets.id, r.sheetId))
    .innerJoin(tables.projects, eq(tables.projects.id, tables.sheets.projectId))
    .where(inArray(tables.projects.id, [0, ...await memberProjectIds(user.id, 'checker')])).orderBy(asc(r.issuedAt))
  const statusBySheet = new Map<number, Map<number, DerivedStatus>>()
  const out = []
  for (const row of rows) {
    if (!statusBySheet.has(row.sheetId)) statusBySheet.set(row.sheetId, await sheetRevisionStatuses(db, row.sheetId))
    const status = statusBySheet.get(row.sheetId)!.get(row.id)!
    const { checks, ...summary } = row
    if (status.status === 'issued') out.push({ ...summary, status, tally: tallyOf(checks), authoredByYou: row.authorId === user.id })
  }
  return out
}
