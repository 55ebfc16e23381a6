// Writes parts back as template rows (same columns, SI numbers), e.g. to export a catalogue or to
// seed the demo through the same import path as an upload.

import { CATALOG_COLUMNS } from '../../catalog/columns'
import { formatPriceBreaks } from './prices'
import type { CatalogPart, CellValue } from './types'

/** One template row for a part, in CATALOG_COLUMNS order. Numbers stay numbers (in the units row's unit). */
export function partToRow(part: CatalogPart): CellValue[] {
  return CATALOG_COLUMNS.map((column) => {
    if (column.key === 'priceBreaks') return part.priceBreaks.length > 0 ? formatPriceBreaks(part.priceBreaks) : null
    if (column.key === 'packageConfiguration' && part.kind === 'capacitor') return null
    const value = (part as unknown as Record<string, unknown>)[column.key]
    if (value === undefined || value === null) return null
    return typeof value === 'number' ? value : String(value)
  })
}

/** Header and rows for a list of parts (the template's header row, no units row). */
export function partsToTable(parts: readonly CatalogPart[]): { headers: string[], rows: CellValue[][] } {
  return { headers: CATALOG_COLUMNS.map(c => c.header), rows: parts.map(partToRow) }
}
