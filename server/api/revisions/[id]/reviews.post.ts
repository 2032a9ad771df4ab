import { reviewBody, revisionIdParams } from '../../../utils/records-schemas'

/** A decision (return, approve) or a comment; the role on the project and the author rule are checked in the service. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  const body = await validBody(event, reviewBody)
  setResponseStatus(event, 201)
  return idempotent(event, user.id, { id, ...body }, () => reviewRevision(event, id, body, user))
})
