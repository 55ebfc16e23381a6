import { eq, sql } from 'drizzle-orm'

// Ends the session server-side: the session version goes up, so this cookie (and any copy of it)
// stops working at once, on every instance, not only in this browser.
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  if (user) {
    await useDb().update(tables.users).set({ sessionVersion: sql`${tables.users.sessionVersion} + 1` }).where(eq(tables.users.id, user.id))
    await audit(event, 'signed out', { actorId: user.id, actorEmail: user.email })
  }
  await clearUserSession(event, sessionCookie(event))
  return { ok: true }
})
