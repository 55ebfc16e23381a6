import { eq, sql } from 'drizzle-orm'
import { inviteSchema } from '#shared/schemas/auth'
import { roleLabels } from '#shared/roles'

// Invites a colleague: creates the account without a password and mails a one-time link.
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'users:manage')
  const body = await readValid(event, inviteSchema)
  const db = useDb()
  const [existing] = await db.select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, body.email))
  if (existing?.passwordHash) {
    throw createError({ statusCode: 409, message: `email: ${body.email} already has an account.`, data: { issues: [{ path: 'email', message: 'Already has an account' }] } })
  }
  const user = existing ?? (await db.insert(tables.users).values({ email: body.email, name: body.name, role: body.role }).returning())[0]!
  const link = await issueOneTimeLink(user.id, 'invite')
  const sent = await sendMail({
    to: user.email,
    subject: 'You are invited to Stratavolt',
    text: `Hello ${user.name},\n\n${admin.name} invited you to Stratavolt as ${roleLabels[body.role]}. Set your password here (the link works once, for 7 days):\n\n${link.url}\n`,
  })
  await audit(event, 'user invited', { subject: user.email, details: { role: body.role, mailSent: sent } })
  setResponseStatus(event, 201)
  return { id: user.id, email: user.email, mailSent: sent, expiresAt: link.expiresAt }
})
