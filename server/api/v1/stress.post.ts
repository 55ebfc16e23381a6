import { provenanceQuery } from '#shared/schemas/provenance'
import { answerFromPool } from '~~/server/workers/pool'

// One operating point, nothing saved (PRODUCT.md "Public API v1").
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { provenance } = queryValid(event, provenanceQuery)
  // the body (stressInputSchema) is validated, computed, serialised and (for gzip clients) compressed on a worker
  // thread: the event loop only reads it and sends the answer's bytes
  const body = await readRawBody(event, 'utf8').catch(() => undefined)
  return answerFromPool(event, { kind: 'stress-body', body, provenance })
})
