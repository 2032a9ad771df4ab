import { z } from 'zod'
import { textField } from '../../shared/schemas/text'
import { recordId } from '../../shared/schemas/record-id'

/** A record's numeric id in the path (a revision, a review, a version of the office details). */
export const idParams = z.object({
  id: recordId('must be a positive whole number'),
})

export const revisionIdParams = idParams

// the Issue dialog and this route share one schema
export { issueRevisionSchema as issueBody } from '../../shared/schemas/issue'

export const reviewBody = z.object({
  decision: z.enum(['comment', 'return', 'approve'], { message: 'choose comment, return or approve' }),
  comments: z.array(z.object({
    anchor: textField('Section').max(120, 'Section is at most 120 characters').default(''),
    text: textField('Comment').trim().min(1, 'Write the comment').max(4000, 'A comment is at most 4000 characters'),
  })).max(100, 'At most 100 comments at once').default([]),
}).refine(b => b.decision === 'approve' || b.comments.length > 0, { path: ['comments'], message: 'Add at least one comment' })

export const REVIEW_FIELD_LABELS = { decision: 'Decision', comments: 'Comments', 'comments.*': 'Comment {n}', 'comments.*.anchor': 'Comment {n}, section', 'comments.*.text': 'Comment {n}' }

export type ReviewBody = z.infer<typeof reviewBody>

export const diffQuery = z.object({
  against: recordId('choose a revision of this sheet').optional(),
})

export const DIFF_QUERY_LABELS = { against: 'Compared with' }

export const archiveQuery = z.object({
  project: recordId('choose a project').optional(),
  from: z.iso.date({ message: 'a date like 2026-01-31' }).optional(),
  to: z.iso.date({ message: 'a date like 2026-01-31' }).optional(),
  status: z.enum(['current', 'superseded', 'all'], { message: 'current, superseded or all' }).default('all'),
  q: textField('Search').trim().max(100, 'Search is at most 100 characters').optional(),
  page: recordId('a page number: 1, 2, 3…').optional(),
  per: z.preprocess(value => (typeof value === 'string' && /^[0-9]{1,4}$/.test(value) ? Number(value) : value), z.number({ message: 'a whole number from 1 to 200' }).int('a whole number from 1 to 200').min(1, 'a whole number from 1 to 200').max(200, 'at most 200 a page')).optional(),
})

export const ARCHIVE_QUERY_LABELS = { project: 'Project', from: 'Sealed from', to: 'Sealed to', status: 'Status', q: 'Search', page: 'Page', per: 'Documents per page' }

export type ArchiveQuery = z.infer<typeof archiveQuery>

export const verifyQueryBody = z.object({
  query: textField('Hash or reference').trim().min(1, 'Paste a hash or a verification reference').max(200, 'A hash or reference is at most 200 characters'),
})

export const VERIFY_FIELD_LABELS = { query: 'Hash or reference' }
