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
  /** component engineering's approval of the part (null for hand-added lines) */
  approved?: boolean | null
  /** why the line needs a design engineer's acknowledgement before release: 'unapproved' | 'nrnd' | 'obsolete' */
  gate?: BomGateReason[]
  /** the recorded acknowledgement that lets a gated line be released */
  acknowledgement?: BomAcknowledgement | null
  /** module slots no position of the design uses (shown once; they are part of the package, not bought apart) */
  unusedSlots?: string[]
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
  positions: BomPositionRow[]
  /** summary rows of the design for the summary sheet: [label, value, unit] */
  designSummary: [string, string | number, string][]
  safetyNote: string
}

export type BomGateReason = 'unapproved' | 'nrnd' | 'obsolete'

export interface BomAcknowledgement {
  reason: string
  by: string
  /** ISO time */
  at: string
}

/** One position of the design and what fills it (the positions sheet of the exports). */
export interface BomPositionRow {
  side: string
  position: string
  partNumber: string
  manufacturer: string
  /** pieces bought for this position per converter set (0 when another position's module covers it) */
  perConverter: number
  seriesCount: number
  parallelCount: number
  /** the position whose package also holds this one ("covered by S1"): nothing extra is bought */
  coveredBy?: string
}

/** Purchasing status of one line, in the order it moves. */
export const PURCHASE_STATUSES = ['to-quote', 'quoted', 'ordered', 'confirmed', 'received'] as const
export type PurchaseStatus = (typeof PURCHASE_STATUSES)[number]

/** Fields purchasing edits on a line (the page sends one at a time). */
export type PurchaseField = 'supplier' | 'quotedUnitPrice' | 'orderReference' | 'quoteCurrency' | 'status' | 'promisedDelivery'

/** What purchasing records against one BOM line (keyed by BomLine.key). */
export interface BomPurchaseEntry {
  supplier?: string | null
  /** per piece, in quoteCurrency (default the line's currency) */
  quotedUnitPrice?: number | null
  quoteCurrency?: string | null
  orderReference?: string | null
  status?: PurchaseStatus
  /** ISO date each status was reached */
  statusDates?: Partial<Record<PurchaseStatus, string>>
  /** ISO date (yyyy-mm-dd) the supplier promised delivery */
  promisedDelivery?: string | null
}

/** Purchasing records by BomLine.key. */
export type BomPurchase = Record<string, BomPurchaseEntry>
