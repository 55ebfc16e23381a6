import { desc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'

// One part with every version it had (which catalogue version, when).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const { id } = paramsValid(event, idParam)
  const db = useDb()
  const [part] = await db.select().from(tables.parts).where(eq(tables.parts.id, id))
  if (!part) throw createError({ statusCode: 404, message: 'No such part.' })
  const versions = await db.select({ id: tables.partVersions.id, data: tables.partVersions.data, createdAt: tables.partVersions.createdAt, catalogVersion: tables.catalogVersions.number, note: tables.catalogVersions.note })
    .from(tables.partVersions).innerJoin(tables.catalogVersions, eq(tables.catalogVersions.id, tables.partVersions.catalogVersionId))
    .where(eq(tables.partVersions.partId, id)).orderBy(desc(tables.partVersions.id))
  return { ...part, versions }
})
