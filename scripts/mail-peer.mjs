// A local SMTP peer (smtp-server) for development and tests: every message sent by the app is
// received here and written to <instance>/mailbox/*.json, which the dev-only mailbox page lists.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { SMTPServer } from 'smtp-server'

export async function startMailPeer(inst, port = inst.mailPort, folder = 'mailbox') {
  const dir = join(inst.base, folder)
  mkdirSync(dir, { recursive: true })
  let seq = 0
  const server = new SMTPServer({
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
  await new Promise((resolvePromise, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', resolvePromise)
  })
  return {
    env: { NUXT_MAIL_HOST: '127.0.0.1', NUXT_MAIL_PORT: String(port), NUXT_MAILBOX_DIR: dir },
    close: () => new Promise(r => server.close(r)),
  }
}
