// How catalogue values read on screen: labels and units from catalog/columns.ts (the one column
// definition), field groups for the part page, a field diff between part versions, import shapes.
import {
  CATALOG_COLUMNS, COLUMN_BY_KEY, fosterKeys, LIFECYCLES, PACKAGE_CONFIGURATIONS, PART_KINDS, SEMICONDUCTOR_KINDS,
  type CatalogColumn, type ColumnKey, type Lifecycle, type PartKind,
} from '~~/catalog/columns'
import type { MappingSuggestion, MatchReason } from '#shared/catalog/mapping'
import type { CatalogPart, ColumnMapping, PriceBreak, TableProblem, ValidationIssue } from '#shared/catalog/types'
import { formatDateTime, formatInteger, formatMoney, formatNumber, formatSi } from '#shared/utils/format'
import { activeLocale } from '~/composables/useLocale'

export { CATALOG_COLUMNS, COLUMN_BY_KEY, LIFECYCLES, PART_KINDS }

/** Upload limits the server enforces (server/services/catalog-import.ts UPLOAD_LIMITS). */
export const UPLOAD_LIMITS = { maxBytes: 10 * 1024 * 1024, maxRows: 20_000 }

/** The answer of upload, GET import and preview (server/services/catalog-import.ts describeImport). */
export interface ColumnSeparatorInfo { key: ColumnKey, separator: '.' | ',', source: 'cells' | 'file', chosen: boolean, comma: number, dot: number }
export interface UnknownValueInfo { field: ColumnKey, value: string, rowCount: number, firstRow: number, suggestion: string | null }
export interface FieldChangeInfo { key: ColumnKey, label: string, old: unknown, new: unknown }

export interface ImportDescription {
  import: { id: number, filename: string, sizeBytes: number, status: string, sheetName: string, createdAt: string, catalogVersionId: number | null, refusedCount?: number }
  headers: string[]
  headerRowNumber: number
  headerCandidates: { rowNumber: number, score: number, text: string }[]
  skipped: { rowNumber: number, reason: 'above-header' | 'units' | 'blank' | 'notes' | 'duplicate', text: string }[]
  valueMapping: Partial<Record<ColumnKey, Record<string, string>>>
  constants: Partial<Record<ColumnKey, string>>
  changes: { added: number, changed: number, unchanged: number, listedAll: boolean, changes: { partId: number, manufacturer: string, partNumber: string, row: number | null, fields: FieldChangeInfo[] }[] }
  suggestions: MappingSuggestion[]
  unusedHeaders: { index: number, header: string, column: string }[]
  mapping: ColumnMapping
  decimalSeparator: '.' | ','
  warnings: TableProblem[]
  preview: {
    rowsRead: number
    rowsWithErrors: number
    validParts: number
    issues: ValidationIssue[]
    issueCount: number
    truncated: boolean
    sample: CatalogPart[]
    duplicatesSkipped: { rowNumber: number, sameAs: number }[]
    unknownValues: UnknownValueInfo[]
    currencyFromHeader: string | null
    carried: ColumnKey[]
    decimalSeparators: ColumnSeparatorInfo[]
  }
}

/** number / catalogVersionId are null when the file changed nothing (no new version). */
export interface CommitSummary { catalogVersionId: number | null, number: number | null, added: number, updated: number, unchanged: number, refused: number }

export const kindLabels: Record<PartKind, string> = {
  'switch-diode': 'Switch + diode',
  'switch': 'Switch',
  'diode': 'Diode',
  'capacitor': 'Capacitor',
}

export const lifecycleLabels: Record<Lifecycle, string> = {
  active: 'Active',
  nrnd: 'Not for new designs',
  obsolete: 'Obsolete',
}

export const lifecycleBadgeClass: Record<Lifecycle, string> = {
  active: 'bg-teal-100 text-teal-900',
  nrnd: 'bg-amber-100 text-amber-900',
  obsolete: 'bg-rose-100 text-rose-900',
}

/** Spreadsheet column letter of a 0-based index (same rule as the server's). */
export { columnLetter } from '#shared/catalog/mapping'

/** Column header with its unit, e.g. "Voltage rating [V]". */
export function labelWithUnit(column: CatalogColumn): string {
  return column.unit && column.unit !== 'per piece' ? `${column.header} [${column.unit}]` : column.header
}

/** When a catalogue column must be filled, in words ("" when optional). */
export function requiredText(column: CatalogColumn): string {
  const kinds = column.requiredFor
  if (kinds.length === 0) return ''
  if (kinds.length === PART_KINDS.length) return 'required'
  if (kinds.length === SEMICONDUCTOR_KINDS.length && SEMICONDUCTOR_KINDS.every(k => kinds.includes(k))) return 'required for semiconductors'
  return `required for ${kinds.map(k => kindLabels[k].toLowerCase()).join(', ')}`
}

export const reasonLabels: Record<MatchReason, string> = {
  label: 'same name as the template',
  alias: 'a usual name for this column',
  contains: 'header contains the name',
  similar: 'similar name',
  none: 'no matching header',
}

export function money(value: number | null | undefined, currency?: string | null): string {
  return formatMoney(value, currency ?? null, activeLocale())
}

export function formatPriceBreaksText(breaks: readonly PriceBreak[], currency?: string | null): string {
  if (!breaks.length) return '—'
  return breaks.map(b => `from ${formatInteger(b.minQuantity, activeLocale())} pcs: ${money(b.unitPrice, currency)}`).join('; ')
}

/** Units shown with an SI prefix ("2.1 mΩ", "45 mJ", "500 µF"); volts and amperes only from 1 k up ("0.9 V", "1.2 kV"). */
const PREFIXED_UNITS = new Set(['Ω', 'J', 'F', 's'])
const KILO_UNITS = new Set(['V', 'A'])

function plainNumber(value: number): string {
  return formatNumber(Number(value.toPrecision(6)), activeLocale(), { maxDecimals: 6 })
}

/** One quantity in a column's unit as the UI shows it. */
export function formatQuantity(value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  if (PREFIXED_UNITS.has(unit) || (KILO_UNITS.has(unit) && Math.abs(value) >= 1000)) return formatSi(value, unit, 4, activeLocale())
  if (unit === 'd') return `${plainNumber(value)} ${value === 1 ? 'day' : 'days'}`
  if (unit === 'pcs') return `${plainNumber(value)} pcs`
  return unit ? `${plainNumber(value)} ${unit}` : plainNumber(value)
}

/** A part's field as the UI shows it, with its unit from columns.ts. */
export function formatField(key: ColumnKey, part: Partial<CatalogPart>): string {
  const value = (part as Record<string, unknown>)[key]
  const column = COLUMN_BY_KEY[key]
  if (key === 'priceBreaks') return formatPriceBreaksText((value as PriceBreak[] | undefined) ?? [], part.currency)
  if (value === undefined || value === null || value === '') return '—'
  if (key === 'kind') return kindLabels[value as PartKind] ?? String(value)
  if (key === 'lifecycle') return lifecycleLabels[value as Lifecycle] ?? String(value)
  if (key === 'packageConfiguration') return PACKAGE_CONFIGURATIONS[value as keyof typeof PACKAGE_CONFIGURATIONS]?.label ?? String(value)
  if (typeof value === 'number') return formatQuantity(value, column.unit)
  return String(value)
}

/** The part page's groups of fields (every catalogue column appears in exactly one). */
export const FIELD_GROUPS: { id: string, title: string, keys: ColumnKey[] }[] = [
  { id: 'identity', title: 'Part', keys: ['partNumber', 'manufacturer', 'kind', 'packageConfiguration', 'technology', 'description', 'datasheetUrl'] },
  { id: 'ratings', title: 'Ratings', keys: ['voltageRating', 'currentRating', 'junctionTemperatureMax'] },
  { id: 'conduction', title: 'Conduction (on-state model v = V0 + r·i, hot)', keys: ['switchThresholdVoltage', 'switchSlopeResistance', 'diodeThresholdVoltage', 'diodeSlopeResistance'] },
  { id: 'switching', title: 'Switching energies per event', keys: ['turnOnEnergy', 'turnOffEnergy', 'recoveryEnergy', 'energyReferenceVoltage', 'energyReferenceCurrent'] },
  { id: 'temperature', title: 'Loss figures at 25 °C (optional: linear in T_j up to the data temperature)', keys: ['lossDataTemperature', 'switchThresholdVoltage25', 'switchSlopeResistance25', 'diodeThresholdVoltage25', 'diodeSlopeResistance25', 'turnOnEnergy25', 'turnOffEnergy25', 'recoveryEnergy25'] },
  { id: 'thermal', title: 'Thermal', keys: ['rthJunctionCaseSwitch', 'rthJunctionCaseDiode', 'rthCaseHeatsink'] },
  { id: 'foster', title: 'Transient thermal impedance junction-case (Foster R_i, τ_i)', keys: [...fosterKeys('Switch').flat(), ...fosterKeys('Diode').flat()] },
  { id: 'capacitor', title: 'Capacitor', keys: ['capacitance', 'rippleCurrentRating', 'esr', 'capacitorRatedLife', 'capacitorRatedTemperature', 'capacitorRthHotSpot'] },
  { id: 'commercial', title: 'Commercial', keys: ['priceBreaks', 'currency', 'minimumOrderQuantity', 'stock', 'leadTimeDays', 'lifecycle', 'supplier'] },
]

function hasValue(part: Partial<CatalogPart>, key: ColumnKey): boolean {
  const v = (part as Record<string, unknown>)[key]
  return Array.isArray(v) ? v.length > 0 : v !== undefined && v !== null && v !== ''
}

/** Groups that hold at least one value for this part (a capacitor has no switching energies). */
export function groupsFor(part: Partial<CatalogPart>) {
  return FIELD_GROUPS.filter(g => g.keys.some(k => hasValue(part, k)))
}

export interface FieldChange { key: ColumnKey, label: string, before: string, after: string }

/** Fields that differ between an older and a newer version of a part, in column order. */
export function diffParts(older: Partial<CatalogPart>, newer: Partial<CatalogPart>): FieldChange[] {
  const changes: FieldChange[] = []
  for (const column of CATALOG_COLUMNS) {
    const a = (older as Record<string, unknown>)[column.key]
    const b = (newer as Record<string, unknown>)[column.key]
    if (JSON.stringify(a ?? null) === JSON.stringify(b ?? null)) continue
    if (column.key === 'priceBreaks' && !(a as unknown[] | undefined)?.length && !(b as unknown[] | undefined)?.length) continue
    changes.push({ key: column.key, label: column.header, before: formatField(column.key, older), after: formatField(column.key, newer) })
  }
  return changes
}

export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`
  return `${Math.max(1, Math.ceil(bytes / 1024))} kB`
}

export function formatDate(value: string | Date | null | undefined): string {
  return formatDateTime(value, activeLocale())
}
