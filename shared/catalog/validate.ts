// Turns mapped spreadsheet rows into typed catalogue parts, explaining every cell it refuses
// (row as the user sees it, column letter, field). A row with any error yields no part.

import {
  CATALOG_COLUMNS, COLUMN_BY_KEY, PACKAGE_CONFIGURATIONS, PART_KINDS, TEMPLATE_EXAMPLE_PART_NUMBERS,
  type CatalogColumn, type PackageConfiguration, type PartKind,
} from '../../catalog/columns'
import { fosterProblems } from '../thermal/network'
import { checkMapping, columnLetter } from './mapping'
import { partKey } from './part-key'
import { parsePriceBreaks } from './prices'
import type { CatalogPart, CellValue, ColumnKey, ColumnMapping, Currency, PriceBreak, RawTable, ValidationIssue } from './types'
import { parseQuantity, unitScaleFromHeader, type DecimalSeparator } from './units'
import type { ImportedPart } from './merge'
import { cellDecimalMark, currencyInHeader, normaliseValue, suggestValue, type ValueMapping } from './values'

export interface ValidateOptions {
  /** Decimal mark of columns that have none of their own in `columnDecimalSeparators`. */
  decimalSeparator: DecimalSeparator
  /** Decimal mark per column (detected from its cells, or chosen by the user). */
  columnDecimalSeparators?: Partial<Record<ColumnKey, DecimalSeparator>>
  /** Uploaded enum values → ours, per column; keys normalised with normaliseValue. */
  valueMapping?: ValueMapping
  /** Values standing in for columns the file lacks (e.g. currency 'EUR', a manufacturer). */
  constants?: Partial<Record<ColumnKey, string>>
  /** Stop listing issues after this many (the count of bad rows stays exact). Default 2000. */
  maxIssues?: number
}

export interface ValidationResult {
  /** Valid rows as parts; `defaulted` names fields filled by a default because the cell was blank. */
  parts: ImportedPart[]
  issues: ValidationIssue[]
  /** Data rows looked at. */
  rowsRead: number
  /** Rows refused because of at least one error. */
  rowsWithErrors: number
  /** True when more issues existed than maxIssues. */
  truncated: boolean
  /** Every issue found, listed or not. */
  issueCount: number
  /** Refused rows with every reason, for the refused-rows sheet (not capped). */
  refused: { rowNumber: number, reasons: string[] }[]
  /** Rows that repeat an earlier row exactly: skipped, not refused. */
  duplicatesSkipped: { rowNumber: number, sameAs: number }[]
  /** Enum values that are not ours and not mapped, with a suggestion. */
  unknownValues: UnknownValue[]
  /** Catalogue columns the file carries (mapped, or given a constant): only these change existing parts. */
  carried: ColumnKey[]
  /** Currency read from the price header ("Price €"), when no currency column or constant is given. */
  currencyFromHeader: Currency | null
}

export interface UnknownValue {
  field: ColumnKey
  /** As written in the file. */
  value: string
  /** Rows that hold it. */
  rowCount: number
  firstRow: number
  suggestion: string | null
}

const TEXT_MAX_LENGTH: Partial<Record<ColumnKey, number>> = { description: 2000, datasheetUrl: 2000 }
const DEFAULT_TEXT_MAX_LENGTH = 200

function isBlank(value: CellValue | undefined): boolean {
  return value === null || value === undefined || (typeof value === 'string' && value.trim() === '')
}

function formatNumber(value: number): string {
  return Number(value.toPrecision(6)).toString()
}

function kindsText(kinds: readonly PartKind[]): string {
  return kinds.map(k => `'${k}'`).join(', ')
}

/** Matches an enum cell against the column's values and their other spellings. */
const ENUM_LOOKUP = new Map<CatalogColumn, Map<string, string>>()

/** Lower-case spelling → value for an enum column, built once per column. */
function enumLookup(column: CatalogColumn): Map<string, string> {
  let lookup = ENUM_LOOKUP.get(column)
  if (!lookup) {
    lookup = new Map(Object.entries(column.valueAliases ?? {}))
    for (const v of column.values ?? []) lookup.set(v.toLowerCase(), v)
    ENUM_LOOKUP.set(column, lookup)
  }
  return lookup
}

export function parseEnumValue(column: CatalogColumn, raw: CellValue): { ok: true, value: string } | { ok: false, reason: string } {
  const text = String(raw).trim()
  const key = text.toLowerCase().replace(/\s+/g, ' ')
  const values = column.values ?? []
  const found = enumLookup(column).get(key)
  if (found) return { ok: true, value: found }
  return { ok: false, reason: `unknown value '${text}'; expected one of: ${values.join(', ')}` }
}

type CellResult = { ok: true, value: unknown } | { ok: false, reason: string }

/** Parses one non-blank cell by its column's type. */
function parseCell(column: CatalogColumn, raw: CellValue, decimalSeparator: DecimalSeparator, bareNumberScale: number): CellResult {
  switch (column.type) {
    case 'text': {
      const text = String(raw).trim()
      const max = TEXT_MAX_LENGTH[column.key] ?? DEFAULT_TEXT_MAX_LENGTH
      if (text.length > max) return { ok: false, reason: `is ${text.length} characters long; at most ${max} are allowed` }
      return { ok: true, value: text }
    }
    case 'enum':
      return parseEnumValue(column, raw)
    case 'url': {
      const text = String(raw).trim()
      let url: URL
      try {
        url = new URL(text)
      }
      catch {
        return { ok: false, reason: `'${text}' is not a web link; expected e.g. 'https://example.com/datasheet.pdf'` }
      }
      if (url.protocol !== 'https:' && url.protocol !== 'http:') return { ok: false, reason: `'${text}' must start with https:// or http://` }
      return { ok: true, value: url.toString() }
    }
    case 'priceBreaks': {
      const result = parsePriceBreaks(raw, decimalSeparator)
      return result.ok ? { ok: true, value: result.breaks } : result
    }
    case 'number':
    case 'integer': {
      const unit = column.type === 'integer' && column.unit === '' ? 'pcs' : column.unit
      // A value with its unit typed in ("2,1 mΩ") carries its own decimal mark when it is unambiguous.
      const own = typeof raw === 'string' ? cellDecimalMark(raw) : null
      const result = parseQuantity(raw, unit, { decimalSeparator: own ?? decimalSeparator, bareNumberScale })
      if (!result.ok) return result
      const value = result.value
      const unitText = column.unit === '' || column.unit === 'pcs' ? '' : ` ${column.unit}`
      if (column.type === 'integer' && !Number.isInteger(value)) return { ok: false, reason: `must be a whole number, got ${formatNumber(value)}` }
      if (value < 0 && (column.min ?? 0) >= 0) return { ok: false, reason: `must not be negative, got ${formatNumber(value)}${unitText}` }
      if ((column.min !== undefined && value < column.min) || (column.max !== undefined && value > column.max)) {
        return { ok: false, reason: `${formatNumber(value)}${unitText} is outside the plausible range ${formatNumber(column.min ?? 0)}…${formatNumber(column.max ?? Infinity)}${unitText}; check the unit (numbers without a unit are read in ${column.unit || 'pieces'})` }
      }
      return { ok: true, value }
    }
  }
}

const fieldLabel = (key: ColumnKey) => COLUMN_BY_KEY[key].header

function kindsList(kinds: Iterable<PartKind>): string {
  return [...kinds].join(', ')
}

/**
 * Validates mapped rows into parts. Required cells depend on the row's kind (columns.ts `requiredFor`);
 * every required column that is not mapped is reported once, on the header row, all at once.
 * Each message names the field once in the user's words; the row and column letter travel beside it.
 */
export function validateRows(table: Pick<RawTable, 'headers' | 'rows' | 'headerRowNumber'>, mapping: ColumnMapping, opts: ValidateOptions): ValidationResult {
  const maxIssues = opts.maxIssues ?? 2000
  const headerIssues: ValidationIssue[] = []
  const rowIssues: ValidationIssue[] = []
  const headerRow = table.headerRowNumber ?? 1
  const constants = opts.constants ?? {}
  const valueMapping = opts.valueMapping ?? {}

  for (const problem of checkMapping(mapping, table.headers)) {
    const index = mapping[problem.field]
    headerIssues.push({ row: headerRow, column: typeof index === 'number' && index >= 0 && index < table.headers.length ? columnLetter(index) : '', field: problem.field, message: problem.message, severity: 'error' })
  }

  const scales: Partial<Record<ColumnKey, number>> = {}
  const indexOf: Partial<Record<ColumnKey, number>> = {}
  const letterOf: Partial<Record<ColumnKey, string>> = {}
  for (const column of CATALOG_COLUMNS) {
    const index = mapping[column.key]
    if (typeof index === 'number' && index >= 0 && table.headers[index] !== undefined) {
      indexOf[column.key] = index
      letterOf[column.key] = columnLetter(index)
      scales[column.key] = unitScaleFromHeader(table.headers[index]!, column.unit) ?? 1
    }
  }
  // A currency named in the price header stands for a missing currency column.
  let currencyFromHeader: Currency | null = null
  if (indexOf.currency === undefined && !constants.currency && indexOf.priceBreaks !== undefined) {
    currencyFromHeader = currencyInHeader(table.headers[indexOf.priceBreaks]!)
  }
  // Constants stand only for columns the file lacks.
  const constantOf: Partial<Record<ColumnKey, string>> = Object.fromEntries(
    Object.entries({ ...constants, ...(currencyFromHeader ? { currency: currencyFromHeader } : {}) })
      .filter(([key, value]) => value && indexOf[key as ColumnKey] === undefined),
  )
  const carried = CATALOG_COLUMNS.map(c => c.key).filter(k => indexOf[k] !== undefined || constantOf[k] !== undefined)

  const separatorOf = (key: ColumnKey): DecimalSeparator => opts.columnDecimalSeparators?.[key] ?? opts.decimalSeparator
  const rows = table.rows
  const parts: CatalogPart[] = []
  const refused = new Map<number, string[]>()
  const seen = new Map<string, { rowNumber: number, partIndex: number | null, fingerprint: string }>()
  const duplicatesSkipped: { rowNumber: number, sameAs: number }[] = []
  const exampleNumbers = new Set(TEMPLATE_EXAMPLE_PART_NUMBERS.map(n => n.toLowerCase()))
  const unknown = new Map<string, UnknownValue>()
  /** Unmapped required columns, with the kinds that needed them. */
  const missingColumns = new Map<ColumnKey, Set<PartKind>>()
  const refuse = (rowNumber: number, reason: string) => {
    const list = refused.get(rowNumber)
    if (list) list.push(reason)
    else refused.set(rowNumber, [reason])
  }

  const enumValue = (column: CatalogColumn, raw: CellValue, rowNumber: number): { ok: true, value: string } | { ok: false, reason: string } => {
    const parsed = parseEnumValue(column, raw)
    if (parsed.ok) return parsed
    const text = String(raw).trim()
    const mapped = valueMapping[column.key]?.[normaliseValue(text)]
    if (mapped && (column.values ?? []).includes(mapped)) return { ok: true, value: mapped }
    const tag = `${column.key}\u0000${normaliseValue(text)}`
    const entry = unknown.get(tag)
    if (entry) entry.rowCount++
    else unknown.set(tag, { field: column.key, value: text, rowCount: 1, firstRow: rowNumber, suggestion: suggestValue(column, text) })
    const suggestion = unknown.get(tag)!.suggestion
    return { ok: false, reason: `unknown value '${text}'; expected one of: ${(column.values ?? []).join(', ')}${suggestion ? ` (it looks like '${suggestion}': confirm it under "Values")` : ' (say what it means under "Values")'}` }
  }

  for (const row of rows) {
    let rowHasError = false
    const error = (field: ColumnKey, message: string, letterField: ColumnKey = field) => {
      rowHasError = true
      rowIssues.push({ row: row.rowNumber, column: letterOf[letterField] ?? '', field, message, severity: 'error' })
      refuse(row.rowNumber, message)
    }
    const valueOf = (key: ColumnKey): CellValue | undefined => {
      const index = indexOf[key]
      if (index === undefined) return constantOf[key]
      return row.cells[index] ?? null
    }
    const values: Partial<Record<ColumnKey, unknown>> = {}

    // Kind first: it decides which cells are required.
    const kindCell = valueOf('kind')
    let kind: PartKind | null = null
    if (kindCell === undefined) {
      rowHasError = true
      const set = missingColumns.get('kind') ?? new Set<PartKind>()
      missingColumns.set('kind', set)
      refuse(row.rowNumber, `${fieldLabel('kind')}: no column is mapped to it`)
    }
    else if (isBlank(kindCell)) error('kind', `${COLUMN_BY_KEY.kind.header} is empty; expected one of: ${PART_KINDS.join(', ')}`)
    else {
      const parsed = enumValue(COLUMN_BY_KEY.kind, kindCell, row.rowNumber)
      if (parsed.ok) kind = parsed.value as PartKind
      else error('kind', `${COLUMN_BY_KEY.kind.header}: ${parsed.reason}`)
    }

    for (const column of CATALOG_COLUMNS) {
      if (column.key === 'kind') continue
      const cell = valueOf(column.key)
      const required = kind !== null && column.requiredFor.includes(kind)
      if (cell === undefined) {
        if (required) {
          rowHasError = true
          const set = missingColumns.get(column.key) ?? new Set<PartKind>()
          set.add(kind!)
          missingColumns.set(column.key, set)
          refuse(row.rowNumber, `${column.header}: required for ${kind} parts but no column is mapped to it`)
        }
        continue
      }
      if (isBlank(cell)) {
        if (required) error(column.key, `${column.header} is required for ${kind} parts and is empty${column.unit && column.unit !== 'pcs' ? ` (unit ${column.unit})` : ''}`)
        continue
      }
      const parsed = column.type === 'enum'
        ? enumValue(column, cell, row.rowNumber)
        : parseCell(column, cell, separatorOf(column.key), scales[column.key] ?? 1)
      if (parsed.ok) values[column.key] = parsed.value
      else error(column.key, `${column.header}: ${parsed.reason}`)
    }

    // Checks across cells.
    const partNumber = values.partNumber as string | undefined
    if (partNumber && exampleNumbers.has(partNumber.toLowerCase())) {
      error('partNumber', `'${partNumber}' is the template's example row: delete it before uploading`)
    }
    let configuration = values.packageConfiguration as PackageConfiguration | undefined
    if (kind === 'capacitor') {
      if (configuration && configuration !== 'single') error('packageConfiguration', `capacitors are single parts; leave ${COLUMN_BY_KEY.packageConfiguration.header} blank or write 'single'`)
      configuration = 'single'
    }
    else if (kind && configuration && !PACKAGE_CONFIGURATIONS[configuration].kinds.includes(kind)) {
      error('packageConfiguration', `'${configuration}' is not a package for ${kind} parts; it fits ${kindsText(PACKAGE_CONFIGURATIONS[configuration].kinds)}`)
    }
    const breaks = values.priceBreaks as PriceBreak[] | undefined
    if (breaks && breaks.length > 0 && !values.currency) {
      error('currency', `${COLUMN_BY_KEY.currency.header} is required when prices are given (map a currency column, give one for the whole file, or name it in the price header, e.g. 'Price €')`, letterOf.currency ? 'currency' : 'priceBreaks')
    }
    const rating = values.voltageRating as number | undefined
    const testVoltage = values.energyReferenceVoltage as number | undefined
    if (rating !== undefined && testVoltage !== undefined && testVoltage > rating) {
      error('energyReferenceVoltage', `${COLUMN_BY_KEY.energyReferenceVoltage.header} ${formatNumber(testVoltage)} V is above the voltage rating ${formatNumber(rating)} V`)
    }

    // Foster pairs: both halves of a pair, and the R_i near R_th,jc (shared/thermal/network.ts, the same rule as the part edit).
    for (const problem of fosterProblems(values as Partial<CatalogPart>)) {
      const field = problem.field as ColumnKey
      if (problem.severity === 'error') error(field, problem.message)
      else rowIssues.push({ row: row.rowNumber, column: letterOf[field] ?? '', field, message: problem.message, severity: 'warning' })
    }

    // Same manufacturer and part number twice: an exact repeat is skipped and reported; differing
    // rows are both refused, each naming the other.
    const manufacturer = values.manufacturer as string | undefined
    let duplicateOf: { rowNumber: number, partIndex: number | null, fingerprint: string } | undefined
    let dedupeKey: string | undefined
    const fingerprint = JSON.stringify(CATALOG_COLUMNS.map(c => values[c.key] ?? null).concat([kind]))
    if (partNumber && manufacturer) {
      dedupeKey = partKey(manufacturer, partNumber)
      duplicateOf = seen.get(dedupeKey)
      if (duplicateOf && !rowHasError && duplicateOf.fingerprint === fingerprint) {
        duplicatesSkipped.push({ rowNumber: row.rowNumber, sameAs: duplicateOf.rowNumber })
        rowIssues.push({ row: row.rowNumber, column: letterOf.partNumber ?? '', field: 'partNumber', message: `repeats row ${duplicateOf.rowNumber} exactly; skipped`, severity: 'warning' })
        continue
      }
      if (duplicateOf) {
        error('partNumber', `duplicate: ${manufacturer} ${partNumber} is also on row ${duplicateOf.rowNumber} with other values: keep one`)
        if (duplicateOf.partIndex !== null) {
          parts[duplicateOf.partIndex] = undefined as unknown as CatalogPart
          duplicateOf.partIndex = null
        }
        const message = `duplicate: ${manufacturer} ${partNumber} is also on row ${row.rowNumber} with other values: keep one`
        rowIssues.push({ row: duplicateOf.rowNumber, column: letterOf.partNumber ?? '', field: 'partNumber', message, severity: 'error' })
        refuse(duplicateOf.rowNumber, message)
      }
    }

    if (rowHasError || kind === null) {
      if (dedupeKey && !duplicateOf) seen.set(dedupeKey, { rowNumber: row.rowNumber, partIndex: null, fingerprint })
      if (!refused.has(row.rowNumber)) refuse(row.rowNumber, 'refused')
      continue
    }
    const defaulted: ColumnKey[] = []
    if (values.lifecycle === undefined) defaulted.push('lifecycle')
    if (configuration === undefined) defaulted.push('packageConfiguration')
    if (breaks === undefined) defaulted.push('priceBreaks')
    const part = { ...values, kind, packageConfiguration: configuration ?? 'single', lifecycle: values.lifecycle ?? COLUMN_BY_KEY.lifecycle.defaultValue, priceBreaks: breaks ?? [], sourceRow: row.rowNumber, ...(defaulted.length ? { defaulted } : {}) } as CatalogPart
    parts.push(part)
    if (dedupeKey) seen.set(dedupeKey, { rowNumber: row.rowNumber, partIndex: parts.length - 1, fingerprint })
  }

  for (const [key, kinds] of missingColumns) {
    const column = COLUMN_BY_KEY[key]
    const message = key === 'kind'
      ? `the required column '${column.header}' is not mapped: every row needs a kind (${kindsText(PART_KINDS)})`
      : `'${column.header}' is required for ${kindsList(kinds)} parts but no uploaded column is mapped to it`
    headerIssues.push({ row: headerRow, column: '', field: key, message, severity: 'error' })
  }
  rowIssues.sort((a, b) => a.row - b.row)
  const all = [...headerIssues, ...rowIssues]
  const refusedRows = [...refused.entries()].sort((a, b) => a[0] - b[0]).map(([rowNumber, reasons]) => ({ rowNumber, reasons }))
  return {
    parts: parts.filter(Boolean),
    issues: all.slice(0, maxIssues),
    rowsRead: rows.length,
    rowsWithErrors: refusedRows.length,
    truncated: all.length > maxIssues,
    issueCount: all.length,
    refused: refusedRows,
    duplicatesSkipped,
    unknownValues: [...unknown.values()],
    carried,
    currencyFromHeader,
  }
}
