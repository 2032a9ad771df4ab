import { revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  setResponseStatus(event, 201)
  // sealing is idempotent per revision: a retry whose first answer was lost gets that seal
  return idempotent(event, user.id, { id }, () => sealRevision(event, id, user), () => sealRevision(event, id, user))
})
