import { sql } from 'drizzle-orm'

/** For the load balancer: 503 while the database does not answer, so no traffic is sent here. */
export default defineEventHandler(async () => {
  try {
    await useDb().execute(sql`SELECT 1`)
  }
  catch {
    throw createError({ statusCode: 503, message: 'The database is not answering' })
  }
  return { ok: true }
})
