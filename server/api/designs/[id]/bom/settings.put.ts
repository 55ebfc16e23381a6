import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { bomSettingsSchema } from '#shared/schemas/design'
import { loadDesign } from '~~/server/services/designs'

// Build quantity, spares and hand-added lines of the design's BOM.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:release')
  const { id } = paramsValid(event, idParam)
  const settings = await readValid(event, bomSettingsSchema)
  await loadDesign(id)
  await useDb().update(tables.designs).set({ bomSettings: settings }).where(eq(tables.designs.id, id))
  await audit(event, 'BOM settings changed', { subject: `design ${id}`, details: { buildQuantity: settings.buildQuantity, sparesPercent: settings.sparesPercent, manualLines: settings.manualLines.length } })
  return settings
})
