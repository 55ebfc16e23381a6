import { desc } from 'drizzle-orm'

// Outgoing mail: what the app sent (and whether it went out), plus what the local fake SMTP server received.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'mail:read')
  const [sent, received] = await Promise.all([
    useDb().select().from(tables.sentMail).orderBy(desc(tables.sentMail.at)).limit(300),
    readMailbox(),
  ])
  return {
    sent,
    received: received.slice(0, 300).map(m => ({ ...m, attachments: m.attachments.map(({ contentBase64: _, ...a }) => a) })),
    mailboxConfigured: !!useRuntimeConfig().mailboxDir,
  }
})
