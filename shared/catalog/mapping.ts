// Header mapping: which uploaded column feeds which catalogue column. The suggestion compares
// normalised header names with each column's label, key and aliases (catalog/columns.ts).

import { CATALOG_COLUMNS, type CatalogColumn } from '../../catalog/columns'
import type { CellValue, ColumnKey, ColumnMapping, RawTable } from './types'
import { UNIT_SPECS, unitFactor, unitScaleFromHeader } from './units'

/** Spreadsheet column letter of a 0-based index: 0 → "A", 27 → "AB". */
export function columnLetter(index: number): string {
  let n = index + 1
  let letters = ''
  while (n > 0) {
    const rest = (n - 1) % 26
    letters = String.fromCharCode(65 + rest) + letters
    n = Math.floor((n - 1) / 26)
  }
  return letters
}

const EXTRA_UNIT_WORDS = new Set(['pcs', 'pc', 'pieces', 'days', 'weeks', 'wks', 'eur', 'usd', 'gbp', 'chf', 'sek', '€', '$', '£', 'si'])

/** True when the text is a unit ("mJ", "K/W", "pcs", "€"), as written in brackets or a units row. */
export function isUnitText(text: string): boolean {
  const t = text.trim()
  if (t === '') return false
  if (EXTRA_UNIT_WORDS.has(t.toLowerCase())) return true
  return Object.keys(UNIT_SPECS).some(symbol => symbol !== '' && unitFactor(t, symbol) !== null)
}

/** Lower case, no accents, units in brackets dropped, punctuation to spaces: "Rth(j-c) IGBT [K/W]" → "rth j c igbt". */
export function normaliseHeader(text: string): string {
  let s = text.normalize('NFKC')
  s = s.replace(/[([{]([^)\]}]*)[)\]}]/g, (_, inner: string) => (isUnitText(inner) ? ' ' : ` ${inner} `))
  s = s.replace(/,\s*([^,]+)$/, (whole, tail: string) => (isUnitText(tail) ? '' : whole))
  s = s.replace(/\s+in\s+(\S+)\s*$/i, (whole, tail: string) => (isUnitText(tail) ? '' : whole))
  s = s.normalize('NFKD').replace(/[\u0300-\u036f]/g, '')
  s = s.replace(/[µμ]/g, 'u').replace(/[Ω\u2126]/g, 'ohm').replace(/#/g, ' number ')
  s = s.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()
  return s.replace(/[^a-z0-9]+/g, ' ').trim()
}

function bigrams(s: string): Map<string, number> {
  const grams = new Map<string, number>()
  for (let i = 0; i < s.length - 1; i++) {
    const g = s.slice(i, i + 2)
    grams.set(g, (grams.get(g) ?? 0) + 1)
  }
  return grams
}

/** Sørensen–Dice coefficient on character bigrams (0…1), spaces ignored. */
export function similarity(a: string, b: string): number {
  const x = a.replace(/\s+/g, '')
  const y = b.replace(/\s+/g, '')
  if (x === y) return 1
  if (x.length < 2 || y.length < 2) return 0
  const gx = bigrams(x)
  const gy = bigrams(y)
  let overlap = 0
  for (const [g, n] of gx) overlap += Math.min(n, gy.get(g) ?? 0)
  return (2 * overlap) / (x.length - 1 + y.length - 1)
}

export type MatchReason = 'label' | 'alias' | 'contains' | 'similar' | 'none'

export interface MappingSuggestion {
  key: ColumnKey
  /** Template header of the catalogue column. */
  label: string
  /** 0-based index of the uploaded header, or null when nothing fits. */
  index: number | null
  uploadedHeader?: string
  /** Column letter of the uploaded header. */
  column?: string
  /** 0…1, how sure the suggestion is. */
  score: number
  reason: MatchReason
  /** Factor applied to bare numbers because the header names a unit ("Eon (mJ)" → 0.001). */
  headerUnitScale?: number
}

interface Names { label: string, key: string, aliases: string[] }

function namesOf(column: CatalogColumn): Names {
  return {
    label: normaliseHeader(column.header),
    key: normaliseHeader(column.key),
    aliases: column.aliases.map(normaliseHeader),
  }
}

/** How well one uploaded header fits one catalogue column, with the reason. */
export function scoreHeader(header: string, column: CatalogColumn): { score: number, reason: MatchReason } {
  return scoreNormalised(normaliseHeader(header), namesOf(column))
}

function scoreNormalised(h: string, names: Names): { score: number, reason: MatchReason } {
  if (h === '') return { score: 0, reason: 'none' }
  if (h === names.label || h === names.key) return { score: 1, reason: 'label' }
  if (names.aliases.includes(h)) return { score: 0.95, reason: 'alias' }
  const headerTokens = h.split(' ')
  let best: { score: number, reason: MatchReason } = { score: 0, reason: 'none' }
  for (const name of [names.label, ...names.aliases]) {
    if (name.length >= 3) {
      const tokens = name.split(' ')
      if (tokens.every(t => headerTokens.includes(t))) {
        const score = 0.7 + 0.2 * (tokens.length / headerTokens.length)
        if (score > best.score) best = { score, reason: 'contains' }
      }
    }
    const score = 0.85 * similarity(h, name)
    if (score > best.score) best = { score, reason: 'similar' }
  }
  return best
}

/** Suggestions below this score are not made: the user maps the column by hand. */
export const SUGGESTION_THRESHOLD = 0.6

/**
 * Suggests, for each catalogue column, the best uploaded header. One header feeds at most one column;
 * the surest pairs are taken first.
 */
export function suggestMapping(headers: readonly string[], columns: readonly CatalogColumn[] = CATALOG_COLUMNS): {
  mapping: ColumnMapping
  suggestions: MappingSuggestion[]
  /** Uploaded headers no column uses (shown so the user can map them by hand). */
  unusedHeaders: { index: number, header: string, column: string }[]
} {
  const normalised = headers.map(normaliseHeader)
  const pairs: { columnIndex: number, headerIndex: number, score: number, reason: MatchReason }[] = []
  columns.forEach((column, columnIndex) => {
    const names = namesOf(column)
    normalised.forEach((h, headerIndex) => {
      const { score, reason } = scoreNormalised(h, names)
      if (score >= SUGGESTION_THRESHOLD) pairs.push({ columnIndex, headerIndex, score, reason })
    })
  })
  pairs.sort((a, b) => b.score - a.score || a.columnIndex - b.columnIndex || a.headerIndex - b.headerIndex)
  const takenColumns = new Map<number, (typeof pairs)[number]>()
  const takenHeaders = new Set<number>()
  for (const pair of pairs) {
    if (takenColumns.has(pair.columnIndex) || takenHeaders.has(pair.headerIndex)) continue
    takenColumns.set(pair.columnIndex, pair)
    takenHeaders.add(pair.headerIndex)
  }
  const mapping: ColumnMapping = {}
  const suggestions: MappingSuggestion[] = columns.map((column, columnIndex) => {
    const pair = takenColumns.get(columnIndex)
    mapping[column.key] = pair ? pair.headerIndex : null
    if (!pair) return { key: column.key, label: column.header, index: null, score: 0, reason: 'none' }
    const uploadedHeader = headers[pair.headerIndex]!
    const scale = unitScaleFromHeader(uploadedHeader, column.unit)
    return {
      key: column.key,
      label: column.header,
      index: pair.headerIndex,
      uploadedHeader,
      column: columnLetter(pair.headerIndex),
      score: Math.round(pair.score * 100) / 100,
      reason: pair.reason,
      ...(scale !== null && scale !== 1 ? { headerUnitScale: scale } : {}),
    }
  })
  const unusedHeaders = headers
    .map((header, index) => ({ index, header, column: columnLetter(index) }))
    .filter(h => !takenHeaders.has(h.index) && h.header.trim() !== '')
  return { mapping, suggestions, unusedHeaders }
}

/** Problems with a mapping itself: indices outside the sheet, one uploaded column feeding two catalogue columns. */
export function checkMapping(mapping: ColumnMapping, headers: readonly string[]): { field: ColumnKey, message: string }[] {
  const problems: { field: ColumnKey, message: string }[] = []
  const usedBy = new Map<number, ColumnKey>()
  for (const [key, index] of Object.entries(mapping) as [ColumnKey, number | null | undefined][]) {
    if (index === null || index === undefined) continue
    if (!Number.isInteger(index) || index < 0 || index >= headers.length) {
      problems.push({ field: key, message: `'${key}' is mapped to column ${index}, which the sheet does not have` })
      continue
    }
    const other = usedBy.get(index)
    if (other) {
      problems.push({ field: key, message: `column ${columnLetter(index)} ('${headers[index]}') is mapped to both '${other}' and '${key}'` })
    }
    else usedBy.set(index, key)
  }
  return problems
}

export interface MappedCell {
  value: CellValue
  /** Column letter in the uploaded sheet. */
  column: string
}

export interface MappedRow {
  rowNumber: number
  cells: Partial<Record<ColumnKey, MappedCell>>
}

/** Picks each mapped catalogue column's cell out of every row. Unmapped columns are absent. */
export function applyMapping(table: Pick<RawTable, 'rows'>, mapping: ColumnMapping): MappedRow[] {
  const entries = (Object.entries(mapping) as [ColumnKey, number | null | undefined][])
    .filter((e): e is [ColumnKey, number] => typeof e[1] === 'number' && e[1] >= 0)
    .map(([key, index]) => ({ key, index, column: columnLetter(index) }))
  return table.rows.map((row) => {
    const cells: Partial<Record<ColumnKey, MappedCell>> = {}
    for (const { key, index, column } of entries) cells[key] = { value: row.cells[index] ?? null, column }
    return { rowNumber: row.rowNumber, cells }
  })
}
