import { commitParts, lockCatalog } from '~~/server/services/catalog'
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { partPatchSchema } from '#shared/schemas/catalog'
import type { CatalogPart } from '#shared/catalog/types'
import { fosterProblems } from '#shared/thermal/network'

// Approve a part, or change its lifecycle / stock / lead time / Foster network (a new part version in a new
// catalogue version). A Foster field sent as null is cleared; the result must give both halves of each pair.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { approved, ...edits } = await readValid(event, partPatchSchema)
  const db = useDb()
  // Read and write under the catalogue lock: two edits at once apply one after the other, the
  // second on top of the first (no lost change, no duplicate version number).
  const row = await db.transaction(async (tx) => {
    await lockCatalog(tx)
    const [row] = await tx.select({ part: tables.parts, data: tables.partVersions.data }).from(tables.parts)
      .innerJoin(tables.partVersions, eq(tables.partVersions.id, tables.parts.currentVersionId)).where(eq(tables.parts.id, id))
      .for('update', { of: tables.parts })
    if (!row) throw createError({ statusCode: 404, message: 'No such part.' })
    // A part the re-keying found to repeat an older one: a new version would land on the older part (same key).
    if (row.part.keyConflictWith !== null && Object.values(edits).some(v => v !== undefined)) {
      throw createError({ statusCode: 409, message: `${row.part.manufacturer} ${row.part.partNumber} is another spelling of part ${row.part.keyConflictWith} (see "Part key conflict" in the audit log): edit that part instead.` })
    }
    if (approved !== undefined) await tx.update(tables.parts).set({ approved }).where(eq(tables.parts.id, id))
    const changes = Object.fromEntries(Object.entries(edits).filter(([, v]) => v !== undefined))
    if (Object.keys(changes).length) {
      // null clears a field: it is left out of the new version's data
      const part = Object.fromEntries(Object.entries({ ...(row.data as CatalogPart), ...changes }).filter(([, v]) => v !== null)) as unknown as CatalogPart
      const refused = fosterProblems(part).filter(p => p.severity === 'error')
      if (refused.length) throw createError({ statusCode: 422, message: refused[0]!.message, data: { issues: refused.map(p => ({ path: p.field, message: p.message })) } })
      await commitParts(tx, [part], { userId: user.id, note: `Edited ${part.partNumber} (${Object.keys(changes).join(', ')})`, approve: row.part.approved })
    }
    return row
  })
  await audit(event, 'part edited', { subject: `${row.part.manufacturer} ${row.part.partNumber}`, details: { approved, ...edits } })
  return { ok: true }
})
