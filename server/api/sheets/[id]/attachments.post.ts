import { revisionIdParams } from '../../../utils/records-schemas'

/** Multipart upload, field `file`: PDF, PNG or JPEG by content, size-limited. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  setResponseStatus(event, 201)
  return uploadAttachment(event, id, user)
})
