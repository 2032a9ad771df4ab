// The one canonical form in which a history row is hashed: the row as the database gives it back,
// every column by its name in the schema, dates as ISO 8601 UTC with milliseconds, JSON columns as
// values, then RFC 8785 canonical JSON. Two rules keep old hashes valid as the schema grows:
//  1. Each log leaf records the row form it was written in (`ROW_FORM`, stored in log_leaves.form
//     and inside the hashed entry). A change to how rows are put into JSON is a new form number;
//     leaves written before keep verifying in their own form.
//  2. A column added to a history table after rows were first hashed is listed in LATER_COLUMNS
//     with the value it reads back as on rows written before it. While a row holds that value the
//     column is left out of the form, so adding it changes no earlier row's hash; once a row holds
//     anything else (written so, or edited behind the application's back) it is covered.
// Pure, so the offline verifier and the unit tests can use it too.

/** The row form new leaves are written in. */
export const ROW_FORM = 1

/** Row forms this code can check. */
export const KNOWN_ROW_FORMS: readonly number[] = [1]

type Absent = null | '' | readonly []

/**
 * Columns added to a history table after its rows were first hashed, by kind of row, with the value
 * that earlier rows read back as (the column's default). Add every new history column here.
 */
export const LATER_COLUMNS: Record<string, Record<string, Absent>> = {
  revision: {
    // why the author issued although checks fail
    failingChecksReason: '',
    // the author's replies to the comments on the revision before
    replies: null,
  },
  review: {
    // the office details an approval froze for the title block
    officeVersion: null,
  },
}

/** True when `value` is what rows written before `column` existed read back as. */
export function isAbsentLater(kind: string, column: string, value: unknown): boolean {
  const columns = LATER_COLUMNS[kind]
  if (!columns || !(column in columns)) return false
  const absent = columns[column]
  if (value === undefined || value === null) return true
  if (Array.isArray(absent)) return Array.isArray(value) && value.length === 0
  return value === absent
}

/** A row's covered columns in the canonical form (before canonical JSON). */
export function rowForm(kind: string, row: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const [key, value] of Object.entries(row)) {
    if (value === undefined || isAbsentLater(kind, key, value)) continue
    out[key] = value instanceof Date ? value.toISOString() : value
  }
  return out
}

/**
 * The later fields of an explicit field set (content hashes): each one only when it holds something
 * other than its absent value, by the same rule as the row form.
 */
export function laterFields(kind: string, fields: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(fields).filter(([key, value]) => !isAbsentLater(kind, key, value)))
}
