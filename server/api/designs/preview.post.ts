import type { DesignPreview } from '#shared/types/design'
import { runInPool } from '~~/server/workers/pool'
import { designInputSchema } from '#shared/schemas/stress'

// Live results while an engineer edits (nothing saved).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const input = await readValid(event, designInputSchema)
  return runInPool<DesignPreview>({ kind: 'preview', input })
})
