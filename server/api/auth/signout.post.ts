/** Signs out here: the session ends on the server, so its cookie is worthless even if kept. */
export default defineEventHandler(async (event) => {
  await endSession(event)
  return { ok: true }
})
