/** A new version of the office details (multipart: name, logo=keep|remove, logoFile); the role first, so no upload is read for nobody. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  setResponseStatus(event, 201)
  return saveOfficeDetails(event, user)
})
