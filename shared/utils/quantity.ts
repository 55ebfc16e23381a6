// What an engineer types into a form field, read as one SI value: "0.69 kV", "4k", "4,5 kHz" (decimal-comma
// locale), "60n", "2 kA/µs" (µ also written "u"), and shown back in one canonical form. A unit that does not fit
// the field is refused with a message, never reinterpreted. Numbers and units are read by the catalogue's
// parser (shared/catalog/units.ts), so a cell and a field understand the same notation.
import { parseNumberText, prefixFactor, recogniseOtherQuantity, splitQuantityText, UNIT_SPECS, unitFactor, type DecimalSeparator } from '../catalog/units'
import { decimalMark, formatSi } from './format'

export interface QuantityField {
  /**
   * SI base unit of the field, a key of UNIT_SPECS: 'V', 'A', 'Hz', 'H', 'A/s', '°C', '%' (a fraction: 85 % → 0.85),
   * '' (a plain number); or a price in a currency, its ISO 4217 code ('EUR'): "1,5k" or "2 k€".
   */
  unit: string
  /** The user's locale (BCP 47, e.g. 'de-DE'): decides the decimal mark. */
  locale: string
  /** The field's label, named in every message. */
  label: string
  /** Lowest and highest allowed value, in the SI base unit (inclusive). */
  min?: number
  max?: number
  /** Zero and below refused (a frequency, a DC link). */
  positive?: boolean
  /** Empty is allowed (the value becomes undefined). */
  optional?: boolean
}

export type FieldQuantity = { ok: true, value: number | undefined } | { ok: false, message: string }

// Units a bare prefix may stand in front of without the unit ("4k" in a frequency field); not °C, %, plain numbers.
const PREFIXABLE = new Set(['V', 'A', 'Hz', 'H', 'A/s', 'W', 'Ω', 'F', 'J', 's'])

// Prices: the currency's code or symbol, with k or M in front ("2 k€", "1.5 MSEK") or k / M alone ("1,5k").
const MONEY_PREFIXES: Readonly<Record<string, number>> = { k: 1e3, K: 1e3, M: 1e6 }
const CURRENCY_SYMBOLS: Readonly<Record<string, readonly string[]>> = { EUR: ['€'], USD: ['$', 'US$'], GBP: ['£'], SEK: ['kr'], NOK: ['kr'], DKK: ['kr'], CHF: ['Fr.', 'Fr'], JPY: ['¥'], CNY: ['¥'] }

/** A price field's unit: a three-letter currency code. */
export const isCurrencyUnit = (unit: string) => /^[A-Z]{3}$/.test(unit)

/** Scale of the unit text typed after a price in `currency` ("k€" → 1000), or null when it names no such price. */
function moneyFactor(unitText: string, currency: string): number | null {
  const compact = unitText.replace(/\s+/g, '')
  if (compact === '') return 1
  for (const spelling of [currency, ...(CURRENCY_SYMBOLS[currency] ?? [])]) {
    if (!compact.toLowerCase().endsWith(spelling.toLowerCase())) continue
    const prefix = compact.slice(0, compact.length - spelling.length)
    if (prefix === '') return 1
    if (Object.hasOwn(MONEY_PREFIXES, prefix)) return MONEY_PREFIXES[prefix]!
  }
  return Object.hasOwn(MONEY_PREFIXES, compact) ? MONEY_PREFIXES[compact]! : null
}

/** The decimal mark of a locale (the one helper in ./format): ',' for de-DE and sv-SE, '.' for en-GB and en-US. */
export const decimalMarkOf: (locale: string) => DecimalSeparator = decimalMark

function localised(text: string, mark: DecimalSeparator): string {
  return mark === ',' ? text.replace(/(\d)\.(\d)/g, '$1,$2') : text
}

/** Unit as shown: di/dt in A/µs, the rest in its own symbol. */
function shownUnit(unit: string): string {
  return unit === 'A/s' ? 'A/µs' : unit
}

/** The canonical text of a value in `unit` for `locale`: 1100 V → "1.1 kV" (en) / "1,1 kV" (de); 2e9 A/s → "2 kA/µs". */
export function formatQuantity(value: number | undefined | null, unit: string, locale: string): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return ''
  const mark = decimalMarkOf(locale)
  const plain = (v: number) => localised(String(Number(v.toPrecision(6))), mark)
  if (unit === '') return plain(value)
  // a price keeps its cents: 12 significant digits, never a prefix
  if (isCurrencyUnit(unit)) return `${localised(String(Number(value.toPrecision(12))), mark)} ${unit}`
  if (unit === '%') return `${plain(value * 100)} %`
  if (!PREFIXABLE.has(unit)) return `${plain(value)} ${unit}`
  if (unit === 'A/s') return localised(formatSi(value / 1e6, 'A/µs', 6), mark)
  return localised(formatSi(value, unit, 6), mark)
}

function examples(unit: string, mark: DecimalSeparator): string {
  if (isCurrencyUnit(unit)) return `"${localised('1250.5', mark)}", "${localised('1.5k', mark)}" or "2 k${CURRENCY_SYMBOLS[unit]?.[0] ?? unit}"`
  const spec = UNIT_SPECS[unit] ?? UNIT_SPECS['']!
  const [a, b] = spec.examples.map(e => localised(e, mark))
  return unit === 'A/s' ? `"${localised('2 kA/µs', mark)}" or "2000 A/µs"` : `"${a}" or "${b}"`
}

function noun(unit: string): string {
  if (isCurrencyUnit(unit)) return `a price in ${unit}`
  return (UNIT_SPECS[unit] ?? UNIT_SPECS['']!).noun
}

/** "a price in USD" when the unit text names another currency than the field's. */
function otherCurrency(unitText: string): string | null {
  const compact = unitText.replace(/\s+/g, '')
  for (const text of [compact, compact.replace(/^[kKM]/, '')]) {
    const codes = Object.entries(CURRENCY_SYMBOLS).filter(([c, symbols]) => c === text.toUpperCase() || symbols.includes(text)).map(([c]) => c)
    // "kr" is the Swedish, Norwegian and Danish crown alike
    if (codes.length) return codes.length === 1 ? `a price in ${codes[0]}` : 'a price in another currency'
  }
  return null
}

/** Reads what was typed into a field; refusals name the field and say what to type instead. */
export function parseFieldQuantity(raw: string, field: QuantityField): FieldQuantity {
  const text = raw.trim()
  const mark = decimalMarkOf(field.locale)
  const { unit, label } = field
  if (text === '') {
    return field.optional ? { ok: true, value: undefined } : { ok: false, message: `${label}: enter ${noun(unit)}, e.g. ${examples(unit, mark)}.` }
  }
  const split = splitQuantityText(text)
  if (!split) return { ok: false, message: `${label}: "${text}" is not ${noun(unit)}. Type a number, optionally with a prefix and unit, e.g. ${examples(unit, mark)}.` }
  const number = parseNumberText(split.numberText, mark)
  if (!number.ok) {
    const other: DecimalSeparator = mark === '.' ? ',' : '.'
    const otherWay = parseNumberText(split.numberText, other)
    if (otherWay.ok && split.numberText.includes(other)) {
      return { ok: false, message: `${label}: "${text}" uses "${other}" as the decimal mark; your number format (${field.locale}) uses "${mark}". Type e.g. ${examples(unit, mark)}.` }
    }
    return { ok: false, message: `${label}: "${text}" is not a number. Type e.g. ${examples(unit, mark)}.` }
  }
  let factor: number | null
  if (split.unitText === '') factor = unit === '%' ? 0.01 : 1
  else if (isCurrencyUnit(unit)) factor = moneyFactor(split.unitText, unit)
  else factor = unitFactor(split.unitText, unit) ?? (PREFIXABLE.has(unit) ? prefixFactor(split.unitText) : null)
  if (factor === null) {
    const other = isCurrencyUnit(unit) ? otherCurrency(split.unitText) ?? recogniseOtherQuantity(split.unitText, unit) : recogniseOtherQuantity(split.unitText, unit)
    const what = other ? `is ${other}, not ${noun(unit)}` : `has a unit "${split.unitText}" that does not fit`
    return { ok: false, message: `${label}: "${text}" ${what}. Type ${noun(unit)}${unit && unit !== '%' && !isCurrencyUnit(unit) ? ` in ${shownUnit(unit)}` : ''}, e.g. ${examples(unit, mark)}.` }
  }
  // 12 significant digits drop binary noise such as 0.69 × 1000 = 690.0000000000001.
  const value = factor === 1 ? number.value : Number((number.value * factor).toPrecision(12))
  if (field.positive && value <= 0) return { ok: false, message: `${label} must be greater than 0: enter a positive value.` }
  if (field.min !== undefined && value < field.min) {
    return { ok: false, message: `${label} must be at least ${formatQuantity(field.min, unit, field.locale)}: enter that or more.` }
  }
  if (field.max !== undefined && value > field.max) {
    return { ok: false, message: `${label} must be at most ${formatQuantity(field.max, unit, field.locale)}: enter that or less.` }
  }
  return { ok: true, value }
}
