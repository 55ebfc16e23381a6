import { describe, expect, it } from 'vitest'
import { parseQuantity } from '../../shared/catalog/units'
import { formatSi } from '../../shared/utils/format'

// SI prefixes (BIPM, The International System of Units, 9th edition 2019, table 7).
describe('form quantities: shown with a prefix, read back to the same SI value', () => {
  const cases: [number, string, string][] = [
    [1200, 'V', '1.2 kV'],
    [4000, 'Hz', '4 kHz'],
    [450, 'A', '450 A'],
    [6e-8, 'H', '60 nH'],
    [2e9, 'A/s', '2 GA/s'],
    [0.0025, 'V', '2.5 mV'],
  ]
  for (const [value, unit, shown] of cases) {
    it(`${value} ${unit} ↔ "${shown}"`, () => {
      expect(formatSi(value, unit)).toBe(shown)
      const back = parseQuantity(shown, unit, { decimalSeparator: '.' })
      expect(back.ok && back.value).toBeCloseTo(value, 12)
    })
  }

  it('reads the forms engineers type for stray inductance and di/dt', () => {
    expect(parseQuantity('60 nH', 'H', { decimalSeparator: '.' })).toEqual({ ok: true, value: 6e-8 })
    const slope = parseQuantity('2 kA/µs', 'A/s', { decimalSeparator: '.' })
    expect(slope.ok && slope.value).toBeCloseTo(2e9, 0)
    expect(parseQuantity('12 A', 'V', { decimalSeparator: '.' }).ok).toBe(false)
  })

  it('shows missing values as a dash', () => {
    expect(formatSi(undefined, 'V')).toBe('—')
    expect(formatSi(Number.NaN, 'V')).toBe('—')
  })
})
