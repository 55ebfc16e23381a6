import ExcelJS from 'exceljs'
import type { H3Event } from 'h3'
import { buildTemplateRows, CATALOG_COLUMNS } from '../../catalog/columns'

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
