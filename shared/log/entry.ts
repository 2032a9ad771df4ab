// What one leaf of the history log holds: the canonical JSON of one history row as the database
// gives it back, with the kind of row. The leaf hash is RFC 6962's SHA-256(0x00 ‖ entry).
import { canonicalJson } from './canonical'
import { leafHash } from './merkle'

export const LOG_KINDS = ['template', 'revision', 'review', 'seal', 'attachment', 'audit'] as const
export type LogKind = (typeof LOG_KINDS)[number]

/** A row's values for JSON: dates as ISO 8601 UTC with milliseconds, everything else as it is. */
function plainRow(row: Record<string, unknown>) {
  return Object.fromEntries(Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v]))
}

export function logEntry(kind: LogKind, row: Record<string, unknown>): string {
  return canonicalJson({ kind, row: plainRow(row) })
}

export function entryLeafHash(entry: string): string {
  return leafHash(entry).toString('hex')
}
