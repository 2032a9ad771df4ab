/**
 * The sheet's own text: saved with the draft, frozen with the revision, shown to the checker as a
 * prose diff; a newer template version merged three ways into it, a conflict refused at issue until
 * resolved. Against the real server and database.
 */
import { describe, expect, it } from 'vitest'
import { signedIn, unique } from '../helpers/client'
import { png } from '../helpers/png'
import { sha256Hex } from '../../server/utils/hashing'
import { makeSheet, session } from './records-fixtures'

async function demoProject(client: Awaited<ReturnType<typeof signedIn>>) {
  const projects = (await client.get('/api/projects')).body as Array<{ id: number, jobNumber: string }>
  return projects.find(p => p.jobNumber === '2417')!.id
}

describe('the sheet\'s own text', () => {
  it('is saved with the draft, frozen with the revision, and its change reaches the checker\'s diff', async () => {
    const admin = await signedIn('admin')
    const builtin = ((await admin.get('/api/templates')).body as Array<{ id: number, slug: string }>).find(t => t.slug === 'pt-slab-strip')!
    const source = (await admin.get(`/api/templates/${builtin.id}`)).body.body as string
    // an office template of the test's own, so that publishing a newer version touches no other test
    const slug = unique('office-text-').toLowerCase()
    const v1 = (await admin.post('/api/templates', { slug, body: source })).body as { id: number }

    const engineer = await signedIn('engineer')
    const sheet = (await engineer.post(`/api/projects/${await demoProject(engineer)}/sheets`, { reference: unique('TX-'), title: 'Own text', templateId: v1.id })).body
    expect(sheet.body).toBeNull()

    const mine = source.replace('# Loads', '# Loads\n\nThe façade is checked by hand below.\n\n::: calc\nh_f = 3.6 m  # Façade height\ng_f = 0.75 kN/m^2  # Façade weight\nw_f = h_f * g_f  # Façade line load\ncheck w_f <= 7.5 kN/m  # Within the line load designed for\n:::\n')
    const saved = await engineer.request('PUT', `/api/sheets/${sheet.id}/draft`, { inputs: sheet.inputs, draftVersion: sheet.draftVersion, body: mine })
    expect(saved.status).toBe(200)
    expect((await engineer.get(`/api/sheets/${sheet.id}`)).body.body).toBe(mine)

    const first = await engineer.issue(sheet.id, { note: 'own text' })
    expect(first.status).toBe(201)
    const rev1 = (await engineer.get(`/api/revisions/${first.body.id}`)).body
    expect(rev1.reportHtml ?? JSON.stringify(rev1)).toContain('data-name="w_f"')
    expect(JSON.stringify(rev1)).toContain('calc.1.1')

    const reloaded = (await engineer.get(`/api/sheets/${sheet.id}`)).body
    const edited = mine.replace('The façade is checked by hand below.', 'The façade, 3.6 m of glazing, is checked by hand below.')
    await engineer.request('PUT', `/api/sheets/${sheet.id}/draft`, { inputs: reloaded.inputs, draftVersion: reloaded.draftVersion, body: edited })
    const second = await engineer.issue(sheet.id, { note: 'text changed' })
    expect(second.status).toBe(201)
    const checker = await signedIn('checker')
    const diff = (await checker.get(`/api/revisions/${second.body.id}/diff`)).body
    const loads = diff.text.find((t: { title: string }) => t.title === 'Loads')
    expect(loads.kind).toBe('changed')
    expect(loads.parts.filter((p: { kind: string }) => p.kind === 'added').map((p: { text: string }) => p.text).join('')).toContain('3.6 m of glazing')

    // the template's newer version changes the same paragraph: a conflict, refused at issue until resolved
    const v2Body = source.replace('# Loads', '# Loads\n\nThe façade is taken from the architect\'s schedule.\n')
    expect((await admin.post('/api/templates', { slug, body: v2Body })).status).toBe(201)
    const withNewer = (await engineer.get(`/api/sheets/${sheet.id}`)).body
    expect(withNewer.newerTemplateVersion).toBe(2)
    const merged = await engineer.post(`/api/sheets/${sheet.id}/upgrade-template`)
    expect(merged.status).toBe(200)
    expect(merged.body.template.version).toBe(2)
    expect(merged.body.conflicts.length).toBeGreaterThan(0)
    const refused = await engineer.issue(sheet.id, { note: 'unresolved' })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/^Sheet text: .*conflict/)

    // resolved: the engineer keeps their own line
    const resolved = (merged.body.body as string).split('\n').filter((l, i, all) => {
      const open = all.indexOf('<<<<<<< this sheet')
      const end = all.indexOf('>>>>>>> the new version of the template')
      const base = all.indexOf('||||||| the template as this sheet began')
      return !(i === open || (i >= base && i <= end))
    }).join('\n')
    await engineer.request('PUT', `/api/sheets/${sheet.id}/draft`, { inputs: merged.body.inputs, draftVersion: merged.body.draftVersion, body: resolved })
    const third = await engineer.issue(sheet.id, { note: 'merged' })
    expect(third.status).toBe(201)
  })
})

describe('an attached image as a figure of the sheet', () => {
  it('is frozen into the revision\'s report as its own bytes, with its SHA-256', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const image = png(6, 4)
    const up = await engineer.upload(`/api/sheets/${sheetId}/attachments`, image, 'drop-soffit.png')
    expect(up.status).toBe(201)
    const sheet = (await engineer.json('GET', `/api/sheets/${sheetId}`)).body
    const text = `${sheet.template.body}\n\n# Site photographs\n\n::: figure{image="drop-soffit.png"}\nThe drop over the column as cast.\n:::\n`
    expect((await engineer.json('PUT', `/api/sheets/${sheetId}/draft`, { inputs: sheet.inputs, draftVersion: sheet.draftVersion, body: text })).status).toBe(200)
    const again = (await engineer.json('GET', `/api/sheets/${sheetId}`)).body
    const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: again.draftVersion, note: 'with a photograph' })
    expect(issued.status).toBe(201)
    const rev = JSON.stringify((await engineer.json('GET', `/api/revisions/${issued.body.id}`)).body)
    expect(rev).toContain(`data:image/png;base64,${Buffer.from(image).toString('base64')}`)
    expect(rev).toContain(sha256Hex(image))
  })
})
