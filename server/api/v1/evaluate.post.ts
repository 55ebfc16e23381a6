import { provenanceQuery } from '#shared/schemas/provenance'
import { runInPool } from '~~/server/workers/pool'
import { designInputSchema } from '#shared/schemas/stress'

// Several operating points, derating and an optional grid-side converter (back-to-back), nothing saved.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'stress:evaluate')
  const { provenance } = queryValid(event, provenanceQuery)
  const input = await readValid(event, designInputSchema)
  return runInPool({ kind: 'evaluate', input, provenance })
})
