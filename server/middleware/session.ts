/**
 * Sealed cookies cannot be revoked by themselves: every request checks that the session the cookie
 * names is still open on the server (signing out closes it) and that its session version is the
 * user's (disabling a user, a role change or "sign out everywhere" bumps it), so each takes effect at once.
 * Also refuses cross-site state changes (a mutating request whose Origin is another site).
 */
export default defineEventHandler(async (event) => {
  const path = event.path
  if (!path.startsWith('/api/') && !path.startsWith('/files/') && !path.startsWith('/print/')) return

  const method = event.method
  if (method !== 'GET' && method !== 'HEAD') {
    const origin = getRequestHeader(event, 'origin')
    const host = getRequestHeader(event, 'host')
    if (origin && host && new URL(origin).host !== host) {
      throw createError({ statusCode: 403, message: 'Cross-site request refused' })
    }
  }

  const session = await getUserSession(event)
  if (!session.user) return
  const { user, disabled } = await sessionHolder(session.user.id, session.sv, session.secure?.sid)
  if (!user) {
    await clearUserSession(event)
    if (path.startsWith('/api/auth/signin') || path.startsWith('/api/auth/signout')) return
    throw createError({ statusCode: 401, message: disabled ? 'Your account is disabled' : 'Your session has ended: sign in again' })
  }
  event.context.currentUser = { id: user.id, email: user.email, name: user.name, role: user.role }
})

declare module 'h3' {
  interface H3EventContext {
    currentUser?: { id: number, email: string, name: string, role: import('../../shared/types/roles').Role }
  }
}
