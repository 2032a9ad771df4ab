import { revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  setResponseStatus(event, 201)
  return idempotent(event, user.id, { id }, () => sealRevision(event, id, user))
})
