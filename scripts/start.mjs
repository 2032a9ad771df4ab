#!/usr/bin/env node
// `npm start`: the product with its demo data on http://localhost:3000.
// Installs the system packages it needs (as root), starts the private MariaDB, migrates, seeds the
// demo scenario once, builds when the sources changed, serves, and stops the database on exit.
import { spawn } from 'node:child_process'
import { join, resolve, dirname } from 'node:path'
import { fileURLToPath } from 'node:url'
import { start, stop, serverEnv } from './db.mjs'
import { seed } from './seed.mjs'
import { buildIfNeeded } from './build.mjs'
import { startMailPeer } from './mail-peer.mjs'
import { issueDemoRevision } from './demo-revision.mjs'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const dev = process.argv.includes('--dev')

const DEMO_SIGNINS = [
  ['engineer', 'engineer@tendonbook.local', 'engineer-demo-2417'],
  ['checker', 'checker@tendonbook.local', 'checker-demo-2417'],
  ['records', 'records@tendonbook.local', 'records-demo-2417'],
  ['admin', 'admin@tendonbook.local', 'admin-demo-2417!'],
]

async function main() {
  const inst = await start()
  const port = inst.appPort
  seed(inst)
  const mail = await startMailPeer(inst)
  const env = {
    ...process.env,
    ...serverEnv(inst),
    ...mail.env,
    PORT: String(port),
    NUXT_PUBLIC_DEV_MAILBOX: 'true',
  }
  let server
  if (dev) {
    server = spawn(process.execPath, [join(root, 'node_modules', '@nuxt', 'cli', 'bin', 'nuxi.mjs'), 'dev', '--port', String(port)], { cwd: root, stdio: 'inherit', env })
  }
  else {
    buildIfNeeded()
    server = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], { cwd: root, stdio: 'inherit', env })
  }
  await waitForServer(`http://127.0.0.1:${port}/api/health`, 120)
  await issueDemoRevision(`http://127.0.0.1:${port}`).catch(error => process.stderr.write(`[demo] could not issue the demo revision: ${error.message}\n`))
  process.stdout.write([
    '',
    `Tendonbook is running: http://localhost:${port}`,
    'Demo sign-ins (local demo only):',
    ...DEMO_SIGNINS.map(([role, email, password]) => `  ${role.padEnd(9)} ${email.padEnd(28)} ${password}`),
    'Press Ctrl+C to stop (the database stops with it).',
    '',
  ].join('\n'))

  let stopping = false
  const shutdown = async (code = 0) => {
    if (stopping) return
    stopping = true
    server.kill('SIGTERM')
    await mail.close()
    await stop().catch(() => {})
    process.exit(code)
  }
  process.on('SIGINT', () => shutdown(0))
  process.on('SIGTERM', () => shutdown(0))
  server.on('exit', code => shutdown(code ?? 0))
}

async function waitForServer(url, seconds) {
  const until = Date.now() + seconds * 1000
  while (Date.now() < until) {
    try {
      const res = await fetch(url)
      if (res.ok) return
    }
    catch {}
    await new Promise(r => setTimeout(r, 300))
  }
  throw new Error(`the server did not answer at ${url} within ${seconds} s`)
}

main().catch(async (error) => {
  process.stderr.write(`\n[start] ${error.message}\n`)
  await stop().catch(() => {})
  process.exit(1)
})
