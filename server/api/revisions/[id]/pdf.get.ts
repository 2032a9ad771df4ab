import { revisionIdParams } from '../../../utils/records-schemas'

/** The sealed PDF, checked against its recorded hash before it is sent. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  const { seal, bytes } = await sealedPdf(id)
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-disposition': `attachment; filename="${seal.archiveRef}.pdf"`,
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, no-store',
  })
  return Buffer.from(bytes)
})
