import { describe, expect, it } from 'vitest'
import { signedIn, unique } from '../helpers/client'
import { countRows } from '../helpers/db'

describe('projects', () => {
  it('creates a project and lists it', async () => {
    const client = await signedIn('engineer')
    const jobNumber = unique('J')
    const res = await client.post('/api/projects', { jobNumber, name: 'Harbour car park deck', client: 'Example client', site: 'Quay 3' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ jobNumber, name: 'Harbour car park deck', sheets: [] })
    const list = await client.get('/api/projects')
    expect(list.body.map((p: { jobNumber: string }) => p.jobNumber)).toContain(jobNumber)
    const one = await client.get(`/api/projects/${res.body.id}`)
    expect(one.body.name).toBe('Harbour car park deck')
  })

  it('answers a bad body with 400 naming each field, and writes nothing', async () => {
    const client = await signedIn('engineer')
    const before = await countRows('projects')
    const res = await client.post('/api/projects', { jobNumber: 'bad job!', name: 'ab' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fields).sort()).toEqual(['jobNumber', 'name'])
    // in the form's words: labels, never the field's path
    expect(res.body.message).toMatch(/^Job number: .+; Project name: .+$/)
    expect(res.body.message).not.toContain('jobNumber')
    expect(await countRows('projects')).toBe(before)
  })

  it('refuses a duplicate job number with 409 naming the field', async () => {
    const client = await signedIn('engineer')
    const res = await client.post('/api/projects', { jobNumber: '2417', name: 'Second Alder Yard' })
    expect(res.status).toBe(409)
    expect(res.body.data.fields).toHaveProperty('jobNumber')
  })

  it('refuses project creation to a checker', async () => {
    const client = await signedIn('checker')
    const res = await client.post('/api/projects', { jobNumber: unique('C'), name: 'Not allowed' })
    expect(res.status).toBe(403)
  })

  it('answers an unknown project with 404 and a bad id with 400', async () => {
    const client = await signedIn('engineer')
    expect((await client.get('/api/projects/999999')).status).toBe(404)
    expect((await client.get('/api/projects/abc')).status).toBe(400)
  })
})
