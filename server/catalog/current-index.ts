// The matching index built from the rows PostgreSQL sends as one JSON text (part version id, part id, approval,
// the version's data), on a worker thread: parsing 100 000 parts and filling the columns takes seconds, and the
// event loop must keep answering meanwhile. Pure: no database here.
import { createHash } from 'node:crypto'
import { sharePartIndex, type SharedPartIndex } from '#shared/catalog/matching'
import type { CatalogPart } from '#shared/catalog/types'

export type CurrentPart = CatalogPart & { partVersionId: number, partId: number, approved: boolean }

/** One row of the query in currentCatalogue: [part version id, part id, approved, data]. */
export type CurrentRow = [number, number, boolean, CatalogPart]

/** The current parts as the catalogue service hands them to matching (the data, then the three ids). */
export function currentParts(rows: readonly CurrentRow[]): CurrentPart[] {
  return rows.map(([id, partId, approved, data]) => ({ ...data, partVersionId: id, partId, approved }))
}

/** The shared index of the rows' parts, each named by its part version id (`rowsText`: a JSON array of CurrentRow). */
export function buildCurrentIndex(rowsText: string): SharedPartIndex {
  const parts = currentParts(JSON.parse(rowsText) as CurrentRow[])
  return sharePartIndex(parts, p => (p as CurrentPart).partVersionId)
}

/**
 * A fingerprint of an index (its parts in index order and their texts): two instances that read the same
 * generation build byte-identical indices, so they report the same digest.
 */
export function indexDigest(index: SharedPartIndex): string {
  // hash.update takes copies: views of shared memory are refused
  return createHash('sha256').update(new Uint8Array(index.ids.buffer.slice(0))).update(index.text.slice()).digest('hex').slice(0, 16)
}

/**
 * One value per catalogue generation, built once however many requests ask at the same time: callers of the
 * generation being built await that build. A build of a newer generation replaces the kept one when it ends;
 * an older build finishing late never does. A failed build is forgotten (the next caller tries again).
 */
export function perGeneration<T>(build: (generation: number) => Promise<T>) {
  let kept: { generation: number, value: T } | null = null
  const building = new Map<number, Promise<T>>()
  return async (generation: number): Promise<T> => {
    if (kept && kept.generation === generation) return kept.value
    let pending = building.get(generation)
    if (!pending) {
      pending = build(generation).then((value) => {
        if (!kept || kept.generation <= generation) kept = { generation, value }
        return value
      }).finally(() => building.delete(generation))
      building.set(generation, pending)
    }
    return pending
  }
}
