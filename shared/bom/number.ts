// Number entry in the user's locale: "12,50" in a decimal-comma locale is twelve and a half, never 1250.

export interface ParsedNumber { value: number | null, error: string | null }

/** Decimal and group separators of a locale, from Intl (e.g. de-DE → ',' and '.'). */
export function separatorsOf(locale: string): { decimal: string, group: string } {
  const parts = new Intl.NumberFormat(locale).formatToParts(12345.6)
  return {
    decimal: parts.find(p => p.type === 'decimal')?.value ?? '.',
    group: parts.find(p => p.type === 'group')?.value ?? ',',
  }
}

/**
 * Reads a typed number in `locale`. Group separators are accepted only in groups of three digits
 * ("1.234,5" in de-DE); anything ambiguous or malformed is refused with a message rather than guessed.
 * Blank gives null.
 */
export function parseLocaleNumber(text: string, locale: string): ParsedNumber {
  // Every kind of space (fr-FR groups with U+202F) counts as one.
  const raw = text.trim().replace(/\s/g, ' ')
  if (raw === '') return { value: null, error: null }
  const { decimal, group } = separatorsOf(locale)
  const normGroup = /\s/.test(group) ? ' ' : group
  const [intPart, fracPart, extra] = raw.split(decimal)
  if (extra !== undefined) return { value: null, error: `"${text}" has more than one decimal separator "${decimal}"` }
  let digits = intPart!
  const sign = digits.startsWith('-') ? '-' : ''
  if (sign) digits = digits.slice(1)
  if (normGroup && digits.includes(normGroup)) {
    const groups = digits.split(normGroup)
    if (!/^\d{1,3}$/.test(groups[0]!) || groups.slice(1).some(g => !/^\d{3}$/.test(g))) {
      return { value: null, error: `"${text}" is not a number in this locale (decimal separator "${decimal}", thousands "${group}")` }
    }
    digits = groups.join('')
  }
  if (!/^\d*$/.test(digits) || (fracPart !== undefined && !/^\d+$/.test(fracPart)) || (digits === '' && fracPart === undefined)) {
    return { value: null, error: `"${text}" is not a number in this locale (decimal separator "${decimal}")` }
  }
  const value = Number(`${sign}${digits || '0'}${fracPart !== undefined ? `.${fracPart}` : ''}`)
  return Number.isFinite(value) ? { value, error: null } : { value: null, error: `"${text}" is not a number` }
}

/** A quote this far from the catalogue price (either way) asks for confirmation. */
export const QUOTE_CONFIRM_FACTOR = 3

/** True when a quoted unit price is more than 3× above or below the catalogue price break (same currency only). */
export function quoteNeedsConfirmation(quoted: number, catalogue: number | null | undefined): boolean {
  if (catalogue == null || !(catalogue > 0) || !(quoted > 0)) return false
  return quoted > catalogue * QUOTE_CONFIRM_FACTOR || quoted < catalogue / QUOTE_CONFIRM_FACTOR
}
