import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import { canonicalJson, sha256Hex } from '../../shared/log/canonical'

const KEY = /^[\x21-\x7E]{8,100}$/

function duplicate(error: unknown) {
  const e = error as { code?: string, cause?: { code?: string } }
  return e.code === 'ER_DUP_ENTRY' || e.cause?.code === 'ER_DUP_ENTRY'
}

/**
 * Runs a state-changing request once per `Idempotency-Key` (header, per user): the first result is
 * stored with the user and the route, and a retry with the same key gets it back instead of acting
 * again. Without the header the request simply runs.
 * @throws 400 for a malformed key, 422 when the key was used for another request, 409 while the
 * first request with the key is still running.
 */
export async function idempotent<T>(event: H3Event, userId: number, body: unknown, work: () => Promise<T>): Promise<T> {
  const key = getRequestHeader(event, 'idempotency-key')
  if (key === undefined) return work()
  if (!KEY.test(key)) throw createError({ statusCode: 400, message: 'Idempotency-Key: 8 to 100 visible characters, one new key per action' })
  const route = `${event.method} ${getRequestURL(event).pathname}`
  const requestHash = sha256Hex(canonicalJson({ route, body: body ?? null }))
  const t = tables.idempotencyKeys
  try {
    await useDb().insert(t).values({ userId, idempotencyKey: key, route, requestHash })
  }
  catch (error) {
    if (!duplicate(error)) throw error
    const [first] = await useDb().select().from(t).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key)))
    if (!first || first.requestHash !== requestHash) {
      throw createError({ statusCode: 422, message: `This Idempotency-Key was already used for another request${first && first.route !== route ? ` (${first.route})` : ' with different content'}; use a new key for a new action` })
    }
    if (first.statusCode === null) throw createError({ statusCode: 409, message: 'The first request with this Idempotency-Key is still being processed; try again in a moment' })
    setResponseStatus(event, first.statusCode)
    setResponseHeader(event, 'idempotent-replayed', 'true')
    return (typeof first.response === 'string' ? JSON.parse(first.response) : first.response) as T
  }
  let result: T
  try {
    result = await work()
  }
  catch (error) {
    // nothing was done: the same key may try again
    await useDb().delete(t).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key)))
    throw error
  }
  await useDb().update(t).set({ statusCode: getResponseStatus(event), response: JSON.parse(JSON.stringify(result)) }).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key)))
  return result
}
