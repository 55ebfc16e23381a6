import { matchDesign } from '~~/server/services/parts'
import { idParam } from '#shared/schemas/auth'
import { sees } from '#shared/roles'

// The design page's figures from the assigned parts (losses, efficiency, cost, T_j per side, T_j peak per
// position over the period, the mission life) without
// searching the catalogue for candidates: the parts page (GET …/parts) does that. Cost only for roles
// that see catalogue data.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { design, summary, positions, thermal } = await matchDesign(id, 0, { summaryOnly: true })
  const head = { id: design.id, name: design.name, revision: design.revision }
  // T_j over the period per assigned position (the hottest point) and the mission life.
  const junction = positions.filter(p => p.assigned?.thermal).map(p => ({ side: p.side, position: p.position, meanC: p.assigned!.thermal!.meanC, peakC: p.assigned!.thermal!.peakC, pointName: p.assigned!.thermal!.worstPointName, limitC: p.assigned!.thermal!.limitC, peakOk: p.assigned!.thermal!.peakOk }))
  if (sees(user.role, 'catalogue')) return { design: head, summary, junction, life: thermal.life }
  return { design: head, summary: summary.map(s => ({ ...s, costPerDesign: null as number | null })), junction, life: thermal.life }
})
