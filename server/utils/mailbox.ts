// Reads the dev SMTP peer's mailbox folder (scripts/mail-peer.mjs writes one JSON file per message).
import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'

export interface MailboxMessage {
  file: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
}

function decodeQuotedPrintable(text: string) {
  const bytes = Buffer.from(text.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/gi, (_, h: string) => String.fromCharCode(parseInt(h, 16))), 'latin1')
  return bytes.toString('utf8')
}

function decodeWord(value: string) {
  return value.replace(/=\?utf-8\?([bq])\?([^?]*)\?=/gi, (_, enc: string, data: string) => enc.toLowerCase() === 'b'
    ? Buffer.from(data, 'base64').toString('utf8')
    : decodeQuotedPrintable(data.replace(/_/g, ' ')))
}

/** A single-part text message as nodemailer writes it: headers, blank line, body (7bit, QP or base64). */
export function parseMessage(raw: string): { subject: string, text: string } {
  const split = raw.search(/\r?\n\r?\n/)
  const head = split >= 0 ? raw.slice(0, split) : raw
  const body = split >= 0 ? raw.slice(split).replace(/^\r?\n\r?\n/, '') : ''
  const headers = new Map<string, string>()
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const i = line.indexOf(':')
    if (i > 0) headers.set(line.slice(0, i).trim().toLowerCase(), line.slice(i + 1).trim())
  }
  const encoding = (headers.get('content-transfer-encoding') ?? '').toLowerCase()
  const text = encoding === 'quoted-printable' ? decodeQuotedPrintable(body) : encoding === 'base64' ? Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8') : body
  return { subject: decodeWord(headers.get('subject') ?? ''), text: text.replace(/\r\n/g, '\n').trimEnd() }
}

/** The newest messages of the mailbox folder; with `recipient`, only those addressed to that e-mail. */
export async function readMailbox(dir: string, limit = 100, recipient?: string): Promise<MailboxMessage[]> {
  let files: string[]
  try {
    files = (await readdir(dir)).filter(f => f.endsWith('.json')).sort().reverse()
  }
  catch {
    return []
  }
  const out: MailboxMessage[] = []
  const wanted = recipient?.toLowerCase()
  for (const file of files) {
    if (out.length >= limit) break
    const stored = JSON.parse(await readFile(join(dir, file), 'utf8')) as { receivedAt: string, from: string, to: string[], raw: string }
    if (wanted && !stored.to.some(to => to.toLowerCase() === wanted)) continue
    out.push({ file, receivedAt: stored.receivedAt, from: stored.from, to: stored.to, ...parseMessage(stored.raw) })
  }
  return out
}
