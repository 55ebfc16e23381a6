// Number and date text for the printed exports (PDF), in the requesting user's locale, through the one helper
// (shared/utils/format.ts). Spreadsheets get real numbers instead (with the locale's text where text is written).
import * as fmt from '../../shared/utils/format'

/** 12345.6 → "12,345.60" (en-GB) / "12.345,60" (de-DE): two decimals, thousands separated. */
export function formatMoney(value: number | null | undefined, locale: string = fmt.DEFAULT_LOCALE): string {
  return fmt.formatMoney(value, null, locale)
}

/** Unit prices keep up to four decimals (small parts are quoted in fractions of a cent). */
export function formatUnitPrice(value: number | null | undefined, locale: string = fmt.DEFAULT_LOCALE): string {
  return fmt.formatUnitPrice(value, locale)
}

/** Whole pieces, thousands separated. */
export function formatPieces(value: number | null | undefined, locale: string = fmt.DEFAULT_LOCALE): string {
  return fmt.formatInteger(value, locale)
}

/** A number with `digits` decimals for engineering tables; "—" when missing. */
export function formatNumber(value: number | null | undefined, digits = 1, locale: string = fmt.DEFAULT_LOCALE): string {
  return fmt.formatNumber(value, locale, { decimals: digits })
}

/** ISO date-time → "14 Mar 2026, 09:30 UTC" (en-GB); anything unparsable is shown as given. */
export function formatDateTime(iso: string, locale: string = fmt.DEFAULT_LOCALE): string {
  return fmt.formatDateTime(iso, locale)
}
