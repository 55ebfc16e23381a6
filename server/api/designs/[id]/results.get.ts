import { loadDesign, loadRevision, previewQuery, revisionQuery } from '~~/server/services/designs'
import type { DesignPreview } from '#shared/types/design'
import { answerFromPool } from '~~/server/workers/pool'
import { idParam } from '#shared/schemas/auth'
import type { DesignInput } from '#shared/engine/types'

// Results of the saved design (or of ?revision=N), as compact as the live preview's.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { revision } = queryValid(event, revisionQuery)
  const view = queryValid(event, previewQuery)
  const design = await loadDesign(id)
  const input = revision && revision !== design.revision ? (await loadRevision(id, revision)).input : design.input as DesignInput
  // computed, serialised and (for gzip clients) compressed on a worker thread
  return answerFromPool<DesignPreview>(event, { kind: 'preview', input, view: { ...view, compact: true } })
})
