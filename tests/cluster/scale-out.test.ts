// Two stateless instances (A on node 1, B on node 2) over a three-node Galera cluster, S3 storage
// and one SMTP peer: sessions cross instances, the records flow crosses instances, concurrent
// issues of one sheet get consecutive codes, a node stops mid-run and rejoins, the outbox delivers
// each message once.
import { readFileSync, statSync } from 'node:fs'
import { createStorage } from 'unstorage'
import s3Driver from 'unstorage/drivers/s3'
import { describe, expect, it } from 'vitest'
import { sha256Hex } from '../../server/utils/hashing'
import { DEMO } from '../helpers/client'
import { withDb } from '../helpers/db'
import { issue, makeSheet } from '../integration/records-fixtures'
import {
  A, B, on, onNode, received, record, rowCounts, signIn, startNode, stopNode, theCluster, waitForCluster, wsrepStatus,
} from './cluster-fixtures'

const [node1, node2, node3] = theCluster.nodes as [typeof theCluster.nodes[0], typeof theCluster.nodes[0], typeof theCluster.nodes[0]]

/** Transactions Galera refused for a conflict, on all nodes: failed certification at commit, or aborted by a write set being applied. */
async function conflictsSoFar() {
  let sum = 0
  for (const node of theCluster.nodes) {
    const st = await wsrepStatus(node)
    sum += Number(st?.wsrep_local_cert_failures ?? 0) + Number(st?.wsrep_local_bf_aborts ?? 0)
  }
  return sum
}

describe('the schema under Galera', () => {
  it('has a primary key on every table and only InnoDB tables, the same on every node', async () => {
    const query = `SELECT t.table_name AS name, t.engine, (SELECT COUNT(*) FROM information_schema.table_constraints c
      WHERE c.table_schema = t.table_schema AND c.table_name = t.table_name AND c.constraint_type = 'PRIMARY KEY') AS pk
      FROM information_schema.tables t WHERE t.table_schema = DATABASE() ORDER BY t.table_name`
    const perNode = await Promise.all(theCluster.nodes.map(n => onNode(n, async conn => (await conn.query(query))[0] as Array<{ name: string, engine: string, pk: number }>)))
    const tables = perNode[0]!
    expect(tables.length).toBeGreaterThan(10)
    expect(tables.filter(t => Number(t.pk) !== 1 || t.engine !== 'InnoDB')).toEqual([])
    expect(perNode[1]).toEqual(tables)
    expect(perNode[2]).toEqual(tables)
    const triggers = await Promise.all(theCluster.nodes.map(n => onNode(n, async conn => ((await conn.query('SELECT trigger_name AS name FROM information_schema.triggers WHERE trigger_schema = DATABASE() ORDER BY trigger_name'))[0] as Array<{ name: string }>).map(t => t.name))))
    expect(triggers[0]!.length).toBeGreaterThan(10)
    expect(triggers[1]).toEqual(triggers[0])
    expect(triggers[2]).toEqual(triggers[0])
    record({ 'schema on each node': `${tables.length} tables (all InnoDB with a primary key), ${triggers[0]!.length} triggers` })
  })
})

describe('sessions', () => {
  it('a user signed in on A is served on B with the same cookie, and signed out there too when the account is disabled', async () => {
    const engineer = await signIn('engineer', A)
    const me = await on(B, engineer).json('GET', '/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.email).toBe(DEMO.engineer.email)
    // the session version is in the database, not in either process: a change made through one node reaches both instances
    await withDb(conn => conn.query('UPDATE users SET session_version = session_version + 1 WHERE email = ?', [DEMO.engineer.email]))
    expect((await on(B, engineer).json('GET', '/api/auth/me')).status).toBe(401)
    expect((await engineer.json('GET', '/api/auth/me')).status).toBe(401)
  })
})

describe('the records flow across instances', () => {
  it('issued on A, approved on B, sealed on A into S3, downloaded from B; sealing again on B gives the first seal', async () => {
    const { sheetId, jobNumber } = await makeSheet()
    const engineer = await signIn('engineer', A)
    const issued = await issue(engineer, sheetId, { note: 'cluster flow' })
    expect(issued.status, JSON.stringify(issued.body)).toBe(201)
    const checker = await signIn('checker', B)
    const approved = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve', comments: [] })
    expect(approved.status, JSON.stringify(approved.body)).toBe(201)
    const records = await signIn('records', A)
    const sealed = await records.json('POST', `/api/revisions/${issued.body.id}/seal`)
    expect(sealed.status, JSON.stringify(sealed.body)).toBe(201)
    expect(sealed.body.alreadySealed).toBe(false)
    const seal = sealed.body.seal
    expect(seal.archiveRef).toBe(`${jobNumber}-PS-2-C01`)

    // the PDF is in the S3 bucket, read back with the S3 API itself
    const [row] = await withDb(async conn => (await conn.query('SELECT storage_key AS storageKey FROM seals WHERE revision_id = ?', [issued.body.id]))[0] as Array<{ storageKey: string }>)
    const bucket = createStorage({ driver: s3Driver({ endpoint: process.env.NUXT_STORAGE_ENDPOINT!, bucket: process.env.NUXT_STORAGE_BUCKET!, region: process.env.NUXT_STORAGE_REGION!, accessKeyId: process.env.NUXT_STORAGE_ACCESS_KEY_ID!, secretAccessKey: process.env.NUXT_STORAGE_SECRET_ACCESS_KEY! }) })
    const inS3 = new Uint8Array(await bucket.getItemRaw(row!.storageKey) as ArrayBuffer)
    expect(sha256Hex(inS3)).toBe(seal.pdfSha256)

    const fromB = await on(B, records).fetch(`/api/revisions/${issued.body.id}/pdf`)
    expect(fromB.status).toBe(200)
    expect(sha256Hex(new Uint8Array(await fromB.arrayBuffer()))).toBe(seal.pdfSha256)

    const again = await on(B, records).json('POST', `/api/revisions/${issued.body.id}/seal`)
    expect(again.status).toBe(200)
    expect(again.body).toMatchObject({ alreadySealed: true, seal: { id: seal.id, pdfSha256: seal.pdfSha256 } })
    expect(again.body.message).toContain('was already sealed')
  })

  it('two instances asked to seal one revision at once make one seal and both answer with it', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await signIn('engineer', B)
    const issued = await issue(engineer, sheetId, { note: 'sealed twice at once' })
    const checker = await signIn('checker', A)
    expect((await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve', comments: [] })).status).toBe(201)
    const records = await signIn('records', A)
    const [onA, onB] = await Promise.all([records, on(B, records)].map(s => s.json('POST', `/api/revisions/${issued.body.id}/seal`)))
    expect([onA.status, onB.status].sort()).toEqual([200, 201])
    expect(onA.body.seal.id).toBe(onB.body.seal.id)
    const [[{ n }]] = await withDb(conn => conn.query('SELECT COUNT(*) AS n FROM seals WHERE revision_id = ?', [issued.body.id])) as unknown as [[{ n: number }]]
    expect(Number(n)).toBe(1)
  })
})

describe('concurrent issues of one sheet on two nodes', () => {
  it('get distinct consecutive codes: the certification conflict at commit is retried, never a duplicate or a 500', async () => {
    const { sheetId } = await makeSheet()
    const onA = await signIn('engineer', A)
    const onB = on(B, onA)
    const conflictsBefore = await conflictsSoFar()
    const statuses: number[] = []
    const codes: string[] = []
    for (let round = 0; round < 4; round++) {
      const answers = await Promise.all([onA, onB].map(s => issue(s, sheetId, { note: `round ${round}` })))
      for (const a of answers) {
        statuses.push(a.status)
        if (a.status === 201) codes.push(a.body.code)
        else expect(a.body.message, JSON.stringify(a.body)).toContain('Someone else issued this sheet a moment ago')
      }
    }
    const conflicts = await conflictsSoFar() - conflictsBefore
    expect(statuses.filter(s => s !== 201 && s !== 409)).toEqual([])
    expect(statuses.filter(s => s === 201).length).toBeGreaterThanOrEqual(7)
    expect(new Set(codes).size).toBe(codes.length)
    const expected = codes.map((_, i) => `P${String(i + 1).padStart(2, '0')}`)
    expect([...codes].sort()).toEqual(expected)
    const [rows] = await withDb(conn => conn.query('SELECT code FROM revisions WHERE sheet_id = ? ORDER BY seq', [sheetId]))
    expect((rows as Array<{ code: string }>).map(r => r.code)).toEqual(expected)
    record({ 'concurrent issues (A and B, 4 rounds)': `${statuses.length} requests, ${codes.length} issued ${expected[0]}-${expected.at(-1)}, ${statuses.filter(s => s === 409).length} answered 409, 0 answered 500`, 'conflicts Galera refused meanwhile (certification + applier aborts)': conflicts })
  })
})

describe('one node stops in the middle of a run', () => {
  it('both instances keep serving through the other nodes, nothing is lost, the node rejoins by IST and catches up', async () => {
    const sheetA = await makeSheet()
    const sheetB = await makeSheet()
    const engineer = await signIn('engineer', A)
    const clients = { A: engineer, B: on(B, engineer) }
    type Result = { phase: string, instance: string, status: number, id?: number }
    const results: Result[] = []
    let phase = 'before'
    let stopTraffic = false

    // each instance reads and issues in a loop (bounded in count and time) while the node goes and comes back
    const traffic = async (name: 'A' | 'B', sheetId: number) => {
      const s = clients[name]
      const until = Date.now() + 240_000
      for (let i = 0; i < 2000 && !stopTraffic && Date.now() < until; i++) {
        const read = await s.json('GET', i % 2 ? '/api/auth/me' : `/api/sheets/${sheetId}/revisions`).catch(() => ({ status: 0, body: null }))
        results.push({ phase, instance: name, status: read.status })
        if (i % 3 === 0) {
          const write = await issue(s, sheetId, { note: `${name} ${i}` }).catch(() => ({ status: 0, body: null }))
          results.push({ phase, instance: name, status: write.status, id: write.status === 201 ? (write.body as { id: number }).id : undefined })
        }
      }
    }
    const running = [traffic('A', sheetA.sheetId), traffic('B', sheetB.sheetId)]
    await new Promise(r => setTimeout(r, 4_000))

    phase = 'node 2 down'
    const n2Log = statSync(node2.logFile).size
    expect(stopNode(node2)).toBe(true)
    for (let i = 0; i < 120 && (await wsrepStatus(node2)) !== null; i++) await new Promise(r => setTimeout(r, 250))
    const during = await waitForCluster(theCluster, 2, [node1, node3], 60)
    expect(during.every(st => st.wsrep_cluster_status === 'Primary')).toBe(true)
    await new Promise(r => setTimeout(r, 8_000))

    phase = 'node 2 rejoining'
    await startNode(theCluster, node2)
    await waitForCluster(theCluster, 3, theCluster.nodes, 120)
    phase = 'after'
    await new Promise(r => setTimeout(r, 3_000))
    stopTraffic = true
    await Promise.all(running)

    const of = (p: string) => results.filter(r => r.phase === p)
    const failed = (rs: Result[]) => rs.filter(r => r.status < 200 || r.status >= 300)
    const down = of('node 2 down')
    // no answer is a 500; both instances answered while node 2 was down, B through another node
    expect(results.filter(r => r.status >= 500 && r.status !== 503)).toEqual([])
    for (const name of ['A', 'B']) {
      const mine = down.filter(r => r.instance === name)
      expect(mine.length).toBeGreaterThan(3)
      expect(failed(mine.slice(-3))).toEqual([])
    }
    expect(failed(down).length).toBeLessThanOrEqual(4)
    expect(failed(of('after'))).toEqual([])

    // nothing acknowledged is lost: every issued revision is on every node, the codes of each sheet run without a gap
    const acknowledged = results.flatMap(r => (r.id ? [r.id] : []))
    for (const node of theCluster.nodes) {
      const ids = await onNode(node, async conn => ((await conn.query('SELECT id FROM revisions WHERE id IN (?)', [acknowledged]))[0] as Array<{ id: number }>).map(r => r.id))
      expect(ids.length, node.name).toBe(acknowledged.length)
    }
    for (const { sheetId } of [sheetA, sheetB]) {
      const [rows] = await withDb(conn => conn.query('SELECT seq FROM revisions WHERE sheet_id = ? ORDER BY seq', [sheetId]))
      expect((rows as Array<{ seq: number }>).map(r => r.seq)).toEqual((rows as unknown[]).map((_, i) => i + 1))
    }

    // the whole history verifies, asked of B (whose node came back)
    const records = await signIn('records', B)
    const verified = await records.json('POST', '/api/chain/verify')
    expect(verified.status).toBe(200)
    expect(verified.body.ok, JSON.stringify(verified.body)).toBe(true)

    // node 2 caught up by incremental state transfer from the others' write-set cache
    const rejoinLog = readFileSync(node2.logFile, 'utf8').slice(n2Log)
    expect(rejoinLog).toMatch(/IST received|Receiving IST/)
    const counts = await Promise.all(theCluster.nodes.map(n => rowCounts(theCluster, n)))
    expect(counts[1]).toEqual(counts[0])
    expect(counts[2]).toEqual(counts[0])
    const tables = Object.keys(counts[0]!).length
    const rowsTotal = Object.values(counts[0]!).reduce((x, y) => x + y, 0)

    const tally = (rs: Result[]) => `${rs.length} requests, ${failed(rs).length} errors${failed(rs).length ? ` (${[...new Set(failed(rs).map(r => r.status))].join(', ')})` : ''}`
    record({
      'requests before the node loss': tally(of('before')),
      'requests while node 2 was down (A / B)': `${tally(down.filter(r => r.instance === 'A'))} / ${tally(down.filter(r => r.instance === 'B'))}`,
      'requests while node 2 rejoined and after': tally([...of('node 2 rejoining'), ...of('after')]),
      'revisions acknowledged during the run': `${acknowledged.length}, all present on the 3 nodes`,
      'chain verification (POST /api/chain/verify on B)': `ok, ${JSON.stringify(verified.body.checked ?? '')}`,
      'node 2 rejoin': 'IST (no full state transfer)',
      'rows compared across nodes': `${tables} tables, ${rowsTotal} rows on each node, equal on all 3`,
    })
  })
})

describe('the outbox across two instances', () => {
  it('delivers each message exactly once to the SMTP peer', async () => {
    type Row = { subject: string, to: string, state: string }
    const outbox = async () => withDb(async conn => ((await conn.query('SELECT subject, to_addresses AS `to`, state FROM outbox'))[0] as Row[]))
    const until = Date.now() + 60_000
    while ((await outbox()).some(m => m.state !== 'sent') && Date.now() < until) await new Promise(r => setTimeout(r, 500))
    await new Promise(r => setTimeout(r, 1_000))
    const rows = await outbox()
    expect(rows.filter(m => m.state !== 'sent')).toEqual([])
    const key = (m: { subject: string, to: string }) => `${m.subject} -> ${m.to.split(',').sort().join(',')}`
    const got = received().map(key).sort()
    expect(got).toEqual(rows.map(key).sort())
    expect(rows.length).toBeGreaterThan(5)
    record({ 'outbox messages sent / received by the SMTP peer': `${rows.length} / ${got.length} (each once)` })
  })
})
