import { commentStateSchema } from '../../../../shared/schemas/review'
import { idParams } from '../../../utils/records-schemas'

/** The checker closes one comment of a review, or opens it again. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParams)
  const body = await validBody(event, commentStateSchema)
  const user = await requireRole(event, 'checker', 'admin')
  setResponseStatus(event, 201)
  return setCommentState(event, id, body, user)
})
