// Faults under the running product: the database killing the app's connections in the middle of an
// issue, the database stopped and started again, the SMTP peer stopped and started again, seals
// rendered under load (each must print again to its sealed bytes), Chromium killed in the middle of
// a seal. Each answer is a clean error in words (never a bare 500), the product recovers without a restart,
// and nothing is lost or half-written: every revision that was confirmed is there, no revision is
// there twice, and the history verifies whole. Killing Chromium mid-seal runs under `npm run test:stress`.
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { recordFigures } from '../helpers/figures'
import { countRows } from '../helpers/db'
import { chainBreaks, draftVersionOf, makeSheet, receivedMail, session, waitForMail, withRoot, type Session } from './records-fixtures'
import { STOP_FILE } from '../../scripts/mail-peer.mjs'

let injected = 0
let survived = 0
let rowsLost = 0
let engineer: Session, checker: Session, records: Session

beforeAll(async () => {
  ;[engineer, checker, records] = await Promise.all([session('engineer'), session('checker'), session('records')])
})

afterAll(() => {
  recordFigures({ suite: 'faults', faultsInjected: injected, faultsSurvived: survived, rowsLost })
})

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))

/** A clean failure: an answer in words with a status that says "try again", not a bare 500. */
function cleanFailure(res: { status: number, body: { message?: string } }) {
  return [409, 503].includes(res.status) && typeof res.body?.message === 'string' && res.body.message.length > 20 && !/^server error$/i.test(res.body.message)
}

async function healthy(timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    const res = await fetch(`${inject('baseUrl')}/api/health`).catch(() => null)
    if (res?.status === 200) return true
    await sleep(250)
  }
  return false
}

describe('the database kills the app\'s connections in the middle of an issue', () => {
  it('answers each issue with its revision or a clean error; a retry with the same key gives the first result; nothing is lost or doubled', async () => {
    const { sheetId } = await makeSheet()
    const confirmed = new Set<number>()  // rounds
    for (let round = 0; round < 6; round++) {
      const key = `fault-kill-${sheetId}-${round}`
      const body = { draftVersion: await draftVersionOf(sheetId), note: `Issue under fault, round ${round + 1}` }
      const issuing = engineer.json('POST', `/api/sheets/${sheetId}/revisions`, body, { 'idempotency-key': key })
      await sleep(20 + round * 40)
      injected += 1
      await withRoot(async (root) => {
        const [rows] = await root.query('SELECT id FROM information_schema.processlist WHERE user = ? AND id <> CONNECTION_ID()', [process.env.NUXT_DATABASE_USER])
        for (const { id } of rows as Array<{ id: number }>) await root.query(`KILL CONNECTION ${Number(id)}`).catch(() => {})
      })
      const first = await issuing
      const clean = first.status === 201 || cleanFailure(first)
      expect(clean, `round ${round + 1}: ${first.status} ${JSON.stringify(first.body).slice(0, 200)}`).toBe(true)
      // the engineer retries with the same key: the first result when it was saved (also when its
      // answer was lost on the way), else the issue is made now
      const retried = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, body, { 'idempotency-key': key })
      expect(retried.status, JSON.stringify(retried.body).slice(0, 200)).toBe(201)
      if (first.status === 201) expect(retried.body).toEqual(first.body)
      // and again: the same answer every time
      const third = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, body, { 'idempotency-key': key })
      expect(third.body).toEqual(retried.body)
      // exactly one revision of this round: nothing lost, nothing twice
      const ofRound = await countRows('revisions', 'sheet_id = ? AND note = ?', [sheetId, body.note])
      rowsLost += Math.max(0, 1 - ofRound)
      expect(ofRound, `round ${round + 1}`).toBe(1)
      confirmed.add(round)
      if (clean) survived += 1
    }
    expect(await countRows('revisions', 'sheet_id = ?', [sheetId])).toBe(confirmed.size)
    expect((await chainBreaks(records)).breaks).toEqual([])
  })
})

describe('the database stops and starts again', () => {
  it('answers 503 in words while it is down, and serves again without a restart once it is back', async () => {
    const { sheetId } = await makeSheet()
    const { start, stop } = await import('../../scripts/db.mjs')
    const revisionsBefore = await countRows('revisions')
    injected += 1
    await stop({ test: true })
    try {
      const health = await fetch(`${inject('baseUrl')}/api/health`)
      expect(health.status).toBe(503)
      const read = await engineer.json('GET', '/api/projects')
      expect(cleanFailure(read), `${read.status} ${JSON.stringify(read.body)}`).toBe(true)
      const write = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: 1, note: 'While the database is down' })
      expect(cleanFailure(write), `${write.status} ${JSON.stringify(write.body)}`).toBe(true)
    }
    finally {
      await start({ test: true })
    }
    expect(await healthy()).toBe(true)
    const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), note: 'Once the database is back' })
    expect(issued.status, JSON.stringify(issued.body).slice(0, 200)).toBe(201)
    const revisionsAfter = await countRows('revisions')
    rowsLost += Math.max(0, revisionsBefore + 1 - revisionsAfter)
    expect(revisionsAfter).toBe(revisionsBefore + 1)
    expect((await chainBreaks(records)).breaks).toEqual([])
    survived += 1
  })
})

/** Every SMTP peer of the run (each test server has its own, and any of them may claim the outbox), stopped or started. */
function mailPeers(state: 'stopped' | 'started') {
  const parent = dirname(inject('mailboxDir'))
  for (const dir of readdirSync(parent).filter(d => d.startsWith('mailbox'))) {
    const file = join(parent, dir, STOP_FILE)
    if (state === 'stopped') writeFileSync(file, 'stopped by the faults suite\n')
    else rmSync(file, { force: true })
  }
}

/** The outbox rows whose subject names this job (each test sheet has a job of its own). */
async function outboxRows(jobNumber: string) {
  return withRoot(async (c) => {
    const [rows] = await c.query('SELECT subject, state, attempts, last_error AS lastError FROM outbox WHERE subject LIKE ?', [`%job ${jobNumber}%`])
    return rows as Array<{ subject: string, state: string, attempts: number, lastError: string }>
  })
}

describe('the SMTP peer stops and starts again', () => {
  it('issues as usual while mail cannot go out, keeps the message, and delivers it exactly once when the peer is back', async () => {
    const { sheetId, jobNumber } = await makeSheet()
    injected += 1
    mailPeers('stopped')
    let ours = (raw: string) => raw.includes('While the mail server is down')
    try {
      await sleep(500)
      const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), note: 'While the mail server is down' })
      expect(issued.status, JSON.stringify(issued.body).slice(0, 200)).toBe(201)
      ours = raw => raw.includes('While the mail server is down') && new RegExp(`/revisions/${issued.body.id}\\b`).test(raw)
      // the outbox tries, fails in words, and keeps the message for later
      let rows = await outboxRows(jobNumber)
      for (const until = Date.now() + 30_000; !(rows[0]?.attempts >= 1) && Date.now() < until; await sleep(300)) rows = await outboxRows(jobNumber)
      expect(rows).toHaveLength(1)
      expect(rows[0]).toMatchObject({ state: 'pending', attempts: 1 })
      expect(rows[0]!.lastError).toMatch(/ECONNREFUSED|connect/i)
    }
    finally {
      mailPeers('started')
    }
    // the next attempt (10 s after the first failure) goes through; once, whichever server sends it
    const mail = await waitForMail(m => ours(m.raw), 60_000)
    expect(mail.raw).toContain('While the mail server is down')
    await sleep(3_000)
    expect(receivedMail().filter(m => ours(m.raw))).toHaveLength(1)
    expect((await outboxRows(jobNumber))[0]).toMatchObject({ state: 'sent', attempts: 2 })
    survived += 1
  })
})

/** A request that the server may refuse while its renders are full: sent again after the Retry-After it gives. */
async function whenRenderFree<T extends { status: number }>(send: () => Promise<T>, attempts = 12): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    const res = await send()
    if (res.status !== 503 || attempt >= attempts) return res
    await sleep(2_000)
  }
}

describe('sealing under load', () => {
  it('seals three revisions at once, then renders all three again at once, to the very bytes sealed', async () => {
    const approved: number[] = []
    for (let i = 0; i < 3; i++) {
      const { sheetId } = await makeSheet()
      const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), note: `Sealed under load, ${i + 1} of 3` })
      expect(issued.status).toBe(201)
      expect((await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' })).status).toBe(201)
      approved.push(issued.body.id)
    }
    injected += 1
    // three seals at once (each renders two or three times): more renders than the server has cores
    const seals = await Promise.all(approved.map(id => whenRenderFree(() => records.json('POST', `/api/revisions/${id}/seal`))))
    expect(seals.map(w => w.status)).toEqual([201, 201, 201])
    // and three renders of the sealed revisions at once: under load, each gives its sealed bytes
    const checks = await Promise.all(approved.map(id => whenRenderFree(() => records.json('POST', `/api/revisions/${id}/reseal-check`))))
    expect(checks.map(c => c.status)).toEqual([200, 200, 200])
    for (const [i, check] of checks.entries()) {
      expect(check.body.identical, JSON.stringify(check.body).slice(0, 300)).toBe(true)
      expect(check.body.sealedSha256).toBe(seals[i]!.body.seal.pdfSha256)
      // deterministic, not a vote: the first render under load is already the sealed one
      expect(check.body.renders).toBe(1)
    }
    expect((await chainBreaks(records)).breaks).toEqual([])
    survived += 1
  })
})

/** Chromium processes started by the test server (its children named chromium). */
function chromiumChildren(parent: number) {
  const found: number[] = []
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8')
      const [, comm, rest] = /^\d+ \((.*)\) (.*)$/s.exec(stat)!
      const ppid = Number(rest!.split(' ')[1])
      if (ppid === parent && /chrom/i.test(comm!)) found.push(Number(entry))
    }
    catch {}
  }
  return found
}

// a seal renders the PDF two or three times (half a minute here): `npm run test:stress` runs it
describe.runIf(process.env.TENDONBOOK_STRESS)('Chromium is killed in the middle of a seal', () => {
  it('answers the seal with its PDF or a clean error, seals on the next try without a restart, and stores one seal', async () => {
    const serverPid = inject('serverPid')
    const { sheetId } = await makeSheet()
    const issued = await engineer.json('POST', `/api/sheets/${sheetId}/revisions`, { draftVersion: await draftVersionOf(sheetId), note: 'To be sealed under fault' })
    expect(issued.status).toBe(201)
    expect((await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' })).status).toBe(201)
    const sealing = records.json('POST', `/api/revisions/${issued.body.id}/seal`)
    // wait for the renderer to be at work, then kill it
    let killed = 0
    for (const until = Date.now() + 20_000; killed === 0 && Date.now() < until; await sleep(100)) {
      for (const pid of chromiumChildren(serverPid)) {
        process.kill(pid, 'SIGKILL')
        killed += 1
      }
    }
    expect(killed).toBeGreaterThan(0)
    injected += 1
    const first = await sealing
    expect(first.status === 201 || cleanFailure(first), `${first.status} ${JSON.stringify(first.body).slice(0, 200)}`).toBe(true)
    const again = first.status === 201 ? first : await records.json('POST', `/api/revisions/${issued.body.id}/seal`)
    expect(again.status, JSON.stringify(again.body).slice(0, 200)).toBe(201)
    expect(await countRows('seals', 'revision_id = ?', [issued.body.id])).toBe(1)
    const pdf = await records.fetch(`/api/revisions/${issued.body.id}/pdf`)
    expect(pdf.status).toBe(200)
    expect((await chainBreaks(records)).breaks).toEqual([])
    survived += 1
  })
})
