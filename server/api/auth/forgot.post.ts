import { eq, sql } from 'drizzle-orm'
import { forgotSchema } from '#shared/schemas/auth'

// Always answers the same, after the same work, so neither the answer nor its timing reveals
// which addresses have accounts: the link and the audit row are written for known addresses, an
// audit row for unknown ones, and the mail itself goes out after the answer.
// Throttled per address and per client (429 with Retry-After), known or not.
export default defineEventHandler(async (event) => {
  const { email } = await readValid(event, forgotSchema)
  const wait = await forgotBlockedFor(email, clientAddress(event))
  if (wait > 0) {
    setResponseHeader(event, 'Retry-After', wait)
    throw createError({ statusCode: 429, message: `Too many reset requests. Try again in ${Math.ceil(wait / 60)} min.` })
  }
  const [user] = await useDb().select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, email))
  if (user && !user.disabled) {
    const link = await issueOneTimeLink(user.id, 'reset')
    await audit(event, 'password reset requested', { actorId: user.id, actorEmail: user.email })
    // not awaited: SMTP time would tell known from unknown addresses; sendMail records failures
    void sendMail({
      to: user.email,
      subject: 'Stratavolt: reset your password',
      text: `Hello ${user.name},\n\nsomeone asked to reset the password of your Stratavolt account. Choose a new one here (the link works once, for one hour; an older link stops working):\n\n${link.url}\n\nIf it was not you, ignore this message.\n`,
    }).catch(err => console.error('[mail] reset mail failed:', err))
  }
  else {
    // the same kind of writes as above
    await useDb().transaction(async (tx) => {
      await tx.update(tables.oneTimeTokens).set({ usedAt: new Date() }).where(eq(tables.oneTimeTokens.userId, -1))
      await tx.execute(sql`select 1`)
    })
    await audit(event, 'password reset requested', { actorEmail: email, details: { account: false } })
  }
  return { ok: true, message: 'If that address has an account, a reset link is on its way.' }
})
