#!/usr/bin/env node
// A three-node MariaDB Galera cluster on loopback, each node with its own private data directory,
// for trying Tendonbook at scale on one machine. Usage: node scripts/cluster.mjs up|down|status [--fresh]
//   up    installs what is missing (as root), bootstraps the first node (--wsrep-new-cluster), joins
//         the others (rsync state transfer), waits for wsrep_cluster_size = 3 and every node Synced,
//         then creates the database and user, migrates and grants through scripts/db.mjs on node 1.
//   down  stops the nodes, the first node last (so it is the safe one to bootstrap next time).
// Ports and folder: see clusterSettings below (README, "Running at scale").
import { execFileSync, spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import {
  admin, alive, createDatabaseAndUser, ensureSystemPackages, envPorts, grant, initialise, migrate,
  rootConnection, secrets, startServer,
} from './db.mjs'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const GALERA_PROVIDER = '/usr/lib/galera/libgalera_smm.so'

/**
 * The cluster's ports and folder, from the environment: TENDONBOOK_CLUSTER_DATA_DIR
 * (.data-cluster), TENDONBOOK_CLUSTER_DB_PORTS (SQL, 7601,7602,7603), TENDONBOOK_CLUSTER_GALERA_PORTS
 * (replication, 7611,7612,7613), TENDONBOOK_CLUSTER_IST_PORTS (incremental state transfer,
 * 7621,7622,7623), TENDONBOOK_CLUSTER_SST_PORTS (full state transfer by rsync, 7631,7632,7633),
 * and for `npm run test:cluster` TENDONBOOK_CLUSTER_APP_PORTS (instances A and B, 7701,7702),
 * TENDONBOOK_CLUSTER_S3_PORT (7801) and TENDONBOOK_CLUSTER_MAIL_PORT (7901).
 */
export function clusterSettings(env = process.env) {
  return {
    base: resolve(root, env.TENDONBOOK_CLUSTER_DATA_DIR || '.data-cluster'),
    dbPorts: envPorts(env, 'TENDONBOOK_CLUSTER_DB_PORTS', [7601, 7602, 7603]),
    galeraPorts: envPorts(env, 'TENDONBOOK_CLUSTER_GALERA_PORTS', [7611, 7612, 7613]),
    istPorts: envPorts(env, 'TENDONBOOK_CLUSTER_IST_PORTS', [7621, 7622, 7623]),
    sstPorts: envPorts(env, 'TENDONBOOK_CLUSTER_SST_PORTS', [7631, 7632, 7633]),
    appPorts: envPorts(env, 'TENDONBOOK_CLUSTER_APP_PORTS', [7701, 7702]),
    s3Port: envPorts(env, 'TENDONBOOK_CLUSTER_S3_PORT', [7801])[0],
    mailPort: envPorts(env, 'TENDONBOOK_CLUSTER_MAIL_PORT', [7901])[0],
  }
}

/**
 * The cluster as one database for scripts/db.mjs (secrets beside the nodes, node 1 to talk to),
 * and its nodes, each shaped like a db.mjs instance.
 */
export function cluster(s = clusterSettings()) {
  const nodes = s.dbPorts.map((port, i) => {
    const base = join(s.base, `node${i + 1}`)
    return {
      name: `node${i + 1}`, index: i, base,
      dataDir: join(base, 'mariadb'), runDir: join(base, 'run'), socket: join(base, 'run', 'mysqld.sock'),
      pidFile: join(base, 'run', 'mysqld.pid'), logFile: join(base, 'mariadb.log'),
      port, galeraPort: s.galeraPorts[i], istPort: s.istPorts[i], sstPort: s.sstPorts[i],
      database: 'tendonbook', user: 'tendonbook',
    }
  })
  const db = { ...nodes[0], name: 'cluster', base: s.base, mailPort: s.mailPort, appPort: s.appPorts[0] }
  return { settings: s, nodes, db }
}

function log(message) {
  process.stdout.write(`[cluster] ${message}\n`)
}

/** rsync carries the full state transfer to a joining node: install it like db.mjs installs its packages. */
function ensureRsync() {
  if (spawnSync('sh', ['-c', 'command -v rsync'], { stdio: 'ignore' }).status === 0) return
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    throw new Error('The cluster needs rsync for state transfers. Run once as root: apt-get install -y rsync')
  }
  log('installing rsync with apt-get (once per machine)')
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
  execFileSync('apt-get', ['-o', 'DPkg::Lock::Timeout=180', '-q', 'update'], { stdio: 'inherit', env })
  execFileSync('apt-get', ['-o', 'DPkg::Lock::Timeout=180', '-y', '-q', 'install', '--no-install-recommends', 'rsync'], { stdio: 'inherit', env })
}

/** Galera's settings for one node: loopback only, its own ports, small buffers for a shared machine. */
export function galeraArgs(c, node) {
  const peers = c.nodes.map(n => `127.0.0.1:${n.galeraPort}`).join(',')
  return [
    '--wsrep-on=ON', `--wsrep-provider=${GALERA_PROVIDER}`, '--wsrep-cluster-name=tendonbook',
    `--wsrep-cluster-address=gcomm://${peers}`, `--wsrep-node-name=${node.name}`, '--wsrep-node-address=127.0.0.1',
    `--wsrep-provider-options=base_host=127.0.0.1;base_port=${node.galeraPort};gmcast.listen_addr=tcp://127.0.0.1:${node.galeraPort};ist.recv_addr=127.0.0.1:${node.istPort};gcache.size=32M`,
    '--wsrep-sst-method=rsync', `--wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    // causal reads: a SELECT waits until this node has applied what the cluster committed before it
    '--wsrep-sync-wait=1',
    // an autocommit statement that loses a certification conflict is retried by the server itself
    '--wsrep-retry-autocommit=4',
    '--wsrep-slave-threads=1',
    '--binlog-format=ROW', '--default-storage-engine=InnoDB', '--innodb-autoinc-lock-mode=2',
    '--innodb-buffer-pool-size=64M', '--innodb-log-file-size=32M', '--innodb-flush-log-at-trx-commit=2',
    '--performance-schema=OFF', '--max-connections=80',
  ]
}

/** `SHOW GLOBAL STATUS LIKE 'wsrep_%'` of a node as an object, or null when it does not answer. */
export async function wsrepStatus(node) {
  if (!alive(node)) return null
  let conn
  try {
    conn = await rootConnection(node)
    const [rows] = await conn.query("SHOW GLOBAL STATUS LIKE 'wsrep_%'")
    return Object.fromEntries(rows.map(r => [r.Variable_name, r.Value]))
  }
  catch {
    return null
  }
  finally {
    await conn?.end().catch(() => {})
  }
}

const synced = st => st && st.wsrep_ready === 'ON' && st.wsrep_local_state_comment === 'Synced'

/** Waits (bounded) until `nodes` are all Synced members of a primary cluster of `size` nodes. */
export async function waitForCluster(c, size, nodes = c.nodes, seconds = 180) {
  const until = Date.now() + seconds * 1000
  let last = []
  while (Date.now() < until) {
    last = await Promise.all(nodes.map(wsrepStatus))
    if (last.every(st => synced(st) && Number(st.wsrep_cluster_size) === size && st.wsrep_cluster_status === 'Primary')) return last
    await new Promise(r => setTimeout(r, 500))
  }
  const seen = nodes.map((n, i) => `${n.name}: ${last[i] ? `${last[i].wsrep_local_state_comment}, size ${last[i].wsrep_cluster_size}` : 'not answering'}`).join('; ')
  throw new Error(`the cluster did not reach ${size} synced nodes within ${seconds} s (${seen}); see ${nodes.map(n => n.logFile).join(', ')}`)
}

/** grastate.dat says whether a node holds the latest state after the whole cluster stopped. */
function safeToBootstrap(node) {
  const file = join(node.dataDir, 'grastate.dat')
  return existsSync(file) && /safe_to_bootstrap:\s*1/.test(readFileSync(file, 'utf8'))
}

/**
 * The system account a node runs as when started by root: the rsync daemon of a state transfer
 * drops root for "nobody", which may not write a root-owned data directory; as `mysql` it keeps
 * that account, which owns the node's folder.
 */
function nodeUser(node) {
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) return []
  if (spawnSync('id', ['mysql'], { stdio: 'ignore' }).status !== 0) return []
  execFileSync('chown', ['-R', 'mysql:mysql', node.base])
  return ['--user=mysql']
}

/** Starts one node: the bootstrap node founds a new cluster, any other joins it (IST when it can, else rsync SST). */
export async function startNode(c, node, { bootstrap = false } = {}) {
  if (alive(node)) return
  log(`${bootstrap ? 'bootstrapping' : 'joining'} ${node.name} (SQL ${node.port}, replication ${node.galeraPort})`)
  mkdirSync(node.runDir, { recursive: true })
  await startServer(node, [...galeraArgs(c, node), ...nodeUser(node), ...(bootstrap ? ['--wsrep-new-cluster'] : [])])
}

/** Stops one node cleanly. */
export function stopNode(node) {
  if (!alive(node)) return false
  const result = admin(node, ['shutdown'])
  if (result.status !== 0) throw new Error(`stopping ${node.name} failed: ${result.stderr}`)
  return true
}

export async function up({ fresh = false } = {}) {
  ensureSystemPackages()
  ensureRsync()
  if (!existsSync(GALERA_PROVIDER)) throw new Error(`${GALERA_PROVIDER} is missing: install galera-4 (apt-get install -y galera-4)`)
  const c = cluster()
  if (fresh) {
    await down(c)
    rmSync(c.settings.base, { recursive: true, force: true })
  }
  const { dbPassword } = secrets(c.db)
  for (const node of c.nodes) initialise(node)
  // found the cluster on the node that stopped last (node 1 after `down`), or node 1 when none says so
  let first = c.nodes.find(safeToBootstrap)
  if (!first) {
    first = c.nodes[0]
    const file = join(first.dataDir, 'grastate.dat')
    if (existsSync(file)) {
      log(`no node is marked safe to bootstrap (the cluster did not stop cleanly): founding it on ${first.name}'s data`)
      writeFileSync(file, readFileSync(file, 'utf8').replace(/safe_to_bootstrap:\s*0/, 'safe_to_bootstrap: 1'))
    }
  }
  await startNode(c, first, { bootstrap: true })
  await waitForCluster(c, 1, [first], 60)
  const started = [first]
  for (const node of c.nodes.filter(n => n !== first)) {
    await startNode(c, node)
    started.push(node)
    await waitForCluster(c, started.length, started)
  }
  await waitForCluster(c, c.nodes.length)
  // schema, migrations and grants run once, here, against one node: GET_LOCK does not replicate
  await createDatabaseAndUser(c.db, dbPassword)
  await migrate(c.db)
  await grant(c.db)
  log(`${c.nodes.length} nodes synced on 127.0.0.1:${c.nodes.map(n => n.port).join(',')}; database ${c.db.database} migrated`)
  return c
}

export async function down(c = cluster()) {
  for (const node of [...c.nodes].reverse()) {
    if (stopNode(node)) {
      // wait until it is gone, so the next node does not see it as a live member
      for (let i = 0; i < 120 && alive(node); i++) await new Promise(r => setTimeout(r, 250))
      log(`${node.name} stopped`)
    }
  }
}

/** Row counts of every table on one node, read over its socket. */
export async function rowCounts(c, node) {
  const conn = await rootConnection(node, c.db.database)
  try {
    const [tables] = await conn.query('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name', [c.db.database])
    const counts = {}
    for (const { name } of tables) {
      const [[{ n }]] = await conn.query(`SELECT COUNT(*) AS n FROM \`${name}\``)
      counts[name] = Number(n)
    }
    return counts
  }
  finally {
    await conn.end()
  }
}

const isMain = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)
if (isMain) {
  const [command] = process.argv.slice(2)
  const actions = {
    up: () => up({ fresh: process.argv.includes('--fresh') }),
    down: () => down(),
    status: async () => {
      for (const node of cluster().nodes) {
        const st = await wsrepStatus(node)
        log(`${node.name} (127.0.0.1:${node.port}): ${st ? `${st.wsrep_local_state_comment}, cluster size ${st.wsrep_cluster_size}, ${st.wsrep_cluster_status}` : 'stopped'}`)
      }
    },
  }
  const action = actions[command]
  if (!action) {
    process.stderr.write('usage: node scripts/cluster.mjs up|down|status [--fresh]\n')
    process.exit(2)
  }
  action().catch((error) => {
    process.stderr.write(`[cluster] ${error.message}\n`)
    process.exit(1)
  })
}
