// Reads one spreadsheet cell as a physical quantity: "1.2 kV", "1 200 V", "2.5 mOhm", "4,7 µF", "12 weeks".
// Returns the value in the column's SI unit (V, A, Ω, J, F, K/W; °C for temperatures, days for lead times).

export type DecimalSeparator = '.' | ','

export interface QuantityOptions {
  decimalSeparator: DecimalSeparator
  /** Factor applied to bare numbers (no unit in the cell), e.g. 1e-3 when the header says "(mJ)". Default 1. */
  bareNumberScale?: number
}

export type QuantityResult = { ok: true, value: number } | { ok: false, reason: string }

interface UnitSpelling {
  text: string
  /** Match regardless of letter case (words and symbols that cannot be confused with a prefix). */
  anyCase?: boolean
  /** Value of one of this spelling in the base unit (weeks → 7 days). */
  factor?: number
  /** SI prefixes allowed in front of this spelling. */
  prefixes?: boolean
}

interface UnitSpec {
  /** Noun phrase for messages: "a voltage". */
  noun: string
  /** Two examples for messages. */
  examples: [string, string]
  spellings: UnitSpelling[]
}

const SI_PREFIXES: Readonly<Record<string, number>> = {
  p: 1e-12, n: 1e-9, u: 1e-6, µ: 1e-6, μ: 1e-6, m: 1e-3, k: 1e3, K: 1e3, M: 1e6, G: 1e9,
}

const withPrefixes = (text: string, anyCase = false): UnitSpelling => ({ text, anyCase, prefixes: true })
const word = (text: string, factor = 1, prefixes = true): UnitSpelling => ({ text, anyCase: true, factor, prefixes })

/** The units a catalogue cell may be expected in, keyed by the symbol columns.ts uses. */
export const UNIT_SPECS: Readonly<Record<string, UnitSpec>> = {
  'V': { noun: 'a voltage', examples: ['1200 V', '1.2 kV'], spellings: [withPrefixes('V', true), withPrefixes('VDC', true), withPrefixes('Vdc'), word('volt'), word('volts')] },
  'A': { noun: 'a current', examples: ['450 A', '1.2 kA'], spellings: [withPrefixes('A', true), withPrefixes('Arms', true), withPrefixes('A rms', true), withPrefixes('Adc', true), word('amp'), word('amps'), word('ampere'), word('amperes')] },
  'Ω': { noun: 'a resistance', examples: ['2.5 mΩ', '2.5 mOhm'], spellings: [withPrefixes('Ω'), withPrefixes('\u2126'), word('ohm'), word('ohms')] },
  'J': { noun: 'an energy', examples: ['18 mJ', '0.018 J'], spellings: [withPrefixes('J', true), withPrefixes('Ws'), withPrefixes('W·s'), word('joule'), word('joules')] },
  'F': { noun: 'a capacitance', examples: ['470 µF', '4.7 mF'], spellings: [withPrefixes('F', true), word('farad'), word('farads')] },
  'K/W': { noun: 'a thermal resistance', examples: ['0.12 K/W', '120 mK/W'], spellings: [withPrefixes('K/W', true), withPrefixes('°C/W', true), withPrefixes('C/W'), withPrefixes('℃/W'), withPrefixes('K/kW', true)].map(s => s.text === 'K/kW' ? { ...s, factor: 1e-3 } : s) },
  '°C': { noun: 'a temperature', examples: ['175 °C', '150 C'], spellings: [{ text: '°C' }, { text: '℃' }, { text: 'C', anyCase: true }, word('degC', 1, false), word('deg C', 1, false), word('celsius', 1, false)] },
  'd': { noun: 'a duration', examples: ['84 d', '12 weeks'], spellings: [{ text: 'd' }, word('day', 1, false), word('days', 1, false), word('wk', 7, false), word('wks', 7, false), word('week', 7, false), word('weeks', 7, false), word('w', 7, false)] },
  's': { noun: 'a time constant', examples: ['12 ms', '0.012 s'], spellings: [withPrefixes('s'), word('sec', 1, false), word('second', 1, false), word('seconds', 1, false)] },
  'h': { noun: 'a number of hours', examples: ['5000 h', '5000'], spellings: [{ text: 'h' }, word('hours', 1, false), word('hour', 1, false), word('hrs', 1, false)] },
  'W': { noun: 'a power', examples: ['250 W', '1.5 kW'], spellings: [withPrefixes('W', true), word('watt'), word('watts')] },
  // Design-form quantities (not catalogue columns): stray inductance and current slope.
  'H': { noun: 'an inductance', examples: ['60 nH', '0.06 µH'], spellings: [withPrefixes('H'), word('henry')] },
  'A/s': { noun: 'a current slope', examples: ['2e9 A/s', '2 kA/µs'], spellings: [withPrefixes('A/s'), { text: 'A/µs', factor: 1e6, prefixes: true }, { text: 'A/us', factor: 1e6, prefixes: true }] },
  'Hz': { noun: 'a frequency', examples: ['4 kHz', '4000 Hz'], spellings: [withPrefixes('Hz', true), word('hertz')] },
  '%': { noun: 'a percentage', examples: ['85 %', '85'], spellings: [{ text: '%', factor: 0.01 }, word('percent', 0.01, false)] },
  'pcs': { noun: 'a number of pieces', examples: ['100', '100 pcs'], spellings: [word('pcs', 1, false), word('pc', 1, false), word('pce', 1, false), word('pieces', 1, false), word('piece', 1, false), word('units', 1, false), word('ea', 1, false)] },
  '': { noun: 'a number', examples: ['12', '12.5'], spellings: [] },
}

// Longest spellings first, so "K/W" is not read as the prefix "K" on "/W"; prepared once.
const SORTED_SPELLINGS: Readonly<Record<string, readonly (UnitSpelling & { compact: string, lower: string })[]>> = Object.fromEntries(
  Object.entries(UNIT_SPECS).map(([symbol, spec]) => [symbol, [...spec.spellings]
    .sort((a, b) => b.text.length - a.text.length)
    .map(s => ({ ...s, compact: s.text.replace(/\s+/g, ''), lower: s.text.replace(/\s+/g, '').toLowerCase() }))]),
)

/** Scale factor of `unitText` for a quantity measured in `expectedUnit`, or null if it is not a spelling of it. */
export function unitFactor(unitText: string, expectedUnit: string): number | null {
  const spellings = SORTED_SPELLINGS[expectedUnit]
  if (!spellings) return null
  const compact = unitText.replace(/[\s_]+/g, '')
  if (compact === '') return 1
  const lower = compact.toLowerCase()
  for (const spelling of spellings) {
    const symbol = spelling.compact
    const endsWith = compact.endsWith(symbol) || (spelling.anyCase === true && lower.endsWith(spelling.lower))
    if (!endsWith) continue
    const prefix = compact.slice(0, compact.length - symbol.length)
    const factor = spelling.factor ?? 1
    if (prefix === '') return factor
    if (spelling.prefixes && prefix in SI_PREFIXES) return factor * SI_PREFIXES[prefix]!
  }
  return null
}

/** The quantity a unit text belongs to ("a current" for "kA"), to tell the user what they typed instead. */
export function recogniseOtherQuantity(unitText: string, expectedUnit: string): string | null {
  for (const [symbol, spec] of Object.entries(UNIT_SPECS)) {
    if (symbol === expectedUnit || symbol === '' || symbol === 'pcs') continue
    if (unitFactor(unitText, symbol) !== null) return spec.noun
  }
  return null
}

function expectation(expectedUnit: string): string {
  const spec = UNIT_SPECS[expectedUnit] ?? UNIT_SPECS['']!
  return `expected ${spec.noun} like '${spec.examples[0]}' or '${spec.examples[1]}'`
}

const GROUP_SPACES = /[\s\u00A0\u2009\u202F']/
const GROUPS_WITH_DOT = /[\s\u00A0\u2009\u202F'.]+/
const GROUPS_WITH_COMMA = /[\s\u00A0\u2009\u202F',]+/

/** Parses the numeric part of a cell; thousands separators must group digits by three. */
export function parseNumberText(text: string, decimalSeparator: DecimalSeparator): { ok: true, value: number } | { ok: false, reason: string } {
  const other = decimalSeparator === '.' ? ',' : '.'
  let s = text.trim().replace(/\u2212/g, '-')
  let sign = 1
  if (s.startsWith('-') || s.startsWith('+')) {
    sign = s.startsWith('-') ? -1 : 1
    s = s.slice(1).trimStart()
  }
  let exponent = 0
  const exp = /[eE]([+-]?\d+)$/.exec(s)
  if (exp) {
    exponent = Number(exp[1])
    s = s.slice(0, exp.index)
  }
  const decimalAt = s.indexOf(decimalSeparator)
  if (decimalAt !== s.lastIndexOf(decimalSeparator)) {
    return { ok: false, reason: `'${text}' has more than one decimal separator '${decimalSeparator}'` }
  }
  const integerPart = decimalAt < 0 ? s : s.slice(0, decimalAt)
  const fraction = decimalAt < 0 ? '' : s.slice(decimalAt + 1)
  if (!/^\d*$/.test(fraction)) return { ok: false, reason: `'${text}' is not a number` }
  if (fraction.includes(other)) return { ok: false, reason: `'${text}' is not a number` }
  const groups = integerPart.split(other === '.' ? GROUPS_WITH_DOT : GROUPS_WITH_COMMA)
  if (groups.length > 1) {
    const wellGrouped = /^\d{1,3}$/.test(groups[0]!) && groups.slice(1).every(g => /^\d{3}$/.test(g))
    if (!wellGrouped) {
      if (integerPart.includes(other) && !GROUP_SPACES.test(integerPart)) {
        return { ok: false, reason: `'${text}' uses '${other}' but the decimal separator chosen for this upload is '${decimalSeparator}'` }
      }
      return { ok: false, reason: `'${text}' is not a number (digit groups must have three digits)` }
    }
  }
  const digits = groups.join('')
  if (!/^\d*$/.test(digits) || (digits === '' && fraction === '')) return { ok: false, reason: `'${text}' is not a number` }
  const value = sign * Number(`${digits || '0'}.${fraction || '0'}`) * 10 ** exponent
  if (!Number.isFinite(value)) return { ok: false, reason: `'${text}' is out of range` }
  return { ok: true, value }
}

// Leading number: digits with group separators, decimal marks and an optional exponent; the rest is the unit.
const NUMBER_AT_START = /^\s*([+\-\u2212]?\s*(?:\d[\d\s\u00A0\u2009\u202F'.,]*\d|\d|[.,]\d+)(?:[eE][+-]?\d+)?)(.*)$/s

/** Splits typed text into its leading number and the unit text after it; null when it does not start with a number. */
export function splitQuantityText(text: string): { numberText: string, unitText: string } | null {
  const match = NUMBER_AT_START.exec(text.trim())
  if (!match) return null
  return { numberText: match[1]!.replace(/\s+$/, ''), unitText: match[2]!.trim() }
}

/** The SI prefix factor of a bare prefix ("k" → 1e3, "u" or "µ" → 1e-6), or null. */
export function prefixFactor(text: string): number | null {
  return Object.hasOwn(SI_PREFIXES, text) ? SI_PREFIXES[text]! : null
}

// 12 significant digits drop binary noise such as 18 mJ → 0.018000000000000002.
function scaled(value: number, factor: number): number {
  return factor === 1 ? value : Number((value * factor).toPrecision(12))
}

/**
 * Reads `raw` (a cell: number, string, or empty) as a quantity in `expectedUnit` (a key of UNIT_SPECS).
 * Numbers without a unit are taken in `expectedUnit` (times `bareNumberScale`).
 */
export function parseQuantity(raw: unknown, expectedUnit: string, opts: QuantityOptions): QuantityResult {
  const bareScale = opts.bareNumberScale ?? 1
  if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) {
    return { ok: false, reason: `empty cell: ${expectation(expectedUnit)}` }
  }
  if (typeof raw === 'number') {
    if (!Number.isFinite(raw)) return { ok: false, reason: `${expectation(expectedUnit)}, got a non-finite number` }
    return { ok: true, value: scaled(raw, bareScale) }
  }
  if (typeof raw !== 'string') {
    return { ok: false, reason: `${expectation(expectedUnit)}, got ${typeof raw === 'boolean' ? `the logical value ${String(raw).toUpperCase()}` : 'a value that is not text or a number'}` }
  }
  const text = raw.trim()
  const match = NUMBER_AT_START.exec(text)
  if (!match) return { ok: false, reason: `${expectation(expectedUnit)}, got '${text}'` }
  const numberText = match[1]!.replace(/\s+$/, '')
  const unitText = match[2]!.trim()
  if (/^[-–~]\s*\d/.test(unitText) || /^(to|\.\.\.?|…)\s*\d/i.test(unitText)) {
    return { ok: false, reason: `${expectation(expectedUnit)}, got a range '${text}': give one value` }
  }
  const number = parseNumberText(numberText, opts.decimalSeparator)
  if (!number.ok) return { ok: false, reason: `${expectation(expectedUnit)}: ${number.reason}` }
  if (unitText === '') return { ok: true, value: scaled(number.value, bareScale) }
  const factor = unitFactor(unitText, expectedUnit)
  if (factor !== null) return { ok: true, value: scaled(number.value, factor) }
  const other = recogniseOtherQuantity(unitText, expectedUnit)
  if (other) return { ok: false, reason: `${expectation(expectedUnit)}, got '${text}' (${other})` }
  return { ok: false, reason: `${expectation(expectedUnit)}, got '${text}': unit '${unitText}' not recognised` }
}

/**
 * Unit a header declares for its bare numbers, e.g. "Eon (mJ)" → 1e-3 for expected unit J,
 * "Lead time [weeks]" → 7 for days. Null when the header names no unit of that quantity.
 */
export function unitScaleFromHeader(header: string, expectedUnit: string): number | null {
  if (expectedUnit === '' || expectedUnit === 'pcs') return null
  const candidates: string[] = []
  for (const m of header.matchAll(/[([{]([^)\]}]+)[)\]}]/g)) candidates.push(m[1]!)
  const afterComma = /,\s*([^,]+)$/.exec(header)
  if (afterComma) candidates.push(afterComma[1]!)
  const afterIn = /\bin\s+(\S+)\s*$/i.exec(header)
  if (afterIn) candidates.push(afterIn[1]!)
  const afterSlash = /\s\/\s*(\S+)\s*$/.exec(header)
  if (afterSlash) candidates.push(afterSlash[1]!)
  for (const candidate of candidates) {
    const text = candidate.trim()
    if (text === '') continue
    const factor = unitFactor(text, expectedUnit)
    if (factor !== null) return factor
  }
  return null
}
