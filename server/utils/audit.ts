import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import { holdLog } from '../database/history-log'
import { auditHash, plainJson } from './hashing'

export interface AuditEntry {
  action: string
  subject: string
  actorId: number | null
  detail?: Record<string, unknown>
}

/** A Drizzle transaction over the app's pool. */
export type Tx = Parameters<Parameters<ReturnType<typeof useDb>['transaction']>[0]>[0]

/**
 * Appends one event to the hash-chained audit trail and to the history log. Inside `tx` when given,
 * so the event commits or rolls back with the act it records (and shares its log batch); otherwise
 * in a transaction of its own. The chain head row is locked FOR UPDATE (after the log's), so
 * concurrent events queue up instead of forking the chain.
 */
export async function recordAudit(event: H3Event | null, entry: AuditEntry, tx?: Tx) {
  const address = event ? clientAddress(event) : ''
  if (tx) return appendAudit(tx, entry, address)
  return historyTransaction(t => appendAudit(t, entry, address))
}

async function appendAudit(tx: Tx, entry: AuditEntry, address: string) {
  await holdLog(tx)
  const heads = tables.chainHeads
  const [head] = await tx.select().from(heads).where(eq(heads.name, 'audit')).for('update')
  if (!head) throw new Error('audit chain head is missing: the records migration has not run')
  const createdAt = new Date()
  const fields = {
    seq: head.seq + 1,
    action: entry.action,
    subject: entry.subject.slice(0, 200),
    actorId: entry.actorId,
    address: address.slice(0, 64),
    detail: plainJson(entry.detail ?? {}),
    createdAt,
    prevHash: head.hash,
  }
  const hash = auditHash(fields)
  const [{ id }] = await tx.insert(tables.auditEvents).values({ ...fields, hash }).$returningId()
  await logWrittenRow(tx, 'audit', id, { hash, of: auditHash })
  await tx.update(heads).set({ seq: fields.seq, hash }).where(eq(heads.name, 'audit'))
  return { seq: fields.seq, hash }
}
