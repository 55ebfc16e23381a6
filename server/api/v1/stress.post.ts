import { provenanceQuery } from '#shared/schemas/provenance'
import { answerFromPool } from '~~/server/workers/pool'
import { stressInputSchema } from '#shared/schemas/stress'

// One operating point, nothing saved (PRODUCT.md "Public API v1").
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { provenance } = queryValid(event, provenanceQuery)
  const { includeWaveform, ...input } = await readValid(event, stressInputSchema)
  // computed, serialised and (for gzip clients) compressed on a worker thread
  return answerFromPool(event, { kind: 'stress', input, options: { includeWaveform: !!includeWaveform, includeSpectrum: !!includeWaveform }, provenance })
})
