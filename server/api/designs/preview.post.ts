import type { DesignPreview } from '#shared/types/design'
import { answerFromPool } from '~~/server/workers/pool'
import { designInputSchema } from '#shared/schemas/stress'
import { previewQuery } from '~~/server/services/designs'

// Live results while an engineer edits (nothing saved): what the visible panels need, the chosen points' waveforms.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const view = queryValid(event, previewQuery)
  const input = await readValid(event, designInputSchema)
  // computed, serialised and (for gzip clients) compressed on a worker thread
  return answerFromPool<DesignPreview>(event, { kind: 'preview', input, view: { ...view, compact: true } })
})
