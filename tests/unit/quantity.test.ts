import { describe, expect, it } from 'vitest'
import { decimalMarkOf, formatQuantity, parseFieldQuantity, type QuantityField } from '../../shared/utils/quantity'

// SI prefixes: BIPM, The International System of Units, 9th edition 2019, table 7 (µ may be typed "u" where
// the keyboard has no µ: common practice). Decimal marks per locale come from Intl (CLDR data).
const locales = ['en-GB', 'de-DE', 'sv-SE', 'en-US'] as const
const comma = (l: string) => l === 'de-DE' || l === 'sv-SE'
const mark = (text: string, l: string) => (comma(l) ? text.replace('.', ',') : text)

const field = (unit: string, locale: string, extra: Partial<QuantityField> = {}): QuantityField => ({ unit, locale, label: 'The field', ...extra })
function value(text: string, unit: string, locale: string) {
  const r = parseFieldQuantity(text, field(unit, locale))
  if (!r.ok) throw new Error(`refused "${text}" (${unit}, ${locale}): ${r.message}`)
  return r.value
}
function refusal(text: string, unit: string, locale: string, extra: Partial<QuantityField> = {}) {
  const r = parseFieldQuantity(text, field(unit, locale, extra))
  if (r.ok) throw new Error(`accepted "${text}" (${unit}, ${locale}) as ${r.value}`)
  return r.message
}

describe('decimal mark of each locale', () => {
  it('is a comma in de-DE and sv-SE, a point in en-GB and en-US', () => {
    expect(locales.map(decimalMarkOf)).toEqual(['.', ',', ',', '.'])
  })
})

for (const locale of locales) {
  describe(`accepted forms in ${locale}`, () => {
    const cases: [string, string, number][] = [
      [mark('0.69 kV', locale), 'V', 690],
      ['690 V', 'V', 690],
      ['690', 'V', 690],
      [mark('1.1 kV', locale), 'V', 1100],
      ['4k', 'Hz', 4000],
      ['4 kHz', 'Hz', 4000],
      [mark('4.5 kHz', locale), 'Hz', 4500],
      ['60n', 'H', 60e-9],
      ['60 nH', 'H', 60e-9],
      ['0,06 µH'.replace(',', comma(locale) ? ',' : '.'), 'H', 60e-9],
      ['60 uH', 'H', 60e-6],
      ['2 kA/µs', 'A/s', 2e9],
      ['2 kA/us', 'A/s', 2e9],
      ['2000 A/µs', 'A/s', 2e9],
      ['450 A', 'A', 450],
      [mark('1.2 kA', locale), 'A', 1200],
      [mark('-0.86', locale), '', -0.86],
      ['\u22120' + (comma(locale) ? ',' : '.') + '86', '', -0.86],
      ['85 %', '%', 0.85],
      ['85', '%', 0.85],
      ['-40 °C', '°C', -40],
    ]
    for (const [text, unit, expected] of cases) {
      it(`"${text}" in a ${unit || 'plain number'} field is ${expected}`, () => {
        expect(value(text, unit, locale)).toBeCloseTo(expected, 15)
      })
    }
  })

  describe(`refused forms in ${locale}`, () => {
    it('a voltage in a current field, named as a voltage', () => {
      expect(refusal(mark('0.69 kV', locale), 'A', locale)).toMatch(/^The field: ".*kV" is a voltage, not a current\. Type a current in A/)
    })
    it('a current in a voltage field, a frequency in an inductance field', () => {
      expect(refusal('12 A', 'V', locale)).toContain('is a current, not a voltage')
      expect(refusal('4 kHz', 'H', locale)).toContain('is a frequency, not an inductance')
    })
    it('a unit in a plain-number field (power factor)', () => {
      expect(refusal(mark('0.69 kV', locale), '', locale)).toContain('is a voltage, not a number')
    })
    it('a bare prefix where prefixes make no sense', () => {
      expect(refusal('4k', '°C', locale)).toContain('does not fit')
      expect(refusal('4k', '', locale)).toContain('does not fit')
    })
    it('the other decimal mark, naming the one to use', () => {
      const wrong = comma(locale) ? '4.5 kHz' : '4,5 kHz'
      const msg = refusal(wrong, 'Hz', locale)
      expect(msg).toContain(`your number format (${locale}) uses "${comma(locale) ? ',' : '.'}"`)
      expect(refusal(comma(locale) ? '0.69 kV' : '1,1 kV', 'V', locale)).toContain('decimal mark')
    })
    it('text that is not a number, and empty when required', () => {
      expect(refusal('abc', 'V', locale)).toContain('"abc" is not a voltage')
      expect(refusal('', 'V', locale)).toMatch(/^The field: enter a voltage/)
      expect(parseFieldQuantity('', field('V', locale, { optional: true }))).toEqual({ ok: true, value: undefined })
    })
    it('outside min / max, and zero where the field must be positive', () => {
      expect(refusal(mark('1.5', locale), '', locale, { min: -1, max: 1 })).toContain('must be at most 1:')
      expect(refusal('0', 'Hz', locale, { positive: true })).toContain('must be greater than 0')
      expect(refusal('-5 A', 'A', locale, { min: 0 })).toContain('must be at least 0 A')
    })
  })

  describe(`canonical form in ${locale}`, () => {
    const cases: [number, string, string][] = [
      [1100, 'V', '1.1 kV'],
      [690, 'V', '690 V'],
      [4500, 'Hz', '4.5 kHz'],
      [60e-9, 'H', '60 nH'],
      [2e9, 'A/s', '2 kA/µs'],
      [5e8, 'A/s', '500 A/µs'],
      [-0.86, '', '-0.86'],
      [0.85, '%', '85 %'],
      [175, '°C', '175 °C'],
    ]
    for (const [v, unit, shown] of cases) {
      it(`${v} ${unit} is shown as "${mark(shown, locale)}" and read back to the same value`, () => {
        const text = formatQuantity(v, unit, locale)
        expect(text).toBe(mark(shown, locale))
        expect(value(text, unit, locale)).toBeCloseTo(v, 15)
      })
    }
    it('an empty value shows as empty', () => {
      expect(formatQuantity(undefined, 'V', locale)).toBe('')
    })
  })
}

// Prices (the purchasing quote): k and M as in the SI prefixes above, typed alone or before the currency's code or
// symbol (common practice in quotes: "2 k€", "1,5k"); cents are kept, never rounded to a prefix.
for (const locale of locales) {
  describe(`prices in ${locale}`, () => {
    const accepted: [string, string, number][] = [
      [mark('1.5k', locale), 'EUR', 1500],
      ['2 k€', 'EUR', 2000],
      ['2k €', 'EUR', 2000],
      [mark('12.50', locale), 'EUR', 12.5],
      ['310 EUR', 'EUR', 310],
      ['310 eur', 'EUR', 310],
      [mark('0.279 kEUR', locale), 'EUR', 279],
      ['1 M€', 'EUR', 1e6],
      ['300 kr', 'SEK', 300],
      ['2 kkr', 'SEK', 2000],
      [mark('1.5 MSEK', locale), 'SEK', 1.5e6],
      ['45 $', 'USD', 45],
    ]
    for (const [text, unit, v] of accepted) {
      it(`"${text}" in a ${unit} field is ${v}`, () => { expect(value(text, unit, locale)).toBe(v) })
    }
    it('refuses a unit of another quantity or currency, naming what it is', () => {
      expect(refusal('2 kV', 'EUR', locale)).toContain('"2 kV" is a voltage, not a price in EUR')
      expect(refusal('2 k$', 'EUR', locale)).toContain('"2 k$" is a price in USD, not a price in EUR')
      expect(refusal('2 kr', 'EUR', locale)).toContain('is a price in another currency, not a price in EUR')
      expect(refusal('4 pcs', 'EUR', locale)).toContain('has a unit "pcs" that does not fit')
      expect(refusal('2 m€', 'EUR', locale)).toContain('does not fit')
      expect(refusal('-3', 'EUR', locale, { min: 0 })).toContain('must be at least 0 EUR')
    })
    it('refuses what it would otherwise have to guess: the other decimal mark is never read as digit grouping', () => {
      expect(refusal(comma(locale) ? '12.50' : '12,50', 'EUR', locale)).toMatch(/decimal mark|not a number/)
      expect(value(comma(locale) ? '1.234,5' : '1,234.5', 'EUR', locale)).toBe(1234.5)
    })
    it('shows a price back with its cents and currency, read back to the same value', () => {
      for (const [v, shown] of [[1500, '1500 EUR'], [12.5, '12.5 EUR'], [1234.56, '1234.56 EUR'], [0.3, '0.3 EUR']] as const) {
        const text = formatQuantity(v, 'EUR', locale)
        expect(text).toBe(mark(shown, locale))
        expect(value(text, 'EUR', locale)).toBe(v)
      }
      expect(formatQuantity(0.1 + 0.2, 'EUR', locale)).toBe(mark('0.3 EUR', locale))
    })
  })
}
