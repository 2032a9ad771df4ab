import { randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { and, eq, isNull, sql } from 'drizzle-orm'

/**
 * Server-side sessions (OWASP ASVS 5.0 7.4.1): the sealed cookie names a row of user_sessions, and
 * a request is served only while that row is open and the user's session version is the one the
 * cookie was issued with. Signing out closes the row; signing out everywhere bumps the version.
 */
export async function startSession(event: H3Event, user: { id: number, email: string, name: string, role: import('../../shared/types/roles').Role, sessionVersion: number }) {
  await endSession(event)
  const sid = randomBytes(32).toString('base64url')
  await useDb().insert(tables.userSessions).values({ id: sid, userId: user.id })
  // ASVS 7.2.4: a new session on every sign-in
  await setUserSession(event, {
    user: { id: user.id, email: user.email, name: user.name, role: user.role },
    sv: user.sessionVersion,
    secure: { sid },
    signedInAt: new Date().toISOString(),
  })
}

/** Closes this request's session on the server and clears its cookie. */
export async function endSession(event: H3Event) {
  const sid = (await getUserSession(event)).secure?.sid
  if (typeof sid === 'string') {
    await useDb().update(tables.userSessions).set({ endedAt: new Date() }).where(and(eq(tables.userSessions.id, sid), isNull(tables.userSessions.endedAt)))
  }
  await clearUserSession(event)
}

/** Signs a user out everywhere: every session they hold, on every device, ends at once. */
export async function endEverySession(userId: number) {
  await useDb().transaction(async (tx) => {
    await tx.update(tables.users).set({ sessionVersion: sql`${tables.users.sessionVersion} + 1` }).where(eq(tables.users.id, userId))
    await tx.update(tables.userSessions).set({ endedAt: new Date() }).where(and(eq(tables.userSessions.userId, userId), isNull(tables.userSessions.endedAt)))
  })
}

/** The user a session cookie still stands for, or why it no longer does. */
export async function sessionHolder(userId: number, sv: unknown, sid: unknown) {
  const u = tables.users
  const s = tables.userSessions
  const [row] = await useDb().select({ user: u, sessionId: s.id, endedAt: s.endedAt }).from(u)
    .leftJoin(s, and(eq(s.id, typeof sid === 'string' ? sid : ''), eq(s.userId, u.id)))
    .where(eq(u.id, userId)).limit(1)
  if (!row || row.user.disabled) return { user: null, disabled: row?.user.disabled ?? false }
  const open = row.sessionId !== null && row.endedAt === null && row.user.sessionVersion === sv
  return { user: open ? row.user : null, disabled: false }
}
