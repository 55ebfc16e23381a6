import { setPasswordSchema } from '#shared/schemas/auth'
import { isRole } from '#shared/roles'

// The invitation and password-reset links both land here. Setting the password ends every other
// session of that account (session version +1) and lifts its sign-in lockout: the real owner of
// a locked account always gets in with a reset link.
export default defineEventHandler(async (event) => {
  const { token, password } = await readValid(event, setPasswordSchema)
  const result = await setPasswordWithLink(token, password)
  const user = result?.user
  if (!result || !user || !isRole(user.role)) {
    throw createError({ statusCode: 410, message: 'This link has expired, was already used, or a newer link was sent. Ask for a new one.' })
  }
  await clearSignInFailures(user.email.toLowerCase())
  await audit(event, result.purpose === 'invite' ? 'invitation accepted' : 'password reset', { actorId: user.id, actorEmail: user.email })
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role, locale: user.locale ?? null }
  await startSession(event, sessionUser, user.sessionVersion)
  return { user: sessionUser }
})
