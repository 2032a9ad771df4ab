import nodemailer from 'nodemailer'
import { describe, expect, it } from 'vitest'
import { parseMessage } from '../../../server/utils/mailbox'

async function compose(subject: string, text: string) {
  // nodemailer's own stream transport writes the exact bytes it would send over SMTP
  const transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'crlf' })
  const info = await transport.sendMail({ from: 'a@tendonbook.local', to: 'b@tendonbook.local', subject, text })
  return (info.message as Buffer).toString('utf8')
}

describe('dev mailbox message parsing', () => {
  it('reads back an ASCII notice as nodemailer writes it', async () => {
    const text = 'Priya issued PS-2 P02 for check.\n\nOpen it: http://127.0.0.1:3000/revisions/12\n'
    const parsed = parseMessage(await compose('[Tendonbook] PS-2 P02 issued for check', text))
    expect(parsed.subject).toBe('[Tendonbook] PS-2 P02 issued for check')
    expect(parsed.text).toBe(text.trimEnd())
  })

  it('decodes quoted-printable bodies and encoded subjects', async () => {
    const long = `σc ≤ 0.6·fck at transfer — ${'x'.repeat(120)}`
    const parsed = parseMessage(await compose('Prüfung σ ≤ 0.6 fck', long))
    expect(parsed.subject).toBe('Prüfung σ ≤ 0.6 fck')
    expect(parsed.text).toBe(long)
  })
})
