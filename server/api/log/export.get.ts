/** "Export head": the signed head, the public key and the proofs of every sealed document, as JSON. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const file = await exportHead(user.id)
  setResponseHeaders(event, {
    'content-type': 'application/json; charset=utf-8',
    'content-disposition': `attachment; filename="tendonbook-head-${file.head.treeSize}.json"`,
  })
  return file
})
