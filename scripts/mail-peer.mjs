// A local SMTP peer (smtp-server) for development and tests: every message sent by the app is
// received here and written to <instance>/mailbox/*.json, which the dev-only mailbox page lists.
// For the fault tests the peer can be stopped and started again from outside: while a file named
// `.peer-stopped` lies in its mailbox folder it does not listen (a connection is refused, as when
// the mail server is down), and it listens again on the same port once the file is gone.
import { existsSync, mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { SMTPServer } from 'smtp-server'

export const STOP_FILE = '.peer-stopped'

export async function startMailPeer(inst, port = inst.mailPort, folder = 'mailbox') {
  const dir = join(inst.base, folder)
  mkdirSync(dir, { recursive: true })
  let seq = 0
  const make = () => new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      const chunks = []
      stream.on('data', c => chunks.push(c))
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8')
        const file = join(dir, `${Date.now()}-${String(seq++).padStart(4, '0')}.json`)
        writeFileSync(file, JSON.stringify({
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map(r => r.address),
          raw,
        }, null, 2))
        callback()
      })
    },
  })
  const listen = server => new Promise((resolvePromise, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => resolvePromise(server))
  })
  let server = await listen(make())
  let changing = false
  const watch = setInterval(async () => {
    if (changing) return
    const stopped = existsSync(join(dir, STOP_FILE))
    if (stopped === (server === null)) return
    changing = true
    try {
      if (stopped) {
        const old = server
        server = null
        await new Promise(r => old.close(r))
      }
      else {
        server = await listen(make())
      }
    }
    catch {}
    finally {
      changing = false
    }
  }, 100)
  watch.unref()
  return {
    env: { NUXT_MAIL_HOST: '127.0.0.1', NUXT_MAIL_PORT: String(port), NUXT_MAILBOX_DIR: dir },
    close: () => {
      clearInterval(watch)
      return server ? new Promise(r => server.close(r)) : Promise.resolve()
    },
  }
}
