import { previewDesign } from '~~/server/services/designs'
import { designInputSchema } from '#shared/schemas/stress'

// Live results while an engineer edits (nothing saved).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const input = await readValid(event, designInputSchema)
  return previewDesign(input)
})
