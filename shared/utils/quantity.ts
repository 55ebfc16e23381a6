// What an engineer types into a form field, read as one SI value: "0.69 kV", "4k", "4,5 kHz" (decimal-comma
// locale), "60n", "2 kA/µs" (µ also written "u"), and shown back in one canonical form. A unit that does not fit
// the field is refused with a message, never reinterpreted. Numbers and units are read by the catalogue's
// parser (shared/catalog/units.ts), so a cell and a field understand the same notation.
import { parseNumberText, prefixFactor, recogniseOtherQuantity, splitQuantityText, UNIT_SPECS, unitFactor, type DecimalSeparator } from '../catalog/units'
import { decimalMark, formatSi } from './format'

export interface QuantityField {
  /** SI base unit of the field, a key of UNIT_SPECS: 'V', 'A', 'Hz', 'H', 'A/s', '°C', '%' (a fraction: 85 % → 0.85), '' (a plain number). */
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
  if (unit === '%') return `${plain(value * 100)} %`
  if (!PREFIXABLE.has(unit)) return `${plain(value)} ${unit}`
  if (unit === 'A/s') return localised(formatSi(value / 1e6, 'A/µs', 6), mark)
  return localised(formatSi(value, unit, 6), mark)
}

function examples(unit: string, mark: DecimalSeparator): string {
  const spec = UNIT_SPECS[unit] ?? UNIT_SPECS['']!
  const [a, b] = spec.examples.map(e => localised(e, mark))
  return unit === 'A/s' ? `"${localised('2 kA/µs', mark)}" or "2000 A/µs"` : `"${a}" or "${b}"`
}

function noun(unit: string): string {
  return (UNIT_SPECS[unit] ?? UNIT_SPECS['']!).noun
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
  else factor = unitFactor(split.unitText, unit) ?? (PREFIXABLE.has(unit) ? prefixFactor(split.unitText) : null)
  if (factor === null) {
    const other = recogniseOtherQuantity(split.unitText, unit)
    const what = other ? `is ${other}, not ${noun(unit)}` : `has a unit "${split.unitText}" that does not fit`
    return { ok: false, message: `${label}: "${text}" ${what}. Type ${noun(unit)}${unit && unit !== '%' ? ` in ${shownUnit(unit)}` : ''}, e.g. ${examples(unit, mark)}.` }
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
