import type { H3Event } from 'h3'
import type { Role } from '../../shared/types/roles'

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

/**
 * Role guard for every route that reads protected data or changes anything.
 * @throws 401 when not signed in, 403 when the user's role may not do this.
 */
export async function requireRole(event: H3Event, ...roles: Role[]) {
  const user = await requireUser(event)
  if (roles.length > 0 && !roles.includes(user.role)) {
    throw createError({ statusCode: 403, message: `This needs the ${roles.join(' or ')} role; you are signed in as ${user.role}` })
  }
  return user
}

export function clientAddress(event: H3Event) {
  return getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'
}
