// What a re-import does to a part that is already in the catalogue: only the columns the file carries
// change it; everything else (stock, lead time, lifecycle set in the app, figures the file lacks) keeps
// its current value. A blank cell in a carried column keeps the current value too: a file can add and
// change figures, never silently erase them (the app's part editor clears a value).

import { COLUMN_BY_KEY, type ColumnKey } from '../../catalog/columns'
import type { CatalogPart } from './types'

/** Fields of a validated part that were filled by a default because the cell was blank (import only). */
export type ImportedPart = CatalogPart & { defaulted?: ColumnKey[] }

/** JSON with sorted keys: jsonb does not keep key order, so a plain stringify would see every part as changed. */
export function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`
  if (value && typeof value === 'object') {
    return `{${Object.keys(value).filter(k => (value as Record<string, unknown>)[k] !== undefined).sort().map(k => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`
  }
  return JSON.stringify(value)
}

/** The part as stored: import-only fields removed. */
export function storedPart(part: ImportedPart): CatalogPart {
  const { sourceRow: _row, defaulted: _defaulted, ...rest } = part
  return rest
}

function isEmptyValue(key: ColumnKey, value: unknown): boolean {
  return value === undefined || value === null || (key === 'priceBreaks' && Array.isArray(value) && value.length === 0)
}

/** The existing part with the carried, non-blank fields of the incoming one. */
export function mergeIncoming(existing: CatalogPart, incoming: ImportedPart, carried: readonly ColumnKey[]): CatalogPart {
  const out: Record<string, unknown> = { ...existing }
  const defaulted = new Set(incoming.defaulted ?? [])
  for (const key of carried) {
    const value = (incoming as unknown as Record<string, unknown>)[key]
    if (defaulted.has(key) || isEmptyValue(key, value)) continue
    out[key] = value
  }
  // Identity comes from the file as written (a corrected spelling of the same part number is kept).
  out.partNumber = incoming.partNumber
  out.manufacturer = incoming.manufacturer
  return out as unknown as CatalogPart
}

export interface FieldChange {
  key: ColumnKey
  /** Catalogue column header, as the user knows it. */
  label: string
  old: unknown
  new: unknown
}

/** Fields that differ between two versions of a part, in column order. */
export function changedFields(before: CatalogPart, after: CatalogPart): FieldChange[] {
  const out: FieldChange[] = []
  const keys = new Set([...Object.keys(before), ...Object.keys(after)])
  for (const key of Object.keys(COLUMN_BY_KEY) as ColumnKey[]) {
    if (!keys.has(key)) continue
    const a = (before as unknown as Record<string, unknown>)[key]
    const b = (after as unknown as Record<string, unknown>)[key]
    if (canonical(a ?? null) !== canonical(b ?? null)) out.push({ key, label: COLUMN_BY_KEY[key].header, old: a ?? null, new: b ?? null })
  }
  return out
}
