import { AsyncLocalStorage } from 'node:async_hooks'
import type { H3Event } from 'h3'
import { and, eq, isNull } from 'drizzle-orm'
import { canonicalJson, sha256Hex } from '../../shared/log/canonical'
import type { Tx } from './audit'

const KEY = /^[\x21-\x7E]{8,100}$/

/** `status_code` of a key whose work committed before its answer was stored (the connection dropped between). */
const DONE_ANSWER_LOST = 0

/** The key of the request being run, for the transaction that does its work to mark it done in the same commit. */
const running = new AsyncLocalStorage<{ userId: number, key: string }>()

/**
 * Marks the running request's key as done, inside the transaction of its work: the mark and the work
 * commit together, with what the transaction gave back (`outcome`), from which a retry is answered
 * when the answer itself was lost.
 */
export async function markIdempotentWorkDone(tx: Tx, outcome: unknown) {
  const current = running.getStore()
  if (!current) return
  const t = tables.idempotencyKeys
  const response = outcome === undefined ? null : JSON.parse(JSON.stringify(outcome))
  await tx.update(t).set({ statusCode: DONE_ANSWER_LOST, response }).where(and(eq(t.userId, current.userId), eq(t.idempotencyKey, current.key)))
}

/** A statement outside any transaction that only sets values: safe to send again when the connection dropped. */
async function again<T>(statement: () => Promise<T>, attempts = 3): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await statement()
    }
    catch (error) {
      if (attempt >= attempts || !isConnectionLost(error)) throw error
      await new Promise(r => setTimeout(r, 100 * attempt))
    }
  }
}

function duplicate(error: unknown) {
  const e = error as { code?: string, cause?: { code?: string } }
  return e.code === 'ER_DUP_ENTRY' || e.cause?.code === 'ER_DUP_ENTRY'
}

/**
 * Runs a state-changing request once per `Idempotency-Key` (header, per user): the first result is
 * stored with the user and the route, and a retry with the same key gets it back instead of acting
 * again. Without the header the request simply runs.
 * The work's own transaction marks the key done in its commit, so a connection lost after that
 * commit never lets a retry do the work twice: the retry is answered by `answerAgain` from what that
 * transaction gave back (by default, that itself is the answer).
 * @throws 400 for a malformed key, 422 when the key was used for another request, 409 while the
 * first request with the key is still running.
 */
export async function idempotent<T>(event: H3Event, userId: number, body: unknown, work: () => Promise<T>, answerAgain: (outcome: unknown) => Promise<T> = async outcome => outcome as T): Promise<T> {
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
    if (!duplicate(error)) {
      // a connection lost on the insert may have stored the key all the same: with no work done, it must not hold up the retry
      if (isConnectionLost(error)) await again(() => useDb().delete(t).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key), isNull(t.statusCode)))).catch(() => {})
      throw error
    }
    const [first] = await useDb().select().from(t).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key)))
    if (!first || first.requestHash !== requestHash) {
      throw createError({ statusCode: 422, message: `This Idempotency-Key was already used for another request${first && first.route !== route ? ` (${first.route})` : ' with different content'}; use a new key for a new action` })
    }
    if (first.statusCode === null) throw createError({ statusCode: 409, message: 'The first request with this Idempotency-Key is still being processed; try again in a moment' })
    if (first.statusCode === DONE_ANSWER_LOST) return answerLost(event, userId, key, first.response, answerAgain)
    setResponseStatus(event, first.statusCode)
    setResponseHeader(event, 'idempotent-replayed', 'true')
    return storedJson(first.response) as T
  }
  let result: T
  try {
    result = await running.run({ userId, key }, work)
  }
  catch (error) {
    // unless its work committed (then the key is marked done), nothing was done: the same key may try again
    await again(() => useDb().delete(t).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key), isNull(t.statusCode))))
    throw error
  }
  await storeAnswer(event, userId, key, result)
  return result
}

/** A retry of a request whose work committed but whose answer was lost: answered now, and that answer kept for any further retry. */
async function answerLost<T>(event: H3Event, userId: number, key: string, outcome: unknown, answerAgain: (outcome: unknown) => Promise<T>): Promise<T> {
  const result = await answerAgain(storedJson(outcome))
  if (result === null || result === undefined) {
    throw createError({ statusCode: 409, message: 'Your first request with this Idempotency-Key was saved, but its answer was lost on the way: reload the page to see the result (nothing was done twice)' })
  }
  await storeAnswer(event, userId, key, result)
  setResponseHeader(event, 'idempotent-replayed', 'true')
  return result
}

/** The answer a key gives every later retry, with the status it was given under. */
async function storeAnswer(event: H3Event, userId: number, key: string, result: unknown) {
  const t = tables.idempotencyKeys
  await again(() => useDb().update(t).set({ statusCode: getResponseStatus(event), response: JSON.parse(JSON.stringify(result)) }).where(and(eq(t.userId, userId), eq(t.idempotencyKey, key))))
}

/** A JSON column as the driver gives it back: parsed already, or (MariaDB's JSON is LONGTEXT) as its text. */
function storedJson(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value
}
