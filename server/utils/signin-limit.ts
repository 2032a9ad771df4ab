import type { H3Event } from 'h3'
import { and, count, eq, gt, max } from 'drizzle-orm'

// OWASP ASVS 5.0 6.3.1: limit guessing per account and per address (values are common practice).
export const SIGNIN_WINDOW_MINUTES = 15
export const MAX_FAILURES_PER_ACCOUNT = 5
export const MAX_FAILURES_PER_ADDRESS = 20

async function failuresSince(column: 'email' | 'address', value: string, since: Date) {
  const t = tables.signinAttempts
  const [row] = await useDb()
    .select({ n: count(), last: max(t.createdAt) })
    .from(t)
    .where(and(eq(t[column], value), eq(t.success, false), gt(t.createdAt, since)))
  return { n: row?.n ?? 0, last: row?.last ?? null }
}

/** @throws 429 with the minutes to wait when the account or the address has failed too often. */
export async function assertSigninAllowed(event: H3Event, email: string, address: string) {
  const since = new Date(Date.now() - SIGNIN_WINDOW_MINUTES * 60_000)
  const checks = [
    { what: 'this account', limit: MAX_FAILURES_PER_ACCOUNT, ...(await failuresSince('email', email, since)) },
    { what: 'this network address', limit: MAX_FAILURES_PER_ADDRESS, ...(await failuresSince('address', address, since)) },
  ]
  for (const check of checks) {
    if (check.n >= check.limit) {
      const last = check.last ? new Date(check.last).getTime() : Date.now()
      const minutes = Math.max(1, Math.ceil((last + SIGNIN_WINDOW_MINUTES * 60_000 - Date.now()) / 60_000))
      setResponseHeader(event, 'Retry-After', String(minutes * 60))
      throw createError({
        statusCode: 429,
        message: `Too many failed sign-in attempts for ${check.what}. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      })
    }
  }
}

export async function recordSigninAttempt(email: string, address: string, success: boolean) {
  await useDb().insert(tables.signinAttempts).values({ email, address, success })
}
