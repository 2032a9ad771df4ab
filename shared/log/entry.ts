// What one leaf of the history log holds: the canonical JSON of one history row as the database
// gives it back (in the row form of shared/log/row-form.ts), with the kind of row and the form's
// number. The leaf hash is RFC 6962's SHA-256(0x00 ‖ entry).
import { canonicalJson } from './canonical'
import { leafHash } from './merkle'
import { ROW_FORM, rowForm } from './row-form'

export const LOG_KINDS = ['template', 'revision', 'review', 'seal', 'attachment', 'audit', 'office-details', 'comment-state'] as const
export type LogKind = (typeof LOG_KINDS)[number]

export function logEntry(kind: LogKind, row: Record<string, unknown>, form: number = ROW_FORM): string {
  if (form !== 1) throw new RangeError(`row form ${form} is not known to this version of Tendonbook`)
  return canonicalJson({ form, kind, row: rowForm(kind, row) })
}

export function entryLeafHash(entry: string): string {
  return leafHash(entry).toString('hex')
}
