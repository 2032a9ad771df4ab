import { z } from 'zod'
import { textField } from '../../shared/schemas/text'
import { recordId } from '../../shared/schemas/record-id'

/** A record's numeric id in the path (a revision, a review, a version of the office details). */
export const idParams = z.object({
  id: recordId('id must be a positive whole number'),
})

export const revisionIdParams = idParams

// the Issue dialog and this route share one schema
export { issueRevisionSchema as issueBody } from '../../shared/schemas/issue'

export const reviewBody = z.object({
  decision: z.enum(['comment', 'return', 'approve'], { message: 'decision is one of comment, return, approve' }),
  comments: z.array(z.object({
    anchor: textField('Section').max(120, 'Section is at most 120 characters').default(''),
    text: textField('Comment').trim().min(1, 'Write the comment').max(4000, 'A comment is at most 4000 characters'),
  })).max(100, 'At most 100 comments at once').default([]),
}).refine(b => b.decision === 'approve' || b.comments.length > 0, { path: ['comments'], message: 'Add at least one comment' })

export type ReviewBody = z.infer<typeof reviewBody>

export const diffQuery = z.object({
  against: recordId('against must be a revision id').optional(),
})

export const archiveQuery = z.object({
  project: recordId('project must be a project id').optional(),
  from: z.iso.date({ message: 'from is a date like 2026-01-31' }).optional(),
  to: z.iso.date({ message: 'to is a date like 2026-01-31' }).optional(),
  status: z.enum(['current', 'superseded', 'all']).default('all'),
  q: textField('Search').trim().max(100, 'Search is at most 100 characters').optional(),
})

export type ArchiveQuery = z.infer<typeof archiveQuery>

export const verifyQueryBody = z.object({
  query: textField('Hash or reference').trim().min(1, 'Paste a hash or a verification reference').max(200),
})
