import { revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await requireRole(event, 'records', 'admin')
  setResponseStatus(event, 201)
  return idempotent(event, user.id, { id }, () => sealRevision(event, id, user))
})
