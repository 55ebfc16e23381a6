import { z } from 'zod'
import { matchDesign } from '~~/server/services/parts'
import { idParam } from '#shared/schemas/auth'
import { restrictedFields, sees } from '#shared/roles'

const query = z.object({ show: z.enum(['preferred', 'all'], { message: 'Use show=preferred or show=all' }).default('preferred') })

// Candidate parts for every position of the design, and what is assigned. By default candidates are the
// approved, active parts; show=all lists the rest too. Catalogue data only for roles with catalogue read.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { show } = queryValid(event, query)
  const { design, positions, summary, policy } = await matchDesign(id, 40, { showAll: show === 'all' })
  const head = { id: design.id, name: design.name, revision: design.revision }
  if (sees(user.role, 'catalogue')) return { design: head, policy, positions, summary }
  const strip = <T extends object>(o: T, keys: readonly string[]) => Object.fromEntries(Object.entries(o).filter(([k]) => !keys.includes(k)))
  return {
    design: head,
    policy,
    positions: positions.map(p => ({
      ...strip(p, restrictedFields.catalogue.position),
      assigned: p.assigned && {
        ...strip(p.assigned, ['part', 'evaluation']),
        part: { partNumber: p.assigned.part.partNumber, manufacturer: p.assigned.part.manufacturer, kind: p.assigned.part.kind, packageConfiguration: p.assigned.part.packageConfiguration },
        evaluation: p.assigned.evaluation && strip(p.assigned.evaluation, restrictedFields.catalogue.evaluation),
      },
    })),
    summary: summary.map(s => ({ ...s, costPerDesign: null })),
  }
})
