import { z } from 'zod'
import { designMatchTask, matchTaskKey } from '~~/server/services/parts'
import type { partsAnswer } from '~~/server/services/parts-answer'
import { answerFromPool } from '~~/server/workers/pool'
import { idParam } from '#shared/schemas/auth'
import { sees } from '#shared/roles'

const query = z.object({
  show: z.enum(['preferred', 'all'], { message: 'Use show=preferred or show=all' }).default('preferred'),
  /** candidates per position, best first */
  limit: z.coerce.number().int().min(1, 'Ask for at least 1 candidate').max(500, 'Ask for at most 500 candidates per position').default(40),
})

// Candidate parts for every position of the design, and what is assigned. By default candidates are the
// approved, active parts; show=all lists the rest too. Catalogue data only for roles with catalogue read.
// Matching, the answer for this role (server/services/parts-answer.ts), its JSON and gzip run on a worker thread.
// The encoded answer is kept by a digest of all it depends on (matchTaskKey): the same design, assignments and
// catalogue generation are answered again without matching.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { show, limit } = queryValid(event, query)
  const { design, task } = await designMatchTask(id, limit, { showAll: show === 'all' })
  const head = { id: design.id, name: design.name, revision: design.revision }
  const seesCatalogue = sees(user.role, 'catalogue')
  return answerFromPool<ReturnType<typeof partsAnswer>>(event, { kind: 'parts-answer', ...task, design: head, seesCatalogue }, { key: matchTaskKey(task, head, seesCatalogue) })
})
