import { VERIFY_FIELD_LABELS, verifyQueryBody } from '../../utils/records-schemas'

/** Either a multipart upload (field `file`) or JSON `{ query }` with a hash or reference. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const multipart = (getRequestHeader(event, 'content-type') ?? '').startsWith('multipart/form-data')
  if (!multipart) {
    const { query } = await validBody(event, verifyQueryBody, VERIFY_FIELD_LABELS)
    return verifyText(event, query, user)
  }
  if (Number(getRequestHeader(event, 'content-length') ?? 0) > 60 * 1024 * 1024) throw createError({ statusCode: 413, message: 'File: larger than 60 MB' })
  const part = (await readMultipartFormData(event))?.find(p => p.name === 'file')
  if (!part || part.data.length === 0) throw createError({ statusCode: 400, message: 'File: choose a PDF to verify', data: { fields: { file: 'Choose a file' } } })
  return verifyUpload(event, new Uint8Array(part.data), user)
})
