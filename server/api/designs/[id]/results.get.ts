import { loadDesign, loadRevision, previewQuery, revisionQuery } from '~~/server/services/designs'
import { answerKey, keepAnswer, storedAnswer } from '~~/server/services/answer-cache'
import type { DesignPreview } from '#shared/types/design'
import { encodedInPool, sendEncoded } from '~~/server/workers/pool'
import { idParam } from '#shared/schemas/auth'
import type { DesignInput } from '#shared/engine/types'

// Results of the saved design (or of ?revision=N), as compact as the live preview's. Computed once per input and
// view: the answer is kept in PostgreSQL (computed_answers) and sent again while the input is unchanged.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { revision } = queryValid(event, revisionQuery)
  const view = { ...queryValid(event, previewQuery), compact: true }
  const design = await loadDesign(id)
  const input = revision && revision !== design.revision ? (await loadRevision(id, revision)).input : design.input as DesignInput
  // every sample (asked for now and then, large) is computed each time
  if (view.resolution === 'full') return sendEncoded<DesignPreview>(event, await encodedInPool(event, { kind: 'preview', input, view }))
  const key = answerKey('design-results', { input, view })
  const stored = await storedAnswer(key)
  if (stored) return sendEncoded<DesignPreview>(event, stored, 'hit')
  // computed, serialised and compressed on a worker thread; kept gzipped (a browser takes it so, others unpacked)
  const answer = await encodedInPool(event, { kind: 'preview', input, view }, true)
  await keepAnswer(key, 'design-results', id, answer)
  return sendEncoded<DesignPreview>(event, answer, 'miss')
})
