import { issueBody, revisionIdParams } from '../../../utils/records-schemas'

/** Issue revision: the server recomputes and freezes the draft the engineer is looking at. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const body = await validBody(event, issueBody)
  const user = await requireRole(event, 'engineer', 'admin')
  setResponseStatus(event, 201)
  return idempotent(event, user.id, { id, ...body }, () => issueRevision(event, id, body, user))
})
