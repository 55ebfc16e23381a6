import { eq, sql } from 'drizzle-orm'
import { loginSchema } from '#shared/schemas/auth'
import { isRole } from '#shared/roles'

// Signs in. Unknown address, no password yet, disabled or wrong password: the same work (one
// password hash check) and the same answer, so neither timing nor wording tells which addresses
// have accounts. Only after the right password is a disabled account told that it is disabled.
// Failures are throttled per account and client (a stranger elsewhere cannot lock the owner out).
export default defineEventHandler(async (event) => {
  const { email, password } = await readValid(event, loginSchema, 400)
  const ip = clientAddress(event)
  const wait = await signInBlockedFor(email, ip)
  if (wait > 0) {
    setResponseHeader(event, 'Retry-After', wait)
    throw createError({ statusCode: 429, message: `Too many failed sign-ins from here. Try again in ${Math.ceil(wait / 60)} min, or reset your password by e-mail.` })
  }
  const db = useDb()
  const [user] = await db.select().from(tables.users).where(eq(sql`lower(${tables.users.email})`, email))
  const passwordOk = await verifyPassword(user?.passwordHash ?? await dummyPasswordHash(), password)
  const ok = passwordOk && !!user?.passwordHash && isRole(user.role)
  if (!ok || !user || !isRole(user.role)) {
    await recordSignInFailure(email, ip)
    await audit(event, 'sign-in failed', { actorId: user?.id ?? null, actorEmail: email, details: { reason: 'wrong e-mail or password' } })
    throw createError({ statusCode: 401, message: 'Wrong e-mail or password.' })
  }
  if (user.disabled) {
    await audit(event, 'sign-in refused', { actorId: user.id, actorEmail: user.email, details: { reason: 'disabled' } })
    throw createError({ statusCode: 403, message: 'Your account is disabled. Ask an administrator to enable it.', data: { reason: 'disabled' } })
  }
  await clearSignInFailures(email)
  await db.update(tables.users).set({ lastSignInAt: new Date() }).where(eq(tables.users.id, user.id))
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role, locale: user.locale ?? null }
  await startSession(event, sessionUser, user.sessionVersion)
  await audit(event, 'signed in', { actorId: user.id, actorEmail: user.email })
  return { user: sessionUser }
})
