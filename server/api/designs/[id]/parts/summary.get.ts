import { matchDesign } from '~~/server/services/parts'
import { idParam } from '#shared/schemas/auth'
import { sees } from '#shared/roles'

// The design page's figures from the assigned parts (losses, efficiency, cost, T_j per side) without
// searching the catalogue for candidates: the parts page (GET …/parts) does that. Cost only for roles
// that see catalogue data.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { design, summary } = await matchDesign(id, 0, { summaryOnly: true })
  const head = { id: design.id, name: design.name, revision: design.revision }
  if (sees(user.role, 'catalogue')) return { design: head, summary }
  return { design: head, summary: summary.map(s => ({ ...s, costPerDesign: null as number | null })) }
})
