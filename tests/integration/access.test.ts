// Access by project, driven from the one permission table (server/utils/access-rules.ts): every
// route under server/api has a rule, and every rule holds for every kind of caller — nobody, the
// administrator, a member of the project in each role, and a person of each role outside it.
import { readdirSync, readFileSync } from 'node:fs'
import { join, relative, resolve } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { ACCESS_RULES, type AccessRule, type RecordKind } from '../../server/utils/access-rules'
import type { ProjectRole, Role } from '../../shared/types/roles'
import { unique } from '../helpers/client'
import { issue, makeSheet, newPerson, session, Session } from './records-fixtures'

const apiDir = resolve(import.meta.dirname, '..', '..', 'server', 'api')

/** Every route file under server/api as Nitro serves it: `METHOD /api/path/:param`. */
function routeFiles(dir = apiDir): Array<{ key: string, file: string }> {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name)
    if (entry.isDirectory()) return routeFiles(path)
    const match = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(entry.name)
    if (!match) return [{ key: `(no method) ${relative(apiDir, path)}`, file: path }]
    const segments = [...relative(apiDir, dir).split('/').filter(Boolean), match[1]!]
      .filter(s => s !== 'index')
      .map(s => s.replace(/^\[(\w+)\]$/, ':$1'))
    return [{ key: `${match[2]!.toUpperCase()} /api/${segments.join('/')}`, file: path }]
  })
}

const RULES = ACCESS_RULES as Record<string, AccessRule>
const RECORD_NAMES: Record<RecordKind, string> = { project: 'project', sheet: 'calc sheet', revision: 'revision', review: 'review', attachment: 'attachment' }

describe('the permission table', () => {
  it('has a rule for every route file and no rule without one', () => {
    const keys = routeFiles().map(r => r.key).sort()
    expect(keys.filter(k => !(k in RULES)), 'routes without a rule in server/utils/access-rules.ts').toEqual([])
    expect(Object.keys(RULES).filter(k => !keys.includes(k)), 'rules for routes that do not exist').toEqual([])
  })

  it('is applied by every route that is not open to anyone, with the record\'s id where it names one', () => {
    for (const { key, file } of routeFiles()) {
      const rule = RULES[key]
      if (!rule || rule.who === 'open') continue
      const source = readFileSync(file, 'utf8')
      expect(source, key).toMatch(rule.who === 'record' ? /authorize\(event, id\)/ : /authorize\(event\)/)
      expect(source, `${key} uses an older guard`).not.toMatch(/requireRole|requireUser/)
    }
  })
})

/** A kind of caller: their account's role (none when not signed in) and their role on the project (none outside it). */
interface Persona { label: string, account: Role | null, project: ProjectRole | null }
type Expected = 'allowed' | 401 | 403 | 404
const PROJECT_ROLE_LIST: ProjectRole[] = ['engineer', 'checker', 'records']
const PERSONAS: Persona[] = [
  { label: 'nobody', account: null, project: null },
  { label: 'admin', account: 'admin', project: null },
  ...PROJECT_ROLE_LIST.map(role => ({ label: `member ${role}`, account: role, project: role })),
  ...PROJECT_ROLE_LIST.map(role => ({ label: `outsider ${role}`, account: role, project: null })),
  // the role on the project, not the account's, is what counts on it
  { label: 'engineer checking the project', account: 'engineer', project: 'checker' },
]

/** What the table says a persona gets from a route. */
function expected(rule: AccessRule, persona: Persona): Expected {
  if (rule.who === 'open') return 'allowed'
  if (persona.account === null) return 401
  if (rule.who === 'account') {
    const heldOnProject = rule.lists !== undefined && rule.lists !== 'any' && persona.project === rule.lists
    return rule.roles === 'any' || rule.roles.includes(persona.account) || heldOnProject ? 'allowed' : 403
  }
  if (persona.account === 'admin') return 403
  if (persona.project === null) return 404
  return rule.roles === 'any' || rule.roles.includes(persona.project) ? 'allowed' : 403
}

describe('every route × every caller', () => {
  const people = new Map<string, Session>()
  const ids = { project: 0, sheet: 0, revision: 0, review: 0, attachment: 0, template: 0, person: 0 }

  beforeAll(async () => {
    const made = await makeSheet()
    ids.project = made.projectId
    ids.sheet = made.sheetId
    // fresh accounts throughout: some routes below end every session of the caller
    people.set('nobody', new Session())
    const boss = await session('admin')
    const adminEmail = `${unique('admin')}@tendonbook.local`
    expect((await boss.json('POST', '/api/admin/users', { email: adminEmail, name: 'Second Administrator', role: 'admin', password: 'a-long-enough-password' })).status).toBe(201)
    const admin = new Session()
    expect((await admin.json('POST', '/api/auth/signin', { email: adminEmail, password: 'a-long-enough-password' })).status).toBe(200)
    people.set('admin', admin)
    for (const persona of PERSONAS.filter(p => p.account && p.account !== 'admin')) {
      const person = await newPerson(persona.account as ProjectRole, persona.label)
      if (persona.project) expect((await boss.json('POST', `/api/admin/projects/${ids.project}/members`, { userId: person.id, role: persona.project })).status).toBe(200)
      else if (persona.account === 'engineer') ids.person = person.id
      people.set(persona.label, person.session)
    }
    const engineer = people.get('member engineer')!
    const issued = await issue(engineer, ids.sheet, { note: 'for the access table' })
    expect(issued.status).toBe(201)
    ids.revision = issued.body.id
    const reviewed = await people.get('member checker')!.json('POST', `/api/revisions/${ids.revision}/reviews`, { decision: 'comment', comments: [{ anchor: '', text: 'Check the cover.' }] })
    expect(reviewed.status).toBe(201)
    ids.review = (reviewed.body.reviews as Array<{ id: number }>).at(-1)!.id
    const uploaded = await engineer.upload(`/api/sheets/${ids.sheet}/attachments`, new TextEncoder().encode('%PDF-1.4\n%%EOF\n'), 'note.pdf', 'application/pdf')
    expect(uploaded.status).toBe(201)
    ids.attachment = uploaded.body.id
    ids.template = (await engineer.json('GET', '/api/templates')).body[0].id
  })

  /** The URL of a route with real records in it: the rule's record for `:id`, else what the route is about. */
  function urlOf(key: string, rule: AccessRule) {
    const path = key.split(' ')[1]!
    const id = rule.who === 'record'
      ? ids[rule.record]
      : path.startsWith('/api/templates') ? ids.template : path.startsWith('/api/admin/users') ? ids.person : ids.project
    return path.replace(':id', String(id)).replace(':userId', String(ids.person))
  }

  // the routes that end the caller's session go last
  const last = ['POST /api/auth/signout-everywhere', 'POST /api/auth/signout']
  const keys = [...Object.keys(RULES).filter(k => !last.includes(k)), ...last]

  it('answers each as the table says: 401 for nobody, 403 for a role that may not act, 404 outside one\'s projects', async () => {
    const wrong: string[] = []
    for (const key of keys) {
      const rule = RULES[key]!
      const method = key.split(' ')[0]!
      const url = urlOf(key, rule)
      for (const persona of PERSONAS) {
        const want = expected(rule, persona)
        const res = await people.get(persona.label)!.json(method, url, method === 'GET' ? undefined : {})
        const message = typeof res.body === 'object' && res.body ? String((res.body as { message?: unknown }).message ?? '') : ''
        const hidden = rule.who === 'record' && res.status === 404 && message === `No ${RECORD_NAMES[rule.record]} with id ${ids[rule.record]}`
        const ok = want === 'allowed'
          ? ![401, 403, 500].includes(res.status) && !hidden
          : want === 404 ? hidden : res.status === want
        if (!ok) wrong.push(`${key} as ${persona.label}: expected ${want}, got ${res.status} ${message}`)
      }
    }
    expect(wrong).toEqual([])
  }, 600_000)
})

describe('membership', () => {
  it('makes the creator of a project its engineer, and hides it from everyone else', async () => {
    const creator = await newPerson('engineer', 'Project Creator')
    const jobNumber = unique('M')
    const made = await creator.session.json('POST', '/api/projects', { jobNumber, name: 'Quay car park deck' })
    expect(made.status).toBe(201)
    expect(made.body.members).toEqual([{ userId: creator.id, name: 'Project Creator', role: 'engineer' }])
    const mine = (await creator.session.json('GET', '/api/projects')).body as Array<{ jobNumber: string, yourRole: string }>
    expect(mine.find(p => p.jobNumber === jobNumber)?.yourRole).toBe('engineer')
    const other = await session('engineer')
    expect(((await other.json('GET', '/api/projects')).body as Array<{ jobNumber: string }>).map(p => p.jobNumber)).not.toContain(jobNumber)
    const hidden = await other.json('GET', `/api/projects/${made.body.id}`)
    expect(hidden.status).toBe(404)
    expect(hidden.body.message).toBe(`No project with id ${made.body.id}`)
  })

  it('lets the administrator add, change and remove members, and refuses what cannot be, in words', async () => {
    const { projectId, sheetId } = await makeSheet()
    const admin = await session('admin')
    const person = await newPerson('checker', 'Later Checker')
    expect((await person.session.json('GET', `/api/sheets/${sheetId}`)).status).toBe(404)

    const added = await admin.json('POST', `/api/admin/projects/${projectId}/members`, { userId: person.id, role: 'checker' })
    expect(added.status).toBe(200)
    expect(added.body.message).toMatch(/^Later Checker is checker on Alder Yard podium/)
    expect((await person.session.json('GET', `/api/sheets/${sheetId}`)).status).toBe(200)
    const saving = await person.session.json('PUT', `/api/sheets/${sheetId}/draft`, { inputs: {}, draftVersion: 1 })
    expect(saving.status).toBe(403)
    expect(saving.body.message).toMatch(/you are a checker; this needs an engineer of the project/)

    const listed = (await admin.json('GET', '/api/admin/projects')).body as Array<{ id: number, members: Array<{ userId: number, role: string }> }>
    expect(listed.find(p => p.id === projectId)!.members).toContainEqual(expect.objectContaining({ userId: person.id, role: 'checker' }))

    const adminId = (await admin.json('GET', '/api/auth/me')).body.id
    const notAdmin = await admin.json('POST', `/api/admin/projects/${projectId}/members`, { userId: adminId, role: 'engineer' })
    expect(notAdmin.status).toBe(400)
    expect(notAdmin.body.message).toContain('administrators are not members of projects')
    const badRole = await admin.json('POST', `/api/admin/projects/${projectId}/members`, { userId: person.id, role: 'admin' })
    expect(badRole.status).toBe(400)
    expect(badRole.body.data.fields.role).toContain('engineer, checker or records')
    expect((await admin.json('POST', '/api/admin/projects/99999999/members', { userId: person.id, role: 'checker' })).status).toBe(404)

    const removed = await admin.json('DELETE', `/api/admin/projects/${projectId}/members/${person.id}`)
    expect(removed.status).toBe(200)
    expect((await person.session.json('GET', `/api/sheets/${sheetId}`)).status).toBe(404)
    const again = await admin.json('DELETE', `/api/admin/projects/${projectId}/members/${person.id}`)
    expect(again.status).toBe(404)
    expect(again.body.message).toContain('Later Checker is not a member')
  })

  it('lets any engineer of the project save the draft; the sheet names who saved, the revision its issuer', async () => {
    const { projectId, sheetId } = await makeSheet()
    const colleague = await newPerson('engineer', 'Second Engineer', projectId)
    const sheet = (await colleague.session.json('GET', `/api/sheets/${sheetId}`)).body
    expect(sheet.yourRole).toBe('engineer')
    const saved = await colleague.session.json('PUT', `/api/sheets/${sheetId}/draft`, { inputs: sheet.inputs, draftVersion: sheet.draftVersion })
    expect(saved.status).toBe(200)
    expect((await colleague.session.json('GET', `/api/sheets/${sheetId}`)).body.updatedByName).toBe('Second Engineer')
    const engineer = await session('engineer')
    const issued = await issue(engineer, sheetId)
    expect(issued.status).toBe(201)
    expect(issued.body.author.name).not.toBe('Second Engineer')
  })

  it('shows lists of the caller\'s projects only: the check queue and the archive', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const issued = await issue(engineer, sheetId)
    expect(issued.status).toBe(201)
    const inQueue = ((await (await session('checker')).json('GET', '/api/checking/queue')).body as Array<{ id: number }>).map(r => r.id)
    expect(inQueue).toContain(issued.body.id)
    const outsider = await newPerson('checker', 'Checker Elsewhere')
    expect((await outsider.session.json('GET', '/api/checking/queue')).body).toEqual([])
    const records = await newPerson('records', 'Records Elsewhere')
    const archive = (await records.session.json('GET', '/api/archive')).body
    expect(archive).toEqual({ register: [], total: 0, page: 1, pageSize: 50, awaiting: [] })
  })

  it('shows the development mailbox\'s messages to their recipients only', async () => {
    const person = await newPerson('engineer', 'Mail Reader')
    const res = await person.session.json('GET', '/api/mailbox')
    expect(res.status).toBe(200)
    expect(res.body.messages).toEqual([])
    const checker = await session('checker')
    const theirs = (await checker.json('GET', '/api/mailbox')).body.messages as Array<{ to: string[] }>
    expect(theirs.every(m => m.to.includes('checker@tendonbook.local'))).toBe(true)
  })
})
