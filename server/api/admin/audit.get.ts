import { desc, ilike, or } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({
  q: z.string().max(100).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(200),
})

export default defineEventHandler(async (event) => {
  await requireRole(event, 'audit:read')
  const { q, limit } = queryValid(event, query)
  const t = tables.auditLog
  return useDb().select().from(t)
    .where(q ? or(ilike(t.action, `%${q}%`), ilike(t.actorEmail, `%${q}%`), ilike(t.subject, `%${q}%`)) : undefined)
    .orderBy(desc(t.at), desc(t.id)).limit(limit)
})
