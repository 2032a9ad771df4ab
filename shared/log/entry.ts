// What one leaf of the history log holds: the canonical JSON of one history row as the database
// gives it back (in the row form of shared/log/row-form.ts), with the kind of row and the form's
// number. The leaf hash is RFC 6962's SHA-256(0x00 ‖ entry).
import { canonicalJson, canonicalSha256 } from './canonical'
import { leafHash } from './merkle'
import { ROW_FORM, rowForm } from './row-form'

export const LOG_KINDS = ['template', 'revision', 'review', 'seal', 'attachment', 'audit', 'office-details', 'comment-state'] as const
export type LogKind = (typeof LOG_KINDS)[number]

function entryValue(kind: LogKind, row: Record<string, unknown>, form: number) {
  if (form !== 1) throw new RangeError(`row form ${form} is not known to this version of Tendonbook`)
  return { form, kind, row: rowForm(kind, row) }
}

export function logEntry(kind: LogKind, row: Record<string, unknown>, form: number = ROW_FORM): string {
  return canonicalJson(entryValue(kind, row, form))
}

export function entryLeafHash(entry: string): string {
  return leafHash(entry).toString('hex')
}

const LEAF_PREFIX = Uint8Array.of(0)

/**
 * The leaf hash of a row, `entryLeafHash(logEntry(kind, row, form))` without making the entry's
 * text: RFC 6962 §2.1 SHA-256(0x00 ‖ entry), the entry fed to the hash part by part.
 */
export function rowLeafHash(kind: LogKind, row: Record<string, unknown>, form: number = ROW_FORM): string {
  return canonicalSha256(entryValue(kind, row, form), LEAF_PREFIX)
}
