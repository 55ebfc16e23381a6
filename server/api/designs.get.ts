import { desc, eq } from 'drizzle-orm'
import { designListQuery } from '#shared/schemas/design'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { status } = queryValid(event, designListQuery)
  const d = tables.designs
  return useDb().select({
    id: d.id, name: d.name, topology: d.topology, levels: d.levels, dcVoltage: d.dcVoltage, powerKw: d.powerKw,
    backToBack: d.backToBack, status: d.status, revision: d.revision, updatedAt: d.updatedAt, owner: tables.users.name,
  }).from(d).leftJoin(tables.users, eq(tables.users.id, d.ownerId))
    .where(status === 'all' ? undefined : eq(d.status, status))
    .orderBy(desc(d.updatedAt))
})
