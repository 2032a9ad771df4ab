import { z } from 'zod'
import { textField } from './text'

/** A comment is the `index`-th comment (from 0) of the review `reviewId`. */
export const commentRef = z.object({
  reviewId: z.number({ message: 'Comment: the review is missing' }).int().positive('Comment: the review is missing'),
  index: z.number({ message: 'Comment: which comment is missing' }).int().min(0, 'Comment: comments count from the first'),
})

/** The checker closes a comment, or opens it again. One schema for the button and the route. */
export const commentStateSchema = z.object({
  index: z.number({ message: 'choose which comment' }).int('choose which comment').min(0, 'choose which comment'),
  state: z.enum(['open', 'closed'], { message: 'open or closed' }),
})

export const COMMENT_STATE_LABELS = { index: 'Comment', state: 'Comment state' }

export type CommentStateBody = z.infer<typeof commentStateSchema>

/**
 * The engineer's reply to one comment of the checker's, sent with the next issue of the sheet. The
 * one shape of a reply everywhere: the editor sends it, the issue route checks it, the revision
 * freezes it in its `replies` column (with the comment it answers quoted, see FrozenReply), and
 * the review pages read it back with this schema to show it under the comment it answers.
 */
export const commentReply = commentRef.extend({
  text: textField('Reply').trim().min(1, 'Reply: write the reply or leave the comment without one').max(4000, 'Reply: at most 4000 characters'),
})

export type CommentReply = z.infer<typeof commentReply>

/** A reply as frozen with the revision: the comment it answers is quoted, so the record reads on its own. */
export interface FrozenReply extends CommentReply {
  /** the section the comment is about ('' for the whole revision) */
  anchor: string
  commentText: string
}
