import { eq } from 'drizzle-orm'

/**
 * Sealed cookies cannot be revoked by themselves: compare the cookie's session version with the
 * user's row on every request, so disabling a user or changing a role takes effect at once.
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
  const [row] = await useDb().select().from(tables.users).where(eq(tables.users.id, session.user.id)).limit(1)
  if (!row || row.disabled || row.sessionVersion !== session.sv) {
    await clearUserSession(event)
    if (path.startsWith('/api/auth/signin')) return
    throw createError({ statusCode: 401, message: row?.disabled ? 'Your account is disabled' : 'Your session has ended: sign in again' })
  }
  event.context.currentUser = { id: row.id, email: row.email, name: row.name, role: row.role }
})

declare module 'h3' {
  interface H3EventContext {
    currentUser?: { id: number, email: string, name: string, role: import('../../shared/types/roles').Role }
  }
}
