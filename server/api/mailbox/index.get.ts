/**
 * Dev-only: the messages the local SMTP peer received for the signed-in user. Absent (404) unless
 * runtimeConfig.public.devMailbox, which only the demo (scripts/start.mjs) and the test servers set.
 */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const config = useRuntimeConfig()
  if (String(config.public.devMailbox) !== 'true' || !config.mailboxDir) throw createError({ statusCode: 404, message: 'No such page' })
  return { messages: await readMailbox(config.mailboxDir, 100, user.email) }
})
