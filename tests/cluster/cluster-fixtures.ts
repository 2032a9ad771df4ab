// Shared by the cluster tests: the two instances, the cluster's nodes, the figures of the closing
// table, and the SMTP peer's mailbox. Started by scripts/test-cluster.mjs.
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import mysql from 'mysql2/promise'
import { DEMO } from '../helpers/client'
import { Session } from '../integration/records-fixtures'

export const A = process.env.TENDONBOOK_CLUSTER_A_URL ?? ''
export const B = process.env.TENDONBOOK_CLUSTER_B_URL ?? ''
if (!A || !B) throw new Error('The cluster tests need the cluster and both instances: run `npm run test:cluster`')

// scripts/cluster.mjs is plain JavaScript: its functions are typed here by use
type Node = { name: string, port: number, socket: string, logFile: string }
type Cluster = { nodes: Node[], db: { database: string } }
const clusterScript = await import('../../scripts/cluster.mjs') as unknown as {
  cluster: () => Cluster
  stopNode: (node: Node) => boolean
  startNode: (c: Cluster, node: Node) => Promise<void>
  waitForCluster: (c: Cluster, size: number, nodes?: Node[], seconds?: number) => Promise<Array<Record<string, string>>>
  wsrepStatus: (node: Node) => Promise<Record<string, string> | null>
  rowCounts: (c: Cluster, node: Node) => Promise<Record<string, number>>
}
export const { stopNode, startNode, waitForCluster, wsrepStatus, rowCounts } = clusterScript
export const theCluster = clusterScript.cluster()

/** A signed-in session on one instance; `on(url)` carries the same cookie to another instance. */
export async function signIn(role: keyof typeof DEMO, baseUrl = A) {
  const s = new Session(baseUrl)
  const res = await s.json('POST', '/api/auth/signin', { email: DEMO[role].email, password: DEMO[role].password })
  if (res.status !== 200) throw new Error(`sign-in as ${role} on ${baseUrl} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return s
}

export function on(baseUrl: string, s: Session) {
  const other = new Session(baseUrl)
  other.cookie = s.cookie
  return other
}

/** Root over a node's own socket (the row counts and the IST check read each node by itself). */
export async function onNode<T>(node: Node, fn: (conn: mysql.Connection) => Promise<T>) {
  const conn = await mysql.createConnection({ socketPath: node.socket, user: 'root', database: theCluster.db.database })
  try {
    return await fn(conn)
  }
  finally {
    await conn.end()
  }
}

/** Figures for the closing table, kept in the file scripts/test-cluster.mjs prints from. */
export function record(figures: Record<string, string | number>) {
  const file = process.env.TENDONBOOK_CLUSTER_REPORT
  if (!file) return
  const before = existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown> : {}
  writeFileSync(file, JSON.stringify({ ...before, ...figures }, null, 2))
}

/** Headers of a received message, folded lines joined. */
function header(raw: string, name: string) {
  const head = raw.split(/\r?\n\r?\n/, 1)[0]!.replace(/\r?\n[ \t]+/g, ' ')
  return new RegExp(`^${name}: (.*)$`, 'mi').exec(head)?.[1]?.trim() ?? ''
}

/** Every message the SMTP peer received: its subject and recipients. */
export function received() {
  const dir = process.env.NUXT_MAILBOX_DIR ?? ''
  if (!dir || !existsSync(dir)) return []
  return readdirSync(dir).filter(f => f.endsWith('.json')).map((f) => {
    const m = JSON.parse(readFileSync(join(dir, f), 'utf8')) as { to: string[], raw: string }
    return { subject: header(m.raw, 'Subject'), to: [...m.to].sort().join(',') }
  })
}
