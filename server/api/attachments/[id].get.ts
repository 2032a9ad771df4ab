import { revisionIdParams } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  const { row, bytes } = await attachmentFile(id)
  setResponseHeaders(event, {
    'content-type': row.mime,
    'content-disposition': `attachment; filename*=UTF-8''${encodeURIComponent(row.filename)}`,
    'x-content-type-options': 'nosniff',
    'content-security-policy': 'default-src \'none\'',
    'cache-control': 'private, no-store',
  })
  return Buffer.from(bytes)
})
