// Turns mapped spreadsheet rows into typed catalogue parts, explaining every cell it refuses
// (row as the user sees it, column letter, field). A row with any error yields no part.

import {
  CATALOG_COLUMNS, COLUMN_BY_KEY, PACKAGE_CONFIGURATIONS, PART_KINDS, TEMPLATE_EXAMPLE_PART_NUMBERS,
  type CatalogColumn, type PackageConfiguration, type PartKind,
} from '../../catalog/columns'
import { checkMapping, columnLetter } from './mapping'
import { parsePriceBreaks } from './prices'
import type { CatalogPart, CellValue, ColumnKey, ColumnMapping, PriceBreak, RawTable, ValidationIssue } from './types'
import { parseQuantity, unitScaleFromHeader, type DecimalSeparator } from './units'

export interface ValidateOptions {
  decimalSeparator: DecimalSeparator
  /** Stop listing issues after this many (the count of bad rows stays exact). Default 2000. */
  maxIssues?: number
}

export interface ValidationResult {
  parts: CatalogPart[]
  issues: ValidationIssue[]
  /** Data rows looked at. */
  rowsRead: number
  /** Rows refused because of at least one error. */
  rowsWithErrors: number
  /** True when more issues existed than maxIssues. */
  truncated: boolean
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
      const result = parseQuantity(raw, unit, { decimalSeparator, bareNumberScale })
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

/**
 * Validates mapped rows into parts. Required cells depend on the row's kind (columns.ts `requiredFor`);
 * a required column that is not mapped at all is reported once, on the header row.
 */
export function validateRows(table: Pick<RawTable, 'headers' | 'rows' | 'headerRowNumber'>, mapping: ColumnMapping, opts: ValidateOptions): ValidationResult {
  const maxIssues = opts.maxIssues ?? 2000
  const issues: ValidationIssue[] = []
  let truncated = false
  const push = (issue: ValidationIssue) => {
    if (issues.length < maxIssues) issues.push(issue)
    else truncated = true
  }
  const headerRow = table.headerRowNumber ?? 1

  for (const problem of checkMapping(mapping, table.headers)) {
    const index = mapping[problem.field]
    push({ row: headerRow, column: typeof index === 'number' && index >= 0 && index < table.headers.length ? columnLetter(index) : '', field: problem.field, message: problem.message, severity: 'error' })
  }

  const scales: Partial<Record<ColumnKey, number>> = {}
  for (const column of CATALOG_COLUMNS) {
    const index = mapping[column.key]
    if (typeof index === 'number' && table.headers[index] !== undefined) {
      scales[column.key] = unitScaleFromHeader(table.headers[index]!, column.unit) ?? 1
    }
  }

  const unmappedReported = new Set<string>()
  // Column index and letter per mapped field, looked up directly in each row (no per-cell objects).
  const indexOf: Partial<Record<ColumnKey, number>> = {}
  const letterOf: Partial<Record<ColumnKey, string>> = {}
  for (const column of CATALOG_COLUMNS) {
    const index = mapping[column.key]
    if (typeof index === 'number' && index >= 0) {
      indexOf[column.key] = index
      letterOf[column.key] = columnLetter(index)
    }
  }
  const rows = table.rows
  const parts: CatalogPart[] = []
  const rowsWithErrors = new Set<number>()
  const seen = new Map<string, { rowNumber: number, partIndex: number | null }>()
  const exampleNumbers = new Set(TEMPLATE_EXAMPLE_PART_NUMBERS.map(n => n.toLowerCase()))

  for (const row of rows) {
    let rowHasError = false
    const error = (field: ColumnKey, message: string, letterField: ColumnKey = field) => {
      rowHasError = true
      push({ row: row.rowNumber, column: letterOf[letterField] ?? '', field, message, severity: 'error' })
    }
    const valueOf = (key: ColumnKey): CellValue | undefined => {
      const index = indexOf[key]
      return index === undefined ? undefined : (row.cells[index] ?? null)
    }
    const values: Partial<Record<ColumnKey, unknown>> = {}

    // Kind first: it decides which cells are required.
    const kindCell = valueOf('kind')
    let kind: PartKind | null = null
    if (kindCell === undefined) {
      rowHasError = true
      if (!unmappedReported.has('kind')) {
        unmappedReported.add('kind')
        push({ row: headerRow, column: '', field: 'kind', message: `the required column '${COLUMN_BY_KEY.kind.header}' is not mapped: every row needs a kind (${kindsText(PART_KINDS)})`, severity: 'error' })
      }
    }
    else if (isBlank(kindCell)) error('kind', `${COLUMN_BY_KEY.kind.header} is empty; expected one of: ${PART_KINDS.join(', ')}`)
    else {
      const parsed = parseEnumValue(COLUMN_BY_KEY.kind, kindCell)
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
          const tag = `${column.key}:${kind}`
          if (!unmappedReported.has(tag)) {
            unmappedReported.add(tag)
            push({ row: headerRow, column: '', field: column.key, message: `'${column.header}' is required for ${kind} parts but no uploaded column is mapped to it`, severity: 'error' })
          }
        }
        continue
      }
      if (isBlank(cell)) {
        if (required) error(column.key, `${column.header} is required for ${kind} parts and is empty${column.unit && column.unit !== 'pcs' ? ` (unit ${column.unit})` : ''}`)
        continue
      }
      const parsed = parseCell(column, cell, opts.decimalSeparator, scales[column.key] ?? 1)
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
      error('currency', `${COLUMN_BY_KEY.currency.header} is required when prices are given`, letterOf.currency ? 'currency' : 'priceBreaks')
    }
    const rating = values.voltageRating as number | undefined
    const testVoltage = values.energyReferenceVoltage as number | undefined
    if (rating !== undefined && testVoltage !== undefined && testVoltage > rating) {
      error('energyReferenceVoltage', `${COLUMN_BY_KEY.energyReferenceVoltage.header} ${formatNumber(testVoltage)} V is above the voltage rating ${formatNumber(rating)} V`)
    }

    // Same manufacturer and part number twice: both rows are refused, each naming the other.
    const manufacturer = values.manufacturer as string | undefined
    let duplicateOf: { rowNumber: number, partIndex: number | null } | undefined
    let dedupeKey: string | undefined
    if (partNumber && manufacturer) {
      dedupeKey = `${manufacturer.toLowerCase().replace(/\s+/g, ' ')}\u0000${partNumber.toLowerCase().replace(/\s+/g, '')}`
      duplicateOf = seen.get(dedupeKey)
      if (duplicateOf) {
        error('partNumber', `duplicate: ${manufacturer} ${partNumber} is also on row ${duplicateOf.rowNumber}`)
        if (duplicateOf.partIndex !== null) {
          parts[duplicateOf.partIndex] = undefined as unknown as CatalogPart
          rowsWithErrors.add(duplicateOf.rowNumber)
          duplicateOf.partIndex = null
        }
        push({ row: duplicateOf.rowNumber, column: letterOf.partNumber ?? '', field: 'partNumber', message: `duplicate: ${manufacturer} ${partNumber} is also on row ${row.rowNumber}`, severity: 'error' })
      }
    }

    if (rowHasError || kind === null) {
      rowsWithErrors.add(row.rowNumber)
      if (dedupeKey && !duplicateOf) seen.set(dedupeKey, { rowNumber: row.rowNumber, partIndex: null })
      continue
    }
    const part = { ...values, kind, packageConfiguration: configuration ?? 'single', lifecycle: values.lifecycle ?? COLUMN_BY_KEY.lifecycle.defaultValue, priceBreaks: breaks ?? [], sourceRow: row.rowNumber } as CatalogPart
    parts.push(part)
    if (dedupeKey) seen.set(dedupeKey, { rowNumber: row.rowNumber, partIndex: parts.length - 1 })
  }

  return {
    parts: parts.filter(Boolean),
    issues,
    rowsRead: rows.length,
    rowsWithErrors: rowsWithErrors.size,
    truncated,
  }
}
