import { z } from 'zod'

/**
 * `?provenance=` of the public evaluation routes: `compact` (default) gives each row a short `provenanceId`
 * and the texts once per answer in `provenance: { [id]: { method, source } }`; `full` repeats them per row.
 */
export const provenanceQuery = z.object({ provenance: z.enum(['compact', 'full']).default('compact') })
