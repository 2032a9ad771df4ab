import { revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  return getRevisionDetail(id, user)
})
