import { eq, sql } from 'drizzle-orm'
import { loginSchema } from '#shared/schemas/auth'
import { isRole } from '#shared/roles'

export default defineEventHandler(async (event) => {
  const { email, password } = await readValid(event, loginSchema, 400)
  const ip = getRequestIP(event) ?? 'unknown'
  const wait = signInBlockedFor(email, ip)
  if (wait > 0) {
    setResponseHeader(event, 'Retry-After', wait)
    throw createError({ statusCode: 429, message: `Too many failed sign-ins. Try again in ${Math.ceil(wait / 60)} min.` })
  }
  const db = useDb()
  const [user] = await db.select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, email))
  const ok = !!user?.passwordHash && !user.disabled && isRole(user.role) && await verifyPassword(user.passwordHash, password)
  if (!ok || !user || !isRole(user.role)) {
    recordSignInFailure(email, ip)
    await audit(event, 'sign-in failed', { actorId: user?.id ?? null, actorEmail: email, details: { reason: user?.disabled ? 'disabled' : 'wrong e-mail or password' } })
    throw createError({ statusCode: 401, message: 'Wrong e-mail or password.' })
  }
  clearSignInFailures(email)
  await db.update(tables.users).set({ lastSignInAt: new Date() }).where(eq(tables.users.id, user.id))
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role }
  await replaceUserSession(event, { user: sessionUser, sessionVersion: user.sessionVersion })
  await audit(event, 'signed in', { actorId: user.id, actorEmail: user.email })
  return { user: sessionUser }
})
