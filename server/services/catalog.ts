// Catalogue versions: a commit writes every part of an import in one transaction as a new
// catalogue version; a part that changed gets a new part version, earlier versions stay readable.
import { eq, inArray, isNotNull, sql } from 'drizzle-orm'
import type { CatalogPart, ColumnKey } from '#shared/catalog/types'
import { canonical, mergeIncoming, storedPart, type ImportedPart } from '#shared/catalog/merge'
import { openSharedIndex, type PartIndex, type SharedPartIndex } from '#shared/catalog/matching'
import { partKey } from '#shared/catalog/part-key'
import { perGeneration, type CurrentPart } from '../catalog/current-index'
import { runInPool } from '../workers/pool'

const BATCH = 2000

export interface ExistingPart { id: number, manufacturer: string, partNumber: string, approved: boolean, data: CatalogPart | null }

/**
 * The current version of the parts with these makers and part numbers, by partKey() (the parts_key index, not a
 * scan); the map is keyed by partKey(). A part the re-keying found to repeat an older one is never returned.
 */
export async function currentVersionsOf(db: Db | Tx, keys: readonly Pick<CatalogPart, 'manufacturer' | 'partNumber'>[]): Promise<Map<string, ExistingPart>> {
  if (keys.length === 0) return new Map()
  const wanted = JSON.stringify([...new Set(keys.map(k => partKey(k.manufacturer, k.partNumber)))])
  const rows = await db.execute<{ id: number, key: string, manufacturer: string, part_number: string, approved: boolean, data: CatalogPart | null }>(sql`
    select p.id, p.key, p.manufacturer, p.part_number, p.approved, v.data
    from jsonb_array_elements_text(${wanted}::jsonb) as x(k)
    join parts p on p.key = x.k and p.key_conflict_with is null
    left join part_versions v on v.id = p.current_version_id`)
  return new Map(rows.map(r => [r.key, { id: r.id, manufacturer: r.manufacturer, partNumber: r.part_number, approved: r.approved, data: r.data }]))
}

/** Columns of part_versions that the parts browser filters and sorts on. */
function versionColumns(part: CatalogPart) {
  const first = part.priceBreaks[0]
  return {
    partNumber: part.partNumber,
    manufacturer: part.manufacturer,
    kind: part.kind,
    packageConfig: part.packageConfiguration,
    voltageRating: part.voltageRating,
    currentRating: part.currentRating ?? null,
    unitPrice: first?.unitPrice ?? null,
    currency: part.currency ?? null,
    stock: part.stock ?? null,
    leadTimeDays: part.leadTimeDays ?? null,
    lifecycle: part.lifecycle,
  }
}

/** catalogVersionId / number are null when nothing changed (no new catalogue version is made). */
export interface CommitSummary { catalogVersionId: number | null, number: number | null, added: number, updated: number, unchanged: number }

/**
 * Serialises catalogue changes across requests and instances: a transaction-level advisory lock,
 * held until commit. Catalogue version numbers (max + 1) and part edits (read, change, write a new
 * version) are then never computed from a state another commit is changing. Take it before any row
 * lock on parts (always the same order: no deadlock). Re-entrant within one transaction.
 */
export async function lockCatalog(tx: Tx) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('stratavolt:catalog'))`)
}

/**
 * Writes the parts as a new catalogue version (inside the caller's transaction). With `carried` (the
 * columns an import file has), an existing part keeps every other field as it is: stock, lead time and
 * lifecycle set in the app survive a file without those columns. Nothing changed → no new version.
 */
export async function commitParts(tx: Tx, incoming: ImportedPart[], meta: { userId: number | null, importId?: number, note: string, approve: boolean, carried?: readonly ColumnKey[], onProgress?: (done: number, total: number) => Promise<void> }): Promise<CommitSummary> {
  await lockCatalog(tx)
  const byKey = await currentVersionsOf(tx, incoming)

  let added = 0
  let unchanged = 0
  const fresh: CatalogPart[] = []
  const changed: { partId: number, part: CatalogPart }[] = []
  for (const raw of incoming) {
    const found = byKey.get(partKey(raw.manufacturer, raw.partNumber))
    const part = found?.data && meta.carried ? mergeIncoming(found.data as CatalogPart, raw, meta.carried) : storedPart(raw)
    if (!found) fresh.push(part)
    else if (canonical(found.data) !== canonical(part)) changed.push({ partId: found.id, part })
    else unchanged++
  }
  if (fresh.length === 0 && changed.length === 0) return { catalogVersionId: null, number: null, added: 0, updated: 0, unchanged }
  // work units for progress: one per new part inserted, one per part version written (new and changed parts)
  const units = fresh.length * 2 + changed.length
  const [{ next }] = await tx.select({ next: sql<number>`coalesce(max(${tables.catalogVersions.number}), 0) + 1` }).from(tables.catalogVersions) as [{ next: number }]
  const [version] = await tx.insert(tables.catalogVersions).values({ number: next, importId: meta.importId ?? null, note: meta.note, createdBy: meta.userId }).returning()
  // Each batch travels as one JSON parameter expanded by PostgreSQL: far fewer bind parameters than a
  // multi-row VALUES list, which is what makes a 20 000-part import fast.
  for (let i = 0; i < fresh.length; i += BATCH) {
    const slice = fresh.slice(i, i + BATCH)
    const rows = slice.map(p => ({ manufacturer: p.manufacturer, part_number: p.partNumber, key: partKey(p.manufacturer, p.partNumber) }))
    const inserted = await tx.execute<{ id: number, key: string }>(sql`
      insert into parts (manufacturer, part_number, key, approved)
      select x.manufacturer, x.part_number, x.key, ${meta.approve} from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(manufacturer text, part_number text, key text)
      returning id, key`)
    const ids = new Map(inserted.map(r => [r.key, r.id]))
    for (const [j, p] of slice.entries()) changed.push({ partId: ids.get(rows[j]!.key)!, part: p })
    added += slice.length
    await meta.onProgress?.(added, units)
  }
  const updated = changed.length - added
  for (let i = 0; i < changed.length; i += BATCH) {
    const slice = changed.slice(i, i + BATCH)
    const rows = slice.map((c) => {
      const v = versionColumns(c.part)
      return {
        part_id: c.partId, part_number: v.partNumber, manufacturer: v.manufacturer, kind: v.kind, package_config: v.packageConfig,
        voltage_rating: v.voltageRating, current_rating: v.currentRating, unit_price: v.unitPrice, currency: v.currency,
        stock: v.stock, lead_time_days: v.leadTimeDays, lifecycle: v.lifecycle, data: c.part,
      }
    })
    // The version that was current stops being so; the new one is (the parts browser reads only these).
    await tx.execute(sql`update part_versions set is_current = false where is_current and part_id = any(${`{${slice.map(c => c.partId).join(',')}}`}::int[])`)
    await tx.execute(sql`
      with inserted as (
        insert into part_versions (part_id, catalog_version_id, part_number, manufacturer, kind, package_config, voltage_rating, current_rating, unit_price, currency, stock, lead_time_days, lifecycle, data, is_current)
        select x.part_id, ${version!.id}, x.part_number, x.manufacturer, x.kind, x.package_config, x.voltage_rating, x.current_rating, x.unit_price, x.currency, x.stock, x.lead_time_days, x.lifecycle, x.data, true
        from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(part_id int, part_number text, manufacturer text, kind text, package_config text, voltage_rating float8, current_rating float8, unit_price numeric, currency text, stock int, lead_time_days int, lifecycle text, data jsonb)
        returning id, part_id
      )
      update parts set current_version_id = inserted.id from inserted where parts.id = inserted.part_id`)
    await meta.onProgress?.(fresh.length + i + slice.length, units)
  }
  const [{ total }] = await tx.select({ total: sql<number>`count(*)::int` }).from(tables.parts).where(isNotNull(tables.parts.currentVersionId)) as [{ total: number }]
  await tx.update(tables.catalogVersions).set({ partsAdded: added, partsUpdated: updated, partsTotal: total }).where(eq(tables.catalogVersions.id, version!.id))
  return { catalogVersionId: version!.id, number: next, added, updated, unchanged }
}

export type { CurrentPart }

/**
 * The catalogue as matching reads it, for one generation: the column index in shared memory (`shared`, sent as
 * is to the worker threads, which all read the same copy), the same opened on this thread (`index`), and each
 * current part version's place in it.
 */
export interface CurrentCatalogue { generation: number, shared: SharedPartIndex, index: PartIndex, places: Map<number, number> }

/** The catalogue generation: one primary-key read, changes with every committed part or part-version write. */
export async function catalogGeneration(): Promise<number> {
  const [row] = await useDb().select({ generation: tables.catalogState.generation }).from(tables.catalogState).where(eq(tables.catalogState.id, 1))
  return row?.generation ?? 0
}

/**
 * Reads every current part version as one JSON text (PostgreSQL writes it; this thread only receives the bytes)
 * and builds the index on a worker thread. Read the generation before the parts: a commit in between leaves
 * newer parts under an older tag, which only costs one more read — never a stale answer.
 */
async function buildCatalogue(generation: number): Promise<CurrentCatalogue> {
  countBuild(generation)
  // ordered by part version id: equal voltage ratings keep this order in the index, so every instance
  // builds the same index from the same generation (json_agg alone follows whatever plan PostgreSQL chose)
  const [row] = await useDb().execute<{ rows: string }>(sql`
    select coalesce(json_agg(json_build_array(v.id, v.part_id, p.approved, v.data) order by v.id), '[]')::text as rows
    from part_versions v join parts p on p.id = v.part_id
    where v.is_current`)
  const { index: shared, digest } = await runInPool<{ index: SharedPartIndex, digest: string }>({ kind: 'build-index', rows: row?.rows ?? '[]' })
  const places = new Map<number, number>()
  for (let i = 0; i < shared.size; i++) places.set(shared.ids[i]!, i)
  if (!held || held.generation <= generation) held = { generation, digest }
  return { generation, shared, index: openSharedIndex(shared), places }
}

/** builds started on this instance per generation (the latest few): health shows the held one's, which must be 1 */
const buildsOf = new Map<number, number>()
let held: { generation: number, digest: string } | null = null

function countBuild(generation: number) {
  buildsOf.set(generation, (buildsOf.get(generation) ?? 0) + 1)
  if (buildsOf.size > 16) buildsOf.delete(Math.min(...buildsOf.keys()))
}

/** The matching index this instance holds (null before the first match): generation, digest, builds of it. */
export function heldCatalogue(): { generation: number, digest: string, builds: number } | null {
  return held && { ...held, builds: buildsOf.get(held.generation) ?? 0 }
}

// Tagged with the catalogue generation it was read at. The generation lives in PostgreSQL (catalog_state, moved
// on by triggers on every parts / part_versions write, approvals included), so this copy is never trusted
// without asking for it. Requests that find the same new generation wait for one build.
const catalogueOf = perGeneration(buildCatalogue)

/**
 * The current version of every part as the matching index, kept between requests until the generation moves on
 * (any instance's commit or edit).
 */
export async function currentCatalogue(): Promise<CurrentCatalogue> {
  return catalogueOf(await catalogGeneration())
}

/** The matching index of a generation just read with catalogGeneration() (kept, or built once as in currentCatalogue). */
export function catalogueAt(generation: number): Promise<CurrentCatalogue> {
  return catalogueOf(generation)
}

/** Same as currentCatalogue (the name the worker-pool callers use). */
export const currentCatalog = currentCatalogue

export async function partVersionsById(ids: number[]) {
  if (!ids.length) return new Map<number, CatalogPart & { partVersionId: number }>()
  const rows = await useDb().select({ id: tables.partVersions.id, data: tables.partVersions.data }).from(tables.partVersions).where(inArray(tables.partVersions.id, ids))
  return new Map(rows.map(r => [r.id, { ...(r.data as CatalogPart), partVersionId: r.id }]))
}
