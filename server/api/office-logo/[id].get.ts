import { idParams } from '../../utils/records-schemas'

/** The logo of one version of the office details, checked against its hash. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParams)
  await authorize(event)
  const { mime, bytes } = await officeLogo(id)
  setResponseHeaders(event, { 'content-type': mime, 'x-content-type-options': 'nosniff', 'cache-control': 'private, max-age=3600' })
  return Buffer.from(bytes)
})
