import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { bomStatusSchema } from '#shared/schemas/bom'
import { loadBom } from '~~/server/services/bom'

// Purchasing moves a released BOM through quoted → ordered → received (or cancels it).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:purchase')
  const { id } = paramsValid(event, idParam)
  const { status } = await readValid(event, bomStatusSchema)
  const bom = await loadBom(id)
  await useDb().update(tables.boms).set({ status }).where(eq(tables.boms.id, id))
  await audit(event, 'BOM status changed', { subject: `BOM ${id}`, details: { from: bom.status, to: status } })
  return { id, status }
})
