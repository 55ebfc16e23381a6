// GET /api/_auth/session answers with the user as the database knows them now (role, name), not as the sealed
// cookie remembers them; a session that no longer counts (disabled, password reset, signed out) answers with
// no user and why, so an open tab can send its user to sign-in with a note. It also carries the locale the pages
// format dates, numbers and money in (`locale`: the user's choice, else the company default).
import { eq } from 'drizzle-orm'

export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (session, event) => {
    const remembered = session.user
    if (!remembered) {
      session.locale = companyLocale(event)
      return
    }
    const user = await currentUser(event)
    if (user) {
      session.user = user
      // the locale pages format in: the user's choice, else the company default (SSR and browser read the same)
      session.locale = requestLocale(event)
      return
    }
    const [row] = await useDb().select({ disabled: tables.users.disabled }).from(tables.users).where(eq(tables.users.id, remembered.id))
    for (const key of Object.keys(session)) Reflect.deleteProperty(session, key)
    session.ended = row?.disabled ? 'disabled' : 'ended'
  })
})
