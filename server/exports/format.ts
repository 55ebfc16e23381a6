// Number and date text for the printed exports (PDF). Spreadsheets get real numbers instead.

const money = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 })
const unitMoney = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 4 })
const pieces = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 })

/** 12345.6 → "12,345.60" (two decimals, thousands separated). */
export function formatMoney(value: number | null | undefined): string {
  return value == null ? '—' : money.format(value)
}

/** Unit prices keep up to four decimals (small parts are quoted in fractions of a cent). */
export function formatUnitPrice(value: number | null | undefined): string {
  return value == null ? '—' : unitMoney.format(value)
}

/** Whole pieces, thousands separated. */
export function formatPieces(value: number | null | undefined): string {
  return value == null ? '—' : pieces.format(value)
}

/** A number with `digits` significant decimals for engineering tables; "—" when missing. */
export function formatNumber(value: number | null | undefined, digits = 1): string {
  if (value == null || !Number.isFinite(value)) return '—'
  return new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(value)
}

/** ISO date-time → "2026-03-14 09:30 UTC"; anything unparsable is shown as given. */
export function formatDateTime(iso: string): string {
  const date = new Date(iso)
  if (Number.isNaN(date.getTime())) return iso
  return `${date.toISOString().slice(0, 10)} ${date.toISOString().slice(11, 16)} UTC`
}
