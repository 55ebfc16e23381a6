// A printable design report (A4 portrait): inputs, schematic, operating points, device and capacitor
// ratings, waveform and spectrum, warnings and the safety note. Built from a plain object so the
// route decides what goes in; SI units in every column header.

import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces'
import { formatDateTime, formatNumber } from '../../shared/utils/format'
import { PDF_STYLES, TABLE_LAYOUT, heading, keepHeadingsWithContent, pageFrame, renderPdf, safetyBox, selfContainedSvg, type PdfFonts } from './pdf'

export { loadFonts, loadFontsFromNodeModules, type PdfFonts } from './pdf'

export interface ReportOperatingPoint {
  name: string
  /** V, output fundamental line-to-line RMS */
  lineVoltageRms: number
  /** A, phase current RMS */
  phaseCurrentRms: number
  /** −1…1, negative = regeneration */
  powerFactor: number
  /** lagging (default) or leading */
  powerFactorSense?: 'lagging' | 'leading'
  /** Hz */
  fundamentalHz: number
  modulationIndex?: number
  /** fraction (0.31 = 31 %) */
  lineVoltageThd?: number
}

/** One device position (the engine's DeviceEnvelope fits as it is). */
export interface ReportDeviceRow {
  /** 'machine' / 'grid' when the design has two converters */
  converter?: string
  name: string
  kind: string
  countPerPhase: number
  /** V, steady state at the worst-case DC link */
  blockingVoltage: number
  /** V */
  blockingVoltageWithOvershoot: number
  /** A */
  currentAvg: number
  /** A */
  currentRms: number
  /** A */
  currentPeak: number
  /** V, part voltage class needed after derating */
  requiredVoltageRating: number
  /** A, part current rating needed after derating */
  requiredCurrentRating: number
}

/** One capacitor position (the engine's CapacitorEnvelope fits as it is). */
export interface ReportCapacitorRow {
  converter?: string
  name: string
  kind: string
  count: number
  /** V */
  voltage: number
  /** A RMS */
  rippleCurrentRms: number
  /** F */
  capacitanceRequired?: number
  /** V */
  requiredVoltageRating?: number
  /** A RMS */
  requiredRippleRating?: number
}

export interface DesignReport {
  company?: string
  designName: string
  revision: number | string
  author: string
  /** ISO date-time */
  date: string
  /** the requesting user's locale for numbers and dates (default en-GB) */
  locale?: string
  topologySummary?: string
  /** [label, value, unit] */
  inputs: [string, string | number, string][]
  operatingPoints: ReportOperatingPoint[]
  devices: ReportDeviceRow[]
  capacitors: ReportCapacitorRow[]
  warnings: string[]
  /** the converter schematic as an SVG document (scripts, images and outside links are removed) */
  schematicSvg?: string
  /** one fundamental period of the operating point named in `title` */
  waveform?: {
    title?: string
    /** s */
    time: number[]
    /** V, line-to-line */
    lineVoltage: number[]
    /** A, phase current */
    phaseCurrent?: number[]
  }
  /** line-voltage spectrum: harmonic order, Hz, V peak */
  spectrum?: { order: number, frequency?: number, amplitude: number }[]
  /** fraction (0.31 = 31 %) */
  lineVoltageThd?: number
  /** the parts, losses, T_j and lifetime (the design's current revision with assigned parts) */
  evaluation?: ReportEvaluation
  safetyNote: string
}

/** Assigned parts and what they give per operating point: losses, efficiency, T_j mean and peak, lifetime. */
export interface ReportEvaluation {
  /** [label, value]: the derating policy as applied */
  derating: [string, string][]
  /** one sentence each */
  assumptions: string[]
  parts: { side: string, position: string, part: string, arrangement: string, meanC: number | null, peakC: number | null, limitC: number | null, peakPoint: string | null }[]
  /** per converter side and operating point */
  points: { side: string, pointName: string, lossW: number, efficiency: number | null, meanC: number | null, peakC: number | null, hottest: string | null }[]
  /** headline figures [label, value] for the summary page */
  headline: [string, string][]
  life: null | {
    limiting: string | null
    positions: { side: string, position: string, part: string, lifeHours: number, method: string, source: string }[]
  }
  /** why figures are missing (e.g. positions without a part) */
  gaps: string[]
}

/** Report input the PDF cannot be made from; `field` names it. */
export class DesignReportError extends Error {
  constructor(readonly field: string, message: string) {
    super(`${field}: ${message}`)
    this.name = 'DesignReportError'
  }
}

const MAX_SPECTRUM_ROWS = 40
const MAX_WAVEFORM_POINTS = 600

function check(report: DesignReport): void {
  if (typeof report?.designName !== 'string' || report.designName.trim() === '') throw new DesignReportError('designName', 'a design name is required')
  for (const list of ['inputs', 'operatingPoints', 'devices', 'capacitors', 'warnings'] as const) {
    if (!Array.isArray(report[list])) throw new DesignReportError(list, 'must be a list (empty if there is nothing to show)')
  }
  if (typeof report.safetyNote !== 'string' || report.safetyNote.trim() === '') throw new DesignReportError('safetyNote', 'the safety note is required')
  const w = report.waveform
  if (w) {
    if (!Array.isArray(w.time) || !Array.isArray(w.lineVoltage) || w.time.length !== w.lineVoltage.length) throw new DesignReportError('waveform.lineVoltage', 'must have one value per time sample')
    if (w.phaseCurrent && w.phaseCurrent.length !== w.time.length) throw new DesignReportError('waveform.phaseCurrent', 'must have one value per time sample')
  }
}

const h = (text: string, alignment: 'left' | 'right' = 'right'): TableCell => ({ text, bold: true, alignment })
const cellIn = (locale: string | undefined) => (value: number | null | undefined, digits: number): TableCell => ({ text: formatNumber(value, locale, { decimals: digits }), alignment: 'right' })

function table(widths: (number | string)[], head: TableCell[], rows: TableCell[][]): Content {
  return { table: { headerRows: 1, dontBreakRows: true, widths, body: [head, ...rows] }, layout: TABLE_LAYOUT }
}

function inputsTable(report: DesignReport): Content {
  const n = cellIn(report.locale)
  return table([170, 120, 50], [h('Input', 'left'), h('Value'), h('Unit', 'left')],
    report.inputs.map(([label, value, unit]) => [{ text: label }, typeof value === 'number' ? n(value, Number.isInteger(value) ? 0 : 2) : { text: value, alignment: 'right' }, { text: unit }]))
}

function operatingPointsTable(report: DesignReport): Content {
  const n = cellIn(report.locale)
  return table(['*', 60, 55, 40, 45, 40, 45],
    [h('Operating point', 'left'), h('V line RMS [V]'), h('I phase RMS [A]'), h('PF'), h('f [Hz]'), h('m'), h('THD [%]')],
    report.operatingPoints.map(p => [
      { text: p.name }, n(p.lineVoltageRms, 0), n(p.phaseCurrentRms, 1), p.powerFactorSense === 'leading' ? { text: `${formatNumber(p.powerFactor, undefined, { decimals: 2 })} lead`, alignment: 'right' } : n(p.powerFactor, 2), n(p.fundamentalHz, 1),
      n(p.modulationIndex, 3), n(p.lineVoltageThd == null ? null : p.lineVoltageThd * 100, 1),
    ]))
}

function devicesTable(report: DesignReport): Content {
  const n = cellIn(report.locale)
  const withConverter = report.devices.some(d => d.converter)
  const head = [
    ...(withConverter ? [h('Side', 'left')] : []), h('Position', 'left'), h('Kind', 'left'), h('Per phase'), h('Blocking [V]'), h('With overshoot [V]'),
    h('I avg [A]'), h('I RMS [A]'), h('I peak [A]'), h('Required V rating [V]'), h('Required I rating [A]'),
  ]
  const rows = report.devices.map(d => [
    ...(withConverter ? [{ text: d.converter ?? '' }] : []), { text: d.name }, { text: d.kind }, n(d.countPerPhase, 0), n(d.blockingVoltage, 0),
    n(d.blockingVoltageWithOvershoot, 0), n(d.currentAvg, 1), n(d.currentRms, 1), n(d.currentPeak, 1), n(d.requiredVoltageRating, 0), n(d.requiredCurrentRating, 0),
  ])
  return table([...(withConverter ? [38] : []), 42, 50, 30, 42, 46, 36, 36, 36, 50, 50], head, rows)
}

function capacitorsTable(report: DesignReport): Content {
  const n = cellIn(report.locale)
  const withConverter = report.capacitors.some(c => c.converter)
  const head = [
    ...(withConverter ? [h('Side', 'left')] : []), h('Position', 'left'), h('Kind', 'left'), h('Count'), h('Voltage [V]'), h('Ripple RMS [A]'),
    h('Capacitance needed [µF]'), h('Required V rating [V]'), h('Required ripple rating [A]'),
  ]
  const rows = report.capacitors.map(c => [
    ...(withConverter ? [{ text: c.converter ?? '' }] : []), { text: c.name }, { text: c.kind }, n(c.count, 0), n(c.voltage, 0), n(c.rippleCurrentRms, 1),
    n(c.capacitanceRequired == null ? null : c.capacitanceRequired * 1e6, 0), n(c.requiredVoltageRating, 0), n(c.requiredRippleRating, 1),
  ])
  return table([...(withConverter ? [38] : []), 50, 50, 36, 50, 54, 64, 60, 64], head, rows)
}

/** Box to fit the drawing in: its own size (pt) when it declares one and that fits, never enlarged. */
function svgFit(svg: string, maxWidth: number, maxHeight: number): [number, number] {
  const root = /<svg\b[^>]*>/i.exec(svg)?.[0] ?? ''
  const size = (name: string) => Number(new RegExp(`\\s${name}\\s*=\\s*["']\\s*([0-9.]+)\\s*(?:px|pt)?\\s*["']`, 'i').exec(root)?.[1] ?? NaN)
  const width = size('width')
  const height = size('height')
  return [Number.isFinite(width) && width > 0 ? Math.min(width, maxWidth) : maxWidth, Number.isFinite(height) && height > 0 ? Math.min(height, maxHeight) : maxHeight]
}

/** Every k-th sample so the drawing stays small; the last sample is kept. */
function decimate(count: number): number[] {
  const step = Math.max(1, Math.ceil(count / MAX_WAVEFORM_POINTS))
  const picks: number[] = []
  for (let i = 0; i < count; i += step) picks.push(i)
  if (picks.at(-1) !== count - 1 && count > 0) picks.push(count - 1)
  return picks
}

/** A plain line chart (no text inside: labels are PDF text beside it, so the fonts stay ours). */
interface Trace { values: number[], colour: string, dashed?: boolean }

export function waveformSvg(time: number[], traces: Trace[], width = 500, height = 160): string {
  const picks = decimate(time.length)
  const t0 = time[0] ?? 0
  const t1 = time.at(-1) ?? 1
  const span = t1 - t0 || 1
  const pad = 4
  const lines: string[] = [
    `<rect x="0.5" y="0.5" width="${width - 1}" height="${height - 1}" fill="none" stroke="#9ca3af" stroke-width="0.6"/>`,
    `<line x1="0" y1="${height / 2}" x2="${width}" y2="${height / 2}" stroke="#9ca3af" stroke-width="0.5"/>`,
  ]
  for (let q = 1; q < 4; q++) lines.push(`<line x1="${(width * q) / 4}" y1="0" x2="${(width * q) / 4}" y2="${height}" stroke="#e5e7eb" stroke-width="0.5"/>`)
  for (const trace of traces) {
    // each trace scaled to its own peak, centred on the zero line
    const peak = picks.reduce((m, i) => Math.max(m, Math.abs(trace.values[i] ?? 0)), 1e-12)
    const points = picks.map((i) => {
      const x = ((time[i]! - t0) / span) * width
      const y = height / 2 - ((trace.values[i] ?? 0) / peak) * (height / 2 - pad)
      return `${x.toFixed(1)},${y.toFixed(1)}`
    })
    lines.push(`<polyline fill="none" stroke="${trace.colour}" stroke-width="0.9"${trace.dashed ? ' stroke-dasharray="3,2"' : ''} points="${points.join(' ')}"/>`)
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${lines.join('')}</svg>`
}

function waveformSection(report: DesignReport): Content[] {
  const w = report.waveform
  if (!w || w.time.length < 2) return []
  const peakOf = (values: number[]) => values.reduce((m, v) => Math.max(m, Math.abs(v)), 0)
  const peakV = peakOf(w.lineVoltage)
  const traces: Trace[] = [{ values: w.lineVoltage, colour: '#111827' }]
  let legend = `Black: line-to-line voltage, ±${formatNumber(peakV, report.locale, { decimals: 0 })} V full scale`
  if (w.phaseCurrent) {
    const peakI = peakOf(w.phaseCurrent)
    traces.push({ values: w.phaseCurrent, colour: '#b45309', dashed: true })
    legend += `; orange dashed: phase current, ±${formatNumber(peakI, report.locale, { decimals: 1 })} A full scale`
  }
  legend += `; time axis ${formatNumber((w.time.at(-1)! - w.time[0]!) * 1000, report.locale, { decimals: 2 })} ms, quarter divisions.`
  return [
    heading(w.title ? `Waveform: ${w.title}` : 'Waveform'),
    { stack: [{ svg: waveformSvg(w.time, traces), width: 500 }, { text: legend, style: 'small', margin: [0, 2, 0, 0] }], unbreakable: true },
  ]
}

function spectrumSection(report: DesignReport): Content[] {
  const n = cellIn(report.locale)
  const lines = report.spectrum ?? []
  const out: Content[] = []
  if (lines.length === 0 && report.lineVoltageThd == null) return out
  out.push(heading('Line-voltage spectrum'))
  if (report.lineVoltageThd != null) out.push({ text: `Total harmonic distortion of the line voltage (THD, full band): ${formatNumber(report.lineVoltageThd * 100, report.locale, { decimals: 1 })} %`, margin: [0, 0, 0, 4] })
  if (lines.length === 0) return out
  const fundamental = lines.find(l => l.order === 1)?.amplitude
  const shown = lines.length > MAX_SPECTRUM_ROWS
    ? [...lines].sort((a, b) => b.amplitude - a.amplitude).slice(0, MAX_SPECTRUM_ROWS).sort((a, b) => a.order - b.order)
    : [...lines].sort((a, b) => a.order - b.order)
  out.push(table([50, 70, 80, 80], [h('Order'), h('Frequency [Hz]'), h('Amplitude [V peak]'), h('Of fundamental [%]')],
    shown.map(l => [n(l.order, 0), n(l.frequency, 1), n(l.amplitude, 1), n(fundamental ? (l.amplitude / fundamental) * 100 : null, 1)])))
  if (shown.length < lines.length) out.push({ text: `The ${shown.length} largest of ${lines.length} spectral lines are shown.`, style: 'small', margin: [0, 2, 0, 0] })
  return out
}

const hoursText = (h: number, locale?: string) => (Number.isFinite(h) ? `${formatNumber(Math.round(h), locale, { decimals: 0 })} h` : 'no cycling')

/** Page 1: the figures a review signs off, the assumptions, and the signature block. */
function reviewSummary(report: DesignReport, e: ReportEvaluation): Content[] {
  const n = cellIn(report.locale)
  const out: Content[] = [
    { text: `Design review summary: ${report.designName}`, style: 'h1' },
    { text: [`Revision ${report.revision}`, ` · ${report.author}`, ` · ${formatDateTime(report.date, report.locale)}`].join(''), margin: [0, 0, 0, 2] },
  ]
  if (report.topologySummary) out.push({ text: report.topologySummary, margin: [0, 0, 0, 4] })
  out.push(heading('Key figures'), table([200, '*'], [h('Figure', 'left'), h('Value', 'left')], e.headline.map(([k, v]) => [{ text: k }, { text: v }])))
  if (e.life?.limiting) out.push({ text: `Lifetime limited by ${e.life.limiting}.`, bold: true, margin: [0, 4, 0, 0] })
  out.push(heading('Assigned parts'), table([40, 44, '*', 40, 44, 44, 44], [h('Side', 'left'), h('Position', 'left'), h('Part', 'left'), h('S × P'), h('T_j mean [°C]'), h('T_j peak [°C]'), h('Limit [°C]')],
    e.parts.map(p => [{ text: p.side }, { text: p.position }, { text: p.part }, { text: p.arrangement, alignment: 'right' }, n(p.meanC, 1), { ...n(p.peakC, 1) as object, ...(p.peakC !== null && p.limitC !== null && p.peakC > p.limitC ? { bold: true, color: '#b91c1c' } : {}) } as TableCell, n(p.limitC, 0)])))
  out.push(heading('Derating policy'), table([200, 100], [h('Rule', 'left'), h('Value')], e.derating.map(([k, v]) => [{ text: k }, { text: v, alignment: 'right' }])))
  out.push(heading('Assumptions'), { ul: [...e.assumptions, ...e.gaps].map(a => ({ text: a, style: 'small' })) })
  out.push(heading('Sign-off'), table([90, '*', 80, 110], [h('Role', 'left'), h('Name', 'left'), h('Date', 'left'), h('Signature', 'left')],
    ['Prepared by', 'Reviewed by', 'Approved by'].map(role => [{ text: role, margin: [0, 8, 0, 8] }, { text: '' }, { text: '' }, { text: '' }])))
  return out
}

/** Losses, efficiency and T_j per operating point, and the lifetime per position. */
function evaluationSection(report: DesignReport, e: ReportEvaluation): Content[] {
  const n = cellIn(report.locale)
  const out: Content[] = [heading('Losses and junction temperature per operating point (assigned parts)')]
  out.push(table([40, '*', 60, 50, 50, 50, 70], [h('Side', 'left'), h('Operating point', 'left'), h('Losses [W]'), h('Efficiency [%]'), h('T_j mean [°C]'), h('T_j peak [°C]'), h('Hottest', 'left')],
    e.points.map(p => [{ text: p.side }, { text: p.pointName }, n(p.lossW, 0), n(p.efficiency === null ? null : p.efficiency * 100, 2), n(p.meanC, 1), n(p.peakC, 1), { text: p.hottest ?? '—' }])))
  out.push({ text: 'T_j mean and peak: the highest over the positions at that point, the peak from time-stepping the instantaneous losses over the fundamental period.', style: 'small', margin: [0, 2, 0, 0] })
  if (e.life) {
    out.push(heading('Lifetime from the mission profile'))
    if (e.life.limiting) out.push({ text: `Limited by ${e.life.limiting}.`, margin: [0, 0, 0, 3] })
    out.push(table([40, 44, 80, 60, '*'], [h('Side', 'left'), h('Position', 'left'), h('Part', 'left'), h('Life'), h('Method and source', 'left')],
      e.life.positions.map(p => [{ text: p.side }, { text: p.position }, { text: p.part }, { text: hoursText(p.lifeHours, report.locale), alignment: 'right' }, { text: `${p.method}. ${p.source}`, style: 'small' }])))
  }
  return out
}

function documentFor(report: DesignReport, schematic: 'draw' | { failed: string }): TDocumentDefinitions {
  const title = `Design report: ${report.designName}`
  const content: Content[] = [
    ...(report.evaluation ? reviewSummary(report, report.evaluation) : []),
    { text: title, style: 'h1', ...(report.evaluation ? { pageBreak: 'before' as const } : {}) },
    { text: [`Revision ${report.revision}`, ` · ${report.author}`, ` · ${formatDateTime(report.date, report.locale)}`].join(''), margin: [0, 0, 0, 2] },
  ]
  if (report.topologySummary) content.push({ text: report.topologySummary, margin: [0, 0, 0, 6] })
  content.push(heading('Inputs'), inputsTable(report))
  if (report.schematicSvg) {
    // A tall leg (many levels) gets a page of its own so that its labels stay readable.
    const [w, h] = svgFit(report.schematicSvg, 10_000, 10_000)
    const tall = (515 * h) / w > 300
    content.push(tall ? { ...(heading('Schematic') as object), pageBreak: 'before' } as Content : heading('Schematic'))
    if (schematic === 'draw') {
      // The caption in regular weight sets the font that any text inside the SVG falls back to.
      content.push({ text: 'One phase leg and the DC link; position names as in the tables below.', style: 'small', margin: [0, 0, 0, 3] })
      // Text inside the SVG cannot name our fonts (pdfmake resolves them by path); the warning is expected.
      content.push({ svg: selfContainedSvg(report.schematicSvg), fit: svgFit(report.schematicSvg, 515, tall ? 660 : 260), options: { warningCallback: () => {} } } as unknown as Content)
    }
    else {
      content.push({ text: `The schematic could not be drawn: ${schematic.failed}`, italics: true })
    }
  }
  if (report.operatingPoints.length > 0) content.push(heading('Operating points'), operatingPointsTable(report))
  if (report.devices.length > 0) content.push(heading('Device positions (worst case over the operating points)'), devicesTable(report))
  if (report.capacitors.length > 0) content.push(heading('Capacitors'), capacitorsTable(report))
  if (report.evaluation) content.push(...evaluationSection(report, report.evaluation))
  content.push(...waveformSection(report), ...spectrumSection(report))
  content.push(heading('Warnings'))
  content.push(report.warnings.length > 0 ? { ul: report.warnings.map(w => ({ text: w })) } : { text: 'None.' })
  content.push(safetyBox(report.safetyNote))

  return {
    pageSize: 'A4',
    pageOrientation: 'portrait',
    pageMargins: [30, 40, 30, 34],
    info: { title: `${title} (rev ${report.revision})`, author: report.author, subject: 'Converter design report', creator: 'Stratavolt', producer: 'Stratavolt' },
    ...pageFrame(report.company ?? '', `${report.designName} · rev ${report.revision}`, formatDateTime(report.date, report.locale), 'Stratavolt design report: a design aid; vendor datasheets govern part ratings.'),
    content,
    pageBreakBefore: keepHeadingsWithContent as TDocumentDefinitions['pageBreakBefore'],
    styles: PDF_STYLES as unknown as TDocumentDefinitions['styles'],
    defaultStyle: { font: 'Roboto', fontSize: 8, lineHeight: 1.1 },
  }
}

/** The report as PDF bytes. A schematic that cannot be drawn is replaced by a note, not an error. */
export async function designReportPdf(report: DesignReport, fonts: PdfFonts): Promise<Buffer> {
  check(report)
  try {
    return await renderPdf(documentFor(report, 'draw'), fonts)
  }
  catch (error) {
    if (!report.schematicSvg) throw error
    return renderPdf(documentFor(report, { failed: error instanceof Error ? error.message : String(error) }), fonts)
  }
}
