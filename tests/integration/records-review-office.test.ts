// Comment states and office details through the routes: validation in the user's words, role
// guards, nothing written on bad input, history that only grows, and an approval that freezes the
// office details in force (its review hash still verifies).
import { describe, expect, it } from 'vitest'
import { countRows, withDb } from '../helpers/db'
import { issue, makeSheet, session, withRoot } from './records-fixtures'

/** A 1×1 PNG. */
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGNgYGAAAAAEAAH2FzhVAAAAAElFTkSuQmCC', 'base64')

async function saveOffice(s: Awaited<ReturnType<typeof session>>, fields: Record<string, string>, logo?: { bytes: Uint8Array, name: string }) {
  const form = new FormData()
  for (const [k, v] of Object.entries(fields)) form.append(k, v)
  if (logo) form.append('logoFile', new Blob([logo.bytes]), logo.name)
  const res = await s.fetch('/api/admin/office', { method: 'POST', body: form })
  return { status: res.status, body: await res.json() as any }
}

describe('comment states', () => {
  it('closes and opens a comment as new rows, refusing bad input, other roles and a repeat', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const issued = (await issue(engineer, sheetId, { note: '' })).body
    const anchor = issued.sections.find((s: { title: string }) => s.title === 'Load balancing').id
    const returned = await checker.json('POST', `/api/revisions/${issued.id}/reviews`, { decision: 'return', comments: [{ anchor, text: 'Justify the balanced share' }] })
    expect(returned.status).toBe(201)
    const reviewId = returned.body.reviews[0].id
    expect(returned.body.threads).toMatchObject([{ reviewId, index: 0, state: 'open', section: 'Load balancing', text: 'Justify the balanced share', replies: [] }])

    const before = await countRows('comment_states', 'review_id = ?', [reviewId])
    const bad = await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 3, state: 'closed' })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toContain('has 1 comment, so there is no comment 4')
    expect((await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'shut' })).body.message).toContain('Comment state: open or closed')
    expect((await checker.json('POST', '/api/reviews/99999999/comment-state', { index: 0, state: 'closed' })).status).toBe(404)
    expect((await engineer.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'closed' })).status).toBe(403)
    expect((await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'open' })).status).toBe(409)
    expect(await countRows('comment_states', 'review_id = ?', [reviewId])).toBe(before)

    expect((await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'closed' })).status).toBe(201)
    expect((await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'open' })).status).toBe(201)
    expect((await checker.json('POST', `/api/reviews/${reviewId}/comment-state`, { index: 0, state: 'closed' })).status).toBe(201)
    expect(await countRows('comment_states', 'review_id = ?', [reviewId])).toBe(3)
    // each state is a leaf of the history log, like every other history row
    expect(await countRows('log_leaves', 'kind = \'comment-state\' AND row_id IN (SELECT id FROM comment_states WHERE review_id = ?)', [reviewId])).toBe(3)
    const detail = await checker.json('GET', `/api/revisions/${issued.id}`)
    expect(detail.body.threads[0]).toMatchObject({ state: 'closed', closedBy: { name: expect.any(String) } })

    await expect(withDb(c => c.query('UPDATE comment_states SET state = ? WHERE review_id = ?', ['open', reviewId]))).rejects.toThrow(/denied/i)
    await expect(withRoot(c => c.query('DELETE FROM comment_states WHERE review_id = ?', [reviewId]))).rejects.toThrow('append-only')
    await expect(withRoot(c => c.query('INSERT INTO comment_states (review_id, comment_index, state, actor_id, created_at) SELECT review_id, 7, state, actor_id, created_at FROM comment_states WHERE review_id = ? LIMIT 1', [reviewId]))).rejects.toThrow('no such comment')
  })
})

describe('office details', () => {
  it('saves versions, checks the logo by its content, and an approval freezes the version in force', async () => {
    const admin = await session('admin')
    const engineer = await session('engineer')
    const checker = await session('checker')
    const versions = await countRows('office_details')

    const blank = await saveOffice(admin, { name: ' ' })
    expect(blank.status).toBe(400)
    expect(blank.body.message).toContain('Enter the office\'s name')
    const fake = await saveOffice(admin, { name: 'Harrow & Vane' }, { bytes: new TextEncoder().encode('%PDF-1.4 pretending'), name: 'logo.png' })
    expect(fake.status).toBe(415)
    expect(fake.body.message).toContain('upload a PNG or JPEG image')
    expect((await saveOffice(engineer, { name: 'Not an admin' })).status).toBe(403)
    expect(await countRows('office_details')).toBe(versions)

    const saved = await saveOffice(admin, { name: 'Harrow & Vane' }, { bytes: PNG, name: 'logo.png' })
    expect(saved.status).toBe(201)
    expect(saved.body).toMatchObject({ name: 'Harrow & Vane', logoMime: 'image/png', logoBytes: PNG.length })
    const logo = await admin.fetch(`/api/office-logo/${saved.body.version}`)
    expect(Buffer.from(await logo.arrayBuffer()).equals(PNG)).toBe(true)

    const { sheetId } = await makeSheet()
    const issued = (await issue(engineer, sheetId, { note: '' })).body
    const approved = await checker.json('POST', `/api/revisions/${issued.id}/reviews`, { decision: 'approve', comments: [] })
    expect(approved.body.approvedBy.officeVersion).toBe(saved.body.version)

    // a later version keeps the logo unless told otherwise; the approved revision keeps its own
    const renamed = await saveOffice(admin, { name: 'Vane Partners', logo: 'keep' })
    expect(renamed.body).toMatchObject({ name: 'Vane Partners', logoSha256: saved.body.logoSha256 })
    const print = await checker.json('GET', `/api/revisions/${issued.id}/print`)
    expect(print.body.titleBlock.office).toBe('Harrow & Vane')
    expect(print.body.titleBlock.officeLogo).toBe(`data:image/png;base64,${PNG.toString('base64')}`)
    const without = await saveOffice(admin, { name: 'Vane Partners', logo: 'remove' })
    expect(without.body.logoSha256).toBeNull()

    // the approval's hash covers the version, and the whole chain still verifies
    for (const version of [saved.body.version, renamed.body.version, without.body.version]) expect(await countRows('log_leaves', 'kind = \'office-details\' AND row_id = ?', [version])).toBe(1)
    const verify = await (await session('records')).json('POST', '/api/chain/verify')
    expect(verify.body.ok, JSON.stringify(verify.body.firstBreak)).toBe(true)
    await expect(withRoot(c => c.query('UPDATE office_details SET name = ? WHERE id = ?', ['x', saved.body.version]))).rejects.toThrow('append-only')
  })
})
