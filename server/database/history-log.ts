// Appending history rows to the log (design.md §7 "History as one log"), on a Drizzle connection or
// transaction: used by the server (server/utils/history-log.ts) and by the seed script alike.
import { asc, eq, getTableColumns, inArray, sql, type Column, type SQL } from 'drizzle-orm'
import type { MySql2Database } from 'drizzle-orm/mysql2'
import type { MySqlTable } from 'drizzle-orm/mysql-core'
import { LOG_KINDS, rowLeafHash, type LogKind } from '../../shared/log/entry'
import { ROW_FORM } from '../../shared/log/row-form'
import type { StoredColumn } from '../../shared/log/canonical'
import * as schema from './schema'

type Database = MySql2Database<typeof schema>
/** A connection or a transaction: both read and write the same way. */
export type Runner = Pick<Database, 'select' | 'insert' | 'update'>
type Row = Record<string, unknown>

export const LOG_TABLES = {
  template: schema.templates,
  revision: schema.revisions,
  review: schema.reviews,
  seal: schema.seals,
  attachment: schema.attachments,
  audit: schema.auditEvents,
  'office-details': schema.officeDetails,
  'comment-state': schema.commentStates,
} satisfies Record<LogKind, MySqlTable>

/** The name of a kind's row for people: "revision 12", "audit event 40", "office details version 2". */
export function rowLabel(kind: LogKind, id: number) {
  const words: Partial<Record<LogKind, string>> = { 'audit': 'audit event', 'office-details': 'office details version', 'comment-state': 'comment state' }
  return `${words[kind] ?? kind} ${id}`
}

/** The large columns a caller has just written, by column name, in the forms it wrote them. */
export type WrittenColumns = Readonly<Record<string, StoredColumn>>

/**
 * JSON columns as values whatever the driver hands back (MariaDB stores JSON as text). A column of
 * `written` whose stored text reads back unchanged is given as its canonical piece, not parsed: the
 * hashes of the row then take that text without walking or encoding the value again.
 */
export function normaliseRow(kind: LogKind, row: Row, written: WrittenColumns = {}): Row {
  const out: Row = { ...row }
  for (const [key, column] of Object.entries(getTableColumns(LOG_TABLES[kind]))) {
    if (typeof out[key] !== 'string') continue
    if (written[key]?.stored === out[key]) out[key] = written[key].canonical
    else if (column.columnType === 'MySqlJson') out[key] = JSON.parse(out[key] as string)
  }
  return out
}

// Each kind's columns to select: JSON columns as their stored text (the driver would parse them,
// and the read-back of a row just written compares that text with what was written).
const selections = new Map<LogKind, Record<string, SQL | Column>>()
function selectionOf(kind: LogKind) {
  let selection = selections.get(kind)
  if (!selection) {
    selection = Object.fromEntries(Object.entries(getTableColumns(LOG_TABLES[kind]))
      .map(([key, column]) => [key, column.columnType === 'MySqlJson' ? sql<string>`CAST(${column} AS CHAR)` : column]))
    selections.set(kind, selection)
  }
  return selection
}

/** Every row of a kind, as stored, by id. */
export async function rowsOf(db: Runner, kind: LogKind, ids?: number[], written?: WrittenColumns): Promise<Map<number, Row>> {
  const table = LOG_TABLES[kind]
  const idColumn = getTableColumns(table).id!
  const query = db.select(selectionOf(kind)).from(table)
  const rows = (ids ? await query.where(inArray(idColumn, ids)) : await query.orderBy(asc(idColumn))) as Row[]
  return new Map(rows.map(r => [Number(r.id), normaliseRow(kind, r, written)]))
}

/**
 * Takes the log's lock row for the rest of the transaction and returns the next leaf index. Every
 * history transaction takes it before any other chain head (the audit one), so they never deadlock.
 */
export async function holdLog(tx: Runner): Promise<number> {
  const heads = schema.chainHeads
  const [head] = await tx.select().from(heads).where(eq(heads.name, 'log')).for('update')
  if (!head) throw new Error('the history log head is missing: the history-log migration has not run')
  return head.seq
}

// The leaves one transaction appends share the index of its first leaf as their batch.
const batches = new WeakMap<object, number>()

/**
 * Reads each row back as the database stores it and appends it to the log, inside `tx`. The `log`
 * row of chain_heads is held FOR UPDATE until the transaction ends, so leaf indexes are consecutive
 * in commit order. An item's `written` columns read back unchanged come as their canonical
 * pieces (normaliseRow). @returns the row as read back and its leaf index of each item, in the
 * order given (history adopted by the first append is not among them).
 */
export async function appendToLog(tx: Runner, items: Array<{ kind: LogKind, id: number, written?: WrittenColumns }>) {
  const heads = schema.chainHeads
  let next = await holdLog(tx)
  let adopted = 0
  if (next === 0) {
    // the first append, whoever makes it (the server or the seed of an upgraded database): history
    // written before the log existed joins it first, in the same batch, so none of it is left out
    const fresh = new Set(items.map(i => `${i.kind}:${i.id}`))
    const earlier: Array<{ kind: LogKind, id: number }> = []
    for (const kind of LOG_KINDS) for (const id of (await rowsOf(tx, kind)).keys()) if (!fresh.has(`${kind}:${id}`)) earlier.push({ kind, id })
    items = [...earlier, ...items]
    adopted = earlier.length
  }
  const batch = batches.get(tx) ?? next
  batches.set(tx, batch)
  const out: Array<{ leafIndex: number, row: Row }> = []
  for (const { kind, id, written } of items) {
    const row = (await rowsOf(tx, kind, [id], written)).get(id)
    if (!row) throw new Error(`${rowLabel(kind, id)} cannot be read back to be logged`)
    const leafHash = rowLeafHash(kind, row, ROW_FORM)
    await tx.insert(schema.logLeaves).values({ leafIndex: next, kind, rowId: id, batch, leafHash, form: ROW_FORM, createdAt: new Date() })
    out.push({ leafIndex: next, row })
    next += 1
  }
  await tx.update(heads).set({ seq: next }).where(eq(heads.name, 'log'))
  return out.slice(adopted)
}

/**
 * History written before the log existed: when the log has no leaf yet, every history row there is
 * becomes a leaf, in one batch. Once the log has a leaf, nothing is ever adopted again, so a row
 * written behind the application's back stays out of the log and is flagged.
 */
export async function adoptHistoryBeforeLog(tx: Runner) {
  if (await holdLog(tx) > 0) return 0
  await appendToLog(tx, [])
  return holdLog(tx)
}
