// Shows a value in SI units with a prefix: 1200 → "1.2 kV" (en-GB) / "1,2 kV" (de-DE). Used by forms (display) and reports.
import { DEFAULT_LOCALE, formatNumber } from './format'

const PREFIXES: [number, string][] = [[1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n']]

export function formatSi(value: number | null | undefined, unit: string, digits = 4, locale: string = DEFAULT_LOCALE): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  if (value === 0) return `0 ${unit}`.trim()
  const abs = Math.abs(value)
  const [factor, prefix] = PREFIXES.find(([f]) => abs >= f * 0.9999) ?? PREFIXES[PREFIXES.length - 1]!
  const scaled = Number((value / factor).toPrecision(digits))
  return `${formatNumber(scaled, locale, { significant: digits, grouping: false })} ${prefix}${unit}`.trim()
}
