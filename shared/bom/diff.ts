// "What changed since the last release": lines added, removed, or with another quantity or price.

import { partKey } from '../catalog/part-key'
import { DEFAULT_LOCALE, formatNumber } from '../utils/format'
import type { BomLine, BomSnapshot } from './types'

/** Fields compared between two releases of the same line. */
const COMPARED = ['quantityPerUnit', 'quantityBuild', 'quantitySpares', 'quantityOrder', 'unitPrice', 'currency', 'extendedPrice', 'references'] as const

export type BomComparedField = (typeof COMPARED)[number]

export interface BomFieldChange {
  field: BomComparedField
  previous: number | string | null
  next: number | string | null
}

export interface BomChange {
  change: 'added' | 'removed' | 'changed'
  /** line key in the newer BOM (the older one for removed lines) */
  key: string
  partNumber: string
  manufacturer: string
  description: string
  /** empty for added and removed lines */
  fields: BomFieldChange[]
  /** one readable sentence, e.g. "Qty to order 24 → 30 pcs; unit price 12.50 → 10.80 EUR" */
  summary: string
}

const LABELS: Record<BomComparedField, string> = {
  quantityPerUnit: 'qty per set',
  quantityBuild: 'qty for the build',
  quantitySpares: 'spares',
  quantityOrder: 'qty to order',
  unitPrice: 'unit price',
  currency: 'currency',
  extendedPrice: 'extended price',
  references: 'references',
}

/**
 * Part lines are matched by partKey() of what they name (a release written before the key was one function still
 * matches); manual lines are numbered ("manual-3"), so they are matched by what they are, not by number.
 */
function identity(line: BomLine): string {
  if (!line.manual) return `part:${partKey(line.manufacturer, line.partNumber)}`
  return `manual:${[line.description, line.partNumber, line.manufacturer].map(s => s.trim().toUpperCase()).join('|')}`
}

function value(line: BomLine, field: BomComparedField): number | string | null {
  return field === 'references' ? line.references.join(', ') : line[field]
}

function same(a: number | string | null, b: number | string | null): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))
  return a === b
}

function show(field: BomComparedField, v: number | string | null, currency: string): string {
  if (v === null) return '—'
  if (typeof v === 'number') return field === 'unitPrice' || field === 'extendedPrice' ? `${formatNumber(v, DEFAULT_LOCALE, { decimals: 2, grouping: false })} ${currency}` : `${v} pcs`
  return v === '' ? '—' : v
}

function describe(line: BomLine): string {
  return [line.manufacturer, line.partNumber].filter(s => s !== '').join(' ') || line.description
}

/** Changes from `previous` to `next`: lines of `next` in order (added or changed), then removed lines. */
export function diffBoms(previous: BomSnapshot, next: BomSnapshot): BomChange[] {
  const unmatched = new Map<string, BomLine[]>()
  for (const line of previous.lines) {
    const id = identity(line)
    unmatched.set(id, [...(unmatched.get(id) ?? []), line])
  }
  const changes: BomChange[] = []
  for (const line of next.lines) {
    const candidates = unmatched.get(identity(line))
    const before = candidates?.shift()
    const base = { key: line.key, partNumber: line.partNumber, manufacturer: line.manufacturer, description: line.description }
    if (!before) {
      changes.push({ ...base, change: 'added', fields: [], summary: `added: ${describe(line)}, ${line.quantityOrder} pcs to order` })
      continue
    }
    const fields: BomFieldChange[] = []
    for (const field of COMPARED) {
      const a = value(before, field)
      const b = value(line, field)
      if (!same(a, b)) fields.push({ field, previous: a, next: b })
    }
    if (fields.length > 0) {
      const text = fields.map(f => `${LABELS[f.field]} ${show(f.field, f.previous, before.currency)} → ${show(f.field, f.next, line.currency)}`).join('; ')
      changes.push({ ...base, change: 'changed', fields, summary: `${describe(line)}: ${text}` })
    }
  }
  for (const rest of unmatched.values()) {
    for (const line of rest) {
      changes.push({ key: line.key, partNumber: line.partNumber, manufacturer: line.manufacturer, description: line.description, change: 'removed', fields: [], summary: `removed: ${describe(line)}` })
    }
  }
  return changes
}
