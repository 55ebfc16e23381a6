import { evaluateStress } from '#shared/engine'
import { stressInputSchema } from '#shared/schemas/stress'

// One operating point, nothing saved (PRODUCT.md "Public API v1").
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { includeWaveform, ...input } = await readValid(event, stressInputSchema)
  return withEngine(() => evaluateStress(input, { includeWaveform: !!includeWaveform, includeSpectrum: !!includeWaveform }))
})
