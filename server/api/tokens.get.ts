import { and, desc, eq, isNull } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'tokens:own')
  const t = tables.apiTokens
  return useDb().select({ id: t.id, name: t.name, prefix: t.prefix, createdAt: t.createdAt, lastUsedAt: t.lastUsedAt })
    .from(t).where(and(eq(t.userId, user.id), isNull(t.revokedAt))).orderBy(desc(t.createdAt))
})
