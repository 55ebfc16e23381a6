import { describe, expect, it } from 'vitest'
import { decimalMark, formatDate, formatDateTime, formatInteger, formatMoney, formatNumber, formatSi, formatUnitPrice, isAppLocale, LOCALES, resolveLocale } from '../../shared/utils/format'

// The one formatting helper, per locale. The expected strings are the CLDR conventions Intl follows (Unicode CLDR
// number and date patterns for en-GB, de-DE, sv-SE, en-US), written out here so that a change in the helper shows.
// sv-SE groups thousands with a no-break space (U+00A0), written \u00a0 below.
const AT = '2026-03-14T09:30:00.000Z'
const EVENING = '2026-03-14T21:05:00.000Z'

describe('formatting per locale', () => {
  const cases: Record<string, { number: string, integer: string, money: string, unit: string, date: string, dateTime: string, evening: string, si: string, mark: ',' | '.' }> = {
    'en-GB': { number: '1,234.5', integer: '12,345', money: '1,234.50 EUR', unit: '0.0125', date: '14 Mar 2026', dateTime: '14 Mar 2026, 09:30 UTC', evening: '14 Mar 2026, 21:05 UTC', si: '1.1 kV', mark: '.' },
    'de-DE': { number: '1.234,5', integer: '12.345', money: '1.234,50 EUR', unit: '0,0125', date: '14.03.2026', dateTime: '14.03.2026, 09:30 UTC', evening: '14.03.2026, 21:05 UTC', si: '1,1 kV', mark: ',' },
    'sv-SE': { number: '1\u00a0234,5', integer: '12\u00a0345', money: '1\u00a0234,50 EUR', unit: '0,0125', date: '14 mars 2026', dateTime: '14 mars 2026 09:30 UTC', evening: '14 mars 2026 21:05 UTC', si: '1,1 kV', mark: ',' },
    'en-US': { number: '1,234.5', integer: '12,345', money: '1,234.50 EUR', unit: '0.0125', date: 'Mar 14, 2026', dateTime: 'Mar 14, 2026, 09:30 UTC', evening: 'Mar 14, 2026, 21:05 UTC', si: '1.1 kV', mark: '.' },
  }
  it('covers every locale a user may choose', () => {
    expect(Object.keys(cases).sort()).toEqual([...LOCALES].sort())
  })
  for (const [locale, c] of Object.entries(cases)) {
    it(`${locale}: 1234.5 → "${c.number}", 12345 pcs → "${c.integer}", money "${c.money}", day "${c.date}", moment "${c.dateTime}"`, () => {
      expect(formatNumber(1234.5, locale)).toBe(c.number)
      expect(formatInteger(12345, locale)).toBe(c.integer)
      expect(formatMoney(1234.5, 'EUR', locale)).toBe(c.money)
      expect(formatUnitPrice(0.0125, locale)).toBe(c.unit)
      expect(formatDate(AT, locale)).toBe(c.date)
      expect(formatDateTime(AT, locale)).toBe(c.dateTime)
      // 24-hour clock in every locale (en-US included), in UTC whatever the machine's time zone
      expect(formatDateTime(EVENING, locale)).toBe(c.evening)
      expect(formatSi(1100, 'V', 4, locale)).toBe(c.si)
      expect(decimalMark(locale)).toBe(c.mark)
    })
  }

  it('fixed decimals, significant digits and no grouping on request', () => {
    expect(formatNumber(2.5, 'de-DE', { decimals: 2 })).toBe('2,50')
    expect(formatNumber(12345.678, 'en-GB', { significant: 3 })).toBe('12,300')
    expect(formatNumber(12345.5, 'de-DE', { grouping: false })).toBe('12345,5')
    expect(formatInteger(2.6, 'en-GB')).toBe('3')
  })

  it('shows missing values as a dash and keeps unparsable dates as given', () => {
    expect(formatNumber(null, 'de-DE')).toBe('—')
    expect(formatNumber(Number.NaN, 'de-DE')).toBe('—')
    expect(formatMoney(undefined, 'EUR', 'en-GB')).toBe('—')
    expect(formatDate(null, 'en-GB')).toBe('—')
    expect(formatDateTime('not a date', 'en-GB')).toBe('not a date')
    expect(formatMoney(5, null, 'de-DE')).toBe('5,00')
  })

  it('the user\'s choice wins over the company default; unknown locales fall back to en-GB', () => {
    expect(resolveLocale('de-DE', 'sv-SE')).toBe('de-DE')
    expect(resolveLocale(null, 'sv-SE')).toBe('sv-SE')
    expect(resolveLocale('xx-XX', 'en-US')).toBe('en-US')
    expect(resolveLocale(undefined, 'fr-FR')).toBe('en-GB')
    expect(isAppLocale('de-DE')).toBe(true)
    expect(isAppLocale('de')).toBe(false)
    // an unknown locale formats as en-GB rather than throwing
    expect(formatNumber(1234.5, 'xx-XX')).toBe('1,234.5')
  })
})
