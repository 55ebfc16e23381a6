import { eq } from 'drizzle-orm'
import { idParam, userPatchSchema } from '#shared/schemas/auth'
import { authChanged } from '~~/server/utils/auth-cache'

// Changes a role or disables / re-enables an account; disabling ends its sessions at once.
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'users:manage')
  const { id } = paramsValid(event, idParam)
  const body = await readValid(event, userPatchSchema)
  if (id === admin.id && (body.disabled || (body.role && body.role !== 'admin'))) {
    throw createError({ statusCode: 422, message: 'You cannot disable yourself or take away your own admin role.' })
  }
  const db = useDb()
  const [user] = await db.select().from(tables.users).where(eq(tables.users.id, id))
  if (!user) throw createError({ statusCode: 404, message: 'No such user.' })
  const changes: Partial<typeof tables.users.$inferInsert> = {}
  if (body.role && body.role !== user.role) changes.role = body.role
  if (body.disabled !== undefined && body.disabled !== user.disabled) {
    changes.disabled = body.disabled
    changes.sessionVersion = user.sessionVersion + 1
  }
  if (Object.keys(changes).length) {
    await db.update(tables.users).set(changes).where(eq(tables.users.id, id))
    await authChanged(id)
  }
  if (changes.role) await audit(event, 'role changed', { subject: user.email, details: { from: user.role, to: changes.role } })
  if (changes.disabled !== undefined) await audit(event, changes.disabled ? 'user disabled' : 'user enabled', { subject: user.email })
  return { id, role: changes.role ?? user.role, disabled: changes.disabled ?? user.disabled }
})
