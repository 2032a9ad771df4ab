import type { H3Event } from 'h3'
import { and, count, eq, isNotNull } from 'drizzle-orm'
import type { ReviewBody } from '../utils/records-schemas'
import { plainJson, reviewHash } from '../utils/hashing'
import { revisionCode } from '../utils/revision-status'
import { quotedComments } from '../utils/comment-threads'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/**
 * Records a checker's decision (return with comments, approve) or a comment on a revision, with its
 * audit event and e-mail notices, in one transaction. The sheet is locked so a decision and a new
 * issue of the same sheet cannot cross.
 * @throws 403 when the author tries to return or approve, 409 when the revision is no longer open for a decision.
 */
export async function reviewRevision(event: H3Event, revisionId: number, body: ReviewBody, user: SessionUser) {
  // `user.role` is the caller's role on the revision's project (server/utils/access.ts)
  if (body.decision !== 'comment' && user.role !== 'checker') {
    throw createError({ statusCode: 403, message: `Returning or approving a revision is for a checker of the project; you are its ${user.role}` })
  }
  await historyTransaction(async (tx) => {
    const [rev] = await tx.select({ id: tables.revisions.id, sheetId: tables.revisions.sheetId, code: tables.revisions.code, authorId: tables.revisions.authorId, sections: tables.revisions.reportSections })
      .from(tables.revisions).where(eq(tables.revisions.id, revisionId))
    if (!rev) throw createError({ statusCode: 404, message: `No revision with id ${revisionId}` })
    const [sheet] = await tx.select().from(tables.sheets).where(eq(tables.sheets.id, rev.sheetId)).for('update')
    const [project] = await tx.select().from(tables.projects).where(eq(tables.projects.id, sheet!.projectId))
    const status = (await sheetRevisionStatuses(tx, rev.sheetId)).get(rev.id)!

    const anchors = new Set((rev.sections as Array<{ id: string }>).map(s => s.id))
    const unknown = body.comments.findIndex(c => c.anchor !== '' && !anchors.has(c.anchor))
    if (unknown >= 0) {
      throw createError({ statusCode: 400, message: `Comment ${unknown + 1}, section: no section "${body.comments[unknown]!.anchor}" in ${rev.code}`, data: { fields: { [`comments.${unknown}.anchor`]: 'No such section in this revision' } } })
    }
    if (body.decision !== 'comment' && status.status !== 'issued') {
      throw createError({ statusCode: 409, message: `${sheet!.reference} ${rev.code} is ${status.label.toLowerCase()}: it is no longer open for a decision` })
    }
    if (body.decision !== 'comment' && rev.authorId === user.id) {
      throw createError({ statusCode: 403, message: `You authored ${sheet!.reference} ${rev.code}: a revision must be ${body.decision === 'approve' ? 'approved' : 'returned'} by someone other than its author` })
    }
    let contractCode: string | null = null
    if (body.decision === 'approve') {
      const [{ n }] = await tx.select({ n: count() }).from(tables.reviews).where(and(eq(tables.reviews.sheetId, rev.sheetId), isNotNull(tables.reviews.contractCode)))
      contractCode = revisionCode('C', n + 1)
    }
    // the approval freezes the office details in force, so every later print of it has the same title block
    const officeVersion = body.decision === 'approve' ? await officeVersionInForce(tx) : null
    const fields = { revisionId: rev.id, sheetId: rev.sheetId, decision: body.decision, contractCode, comments: plainJson(body.comments), reviewerId: user.id, createdAt: new Date(), officeVersion }
    const contentHash = reviewHash(fields)
    const [{ id }] = await tx.insert(tables.reviews).values({ ...fields, contentHash }).$returningId()
    await logWrittenRow(tx, 'review', id, { hash: contentHash, of: reviewHash })
    const subject = `${project!.jobNumber}/${sheet!.reference} ${rev.code}`
    const action = body.decision === 'approve' ? 'revision.approved' : body.decision === 'return' ? 'revision.returned' : 'revision.commented'
    await recordAudit(event, { action, subject, actorId: user.id, detail: { revisionId: rev.id, reviewId: id, contractCode, comments: body.comments.length } }, tx)

    const link = `${getRequestURL(event).origin}/revisions/${rev.id}`
    const [author] = await tx.select({ email: tables.users.email }).from(tables.users).where(eq(tables.users.id, rev.authorId))
    const sectionTitles = new Map((rev.sections as Array<{ id: string, title: string }>).map(x => [x.id, x.title]))
    const commentText = quotedComments(body.comments, anchor => sectionTitles.get(anchor) ?? anchor)
    if (body.decision === 'return') {
      await enqueueMail(tx, { kind: action, to: [author?.email ?? ''], subject: `[Tendonbook] ${sheet!.reference} ${rev.code} returned with comments - job ${project!.jobNumber}`, text: `${user.name} returned ${sheet!.reference} ${rev.code} "${sheet!.title}" with ${body.comments.length === 1 ? 'this comment' : `these ${body.comments.length} comments`}:\n\n${commentText}\n\nOpen it: ${link}\n` })
    }
    if (body.decision === 'approve') {
      const text = `${user.name} approved ${sheet!.reference} ${rev.code} "${sheet!.title}" as ${contractCode}.\n${commentText ? `\n${commentText}\n` : ''}\nOpen it: ${link}\n`
      await enqueueMail(tx, { kind: action, to: [author?.email ?? ''], subject: `[Tendonbook] ${sheet!.reference} ${rev.code} approved as ${contractCode} - job ${project!.jobNumber}`, text })
      await enqueueMail(tx, { kind: 'revision.ready-to-seal', to: await membersWithRole(tx, project!.id, 'records'), subject: `[Tendonbook] ${sheet!.reference} ${contractCode} approved, ready to seal - job ${project!.jobNumber}`, text: `${sheet!.reference} ${rev.code} was approved as ${contractCode} by ${user.name} and can be sealed.\n\nOpen it: ${link}\n` })
    }
  }, { isolationLevel: 'read committed' })
  return getRevisionDetail(revisionId, user)
}
