import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'

let transport: Transporter | undefined

/** One SMTP transport from runtimeConfig.mail: a hosted provider needs only settings. */
export function mailTransport(): Transporter {
  if (!transport) {
    const { mail } = useRuntimeConfig()
    const secure = String(mail.secure) === 'true'
    transport = nodemailer.createTransport({
      host: mail.host,
      port: Number(mail.port),
      secure,
      // the local peer speaks plain SMTP; a provider on 587 upgrades with STARTTLS
      ignoreTLS: !secure && (mail.host === '127.0.0.1' || mail.host === 'localhost'),
      auth: mail.user ? { user: mail.user, pass: mail.password } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    })
  }
  return transport
}

export async function sendMail(message: { to: string[], subject: string, text: string }) {
  const { mail } = useRuntimeConfig()
  await mailTransport().sendMail({ from: mail.from, to: message.to.join(', '), subject: message.subject, text: message.text })
}
