// Ends this session server-side: its id goes on the revoked list the guard checks, so the cookie
// (and any copy of it) stops working at once, on every instance. The account's other sessions
// (another browser) stay; a password reset or disabling ends all of them (session version).
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  await endSession(event, user?.id ?? null)
  if (user) await audit(event, 'signed out', { actorId: user.id, actorEmail: user.email })
  return { ok: true }
})
