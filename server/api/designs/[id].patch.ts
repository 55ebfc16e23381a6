import { loadDesign } from '~~/server/services/designs'
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { designPatchSchema } from '#shared/schemas/design'

// Archive or restore a design.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:write')
  const { id } = paramsValid(event, idParam)
  const { status } = await readValid(event, designPatchSchema)
  const design = await loadDesign(id)
  await useDb().update(tables.designs).set({ status, updatedAt: new Date() }).where(eq(tables.designs.id, id))
  await audit(event, status === 'archived' ? 'design archived' : 'design restored', { subject: `${id} ${design.name}` })
  return { id, status }
})
