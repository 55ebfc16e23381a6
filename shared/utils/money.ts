// Money in Stratavolt: PostgreSQL `numeric(18, 6)` in the database (exact decimals, six places, since small parts
// are quoted in fractions of a cent). In TypeScript an amount is a plain number in the currency's unit (12.5 is
// 12.50 EUR) that always holds a six-place decimal: every sum or product goes through roundMoney, so binary noise
// (10.8 × 3 = 32.400000000000006) never reaches a total, a file or the database. Drizzle converts at the edge
// (numeric ⇄ number); amounts become text only through formatMoney / formatUnitPrice in shared/utils/format.ts.
// Exact up to 9 × 10⁹ in a currency (2⁵³ micro-units), far above any BOM.

/** Decimal places money keeps, here and in the database columns. */
export const MONEY_SCALE = 6
const MICRO = 10 ** MONEY_SCALE

/** The six-place decimal nearest to `value`. */
export function roundMoney(value: number): number {
  return Math.round(value * MICRO) / MICRO
}

/** Unit price × pieces, exact to the six places. */
export function extendedPrice(unitPrice: number, pieces: number): number {
  return roundMoney(unitPrice * pieces)
}
