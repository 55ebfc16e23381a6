import { provenanceQuery } from '#shared/schemas/provenance'
import { answerFromPool } from '~~/server/workers/pool'

// Several operating points, derating and an optional grid-side converter (back-to-back), nothing saved.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { provenance } = queryValid(event, provenanceQuery)
  // the body (designInputSchema) is validated, computed, serialised and (for gzip clients) compressed on a worker thread
  const body = await readRawBody(event, 'utf8').catch(() => undefined)
  return answerFromPool(event, { kind: 'evaluate-body', body, provenance })
})
