// Bill of materials from part assignments: group position fills by part, count pieces, apply build
// quantity, spares, MOQ and price breaks. Pure functions over plain data; quantities in pieces,
// money per piece in the part's currency.

import { partKey } from '../catalog/part-key'
import { orderAtBreaks } from '../catalog/prices'
import { extendedPrice as extendedPriceOf, roundMoney } from '../utils/money'
import { gateReasons } from './gates'
import type { BomLine, BomPositionRow, BomSnapshot } from './types'

export { diffBoms, type BomChange, type BomFieldChange } from './diff'
export { neutraliseFormula } from './formula-safety'
export { gateMark, gateReasons, unacknowledgedLines } from './gates'

export type BomSide = 'machine' | 'grid' | 'dc-link'

/** Unit price from `quantity` pieces upwards. */
export interface UnitPriceBreak {
  /** pieces */
  quantity: number
  /** per piece, in the part's currency */
  price: number
}

/** Catalogue data of the part that fills a position (the same for every fill of that part). */
export interface BomPartData {
  partNumber: string
  manufacturer: string
  description: string
  /** part or position kind: 'switch', 'diode', 'clamp-diode', 'switch-diode', 'capacitor' … */
  kind: string
  unitPriceBreaks: UnitPriceBreak[]
  currency?: string | null
  /** pieces */
  moq?: number | null
  /** days */
  leadTimeDays?: number | null
  /** pieces */
  stock?: number | null
  lifecycle?: string | null
  supplier?: string | null
  partVersionId?: number | null
  /** component engineering's approval; false gates the line (see gates.ts) */
  approved?: boolean | null
}

/** A semiconductor position of a converter and the part that fills it. */
export interface PositionFill extends BomPartData {
  side: BomSide
  /** position name in the leg, e.g. "S1", "Dc1+" */
  position: string
  /** identical positions in one phase leg */
  positionsPerPhase: number
  /** phase legs (3 for a three-phase converter) */
  phases: number
  /** positions one package covers: 1 single, 2 half-bridge, 6 six-pack, 4 or more for a three-level leg module */
  perPackage: number
  /** parts in series per position (e.g. unit diodes of a clamp-diode stack) */
  seriesCount: number
  /** parts in parallel per position */
  parallelCount: number
  /**
   * Module that fills several positions (see coverage.ts): packages per converter set, counted directly
   * instead of positions / perPackage. The positions it covers come in `covered`.
   */
  packagesPerConverter?: number
  /** the module's slots no position uses, shown once on the line */
  unusedSlots?: string[]
}

/** A position filled by another position's module: listed on the positions sheet, never bought again. */
export interface CoveredPosition {
  side: BomSide
  position: string
  /** the host position whose package holds it */
  coveredBy: string
  partNumber: string
  manufacturer: string
}

/** A capacitor bank position: `count` pieces per converter set, counted directly. */
export interface CapacitorFill extends BomPartData {
  /** the converter it belongs to, or 'dc-link': a back-to-back pair's shared link, one bank bought once (from the engine's explicit side, never a label) */
  side: BomSide
  /** position name, e.g. "C1" */
  position: string
  /** pieces per converter set (positions × seriesCount × parallelCount) */
  count: number
  /** capacitors in series per string of the bank (default 1) */
  seriesCount?: number
  /** strings in parallel (default 1) */
  parallelCount?: number
}

/** A line added by hand (heatsink, busbar, gate driver …). */
export interface ManualLineInput {
  description: string
  partNumber?: string | null
  manufacturer?: string | null
  /** pieces per converter set */
  quantityPerUnit: number
  /** per piece */
  unitPrice?: number | null
  currency?: string | null
}

/** A position the design needs but the catalogue has no kind for (the matrix converter's filter inductors): listed to be specified by hand. */
export interface SpecifiedLineInput {
  /** position name, e.g. "Lf" */
  position: string
  side: string
  /** what to buy, in words (rating figures), ending with the note that it is specified by hand */
  description: string
  category: string
  /** pieces per converter set */
  quantityPerUnit: number
}

export interface BomBuildInput {
  positions: PositionFill[]
  capacitors?: CapacitorFill[]
  manualLines?: ManualLineInput[]
  /** design positions with no catalogue kind (no part, no price): one line each, key `specify-<side>-<position>` */
  specified?: SpecifiedLineInput[]
  covered?: CoveredPosition[]
  /** converter sets to build */
  buildQuantity: number
  /** spare pieces as % of the build quantity of each line (0…100) */
  sparesPercent: number
  /** currency of the totals; default 'EUR' */
  currency?: string
}

export interface BomBuildResult {
  lines: BomLine[]
  totals: BomSnapshot['totals']
  positions: BomSnapshot['positions']
}

export interface BomInputIssue {
  /** dotted path of the field, e.g. "positions.2.perPackage" */
  field: string
  message: string
}

/** Input the BOM cannot be built from; the route answers 422 with `issues`. */
export class BomInputError extends Error {
  readonly issues: BomInputIssue[]

  constructor(issues: BomInputIssue[]) {
    super(issues.map(i => `${i.field}: ${i.message}`).join('; '))
    this.name = 'BomInputError'
    this.issues = issues
  }
}

/** Ceil that ignores binary noise (1000 × 1.1 % must give 11 spares, not 12). */
function ceilPieces(value: number): number {
  return Math.ceil(Math.round(value * 1e9) / 1e9)
}

/** Line key: one line per part, by the catalogue's partKey() (so it stays stable across revisions and spellings). */
export function bomLineKey(manufacturer: string, partNumber: string): string {
  return partKey(manufacturer, partNumber)
}

function validWholeNumber(value: unknown, min: number): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= min
}

function checkPartData(part: BomPartData, at: string, issues: BomInputIssue[]): void {
  if (typeof part.partNumber !== 'string' || part.partNumber.trim() === '') issues.push({ field: `${at}.partNumber`, message: 'a part number is required' })
  if (typeof part.manufacturer !== 'string' || part.manufacturer.trim() === '') issues.push({ field: `${at}.manufacturer`, message: 'a manufacturer is required' })
  if (!Array.isArray(part.unitPriceBreaks)) {
    issues.push({ field: `${at}.unitPriceBreaks`, message: 'must be a list of { quantity, price } (empty when there is no price)' })
  }
  else {
    part.unitPriceBreaks.forEach((b, i) => {
      if (!validWholeNumber(b?.quantity, 1)) issues.push({ field: `${at}.unitPriceBreaks.${i}.quantity`, message: `must be a whole number of pieces ≥ 1, got ${String(b?.quantity)}` })
      if (typeof b?.price !== 'number' || !Number.isFinite(b.price) || b.price < 0) issues.push({ field: `${at}.unitPriceBreaks.${i}.price`, message: `must be a price ≥ 0, got ${String(b?.price)}` })
    })
  }
  if (part.moq != null && !validWholeNumber(part.moq, 1)) issues.push({ field: `${at}.moq`, message: `must be a whole number of pieces ≥ 1 or empty, got ${String(part.moq)}` })
}

function checkInput(input: BomBuildInput): void {
  const issues: BomInputIssue[] = []
  if (!validWholeNumber(input.buildQuantity, 1)) issues.push({ field: 'buildQuantity', message: `must be a whole number of converter sets ≥ 1, got ${String(input.buildQuantity)}` })
  if (typeof input.sparesPercent !== 'number' || !Number.isFinite(input.sparesPercent) || input.sparesPercent < 0 || input.sparesPercent > 100) {
    issues.push({ field: 'sparesPercent', message: `must be a percentage from 0 to 100, got ${String(input.sparesPercent)}` })
  }
  if (!Array.isArray(input.positions)) issues.push({ field: 'positions', message: 'must be a list of position fills' })
  ;(Array.isArray(input.positions) ? input.positions : []).forEach((fill, i) => {
    const at = `positions.${i}`
    checkPartData(fill, at, issues)
    if (!['machine', 'grid', 'dc-link'].includes(fill.side)) issues.push({ field: `${at}.side`, message: `must be 'machine', 'grid' or 'dc-link', got ${String(fill.side)}` })
    if (typeof fill.position !== 'string' || fill.position.trim() === '') issues.push({ field: `${at}.position`, message: 'a position name is required' })
    for (const field of ['positionsPerPhase', 'phases', 'perPackage', 'seriesCount', 'parallelCount'] as const) {
      if (!validWholeNumber(fill[field], 1)) issues.push({ field: `${at}.${field}`, message: `must be a whole number ≥ 1, got ${String(fill[field])}` })
    }
    if (fill.packagesPerConverter !== undefined && !validWholeNumber(fill.packagesPerConverter, 1)) issues.push({ field: `${at}.packagesPerConverter`, message: `must be a whole number of packages ≥ 1, got ${String(fill.packagesPerConverter)}` })
  })
  ;(input.capacitors ?? []).forEach((fill, i) => {
    const at = `capacitors.${i}`
    checkPartData(fill, at, issues)
    if (!['machine', 'grid', 'dc-link'].includes(fill.side)) issues.push({ field: `${at}.side`, message: `must be 'machine', 'grid' or 'dc-link', got ${String(fill.side)}` })
    if (typeof fill.position !== 'string' || fill.position.trim() === '') issues.push({ field: `${at}.position`, message: 'a position name is required' })
    if (!validWholeNumber(fill.count, 1)) issues.push({ field: `${at}.count`, message: `must be a whole number of pieces ≥ 1, got ${String(fill.count)}` })
    for (const field of ['seriesCount', 'parallelCount'] as const) {
      if (fill[field] !== undefined && !validWholeNumber(fill[field], 1)) issues.push({ field: `${at}.${field}`, message: `must be a whole number ≥ 1, got ${String(fill[field])}` })
    }
  })
  ;(input.manualLines ?? []).forEach((line, i) => {
    const at = `manualLines.${i}`
    if (typeof line.description !== 'string' || line.description.trim() === '') issues.push({ field: `${at}.description`, message: 'a description is required' })
    if (!validWholeNumber(line.quantityPerUnit, 1)) issues.push({ field: `${at}.quantityPerUnit`, message: `must be a whole number of pieces ≥ 1, got ${String(line.quantityPerUnit)}` })
    if (line.unitPrice != null && (typeof line.unitPrice !== 'number' || !Number.isFinite(line.unitPrice) || line.unitPrice < 0)) {
      issues.push({ field: `${at}.unitPrice`, message: `must be a price ≥ 0 or empty, got ${String(line.unitPrice)}` })
    }
  })
  // Sum-then-divide needs one package size per part.
  const perPackageOf = new Map<string, { perPackage: number, index: number }>()
  ;(Array.isArray(input.positions) ? input.positions : []).forEach((fill, i) => {
    if (typeof fill.partNumber !== 'string' || typeof fill.manufacturer !== 'string' || fill.packagesPerConverter !== undefined) return
    const key = bomLineKey(fill.manufacturer, fill.partNumber)
    const seen = perPackageOf.get(key)
    if (!seen) perPackageOf.set(key, { perPackage: fill.perPackage, index: i })
    else if (seen.perPackage !== fill.perPackage) {
      issues.push({ field: `positions.${i}.perPackage`, message: `${fill.perPackage} differs from ${seen.perPackage} given for the same part ${fill.partNumber} at positions.${seen.index}` })
    }
  })
  if (issues.length > 0) throw new BomInputError(issues)
}

export interface OrderPricing {
  /** pieces to order */
  quantityOrder: number
  /** the break the price comes from (pieces); null when unpriced */
  priceBreakQuantity: number | null
  unitPrice: number | null
  /** why the order exceeds the need, if it does */
  raisedBy: 'moq' | 'first-price-break' | null
}

/** The catalogue's price-break rule (orderAtBreaks) in the BOM's terms. */
export function priceOrder(needed: number, breaks: readonly UnitPriceBreak[], moq: number | null | undefined): OrderPricing {
  const order = orderAtBreaks(breaks.map(b => ({ minQuantity: b.quantity, unitPrice: b.price })), needed, moq)
  return { quantityOrder: order.orderQuantity, priceBreakQuantity: order.breakQuantity, unitPrice: order.unitPrice, raisedBy: order.raisedBy }
}

interface Group {
  key: string
  part: BomPartData
  category: string
  /** positions (semiconductors) summed before dividing by perPackage */
  positions: number
  perPackage: number
  /** capacitor pieces, counted directly */
  directPieces: number
  references: string[]
  unusedSlots: string[]
}

function reference(side: string, position: string, count: number): string {
  return count > 1 ? `${side} ${position.trim()} (×${count})` : `${side} ${position.trim()}`
}

/**
 * Lines of the BOM, in order of first appearance (positions, capacitors, then manual lines).
 *
 * Pieces per converter set for a part = ceil(Σ positionsPerPhase × phases × seriesCount ×
 * parallelCount / perPackage) + Σ capacitor counts. Positions sharing a part are summed first and
 * then divided, so a half-bridge module assigned to S1 and S2 counts 3 modules per three-phase set,
 * not ceil(3/2) + ceil(3/2) = 4. The caller assigns a multi-position package only to positions it
 * really covers together (a half-bridge to one upper and one lower switch of the same leg).
 * Then build = per set × build quantity, spares = ceil(build × spares %), order = max(build +
 * spares, MOQ) (raised to the first price break if that is higher), extended = unit × order.
 *
 * Throws BomInputError naming each bad field.
 */
export function buildBomLines(input: BomBuildInput): BomBuildResult {
  checkInput(input)
  const currency = input.currency ?? 'EUR'
  const groups = new Map<string, Group>()
  const positions: BomPositionRow[] = []

  const groupOf = (part: BomPartData, category: string, perPackage: number): Group => {
    const key = bomLineKey(part.manufacturer, part.partNumber)
    let group = groups.get(key)
    if (!group) {
      group = { key, part, category, positions: 0, perPackage, directPieces: 0, references: [], unusedSlots: [] }
      groups.set(key, group)
    }
    return group
  }

  for (const fill of input.positions) {
    const isModule = fill.packagesPerConverter !== undefined
    const group = groupOf(fill, isModule || fill.perPackage > 1 ? 'module' : fill.kind, fill.perPackage)
    // A module host is counted in packages; other fills in positions, divided by perPackage below.
    const count = isModule ? fill.packagesPerConverter! : fill.positionsPerPhase * fill.phases * fill.seriesCount * fill.parallelCount
    if (isModule) group.directPieces += count
    else group.positions += count
    group.references.push(reference(fill.side, fill.position, count))
    for (const slot of fill.unusedSlots ?? []) if (!group.unusedSlots.includes(slot)) group.unusedSlots.push(slot)
    positions.push({ side: fill.side, position: fill.position.trim(), partNumber: fill.partNumber.trim(), manufacturer: fill.manufacturer.trim(), perConverter: count, seriesCount: fill.seriesCount, parallelCount: fill.parallelCount })
  }
  for (const c of input.covered ?? []) {
    const host = groups.get(bomLineKey(c.manufacturer, c.partNumber))
    host?.references.push(`${c.side} ${c.position.trim()} (in ${c.coveredBy})`)
    positions.push({ side: c.side, position: c.position.trim(), partNumber: c.partNumber.trim(), manufacturer: c.manufacturer.trim(), perConverter: 0, seriesCount: 1, parallelCount: 1, coveredBy: c.coveredBy })
  }
  for (const fill of input.capacitors ?? []) {
    const side = fill.side
    const group = groupOf(fill, 'capacitor', 1)
    group.directPieces += fill.count
    const series = fill.seriesCount ?? 1
    const parallel = fill.parallelCount ?? 1
    group.references.push(series * parallel > 1 ? `${side} ${fill.position.trim()} (${series}s×${parallel}p = ${fill.count})` : reference(side, fill.position, fill.count))
    positions.push({ side, position: fill.position.trim(), partNumber: fill.partNumber.trim(), manufacturer: fill.manufacturer.trim(), perConverter: fill.count, seriesCount: series, parallelCount: parallel })
  }

  const lines: BomLine[] = []
  for (const group of groups.values()) {
    const part = group.part
    const quantityPerUnit = Math.ceil(group.positions / group.perPackage) + group.directPieces
    const lineCurrency = part.currency ?? currency
    lines.push(finishLine({
      key: group.key,
      partNumber: part.partNumber.trim(),
      manufacturer: part.manufacturer.trim(),
      description: part.description ?? '',
      category: group.category,
      references: group.references,
      currency: lineCurrency,
      moq: part.moq ?? null,
      leadTimeDays: part.leadTimeDays ?? null,
      stock: part.stock ?? null,
      lifecycle: part.lifecycle ?? null,
      supplier: part.supplier ?? null,
      partVersionId: part.partVersionId ?? null,
      manual: false,
      approved: part.approved ?? null,
      ...(group.unusedSlots.length > 0 ? { unusedSlots: group.unusedSlots } : {}),
    }, quantityPerUnit, input, part.unitPriceBreaks, currency))
  }
  ;(input.manualLines ?? []).forEach((manual, i) => {
    const breaks = manual.unitPrice != null ? [{ quantity: 1, price: manual.unitPrice }] : []
    lines.push(finishLine({
      key: `manual-${i + 1}`,
      partNumber: manual.partNumber?.trim() ?? '',
      manufacturer: manual.manufacturer?.trim() ?? '',
      description: manual.description.trim(),
      category: 'manual',
      references: [],
      currency: manual.currency ?? currency,
      moq: null,
      leadTimeDays: null,
      stock: null,
      lifecycle: null,
      supplier: null,
      partVersionId: null,
      manual: true,
    }, manual.quantityPerUnit, input, breaks, currency))
  })

  for (const spec of input.specified ?? []) {
    lines.push(finishLine({
      key: `specify-${spec.side}-${spec.position}`,
      partNumber: '',
      manufacturer: '',
      description: spec.description,
      category: spec.category,
      references: [`${spec.side} ${spec.position}`],
      currency,
      moq: null,
      leadTimeDays: null,
      stock: null,
      lifecycle: null,
      supplier: null,
      partVersionId: null,
      manual: true,
    }, spec.quantityPerUnit, input, [], currency))
  }

  return { lines, totals: bomTotals(lines, currency), positions }
}

type LineIdentity = Omit<BomLine, 'quantityPerUnit' | 'quantityBuild' | 'quantitySpares' | 'quantityOrder' | 'priceBreakQuantity' | 'unitPrice' | 'extendedPrice' | 'warnings' | 'gate'>

function finishLine(identity: LineIdentity, quantityPerUnit: number, input: BomBuildInput, breaks: readonly UnitPriceBreak[], bomCurrency: string): BomLine {
  const quantityBuild = quantityPerUnit * input.buildQuantity
  const quantitySpares = ceilPieces(quantityBuild * input.sparesPercent / 100)
  const pricing = priceOrder(quantityBuild + quantitySpares, breaks, identity.moq)
  const warnings: string[] = []
  if (pricing.raisedBy === 'moq') warnings.push(`order raised from ${quantityBuild + quantitySpares} to the MOQ of ${pricing.quantityOrder} pcs`)
  if (pricing.raisedBy === 'first-price-break') warnings.push(`order raised from ${quantityBuild + quantitySpares} to the first price break of ${pricing.quantityOrder} pcs`)
  if (pricing.unitPrice === null) warnings.push('no price')
  if (identity.stock != null && identity.stock < pricing.quantityOrder) warnings.push(`stock ${identity.stock} pcs is below the order of ${pricing.quantityOrder} pcs`)
  if (identity.lifecycle === 'nrnd') warnings.push('lifecycle: not recommended for new designs')
  if (identity.lifecycle === 'obsolete') warnings.push('lifecycle: obsolete')
  if (pricing.unitPrice !== null && identity.currency !== bomCurrency) warnings.push(`priced in ${identity.currency}, not in the BOM currency ${bomCurrency}: not in the total`)
  if (identity.approved === false) warnings.push('not approved by component engineering')
  if (identity.unusedSlots?.length) warnings.push(`unused in the package: ${identity.unusedSlots.join(', ')} (part of the module, not bought apart)`)
  const gate = identity.manual ? [] : gateReasons(identity)
  return {
    ...identity,
    ...(gate.length > 0 ? { gate } : {}),
    quantityPerUnit,
    quantityBuild,
    quantitySpares,
    quantityOrder: pricing.quantityOrder,
    priceBreakQuantity: pricing.priceBreakQuantity,
    unitPrice: pricing.unitPrice,
    extendedPrice: pricing.unitPrice === null ? null : extendedPriceOf(pricing.unitPrice, pricing.quantityOrder),
    ...(warnings.length > 0 ? { warnings } : {}),
  }
}

/** Totals: pieces to order, and the extended price of the priced lines in the BOM currency (others are counted apart, never converted). */
export function bomTotals(lines: readonly BomLine[], currency: string): BomSnapshot['totals'] {
  let pieces = 0
  let extendedPrice = 0
  let unpricedLines = 0
  let otherCurrencyLines = 0
  for (const line of lines) {
    pieces += line.quantityOrder
    if (line.extendedPrice === null) unpricedLines++
    else if (line.currency !== currency) otherCurrencyLines++
    else extendedPrice += line.extendedPrice
  }
  return { lines: lines.length, pieces, extendedPrice: roundMoney(extendedPrice), unpricedLines, otherCurrencyLines }
}

/** Everything of a snapshot that does not come from the lines. */
export type BomSnapshotHeader = Omit<BomSnapshot, 'lines' | 'totals' | 'positions' | 'buildQuantity' | 'sparesPercent' | 'currency'>

/** A complete snapshot ready to be stored as released. */
export function buildBomSnapshot(header: BomSnapshotHeader, input: BomBuildInput): BomSnapshot {
  const built = buildBomLines(input)
  return {
    ...header,
    buildQuantity: input.buildQuantity,
    sparesPercent: input.sparesPercent,
    currency: input.currency ?? 'EUR',
    lines: built.lines,
    totals: built.totals,
    positions: built.positions,
  }
}
