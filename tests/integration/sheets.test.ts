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
  it('seeds the demo sheets PS-2, BB-1 and PS-3 from the built-in templates', async () => {
    const client = await signedIn('engineer')
    const project = (await client.get(`/api/projects/${await demoProject(client)}`)).body
    // the end-to-end tests run beside these on the same database and add sheets of their own to the
    // demo project, each with a reference ending in a base-36 time stamp ("RET-mx6e8tar"): leave those out
    const refs = project.sheets.map((s: { reference: string }) => s.reference) as string[]
    expect(refs.filter(r => !/-[0-9a-z]{6,}$/.test(r))).toEqual(['BB-1', 'PS-2', 'PS-3'])
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
    // the message is in people's words: the label, never the path
    expect(refused.body.message).toMatch(/^Span 1: /)
    expect(refused.body.message).not.toContain('geometry.spans')
    const stored = await withDb(async (conn) => {
      const [rows] = await conn.query('SELECT inputs, draft_version AS v FROM sheets WHERE id = ?', [created.id])
      return (rows as Array<{ inputs: string | object, v: number }>)[0]!
    })
    const storedInputs = typeof stored.inputs === 'string' ? JSON.parse(stored.inputs) : stored.inputs
    expect(storedInputs.geometry.spans[0]).toBe(8100)
    expect(stored.v).toBe(saved.body.draftVersion)
  })

  it('lets only the project\'s engineers change a draft', async () => {
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

  it('creates a sheet with the spans given (metres), the per-span lists resized with them', async () => {
    const client = await signedIn('engineer')
    const template = await firstTemplate(client)
    const res = await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: unique('SP-'), title: 'Two spans', templateId: template.id, spans: [6, 7.5] })
    expect(res.status).toBe(201)
    expect(res.body.inputs.geometry.spans).toEqual([6000, 7500])
    if (res.body.inputs.profile.lowPointAt) expect(res.body.inputs.profile.lowPointAt).toHaveLength(2)
    const bad = await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: unique('SP-'), title: 'Bad spans', templateId: template.id, spans: [6, 0.5] })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toBe('Span 2: A span must be at least 1 m')
  })

  it('copies the inputs of another sheet of the project, and refuses a sheet of another project naming the field', async () => {
    const client = await signedIn('engineer')
    const projectId = await demoProject(client)
    const project = (await client.get(`/api/projects/${projectId}`)).body as { sheets: Array<{ id: number, reference: string }> }
    const ps2 = (await client.get(`/api/sheets/${project.sheets.find(s => s.reference === 'PS-2')!.id}`)).body
    const copy = await client.post(`/api/projects/${projectId}/sheets`, { reference: unique('CP-'), title: 'Copy of PS-2', templateId: ps2.template.id, copyFrom: ps2.id })
    expect(copy.status).toBe(201)
    expect(copy.body.inputs).toEqual(ps2.inputs)

    const other = (await client.post('/api/projects', { jobNumber: unique('J'), name: 'Another project' })).body as { id: number }
    const before = await countRows('sheets')
    const refused = await client.post(`/api/projects/${other.id}/sheets`, { reference: unique('CP-'), title: 'Not from here', templateId: ps2.template.id, copyFrom: ps2.id })
    expect(refused.status).toBe(400)
    expect(refused.body.data.fields).toHaveProperty('copyFrom')
    expect(refused.body.message).toMatch(/^Start from: /)
    expect(await countRows('sheets')).toBe(before)
  })

  it('refuses to issue with failing checks and no reason (400 naming the field), and freezes the reason given', async () => {
    const client = await signedIn('engineer')
    const template = await firstTemplate(client)
    const created = (await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: unique('F-'), title: 'Failing checks', templateId: template.id })).body
    const inputs = structuredClone(created.inputs)
    inputs.tendon.spacing = 1500
    inputs.tendon.count = 1
    expect((await client.request('PUT', `/api/sheets/${created.id}/draft`, { inputs, draftVersion: created.draftVersion })).status).toBe(200)
    const before = await countRows('revisions')
    const refused = await client.issue(created.id, { note: 'try' })
    expect(refused.status).toBe(400)
    expect(Object.keys(refused.body.data.fields)).toEqual(['failingChecksReason'])
    expect(refused.body.message).toMatch(/^Reason for issuing with failing checks: \d+ checks? fail/)
    expect(await countRows('revisions')).toBe(before)

    const tooLong = await client.issue(created.id, { failingChecksReason: 'x'.repeat(2001) })
    expect(tooLong.status).toBe(400)
    expect(tooLong.body.message).toMatch(/^Reason for issuing with failing checks: /)

    const issued = await client.issue(created.id, { note: 'try', failingChecksReason: 'Stress state for the layout meeting' })
    expect(issued.status).toBe(201)
    expect(issued.body.failingChecksReason).toBe('Stress state for the layout meeting')
  })

  it('takes replies only to comments of the revision being answered', async () => {
    const client = await signedIn('engineer')
    const template = await firstTemplate(client)
    const created = (await client.post(`/api/projects/${await demoProject(client)}/sheets`, { reference: unique('R-'), title: 'Replies', templateId: template.id })).body
    const p01 = (await client.issue(created.id, {})).body as { id: number }
    const checker = await signedIn('checker')
    const returned = (await checker.post(`/api/revisions/${p01.id}/reviews`, { decision: 'return', comments: [{ anchor: '', text: 'Check the cover.' }] })).body as { reviews: Array<{ id: number }> }
    const review = returned.reviews.at(-1)!
    const wrong = await client.issue(created.id, { replies: [{ reviewId: review.id, index: 3, text: 'Done' }] })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields).toHaveProperty('replies')
    const p02 = await client.issue(created.id, { replies: [{ reviewId: review.id, index: 0, text: 'Cover raised to 30 mm.' }] })
    expect(p02.status).toBe(201)
    expect(p02.body.replies).toEqual([{ reviewId: review.id, index: 0, text: 'Cover raised to 30 mm.', anchor: '', commentText: 'Check the cover.' }])
  })
})
