// The outbox as two servers see it: two delivery runners, each with its own connection pool and
// its own SMTP sender, run against the one test database at the same time as the integration
// server's own runner. Every message must be sent exactly once, whichever runner claims it.
import { AsyncLocalStorage } from 'node:async_hooks'
import { readdirSync, readFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { drizzle } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import * as schema from '../../server/database/schema'
import { isConnectionLost, isWriteConflict } from '../../server/utils/db'
import { unique } from '../helpers/client'
import { withDb } from '../helpers/db'

interface Runner { name: string, pool: mysql.Pool, db: ReturnType<typeof drizzle<typeof schema>>, sent: string[], failOnce: Set<string> }

const current = new AsyncLocalStorage<Runner>()
// the service's server-side names (Nitro auto-imports), answered per runner
Object.assign(globalThis, {
  tables: schema,
  isWriteConflict,
  isConnectionLost,
  useDb: () => current.getStore()!.db,
  sendMail: async (message: { subject: string }) => {
    const runner = current.getStore()!
    await new Promise(r => setTimeout(r, 5))
    if (runner.failOnce.delete(message.subject)) throw new Error('421 the peer is busy (simulated)')
    runner.sent.push(message.subject)
  },
})
const { deliverOutbox, OUTBOX_MAX_ATTEMPTS } = await import('../../server/services/outbox')

function runner(name: string): Runner {
  const pool = mysql.createPool({
    host: process.env.NUXT_DATABASE_HOST, port: Number(process.env.NUXT_DATABASE_PORT), user: process.env.NUXT_DATABASE_USER,
    password: process.env.NUXT_DATABASE_PASSWORD, database: process.env.NUXT_DATABASE_NAME, connectionLimit: 4, timezone: 'Z',
  })
  return { name, pool, db: drizzle(pool, { schema, mode: 'default' }), sent: [], failOnce: new Set() }
}

/** Runs delivery rounds until a round finds nothing due (at most `rounds`). */
async function drain(r: Runner, limit: number, rounds = 20) {
  for (let i = 0; i < rounds; i++) {
    const { due } = await current.run(r, () => deliverOutbox(limit))
    if (due === 0) return
  }
}

async function enqueue(subjects: string[]) {
  await withDb(conn => conn.query('INSERT INTO outbox (kind, to_addresses, subject, body_text) VALUES ?', [subjects.map(s => ['test.delivery', 'checker@tendonbook.local', s, `body of ${s}`])]))
}

async function rows(token: string) {
  return withDb(async (conn) => {
    const [found] = await conn.query('SELECT id, subject, state, attempts, last_error AS lastError, next_attempt_at AS nextAttemptAt FROM outbox WHERE subject LIKE ? ORDER BY id', [`${token}%`])
    return found as Array<{ id: number, subject: string, state: string, attempts: number, lastError: string, nextAttemptAt: Date }>
  })
}

/** Subjects of our messages that reached the integration server's SMTP peers (its own runner's share). */
function receivedByServer(token: string) {
  const parent = dirname(inject('mailboxDir'))
  const subjects: string[] = []
  for (const dir of readdirSync(parent).filter(d => d.startsWith('mailbox')).map(d => join(parent, d))) {
    for (const file of readdirSync(dir).filter(f => f.endsWith('.json'))) {
      const raw = (JSON.parse(readFileSync(join(dir, file), 'utf8')) as { raw: string }).raw
      const subject = /^Subject: (.*)$/m.exec(raw)?.[1]?.trim()
      if (subject?.startsWith(token)) subjects.push(subject)
    }
  }
  return subjects
}

let a: Runner
let b: Runner
beforeAll(() => {
  a = runner('A')
  b = runner('B')
})
afterAll(async () => {
  await Promise.all([a.pool.end(), b.pool.end()])
})

describe('outbox delivery by several runners on one database', () => {
  it('passes over messages another runner holds (SKIP LOCKED) instead of waiting for them', async () => {
    const token = unique('held')
    await enqueue(Array.from({ length: 6 }, (_, i) => `${token} ${i}`))
    const ours = await rows(token)
    const held = ours.slice(0, 3).map(m => m.id)
    const conn = await mysql.createConnection({ host: process.env.NUXT_DATABASE_HOST, port: Number(process.env.NUXT_DATABASE_PORT), user: process.env.NUXT_DATABASE_USER, password: process.env.NUXT_DATABASE_PASSWORD, database: process.env.NUXT_DATABASE_NAME })
    try {
      await conn.query('SET SESSION innodb_lock_wait_timeout = 20')
      await conn.beginTransaction()
      await conn.query('SELECT id FROM outbox WHERE id IN (?) FOR UPDATE', [held])
      const started = Date.now()
      await drain(b, 50, 5)
      expect(Date.now() - started).toBeLessThan(10_000)
      const heldSubjects = new Set(ours.slice(0, 3).map(m => m.subject))
      expect(b.sent.filter(s => heldSubjects.has(s))).toEqual([])
      await conn.commit()
    }
    finally {
      await conn.end()
    }
  })

  it('sends each of 60 messages exactly once when two runners deliver at the same time', async () => {
    const token = unique('once')
    const subjects = Array.from({ length: 60 }, (_, i) => `${token} ${String(i).padStart(2, '0')}`)
    a.sent = []
    b.sent = []
    await enqueue(subjects)
    await Promise.all([drain(a, 7), drain(b, 7)])
    // the integration server's own runner may have taken some: wait until every row is sent
    const until = Date.now() + 30_000
    while ((await rows(token)).some(m => m.state !== 'sent') && Date.now() < until) await new Promise(r => setTimeout(r, 250))
    const states = await rows(token)
    expect(states.every(m => m.state === 'sent' && m.attempts === 1)).toBe(true)
    await new Promise(r => setTimeout(r, 500))
    const everySend = [...a.sent, ...b.sent, ...receivedByServer(token)].filter(s => s.startsWith(token))
    expect(everySend.length).toBe(subjects.length)
    expect(new Set(everySend)).toEqual(new Set(subjects))
  })

  it('keeps a message that failed for a later attempt with a growing wait, then sends it', async () => {
    // the integration server's runner may claim a new message first: try with a fresh one, three times at most
    for (let attempt = 1; attempt <= 3; attempt++) {
      const subject = `${unique('retry')} notice`
      a.failOnce = new Set([subject])
      a.sent = []
      const before = Date.now()
      await enqueue([subject])
      await current.run(a, () => deliverOutbox(50))
      const [row] = await rows(subject)
      if (a.failOnce.size !== 0) continue
      expect(row).toMatchObject({ state: 'pending', attempts: 1, lastError: '421 the peer is busy (simulated)' })
      const wait = new Date(row!.nextAttemptAt).getTime() - before
      expect(wait).toBeGreaterThan(8_000)
      expect(wait).toBeLessThan(20_000)
      await withDb(conn => conn.query('UPDATE outbox SET next_attempt_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?', [row!.id]))
      await current.run(a, () => deliverOutbox(50))
      const [after] = await rows(subject)
      expect(after!.state).toBe('sent')
      expect(after!.attempts).toBeLessThanOrEqual(2)
      expect(OUTBOX_MAX_ATTEMPTS).toBeGreaterThan(2)
      return
    }
    throw new Error('the integration server claimed the message three times before this runner could')
  })
})
