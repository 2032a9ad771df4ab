import { describe, expect, it } from 'vitest'
import { signedIn, unique } from '../helpers/client'
import { countRows, withDb } from '../helpers/db'

async function demoProject(client: Awaited<ReturnType<typeof signedIn>>) {
  const projects = (await client.get('/api/projects')).body as Array<{ id: number, jobNumber: string }>
  return projects.find(p => p.jobNumber === '2417')!.id
}

async function firstTemplate(client: Awaited<ReturnType<typeof signedIn>>) {
  const templates = (await client.get('/api/templates')).body as Array<{ id: number, slug: string, builtin: boolean }>
  expect(templates.length).toBeGreaterThan(0)
  return templates[0]!
}

describe('calc sheets', () => {
  it('seeds the demo sheets PS-2 and BB-1 from the built-in templates', async () => {
    const client = await signedIn('engineer')
    const project = (await client.get(`/api/projects/${await demoProject(client)}`)).body
    expect(project.sheets.map((s: { reference: string }) => s.reference)).toEqual(['BB-1', 'PS-2'])
  })

  it('creates a sheet from a template with complete starter inputs', async () => {
    const client = await signedIn('engineer')
    const template = await firstTemplate(client)
    const reference = unique('S-')
    const res = await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference, title: 'Transfer slab strip', templateId: template.id })
    expect(res.status).toBe(201)
    expect(res.body.reference).toBe(reference)
    expect(res.body.inputs.annex.k1).toBe(0.8) // EN 1992-1-1 5.10.2.1(1) recommended value, filled in
    expect(res.body.template.id).toBe(template.id)
  })

  it('answers a bad new-sheet body with 400 naming the fields, and writes nothing', async () => {
    const client = await signedIn('engineer')
    const before = await countRows('sheets')
    const res = await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: 'bad ref!', title: 'x', templateId: 0 })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fields).sort()).toEqual(['reference', 'templateId', 'title'])
    expect(await countRows('sheets')).toBe(before)
  })

  it('saves a draft, refuses a stale one with 409 and bad inputs with 400 naming the input', async () => {
    const client = await signedIn('engineer')
    const template = await firstTemplate(client)
    const created = (await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: unique('D-'), title: 'Draft test', templateId: template.id })).body
    const inputs = structuredClone(created.inputs)
    inputs.geometry.spans[0] = 8100
    const saved = await client.request('PUT', `/api/sheets/${created.id}/draft`, { inputs, draftVersion: created.draftVersion })
    expect(saved.status).toBe(200)
    expect(saved.body.draftVersion).toBe(created.draftVersion + 1)

    const stale = await client.request('PUT', `/api/sheets/${created.id}/draft`, { inputs, draftVersion: created.draftVersion })
    expect(stale.status).toBe(409)

    const bad = structuredClone(inputs)
    bad.geometry.spans[0] = -5
    const refused = await client.request('PUT', `/api/sheets/${created.id}/draft`, { inputs: bad, draftVersion: saved.body.draftVersion })
    expect(refused.status).toBe(400)
    expect(Object.keys(refused.body.data.fields)).toContain('inputs.geometry.spans.0')
    const stored = await withDb(async (conn) => {
      const [rows] = await conn.query('SELECT inputs, draft_version AS v FROM sheets WHERE id = ?', [created.id])
      return (rows as Array<{ inputs: string | object, v: number }>)[0]!
    })
    const storedInputs = typeof stored.inputs === 'string' ? JSON.parse(stored.inputs) : stored.inputs
    expect(storedInputs.geometry.spans[0]).toBe(8100)
    expect(stored.v).toBe(saved.body.draftVersion)
  })

  it('lets only engineers and admins change a draft', async () => {
    const engineer = await signedIn('engineer')
    const sheetId = (await engineer.get(`/api/projects/${await demoProject(engineer)}`)).body.sheets[0].id
    const sheet = (await engineer.get(`/api/sheets/${sheetId}`)).body
    const checker = await signedIn('checker')
    expect((await checker.get(`/api/sheets/${sheetId}`)).status).toBe(200)
    const res = await checker.request('PUT', `/api/sheets/${sheetId}/draft`, { inputs: sheet.inputs, draftVersion: sheet.draftVersion })
    expect(res.status).toBe(403)
  })
})

describe('office templates', () => {
  it('publishes immutable versions and refuses a template that names an unknown key, with its line', async () => {
    const admin = await signedIn('admin')
    const builtin = await firstTemplate(admin)
    const source = (await admin.get(`/api/templates/${builtin.id}`)).body.body as string
    const slug = unique('office-').toLowerCase()

    const broken = `${source}\n\nThe span is :val[geometry.no_such_key].\n`
    const line = broken.split('\n').findIndex(l => l.includes('no_such_key')) + 1
    const refused = await admin.post('/api/templates', { slug, body: broken })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toContain(`line ${line}`)
    expect(refused.body.message).toContain('geometry.no_such_key')
    expect(await countRows('templates', 'slug = ?', [slug])).toBe(0)

    const first = await admin.post('/api/templates', { slug, body: source })
    expect(first.status).toBe(201)
    expect(first.body.version).toBe(1)
    const second = await admin.post('/api/templates', { slug, body: `${source}\n\nOffice note: checked against the office's design guide.\n` })
    expect(second.body.version).toBe(2)

    const engineer = await signedIn('engineer')
    expect((await engineer.post('/api/templates', { slug, body: source })).status).toBe(403)
  })
})
