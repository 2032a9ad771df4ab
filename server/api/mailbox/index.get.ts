/** Dev-only: the messages the local SMTP peer received. Absent (404) unless runtimeConfig.public.devMailbox. */
export default defineEventHandler(async (event) => {
  const config = useRuntimeConfig()
  if (String(config.public.devMailbox) !== 'true' || !config.mailboxDir) throw createError({ statusCode: 404, message: 'No such page' })
  await requireUser(event)
  return { messages: await readMailbox(config.mailboxDir), outbox: await outboxSummary() }
})
