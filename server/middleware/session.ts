import type { H3Event } from 'h3'

/**
 * Sealed cookies cannot be revoked by themselves: every request checks that the session the cookie
 * names is still open on the server (signing out closes it) and that its session version is the
 * user's (disabling a user, a role change or "sign out everywhere" bumps it), so each takes effect at once.
 * Also refuses cross-site state changes (a mutating request whose Origin is another site).
 */
export default defineEventHandler(async (event) => {
  if (event.method !== 'GET' && event.method !== 'HEAD' && event.method !== 'OPTIONS') refuseCrossSite(event)
  const path = event.path
  if (!path.startsWith('/api/') && !path.startsWith('/files/') && !path.startsWith('/print/')) return

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

/**
 * A state change must come from this site's own pages: browsers send Origin with every POST, PUT,
 * PATCH and DELETE, so a missing, unreadable or foreign Origin is refused (403), never guessed at.
 */
function refuseCrossSite(event: H3Event) {
  const origin = getRequestHeader(event, 'origin')
  const host = getRequestHeader(event, 'host')
  const refuse = (why: string) => { throw createError({ statusCode: 403, statusMessage: 'Cross-site request refused', message: `Cross-site request refused: ${why}` }) }
  if (!origin) refuse('the request has no Origin header, so it cannot be shown to come from this site')
  let from: URL | null = null
  try {
    from = new URL(origin!)
  }
  catch {}
  if (!from || (from.protocol !== 'http:' && from.protocol !== 'https:')) refuse('its Origin header is not a web address')
  if (!host || from!.host !== host) refuse(`it comes from ${from!.origin}, not from this site`)
}

declare module 'h3' {
  interface H3EventContext {
    currentUser?: { id: number, email: string, name: string, role: import('../../shared/types/roles').Role }
  }
}
