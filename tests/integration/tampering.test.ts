// History rewritten as the database's root, table by table: every history table (revisions,
// reviews, seals, attachments, template versions, audit events) has a row edited, deleted, two rows
// swapped and a row inserted behind the application's back. Each is found by the verification
// against the heads the server signed and published before, and once the row is put back the
// history verifies whole again. (records-integrity.test.ts shows the breaks' wording case by case.)
import type mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { recordFigures } from '../helpers/figures'
import { png } from '../helpers/png'
import { chainBreaks, issue, makeSheet, session, withoutTriggers, withRoot, type Session } from './records-fixtures'

const TABLES = ['revisions', 'reviews', 'seals', 'attachments', 'templates', 'audit_events'] as const
type Table = (typeof TABLES)[number]
const TAMPERINGS = ['edit', 'delete', 'swap', 'insert'] as const
/** the column a forger edits in each table */
const EDITED: Record<Table, string> = { revisions: 'note', reviews: 'created_at', seals: 'archive_ref', attachments: 'filename', templates: 'title', audit_events: 'subject' }

let engineer: Session, checker: Session, records: Session, admin: Session
/** two rows of each table, written through the product */
const rows = {} as Record<Table, [number, number]>
let tried = 0
let detected = 0

/** The two latest rows of a table, when it has two. */
async function latestTwo(table: Table): Promise<[number, number] | null> {
  return withRoot(async (root) => {
    const [found] = await root.query(`SELECT id FROM \`${table}\` ORDER BY id DESC LIMIT 2`)
    const got = (found as Array<{ id: number }>).map(r => r.id).reverse()
    return got.length === 2 ? [got[0]!, got[1]!] : null
  })
}

// Rows written through the product: those other tests left when there are two of a kind (the
// whole suite seals several revisions), else made here: a seal takes a few PDF renders.
beforeAll(async () => {
  ;[engineer, checker, records, admin] = await Promise.all([session('engineer'), session('checker'), session('records'), session('admin')])
  if (!(await latestTwo('seals')) || !(await latestTwo('reviews')) || !(await latestTwo('attachments'))) {
    for (const _ of [1, 2]) {
      const { sheetId } = await makeSheet()
      const rev = await issue(engineer, sheetId, { note: 'For the tampering test' })
      expect(rev.status).toBe(201)
      const approval = await checker.json('POST', `/api/revisions/${rev.body.id}/reviews`, { decision: 'approve' })
      expect(approval.status).toBe(201)
      const seal = await records.json('POST', `/api/revisions/${rev.body.id}/seal`)
      expect(seal.status).toBe(201)
      const form = new FormData()
      form.append('file', new Blob([png(8, 8)], { type: 'image/png' }), `sketch-${sheetId}.png`)
      const upload = await engineer.fetch(`/api/sheets/${sheetId}/attachments`, { method: 'POST', body: form })
      expect(upload.status).toBe(201)
    }
  }
  if (!(await latestTwo('templates'))) {
    for (const n of [1, 2]) {
      const body = `---\nmodel: pt-member\ntitle: Tampering test ${n}\nversion: 1.0.${n}\n---\n# Prestress\n\nThe governing force is :val[balancing.governing].\n`
      expect((await admin.json('POST', '/api/templates', { slug: `tampering-${Date.now().toString(36)}-${n}`, body })).status).toBe(201)
    }
  }
  expect((await chainBreaks(records)).breaks).toEqual([])
  for (const table of TABLES) rows[table] = (await latestTwo(table))!
  expect(Object.values(rows).every(r => r?.length === 2 && r.every(Number.isInteger))).toBe(true)
})

afterAll(() => {
  recordFigures({ suite: 'tampering', tamperingsTried: tried, tamperingsDetected: detected })
})

interface Column { name: string, type: string, unique: boolean }

async function columnsOf(root: mysql.Connection, table: Table): Promise<Column[]> {
  const [cols] = await root.query('SELECT column_name AS name, data_type AS type FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = ? ORDER BY ordinal_position', [table])
  const [uniques] = await root.query('SELECT DISTINCT column_name AS name FROM information_schema.statistics WHERE table_schema = DATABASE() AND table_name = ? AND non_unique = 0 AND index_name <> \'PRIMARY\'', [table])
  const unique = new Set((uniques as Array<{ name: string }>).map(u => u.name))
  return (cols as Array<{ name: string, type: string }>).map(c => ({ ...c, unique: unique.has(c.name) }))
}

/** A value of the column changed the way a forger would: text edited, numbers moved. */
function changed(c: Column) {
  const q = `\`${c.name}\``
  if (/char|text/.test(c.type)) return `CONCAT(LEFT(${q}, GREATEST(CHAR_LENGTH(${q}) - 1, 0)), IF(RIGHT(${q}, 1) = 'f', 'e', 'f'))`
  if (/int|decimal|double|float/.test(c.type)) return `${q} + 100000`
  if (/json|longtext/.test(c.type)) return `JSON_ARRAY(${q})`
  if (/date|time/.test(c.type)) return `${q} - INTERVAL 1 DAY`
  return q
}

/** Rewrites history in `table` as root, with every trigger that would refuse it dropped meanwhile. */
async function tamper(table: Table, how: (typeof TAMPERINGS)[number]) {
  const [x, y] = rows[table]
  const triggers = [`${table}_no_update`, `${table}_no_delete`, ...(table === 'revisions' ? ['revisions_chain_check'] : table === 'reviews' ? ['reviews_rules_check'] : [])]
  return withoutTriggers(triggers, async (root) => {
    await root.query('SET FOREIGN_KEY_CHECKS = 0')
    const cols = await columnsOf(root, table)
    const data = cols.filter(c => c.name !== 'id')
    const list = data.map(c => `\`${c.name}\``).join(', ')
    const backup = `tamper_backup_${table}`
    await root.query(`DROP TABLE IF EXISTS ${backup}`)
    await root.query(`CREATE TABLE ${backup} AS SELECT * FROM \`${table}\` WHERE id IN (?, ?)`, [x, y])
    let inserted: number | null = null
    try {
      if (how === 'edit') {
        const target = data.find(c => c.name === EDITED[table])!
        await root.query(`UPDATE \`${table}\` SET \`${target.name}\` = ${changed(target)} WHERE id = ?`, [x])
      }
      else if (how === 'delete') {
        await root.query(`DELETE FROM \`${table}\` WHERE id = ?`, [y])
      }
      else if (how === 'swap') {
        // the two rows change places: each id now holds the other's content
        await root.query(`DELETE FROM \`${table}\` WHERE id IN (?, ?)`, [x, y])
        await root.query(`INSERT INTO \`${table}\` (id, ${list}) SELECT IF(id = ?, ?, ?), ${list} FROM ${backup}`, [x, y, x])
      }
      else {
        // a copy of a real row under a new id, its unique columns nudged so the database takes it
        const values = data.map(c => (c.unique ? changed(c) : `\`${c.name}\``)).join(', ')
        const [res] = await root.query(`INSERT INTO \`${table}\` (${list}) SELECT ${values} FROM ${backup} WHERE id = ?`, [y])
        inserted = (res as { insertId: number }).insertId
      }
      tried += 1
      const report = await chainBreaks(records)
      if (!report.ok && report.breaks.length > 0) detected += 1
      return report
    }
    finally {
      if (inserted !== null) await root.query(`DELETE FROM \`${table}\` WHERE id = ?`, [inserted])
      await root.query(`DELETE FROM \`${table}\` WHERE id IN (?, ?)`, [x, y])
      await root.query(`INSERT INTO \`${table}\` SELECT * FROM ${backup}`)
      await root.query(`DROP TABLE ${backup}`)
      await root.query('SET FOREIGN_KEY_CHECKS = 1')
    }
  })
}

describe('history rewritten as root is found against the heads signed before', () => {
  for (const table of TABLES) {
    for (const how of TAMPERINGS) {
      it(`${table}: ${how}`, async () => {
        const report = await tamper(table, how)
        expect(report.ok).toBe(false)
        // the row, or the log that holds it, is named
        expect(report.breaks.some(b => b.chain === 'log')).toBe(true)
        if (how !== 'insert') expect(report.breaks.some(b => b.problem === 'head')).toBe(true)
        else expect(report.breaks.some(b => b.problem === 'unlogged')).toBe(true)
        // put back, the history verifies whole again
        expect((await chainBreaks(records)).breaks).toEqual([])
      })
    }
  }
})
