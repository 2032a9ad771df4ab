import { spawn } from 'node:child_process'
import { join, resolve } from 'node:path'
import { describe, expect, inject, it } from 'vitest'

const root = resolve(import.meta.dirname, '..', '..')

describe('health', () => {
  it('says ok while the database answers', async () => {
    const res = await fetch(`${inject('baseUrl')}/api/health`)
    expect(res.status).toBe(200)
  })

  it('says 503 when the database is down, so a load balancer sends no traffic there', async () => {
    // a second instance of the built server, pointed at a port where no database listens
    const port = Number(new URL(inject('baseUrl')).port) + 50
    const server = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], {
      cwd: root,
      env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATABASE_PORT: String(port + 1) },
      stdio: 'ignore',
    })
    try {
      let res: Response | undefined
      for (const until = Date.now() + 30_000; !res && Date.now() < until;) {
        res = await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => undefined)
        if (!res) await new Promise(r => setTimeout(r, 250))
      }
      expect(res?.status).toBe(503)
      expect((await res!.json()).message).toBe('The database is not answering')
    }
    finally {
      server.kill('SIGTERM')
    }
  })
})
