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
