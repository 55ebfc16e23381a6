import { eq } from 'drizzle-orm'
import { localeSettingSchema } from '#shared/schemas/auth'
import { authChanged } from '~~/server/utils/auth-cache'

// The signed-in person's locale for dates, numbers and money on the pages and in the exports; null returns to
// the company default. The session answer (GET /api/_auth/session) carries it from the next read on.
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Please sign in.' })
  const { locale } = await readValid(event, localeSettingSchema)
  await useDb().update(tables.users).set({ locale }).where(eq(tables.users.id, user.id))
  await authChanged(user.id)
  await audit(event, 'locale changed', { subject: user.email, details: { from: user.locale, to: locale } })
  event.context.user = { ...user, locale }
  return { locale, effective: requestLocale(event) }
})
