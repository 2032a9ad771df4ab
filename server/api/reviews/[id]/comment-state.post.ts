import { COMMENT_STATE_LABELS, commentStateSchema } from '../../../../shared/schemas/review'
import { idParams } from '../../../utils/records-schemas'

/** The checker closes one comment of a review, or opens it again. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParams)
  const user = await authorize(event, id)
  const body = await validBody(event, commentStateSchema, COMMENT_STATE_LABELS)
  setResponseStatus(event, 201)
  return setCommentState(event, id, body, user)
})
