// Quantity price breaks in one cell: "1:12.50; 100:10.80; 500:9.90" (from 1 piece 12.50 each, from 100 pieces 10.80 …).

import type { PriceBreak } from './types'
import { parseNumberText, type DecimalSeparator } from './units'

export const PRICE_BREAK_FORMAT = 'quantity:price pairs separated by \';\', e.g. \'1:12.50; 100:10.80; 500:9.90\''

export type PriceBreaksResult = { ok: true, breaks: PriceBreak[] } | { ok: false, reason: string }

/** Reads a price-break cell. A lone number is the unit price from one piece. */
export function parsePriceBreaks(raw: unknown, decimalSeparator: DecimalSeparator): PriceBreaksResult {
  if (typeof raw === 'number') {
    if (!Number.isFinite(raw) || raw < 0) return { ok: false, reason: `a price must be a number ≥ 0, got ${raw}` }
    return { ok: true, breaks: [{ minQuantity: 1, unitPrice: raw }] }
  }
  if (typeof raw !== 'string' || raw.trim() === '') return { ok: false, reason: `empty: expected ${PRICE_BREAK_FORMAT}` }
  const text = raw.trim()
  if (/[€$£¥]|\b(EUR|USD|GBP|CHF|SEK|NOK|DKK|PLN|CZK|JPY|CNY)\b/i.test(text)) {
    return { ok: false, reason: `'${text}': write prices without currency (the currency goes in the Currency column); expected ${PRICE_BREAK_FORMAT}` }
  }
  const parts = text.split(/[;\n]/).map(p => p.trim()).filter(p => p !== '')
  if (parts.length === 1 && !parts[0]!.includes(':')) {
    const price = parseNumberText(parts[0]!, decimalSeparator)
    if (!price.ok) return { ok: false, reason: `${price.reason}; expected ${PRICE_BREAK_FORMAT}` }
    if (price.value < 0) return { ok: false, reason: `price ${parts[0]} is negative` }
    return { ok: true, breaks: [{ minQuantity: 1, unitPrice: price.value }] }
  }
  const breaks: PriceBreak[] = []
  for (const part of parts) {
    const colon = part.indexOf(':')
    if (colon < 0) return { ok: false, reason: `'${part}' has no ':' between quantity and price; expected ${PRICE_BREAK_FORMAT}` }
    const quantityText = part.slice(0, colon).trim().replace(/\s*(\+|pcs|pc|pieces)$/i, '')
    const priceText = part.slice(colon + 1).trim()
    const quantity = parseNumberText(quantityText, decimalSeparator)
    if (!quantity.ok || !Number.isInteger(quantity.value) || quantity.value < 1) {
      return { ok: false, reason: `'${part}': the quantity '${quantityText}' must be a whole number of pieces ≥ 1; expected ${PRICE_BREAK_FORMAT}` }
    }
    const price = parseNumberText(priceText, decimalSeparator)
    if (!price.ok) return { ok: false, reason: `'${part}': the price ${price.reason}; expected ${PRICE_BREAK_FORMAT}` }
    if (price.value < 0) return { ok: false, reason: `'${part}': the price must not be negative` }
    const previous = breaks.at(-1)
    if (previous && quantity.value <= previous.minQuantity) {
      return { ok: false, reason: `quantities must increase from break to break: ${previous.minQuantity} is followed by ${quantity.value}` }
    }
    breaks.push({ minQuantity: quantity.value, unitPrice: price.value })
  }
  return { ok: true, breaks }
}

/** Writes breaks back in the cell format (decimal point). */
export function formatPriceBreaks(breaks: readonly PriceBreak[]): string {
  return breaks.map(b => `${b.minQuantity}:${b.unitPrice.toFixed(2)}`).join('; ')
}

/** What buying at the price breaks comes to; the one rule behind part matching and the BOM. */
export interface OrderAtBreaks {
  /** Pieces to order: at least the need, the MOQ and the first break. */
  orderQuantity: number
  /** Per piece, at the break that applies; null when there are no prices. */
  unitPrice: number | null
  /** The break that applies (pieces); null when there are no prices. */
  breakQuantity: number | null
  /** Why the order exceeds the need, if it does (the MOQ wins when both do). */
  raisedBy: 'moq' | 'first-price-break' | null
}

/**
 * Pieces to order and the unit price: order = max(need, MOQ, first break); the price is that of the largest break
 * not above the order, so every priced order has a price that really applies. The breaks may come in any order.
 */
export function orderAtBreaks(priceBreaks: readonly PriceBreak[], needed: number, minimumOrderQuantity?: number | null): OrderAtBreaks {
  const wanted = Math.max(0, Math.ceil(needed))
  let orderQuantity = Math.max(wanted, minimumOrderQuantity ?? 0)
  let raisedBy: OrderAtBreaks['raisedBy'] = orderQuantity > wanted ? 'moq' : null
  if (priceBreaks.length === 0) return { orderQuantity, unitPrice: null, breakQuantity: null, raisedBy }
  let first = priceBreaks[0]!
  for (const b of priceBreaks) if (b.minQuantity < first.minQuantity) first = b
  if (first.minQuantity > orderQuantity) {
    orderQuantity = first.minQuantity
    raisedBy = 'first-price-break'
  }
  let applying = first
  for (const b of priceBreaks) if (b.minQuantity <= orderQuantity && b.minQuantity > applying.minQuantity) applying = b
  return { orderQuantity, unitPrice: applying.unitPrice, breakQuantity: applying.minQuantity, raisedBy }
}

export interface PriceAtQuantity {
  /** per piece */
  unitPrice: number
  /** The break that applies (pieces). */
  breakQuantity: number
  /** Pieces to order: at least the quantity asked, the first break and the MOQ. */
  orderQuantity: number
  /** True when the quantity asked is below the first break, so more must be bought. */
  raisedToMinimum: boolean
}

/** orderAtBreaks for part matching: null when there are no prices. */
export function priceAtQuantity(priceBreaks: readonly PriceBreak[], quantity: number, minimumOrderQuantity = 1): PriceAtQuantity | null {
  const order = orderAtBreaks(priceBreaks, quantity, minimumOrderQuantity)
  if (order.unitPrice === null || order.breakQuantity === null) return null
  return { unitPrice: order.unitPrice, breakQuantity: order.breakQuantity, orderQuantity: order.orderQuantity, raisedToMinimum: order.raisedBy !== null }
}
