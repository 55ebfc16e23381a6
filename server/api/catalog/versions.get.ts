import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const c = tables.catalogVersions
  return useDb().select({ id: c.id, number: c.number, note: c.note, partsAdded: c.partsAdded, partsUpdated: c.partsUpdated, createdAt: c.createdAt, createdBy: tables.users.name })
    .from(c).leftJoin(tables.users, eq(tables.users.id, c.createdBy)).orderBy(desc(c.number)).limit(200)
})
