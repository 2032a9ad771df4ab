// Global setup for the integration and e2e projects: the built server (.output) on a test port,
// pointed at the test MariaDB started by scripts/test.mjs, plus the local SMTP peer.
import { spawn, type ChildProcess } from 'node:child_process'
import { createWriteStream, existsSync } from 'node:fs'
import { join, resolve } from 'node:path'
import type { TestProject } from 'vitest/node'

const root = resolve(import.meta.dirname, '..', '..')

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    mailboxDir: string
    /** the test server's process, whose Chromium the fault tests may kill */
    serverPid: number
  }
}

export default async function setup(project: TestProject) {
  if (!process.env.NUXT_DATABASE_PORT) {
    throw new Error('Integration and e2e tests need the test database: run them with `npm test`')
  }
  const entry = join(root, '.output', 'server', 'index.mjs')
  if (!existsSync(entry)) throw new Error('No build in .output: run `npm test`, which builds first')

  const { startMailPeer } = await import('../../scripts/mail-peer.mjs')
  const { instance } = await import('../../scripts/db.mjs')
  // integration and e2e run side by side, hardening after them: each gets its own server, SMTP port and mailbox
  const offset = project.name === 'e2e' ? 1 : project.name === 'hardening' ? 2 : 0
  const inst = instance(true)
  const port = inst.appPort + offset
  const mail = await startMailPeer(inst, inst.mailPort + offset * 10, `mailbox-${project.name}`)

  const server: ChildProcess = spawn(process.execPath, [entry], {
    cwd: root,
    env: { ...process.env, ...mail.env, PORT: String(port), HOST: '127.0.0.1', NUXT_PUBLIC_DEV_MAILBOX: 'true' },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  // the server's log stays beside the test data, for the line an error answer's reference names
  const log = createWriteStream(join(inst.base, `server-${project.name}.log`))
  server.stdout?.on('data', (c: Buffer) => { output += c.toString(); log.write(c) })
  server.stderr?.on('data', (c: Buffer) => { output += c.toString(); log.write(c) })

  const baseUrl = `http://127.0.0.1:${port}`
  const until = Date.now() + 60_000
  for (;;) {
    try {
      const res = await fetch(`${baseUrl}/api/health`)
      if (res.ok) break
    }
    catch {}
    if (Date.now() > until || server.exitCode !== null) {
      server.kill()
      await mail.close()
      throw new Error(`test server did not start:\n${output}`)
    }
    await new Promise(r => setTimeout(r, 250))
  }
  project.provide('baseUrl', baseUrl)
  project.provide('mailboxDir', mail.env.NUXT_MAILBOX_DIR)
  project.provide('serverPid', server.pid!)

  return async () => {
    server.kill('SIGTERM')
    await mail.close()
  }
}
