// Display formatting for result numbers: SI prefixes, three significant digits, the active locale's decimal
// mark. No engineering here.
import { formatNumber as formatPlain, formatSi } from '#shared/utils/format'
import { activeLocale } from '~/composables/useLocale'

/** `digits` significant digits in the active locale, no grouping, a true minus sign. */
const significant = (value: number, digits: number) =>
  formatPlain(value, activeLocale(), { significant: digits, grouping: false }).replace('-', '−')

const DASH = '—'

/** "1.23 kV", "780 V", "4.70 mF": value in base SI units, rounded to `digits` significant digits, zeros kept. */
export function formatSI(value: number | null | undefined, unit: string, digits = 3): string {
  return formatSi(value, unit, digits, activeLocale(), { fixed: true })
}

/** Below this magnitude a voltage or current is numerical noise of the integration: shown as 0. */
const NOISE_FLOOR = 1e-6
const denoise = (v: number | null | undefined) => (typeof v === 'number' && Math.abs(v) < NOISE_FLOOR ? 0 : v)

/** V */
export const formatVoltage = (volts: number | null | undefined): string => formatSI(denoise(volts), 'V')
/** A */
export const formatCurrent = (amperes: number | null | undefined): string => formatSI(denoise(amperes), 'A')
/** F, shown in µF / mF */
export const formatCapacitance = (farads: number | null | undefined): string => formatSI(farads, 'F')
/** Hz */
export const formatFrequency = (hertz: number | null | undefined): string => formatSI(hertz, 'Hz')

/** fraction → "31.2 %" */
export function formatPercent(fraction: number | null | undefined, digits = 3): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return DASH
  if (fraction === 0) return '0 %'
  return `${significant(fraction * 100, digits)} %`
}

/** plain number (modulation index, ratios) to `digits` significant digits */
export function formatNumber(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH
  return significant(value, digits)
}

/** whole counts */
export function formatCount(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return DASH
  return String(Math.round(n))
}

/** Trade label of a position kind. */
export function deviceKindLabel(kind: string): string {
  switch (kind) {
    case 'switch': return 'Switch'
    case 'diode': return 'Anti-parallel diode'
    case 'clamp-diode': return 'Clamp diode'
    case 'dc-link': return 'DC link'
    case 'flying': return 'Flying'
    case 'input-filter': return 'Input filter'
    case 'cell': return 'Cell'
    default: return kind
  }
}

/** Short kind label for dense tables: the anti-parallel diode is "Diode". */
export function deviceKindShort(kind: string): string {
  return kind === 'diode' ? 'Diode' : deviceKindLabel(kind)
}

/** V, a standard voltage class: "1.7 kV", "600 V" */
export const formatVoltageClass = (volts: number | null | undefined): string => formatSI(volts, 'V', 2)

/** Same number to display precision: used to mark every cell that shares the column's worst value. */
export function sameAtDisplayPrecision(a: number, b: number, digits = 3): boolean {
  return Number(a.toPrecision(digits)) === Number(b.toPrecision(digits))
}

/** ①, ② … ⑳ for operating point 0, 1 … 19; "#21" beyond. */
export function pointMark(index: number): string {
  if (index < 0) return '?'
  return index < 20 ? String.fromCodePoint(0x2460 + index) : `#${index + 1}`
}
