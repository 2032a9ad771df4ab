import { describe, expect, it } from 'vitest'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { verifyTreeHead } from '../../shared/log/tree-head'
import { countRows, withDb } from '../helpers/db'
import { chainBreaks, issue, makeSheet, newPerson, session, userId, withoutTriggers, withRoot } from './records-fixtures'

const LONE = '\ud800'

async function leaves(where = '1=1', params: unknown[] = []) {
  return withDb(async (c) => {
    const [rows] = await c.query(`SELECT leaf_index AS leafIndex, kind, row_id AS rowId, batch FROM log_leaves WHERE ${where} ORDER BY leaf_index`, params)
    return (rows as Array<{ leafIndex: number, kind: string, rowId: number, batch: number }>).map(r => ({ ...r, leafIndex: Number(r.leafIndex), rowId: Number(r.rowId), batch: Number(r.batch) }))
  })
}

describe('text that cannot be stored as it was hashed', () => {
  it('refuses a lone surrogate in a note, a comment and a verify query, naming the field, writing nothing', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const records = await session('records')
    const bad = await issue(engineer, sheetId, { note: `half an emoji ${LONE}` })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.note).toBe('Note for the checker: contains a broken character')
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(0)

    const rev = (await issue(engineer, sheetId, { note: 'whole emoji \ud83d\ude00 kept' })).body
    expect(rev.note).toBe('whole emoji \ud83d\ude00 kept')
    const comment = await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'return', comments: [{ anchor: '', text: `see ${LONE}` }] })
    expect(comment.status).toBe(400)
    expect(comment.body.data.fields['comments.0.text']).toBe('Comment: contains a broken character')
    expect(await countRows('reviews', 'revision_id = ?', [rev.id])).toBe(0)

    const auditBefore = await countRows('audit_events', 'action = ?', ['verify.reference'])
    const query = await records.json('POST', '/api/verify', { query: LONE })
    expect(query.status).toBe(400)
    expect(query.body.message).toContain('Hash or reference: contains a broken character')
    expect(await countRows('audit_events', 'action = ?', ['verify.reference'])).toBe(auditBefore)
    expect(await countRows('audit_events', 'subject LIKE ?', ['%\ufffd%'])).toBe(0)

    const report = await chainBreaks(records)
    expect(report.breaks).toEqual([])
  })
})

describe('verification of every record', () => {
  it('lists every break, with the row and what is wrong, and is whole again once history is put back', async () => {
    const a = await makeSheet()
    const b = await makeSheet()
    const engineer = await session('engineer')
    const records = await session('records')
    const issueNote = async (sheetId: number, note: string) => (await issue(engineer, sheetId, { note })).body as { id: number, code: string }
    const a1 = await issueNote(a.sheetId, 'a one')
    const a2 = await issueNote(a.sheetId, 'a two')
    const a3 = await issueNote(a.sheetId, 'a three')
    const b1 = await issueNote(b.sheetId, 'b one')
    expect((await chainBreaks(records)).ok).toBe(true)

    await withoutTriggers(['revisions_no_update', 'revisions_no_delete', 'revisions_chain_check'], async (root) => {
      await root.query('CREATE TEMPORARY TABLE kept_revision AS SELECT * FROM revisions WHERE id = ?', [a2.id])
      try {
        await root.query('UPDATE revisions SET note = ? WHERE id IN (?, ?)', ['rewritten', a1.id, b1.id])
        await root.query('DELETE FROM revisions WHERE id = ?', [a2.id])
        const report = await chainBreaks(records)
        expect(report.ok).toBe(false)
        const of = (chain: string, id: number) => report.breaks.filter(x => x.chain === chain && x.id === id).map(x => x.problem)
        // a break in sheet A does not hide the later ones, nor those of sheet B
        expect(of('revisions', a1.id)).toEqual(['content'])
        expect(of('revisions', a3.id)).toEqual(['missing'])
        expect(report.breaks.find(x => x.chain === 'revisions' && x.id === a3.id)!.reason).toContain('revision 2 before it is missing')
        expect(of('revisions', b1.id)).toEqual(['content'])
        expect(report.breaks.find(x => x.id === b1.id && x.chain === 'revisions')!.label).toBe('PS-2 P01')
        // the log sees the same: two rows changed, one deleted, and the heads signed before no longer match
        const logLeaves = await leaves('kind = \'revision\' AND row_id IN (?, ?, ?)', [a1.id, a2.id, b1.id])
        const logged = (id: number) => report.breaks.find(x => x.chain === 'log' && x.id === logLeaves.find(l => l.rowId === id)!.leafIndex)?.problem
        expect([logged(a1.id), logged(a2.id), logged(b1.id)]).toEqual(['changed', 'missing', 'changed'])
        expect(report.breaks.some(x => x.chain === 'log' && x.problem === 'head')).toBe(true)
      }
      finally {
        await root.query('INSERT INTO revisions SELECT * FROM kept_revision')
        await root.query('UPDATE revisions SET note = ? WHERE id = ?', ['a one', a1.id])
        await root.query('UPDATE revisions SET note = ? WHERE id = ?', ['b one', b1.id])
      }
    })
    expect((await chainBreaks(records)).breaks).toEqual([])
  })
})

describe('the history log', () => {
  it('logs each history row in its own transaction with consecutive leaves, and signs heads', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const records = await session('records')
    const rev = (await issue(engineer, sheetId, { note: 'logged' })).body
    const approved = await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })
    expect(approved.status).toBe(201)
    const reviewId = approved.body.reviews[0].id

    const all = await leaves()
    expect(all.map(l => l.leafIndex)).toEqual(all.map((_, i) => i))
    const revLeaf = all.find(l => l.kind === 'revision' && l.rowId === rev.id)!
    const reviewLeaf = all.find(l => l.kind === 'review' && l.rowId === reviewId)!
    // the decision and its audit event were written in one transaction: one batch
    const batch = all.filter(l => l.batch === reviewLeaf.batch).map(l => l.kind)
    expect(batch).toEqual(['review', 'audit'])
    expect(all.filter(l => l.batch === revLeaf.batch).map(l => l.kind)).toEqual(['revision', 'audit'])

    const log = await records.json('GET', '/api/log')
    expect(log.status).toBe(200)
    expect(log.body.latest.signatureOk).toBe(true)
    expect(log.body.latest.treeSize).toBeGreaterThan(reviewLeaf.leafIndex)
    // the signature checks with the public key alone
    expect(verifyTreeHead(log.body.latest, log.body.latest.signature, log.body.publicKey)).toBe(true)
    expect(verifyTreeHead({ ...log.body.latest, treeSize: log.body.latest.treeSize - 1 }, log.body.latest.signature, log.body.publicKey)).toBe(false)
    const sizes = log.body.heads.map((h: { treeSize: number }) => h.treeSize)
    expect(sizes.length).toBeGreaterThan(1)
    expect([...sizes].sort((x: number, y: number) => y - x)).toEqual(sizes)
    expect((await engineer.json('GET', '/api/log')).status).toBe(403)
    // heads are history too
    await expect(withDb(c => c.query('DELETE FROM log_heads ORDER BY id DESC LIMIT 1'))).rejects.toThrow(/denied/i)
  })

  it('flags a decision inserted with the application user\'s own grant: not logged, no session', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const records = await session('records')
    const rev = (await issue(engineer, sheetId)).body
    const checkerId = await userId('checker')
    const inserted = await withDb(async (c) => {
      const [res] = await c.query('INSERT INTO reviews (revision_id, sheet_id, decision, contract_code, comments, reviewer_id, created_at, content_hash) VALUES (?, ?, \'return\', NULL, \'[]\', ?, NOW(3), REPEAT(\'0\', 64))', [rev.id, sheetId, checkerId])
      return (res as { insertId: number }).insertId
    })
    try {
      const report = await chainBreaks(records)
      const problems = report.breaks.filter(x => x.chain === 'log' && x.id === inserted).map(x => x.problem).sort()
      expect(problems).toEqual(['decision', 'unlogged'])
      expect(report.breaks.find(x => x.problem === 'decision' && x.id === inserted)!.reason).toContain('not made through a signed-in session')
    }
    finally {
      await withoutTriggers(['reviews_no_delete'], root => root.query('DELETE FROM reviews WHERE id = ?', [inserted]))
    }
    expect((await chainBreaks(records)).breaks).toEqual([])
  })

  it('detects an edited row and reordered leaves against the heads signed before', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const records = await session('records')
    const first = (await issue(engineer, sheetId, { note: 'first' })).body
    const second = (await issue(engineer, sheetId, { note: 'second' })).body
    expect((await chainBreaks(records)).ok).toBe(true)
    const [l1, l2] = await leaves('kind = \'revision\' AND row_id IN (?, ?)', [first.id, second.id])

    await withoutTriggers(['log_leaves_no_update'], async (root) => {
      // swap the two leaves' rows: each leaf now points at the other revision
      await root.query('UPDATE log_leaves SET row_id = -1 WHERE leaf_index = ?', [l1!.leafIndex])
      await root.query('UPDATE log_leaves SET row_id = ? WHERE leaf_index = ?', [first.id, l2!.leafIndex])
      await root.query('UPDATE log_leaves SET row_id = ? WHERE leaf_index = ?', [second.id, l1!.leafIndex])
      try {
        const report = await chainBreaks(records)
        expect(report.breaks.filter(x => x.chain === 'log' && x.problem === 'changed').map(x => x.id).sort()).toEqual([l1!.leafIndex, l2!.leafIndex])
        const head = report.breaks.find(x => x.problem === 'head')!
        expect(head.reason).toContain('no longer give the root')
      }
      finally {
        await root.query('UPDATE log_leaves SET row_id = -1 WHERE leaf_index = ?', [l1!.leafIndex])
        await root.query('UPDATE log_leaves SET row_id = ? WHERE leaf_index = ?', [second.id, l2!.leafIndex])
        await root.query('UPDATE log_leaves SET row_id = ? WHERE leaf_index = ?', [first.id, l1!.leafIndex])
      }
    })
    await withoutTriggers(['audit_events_no_update'], async (root) => {
      const [rows] = await root.query('SELECT id, subject FROM audit_events WHERE JSON_VALUE(detail, \'$.revisionId\') = ? AND action = \'revision.issued\'', [second.id])
      const event = (rows as Array<{ id: number, subject: string }>)[0]!
      await root.query('UPDATE audit_events SET subject = ? WHERE id = ?', ['someone else', event.id])
      try {
        const report = await chainBreaks(records)
        expect(report.breaks.filter(x => x.chain === 'audit').map(x => x.problem)).toEqual(['content'])
        expect(report.breaks.some(x => x.chain === 'log' && x.problem === 'changed' && x.label.startsWith(`audit event ${event.id} `))).toBe(true)
        expect(report.breaks.some(x => x.chain === 'log' && x.problem === 'head')).toBe(true)
      }
      finally {
        await root.query('UPDATE audit_events SET subject = ? WHERE id = ?', [event.subject, event.id])
      }
    })
    expect((await chainBreaks(records)).breaks).toEqual([])
  })
})

describe('issuing the draft on screen', () => {
  it('refuses to freeze a newer draft saved by someone else, with 409 naming who and which version', async () => {
    const { sheetId, projectId } = await makeSheet()
    const engineer = await session('engineer')
    // a second engineer on the job: any engineer of the project may save its draft
    const colleague = (await newPerson('engineer', 'Ruth Okafor', projectId)).session
    const missing = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { note: 'no version' })
    expect(missing.status).toBe(400)
    expect(missing.body.data.fields.draftVersion).toContain('draft version on your screen')
    // the engineer has version 1 on screen; the colleague saves a change meanwhile (one that keeps every
    // check passing, so the fresh issue below needs no reason for failing checks)
    const saved = await colleague.json('PUT', `/api/sheets/${sheetId}/draft`, { inputs: { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: 280 } }, draftVersion: 1 })
    expect(saved.status).toBe(200)
    const stale = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { note: 'what I checked', draftVersion: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.message).toMatch(/^Ruth Okafor saved a newer draft of PS-2 \(version 2; you are looking at version 1\).*Reload the sheet/)
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(0)
    const fresh = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { note: 'after reloading', draftVersion: 2 })
    expect(fresh.status).toBe(201)
    expect(fresh.body.code).toBe('P01')
  })
})

describe('retries with an Idempotency-Key', () => {
  let n = 0
  const newKey = () => `test-action-${Date.now().toString(36)}-${n++}`

  it('answers a retried issue with the first revision, never a second; another body or route with the key is 422', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const url = `/api/sheets/${sheetId}/revisions`
    const key = newKey()
    const first = await engineer.json('POST', url, { note: 'once', draftVersion: 1 }, { 'idempotency-key': key })
    expect(first.status).toBe(201)
    const retry = await engineer.json('POST', url, { note: 'once', draftVersion: 1 }, { 'idempotency-key': key })
    expect(retry.status).toBe(201)
    expect(retry.body).toMatchObject({ id: first.body.id, code: 'P01', contentHash: first.body.contentHash })
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(1)

    const changed = await engineer.json('POST', url, { note: 'twice', draftVersion: 1 }, { 'idempotency-key': key })
    expect(changed.status).toBe(422)
    expect(changed.body.message).toContain('already used for another request')
    const elsewhere = await engineer.json('POST', `/api/revisions/${first.body.id}/reviews`, { decision: 'comment', comments: [{ text: 'x' }] }, { 'idempotency-key': key })
    expect(elsewhere.status).toBe(422)
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(1)
    expect((await engineer.json('POST', url, { draftVersion: 1 }, { 'idempotency-key': 'short' })).status).toBe(400)

    // the same request sent four times at once: one revision, the others wait or get it back
    const burst = newKey()
    const answers = await Promise.all(Array.from({ length: 4 }, () => engineer.json('POST', url, { note: 'burst', draftVersion: 1 }, { 'idempotency-key': burst })))
    expect(answers.every(a => a.status === 201 || a.status === 409)).toBe(true)
    expect(new Set(answers.filter(a => a.status === 201).map(a => a.body.id)).size).toBe(1)
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(2)
  })

  it('answers a retried approval and a retried seal with the first result', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const records = await session('records')
    const rev = (await issue(engineer, sheetId)).body
    const approveKey = newKey()
    const approve = () => checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' }, { 'idempotency-key': approveKey })
    const approved = await approve()
    expect(approved.status).toBe(201)
    const again = await approve()
    expect(again.status).toBe(201)
    expect(again.body.status).toEqual(approved.body.status)
    expect(await countRows('reviews', 'revision_id = ?', [rev.id])).toBe(1)
    // without the key the same second approval is refused: it would be a second decision
    expect((await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })).status).toBe(409)

    const sealKey = newKey()
    const sealed = await records.json('POST', `/api/revisions/${rev.id}/seal`, undefined, { 'idempotency-key': sealKey })
    expect(sealed.status, JSON.stringify(sealed.body)).toBe(201)
    const resent = await records.json('POST', `/api/revisions/${rev.id}/seal`, undefined, { 'idempotency-key': sealKey })
    expect(resent.status).toBe(201)
    expect(resent.body.seal).toEqual(sealed.body.seal)
    expect(await countRows('seals', 'revision_id = ?', [rev.id])).toBe(1)
  })

  it('answers a retry with the first result also when the work committed but its answer was lost on the way', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const checker = await session('checker')
    const records = await session('records')
    // the state a dropped connection leaves: the work's own commit marked the key done with what the
    // transaction gave back, and the answer was never stored (status 0); as root, since the app cannot
    const loseAnswer = (key: string, outcome: unknown) => withRoot(c => c.query('UPDATE idempotency_keys SET status_code = 0, response = ? WHERE idempotency_key = ?', [outcome === null ? null : JSON.stringify(outcome), key]))
    const issueKey = newKey()
    const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { note: 'answer lost', draftVersion: 1 }, { 'idempotency-key': issueKey })
    expect(issued.status).toBe(201)
    await loseAnswer(issueKey, { id: issued.body.id, code: issued.body.code, contentHash: issued.body.contentHash })
    const issuedAgain = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { note: 'answer lost', draftVersion: 1 }, { 'idempotency-key': issueKey })
    expect(issuedAgain.status).toBe(201)
    expect(issuedAgain.body).toEqual(issued.body)
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(1)

    const approveKey = newKey()
    const approved = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' }, { 'idempotency-key': approveKey })
    expect(approved.status).toBe(201)
    await loseAnswer(approveKey, null)
    const approvedAgain = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' }, { 'idempotency-key': approveKey })
    expect(approvedAgain.status).toBe(201)
    expect(approvedAgain.body.status).toEqual(approved.body.status)
    expect(approvedAgain.body.reviews).toEqual(approved.body.reviews)
    expect(await countRows('reviews', 'revision_id = ?', [issued.body.id])).toBe(1)

    const sealKey = newKey()
    const sealed = await records.json('POST', `/api/revisions/${issued.body.id}/seal`, undefined, { 'idempotency-key': sealKey })
    expect(sealed.status).toBe(201)
    await loseAnswer(sealKey, null)
    const sealedAgain = await records.json('POST', `/api/revisions/${issued.body.id}/seal`, undefined, { 'idempotency-key': sealKey })
    expect(sealedAgain.body.seal).toEqual(sealed.body.seal)
    expect(await countRows('seals', 'revision_id = ?', [issued.body.id])).toBe(1)
    expect((await chainBreaks(records)).breaks).toEqual([])
  })
})
