import { and, asc, eq, inArray, lte } from 'drizzle-orm'
import type { ProjectRole } from '../../shared/types/roles'
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

/** The active members of a project who hold this role there: mail about a project goes to its members only. */
export async function membersWithRole(tx: Tx, projectId: number, role: ProjectRole) {
  const u = tables.users
  const m = tables.projectMembers
  const rows = await tx.select({ email: u.email }).from(m).innerJoin(u, eq(u.id, m.userId))
    .where(and(eq(m.projectId, projectId), eq(m.role, role), eq(u.disabled, false)))
  return rows.map(r => r.email)
}

/** How long a claim holds a message: longer than one SMTP exchange may take (server/utils/mail.ts). */
const CLAIM_MS = 60_000

/**
 * Claims up to `limit` due messages in one short transaction: `FOR UPDATE SKIP LOCKED` passes over
 * rows another runner on the same server is claiming, and the claim pushes their next attempt a
 * minute ahead before anything is sent. Under Galera row locks stay on their node, so two nodes
 * may pick the same rows: their claims then conflict at commit and the loser claims nothing.
 */
async function claimDue(limit: number) {
  const o = tables.outbox
  try {
    return await useDb().transaction(async (tx) => {
      const due = await tx.select().from(o).where(and(eq(o.state, 'pending'), lte(o.nextAttemptAt, new Date())))
        .orderBy(asc(o.id)).limit(limit).for('update', { skipLocked: true })
      if (due.length) await tx.update(o).set({ nextAttemptAt: new Date(Date.now() + CLAIM_MS) }).where(inArray(o.id, due.map(m => m.id)))
      return due
    })
  }
  catch (error) {
    if (isWriteConflict(error)) return []
    throw error
  }
}

/**
 * Sends what is due. The messages are claimed first (see `claimDue`), so two runners (or two
 * servers on one database or cluster) never send one twice; a failure is retried with a growing
 * wait, then marked failed.
 */
export async function deliverOutbox(limit = 20) {
  const db = useDb()
  const o = tables.outbox
  const due = await claimDue(limit)
  let sent = 0
  let failed = 0
  for (const message of due) {
    try {
      await sendMail({ to: message.toAddresses.split(','), subject: message.subject, text: message.bodyText })
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
      continue
    }
    await markSent(message)
    sent += 1
  }
  return { due: due.length, sent, failed }
}

/**
 * Records that a message went out. A message left unmarked would be sent again once its claim runs
 * out, so when the database connection breaks (a node going away) the mark is made again, a few
 * times, through the next database host; it sets absolute values, so making it twice is harmless.
 */
async function markSent(message: { id: number, attempts: number }) {
  const o = tables.outbox
  for (let attempt = 1; ; attempt++) {
    try {
      await useDb().update(o).set({ state: 'sent', sentAt: new Date(), attempts: message.attempts + 1, lastError: '' })
        .where(and(eq(o.id, message.id), eq(o.state, 'pending')))
      return
    }
    catch (error) {
      if (attempt >= 5 || !isConnectionLost(error)) throw error
      await new Promise(r => setTimeout(r, 400 * attempt))
    }
  }
}
