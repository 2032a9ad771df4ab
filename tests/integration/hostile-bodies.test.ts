// Every route that changes something, from the one permission table, is sent generated bodies that
// no schema may accept (wrong types, missing fields, huge and ill-formed strings, numbers JSON
// cannot hold, deep nesting, values with units where a number goes) and hostile path ids: each
// answer is a 4xx naming the field at fault, never a 5xx, and nothing is written anywhere: the row
// count of every table and the history log's latest head are the same before and after.
// `npm test` sends 100 bodies per route; `npm run test:stress` sends 1,000.
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ACCESS_RULES } from '../../server/utils/access-rules'
import { recordFigures } from '../helpers/figures'
import { withDb } from '../helpers/db'
import { draftVersionOf, issue, makeSheet, newPerson, session, type Session } from './records-fixtures'

const BODIES_PER_ROUTE = process.env.TENDONBOOK_STRESS ? 1000 : 100
const MUTATING = Object.keys(ACCESS_RULES).filter(k => /^(POST|PUT|PATCH|DELETE) /.test(k))

type Kind = 'text' | 'number' | 'boolean' | 'object' | 'array'
/** `label`: how messages must call the field; `element`: how they call one element of a list field */
interface Field { kind: Kind, label: string, required: boolean, element?: string }
interface RouteSpec {
  /** who calls it: a session allowed to */
  caller: () => Session
  /** the path with its ids filled in */
  path: () => string
  /** a body the route would accept, field by field; null: the route reads no body */
  fields: Record<string, Field> | null
  base?: () => Record<string, unknown>
}

let engineer: Session, checker: Session, records: Session, admin: Session
let ids: { projectId: number, sheetId: number, revisionId: number, reviewId: number, personId: number, templateId: number }

const text = (label: string, required = true): Field => ({ kind: 'text', label, required })
const num = (label: string, required = true): Field => ({ kind: 'number', label, required })

/** How each mutating route is called correctly; the fuzz breaks one or more fields of it. */
const SPECS: Record<string, RouteSpec> = {
  'POST /api/auth/signin': { caller: () => new SessionLike(), path: () => '/api/auth/signin', fields: { email: text('E-mail'), password: text('Password') }, base: () => ({ email: 'engineer@tendonbook.local', password: 'not-the-password' }) },
  'POST /api/auth/signout': { caller: () => engineer, path: () => '/api/auth/signout', fields: null },
  'POST /api/auth/signout-everywhere': { caller: () => engineer, path: () => '/api/auth/signout-everywhere', fields: null },
  'POST /api/templates': { caller: () => admin, path: () => '/api/templates', fields: { slug: text('Short name'), body: text('Template text') }, base: () => ({ slug: 'fuzz-template', body: '---\nmodel: pt-member\ntitle: Fuzz\nversion: 1\n---\n# Fuzz\n' }) },
  'POST /api/admin/office': { caller: () => admin, path: () => '/api/admin/office', fields: null },
  'POST /api/admin/users': { caller: () => admin, path: () => '/api/admin/users', fields: { email: text('E-mail'), name: text('Name'), role: text('Role'), password: text('Password') }, base: () => ({ email: 'fuzz-person@tendonbook.local', name: 'Fuzz Person', role: 'engineer', password: 'a-long-enough-password' }) },
  'PATCH /api/admin/users/:id': { caller: () => admin, path: () => `/api/admin/users/${ids.personId}`, fields: { name: text('Name', false), role: text('Role', false), disabled: { kind: 'boolean', label: 'Account disabled', required: false }, password: text('Password', false) }, base: () => ({ name: 'Fuzz Target', role: 'engineer', disabled: false, password: 'a-long-enough-password' }) },
  'POST /api/admin/projects/:id/members': { caller: () => admin, path: () => `/api/admin/projects/${ids.projectId}/members`, fields: { userId: num('Person'), role: text('Role on the project') }, base: () => ({ userId: ids.personId, role: 'checker' }) },
  'DELETE /api/admin/projects/:id/members/:userId': { caller: () => admin, path: () => `/api/admin/projects/${ids.projectId}/members/${ids.personId}`, fields: null },
  'POST /api/projects': { caller: () => engineer, path: () => '/api/projects', fields: { jobNumber: text('Job number'), name: text('Project name'), client: text('Client', false), site: text('Site', false) }, base: () => ({ jobNumber: 'FZ-1', name: 'Fuzz project', client: 'Fuzz', site: 'Fuzz' }) },
  'POST /api/projects/:id/sheets': { caller: () => engineer, path: () => `/api/projects/${ids.projectId}/sheets`, fields: { reference: text('Calc reference'), title: text('Title'), partOfStructure: text('Part of structure', false), templateId: num('Template'), spans: { kind: 'array', label: 'Spans', element: 'Span ', required: false }, copyFrom: num('Start from', false) }, base: () => ({ reference: 'FZ-1', title: 'Fuzz sheet', partOfStructure: 'Fuzz', templateId: ids.templateId, spans: [7.8, 9.6] }) },
  'PUT /api/sheets/:id/draft': { caller: () => engineer, path: () => `/api/sheets/${ids.sheetId}/draft`, fields: { inputs: { kind: 'object', label: 'Inputs', required: true }, draftVersion: num('Draft version'), body: text('Sheet text', false) }, base: () => ({ inputs: {}, draftVersion: 1, body: null }) },
  'POST /api/sheets/:id/upgrade-template': { caller: () => engineer, path: () => `/api/sheets/${ids.sheetId}/upgrade-template`, fields: null },
  'POST /api/sheets/:id/attachments': { caller: () => engineer, path: () => `/api/sheets/${ids.sheetId}/attachments`, fields: null },
  'POST /api/sheets/:id/revisions': { caller: () => engineer, path: () => `/api/sheets/${ids.sheetId}/revisions`, fields: { note: text('Note for the checker', false), failingChecksReason: text('Reason for issuing with failing checks', false), replies: { kind: 'array', label: 'Replies to the comments', element: 'Reply ', required: false }, draftVersion: num('Draft version') }, base: () => ({ note: 'fuzz', failingChecksReason: 'fuzz', replies: [], draftVersion: 1 }) },
  'POST /api/revisions/:id/reviews': { caller: () => checker, path: () => `/api/revisions/${ids.revisionId}/reviews`, fields: { decision: text('Decision'), comments: { kind: 'array', label: 'Comments', element: 'Comment ', required: false } }, base: () => ({ decision: 'comment', comments: [{ anchor: '', text: 'fuzz' }] }) },
  'POST /api/reviews/:id/comment-state': { caller: () => checker, path: () => `/api/reviews/${ids.reviewId}/comment-state`, fields: { index: num('Comment'), state: text('Comment state') }, base: () => ({ index: 0, state: 'closed' }) },
  'POST /api/revisions/:id/seal': { caller: () => records, path: () => `/api/revisions/${ids.revisionId}/seal`, fields: null },
  'POST /api/revisions/:id/reseal-check': { caller: () => records, path: () => `/api/revisions/${ids.revisionId}/reseal-check`, fields: null },
  'POST /api/verify': { caller: () => records, path: () => '/api/verify', fields: { query: text('Hash or reference') }, base: () => ({ query: 'TB-0000' }) },
  'POST /api/chain/verify': { caller: () => records, path: () => '/api/chain/verify', fields: null },
}

/** A caller that is signed in as nobody (sign-in itself). */
class SessionLike {
  json(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    return rawJson(method, path, body === undefined ? undefined : JSON.stringify(body), '', headers)
  }
}

async function rawJson(method: string, path: string, text: string | undefined, cookie: string, headers: Record<string, string> = {}) {
  const base = (globalThis as { __baseUrl?: string }).__baseUrl!
  const res = await fetch(`${base}${path}`, { method, headers: { origin: base, 'content-type': 'application/json', ...(cookie ? { cookie } : {}), ...headers }, body: text, redirect: 'manual' })
  const raw = await res.text()
  let body: unknown = raw
  try {
    body = JSON.parse(raw)
  }
  catch {}
  return { status: res.status, body: body as { message?: string, statusMessage?: string, data?: { fields?: Record<string, string> } } }
}

// values that JSON text can carry but JSON.stringify cannot write: put in as placeholders, swapped after
const RAW: Record<string, string> = {
  '"@@INFINITY@@"': '1e999',
  '"@@MINUS_INFINITY@@"': '-1e999',
  '"@@LONG_NUMBER@@"': `1${'0'.repeat(400)}`,
  '"@@DEEP_ARRAY@@"': `${'['.repeat(20_000)}${']'.repeat(20_000)}`,
  '"@@DEEP_OBJECT@@"': `${'{"a":'.repeat(5_000)}1${'}'.repeat(5_000)}`,
}
const withRaw = (json: string) => Object.entries(RAW).reduce((t, [k, v]) => t.split(k).join(v), json)

const illFormed = fc.tuple(fc.string({ maxLength: 20 }), fc.constantFrom('\uD800', '\uDBFF', '\uDC00', '\uDFFF\uD800'), fc.string({ maxLength: 20 })).map(([a, s, b]) => a + s + b)
const huge = fc.integer({ min: 410_000, max: 900_000 }).map(n => 'x'.repeat(n))
const deep = fc.constantFrom('@@DEEP_ARRAY@@', '@@DEEP_OBJECT@@')
const notANumber = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', '@@INFINITY@@', '@@MINUS_INFINITY@@', '@@LONG_NUMBER@@', '5 kN', '7.8 m', '0x10', '', ' '),
  fc.constantFrom(-1e308, -1, 0.5, 1e308, Number.MAX_SAFE_INTEGER + 2),
  fc.record({ value: fc.integer({ min: 1, max: 9 }), unit: fc.constantFrom('kN', 'm', 'mm', 'MPa') }),
  fc.boolean(), fc.constant([]), fc.array(fc.integer(), { minLength: 1, maxLength: 2 }), fc.constant({}), deep, illFormed,
)

/** A value that the field's type refuses whatever the field. */
function hostile(kind: Kind) {
  switch (kind) {
    case 'text': return fc.oneof(illFormed, huge, fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.boolean(), fc.constant({}), fc.array(fc.string(), { maxLength: 3 }), deep)
    case 'number': return notANumber
    case 'boolean': return fc.oneof(fc.constantFrom('true', 'false', 'yes', 1, 0, '@@INFINITY@@'), fc.constant({}), fc.constant([]), illFormed, deep)
    case 'object': return fc.oneof(fc.string(), fc.integer(), fc.array(fc.integer(), { maxLength: 3 }), fc.constant(null), fc.constant('@@DEEP_ARRAY@@'), illFormed)
    case 'array': return fc.oneof(fc.string(), fc.integer(), fc.constant({}), fc.array(fc.oneof(fc.integer(), illFormed, fc.constant(null)), { minLength: 1, maxLength: 3 }), fc.constant(Array.from({ length: 300 }, () => ({ anchor: '', text: 'x' }))), deep, huge)
  }
}

type Body = { text: string, fault: string | null }

/** One generated body for the route: either some fields broken, a required one left out, or no object at all. */
function bodies(fields: Record<string, Field>, base: Record<string, unknown>): fc.Arbitrary<Body> {
  const names = Object.keys(fields)
  const broken = fc.subarray(names, { minLength: 1 }).chain(chosen => fc.tuple(...chosen.map(n => hostile(fields[n]!.kind))).map((values) => {
    const body = { ...base }
    chosen.forEach((n, i) => { body[n] = values[i] })
    return { text: withRaw(JSON.stringify(body)), fault: chosen.length === 1 ? chosen[0]! : null }
  }))
  const required = names.filter(n => fields[n]!.required)
  const missing = fc.constantFrom(...(required.length ? required : names)).map((n) => {
    const body = { ...base }
    delete body[n]
    return { text: JSON.stringify(body), fault: fields[n]!.required ? n : null }
  })
  const whole = fc.constantFrom('[]', '"text"', '42', 'true', '{"a":', '{', 'not json at all', '"\\ud800"', '{"__proto__":{"admin":true}}', RAW['"@@DEEP_ARRAY@@"']!, RAW['"@@DEEP_OBJECT@@"']!).map(t => ({ text: t, fault: null }))
  return fc.oneof({ weight: 6, arbitrary: broken }, { weight: 2, arbitrary: required.length ? missing : broken }, { weight: 1, arbitrary: required.length ? whole : broken })
}

const HOSTILE_IDS = ['abc', '-1', '0', '1.5', '1e999', '99999999999999999999', 'NaN', 'Infinity', '%00', '%ED%A0%80', '..%2F..%2Fetc%2Fpasswd', '1%20OR%201=1', `${'9'.repeat(300)}`]

async function snapshot() {
  return withDb(async (conn) => {
    const [tables] = await conn.query('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name')
    const counts: Record<string, number> = {}
    for (const { t } of tables as Array<{ t: string }>) {
      const [rows] = await conn.query(`SELECT COUNT(*) AS n FROM \`${t}\``)
      counts[t] = Number((rows as Array<{ n: number }>)[0]!.n)
    }
    const [head] = await conn.query('SELECT tree_size AS size, root_hash AS root FROM log_heads ORDER BY tree_size DESC LIMIT 1')
    return { counts, head: (head as Array<{ size: number, root: string }>)[0] ?? null }
  })
}

const generic = /^(server error|internal server error|bad request|invalid input)?$/i
let tried = 0
let serverErrors = 0
let before: Awaited<ReturnType<typeof snapshot>>

beforeAll(async () => {
  (globalThis as { __baseUrl?: string }).__baseUrl = inject('baseUrl')
  ;[engineer, checker, records, admin] = await Promise.all([session('engineer'), session('checker'), session('records'), session('admin')])
  const made = await makeSheet()
  const issued = await issue(engineer, made.sheetId, { note: 'Fuzz target revision' })
  expect(issued.status).toBe(201)
  const review = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'comment', comments: [{ anchor: '', text: 'Fuzz target comment' }] })
  expect(review.status).toBe(201)
  const person = await newPerson('checker', 'Fuzz Target')
  const [template] = await withDb(async conn => (await conn.query('SELECT id FROM templates ORDER BY id LIMIT 1'))[0] as Array<{ id: number }>)
  ids = { ...made, revisionId: issued.body.id, reviewId: (review.body.reviews as Array<{ id: number }>).at(-1)!.id, personId: person.id, templateId: template!.id }
  before = await snapshot()
})

afterAll(() => {
  recordFigures({ suite: 'hostile bodies', routes: MUTATING.length, bodiesTried: tried, serverErrors })
})

describe('hostile bodies on every route that changes something', () => {
  it('has a way to call every mutating route of the permission table', () => {
    expect(MUTATING.filter(k => !SPECS[k])).toEqual([])
  })

  for (const key of MUTATING) {
    const spec = SPECS[key]
    const method = key.split(' ')[0]!
    it(`${key}: hostile ids are refused with 4xx and a message`, async () => {
      if (!spec || !key.includes(':')) return
      const path = spec.path()
      const problems: string[] = []
      for (const bad of HOSTILE_IDS) {
        // every numeric id of the path in turn, by its place (the same digits may stand in two places)
        const segments = path.split('/')
        for (const [at] of segments.map((seg, i) => [i, seg] as const).filter(([, seg]) => /^\d+$/.test(seg))) {
          const hostilePath = segments.map((seg, i) => (i === at ? bad : seg)).join('/')
          const res = await rawJson(method, hostilePath, spec.base ? JSON.stringify(spec.base()) : undefined, cookieOf(spec.caller()))
          tried += 1
          if (res.status >= 500) serverErrors += 1
          if (res.status < 400 || res.status >= 500 || generic.test(res.body?.message ?? '')) problems.push(`${hostilePath} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`)
        }
      }
      expect(problems).toEqual([])
    })

    if (!spec?.fields) continue
    it(`${key}: ${BODIES_PER_ROUTE} generated bodies are refused, each naming the field`, async () => {
      const problems: string[] = []
      const samples = fc.sample(bodies(spec.fields!, { ...spec.base!(), ...(key.includes('draft') || key.includes('revisions') ? { draftVersion: await draftVersionOf(ids.sheetId) } : {}) }), { numRuns: BODIES_PER_ROUTE, seed: 20_417 })
      for (const body of samples) {
        const res = await rawJson(method, spec.path(), body.text, cookieOf(spec.caller()))
        tried += 1
        if (res.status >= 500) serverErrors += 1
        const message = res.body?.message ?? ''
        // the field at fault by its label (or one element of a list by its number), never by its path
        const field = body.fault === null ? null : spec.fields![body.fault]!
        const said = message.toLowerCase()
        const named = field === null || said.includes(field.label.toLowerCase()) || (field.element !== undefined && said.includes(field.element.toLowerCase()))
        const path = Object.keys(spec.fields!).find(name => name.toLowerCase() !== spec.fields![name]!.label.toLowerCase() && new RegExp(`(^|; )${name}(\\.\\d+)*(\\.\\w+)?:`).test(message))
        if (res.status < 400 || res.status >= 500 || generic.test(message) || !named || path) {
          problems.push(`${res.status} ${message.slice(0, 160)} ← ${body.text.slice(0, 160)}`)
        }
      }
      expect(problems.slice(0, 10)).toEqual([])
    }, 300_000)
  }

  it('wrote nothing: every table has as many rows as before, and the log the same head', async () => {
    const after = await snapshot()
    expect(after.counts).toEqual(before.counts)
    expect(after.head).toEqual(before.head)
  })
})

function cookieOf(s: Session | SessionLike) {
  return s instanceof SessionLike ? '' : s.cookie
}
