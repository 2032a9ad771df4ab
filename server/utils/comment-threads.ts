// A sheet's comments as threads: each checker's comment with the engineer's replies (issued with a
// later revision) and its state — open, answered (a reply and not closed), closed (the checker's
// newest state row says so). Pure, so unit tests can drive it with any history.
import { commentReply, type CommentReply } from '../../shared/schemas/review'

export type ThreadState = 'open' | 'answered' | 'closed'

export interface ThreadReview {
  id: number
  revisionId: number
  revisionCode: string
  decision: string
  comments: unknown
  reviewerName: string
  createdAt: Date | string
}

export interface ThreadStateRow {
  reviewId: number
  commentIndex: number
  state: 'open' | 'closed'
  actorName: string
  createdAt: Date | string
}

export interface ThreadReplySource {
  revisionCode: string
  authorName: string
  issuedAt: Date | string
  /** whatever the revision row carries as `replies`; read with the shared reply schema */
  replies: unknown
}

export interface CommentThread {
  reviewId: number
  index: number
  revisionId: number
  revisionCode: string
  decision: string
  anchor: string
  /** the section's title in the revision commented on, '' for the whole revision */
  section: string
  text: string
  reviewerName: string
  createdAt: Date | string
  replies: Array<{ text: string, authorName: string, revisionCode: string, at: Date | string }>
  state: ThreadState
  closedBy: { name: string, at: Date | string } | null
}

/** The replies a revision row carries, each checked against the shared schema; anything else is not a reply. */
export function repliesIn(value: unknown): CommentReply[] {
  let list = value
  if (typeof value === 'string') {
    try {
      list = JSON.parse(value)
    }
    catch {
      return []
    }
  }
  if (!Array.isArray(list)) return []
  return list.flatMap((r) => {
    const parsed = commentReply.safeParse(r)
    return parsed.success ? [parsed.data] : []
  })
}

export function commentThreads(
  reviews: readonly ThreadReview[],
  sectionTitles: (revisionId: number, anchor: string) => string,
  states: readonly ThreadStateRow[],
  replySources: readonly ThreadReplySource[],
): CommentThread[] {
  const out: CommentThread[] = []
  for (const review of reviews) {
    const comments = Array.isArray(review.comments) ? review.comments as Array<{ anchor?: string, text?: string }> : []
    comments.forEach((c, index) => {
      const replies = replySources.flatMap(source => repliesIn(source.replies)
        .filter(r => r.reviewId === review.id && r.index === index)
        .map(r => ({ text: r.text, authorName: source.authorName, revisionCode: source.revisionCode, at: source.issuedAt })))
      const newest = states.filter(s => s.reviewId === review.id && s.commentIndex === index).at(-1)
      const closed = newest?.state === 'closed'
      out.push({
        reviewId: review.id,
        index,
        revisionId: review.revisionId,
        revisionCode: review.revisionCode,
        decision: review.decision,
        anchor: c.anchor ?? '',
        section: c.anchor ? sectionTitles(review.revisionId, c.anchor) : '',
        text: c.text ?? '',
        reviewerName: review.reviewerName,
        createdAt: review.createdAt,
        replies,
        state: closed ? 'closed' : replies.length ? 'answered' : 'open',
        closedBy: closed && newest ? { name: newest.actorName, at: newest.createdAt } : null,
      })
    })
  }
  return out
}

/**
 * Comments as an e-mail quotes them: the section in words, then the comment quoted line by line.
 *   On "Load balancing":
 *   > Justify the balanced fraction.
 */
export function quotedComments(comments: ReadonlyArray<{ anchor: string, text: string }>, sectionTitle: (anchor: string) => string): string {
  return comments.map((c) => {
    const where = c.anchor ? `On "${sectionTitle(c.anchor)}":` : 'On the whole revision:'
    return `${where}\n${c.text.split('\n').map(line => `> ${line}`).join('\n')}`
  }).join('\n\n')
}
