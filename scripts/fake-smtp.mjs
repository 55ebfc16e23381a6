// Local fake SMTP server: accepts every message on 127.0.0.1 and stores it, attachments
// included, as one JSON file per message in the mailbox folder that the app's mail page reads.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'

const port = Number(process.env.SMTP_PORT ?? 2525)
const mailbox = process.env.MAILBOX_DIR ?? join(process.cwd(), '.data', 'mailbox')
mkdirSync(mailbox, { recursive: true })

let counter = 0
// A recipient containing "+fail-once" is refused the first time it is seen (tests of mail retries).
const refusedOnce = new Set()
const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  size: 25 * 1024 * 1024,
  onRcptTo(address, session, callback) {
    const to = address.address.toLowerCase()
    if (to.includes('+fail-once') && !refusedOnce.has(to)) {
      refusedOnce.add(to)
      const err = new Error('mailbox busy, try again later (fake SMTP)')
      err.responseCode = 450
      return callback(err)
    }
    callback()
  },
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const receivedAt = new Date()
      const id = `${receivedAt.getTime()}-${process.pid}-${++counter}`
      const record = {
        id,
        receivedAt: receivedAt.toISOString(),
        from: mail.from?.text ?? '',
        to: session.envelope.rcptTo.map(r => r.address),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
        attachments: mail.attachments.map(a => ({
          filename: a.filename ?? 'attachment',
          contentType: a.contentType,
          size: a.size,
          contentBase64: a.content.toString('base64'),
        })),
      }
      writeFileSync(join(mailbox, `${id}.json`), JSON.stringify(record))
      callback()
    }, err => callback(err))
  },
})
server.on('error', err => console.error('[fake-smtp]', err.message))
server.listen(port, '127.0.0.1', () => console.log(`[fake-smtp] listening on 127.0.0.1:${port}, storing mail in ${mailbox}`))
for (const sig of ['SIGTERM', 'SIGINT']) process.on(sig, () => server.close(() => process.exit(0)))
