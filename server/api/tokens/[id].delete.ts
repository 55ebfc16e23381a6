import { and, eq, isNull } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { authChanged } from '~~/server/utils/auth-cache'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'tokens:own')
  const { id } = paramsValid(event, idParam)
  const t = tables.apiTokens
  const [row] = await useDb().update(t).set({ revokedAt: new Date() })
    .where(and(eq(t.id, id), eq(t.userId, user.id), isNull(t.revokedAt))).returning()
  if (!row) throw createError({ statusCode: 404, message: 'No such token.' })
  // every instance stops trusting its cached owner of this token now
  await authChanged(user.id)
  await audit(event, 'API token revoked', { subject: row.name })
  return { ok: true }
})
