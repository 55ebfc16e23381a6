// Catalogue import: keep the uploaded file, read it, map its headers, validate every row, commit
// atomically. Nothing reaches the parts tables before the commit.
import { createHash, randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { normaliseHeader, suggestMapping, checkMapping } from '#shared/catalog/mapping'
import { validateRows } from '#shared/catalog/validate'
import type { ColumnMapping, RawTable } from '#shared/catalog/types'
import type { DecimalSeparator } from '#shared/catalog/units'
import { runInPool } from '../workers/pool'

export const UPLOAD_LIMITS = { maxBytes: 10 * 1024 * 1024, maxRows: 20_000 }

/** Where the table read from an upload is kept beside the file (shared upload storage, never process memory). */
const tableKey = (storageKey: string) => `${storageKey}.table.json`

/**
 * Keeps the table read from an upload beside the file in the shared upload storage, so that preview and
 * commit on any instance need not read the spreadsheet again (and no instance holds a pending import alone).
 */
export async function rememberTable(storageKey: string, table: RawTable) {
  await useStorage('uploads').setItemRaw(tableKey(storageKey), Buffer.from(JSON.stringify(table)))
}

/** Reads the spreadsheet on a worker thread (a 20 000-row .xlsx takes seconds of CPU). */
function readInPool(file: Buffer, filename: string) {
  return runInPool<RawTable>({ kind: 'read-catalog', file, filename, limits: UPLOAD_LIMITS })
}

export function headerSignature(headers: string[]) {
  return createHash('sha256').update(headers.map(normaliseHeader).join('|')).digest('hex').slice(0, 32)
}

/** Reads an upload; a file that cannot be imported answers 422 with every problem, and nothing is kept. */
export async function readUpload(buffer: Buffer, filename: string) {
  const table = await readInPool(buffer, filename)
  if (table.errors.length) {
    const first = table.errors[0]!
    const where = first.row ? ` (row ${first.row}${first.column ? `, column ${first.column}` : ''})` : ''
    throw createError({ statusCode: 422, message: `${filename}: ${first.message}${where}`, data: { problems: table.errors, warnings: table.warnings } })
  }
  return table
}

export async function storeUpload(buffer: Buffer, filename: string) {
  const key = `imports:${randomUUID()}-${filename.replace(/[^\w.-]+/g, '_').slice(-80)}`
  await useStorage('uploads').setItemRaw(key, buffer)
  return key
}

export async function loadImportTable(row: typeof tables.catalogImports.$inferSelect): Promise<RawTable> {
  const kept = await useStorage('uploads').getItemRaw(tableKey(row.storageKey))
  if (kept) return JSON.parse(Buffer.from(kept as ArrayBuffer).toString('utf8')) as RawTable
  const raw = await useStorage('uploads').getItemRaw(row.storageKey)
  if (!raw) throw createError({ statusCode: 410, message: 'The uploaded file is no longer stored; upload it again.' })
  const table = await readInPool(Buffer.from(raw as ArrayBuffer), row.filename)
  await rememberTable(row.storageKey, table)
  return table
}

export async function rememberedMapping(userId: number, headers: string[]): Promise<ColumnMapping | null> {
  const [m] = await useDb().select().from(tables.headerMappings)
    .where(and(eq(tables.headerMappings.userId, userId), eq(tables.headerMappings.signature, headerSignature(headers))))
  return (m?.mapping as ColumnMapping) ?? null
}

/** Validation of the mapped rows as the preview shows it. */
export function previewOf(table: RawTable, mapping: ColumnMapping, decimalSeparator: DecimalSeparator) {
  const mappingProblems = checkMapping(mapping, table.headers)
  if (mappingProblems.length) {
    throw createError({ statusCode: 422, message: `mapping.${mappingProblems[0]!.field}: ${mappingProblems[0]!.message}`, data: { issues: mappingProblems.map(p => ({ path: `mapping.${p.field}`, message: p.message })) } })
  }
  const result = validateRows(table, mapping, { decimalSeparator })
  return {
    rowsRead: result.rowsRead,
    rowsWithErrors: result.rowsWithErrors,
    validParts: result.parts.length,
    issues: result.issues,
    truncated: result.truncated,
    sample: result.parts.slice(0, 25),
    parts: result.parts,
  }
}

export function describeImport(row: typeof tables.catalogImports.$inferSelect, table: RawTable, mapping: ColumnMapping, decimalSeparator: DecimalSeparator) {
  const { parts: _, ...preview } = previewOf(table, mapping, decimalSeparator)
  const { suggestions, unusedHeaders } = suggestMapping(table.headers)
  return {
    import: { id: row.id, filename: row.filename, sizeBytes: row.sizeBytes, status: row.status, sheetName: table.sheetName, createdAt: row.createdAt, catalogVersionId: row.catalogVersionId },
    headers: table.headers,
    headerRowNumber: table.headerRowNumber,
    suggestions,
    unusedHeaders,
    mapping,
    decimalSeparator,
    warnings: table.warnings,
    preview,
  }
}
