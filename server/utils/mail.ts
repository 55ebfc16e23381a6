import nodemailer, { type Transporter } from 'nodemailer'

export interface OutgoingMail {
  to: string | string[]
  subject: string
  text: string
  attachments?: { filename: string, content: Buffer, contentType?: string }[]
}

let transport: Transporter | undefined

function useTransport() {
  if (!transport) {
    const c = useRuntimeConfig()
    transport = nodemailer.createTransport({
      host: c.smtpHost,
      port: Number(c.smtpPort),
      secure: false,
      ignoreTLS: c.smtpHost === '127.0.0.1' || c.smtpHost === 'localhost',
      auth: c.smtpUser ? { user: c.smtpUser, pass: c.smtpPass } : undefined,
    })
  }
  return transport
}

/** Sends one message over SMTP and records it; returns false (and records why) when sending failed. */
export async function sendMail(mail: OutgoingMail): Promise<boolean> {
  return (await sendMailResult(mail)).ok
}

/** As sendMail, with the SMTP error (the outbox keeps it for the outgoing-mail page). */
export async function sendMailResult(mail: OutgoingMail): Promise<{ ok: boolean, error: string | null }> {
  const to = Array.isArray(mail.to) ? mail.to.join(', ') : mail.to
  const names = (mail.attachments ?? []).map(a => a.filename)
  try {
    const info = await useTransport().sendMail({ from: useRuntimeConfig().mailFrom, ...mail, to })
    await useDb().insert(tables.sentMail).values({ to, subject: mail.subject, messageId: info.messageId, attachments: names, status: 'sent' })
    return { ok: true, error: null }
  }
  catch (err) {
    const message = err instanceof Error ? err.message : String(err)
    console.error('[mail] sending failed:', message)
    await useDb().insert(tables.sentMail).values({ to, subject: mail.subject, attachments: names, status: 'failed', error: message })
    return { ok: false, error: message }
  }
}

export function appUrl(path: string) {
  return new URL(path, useRuntimeConfig().appUrl).toString()
}

/** Resolves when the SMTP server answers a handshake (health check). */
export async function verifyMailTransport() {
  await useTransport().verify()
}
