import { z } from 'zod'
import { commentReply } from './review'
import { textField } from './text'

/**
 * Issue revision: one schema for the Issue dialog and the route. A reason is required when checks
 * fail; only the server knows that for sure (it reruns the design), so it checks it there.
 */
export const issueRevisionSchema = z.object({
  note: textField('Note for the checker').trim().max(500, 'The note is at most 500 characters').default(''),
  failingChecksReason: textField('Reason for issuing with failing checks').trim().max(2000, 'The reason is at most 2000 characters').default(''),
  replies: z.array(commentReply).max(200, 'At most 200 replies at once').default([]),
  // the draft the engineer is looking at: a newer one saved meanwhile must not be frozen unseen
  draftVersion: z.number({ message: 'Reload the sheet: the issue must name the draft version on your screen' }).int().positive('Reload the sheet: the issue must name the draft version on your screen'),
})

export type IssueRevisionBody = z.infer<typeof issueRevisionSchema>
export type { CommentReply } from './review'

/** Field labels of the Issue dialog, for messages in people's words. */
export const ISSUE_FIELD_LABELS: Record<string, string> = {
  note: 'Note for the checker',
  failingChecksReason: 'Reason for issuing with failing checks',
  replies: 'Replies to the comments',
  'replies.*': 'Reply {n}',
  'replies.*.text': 'Reply {n}',
  'replies.*.reviewId': 'Reply {n}',
  'replies.*.index': 'Reply {n}',
  draftVersion: 'Draft version',
}
