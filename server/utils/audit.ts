import type { H3Event } from 'h3'

export interface AuditEntry {
  action: string
  subject: string
  actorId: number | null
  detail?: Record<string, unknown>
}

/**
 * Audit trail hook. The hash-chained, append-only audit table arrives with the records side;
 * until then entries go to the server log so nothing is silently dropped.
 */
export async function recordAudit(event: H3Event, entry: AuditEntry) {
  const address = clientAddress(event)
  console.info(`[audit] ${entry.action} subject=${entry.subject} actor=${entry.actorId ?? '-'} from=${address}`)
}
