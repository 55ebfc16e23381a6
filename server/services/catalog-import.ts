// Catalogue import: keep the uploaded file, read it, map its headers and values, validate every row,
// show what would change, commit atomically. Nothing reaches the parts tables before the commit.
// Storage of the pending import (file, table cache) sits behind the small functions at the top, so
// moving it elsewhere is a local change.
import { createHash, randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { normaliseHeader, suggestMapping, checkMapping } from '#shared/catalog/mapping'
import { validateRows } from '#shared/catalog/validate'
import { detectDecimalSeparators, normaliseValue, type ColumnSeparator, type ValueMapping } from '#shared/catalog/values'
import { changedFields, mergeIncoming, type FieldChange } from '#shared/catalog/merge'
import { partKey } from '#shared/catalog/part-key'
import type { ColumnKey, ColumnMapping, ImportSettings, RawTable } from '#shared/catalog/types'
import type { DecimalSeparator } from '#shared/catalog/units'
import type { UnknownValue } from '#shared/catalog/validate'
import type { ReadOptions } from '../catalog/read'
import { runInPool } from '../workers/pool'
import { currentVersionsOf } from './catalog'

import { UPLOAD_LIMITS } from '../catalog/limits'

export { UPLOAD_LIMITS }

type ImportRow = typeof tables.catalogImports.$inferSelect

// ------------------------------------------------------------ storage of pending imports

/**
 * Where the table read from an upload (with a chosen header row) is kept: beside the file in the shared
 * upload storage, never in process memory, so preview and commit work on any instance.
 */
const tableKey = (storageKey: string, headerRow: number | undefined) => `${storageKey}.table${headerRow ? `-h${headerRow}` : ''}.json`

/** Keeps the table read from an upload beside its file, so preview and commit need not read the file again. */
export async function rememberTable(storageKey: string, table: RawTable, headerRow?: number) {
  await useStorage('uploads').setItemRaw(tableKey(storageKey, headerRow), Buffer.from(JSON.stringify(table)))
}

/** Reads the spreadsheet on a worker thread (a 20 000-row .xlsx takes seconds of CPU). */
function readInPool(file: Buffer, filename: string, limits: ReadOptions) {
  return runInPool<RawTable>({ kind: 'read-catalog', file, filename, limits })
}

export async function storeUpload(buffer: Buffer, filename: string) {
  const key = `imports:${randomUUID()}-${filename.replace(/[^\w.-]+/g, '_').slice(-80)}`
  await useStorage('uploads').setItemRaw(key, buffer)
  return key
}

/** Removes an uncommitted import's stored file and the tables kept beside it. */
export async function deleteUpload(row: Pick<ImportRow, 'id' | 'storageKey'>) {
  const storage = useStorage('uploads')
  const kept = (await storage.getKeys('imports')).filter(k => k.startsWith(`${row.storageKey}.table`))
  await Promise.all(kept.map(k => storage.removeItem(k)))
  await storage.removeItem(row.storageKey)
}

export async function loadImportTable(row: ImportRow, headerRow: number | undefined = (row.settings as ImportSettings).headerRow): Promise<RawTable> {
  const kept = await useStorage('uploads').getItemRaw(tableKey(row.storageKey, headerRow))
  if (kept) return JSON.parse(Buffer.from(kept as ArrayBuffer).toString('utf8')) as RawTable
  const raw = await useStorage('uploads').getItemRaw(row.storageKey)
  if (!raw) throw createError({ statusCode: 410, message: 'The uploaded file is no longer stored; upload it again.' })
  const table = await readInPool(Buffer.from(raw as ArrayBuffer), row.filename, { ...UPLOAD_LIMITS, ...(headerRow ? { headerRow } : {}) })
  if (table.errors.length) {
    throw createError({ statusCode: 422, message: `headerRow: ${table.errors[0]!.message}`, data: { issues: [{ path: 'headerRow', message: table.errors[0]!.message }] } })
  }
  await rememberTable(row.storageKey, table, headerRow)
  return table
}

// ------------------------------------------------------------ reading choices

export function headerSignature(headers: string[]) {
  return createHash('sha256').update(headers.map(normaliseHeader).join('|')).digest('hex').slice(0, 32)
}

/** Reads an upload; a file that cannot be imported answers 422 with every problem, and nothing is kept. */
export async function readUpload(buffer: Buffer, filename: string) {
  const table = await readInPool(buffer, filename, UPLOAD_LIMITS)
  if (table.errors.length) {
    const first = table.errors[0]!
    const where = first.row ? ` (row ${first.row}${first.column ? `, column ${first.column}` : ''})` : ''
    throw createError({ statusCode: 422, message: `${filename}: ${first.message}${where}`, data: { problems: table.errors, warnings: table.warnings } })
  }
  return table
}

/** Everything the user chooses about reading one upload. */
export interface ImportChoice {
  mapping: ColumnMapping
  decimalSeparator: DecimalSeparator
  headerRow?: number
  columnDecimalSeparators?: Partial<Record<ColumnKey, DecimalSeparator>>
  valueMapping?: ValueMapping
  constants?: Partial<Record<ColumnKey, string>>
}

export async function rememberedChoice(userId: number, headers: string[]): Promise<Pick<ImportChoice, 'mapping' | 'valueMapping' | 'constants'> | null> {
  const [m] = await useDb().select().from(tables.headerMappings)
    .where(and(eq(tables.headerMappings.userId, userId), eq(tables.headerMappings.signature, headerSignature(headers))))
  if (!m) return null
  const settings = m.settings as ImportSettings
  return { mapping: m.mapping as ColumnMapping, valueMapping: settings.valueMapping ?? {}, constants: settings.constants ?? {} }
}

/** Remembers the mapping, value mapping and constants for this uploader and header set. */
export async function rememberChoice(tx: Tx, userId: number, headers: string[], choice: ImportChoice) {
  const settings = { valueMapping: choice.valueMapping ?? {}, constants: choice.constants ?? {} }
  await tx.insert(tables.headerMappings).values({ userId, signature: headerSignature(headers), mapping: choice.mapping, settings })
    .onConflictDoUpdate({ target: [tables.headerMappings.userId, tables.headerMappings.signature], set: { mapping: choice.mapping, settings, updatedAt: new Date() } })
}

/** The first choice for a fresh upload (or a new header row): remembered, else suggested, with value suggestions. */
export async function initialChoice(userId: number, table: RawTable, decimalSeparator: DecimalSeparator, headerRow?: number): Promise<ImportChoice> {
  const remembered = await rememberedChoice(userId, table.headers)
  const choice: ImportChoice = {
    mapping: remembered?.mapping ?? suggestMapping(table.headers).mapping,
    decimalSeparator,
    ...(headerRow ? { headerRow } : {}),
    valueMapping: remembered?.valueMapping ?? {},
    constants: remembered?.constants ?? {},
  }
  choice.valueMapping = withSuggestions(choice.valueMapping!, evaluate(table, choice).result.unknownValues)
  return choice
}

/** Adds each unknown value's suggestion to the value mapping (the user sees and may change them). */
export function withSuggestions(valueMapping: ValueMapping, unknown: readonly UnknownValue[]): ValueMapping {
  const out: ValueMapping = structuredClone(valueMapping)
  for (const u of unknown) {
    if (!u.suggestion) continue
    const forColumn = (out[u.field] ??= {})
    forColumn[normaliseValue(u.value)] ??= u.suggestion
  }
  return out
}

export function settingsOf(choice: ImportChoice): ImportSettings {
  return {
    ...(choice.headerRow ? { headerRow: choice.headerRow } : {}),
    columnDecimalSeparators: choice.columnDecimalSeparators ?? {},
    valueMapping: choice.valueMapping ?? {},
    constants: choice.constants ?? {},
  }
}

export function choiceOf(row: ImportRow): ImportChoice {
  const s = row.settings as ImportSettings
  return { mapping: (row.mapping ?? {}) as ColumnMapping, decimalSeparator: row.decimalSeparator as DecimalSeparator, ...s }
}

// ------------------------------------------------------------ validation and changes

function evaluate(table: RawTable, choice: ImportChoice) {
  const detected = detectDecimalSeparators(table, choice.mapping, choice.decimalSeparator)
  const separators: (ColumnSeparator & { chosen: boolean })[] = detected.map((d) => {
    const chosen = choice.columnDecimalSeparators?.[d.key]
    return { ...d, separator: chosen ?? d.separator, chosen: chosen !== undefined }
  })
  const columnDecimalSeparators = Object.fromEntries(separators.map(s => [s.key, s.separator]))
  const result = validateRows(table, choice.mapping, {
    decimalSeparator: choice.decimalSeparator, columnDecimalSeparators, valueMapping: choice.valueMapping, constants: choice.constants,
  })
  return { result, separators }
}

/** Validation of the mapped rows as the preview shows it. */
export function previewOf(table: RawTable, choice: ImportChoice) {
  const mappingProblems = checkMapping(choice.mapping, table.headers)
  if (mappingProblems.length) {
    throw createError({ statusCode: 422, message: `mapping.${mappingProblems[0]!.field}: ${mappingProblems[0]!.message}`, data: { issues: mappingProblems.map(p => ({ path: `mapping.${p.field}`, message: p.message })) } })
  }
  const { result, separators } = evaluate(table, choice)
  return {
    rowsRead: result.rowsRead,
    rowsWithErrors: result.rowsWithErrors,
    validParts: result.parts.length,
    issues: result.issues,
    issueCount: result.issueCount,
    truncated: result.truncated,
    duplicatesSkipped: result.duplicatesSkipped,
    unknownValues: result.unknownValues,
    currencyFromHeader: result.currencyFromHeader,
    carried: result.carried,
    decimalSeparators: separators,
    sample: result.parts.slice(0, 25).map(({ defaulted: _, ...p }) => p),
    parts: result.parts,
    refused: result.refused,
  }
}

export interface PartChange {
  partId: number
  manufacturer: string
  partNumber: string
  row: number | null
  fields: FieldChange[]
}

/** What a commit would do to the catalogue: new parts, changed ones (field by field, old → new), unchanged. */
export async function changesAgainstCatalogue(parts: ReturnType<typeof previewOf>['parts'], carried: readonly ColumnKey[], listed = 200) {
  const existing = await currentVersionsOf(useDb(), parts)
  let added = 0
  let unchanged = 0
  let changedCount = 0
  const changes: PartChange[] = []
  for (const part of parts) {
    const found = existing.get(partKey(part.manufacturer, part.partNumber))
    if (!found?.data) {
      added++
      continue
    }
    const fields = changedFields(found.data, mergeIncoming(found.data, part, carried))
    if (fields.length === 0) unchanged++
    else {
      changedCount++
      if (changes.length < listed) changes.push({ partId: found.id, manufacturer: found.manufacturer, partNumber: found.partNumber, row: part.sourceRow ?? null, fields })
    }
  }
  return { added, changed: changedCount, unchanged, changes, listedAll: changes.length === changedCount }
}

export async function describeImport(row: ImportRow, table: RawTable, choice: ImportChoice) {
  const { parts, refused: _refused, ...preview } = previewOf(table, choice)
  const { suggestions, unusedHeaders } = suggestMapping(table.headers)
  const changes = await changesAgainstCatalogue(parts, preview.carried)
  return {
    import: { id: row.id, filename: row.filename, sizeBytes: row.sizeBytes, status: row.status, sheetName: table.sheetName, createdAt: row.createdAt, catalogVersionId: row.catalogVersionId, refusedCount: row.refusedCount },
    headers: table.headers,
    headerRowNumber: table.headerRowNumber,
    headerCandidates: table.headerCandidates,
    skipped: table.skipped,
    suggestions,
    unusedHeaders,
    mapping: choice.mapping,
    decimalSeparator: choice.decimalSeparator,
    valueMapping: choice.valueMapping ?? {},
    constants: choice.constants ?? {},
    warnings: table.warnings,
    preview,
    changes,
  }
}
