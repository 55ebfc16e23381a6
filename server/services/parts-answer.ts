// The parts page's answer as a role sees it, built from a design's matching (pure: it runs on the worker
// thread that matched, so the answer is serialised and compressed there and the event loop only sends bytes).
import type { Candidate } from '#shared/catalog/matching'
import type { CatalogPart } from '#shared/catalog/types'
import { restrictedFields } from '#shared/roles'
import type { matchDesignPositions, PositionMatch } from './parts'

type Matched = ReturnType<typeof matchDesignPositions>
type Assigned = NonNullable<PositionMatch['assigned']>
/** A position as a role sees it: catalogue fields (restrictedFields.catalogue) only with catalogue read. */
type ListedCandidate = Omit<PositionMatch['candidates'][number], 'part'> & { part: ReturnType<typeof partLabel> }
export type ShownPosition = Omit<PositionMatch, 'candidates' | 'hiddenCandidates' | 'nothingFits' | 'assigned'>
  & Partial<Pick<PositionMatch, 'hiddenCandidates' | 'nothingFits'>> & { candidates?: ListedCandidate[] }
  & { assigned: null | (Omit<Assigned, 'part' | 'evaluation'> & { part: Pick<CatalogPart, 'partNumber' | 'manufacturer' | 'kind' | 'packageConfiguration'> & Partial<CatalogPart>, evaluation: Partial<Candidate> | null }) }

/** the design as the answer names it */
export interface DesignHead { id: number, name: string, revision: number }

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

/**
 * Candidate parts for every position and what is assigned; catalogue data only when `seesCatalogue`. Candidates
 * refer to their part by partVersionId with a short label; each part's full data is sent once in `parts`.
 */
export function partsAnswer(design: DesignHead, matched: Matched, seesCatalogue: boolean) {
  const { positions, summary, policy, thermal, linkBalance } = matched
  const head = { id: design.id, name: design.name, revision: design.revision }
  if (seesCatalogue) {
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
}
