import ExcelJS from 'exceljs'
import type { H3Event } from 'h3'
import { buildTemplateRows, CATALOG_COLUMNS } from '../../catalog/columns'
import { columnLetter } from '../../shared/catalog/mapping'
import type { RawTable } from '../../shared/catalog/types'

/** Rows of the template's Parts sheet that offer drop-down lists for the fixed-value columns. */
export const TEMPLATE_LIST_ROWS = 2000

// The import template: header row, units row, one example per kind; .xlsx or .csv.
export async function sendTemplate(event: H3Event, format: 'xlsx' | 'csv') {
  const rows = buildTemplateRows()
  const workbook = new ExcelJS.Workbook()
  workbook.creator = 'Stratavolt'
  const sheet = workbook.addWorksheet('Parts', { views: [{ state: 'frozen', ySplit: 2 }] })
  sheet.addRow(rows.header).font = { bold: true }
  sheet.addRow(rows.units).font = { italic: true, color: { argb: 'FF64748B' } }
  for (const example of rows.examples) sheet.addRow(example)
  sheet.columns.forEach((column, i) => { column.width = Math.max(12, (rows.header[i]?.length ?? 10) + 4) })
  // Drop-down lists for the columns with fixed values (kind, configuration, technology, currency,
  // lifecycle); other spellings are still accepted on import, the list only offers ours.
  // exceljs writes a range key as one sqref; its typings omit the worksheet's dataValidations.
  const validations = (sheet as unknown as { dataValidations: { add: (range: string, v: ExcelJS.DataValidation) => void } }).dataValidations
  CATALOG_COLUMNS.forEach((column, i) => {
    if (!column.values) return
    const letter = columnLetter(i)
    validations.add(`${letter}3:${letter}${TEMPLATE_LIST_ROWS + 2}`, {
      type: 'list', allowBlank: true, formulae: [`"${column.values.join(',')}"`],
      showErrorMessage: true, errorStyle: 'warning', errorTitle: column.header, error: `Expected one of: ${column.values.join(', ')}`,
    })
  })
  const notes = workbook.addWorksheet('Column guide')
  notes.addRow(['Column', 'Unit', 'Meaning']).font = { bold: true }
  for (const c of CATALOG_COLUMNS) notes.addRow([c.header, c.unit, c.description])
  notes.columns = [{ width: 28 }, { width: 10 }, { width: 90 }]
  setResponseHeader(event, 'Content-Disposition', `attachment; filename="stratavolt-parts-template.${format}"`)
  if (format === 'csv') {
    setResponseHeader(event, 'Content-Type', 'text/csv; charset=utf-8')
    return Buffer.from(await workbook.csv.writeBuffer({ sheetName: 'Parts' }))
  }
  setResponseHeader(event, 'Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet')
  return Buffer.from(await workbook.xlsx.writeBuffer())
}

/** The refused rows as uploaded (header row first), with a Reason column, to fix and upload again. */
export async function refusedRowsWorkbook(table: RawTable, refused: readonly { rowNumber: number, reasons: string[] }[]): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook()
  workbook.creator = 'Stratavolt'
  const sheet = workbook.addWorksheet('Refused rows', { views: [{ state: 'frozen', ySplit: 1 }] })
  sheet.addRow([...table.headers, 'Reason', 'Row in the upload']).font = { bold: true }
  const byNumber = new Map(table.rows.map(r => [r.rowNumber, r]))
  for (const r of refused) {
    const cells = byNumber.get(r.rowNumber)?.cells ?? []
    sheet.addRow([...table.headers.map((_, i) => cells[i] ?? null), r.reasons.join('; '), r.rowNumber])
  }
  sheet.getColumn(table.headers.length + 1).width = 80
  return Buffer.from(await workbook.xlsx.writeBuffer())
}
