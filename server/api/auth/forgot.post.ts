import { eq, sql } from 'drizzle-orm'
import { forgotSchema } from '#shared/schemas/auth'

// Always answers the same, so the form does not reveal which addresses have accounts.
export default defineEventHandler(async (event) => {
  const { email } = await readValid(event, forgotSchema)
  const [user] = await useDb().select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, email))
  if (user && !user.disabled) {
    const link = await issueOneTimeLink(user.id, 'reset')
    await sendMail({
      to: user.email,
      subject: 'Stratavolt: reset your password',
      text: `Hello ${user.name},\n\nsomeone asked to reset the password of your Stratavolt account. Choose a new one here (the link works once, for one hour):\n\n${link.url}\n\nIf it was not you, ignore this message.\n`,
    })
    await audit(event, 'password reset requested', { actorId: user.id, actorEmail: user.email })
  }
  return { ok: true, message: 'If that address has an account, a reset link is on its way.' }
})
