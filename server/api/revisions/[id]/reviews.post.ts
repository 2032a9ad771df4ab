import { reviewBody, revisionIdParams } from '../../../utils/records-schemas'

/** A decision (return, approve) or a comment; the role and the author rule are checked in the service. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const body = await validBody(event, reviewBody)
  const user = await requireRole(event, 'engineer', 'checker', 'admin')
  setResponseStatus(event, 201)
  return idempotent(event, user.id, { id, ...body }, () => reviewRevision(event, id, body, user))
})
