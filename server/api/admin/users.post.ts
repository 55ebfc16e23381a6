import { eq, sql } from 'drizzle-orm'
import { inviteSchema } from '#shared/schemas/auth'
import { roleLabels } from '#shared/roles'
import { authChanged } from '~~/server/utils/auth-cache'

// Invites a colleague: creates the account without a password and mails a one-time link
// (a newer invitation or reset link revokes the older ones).
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'users:manage')
  const body = await readValid(event, inviteSchema)
  const db = useDb()
  const [existing] = await db.select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, body.email))
  if (existing?.passwordHash) {
    throw createError({ statusCode: 409, message: `email: ${body.email} already has an account.`, data: { issues: [{ path: 'email', message: 'Already has an account' }] } })
  }
  let user = existing ?? (await db.insert(tables.users).values({ email: body.email, name: body.name, role: body.role }).returning())[0]!
  // Inviting someone who has not accepted yet: the new invitation's role and name replace the old
  // ones (audited), and the new link replaces the old link, so what the mail says is what signs in.
  if (existing && (existing.role !== body.role || existing.name !== body.name)) {
    user = (await db.update(tables.users).set({ role: body.role, name: body.name }).where(eq(tables.users.id, existing.id)).returning())[0]!
    await authChanged(existing.id)
    if (existing.role !== body.role) await audit(event, 'role changed', { subject: user.email, details: { from: existing.role, to: body.role, reason: 'invited again' } })
  }
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
