import { describe, expect, it } from 'vitest'
import { designMember } from '../../shared/engine'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { auditHash, revisionHash } from '../../server/utils/hashing'
import { countRows, withDb } from '../helpers/db'
import { DEMO } from '../helpers/client'
import { draftVersionOf, issue, makeSheet, session, setSheetInputs, triggerSql, userId, waitForMail, withRoot } from './records-fixtures'

async function revisionRow(id: number) {
  return withDb(async (conn) => {
    const [rows] = await conn.query('SELECT * FROM revisions WHERE id = ?', [id])
    const r = (rows as Array<Record<string, any>>)[0]!
    const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)
    return {
      sheetId: r.sheet_id, seq: r.seq, code: r.code, note: r.note, inputs: json(r.inputs), results: json(r.results),
      templateId: r.template_id, templateSlug: r.template_slug, templateVersion: r.template_version, templateTitle: r.template_title,
      model: r.model, templateBody: r.template_body, engineVersion: r.engine_version, reportHtml: r.report_html,
      reportSections: json(r.report_sections), authorId: r.author_id, issuedAt: new Date(`${String(r.issued_at instanceof Date ? r.issued_at.toISOString() : r.issued_at)}`),
      prevHash: r.prev_hash, contentHash: r.content_hash as string,
    }
  })
}

describe('issuing a revision', () => {
  it('answers the issue with the revision\'s id, code and content hash only', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const res = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), note: 'small answer' })
    expect(res.status).toBe(201)
    const row = await revisionRow(res.body.id)
    expect(res.body).toEqual({ id: res.body.id, code: 'P01', contentHash: row.contentHash })
    expect(revisionHash(row)).toBe(row.contentHash)
  })

  it('freezes a run the server computed itself, with its content hash', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    // results sent by a client are not an input of the route: they are ignored
    const res = await issue(engineer, sheetId, { note: 'First issue', results: { checks: [] } })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ code: 'P01', seq: 1, note: 'First issue', status: { status: 'issued', suitability: 'S3' } })
    const row = await revisionRow(res.body.id)
    // the frozen checks are the engine's own, run here again from the demo inputs
    const expected = designMember(DEMO_PS2)
    expect((row.results as { checks: unknown[] }).checks).toEqual(JSON.parse(JSON.stringify(expected.checks)))
    expect(row.engineVersion).toBe(expected.engineVersion)
    expect(row.prevHash).toBeNull()
    expect(revisionHash(row)).toBe(row.contentHash)
    expect(res.body.contentHash).toBe(row.contentHash)
    expect(row.reportHtml).toContain('competent engineer')
  })

  it('gives concurrent issues of one sheet distinct, consecutive codes, each chained to the one before', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const results = await Promise.all(Array.from({ length: 6 }, (_, i) => issue(engineer, sheetId, { note: `parallel ${i}` })))
    expect(results.map(r => r.status)).toEqual(Array(6).fill(201))
    expect(results.map(r => r.body.code).sort()).toEqual(['P01', 'P02', 'P03', 'P04', 'P05', 'P06'])
    const rows = await Promise.all(results.map(r => revisionRow(r.body.id)))
    rows.sort((a, b) => a.seq - b.seq)
    for (let i = 1; i < rows.length; i++) expect(rows[i]!.prevHash).toBe(rows[i - 1]!.contentHash)
  })

  it('refuses an issue by a checker, and bad inputs with 422 naming the field, writing nothing', async () => {
    const { sheetId, jobNumber } = await makeSheet()
    const checker = await session('checker')
    expect((await issue(checker, sheetId)).status).toBe(403)
    const engineer = await session('engineer')
    await setSheetInputs(sheetId, { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: -5 } })
    const res = await issue(engineer, sheetId)
    expect(res.status).toBe(422)
    expect(res.body.message).toContain('Overall depth')
    expect(res.body.data.fields).toHaveProperty(['inputs.section.h'])
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(0)
    expect(await countRows('outbox', 'subject LIKE ?', [`%job ${jobNumber} %`])).toBe(0)
    expect((await engineer.json('POST', '/api/sheets/99999999/revisions', { draftVersion: 1 })).status).toBe(404)
  })
})

describe('history only grows', () => {
  it('refuses UPDATE and DELETE on a revision, to the app user and to root alike', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const { body } = await issue(engineer, sheetId)
    await expect(withDb(c => c.query('UPDATE revisions SET note = ? WHERE id = ?', ['changed', body.id]))).rejects.toThrow(/denied/i)
    await expect(withDb(c => c.query('DELETE FROM revisions WHERE id = ?', [body.id]))).rejects.toThrow(/denied/i)
    await expect(withRoot(c => c.query('UPDATE revisions SET note = ? WHERE id = ?', ['changed', body.id]))).rejects.toThrow('append-only')
    await expect(withRoot(c => c.query('DELETE FROM revisions WHERE id = ?', [body.id]))).rejects.toThrow('append-only')
    await expect(withRoot(c => c.query('DELETE FROM audit_events ORDER BY id DESC LIMIT 1'))).rejects.toThrow('append-only')
    // a revision with a gap in the numbering, or a wrong link, is refused by the chain trigger
    await expect(withRoot(c => c.query('INSERT INTO revisions SELECT NULL, sheet_id, seq + 5, \'P99\', note, inputs, results, template_id, template_slug, template_version, template_title, model, template_body, engine_version, report_html, report_sections, author_id, issued_at, REPEAT(\'e\', 64), content_hash, failing_checks_reason, replies FROM revisions WHERE id = ?', [body.id]))).rejects.toThrow('without a gap')
    // foreign keys to history are ON DELETE RESTRICT
    await expect(withRoot(c => c.query('DELETE FROM sheets WHERE id = ?', [sheetId]))).rejects.toThrow(/foreign key/i)
  })

  it('finds a tampered revision with verify chain, and the chain is whole again once it is put back', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const records = await session('records')
    const { body } = await issue(engineer, sheetId, { note: 'original note' })
    const intact = await records.json('POST', '/api/chain/verify')
    expect(intact.body.ok, JSON.stringify(intact.body.firstBreak)).toBe(true)
    const restore = triggerSql('revisions_no_update')
    try {
      await withRoot(async (c) => {
        await c.query('DROP TRIGGER revisions_no_update')
        await c.query('UPDATE revisions SET note = ? WHERE id = ?', ['tampered note', body.id])
      })
      const broken = await records.json('POST', '/api/chain/verify')
      expect(broken.body.ok).toBe(false)
      expect(broken.body.firstBreak).toMatchObject({ chain: 'revisions', id: body.id })
      expect(broken.body.firstBreak.reason).toContain('no longer matches')
      // nor is the changed revision shown or printed as if it were the one issued
      const shown = await engineer.json('GET', `/api/revisions/${body.id}`)
      expect(shown.status).toBe(409)
      expect(shown.body.message).toContain('no longer matches its content hash')
      expect((await records.json('GET', `/api/revisions/${body.id}/print`)).status).toBe(409)
    }
    finally {
      await withRoot(async (c) => {
        await c.query('DROP TRIGGER IF EXISTS revisions_no_update')
        await c.query('UPDATE revisions SET note = ? WHERE id = ?', ['original note', body.id])
        await c.query(restore)
      })
    }
    expect((await records.json('POST', '/api/chain/verify')).body.ok).toBe(true)
    expect((await engineer.json('POST', '/api/chain/verify')).status).toBe(403)
  })

  it('chains audit events for sign-in, failed sign-in and issue', async () => {
    const { sheetId } = await makeSheet()
    const bad = await session('engineer')
    await bad.json('POST', '/api/auth/signin', { email: DEMO.checker.email, password: 'wrong password' })
    const engineer = await session('engineer')
    const { body } = await issue(engineer, sheetId)
    const events = await withDb(async (c) => {
      const [rows] = await c.query('SELECT * FROM audit_events ORDER BY seq')
      return rows as Array<Record<string, any>>
    })
    const actions = events.map(e => e.action)
    expect(actions).toContain('signin')
    expect(actions).toContain('signin.failed')
    expect(events.some(e => e.action === 'revision.issued' && (typeof e.detail === 'string' ? JSON.parse(e.detail) : e.detail).revisionId === body.id)).toBe(true)
    let prev: string | null = null
    for (const e of events) {
      const fields = { seq: e.seq, action: e.action, subject: e.subject, actorId: e.actor_id, address: e.address, detail: typeof e.detail === 'string' ? JSON.parse(e.detail) : e.detail, createdAt: new Date(e.created_at), prevHash: e.prev_hash }
      expect(e.prev_hash).toBe(prev)
      expect(auditHash(fields)).toBe(e.hash)
      prev = e.hash
    }
  })
})

describe('check and sign-off', () => {
  it('returns with anchored comments, shows the diff of the next issue, approves as C01 and mails each party', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const first = (await issue(engineer, sheetId, { note: 'for check' })).body
    const issuedMail = await waitForMail(m => m.to.includes(DEMO.checker.email) && m.raw.includes(`/revisions/${first.id}`))
    expect(issuedMail.raw).toContain('issued for check')

    const queue = await checker.json('GET', '/api/checking/queue')
    expect(queue.body.map((q: { id: number }) => q.id)).toContain(first.id)

    const anchor = first.sections[0].id
    expect((await checker.json('POST', `/api/revisions/${first.id}/reviews`, { decision: 'return', comments: [] })).status).toBe(400)
    expect((await checker.json('POST', `/api/revisions/${first.id}/reviews`, { decision: 'return', comments: [{ anchor: 'no-such-section', text: 'x' }] })).status).toBe(400)
    const returned = await checker.json('POST', `/api/revisions/${first.id}/reviews`, { decision: 'return', comments: [{ anchor, text: 'Check the drape in span 2' }] })
    expect(returned.status).toBe(201)
    expect(returned.body.status.status).toBe('returned')
    expect(returned.body.reviews[0].comments).toEqual([{ anchor, text: 'Check the drape in span 2' }])
    await waitForMail(m => m.to.includes(DEMO.engineer.email) && m.raw.includes('returned with comments') && m.raw.includes(`/revisions/${first.id}`))
    expect((await checker.json('POST', `/api/revisions/${first.id}/reviews`, { decision: 'approve' })).status).toBe(409)

    await setSheetInputs(sheetId, { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: 280 } })
    const second = (await issue(engineer, sheetId, { note: 'depth 280 mm' })).body
    expect(second.code).toBe('P02')
    const diff = await checker.json('GET', `/api/revisions/${second.id}/diff`)
    expect(diff.body.against.code).toBe('P01')
    expect(diff.body.diff.inputs.map((c: { path: string }) => c.path)).toContain('section.h')
    expect(diff.body.diff.inputs.find((c: { path: string }) => c.path === 'section.h')).toMatchObject({ label: 'Overall depth', group: 'section' })
    expect(diff.body.diff.all.length).toBeGreaterThan(0)
    expect(diff.body.diff.sections.length).toBeGreaterThan(0)
    const firstAfter = await checker.json('GET', `/api/revisions/${first.id}`)
    expect(firstAfter.body.status.status).toBe('superseded')

    const approved = await checker.json('POST', `/api/revisions/${second.id}/reviews`, { decision: 'approve', comments: [{ anchor: '', text: 'Checked.' }] })
    expect(approved.status).toBe(201)
    expect(approved.body.status).toMatchObject({ status: 'approved', contractCode: 'C01', suitability: 'A1' })
    await waitForMail(m => m.to.includes(DEMO.engineer.email) && m.raw.includes('approved as C01') && m.raw.includes(`/revisions/${second.id}`))
    await waitForMail(m => m.to.includes(DEMO.records.email) && m.raw.includes('ready to seal') && m.raw.includes(`/revisions/${second.id}`))
    expect((await checker.json('POST', `/api/revisions/${second.id}/reviews`, { decision: 'approve' })).status).toBe(409)
  })

  it('never lets the author approve their own revision, even once they check the project', async () => {
    const { sheetId, projectId } = await makeSheet()
    const engineer = await session('engineer')
    const rev = (await issue(engineer, sheetId)).body
    // the author becomes a checker of the project after issuing
    const admin = await session('admin')
    const authorId = await userId('engineer')
    expect((await admin.json('POST', `/api/admin/projects/${projectId}/members`, { userId: authorId, role: 'checker' })).status).toBe(200)
    const seen = (await engineer.json('GET', `/api/revisions/${rev.id}`)).body
    expect(seen.can.approve).toBe(false)
    expect(seen.can.decide).toBe(false)
    const refused = await engineer.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })
    expect(refused.status).toBe(403)
    expect(refused.body.message).toContain('someone other than its author')
    // returning one's own revision is a decision on it too
    const returned = await engineer.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'return', comments: [{ anchor: '', text: 'my own' }] })
    expect(returned.status).toBe(403)
    expect(returned.body.message).toContain('returned by someone other than its author')
    // and the database refuses it too, whatever the application does
    await expect(withDb(c => c.query('INSERT INTO reviews (revision_id, sheet_id, decision, contract_code, comments, reviewer_id, created_at, content_hash) VALUES (?, ?, \'approve\', \'C01\', \'[]\', ?, NOW(3), REPEAT(\'f\', 64))', [rev.id, sheetId, authorId]))).rejects.toThrow('may not approve')
    // the administrator decides nothing on engineering work
    const byAdmin = await admin.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })
    expect(byAdmin.status).toBe(403)
    expect(byAdmin.body.message).toContain('not engineering work')
    const records = await session('records')
    expect((await records.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })).status).toBe(403)
    const checker = await session('checker')
    expect((await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })).status).toBe(201)
  })
})
