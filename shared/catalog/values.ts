// Reading cell values the catalogue does not spell its own way: suppliers' words for kinds, package
// configurations and lifecycles ("IGBT module", "2in1", "mass production"), a currency named in the
// price header ("Price €"), and the decimal mark a column or a cell uses.

import { CATALOG_COLUMNS, CURRENCIES, type CatalogColumn, type ColumnKey, type Currency } from '../../catalog/columns'
import { similarity } from './mapping'
import type { ColumnMapping, RawTable } from './types'
import type { DecimalSeparator } from './units'

/** Uploaded value (normalised) → catalogue value, per enum column. */
export type ValueMapping = Partial<Record<ColumnKey, Record<string, string>>>

/** Lower case, single spaces, no surrounding punctuation: the key a value mapping is stored under. */
export function normaliseValue(text: string): string {
  return text.normalize('NFKC').toLowerCase().replace(/[\s_]+/g, ' ').replace(/^[\s.,;:*-]+|[\s.,;:*-]+$/g, '').trim()
}

/**
 * Word rules for values that no alias spells out: the first rule whose words all occur wins. Written
 * from how supplier price lists commonly describe their parts (common practice, not from a standard).
 */
const WORD_RULES: Partial<Record<ColumnKey, { words: string[], value: string }[]>> = {
  kind: [
    { words: ['capacitor'], value: 'capacitor' },
    { words: ['film'], value: 'capacitor' },
    { words: ['electrolytic'], value: 'capacitor' },
    { words: ['igbt', 'only'], value: 'switch' },
    { words: ['without', 'diode'], value: 'switch' },
    { words: ['igbt'], value: 'switch-diode' },
    { words: ['mosfet'], value: 'switch-diode' },
    { words: ['module'], value: 'switch-diode' },
    { words: ['rectifier'], value: 'diode' },
    { words: ['diode'], value: 'diode' },
    { words: ['thyristor'], value: 'switch' },
  ],
  packageConfiguration: [
    { words: ['six'], value: 'six-pack' },
    { words: ['6in1'], value: 'six-pack' },
    { words: ['6 in 1'], value: 'six-pack' },
    { words: ['sixpack'], value: 'six-pack' },
    { words: ['2in1'], value: 'half-bridge' },
    { words: ['2 in 1'], value: 'half-bridge' },
    { words: ['half'], value: 'half-bridge' },
    { words: ['dual', 'diode'], value: 'dual-diode' },
    { words: ['dual'], value: 'half-bridge' },
    { words: ['anpc'], value: 'anpc-leg' },
    { words: ['npc'], value: 'npc-leg' },
    { words: ['t-type'], value: 't-type-leg' },
    { words: ['tnpc'], value: 't-type-leg' },
    { words: ['h-bridge'], value: 'h-bridge' },
    { words: ['full'], value: 'h-bridge' },
    { words: ['4in1'], value: 'h-bridge' },
    { words: ['chopper'], value: 'chopper' },
    { words: ['1in1'], value: 'single' },
    { words: ['single'], value: 'single' },
    { words: ['discrete'], value: 'single' },
  ],
  lifecycle: [
    { words: ['not', 'new'], value: 'nrnd' },
    { words: ['phase', 'out'], value: 'nrnd' },
    { words: ['last', 'buy'], value: 'nrnd' },
    { words: ['eol'], value: 'nrnd' },
    { words: ['discontinued'], value: 'obsolete' },
    { words: ['obsolete'], value: 'obsolete' },
    { words: ['production'], value: 'active' },
    { words: ['active'], value: 'active' },
    { words: ['available'], value: 'active' },
    { words: ['released'], value: 'active' },
  ],
  technology: [
    { words: ['sic', 'diode'], value: 'sic-diode' },
    { words: ['sic', 'schottky'], value: 'sic-diode' },
    { words: ['sic'], value: 'sic-mosfet' },
    { words: ['igbt'], value: 'si-igbt' },
    { words: ['mosfet'], value: 'si-mosfet' },
    { words: ['diode'], value: 'si-diode' },
    { words: ['film'], value: 'film' },
    { words: ['electrolytic'], value: 'electrolytic' },
  ],
}

/** Our value an uploaded enum value most likely means, or null when nothing is close. */
export function suggestValue(column: CatalogColumn, text: string): string | null {
  const values = column.values ?? []
  const v = normaliseValue(text)
  if (v === '') return null
  const tokens = v.split(/[\s/+,()]+/)
  for (const rule of WORD_RULES[column.key] ?? []) {
    if (rule.words.every(w => (w.includes(' ') ? v.includes(w) : tokens.includes(w) || v.includes(w)))) return rule.value
  }
  // Yes / no words for a column with two-valued meaning are not guessed: the user decides.
  let best: { value: string, score: number } | null = null
  const spellings: [string, string][] = [...values.map(x => [x, x] as [string, string]), ...Object.entries(column.valueAliases ?? {})]
  for (const [spelling, value] of spellings) {
    const score = similarity(v, spelling.toLowerCase())
    if (score > (best?.score ?? 0)) best = { value, score }
  }
  return best && best.score >= 0.6 ? best.value : null
}

const CURRENCY_SYMBOLS: Record<string, Currency> = { '€': 'EUR', '$': 'USD', 'US$': 'USD', '£': 'GBP', '¥': 'JPY', 'Fr.': 'CHF', 'kr': 'SEK', 'zł': 'PLN', 'Kč': 'CZK', '₹': 'INR', '₩': 'KRW' }

/** A currency named in a price header: "Price €", "Unit price [USD]", "Preis (EUR)" → the ISO code. */
export function currencyInHeader(header: string): Currency | null {
  const upper = header.toUpperCase()
  for (const code of CURRENCIES) if (new RegExp(`(^|[^A-Z])${code}([^A-Z]|$)`).test(upper)) return code
  for (const [symbol, code] of Object.entries(CURRENCY_SYMBOLS)) {
    if (symbol.length === 1 ? header.includes(symbol) : new RegExp(`(^|\\W)${symbol.replace(/[.$]/g, '\\$&')}(\\W|$)`).test(header)) return code
  }
  return null
}

/**
 * The decimal mark a number text shows unambiguously: "2,1", "0,065" → ','; "1.5", "1,234.5" → '.';
 * null for "1,234" or "1.234" (a thousands group or a decimal: cannot tell) and for whole numbers.
 */
export function decimalMarkOf(text: string): DecimalSeparator | null {
  const m = /[+\-\u2212]?\d[\d\s\u00A0\u2009\u202F'.,]*/.exec(text)
  if (!m) return null
  const n = m[0].replace(/[\s\u00A0\u2009\u202F']+$/, '')
  const lastDot = n.lastIndexOf('.')
  const lastComma = n.lastIndexOf(',')
  if (lastDot >= 0 && lastComma >= 0) return lastDot > lastComma ? '.' : ','
  const at = Math.max(lastDot, lastComma)
  if (at < 0) return null
  const mark = n[at] as DecimalSeparator
  if (n.indexOf(mark) !== at) return null // "1.234.567": groups
  const after = n.slice(at + 1).replace(/\D.*$/, '')
  // "1,234" may be a thousands group; "0,065" may not (no group starts with 0).
  const before = n.slice(0, at).replace(/^[+\-\u2212]/, '')
  if (after.length === 3 && before !== '0') return null
  return mark
}

/** The decimal mark of a cell that carries a unit ("2,1 mΩ", "4.7 µF"), when unambiguous; else null. */
export function cellDecimalMark(text: string): DecimalSeparator | null {
  if (!/\d\s*[^\d\s.,:;'+\-\u2212eE]/.test(text) || /:/.test(text)) return null
  return decimalMarkOf(text)
}

export interface ColumnSeparator {
  key: ColumnKey
  separator: DecimalSeparator
  /** 'cells' = found in the column's values; 'file' = the file's default (no evidence either way). */
  source: 'cells' | 'file'
  comma: number
  dot: number
}

const NUMERIC_TYPES = new Set(['number', 'integer', 'priceBreaks'])

/** Decimal mark of each mapped numeric column, by a count of the unambiguous marks in its cells. */
export function detectDecimalSeparators(table: Pick<RawTable, 'rows'>, mapping: ColumnMapping, fallback: DecimalSeparator, sampleRows = 2000): ColumnSeparator[] {
  const out: ColumnSeparator[] = []
  for (const column of CATALOG_COLUMNS) {
    const index = mapping[column.key]
    if (!NUMERIC_TYPES.has(column.type) || typeof index !== 'number') continue
    let comma = 0
    let dot = 0
    const rows = table.rows.length > sampleRows ? table.rows.slice(0, sampleRows) : table.rows
    for (const row of rows) {
      const cell = row.cells[index]
      if (typeof cell !== 'string') continue
      for (const piece of column.type === 'priceBreaks' ? cell.split(/[;|\n]/).map(p => p.split(':').at(-1)!) : [cell]) {
        const mark = decimalMarkOf(piece)
        if (mark === ',') comma++
        else if (mark === '.') dot++
      }
    }
    const separator = comma > dot ? ',' : dot > comma ? '.' : fallback
    out.push({ key: column.key, separator, source: comma === dot ? 'file' : 'cells', comma, dot })
  }
  return out
}
