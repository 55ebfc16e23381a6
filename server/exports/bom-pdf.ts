// A released BOM as a printable PDF (A4 landscape): header with design and revisions on every page,
// the lines with totals, purchasing records, the positions table and the safety note.

import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces'
import type { BomLine, BomPurchase, BomSnapshot } from '../../shared/bom/types'
import { gateMark } from '../../shared/bom/gates'
import { openLinesBySupplier, supplierOf } from '../../shared/bom/purchase'
import { count, DEFAULT_LOCALE, formatDateTime, formatInteger, formatMoney, formatNumber as formatDecimal, formatUnitPrice } from '../../shared/utils/format'
import { PDF_STYLES, TABLE_LAYOUT, heading, keepHeadingsWithContent, pageFrame, renderPdf, safetyBox, type PdfFonts } from './pdf'

export { loadFonts, loadFontsFromNodeModules, type PdfFonts } from './pdf'

function header(text: string, alignment: 'left' | 'right' = 'left'): TableCell {
  return { text, bold: true, alignment }
}

function num(text: string, extra: Record<string, unknown> = {}): TableCell {
  return { text, alignment: 'right', ...extra }
}

/** Currency shown beside the number only when the line differs from the BOM currency. */
function price(value: number | null, line: BomLine, bomCurrency: string, locale: string, unit = false): string {
  const text = unit ? formatUnitPrice(value, locale) : formatMoney(value, null, locale)
  return value !== null && line.currency !== bomCurrency ? `${text} ${line.currency}` : text
}

function linesTable(snapshot: BomSnapshot, locale: string): Content {
  const cur = snapshot.currency
  const body: TableCell[][] = [[
    header('#', 'right'), header('Part number'), header('Manufacturer'), header('Description'), header('References'),
    header('Per set [pcs]', 'right'), header('Build [pcs]', 'right'), header('Spares [pcs]', 'right'), header('Order [pcs]', 'right'),
    header('Break [pcs]', 'right'), header(`Unit [${cur}]`, 'right'), header(`Extended [${cur}]`, 'right'), header('Lead [days]', 'right'), header('Lifecycle'),
  ]]
  snapshot.lines.forEach((line, i) => {
    const description: Content[] = [{ text: line.description }]
    if (line.gate?.length) description.push({ text: `CHECK: ${gateMark(line)}`, bold: true, color: '#b91c1c', fontSize: 6.5 })
    if (line.warnings?.length) description.push({ text: line.warnings.join('; '), italics: true, color: '#92400e', fontSize: 6.5 })
    body.push([
      num(String(i + 1)), { text: line.partNumber || '—' }, { text: line.manufacturer || '—' }, { stack: description },
      { text: line.references.join(', '), fontSize: 6.5 },
      num(formatInteger(line.quantityPerUnit, locale)), num(formatInteger(line.quantityBuild, locale)), num(formatInteger(line.quantitySpares, locale)),
      num(formatInteger(line.quantityOrder, locale), { bold: true }), num(formatInteger(line.priceBreakQuantity, locale)),
      num(price(line.unitPrice, line, cur, locale, true)), num(price(line.extendedPrice, line, cur, locale)),
      num(formatInteger(line.leadTimeDays, locale)), { text: line.lifecycle ?? '—' },
    ])
  })
  const t = snapshot.totals
  const sum = (pick: (l: BomLine) => number) => snapshot.lines.reduce((a, l) => a + pick(l), 0)
  body.push([
    { text: `Total, ${t.lines} lines`, bold: true, colSpan: 5 }, '', '', '', '',
    num(formatInteger(sum(l => l.quantityPerUnit), locale), { bold: true }), num(formatInteger(sum(l => l.quantityBuild), locale), { bold: true }),
    num(formatInteger(sum(l => l.quantitySpares), locale), { bold: true }), num(formatInteger(t.pieces, locale), { bold: true }), '', '',
    num(`${formatMoney(t.extendedPrice, null, locale)} ${cur}`, { bold: true, colSpan: 2 }), '', '',
  ])
  return {
    table: {
      headerRows: 1,
      dontBreakRows: true,
      widths: [16, 70, 72, '*', 90, 34, 34, 34, 38, 34, 44, 58, 30, 40],
      body,
    },
    layout: TABLE_LAYOUT,
  }
}

function excludedNote(snapshot: BomSnapshot): Content | null {
  const parts: string[] = []
  if (snapshot.totals.unpricedLines > 0) parts.push(`${count(snapshot.totals.unpricedLines, 'line')} without a price`)
  if ((snapshot.totals.otherCurrencyLines ?? 0) > 0) parts.push(`${count(snapshot.totals.otherCurrencyLines ?? 0, 'line')} priced in another currency`)
  return parts.length > 0 ? { text: `Not in the total: ${parts.join(', ')}.`, italics: true, margin: [0, 3, 0, 0] } : null
}

function purchaseTable(snapshot: BomSnapshot, purchase: BomPurchase, locale: string): Content | null {
  const rows = snapshot.lines.map((line, i) => ({ line, i, p: purchase[line.key] })).filter(r => r.p)
  if (rows.length === 0) return null
  const cur = snapshot.currency
  const body: TableCell[][] = [[header('#', 'right'), header('Part number'), header('Ordered from'), header('Order [pcs]', 'right'), header(`Quoted unit [${cur}]`, 'right'), header(`Quoted extended [${cur}]`, 'right'), header('Order reference'), header('Status'), header('Promised delivery')]]
  // Grouped by the supplier the line is bought from.
  rows.sort((a, b) => supplierOf(a.line, purchase).localeCompare(supplierOf(b.line, purchase)) || a.i - b.i)
  for (const { line, i, p } of rows) {
    const quoted = p!.quotedUnitPrice ?? null
    const quoteCurrency = p!.quoteCurrency ?? line.currency
    const quotedText = (v: number | null, unit: boolean) => (v === null ? '—' : `${unit ? formatUnitPrice(v, locale) : formatMoney(v, null, locale)}${quoteCurrency !== cur ? ` ${quoteCurrency}` : ''}`)
    const status = p!.status ?? 'to-quote'
    body.push([
      num(String(i + 1)), { text: line.partNumber || line.description }, { text: p!.supplier ?? '—' }, num(formatInteger(line.quantityOrder, locale)),
      num(quotedText(quoted, true)), num(quotedText(quoted === null ? null : quoted * line.quantityOrder, false)), { text: p!.orderReference ?? '—' },
      { text: `${status}${p!.statusDates?.[status] ? ` (${p!.statusDates[status]})` : ''}` }, { text: p!.promisedDelivery ?? '—' },
    ])
  }
  return [
    heading('Purchasing'),
    { table: { headerRows: 1, dontBreakRows: true, widths: [16, 100, 120, 44, 60, 70, '*', 70, 60], body }, layout: TABLE_LAYOUT },
  ]
}

function positionsTable(snapshot: BomSnapshot, locale: string): Content {
  const body: TableCell[][] = [[header('Side'), header('Position'), header('Manufacturer'), header('Part number'), header('Per converter set [pcs]', 'right'), header('In series [pcs]', 'right'), header('In parallel [pcs]', 'right'), header('Covered by')]]
  for (const p of snapshot.positions) {
    body.push([{ text: p.side }, { text: p.position }, { text: p.manufacturer }, { text: p.partNumber }, num(formatInteger(p.perConverter, locale)), num(formatInteger(p.seriesCount, locale)), num(formatInteger(p.parallelCount, locale)), { text: p.coveredBy ? `module at ${p.coveredBy}` : '' }])
  }
  return { table: { headerRows: 1, dontBreakRows: true, widths: [50, 60, 140, 110, 70, 50, 50, '*'], body }, layout: TABLE_LAYOUT }
}

/** The BOM as PDF bytes. Fonts come from the caller (server asset or node_modules). */
export async function bomToPdf(full: BomSnapshot, fonts: PdfFonts, purchase: BomPurchase = {}, options: { openOnly?: boolean, locale?: string } = {}): Promise<Buffer> {
  const locale = options.locale ?? DEFAULT_LOCALE
  // Purchasing's open-lines view: lines not yet received, ordered by supplier.
  const snapshot = options.openOnly ? openLinesBySupplier(full, purchase) : full
  const title = `Bill of materials: ${snapshot.designName}`
  const released = `released ${formatDateTime(snapshot.releasedAt, locale)} by ${snapshot.releasedBy}`
  const summary: TableCell[][] = [
    [header('Design'), { text: `${snapshot.designName}, revision ${snapshot.designRevision}` }, header('BOM revision'), { text: String(snapshot.revision) }],
    [header('Topology'), { text: snapshot.topologySummary }, header('Released'), { text: `${formatDateTime(snapshot.releasedAt, locale)} by ${snapshot.releasedBy}` }],
    [header('Build quantity'), { text: `${formatInteger(snapshot.buildQuantity, locale)} sets, spares ${snapshot.sparesPercent} %` }, header('Total'), { text: `${formatMoney(snapshot.totals.extendedPrice, null, locale)} ${snapshot.currency}`, bold: true }],
  ]
  const designRows: TableCell[][] = snapshot.designSummary.map(([label, value, unit]) => [{ text: label }, num(typeof value === 'number' ? formatDecimal(value, locale) : value), { text: unit }])

  const content: Content[] = [
    { text: title, style: 'h1' },
    { table: { widths: [70, '*', 70, '*'], body: summary }, layout: 'noBorders', margin: [0, 0, 0, 8] },
    linesTable(snapshot, locale),
  ]
  const note = excludedNote(snapshot)
  if (note) content.push(note)
  const purchasing = purchaseTable(snapshot, purchase, locale)
  if (purchasing) content.push(purchasing)
  content.push(heading('Positions'), positionsTable(snapshot, locale))
  if (designRows.length > 0) {
    content.push(heading('Design summary'), { table: { headerRows: 0, widths: [160, 80, 40], body: designRows }, layout: TABLE_LAYOUT })
  }
  content.push(safetyBox(snapshot.safetyNote))

  const doc: TDocumentDefinitions = {
    pageSize: 'A4',
    pageOrientation: 'landscape',
    pageMargins: [30, 40, 30, 34],
    info: { title: `${title} (design rev ${snapshot.designRevision}, BOM rev ${snapshot.revision})`, author: snapshot.releasedBy, subject: 'Bill of materials', creator: 'Stratavolt', producer: 'Stratavolt' },
    ...pageFrame(snapshot.company, `${snapshot.designName} · design rev ${snapshot.designRevision} · BOM rev ${snapshot.revision}`, released, 'Stratavolt bill of materials: a design aid; vendor datasheets govern part ratings.'),
    content,
    pageBreakBefore: keepHeadingsWithContent as TDocumentDefinitions['pageBreakBefore'],
    styles: PDF_STYLES as unknown as TDocumentDefinitions['styles'],
    defaultStyle: { font: 'Roboto', fontSize: 7.5, lineHeight: 1.1 },
  }
  return renderPdf(doc, fonts)
}
