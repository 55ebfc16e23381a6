import { z } from 'zod'
import { matchDesign, type PositionMatch } from '~~/server/services/parts'
import type { Candidate } from '#shared/catalog/matching'
import type { CatalogPart } from '#shared/catalog/types'
import { idParam } from '#shared/schemas/auth'
import { restrictedFields, sees } from '#shared/roles'

const query = z.object({
  show: z.enum(['preferred', 'all'], { message: 'Use show=preferred or show=all' }).default('preferred'),
  /** candidates per position, best first */
  limit: z.coerce.number().int().min(1, 'Ask for at least 1 candidate').max(500, 'Ask for at most 500 candidates per position').default(40),
})

type Assigned = NonNullable<PositionMatch['assigned']>
/** A position as a role sees it: catalogue fields (restrictedFields.catalogue) only with catalogue read. */
type ListedCandidate = Omit<PositionMatch['candidates'][number], 'part'> & { part: ReturnType<typeof partLabel> }
type ShownPosition = Omit<PositionMatch, 'candidates' | 'hiddenCandidates' | 'nothingFits' | 'assigned'>
  & Partial<Pick<PositionMatch, 'hiddenCandidates' | 'nothingFits'>> & { candidates?: ListedCandidate[] }
  & { assigned: null | (Omit<Assigned, 'part' | 'evaluation'> & { part: Pick<CatalogPart, 'partNumber' | 'manufacturer' | 'kind' | 'packageConfiguration'> & Partial<CatalogPart>, evaluation: Partial<Candidate> | null }) }

/** What a candidate row shows of its part; the rest is in the answer's `parts` by partVersionId. */
function partLabel(part: CatalogPart): Pick<CatalogPart, 'partNumber' | 'manufacturer' | 'kind' | 'packageConfiguration' | 'voltageRating'> & Partial<Pick<CatalogPart, 'currentRating' | 'capacitance'>> {
  const label: ReturnType<typeof partLabel> = { partNumber: part.partNumber, manufacturer: part.manufacturer, kind: part.kind, packageConfiguration: part.packageConfiguration, voltageRating: part.voltageRating }
  if (part.currentRating !== undefined) label.currentRating = part.currentRating
  if (part.capacitance !== undefined) label.capacitance = part.capacitance
  return label
}

function strip<T extends object>(o: T, keys: readonly string[]) {
  return Object.fromEntries(Object.entries(o).filter(([k]) => !keys.includes(k)))
}

// Candidate parts for every position of the design, and what is assigned. By default candidates are the
// approved, active parts; show=all lists the rest too. Catalogue data only for roles with catalogue read.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { show, limit } = queryValid(event, query)
  const { design, positions, summary, policy, thermal, linkBalance } = await matchDesign(id, limit, { showAll: show === 'all' })
  const head = { id: design.id, name: design.name, revision: design.revision }
  if (sees(user.role, 'catalogue')) {
    // Candidates refer to their part by partVersionId with a short label; the full catalogue data of
    // each part is sent once in `parts`, however many positions list it.
    const parts: Record<number, CatalogPart> = {}
    const listed = positions.map(p => ({
      ...p,
      candidates: p.candidates.map((c) => {
        parts[c.partVersionId] ??= c.part
        return { ...c, part: partLabel(c.part) }
      }),
    }))
    return { design: head, policy, thermal, positions: listed as ShownPosition[], parts, summary: summary as (typeof summary[number] & { costPerDesign: number | null })[], linkBalance }
  }
  const shown = positions.map(p => ({
    ...strip(p, restrictedFields.catalogue.position),
    assigned: p.assigned && {
      ...strip(p.assigned, ['part', 'evaluation']),
      part: { partNumber: p.assigned.part.partNumber, manufacturer: p.assigned.part.manufacturer, kind: p.assigned.part.kind, packageConfiguration: p.assigned.part.packageConfiguration },
      evaluation: p.assigned.evaluation && strip(p.assigned.evaluation, restrictedFields.catalogue.evaluation),
    },
  })) as ShownPosition[]
  return { design: head, policy, thermal, positions: shown, summary: summary.map(s => ({ ...s, costPerDesign: null as number | null })), linkBalance }
})
