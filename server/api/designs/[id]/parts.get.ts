import { matchDesign } from '~~/server/services/parts'
import { idParam } from '#shared/schemas/auth'

// Candidate parts for every position of the design, and what is assigned.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { design, positions, summary, policy } = await matchDesign(id)
  return { design: { id: design.id, name: design.name, revision: design.revision }, policy, positions, summary }
})
