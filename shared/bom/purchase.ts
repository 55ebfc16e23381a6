// Purchasing views of a released BOM: lines still open, grouped by the supplier they are bought from.

import { bomTotals } from './build'
import type { BomLine, BomPurchase, BomSnapshot } from './types'

/** The supplier a line is bought from: purchasing's entry, else the catalogue's supplier. */
export function supplierOf(line: BomLine, purchase: BomPurchase): string {
  return purchase[line.key]?.supplier?.trim() || line.supplier?.trim() || '(no supplier)'
}

/** A line is open until it is received. */
export function isOpen(line: BomLine, purchase: BomPurchase): boolean {
  return (purchase[line.key]?.status ?? 'to-quote') !== 'received'
}

/** Lines grouped by supplier (suppliers in alphabetical order, lines in BOM order within each). */
export function groupBySupplier(lines: readonly BomLine[], purchase: BomPurchase): { supplier: string, lines: BomLine[] }[] {
  const groups = new Map<string, BomLine[]>()
  for (const line of lines) {
    const s = supplierOf(line, purchase)
    groups.set(s, [...(groups.get(s) ?? []), line])
  }
  return [...groups.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([supplier, ls]) => ({ supplier, lines: ls }))
}

/** The snapshot cut to its open lines, ordered by supplier, with totals of those lines. */
export function openLinesBySupplier(snapshot: BomSnapshot, purchase: BomPurchase): BomSnapshot {
  const lines = groupBySupplier(snapshot.lines.filter(l => isOpen(l, purchase)), purchase).flatMap(g => g.lines)
  return { ...snapshot, lines, totals: bomTotals(lines, snapshot.currency) }
}

/** Pieces missing from stock for the order (0 when stock covers it or is unknown). */
export function stockShortfall(line: Pick<BomLine, 'stock' | 'quantityOrder'>): number {
  return line.stock == null ? 0 : Math.max(0, line.quantityOrder - line.stock)
}
