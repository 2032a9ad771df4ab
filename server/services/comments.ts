import type { H3Event } from 'h3'
import { and, asc, desc, eq, lte } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import type { CommentStateBody } from '../../shared/schemas/review'
import type { Db } from '../utils/db'
import type { Tx } from '../utils/audit'
import { commentThreads, type CommentThread } from '../utils/comment-threads'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/**
 * Every comment on the sheet's revisions up to `uptoSeq`, with the engineer's replies and its state.
 * Replies travel with the revision that answers them, in the `replies` column of the revisions table
 * (FrozenReply of shared/schemas/review.ts, read back with its `commentReply` schema).
 */
export async function sheetCommentThreads(db: Db | Tx, sheetId: number, uptoSeq: number): Promise<CommentThread[]> {
  const r = tables.revisions
  const v = tables.reviews
  const reviewer = alias(tables.users, 'reviewer')
  const reviews = await db.select({ id: v.id, revisionId: v.revisionId, revisionCode: r.code, decision: v.decision, comments: v.comments, reviewerName: reviewer.name, createdAt: v.createdAt })
    .from(v).innerJoin(r, eq(r.id, v.revisionId)).innerJoin(reviewer, eq(reviewer.id, v.reviewerId))
    .where(and(eq(v.sheetId, sheetId), lte(r.seq, uptoSeq))).orderBy(asc(r.seq), asc(v.id))
  if (!reviews.some(x => Array.isArray(x.comments) && x.comments.length > 0)) return []
  const revs = await db.select({ id: r.id, sections: r.reportSections }).from(r).where(and(eq(r.sheetId, sheetId), lte(r.seq, uptoSeq)))
  const titles = new Map(revs.map(x => [x.id, new Map((x.sections as Array<{ id: string, title: string }>).map(s => [s.id, s.title]))]))
  const cs = tables.commentStates
  const actor = alias(tables.users, 'actor')
  const states = await db.select({ reviewId: cs.reviewId, commentIndex: cs.commentIndex, state: cs.state, actorName: actor.name, createdAt: cs.createdAt })
    .from(cs).innerJoin(v, eq(v.id, cs.reviewId)).innerJoin(actor, eq(actor.id, cs.actorId)).where(eq(v.sheetId, sheetId)).orderBy(asc(cs.id))
  const author = alias(tables.users, 'author')
  const replySources = await db.select({ revisionCode: r.code, authorName: author.name, issuedAt: r.issuedAt, replies: r.replies }).from(r).innerJoin(author, eq(author.id, r.authorId))
    .where(and(eq(r.sheetId, sheetId), lte(r.seq, uptoSeq))).orderBy(asc(r.seq))
  return commentThreads(reviews, (revisionId, anchor) => titles.get(revisionId)?.get(anchor) ?? anchor, states, replySources)
}

/**
 * A checker closes a comment or opens it again: a new state row with its audit event, never an update.
 * @throws 404 unknown review, 400 no such comment, 409 when the comment is already in that state.
 */
export async function setCommentState(event: H3Event, reviewId: number, body: CommentStateBody, user: SessionUser) {
  return historyTransaction(async (tx) => {
    const [review] = await tx.select({ id: tables.reviews.id, sheetId: tables.reviews.sheetId, revisionId: tables.reviews.revisionId, comments: tables.reviews.comments, code: tables.revisions.code, seq: tables.revisions.seq })
      .from(tables.reviews).innerJoin(tables.revisions, eq(tables.revisions.id, tables.reviews.revisionId)).where(eq(tables.reviews.id, reviewId))
    if (!review) throw createError({ statusCode: 404, message: `No review with id ${reviewId}` })
    // the sheet row is the lock every act on a sheet's history takes, so two closes cannot cross
    const [sheet] = await tx.select({ reference: tables.sheets.reference }).from(tables.sheets).where(eq(tables.sheets.id, review.sheetId)).for('update')
    const comments = Array.isArray(review.comments) ? review.comments : []
    if (body.index >= comments.length) {
      throw createError({ statusCode: 400, message: `Comment: the review of ${review.code} has ${comments.length} comment${comments.length === 1 ? '' : 's'}, so there is no comment ${body.index + 1}`, data: { fields: { index: 'No such comment' } } })
    }
    const cs = tables.commentStates
    const [newest] = await tx.select({ state: cs.state }).from(cs).where(and(eq(cs.reviewId, reviewId), eq(cs.commentIndex, body.index))).orderBy(desc(cs.id)).limit(1)
    const current = newest?.state ?? 'open'
    if (current === body.state) throw createError({ statusCode: 409, message: `That comment on ${sheet!.reference} ${review.code} is already ${body.state}` })
    const [{ id }] = await tx.insert(cs).values({ reviewId, commentIndex: body.index, state: body.state, actorId: user.id, createdAt: new Date() }).$returningId()
    await logWrittenRow(tx, 'comment-state', id)
    await recordAudit(event, { action: body.state === 'closed' ? 'comment.closed' : 'comment.reopened', subject: `${sheet!.reference} ${review.code}`, actorId: user.id, detail: { reviewId, index: body.index } }, tx)
    return { reviewId, index: body.index, state: body.state }
  })
}
