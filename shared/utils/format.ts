// The one place numbers, money and dates become text, on Intl, for the pages, the PDFs and the workbooks alike.
// Every function takes the locale (the user's choice, else the company default) as its last argument; dates are
// always shown in UTC so that the server-rendered page and the browser show the very same text.

/** The locales a user may choose. */
export const LOCALES = ['en-GB', 'de-DE', 'sv-SE', 'en-US'] as const
export type AppLocale = typeof LOCALES[number]

export const LOCALE_LABELS: Record<AppLocale, string> = {
  'en-GB': 'English (United Kingdom): 1,234.5 · 14 Mar 2026',
  'de-DE': 'Deutsch (Deutschland): 1.234,5 · 14.03.2026',
  'sv-SE': 'Svenska (Sverige): 1 234,5 · 14 mars 2026',
  'en-US': 'English (United States): 1,234.5 · Mar 14, 2026',
}

/** Used when neither the user nor the company chose. */
export const DEFAULT_LOCALE: AppLocale = 'en-GB'

export function isAppLocale(value: unknown): value is AppLocale {
  return typeof value === 'string' && (LOCALES as readonly string[]).includes(value)
}

/** The locale to format in: the user's choice, else the company default, else en-GB. */
export function resolveLocale(userChoice?: string | null, companyDefault?: string | null): AppLocale {
  if (isAppLocale(userChoice)) return userChoice
  if (isAppLocale(companyDefault)) return companyDefault
  return DEFAULT_LOCALE
}

// Intl formatters are costly to build and are asked for in long tables: one per locale and option set.
const cache = new Map<string, Intl.NumberFormat | Intl.DateTimeFormat>()
function numberFormat(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `n|${locale}|${JSON.stringify(options)}`
  let f = cache.get(key) as Intl.NumberFormat | undefined
  if (!f) cache.set(key, f = new Intl.NumberFormat(resolveLocale(locale), options))
  return f
}
function dateFormat(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `d|${locale}|${JSON.stringify(options)}`
  let f = cache.get(key) as Intl.DateTimeFormat | undefined
  if (!f) cache.set(key, f = new Intl.DateTimeFormat(resolveLocale(locale), { timeZone: 'UTC', ...options }))
  return f
}

const missing = (value: number | null | undefined): value is null | undefined => value == null || !Number.isFinite(value)

export interface NumberOptions {
  /** Fixed decimals (min = max). */
  decimals?: number
  /** At most this many decimals (default 6). */
  maxDecimals?: number
  /** At most this many significant digits (overrides the decimals). */
  significant?: number
  /** Thousands separators (default on). */
  grouping?: boolean
}

/** A plain number: formatNumber(1234.5, 'de-DE') → "1.234,5"; sv-SE → "1 234,5" (U+00A0 grouping); "—" when missing. */
export function formatNumber(value: number | null | undefined, locale: string = DEFAULT_LOCALE, options: NumberOptions = {}): string {
  if (missing(value)) return '—'
  const o: Intl.NumberFormatOptions = { useGrouping: options.grouping ?? true }
  if (options.significant !== undefined) o.maximumSignificantDigits = options.significant
  else if (options.decimals !== undefined) Object.assign(o, { minimumFractionDigits: options.decimals, maximumFractionDigits: options.decimals })
  else o.maximumFractionDigits = options.maxDecimals ?? 6
  return numberFormat(locale, o).format(value)
}

const SI_PREFIXES: [number, string][] = [[1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p']]

export interface SiOptions {
  /** Keep trailing zeros to the significant digits ("4.70 mF", the results tables) instead of dropping them ("4.7 mF"). */
  fixed?: boolean
}

/**
 * A value in SI base units with a prefix, rounded to `digits` significant digits first (999.96 V → "1 kV", not
 * "1000 V"): formatSi(1200, 'V') → "1.2 kV" (en-GB) / "1,2 kV" (de-DE); negative values carry a true minus sign.
 */
export function formatSi(value: number | null | undefined, unit: string, digits = 4, locale: string = DEFAULT_LOCALE, options: SiOptions = {}): string {
  if (missing(value)) return '—'
  if (value === 0) return `0 ${unit}`.trim()
  const rounded = Number(value.toPrecision(digits))
  const magnitude = Math.abs(rounded)
  const [factor, prefix] = SI_PREFIXES.find(([f]) => magnitude >= f * (1 - 1e-12)) ?? SI_PREFIXES[SI_PREFIXES.length - 1]!
  const scaled = Number((rounded / factor).toPrecision(digits))
  const o: Intl.NumberFormatOptions = { useGrouping: false, maximumSignificantDigits: digits }
  if (options.fixed) o.minimumSignificantDigits = digits
  return `${numberFormat(locale, o).format(scaled).replace('-', '−')} ${prefix}${unit}`.trim()
}

/** Whole pieces, thousands separated: 12345 → "12,345" (en-GB), "12.345" (de-DE). */
export function formatInteger(value: number | null | undefined, locale: string = DEFAULT_LOCALE): string {
  return formatNumber(missing(value) ? value : Math.round(value), locale, { decimals: 0 })
}

/** A money amount with two decimals and its currency code after it: 1234.5 → "1,234.50 EUR" / "1.234,50 EUR". */
export function formatMoney(value: number | null | undefined, currency: string | null = 'EUR', locale: string = DEFAULT_LOCALE): string {
  if (missing(value)) return '—'
  const amount = formatNumber(value, locale, { decimals: 2 })
  return currency ? `${amount} ${currency}` : amount
}

/** A unit price: two to four decimals (small parts are quoted in fractions of a cent), no currency. */
export function formatUnitPrice(value: number | null | undefined, locale: string = DEFAULT_LOCALE): string {
  if (missing(value)) return '—'
  return numberFormat(locale, { minimumFractionDigits: 2, maximumFractionDigits: 4 }).format(value)
}

function toDate(value: string | number | Date | null | undefined): Date | null {
  if (value === null || value === undefined || value === '') return null
  const date = value instanceof Date ? value : new Date(value)
  return Number.isNaN(date.getTime()) ? null : date
}

/** A day: "14 Mar 2026" (en-GB), "14.03.2026" (de-DE), "14 mars 2026" (sv-SE), "Mar 14, 2026" (en-US); "—" when missing. */
export function formatDate(value: string | number | Date | null | undefined, locale: string = DEFAULT_LOCALE): string {
  const date = toDate(value)
  return date ? dateFormat(locale, { dateStyle: 'medium' }).format(date) : '—'
}

/** A moment, in UTC and saying so: "14 Mar 2026, 09:30 UTC" (en-GB), "14.03.2026, 09:30 UTC" (de-DE). */
export function formatDateTime(value: string | number | Date | null | undefined, locale: string = DEFAULT_LOCALE): string {
  const date = toDate(value)
  if (!date) return typeof value === 'string' && value ? value : '—'
  return `${dateFormat(locale, { dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23' }).format(date)} UTC`
}

/** The decimal mark of a locale: ',' for de-DE and sv-SE, '.' for en-GB and en-US. */
export function decimalMark(locale: string = DEFAULT_LOCALE): ',' | '.' {
  return numberFormat(locale, {}).formatToParts(1.5).find(p => p.type === 'decimal')?.value === ',' ? ',' : '.'
}

/** A count with its noun in the right number: count(1, 'row') → "1 row", count(0, 'part') → "0 parts", count(1200, 'line') → "1,200 lines". */
export function count(n: number, singular: string, plural = `${singular}s`, locale: string = DEFAULT_LOCALE): string {
  return `${formatInteger(n, locale)} ${n === 1 ? singular : plural}`
}
