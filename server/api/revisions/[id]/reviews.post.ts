import { REVIEW_FIELD_LABELS, reviewBody, revisionIdParams } from '../../../utils/records-schemas'

/** A decision (return, approve) or a comment; the role on the project and the author rule are checked in the service. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  const body = await validBody(event, reviewBody, REVIEW_FIELD_LABELS)
  setResponseStatus(event, 201)
  // a retry whose first answer was lost is answered with the revision as it now stands, as the first would have been
  const answer = await idempotent(event, user.id, { id, ...body }, () => reviewRevision(event, id, body, user), () => getRevisionDetail(id, user))
  // the first render of its seal, while nobody waits for it
  if (body.decision === 'approve') numberApprovedRevision(event, id, user)
  return answer
})
