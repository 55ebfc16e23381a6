// A released BOM as an .xlsx workbook for purchasing: sheet "BOM" (real numbers, formulas with
// cached results, frozen header, filter), "Design" (summary and safety note), "Positions".

import ExcelJS from 'exceljs'
import type { BomLine, BomPurchase, BomSnapshot } from '../../shared/bom/types'
import { neutraliseFormula } from '../../shared/bom/formula-safety'
import { diffBoms } from '../../shared/bom/diff'
import { gateMark } from '../../shared/bom/gates'
import { openLinesBySupplier, stockShortfall } from '../../shared/bom/purchase'
import { count, DEFAULT_LOCALE, formatDateTime } from '../../shared/utils/format'
import { extendedPrice, roundMoney } from '../../shared/utils/money'

export interface BomXlsxOptions {
  /** the previous release: adds the "Changes" sheet */
  previous?: BomSnapshot | null
  /** only lines not yet received, ordered by supplier */
  openOnly?: boolean
  /** the requesting user's locale, for the text cells that carry a date (numbers stay numbers) */
  locale?: string
}

type CellValue = string | number | null | { formula: string, result: number }

interface Column {
  header: string
  /** characters */
  width: number
  numFmt?: string
  value: (line: BomLine, purchase: BomPurchase[string] | undefined, row: number) => CellValue
}

const QTY = '#,##0'
const PRICE = '#,##0.00##'
const MONEY = '#,##0.00'

/** Every text cell goes through here: formula-looking text is neutralised. */
function text(value: string | null | undefined): string | null {
  return value == null || value === '' ? null : neutraliseFormula(value)
}

/** Header/footer text: "&" starts a control code there and must be doubled. */
function headerText(value: string | number): string {
  return String(value).replace(/&/g, '&&')
}

function bomColumns(currency: string, letter: (key: string) => string): Record<string, Column> {
  return {
    line: { header: 'Line', width: 6, numFmt: '0', value: (_l, _p, row) => row - 1 },
    manufacturer: { header: 'Manufacturer', width: 24, value: l => text(l.manufacturer) },
    partNumber: { header: 'Part number', width: 22, value: l => text(l.partNumber) },
    description: { header: 'Description', width: 40, value: l => text(l.description) },
    category: { header: 'Category', width: 12, value: l => text(l.category) },
    references: { header: 'References', width: 34, value: l => text(l.references.join(', ')) },
    quantityPerUnit: { header: 'Qty per set [pcs]', width: 11, numFmt: QTY, value: l => l.quantityPerUnit },
    quantityBuild: { header: 'Qty build [pcs]', width: 11, numFmt: QTY, value: l => l.quantityBuild },
    quantitySpares: { header: 'Spares [pcs]', width: 10, numFmt: QTY, value: l => l.quantitySpares },
    quantityOrder: { header: 'Qty to order [pcs]', width: 12, numFmt: QTY, value: l => l.quantityOrder },
    priceBreak: { header: 'Price break [pcs]', width: 11, numFmt: QTY, value: l => l.priceBreakQuantity },
    unitPrice: { header: `Unit price [${currency}]`, width: 13, numFmt: PRICE, value: l => l.unitPrice },
    currency: { header: 'Currency', width: 9, value: l => text(l.currency) },
    extendedPrice: {
      header: `Extended price [${currency}]`, width: 15, numFmt: MONEY,
      value: (l, _p, row) => l.unitPrice === null ? null : { formula: `${letter('quantityOrder')}${row}*${letter('unitPrice')}${row}`, result: extendedPrice(l.unitPrice, l.quantityOrder) },
    },
    moq: { header: 'MOQ [pcs]', width: 10, numFmt: QTY, value: l => l.moq },
    leadTime: { header: 'Lead time [days]', width: 10, numFmt: '0', value: l => l.leadTimeDays },
    stock: { header: 'Stock [pcs]', width: 10, numFmt: QTY, value: l => l.stock },
    stockShort: { header: 'Short of stock [pcs]', width: 10, numFmt: QTY, value: l => stockShortfall(l) || null },
    approval: { header: 'Approval / lifecycle check', width: 36, value: l => text(gateMark(l)) },
    lifecycle: { header: 'Lifecycle', width: 10, value: l => text(l.lifecycle) },
    supplier: { header: 'Catalogue supplier', width: 22, value: l => text(l.supplier) },
    purchaseSupplier: { header: 'Ordered from', width: 22, value: (_l, p) => text(p?.supplier) },
    quotedUnitPrice: { header: `Quoted unit price [${currency}]`, width: 14, numFmt: PRICE, value: (_l, p) => p?.quotedUnitPrice ?? null },
    quotedExtended: {
      header: `Quoted extended [${currency}]`, width: 15, numFmt: MONEY,
      value: (l, p, row) => p?.quotedUnitPrice == null ? null : { formula: `${letter('quantityOrder')}${row}*${letter('quotedUnitPrice')}${row}`, result: extendedPrice(p.quotedUnitPrice, l.quantityOrder) },
    },
    orderReference: { header: 'Order reference', width: 18, value: (_l, p) => text(p?.orderReference) },
    quoteCurrency: { header: 'Quote currency', width: 9, value: (l, p) => p?.quotedUnitPrice == null ? null : text(p?.quoteCurrency ?? l.currency) },
    status: { header: 'Purchasing status', width: 12, value: (_l, p) => text(p?.status ?? 'to-quote') },
    statusDate: { header: 'Status since', width: 12, value: (_l, p) => text(p?.status ? p.statusDates?.[p.status] : null) },
    promisedDelivery: { header: 'Promised delivery', width: 12, value: (_l, p) => text(p?.promisedDelivery) },
    notes: { header: 'Notes', width: 40, value: l => text((l.warnings ?? []).join('; ')) },
  }
}

const COLUMN_ORDER = [
  'line', 'manufacturer', 'partNumber', 'description', 'category', 'references', 'quantityPerUnit', 'quantityBuild',
  'quantitySpares', 'quantityOrder', 'priceBreak', 'unitPrice', 'currency', 'extendedPrice', 'moq', 'leadTime', 'stock',
  'lifecycle', 'supplier', 'purchaseSupplier', 'quotedUnitPrice', 'quotedExtended', 'orderReference', 'notes',
  'stockShort', 'approval', 'quoteCurrency', 'status', 'statusDate', 'promisedDelivery',
] as const

/** Column letter of the 1-based column number (1 → A, 27 → AA). */
function columnLetter(n: number): string {
  let s = ''
  for (let k = n; k > 0; k = Math.floor((k - 1) / 26)) s = String.fromCharCode(65 + ((k - 1) % 26)) + s
  return s
}

function styleHeader(row: ExcelJS.Row): void {
  row.font = { bold: true }
  row.alignment = { vertical: 'bottom', wrapText: true }
  row.height = 30
  row.eachCell((cell) => {
    cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE5E7EB' } }
    cell.border = { bottom: { style: 'thin' } }
  })
}

function addBomSheet(workbook: ExcelJS.Workbook, snapshot: BomSnapshot, purchase: BomPurchase): void {
  const sheet = workbook.addWorksheet('BOM', {
    views: [{ state: 'frozen', xSplit: 3, ySplit: 1 }],
    pageSetup: { orientation: 'landscape', paperSize: 9, fitToPage: true, fitToWidth: 1, fitToHeight: 0, printTitlesRow: '1:1' },
    headerFooter: {
      oddHeader: `&L${headerText(snapshot.company)}&C${headerText(snapshot.designName)} rev ${snapshot.designRevision}&RBOM rev ${snapshot.revision}`,
      oddFooter: '&LStratavolt BOM&RPage &P of &N',
    },
  })
  const letterOf = (key: string) => columnLetter(COLUMN_ORDER.indexOf(key as (typeof COLUMN_ORDER)[number]) + 1)
  const defs = bomColumns(snapshot.currency, letterOf)
  const columns = COLUMN_ORDER.map(key => defs[key]!)
  sheet.columns = columns.map(c => ({ width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }))

  styleHeader(sheet.addRow(columns.map(c => c.header)))
  snapshot.lines.forEach((line, i) => {
    const rowNumber = i + 2
    const row = sheet.addRow(columns.map(c => c.value(line, purchase[line.key], rowNumber)))
    row.alignment = { vertical: 'top' }
    // Lines priced in another currency say so in the number itself.
    if (line.currency !== snapshot.currency) {
      const fmt = `#,##0.00 "${line.currency.replace(/"/g, '')}"`
      for (const key of ['unitPrice', 'extendedPrice', 'quotedUnitPrice', 'quotedExtended']) row.getCell(letterOf(key)).numFmt = fmt
    }
  })
  const lastLineRow = snapshot.lines.length + 1
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: Math.max(lastLineRow, 1), column: columns.length } }

  // Totals one row below the lines, outside the filter range, so sorting never moves them.
  const totalsRow = sheet.getRow(lastLineRow + 2)
  const range = (key: string) => `${letterOf(key)}2:${letterOf(key)}${Math.max(lastLineRow, 2)}`
  const sumOf = (key: string, values: number[]) => ({ formula: `SUM(${range(key)})`, result: values.reduce((a, b) => a + b, 0) })
  // Only lines in the BOM currency add up to the total; others are never converted.
  const sumInCurrency = (key: string, values: (number | null)[]) => ({
    formula: `SUMIF(${range('currency')},"${snapshot.currency.replace(/"/g, '')}",${range(key)})`,
    result: roundMoney(values.reduce<number>((a, v, i) => (v !== null && snapshot.lines[i]!.currency === snapshot.currency ? a + v : a), 0)),
  })
  totalsRow.getCell(letterOf('description')).value = `Total (${snapshot.totals.lines} lines)`
  totalsRow.getCell(letterOf('quantityPerUnit')).value = sumOf('quantityPerUnit', snapshot.lines.map(l => l.quantityPerUnit))
  totalsRow.getCell(letterOf('quantityBuild')).value = sumOf('quantityBuild', snapshot.lines.map(l => l.quantityBuild))
  totalsRow.getCell(letterOf('quantitySpares')).value = sumOf('quantitySpares', snapshot.lines.map(l => l.quantitySpares))
  totalsRow.getCell(letterOf('quantityOrder')).value = sumOf('quantityOrder', snapshot.lines.map(l => l.quantityOrder))
  totalsRow.getCell(letterOf('currency')).value = text(snapshot.currency)
  totalsRow.getCell(letterOf('extendedPrice')).value = sumInCurrency('extendedPrice', snapshot.lines.map(l => l.unitPrice === null ? null : l.unitPrice * l.quantityOrder))
  totalsRow.getCell(letterOf('quotedExtended')).value = sumInCurrency('quotedExtended', snapshot.lines.map((l) => {
    const quoted = purchase[l.key]?.quotedUnitPrice
    return quoted == null ? null : quoted * l.quantityOrder
  }))
  totalsRow.font = { bold: true }
  totalsRow.eachCell((cell) => { cell.border = { top: { style: 'thin' } } })
  const excluded = [
    snapshot.totals.unpricedLines > 0 ? count(snapshot.totals.unpricedLines, 'unpriced line') : '',
    (snapshot.totals.otherCurrencyLines ?? 0) > 0 ? `${count(snapshot.totals.otherCurrencyLines ?? 0, 'line')} in another currency` : '',
  ].filter(s => s !== '')
  if (excluded.length > 0) sheet.getRow(lastLineRow + 3).getCell(letterOf('description')).value = `Not in the total: ${excluded.join(', ')}`
}

function addDesignSheet(workbook: ExcelJS.Workbook, snapshot: BomSnapshot, locale: string): void {
  const sheet = workbook.addWorksheet('Design', { views: [{ state: 'frozen', ySplit: 1 }] })
  sheet.columns = [{ width: 34 }, { width: 44 }, { width: 12 }]
  styleHeader(sheet.addRow(['Item', 'Value', 'Unit']))
  const rows: [string, string | number, string][] = [
    ['Company', snapshot.company, ''],
    ['Design', snapshot.designName, ''],
    ['Design revision', snapshot.designRevision, ''],
    ['Topology', snapshot.topologySummary, ''],
    ['BOM revision', snapshot.revision, ''],
    ['Released at', formatDateTime(snapshot.releasedAt, locale), ''],
    ['Released by', snapshot.releasedBy, ''],
    ['Build quantity', snapshot.buildQuantity, 'sets'],
    ['Spares', snapshot.sparesPercent, '%'],
    ['Currency', snapshot.currency, ''],
    ['Total extended price', snapshot.totals.extendedPrice, snapshot.currency],
    ...snapshot.designSummary,
  ]
  for (const [label, value, unit] of rows) {
    const row = sheet.addRow([text(label), typeof value === 'number' ? value : text(value), text(unit)])
    row.getCell(2).alignment = { horizontal: 'left' }
  }
  sheet.addRow([])
  const noteRow = sheet.addRow(['Safety note'])
  noteRow.font = { bold: true }
  const note = sheet.addRow([text(snapshot.safetyNote)])
  sheet.mergeCells(note.number, 1, note.number, 3)
  note.getCell(1).alignment = { wrapText: true, vertical: 'top' }
  note.height = Math.max(30, Math.ceil(snapshot.safetyNote.length / 80) * 15)
}

function addPositionsSheet(workbook: ExcelJS.Workbook, snapshot: BomSnapshot): void {
  const sheet = workbook.addWorksheet('Positions', { views: [{ state: 'frozen', ySplit: 1 }] })
  sheet.columns = [{ width: 10 }, { width: 12 }, { width: 26 }, { width: 22 }, { width: 14, style: { numFmt: QTY } }, { width: 11, style: { numFmt: QTY } }, { width: 11, style: { numFmt: QTY } }, { width: 18 }]
  styleHeader(sheet.addRow(['Side', 'Position', 'Manufacturer', 'Part number', 'Per converter set [pcs]', 'In series [pcs]', 'In parallel [pcs]', 'Covered by']))
  for (const p of snapshot.positions) {
    sheet.addRow([text(p.side), text(p.position), text(p.manufacturer), text(p.partNumber), p.perConverter, p.seriesCount, p.parallelCount, text(p.coveredBy ? `module at ${p.coveredBy}` : null)])
  }
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: Math.max(snapshot.positions.length + 1, 1), column: 8 } }
}

/** "Changes": the line-by-line comparison with the previous release (added, removed, quantity and price changes). */
function addChangesSheet(workbook: ExcelJS.Workbook, snapshot: BomSnapshot, previous: BomSnapshot): void {
  const sheet = workbook.addWorksheet('Changes', { views: [{ state: 'frozen', ySplit: 1 }] })
  sheet.columns = [{ width: 10 }, { width: 24 }, { width: 22 }, { width: 20 }, { width: 14 }, { width: 14 }, { width: 60 }]
  styleHeader(sheet.addRow([`Change (rev ${previous.revision} → ${snapshot.revision})`, 'Manufacturer', 'Part number', 'Field', 'Before', 'After', 'Summary']))
  const changes = diffBoms(previous, snapshot)
  for (const c of changes) {
    if (c.fields.length === 0) sheet.addRow([c.change, text(c.manufacturer), text(c.partNumber), null, null, null, text(c.summary)])
    for (const f of c.fields) sheet.addRow([c.change, text(c.manufacturer), text(c.partNumber), f.field, typeof f.previous === 'number' ? f.previous : text(f.previous), typeof f.next === 'number' ? f.next : text(f.next), text(c.summary)])
  }
  if (changes.length === 0) sheet.addRow(['none', null, null, null, null, null, 'No line changed since the previous release.'])
}

/** The workbook as bytes. `purchase` (by line key) adds supplier, quote and order reference. */
export async function bomToXlsx(full: BomSnapshot, purchase: BomPurchase = {}, options: BomXlsxOptions = {}): Promise<Buffer> {
  const snapshot = options.openOnly ? openLinesBySupplier(full, purchase) : full
  const workbook = new ExcelJS.Workbook()
  const released = new Date(snapshot.releasedAt)
  const when = Number.isNaN(released.getTime()) ? new Date() : released
  workbook.creator = 'Stratavolt'
  workbook.lastModifiedBy = 'Stratavolt'
  workbook.created = when
  workbook.modified = when
  workbook.company = snapshot.company
  workbook.title = `BOM ${snapshot.designName} rev ${snapshot.designRevision}, BOM rev ${snapshot.revision}`
  workbook.subject = 'Bill of materials'
  // Cached results are written, but spreadsheets should still recompute on open.
  workbook.calcProperties = { fullCalcOnLoad: true }

  addBomSheet(workbook, snapshot, purchase)
  addDesignSheet(workbook, snapshot, options.locale ?? DEFAULT_LOCALE)
  addPositionsSheet(workbook, snapshot)
  if (options.previous) addChangesSheet(workbook, full, options.previous)
  const bytes = await workbook.xlsx.writeBuffer()
  return Buffer.from(bytes as ArrayBuffer)
}
