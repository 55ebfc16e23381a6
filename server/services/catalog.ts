// Catalogue versions: a commit writes every part of an import in one transaction as a new
// catalogue version; a part that changed gets a new part version, earlier versions stay readable.
import { eq, inArray, isNotNull, sql } from 'drizzle-orm'
import type { CatalogPart } from '#shared/catalog/types'

const BATCH = 500
/** JSON with sorted keys: jsonb does not keep key order, so a plain stringify would see every part as changed. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`
  if (value && typeof value === 'object') {
    return `{${Object.keys(value).filter(k => (value as Record<string, unknown>)[k] !== undefined).sort().map(k => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`
  }
  return JSON.stringify(value)
}

const key = (manufacturer: string, partNumber: string) => `${manufacturer.trim().toLowerCase()}\u0000${partNumber.trim().toLowerCase()}`

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

function stripImportFields(part: CatalogPart): CatalogPart {
  const { sourceRow: _, ...rest } = part
  return rest
}

export interface CommitSummary { catalogVersionId: number, number: number, added: number, updated: number, unchanged: number }

/** Writes the parts as a new catalogue version (inside the caller's transaction). */
export async function commitParts(tx: Tx, incoming: CatalogPart[], meta: { userId: number | null, importId?: number, note: string, approve: boolean }): Promise<CommitSummary> {
  const [{ next }] = await tx.select({ next: sql<number>`coalesce(max(${tables.catalogVersions.number}), 0) + 1` }).from(tables.catalogVersions) as [{ next: number }]
  const [version] = await tx.insert(tables.catalogVersions).values({ number: next, importId: meta.importId ?? null, note: meta.note, createdBy: meta.userId }).returning()
  const existing = await tx.select({ id: tables.parts.id, manufacturer: tables.parts.manufacturer, partNumber: tables.parts.partNumber, currentVersionId: tables.parts.currentVersionId, data: tables.partVersions.data })
    .from(tables.parts).leftJoin(tables.partVersions, eq(tables.partVersions.id, tables.parts.currentVersionId))
  const byKey = new Map(existing.map(p => [key(p.manufacturer, p.partNumber), p]))

  let added = 0
  let unchanged = 0
  const fresh: CatalogPart[] = []
  const changed: { partId: number, part: CatalogPart }[] = []
  for (const raw of incoming) {
    const part = stripImportFields(raw)
    const found = byKey.get(key(part.manufacturer, part.partNumber))
    if (!found) fresh.push(part)
    else if (canonical(found.data) !== canonical(part)) changed.push({ partId: found.id, part })
    else unchanged++
  }
  for (let i = 0; i < fresh.length; i += BATCH) {
    const slice = fresh.slice(i, i + BATCH)
    const rows = await tx.insert(tables.parts).values(slice.map(p => ({ manufacturer: p.manufacturer, partNumber: p.partNumber, approved: meta.approve }))).returning({ id: tables.parts.id })
    slice.forEach((p, j) => changed.push({ partId: rows[j]!.id, part: p }))
    added += slice.length
  }
  const updated = changed.length - added
  for (let i = 0; i < changed.length; i += BATCH) {
    const slice = changed.slice(i, i + BATCH)
    const versions = await tx.insert(tables.partVersions)
      .values(slice.map(c => ({ partId: c.partId, catalogVersionId: version!.id, data: c.part, ...versionColumns(c.part) })))
      .returning({ id: tables.partVersions.id, partId: tables.partVersions.partId })
    // ids come from the database as integers, so they can be written into the statement
    const pairs = versions.map(v => `(${Number(v.id)},${Number(v.partId)})`).join(',')
    await tx.execute(sql.raw(`update parts set current_version_id = v.id from (values ${pairs}) as v(id, part_id) where parts.id = v.part_id`))
  }
  await tx.update(tables.catalogVersions).set({ partsAdded: added, partsUpdated: updated }).where(eq(tables.catalogVersions.id, version!.id))
  bumpCatalogGeneration()
  return { catalogVersionId: version!.id, number: next, added, updated, unchanged }
}

let generation = 0
let cache: { generation: number, parts: (CatalogPart & { partVersionId: number, approved: boolean })[] } | null = null

export function bumpCatalogGeneration() {
  generation++
}

/** The current version of every part (cached until the catalogue changes). */
export async function currentParts() {
  if (cache && cache.generation === generation) return cache.parts
  const g = generation
  const rows = await useDb().select({ id: tables.partVersions.id, data: tables.partVersions.data, approved: tables.parts.approved })
    .from(tables.parts).innerJoin(tables.partVersions, eq(tables.partVersions.id, tables.parts.currentVersionId))
    .where(isNotNull(tables.parts.currentVersionId))
  const parts = rows.map(r => ({ ...(r.data as CatalogPart), partVersionId: r.id, approved: r.approved }))
  cache = { generation: g, parts }
  return parts
}

export async function partVersionsById(ids: number[]) {
  if (!ids.length) return new Map<number, CatalogPart & { partVersionId: number }>()
  const rows = await useDb().select({ id: tables.partVersions.id, data: tables.partVersions.data }).from(tables.partVersions).where(inArray(tables.partVersions.id, ids))
  return new Map(rows.map(r => [r.id, { ...(r.data as CatalogPart), partVersionId: r.id }]))
}
