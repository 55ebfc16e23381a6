// A bill of materials as released: an immutable snapshot that exports and the purchasing view read.
// Money in the line's currency (EUR for the demo); quantities are whole pieces.

export interface BomLine {
  /** stable key within the BOM: manufacturer + part number, or "manual-<n>" */
  key: string
  partNumber: string
  manufacturer: string
  description: string
  /** 'switch' | 'diode' | 'capacitor' | 'module' | 'manual' … */
  category: string
  /** reference positions this line fills, e.g. ["machine S1", "machine S4", "dc-link C1"] */
  references: string[]
  /** pieces for one converter set before build quantity */
  quantityPerUnit: number
  /** pieces for the build (× build quantity), rounded up */
  quantityBuild: number
  /** spare pieces (spares % of the build quantity, rounded up) */
  quantitySpares: number
  /** pieces to order: max(build + spares, MOQ) */
  quantityOrder: number
  /** the quantity break the unit price comes from */
  priceBreakQuantity: number | null
  unitPrice: number | null
  currency: string
  /** unitPrice × quantityOrder */
  extendedPrice: number | null
  moq: number | null
  leadTimeDays: number | null
  stock: number | null
  lifecycle: string | null
  supplier: string | null
  /** the catalogue part version it was priced from; null for hand-added lines */
  partVersionId: number | null
  /** line added by hand (e.g. heatsink), not from a part assignment */
  manual: boolean
  /** things purchasing should see: order raised to the MOQ or first price break, stock short, lifecycle, other currency */
  warnings?: string[]
}

export interface BomSnapshot {
  company: string
  designId: number
  designName: string
  designRevision: number
  topologySummary: string
  /** BOM revision (1, 2, …) */
  revision: number
  releasedAt: string
  releasedBy: string
  buildQuantity: number
  sparesPercent: number
  currency: string
  lines: BomLine[]
  /** pieces = sum of quantityOrder; extendedPrice sums the priced lines in `currency` only */
  totals: { lines: number, pieces: number, extendedPrice: number, unpricedLines: number, otherCurrencyLines?: number }
  /** per position: what fills it (for the positions table in the PDF) */
  positions: { side: string, position: string, partNumber: string, manufacturer: string, perConverter: number, seriesCount: number, parallelCount: number }[]
  /** summary rows of the design for the summary sheet: [label, value, unit] */
  designSummary: [string, string | number, string][]
  safetyNote: string
}

/** What purchasing records against one BOM line (keyed by BomLine.key). */
export interface BomPurchaseEntry {
  supplier?: string | null
  /** per piece, in the line's currency */
  quotedUnitPrice?: number | null
  orderReference?: string | null
}

/** Purchasing records by BomLine.key. */
export type BomPurchase = Record<string, BomPurchaseEntry>
