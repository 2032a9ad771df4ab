import { and, asc, eq, lte, sql } from 'drizzle-orm'
import type { Role } from '../../shared/types/roles'
import type { Tx } from '../utils/audit'
import { CAUTION } from '../utils/print-templates'

/** Attempts before a message is marked failed; waits grow 10 s, 20 s, 40 s… */
export const OUTBOX_MAX_ATTEMPTS = 6

export interface OutgoingMail {
  kind: string
  to: string[]
  subject: string
  text: string
}

/** Writes mail inside the caller's transaction: it is sent only if the act it tells about commits. */
export async function enqueueMail(tx: Tx, mail: OutgoingMail) {
  const to = [...new Set(mail.to.filter(Boolean))]
  if (to.length === 0) return
  await tx.insert(tables.outbox).values({ kind: mail.kind, toAddresses: to.join(','), subject: mail.subject.slice(0, 250), bodyText: withCaution(mail.text) })
}

/** Every message ends with the caution, whatever it tells about. */
export function withCaution(text: string): string {
  return `${text.trimEnd()}\n\n--\n${CAUTION}\n`
}

export async function addressesWithRole(tx: Tx, ...roles: Role[]) {
  const u = tables.users
  const rows = await tx.select({ email: u.email, role: u.role }).from(u).where(eq(u.disabled, false))
  return rows.filter(r => roles.includes(r.role)).map(r => r.email)
}

/**
 * Sends what is due. Each message is claimed first (its next attempt pushed a minute ahead), so two
 * runners (or two servers on one database) never send it twice; a failure is retried with a growing
 * wait, then marked failed.
 */
export async function deliverOutbox(limit = 20) {
  const db = useDb()
  const o = tables.outbox
  const due = await db.select().from(o).where(and(eq(o.state, 'pending'), lte(o.nextAttemptAt, new Date()))).orderBy(asc(o.id)).limit(limit)
  let sent = 0
  let failed = 0
  for (const message of due) {
    // the claim moves the next attempt past now, so a second runner's identical claim matches nothing
    const claim = await db.update(o).set({ nextAttemptAt: new Date(Date.now() + 60_000) })
      .where(and(eq(o.id, message.id), eq(o.state, 'pending'), lte(o.nextAttemptAt, new Date())))
    if ((claim as unknown as [{ affectedRows: number }])[0].affectedRows !== 1) continue
    try {
      await sendMail({ to: message.toAddresses.split(','), subject: message.subject, text: message.bodyText })
      await db.update(o).set({ state: 'sent', sentAt: new Date(), attempts: sql`${o.attempts} + 1`, lastError: '' }).where(eq(o.id, message.id))
      sent += 1
    }
    catch (error) {
      const attempts = message.attempts + 1
      const reason = error instanceof Error ? error.message : String(error)
      await db.update(o).set({
        attempts,
        state: attempts >= OUTBOX_MAX_ATTEMPTS ? 'failed' : 'pending',
        nextAttemptAt: new Date(Date.now() + 10_000 * 2 ** (attempts - 1)),
        lastError: reason.slice(0, 500),
      }).where(eq(o.id, message.id))
      failed += 1
    }
  }
  return { due: due.length, sent, failed }
}

export async function outboxSummary() {
  const o = tables.outbox
  return useDb().select({ state: o.state, count: sql<number>`count(*)` }).from(o).groupBy(o.state)
}
