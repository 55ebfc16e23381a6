import { inArray, eq } from 'drizzle-orm'
import { commitParts } from '~~/server/services/catalog'
import { partsBulkSchema } from '#shared/schemas/catalog'
import type { CatalogPart } from '#shared/catalog/types'
import { count } from '#shared/utils/format'

// Approve, or change the lifecycle of, many parts at once: `confirm` must name how many change.
// A lifecycle change is one new catalogue version for all of them; approval is a flag on the part.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { ids, approved, lifecycle } = await readValid(event, partsBulkSchema)
  const unique = [...new Set(ids)]
  const db = useDb()
  const rows = await db.select({ id: tables.parts.id, data: tables.partVersions.data }).from(tables.parts)
    .innerJoin(tables.partVersions, eq(tables.partVersions.id, tables.parts.currentVersionId)).where(inArray(tables.parts.id, unique))
  if (rows.length !== unique.length) {
    const found = new Set(rows.map(r => r.id))
    const missing = unique.filter(x => !found.has(x))
    throw createError({ statusCode: 422, message: `ids: no such part ${missing.slice(0, 5).join(', ')}${missing.length > 5 ? ` and ${missing.length - 5} more` : ''}; nothing was changed.`, data: { issues: [{ path: 'ids', message: 'Unknown part ids' }] } })
  }
  const summary = await db.transaction(async (tx) => {
    if (approved !== undefined) await tx.update(tables.parts).set({ approved }).where(inArray(tables.parts.id, unique))
    if (lifecycle === undefined) return null
    const parts = rows.map(r => ({ ...(r.data as CatalogPart), lifecycle }))
    return commitParts(tx, parts, { userId: user.id, note: `Lifecycle of ${count(parts.length, 'part')} set to ${lifecycle}`, approve: false })
  })
  await audit(event, 'parts changed in bulk', { subject: count(unique.length, 'part'), details: { approved, lifecycle, ids: unique.slice(0, 100) } })
  return { changed: unique.length, approved: approved ?? null, lifecycle: lifecycle ?? null, catalogVersion: summary?.number ?? null }
})
