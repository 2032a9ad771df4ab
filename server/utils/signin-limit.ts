import type { H3Event } from 'h3'
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible'

// OWASP ASVS 5.0 6.3.1: limit guessing per account and per address (values are common practice).
export const SIGNIN_WINDOW_MINUTES = 15
export const MAX_FAILURES_PER_ACCOUNT = 5
export const MAX_FAILURES_PER_ADDRESS = 20

let limiters: { account: RateLimiterMySQL, address: RateLimiterMySQL } | undefined

/**
 * Counters in MariaDB (table signin_limits, made by a migration: the app user may not create
 * tables), shared by every app instance. Each attempt is counted BEFORE its password is checked,
 * in one INSERT … ON DUPLICATE KEY UPDATE inside a transaction, so concurrent attempts each see
 * their own count and no more than the limit ever reach the password check.
 */
function signinLimiters() {
  if (!limiters) {
    const options = {
      storeClient: usePool().pool,
      storeType: 'pool',
      dbName: useRuntimeConfig().database.name,
      tableName: 'signin_limits',
      tableCreated: true,
      clearExpiredByTimeout: true,
      duration: SIGNIN_WINDOW_MINUTES * 60,
    }
    limiters = {
      // per account AND address: a stranger elsewhere cannot lock the owner out
      account: new RateLimiterMySQL({ ...options, keyPrefix: 'account', points: MAX_FAILURES_PER_ACCOUNT }),
      address: new RateLimiterMySQL({ ...options, keyPrefix: 'address', points: MAX_FAILURES_PER_ADDRESS }),
    }
  }
  return limiters
}

const keys = (email: string, address: string) => ({ account: `${email}|${address}`, address })

async function refusal(attempt: Promise<unknown>) {
  try {
    await attempt
    return null
  }
  catch (error) {
    if (error instanceof RateLimiterRes) return error
    throw error
  }
}

/**
 * Counts this attempt against the account (from this address), then, if it may go on, against the
 * address: only attempts that will reach the password check use up the address's allowance.
 * @throws 429 with the minutes to wait when either has had too many attempts.
 */
export async function countSigninAttempt(event: H3Event, email: string, address: string) {
  const limiter = signinLimiters()
  const key = keys(email, address)
  for (const [what, refused] of [['this account', () => refusal(limiter.account.consume(key.account))], ['this network address', () => refusal(limiter.address.consume(key.address))]] as const) {
    const over = await refused()
    if (over) {
      const minutes = Math.max(1, Math.ceil(over.msBeforeNext / 60_000))
      setResponseHeader(event, 'Retry-After', String(minutes * 60))
      throw createError({
        statusCode: 429,
        message: `Too many failed sign-in attempts for ${what}. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      })
    }
  }
}

/** A successful sign-in: the account starts afresh and the address gets its attempt back. */
export async function signinSucceeded(email: string, address: string) {
  const { account, address: byAddress } = signinLimiters()
  const key = keys(email, address)
  await Promise.all([account.delete(key.account), byAddress.reward(key.address, 1)])
}
