/** Signs the user out on every device: all their sessions end at once, this one too. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  await endEverySession(user.id)
  await recordAudit(event, { action: 'signout.everywhere', subject: user.email, actorId: user.id })
  await clearUserSession(event)
  return { ok: true }
})
