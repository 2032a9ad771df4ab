import type { H3Event } from 'h3'

/**
 * The signed-in user, fresh from the database for this request (set by server/middleware/session.ts).
 * @throws 401 when nobody is signed in or the session was revoked.
 */
export async function requireUser(event: H3Event) {
  await requireUserSession(event, { message: 'Sign in to continue' })
  const user = event.context.currentUser
  if (!user) throw createError({ statusCode: 401, message: 'Your session has ended: sign in again' })
  return user
}

export function clientAddress(event: H3Event) {
  return getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'
}
