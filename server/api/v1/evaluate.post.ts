import { provenanceQuery } from '#shared/schemas/provenance'
import { answerFromPool } from '~~/server/workers/pool'
import { designInputSchema } from '#shared/schemas/stress'

// Several operating points, derating and an optional grid-side converter (back-to-back), nothing saved.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { provenance } = queryValid(event, provenanceQuery)
  const input = await readValid(event, designInputSchema)
  // computed, serialised and (for gzip clients) compressed on a worker thread
  return answerFromPool(event, { kind: 'evaluate', input, provenance })
})
