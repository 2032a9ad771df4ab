// Shared set-up of the records tests: a fresh project and calc sheet straight in the test database
// (so these tests depend only on the records side), sessions that can also send multipart bodies,
// root access for the tests that try to rewrite history, and the SMTP peer's mailbox.
import { readdirSync, readFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import mysql from 'mysql2/promise'
import { inject } from 'vitest'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { DEMO, unique } from '../helpers/client'
import { withDb } from '../helpers/db'

const root = resolve(import.meta.dirname, '..', '..')

/** A signed-in session for fetch calls of any kind (JSON, multipart, binary downloads). */
export class Session {
  cookie = ''
  constructor(readonly baseUrl: string = inject('baseUrl')) {}

  async fetch(path: string, init: RequestInit = {}) {
    const res = await fetch(`${this.baseUrl}${path}`, { ...init, headers: { origin: this.baseUrl, ...(init.headers as Record<string, string> ?? {}), cookie: this.cookie }, redirect: 'manual' })
    const set = res.headers.getSetCookie().map(l => l.split(';')[0]!).filter(p => !p.endsWith('='))
    if (set.length) this.cookie = set.join('; ')
    return res
  }

  async json<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<{ status: number, body: T }> {
    const res = await this.fetch(path, { method, headers: { ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...headers }, body: body === undefined ? undefined : JSON.stringify(body) })
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = JSON.parse(text)
    }
    catch {}
    return { status: res.status, body: parsed as T }
  }

  async upload<T = any>(path: string, bytes: Uint8Array, filename: string, type = 'application/octet-stream') {
    const form = new FormData()
    form.append('file', new Blob([bytes], { type }), filename)
    const res = await this.fetch(path, { method: 'POST', body: form })
    return { status: res.status, body: await res.json() as T }
  }
}

export async function session(role: keyof typeof DEMO) {
  const s = new Session()
  const res = await s.json('POST', '/api/auth/signin', { email: DEMO[role].email, password: DEMO[role].password })
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status}`)
  return s
}

/** A short template of the records tests' own, used only when no built-in pt-member template is seeded. */
const FALLBACK_TEMPLATE = `---
model: pt-member
title: Records test sheet
version: 1
---
# Prestress

The governing force to balance the chosen load is :val[balancing.governing].

# Stresses at transfer

::: checks{group=transfer}
:::

# Stresses in service

::: checks{group=service}
:::
`

/** The first built-in pt-member template seeded in the database (the slab strip unless `kind` says), else the fallback above. */
async function templateId(conn: mysql.Connection, kind = 'slab') {
  const [rows] = await conn.query('SELECT id FROM templates WHERE model = ? AND builtin = 1 ORDER BY (slug LIKE ?) DESC, id ASC LIMIT 1', ['pt-member', `%${kind}%`])
  const found = (rows as Array<{ id: number }>)[0]
  if (found) return found.id
  // INSERT IGNORE: the integration and e2e runs may both get here first
  await conn.query('INSERT IGNORE INTO templates (slug, version, title, model, body, builtin) VALUES (?, 1, ?, ?, ?, 0)', ['records-test-sheet', 'Records test sheet', 'pt-member', FALLBACK_TEMPLATE])
  const [made] = await conn.query('SELECT id FROM templates WHERE slug = ? LIMIT 1', ['records-test-sheet'])
  return (made as Array<{ id: number }>)[0]!.id
}

export async function userId(role: keyof typeof DEMO) {
  return withDb(async (conn) => {
    const [rows] = await conn.query('SELECT id FROM users WHERE email = ?', [DEMO[role].email])
    return (rows as Array<{ id: number }>)[0]!.id
  })
}

/**
 * A new project with one calc sheet holding the PS-2 demo inputs (or others, on the template of the
 * `kind` named); the demo engineer, checker and records clerk are its members, each in their role.
 */
export async function makeSheet(inputs: unknown = DEMO_PS2, kind = 'slab') {
  const engineer = await userId('engineer')
  const members = [['engineer', engineer], ['checker', await userId('checker')], ['records', await userId('records')]] as const
  const admin = await userId('admin')
  return withDb(async (conn) => {
    const job = unique('R')
    const [p] = await conn.query('INSERT INTO projects (job_number, name, client, site, created_by) VALUES (?, ?, ?, ?, ?)', [job, 'Alder Yard podium (records test)', 'Alder Yard Developments (fictional)', 'Northgate', engineer])
    const projectId = (p as { insertId: number }).insertId
    for (const [role, id] of members) await conn.query('INSERT INTO project_members (project_id, user_id, role, added_by) VALUES (?, ?, ?, ?)', [projectId, id, role, admin])
    const [s] = await conn.query('INSERT INTO sheets (project_id, reference, title, part_of_structure, template_id, inputs, created_by, updated_by) VALUES (?, ?, ?, ?, ?, ?, ?, ?)', [projectId, kind === 'slab' ? 'PS-2' : 'BB-1', kind === 'slab' ? 'Podium slab strip' : 'Band beam on grid C', 'Level 1 podium', await templateId(conn, kind), JSON.stringify(inputs), engineer, engineer])
    return { projectId, jobNumber: job, sheetId: (s as { insertId: number }).insertId }
  })
}

/**
 * A new account of this role (made by the demo admin), signed in, and, when `projectId` is given,
 * put on that project in the same role through the admin's membership route.
 */
export async function newPerson(role: 'engineer' | 'checker' | 'records', name: string, projectId?: number) {
  const admin = await session('admin')
  const email = `${unique(role)}@tendonbook.local`
  const password = 'a-long-enough-password'
  const made = await admin.json('POST', '/api/admin/users', { email, name, role, password })
  if (made.status !== 201) throw new Error(`making ${name} failed: ${made.status} ${JSON.stringify(made.body)}`)
  if (projectId !== undefined) {
    const added = await admin.json('POST', `/api/admin/projects/${projectId}/members`, { userId: made.body.id, role })
    if (added.status !== 200) throw new Error(`putting ${name} on project ${projectId} failed: ${added.status} ${JSON.stringify(added.body)}`)
  }
  const s = new Session()
  const signed = await s.json('POST', '/api/auth/signin', { email, password })
  if (signed.status !== 200) throw new Error(`sign-in as ${name} failed: ${signed.status}`)
  return { session: s, id: made.body.id as number, email }
}

/** A save of the draft, as the editor's would be: new inputs, the next draft version. */
export async function setSheetInputs(sheetId: number, inputs: unknown) {
  await withDb(conn => conn.query('UPDATE sheets SET inputs = ?, draft_version = draft_version + 1 WHERE id = ?', [JSON.stringify(inputs), sheetId]))
}

export async function draftVersionOf(sheetId: number) {
  return withDb(async (conn) => {
    const [rows] = await conn.query('SELECT draft_version AS v FROM sheets WHERE id = ?', [sheetId])
    return (rows as Array<{ v: number }>)[0]?.v ?? 1
  })
}

/** Issues the sheet's draft as the editor does: naming the draft version on screen, the latest. */
export async function issue(s: Session, sheetId: number, body: Record<string, unknown> = {}) {
  const issued = await s.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), ...body })
  return issued.status === 201 ? { status: 201, body: await issuedRevision(s, issued.body) } : issued
}

/**
 * The revision an issue made, as GET /api/revisions/:id shows it; the issue answers { id, code,
 * contentHash } and nothing else, which this checks first.
 */
export async function issuedRevision(s: Session, answer: { id: number, code: string, contentHash: string }) {
  if (Object.keys(answer).sort().join() !== 'code,contentHash,id') throw new Error(`an issue answered ${JSON.stringify(answer).slice(0, 200)}, not { id, code, contentHash }`)
  const detail = await s.json('GET', `/api/revisions/${answer.id}`)
  if (detail.status !== 200 || detail.body.code !== answer.code || detail.body.contentHash !== answer.contentHash) throw new Error(`the issued revision ${answer.id} reads back as ${detail.status} ${JSON.stringify(detail.body).slice(0, 200)}`)
  return detail.body
}

/** Root over the test instance's socket: the one connection that may drop a trigger. */
export async function withRoot<T>(fn: (conn: mysql.Connection) => Promise<T>): Promise<T> {
  const base = process.env.TENDONBOOK_TEST_BASE
  if (!base) throw new Error('TENDONBOOK_TEST_BASE is not set: run with npm test')
  const conn = await mysql.createConnection({ socketPath: join(base, 'run', 'mysqld.sock'), user: 'root', database: process.env.NUXT_DATABASE_NAME })
  try {
    return await fn(conn)
  }
  finally {
    await conn.end()
  }
}

/** The CREATE TRIGGER statement of the records migration for one trigger name. */
export function triggerSql(name: string) {
  const dir = join(root, 'drizzle')
  for (const file of readdirSync(dir).filter(f => f.endsWith('.sql'))) {
    for (const chunk of readFileSync(join(dir, file), 'utf8').split('--> statement-breakpoint')) {
      if (chunk.includes(`CREATE TRIGGER \`${name}\``)) return chunk.trim()
    }
  }
  throw new Error(`no trigger ${name} in the migrations`)
}

export interface ReceivedMail { to: string[], raw: string, file: string }

/** Every message the SMTP peers of this run (one per test server, mailbox-*) have received so far. */
export function receivedMail(): ReceivedMail[] {
  const parent = dirname(inject('mailboxDir'))
  const dirs = readdirSync(parent).filter(d => d.startsWith('mailbox')).map(d => join(parent, d))
  return dirs.flatMap(dir => readdirSync(dir).filter(f => f.endsWith('.json'))
    .map(file => ({ ...(JSON.parse(readFileSync(join(dir, file), 'utf8')) as { to: string[], raw: string }), file: join(dir, file) })))
}

/**
 * Waits until a message matching `match` reaches an SMTP peer. The integration and e2e servers share
 * the test database and so its outbox: whichever server claims a message sends it to its own peer,
 * so every peer's folder (mailbox-*) beside ours is searched.
 */
export async function waitForMail(match: (m: ReceivedMail) => boolean, timeoutMs = 30_000): Promise<ReceivedMail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const found = receivedMail().find(match)
    if (found) return found
    if (Date.now() > until) throw new Error('the expected e-mail did not arrive')
    await new Promise(r => setTimeout(r, 300))
  }
}

/** Text of every page of a PDF, read with pdfjs-dist (a general-purpose PDF reader). */
export async function pdfText(bytes: Uint8Array) {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs')
  const doc = await pdfjs.getDocument({ data: new Uint8Array(bytes) }).promise
  const pages: string[] = []
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent()
    pages.push(content.items.map(item => ('str' in item ? item.str : '')).join(' '))
  }
  return { pages, numPages: doc.numPages }
}

/**
 * Runs `fn` as root with the named triggers dropped, then puts them back from the migrations
 * whatever happens: how the tests rewrite history behind the application's back.
 */
export async function withoutTriggers<T>(names: string[], fn: (conn: mysql.Connection) => Promise<T>): Promise<T> {
  const restore = names.map(triggerSql)
  return withRoot(async (conn) => {
    try {
      for (const name of names) await conn.query(`DROP TRIGGER IF EXISTS \`${name}\``)
      return await fn(conn)
    }
    finally {
      for (const name of names) await conn.query(`DROP TRIGGER IF EXISTS \`${name}\``)
      for (const sql of restore) await conn.query(sql)
    }
  })
}

/** Every break the chain verification lists, as records. */
export async function chainBreaks(records: Session) {
  const res = await records.json('POST', '/api/chain/verify')
  if (res.status !== 200) throw new Error(`chain verification failed: ${res.status} ${JSON.stringify(res.body)}`)
  return res.body as { ok: boolean, breaks: Array<{ chain: string, id: number, label: string, problem: string, reason: string }> }
}
