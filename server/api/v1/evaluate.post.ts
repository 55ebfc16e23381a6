import { evaluateDesign } from '#shared/engine'
import { designInputSchema } from '#shared/schemas/stress'

// Several operating points, derating and an optional grid-side converter (back-to-back), nothing saved.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const input = await readValid(event, designInputSchema)
  return withEngine(() => evaluateDesign(input))
})
