import { z } from 'zod'

/** A comment is the `index`-th comment of the review `reviewId`. */
export const commentRef = z.object({
  reviewId: z.number({ message: 'reviewId must be a number' }).int().positive('reviewId must be a positive whole number'),
  index: z.number({ message: 'index must be a number' }).int().min(0, 'index counts from 0'),
})

/** The checker closes a comment, or opens it again. One schema for the button and the route. */
export const commentStateSchema = z.object({
  index: z.number({ message: 'index must be a number' }).int().min(0, 'index counts from 0'),
  state: z.enum(['open', 'closed'], { message: 'state is open or closed' }),
})

export type CommentStateBody = z.infer<typeof commentStateSchema>

/**
 * The engineer's reply to a comment, issued with the next revision. A revision row that carries a
 * `replies` list in this shape has its replies shown under the comments they answer.
 */
export const commentReply = commentRef.extend({
  text: z.string().trim().min(1, 'Write the reply').max(4000, 'A reply is at most 4000 characters'),
})

export type CommentReply = z.infer<typeof commentReply>
