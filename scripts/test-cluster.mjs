#!/usr/bin/env node
// `npm run test:cluster` (not part of `npm test`): Tendonbook at scale on one machine. A fresh
// three-node Galera cluster (scripts/cluster.mjs), the local S3 server and an SMTP peer, a build
// when needed, two app instances — A on node 1, B on node 2, each with the other nodes as
// fallbacks — then tests/cluster/*.test.ts with vitest.cluster.config.ts. Prints a closing table and
// tears everything down, also on failure or Ctrl+C.
import { spawn } from 'node:child_process'
import { createWriteStream, existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { buildIfNeeded } from './build.mjs'
import { cluster, down, up } from './cluster.mjs'
import { serverEnv } from './db.mjs'
import { startMailPeer } from './mail-peer.mjs'
import { startS3Peer } from './s3-peer.mjs'
import { seed } from './seed.mjs'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const extra = process.argv.slice(2)

const running = { apps: [], s3: null, mail: null, cluster: null, tests: null }

function log(message) {
  process.stdout.write(`[test:cluster] ${message}\n`)
}

async function waitForHealth(url, app, seconds) {
  const until = Date.now() + seconds * 1000
  while (Date.now() < until) {
    if (app.child.exitCode !== null) throw new Error(`instance ${app.name} exited:\n${app.output.slice(-3000)}`)
    try {
      if ((await fetch(`${url}/api/health`)).ok) return
    }
    catch {}
    await new Promise(r => setTimeout(r, 300))
  }
  throw new Error(`instance ${app.name} did not answer at ${url} within ${seconds} s:\n${app.output.slice(-3000)}`)
}

/** One app instance on its port, its database hosts listed node first, then the other nodes. */
function startInstance(name, port, nodes, env, logDir) {
  const hosts = nodes.map(n => `127.0.0.1:${n.port}`).join(',')
  const app = { name, port, hosts, output: '' }
  app.child = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], {
    cwd: root,
    env: { ...env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATABASE_HOSTS: hosts, NUXT_DATABASE_HOST: '127.0.0.1', NUXT_DATABASE_PORT: String(nodes[0].port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  const file = createWriteStream(join(logDir, `instance-${name}.log`))
  const keep = (chunk) => {
    file.write(chunk)
    app.output = (app.output + chunk.toString()).slice(-20_000)
  }
  app.child.stdout.on('data', keep)
  app.child.stderr.on('data', keep)
  running.apps.push(app)
  return app
}

async function teardown() {
  if (running.tests && running.tests.exitCode === null) running.tests.kill('SIGTERM')
  for (const app of running.apps) {
    if (app.child.exitCode === null) app.child.kill('SIGTERM')
  }
  for (const app of running.apps) {
    for (let i = 0; i < 40 && app.child.exitCode === null; i++) await new Promise(r => setTimeout(r, 100))
    if (app.child.exitCode === null) app.child.kill('SIGKILL')
  }
  running.apps = []
  await running.mail?.close().catch(() => {})
  await running.s3?.close().catch(() => {})
  running.mail = running.s3 = null
  if (running.cluster) await down(running.cluster).catch(error => log(`stopping the cluster: ${error.message}`))
  running.cluster = null
}

function printTable(reportFile) {
  if (!existsSync(reportFile)) {
    log('no figures were recorded (the tests stopped before measuring)')
    return
  }
  const figures = JSON.parse(readFileSync(reportFile, 'utf8'))
  const rows = Object.entries(figures)
  const width = Math.max(...rows.map(([k]) => k.length))
  process.stdout.write(`\nClosing table (${new Date().toISOString().slice(0, 19)}Z)\n`)
  process.stdout.write(`${'-'.repeat(width + 24)}\n`)
  for (const [key, value] of rows) process.stdout.write(`${key.padEnd(width)}  ${value}\n`)
  process.stdout.write(`${'-'.repeat(width + 24)}\n`)
}

async function main() {
  const c = cluster()
  const s = c.settings
  rmSync(s.base, { recursive: true, force: true })
  mkdirSync(s.base, { recursive: true })
  running.cluster = c
  await up({ fresh: true })
  seed(c.db)
  running.s3 = await startS3Peer({ port: s.s3Port, directory: join(s.base, 's3') })
  running.mail = await startMailPeer(c.db, s.mailPort, 'mailbox')
  buildIfNeeded()
  const env = { ...process.env, ...serverEnv(c.db), ...running.s3.env, ...running.mail.env, NUXT_PUBLIC_DEV_MAILBOX: 'true', NODE_ENV: 'production' }
  const [n1, n2, n3] = c.nodes
  const a = startInstance('A', s.appPorts[0], [n1, n2, n3], env, s.base)
  const b = startInstance('B', s.appPorts[1], [n2, n3, n1], env, s.base)
  await Promise.all([waitForHealth(`http://127.0.0.1:${a.port}`, a, 90), waitForHealth(`http://127.0.0.1:${b.port}`, b, 90)])
  log(`instance A on 127.0.0.1:${a.port} (database ${a.hosts}), instance B on 127.0.0.1:${b.port} (database ${b.hosts}), S3 on ${running.s3.endpoint}, SMTP peer on 127.0.0.1:${s.mailPort}`)

  const reportFile = join(s.base, 'figures.json')
  // spawn, not spawnSync: the S3 server and the SMTP peer live in this process and must keep answering
  const tests = spawn(process.execPath, [join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', '--config', 'vitest.cluster.config.ts', ...extra], {
    cwd: root,
    stdio: 'inherit',
    env: {
      ...env,
      NUXT_DATABASE_HOST: '127.0.0.1',
      NUXT_DATABASE_PORT: String(n1.port),
      TENDONBOOK_CLUSTER_A_URL: `http://127.0.0.1:${a.port}`,
      TENDONBOOK_CLUSTER_B_URL: `http://127.0.0.1:${b.port}`,
      TENDONBOOK_CLUSTER_REPORT: reportFile,
      NODE_ENV: 'test',
    },
  })
  running.tests = tests
  const status = await new Promise(resolve => tests.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0))))
  running.tests = null
  const failedApps = running.apps.filter(app => app.child.exitCode !== null)
  for (const app of failedApps) log(`instance ${app.name} exited early:\n${app.output.slice(-3000)}`)
  printTable(reportFile)
  return status
}

let finishing = false
async function finish(code) {
  if (finishing) return
  finishing = true
  await teardown()
  process.exit(code)
}
process.on('SIGINT', () => finish(130))
process.on('SIGTERM', () => finish(143))

main().then(finish, async (error) => {
  process.stderr.write(`[test:cluster] ${error.message}\n`)
  await finish(1)
})
