// Reads an uploaded catalogue file (.xlsx or .csv) into a raw table of header + rows, refusing what
// cannot be imported faithfully: not a spreadsheet, empty, too large, zip bombs, formulas, merged
// cells, hidden rows, duplicates. Every problem names the row and cell as the user sees them.

import ExcelJS from 'exceljs'
import { CATALOG_COLUMNS, isUnitsRow } from '../../catalog/columns'
import { columnLetter, suggestMapping } from '../../shared/catalog/mapping'
import type { CellValue, RawTable, TableProblem } from '../../shared/catalog/types'
import { detectDelimiter, parseCsv } from './csv'
import { readZipDirectory, verifyZipEntries } from './zip'

export interface ReadOptions {
  /** bytes, upload size limit (default 5 MB) */
  maxBytes?: number
  /** data rows allowed (default 20 000) */
  maxRows?: number
  /** bytes an .xlsx may inflate to (default 100 MB) */
  maxUncompressedBytes?: number
  /** uncompressed / compressed limit for large .xlsx (default 200) */
  maxCompressionRatio?: number
  /** problems listed before summarising the rest (default 500) */
  maxProblems?: number
}

export const DEFAULT_READ_LIMITS = { maxBytes: 5 * 1024 * 1024, maxRows: 20_000, maxUncompressedBytes: 100 * 1024 * 1024, maxCompressionRatio: 200, maxProblems: 500 }

// Worksheet parts that carry nothing a catalogue import reads (hyperlink targets included: the cell text is used).
const IGNORED_SHEET_NODES = ['dataValidations', 'conditionalFormatting', 'extLst', 'drawing', 'picture', 'pageSetup', 'pageMargins', 'headerFooter', 'printOptions', 'rowBreaks', 'tableParts', 'sheetProtection', 'hyperlinks']
const MAX_COLUMNS = 1000

const PREFERRED_SHEET = /^(parts?|catalog(ue)?|components?|parts? list)$/i
const LIKELY_SHEET = /part|catalog|component/i

function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} kB`
}

function formatCount(n: number): string {
  return n.toLocaleString('en-GB').replace(/,/g, ' ')
}

/** Collects problems up to a limit, then counts the rest. */
class Problems {
  readonly list: TableProblem[] = []
  private dropped = 0
  private readonly limit: number
  constructor(limit: number) {
    this.limit = limit
  }

  add(problem: TableProblem) {
    if (this.list.length < this.limit) this.list.push(problem)
    else this.dropped++
  }

  finish(what: string): TableProblem[] {
    if (this.dropped > 0) this.list.push({ message: `… and ${formatCount(this.dropped)} more ${what} not listed` })
    return this.list
  }
}

function failed(message: string, format: RawTable['format'] = 'xlsx', extra: Partial<RawTable> = {}): RawTable {
  return { sheetName: '', format, headerRowNumber: 0, headers: [], rows: [], warnings: [], errors: [{ message }], ...extra }
}

type Sniffed = 'zip' | 'csv' | { refuse: string }

function startsWith(buffer: Buffer, bytes: number[]): boolean {
  return bytes.every((b, i) => buffer[i] === b)
}

/** True when a sheet's first filled row has headers for both part number and manufacturer. */
function looksLikePartsSheet(sheet: ExcelJS.Worksheet): boolean {
  let headers: string[] | null = null
  sheet.eachRow({ includeEmpty: false }, (row) => {
    if (headers) return
    const values = Array.isArray(row.values) ? row.values.slice(1) : []
    headers = values.map(v => (v === null || v === undefined ? '' : String(typeof v === 'object' && 'text' in (v as object) ? (v as { text: unknown }).text : v)))
  })
  if (!headers) return false
  const { mapping } = suggestMapping(headers)
  return mapping.partNumber != null && mapping.manufacturer != null
}

/** Tells spreadsheets from other files by their first bytes. */
function sniff(buffer: Buffer): Sniffed {
  if (startsWith(buffer, [0x50, 0x4b, 0x03, 0x04]) || startsWith(buffer, [0x50, 0x4b, 0x05, 0x06])) return 'zip'
  if (startsWith(buffer, [0xd0, 0xcf, 0x11, 0xe0])) return { refuse: 'this is an old Excel 97–2003 (.xls) or other legacy Office file: save it as .xlsx or .csv and upload again' }
  if (startsWith(buffer, [0x25, 0x50, 0x44, 0x46])) return { refuse: 'this is a PDF, not a spreadsheet: upload .xlsx or .csv' }
  if (startsWith(buffer, [0x89, 0x50, 0x4e, 0x47]) || startsWith(buffer, [0xff, 0xd8, 0xff]) || startsWith(buffer, [0x47, 0x49, 0x46, 0x38])) return { refuse: 'this is an image, not a spreadsheet: upload .xlsx or .csv' }
  if (startsWith(buffer, [0x1f, 0x8b]) || startsWith(buffer, [0x37, 0x7a, 0xbc, 0xaf]) || startsWith(buffer, [0x52, 0x61, 0x72, 0x21])) return { refuse: 'this is a compressed archive, not a spreadsheet: upload .xlsx or .csv' }
  if (startsWith(buffer, [0xff, 0xfe]) || startsWith(buffer, [0xfe, 0xff])) return 'csv'
  const head = buffer.subarray(0, 8192)
  if (head.includes(0)) return { refuse: 'this is a binary file, not a spreadsheet: upload .xlsx or .csv' }
  return 'csv'
}

/**
 * Reads an uploaded catalogue file. `fileName` only sharpens messages (the content decides the format).
 * Never throws for bad input: problems come back in `errors` / `warnings`.
 */
export async function readCatalogFile(buffer: Buffer | Uint8Array, fileName = 'upload', opts: ReadOptions = {}): Promise<RawTable> {
  try {
    return await readChecked(buffer, fileName, opts)
  }
  catch (error) {
    // A file that trips the spreadsheet library in an unforeseen way is still a bad upload, not a crash.
    return failed(`'${fileName}' could not be read (${(error as Error).message})`)
  }
}

async function readChecked(buffer: Buffer | Uint8Array, fileName: string, opts: ReadOptions): Promise<RawTable> {
  const limits = { ...DEFAULT_READ_LIMITS, ...opts }
  const data = Buffer.isBuffer(buffer) ? buffer : Buffer.from(buffer.buffer, buffer.byteOffset, buffer.byteLength)
  if (data.length === 0) return failed(`'${fileName}' is empty (0 bytes)`)
  if (data.length > limits.maxBytes) return failed(`'${fileName}' is ${formatBytes(data.length)}; uploads are limited to ${formatBytes(limits.maxBytes)}`)
  const kind = sniff(data)
  const extension = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase()
  if (typeof kind === 'object') return failed(`'${fileName}': ${kind.refuse}`)
  if (kind === 'zip') {
    const table = await readXlsx(data, fileName, limits)
    if (extension && extension !== 'xlsx' && table.errors.length === 0) table.warnings.unshift({ message: `'${fileName}' was read as an .xlsx workbook (its content), not as .${extension}` })
    return table
  }
  if (extension === 'xlsx') return failed(`'${fileName}' is named .xlsx but is not an Excel workbook (no zip structure); if it is CSV text, name it .csv`, 'csv')
  return readCsv(data, fileName, limits)
}

// ---------------------------------------------------------------- CSV

function decodeText(data: Buffer): { text: string, warning?: string } {
  if (startsWith(data, [0xef, 0xbb, 0xbf])) return { text: data.subarray(3).toString('utf8') }
  if (startsWith(data, [0xff, 0xfe])) return { text: new TextDecoder('utf-16le').decode(data.subarray(2)) }
  if (startsWith(data, [0xfe, 0xff])) return { text: new TextDecoder('utf-16be').decode(data.subarray(2)) }
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(data) }
  }
  catch {
    return { text: new TextDecoder('windows-1252').decode(data), warning: 'the file is not UTF-8; it was read as Windows-1252 (Western European). Check accented letters and symbols such as µ and Ω, or save as "CSV UTF-8"' }
  }
}

function readCsv(data: Buffer, fileName: string, limits: typeof DEFAULT_READ_LIMITS): RawTable {
  const { text, warning } = decodeText(data)
  if (text.trim() === '') return failed(`'${fileName}' is empty (no text)`, 'csv')
  const delimiter = detectDelimiter(text)
  const parsed = parseCsv(text, delimiter, limits.maxRows + 1)
  if (!parsed.ok) return failed(`row ${parsed.row}: ${parsed.message}`, 'csv', { errors: [{ row: parsed.row, message: parsed.message }] })
  const warnings = new Problems(limits.maxProblems)
  const errors = new Problems(limits.maxProblems)
  if (warning) warnings.add({ message: warning })
  const rows = parsed.records.map(r => ({ rowNumber: r.rowNumber, cells: r.cells.map(c => (c.trim() === '' ? null : c)) as CellValue[] }))
  for (const row of rows) {
    row.cells.forEach((cell, i) => {
      if (typeof cell === 'string' && /^=\s*[A-Za-z(]/.test(cell.trim())) {
        errors.add({ row: row.rowNumber, column: columnLetter(i), message: `cell ${columnLetter(i)}${row.rowNumber} holds a formula (${cell.trim().slice(0, 40)}); catalogue values must be typed in literally` })
      }
    })
  }
  const sheetName = fileName.replace(/\.[^.]*$/, '')
  const table = buildTable(rows, sheetName, 'csv', limits, warnings, errors)
  table.delimiter = delimiter
  table.suggestedDecimalSeparator = delimiter === ';' ? ',' : '.'
  return table
}

// ---------------------------------------------------------------- XLSX

type Row = { rowNumber: number, cells: CellValue[] }

function richTextToString(value: { richText: { text: string }[] }): string {
  return value.richText.map(r => r.text).join('')
}

async function readXlsx(data: Buffer, fileName: string, limits: typeof DEFAULT_READ_LIMITS): Promise<RawTable> {
  const zip = readZipDirectory(data, { maxUncompressedBytes: limits.maxUncompressedBytes, maxCompressionRatio: limits.maxCompressionRatio })
  if (!zip.ok) return failed(`'${fileName}': ${zip.reason}`)
  const names = new Set(zip.entries.map(e => e.name))
  if (!names.has('xl/workbook.xml')) {
    if (names.has('content.xml')) return failed(`'${fileName}' is an OpenDocument file (.ods), not .xlsx: save it as .xlsx or .csv`)
    if (names.has('word/document.xml')) return failed(`'${fileName}' is a Word document, not a spreadsheet`)
    return failed(`'${fileName}' is a zip archive but not an Excel workbook (.xlsx)`)
  }
  const inflation = verifyZipEntries(data, zip.entries)
  if (inflation) return failed(`'${fileName}': ${inflation}`)

  const workbook = new ExcelJS.Workbook()
  try {
    // exceljs' typings want its own Buffer flavour and omit maxRows / maxCols, which its parser honours:
    // they stop a far-too-large sheet early. Parts we never read are skipped.
    const options = { ignoreNodes: IGNORED_SHEET_NODES, maxRows: 2 * limits.maxRows + 10, maxCols: MAX_COLUMNS }
    await workbook.xlsx.load(data as unknown as ExcelJS.Buffer, options as Partial<ExcelJS.XlsxReadOptions>)
  }
  catch (error) {
    const message = (error as Error).message
    if (/Max row count/.test(message)) return failed(`'${fileName}' has more than ${formatCount(2 * limits.maxRows + 10)} rows in a sheet; the limit is ${formatCount(limits.maxRows)} parts per upload: split the file`)
    if (/Max column count/.test(message)) return failed(`'${fileName}' has more than ${MAX_COLUMNS} columns in a row; a catalogue has about ${CATALOG_COLUMNS.length}`)
    return failed(`'${fileName}' could not be read as an .xlsx workbook (${message})`)
  }

  const warnings = new Problems(limits.maxProblems)
  const errors = new Problems(limits.maxProblems)
  const sheets = workbook.worksheets
  const visible = sheets.filter(s => s.state === 'visible' || s.state === undefined)
  if (visible.length === 0) return failed(`'${fileName}' has no visible worksheet`)
  const sheet = visible.find(s => PREFERRED_SHEET.test(s.name.trim())) ?? visible.find(s => LIKELY_SHEET.test(s.name)) ?? visible[0]!
  const others = sheets.filter(s => s !== sheet)
  // A catalogue split over several sheets would import half of it: refuse, naming the sheets.
  const alsoParts = visible.filter(s => s !== sheet && looksLikePartsSheet(s))
  if (alsoParts.length > 0 && looksLikePartsSheet(sheet)) {
    return failed(`'${fileName}' has parts on several sheets ('${sheet.name}', ${alsoParts.map(s => `'${s.name}'`).join(', ')}): put them on one sheet, or upload each sheet as its own file`, 'xlsx', { sheetName: sheet.name })
  }
  if (others.length > 0) {
    warnings.add({ message: `read the sheet '${sheet.name}'; not read: ${others.map(s => `'${s.name}'${s.state !== 'visible' && s.state !== undefined ? ' (hidden)' : ''}`).join(', ')}` })
  }
  // Far past the limit: stop before walking every cell (the exact count is given below otherwise).
  if (sheet.actualRowCount > 2 * limits.maxRows + 10) {
    return failed(`the sheet '${sheet.name}' has ${formatCount(sheet.actualRowCount)} filled rows; the limit is ${formatCount(limits.maxRows)} parts per upload: split the file`, 'xlsx', { sheetName: sheet.name })
  }

  const rows: Row[] = []
  const merges = new Map<string, { top: number, left: number, bottom: number, right: number }>()
  const hiddenRows: number[] = []
  let width = 0
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: CellValue[] = []
    let filled = false
    row.eachCell({ includeEmpty: false }, (cell, colNumber) => {
      // Built only for messages: this runs for every cell of up to 20 000 rows.
      const address = () => `${columnLetter(colNumber - 1)}${rowNumber}`
      if (cell.isMerged) {
        const master = cell.master
        const range = merges.get(master.address) ?? { top: rowNumber, left: colNumber, bottom: rowNumber, right: colNumber }
        range.top = Math.min(range.top, rowNumber)
        range.left = Math.min(range.left, colNumber)
        range.bottom = Math.max(range.bottom, rowNumber)
        range.right = Math.max(range.right, colNumber)
        merges.set(master.address, range)
        if (cell.type === ExcelJS.ValueType.Merge) return
      }
      const value = cell.value
      let out: CellValue
      if (value === null || value === undefined) out = null
      else if (typeof value === 'number') out = value
      else if (typeof value === 'string') out = value
      else if (typeof value === 'boolean') out = value ? 'TRUE' : 'FALSE'
      else if (value instanceof Date) {
        out = value.toISOString().slice(0, 10)
        warnings.add({ row: rowNumber, column: columnLetter(colNumber - 1), message: `cell ${address()} holds a date (${out}); if a number was meant, format the column as text or number and type it again` })
      }
      else if ('formula' in value || 'sharedFormula' in value) {
        const formula = 'formula' in value && value.formula ? value.formula : (value as { sharedFormula?: string }).sharedFormula
        errors.add({ row: rowNumber, column: columnLetter(colNumber - 1), message: `cell ${address()} holds a formula (=${String(formula ?? '').slice(0, 40)}); catalogue values must be typed in literally: copy the column and paste values only` })
        out = null
      }
      else if ('richText' in value) out = richTextToString(value)
      else if ('hyperlink' in value) out = typeof value.text === 'string' ? value.text : richTextToString(value.text as unknown as { richText: { text: string }[] })
      else if ('error' in value) {
        errors.add({ row: rowNumber, column: columnLetter(colNumber - 1), message: `cell ${address()} shows the error ${value.error}; type in the value instead` })
        out = null
      }
      else out = String(cell.text ?? '')
      if (out !== null && !(typeof out === 'string' && out.trim() === '')) filled = true
      cells[colNumber - 1] = out
      width = Math.max(width, colNumber)
    })
    if (row.hidden && filled) hiddenRows.push(rowNumber)
    rows.push({ rowNumber, cells })
  })

  for (const range of merges.values()) {
    if (range.top === range.bottom && range.left === range.right) continue
    const text = `${columnLetter(range.left - 1)}${range.top}:${columnLetter(range.right - 1)}${range.bottom}`
    errors.add({ row: range.top, column: columnLetter(range.left - 1), message: `cells ${text} are merged; unmerge them and fill every cell` })
  }
  for (const [first, last] of groupRuns(hiddenRows)) {
    errors.add({ row: first, message: first === last ? `row ${first} is hidden; unhide it (or clear filters) or delete it, so that what you see is what is imported` : `rows ${first}–${last} are hidden; unhide them (or clear filters) or delete them, so that what you see is what is imported` })
  }
  const hiddenColumns: string[] = []
  for (let c = 1; c <= width; c++) {
    if (sheet.getColumn(c).hidden && rows.some(r => r.cells[c - 1] !== null && r.cells[c - 1] !== undefined)) hiddenColumns.push(columnLetter(c - 1))
  }
  if (hiddenColumns.length > 0) {
    warnings.add({ column: hiddenColumns[0], message: `column${hiddenColumns.length > 1 ? 's' : ''} ${hiddenColumns.join(', ')} ${hiddenColumns.length > 1 ? 'are' : 'is'} hidden in the sheet but will be read; check the mapping` })
  }
  for (const row of rows) for (let c = 0; c < width; c++) if (row.cells[c] === undefined) row.cells[c] = null
  return buildTable(rows, sheet.name, 'xlsx', limits, warnings, errors)
}

function groupRuns(numbers: number[]): [number, number][] {
  const runs: [number, number][] = []
  for (const n of numbers) {
    const last = runs.at(-1)
    if (last && n === last[1] + 1) last[1] = n
    else runs.push([n, n])
  }
  return runs
}

// ---------------------------------------------------------------- common

function isEmptyRow(cells: CellValue[]): boolean {
  return cells.every(c => c === null || (typeof c === 'string' && c.trim() === ''))
}

/** Finds the header row, skips the template's units row, trims empty rows and checks limits and duplicates. */
function buildTable(allRows: Row[], sheetName: string, format: RawTable['format'], limits: typeof DEFAULT_READ_LIMITS, warnings: Problems, errors: Problems): RawTable {
  const nonEmpty = allRows.filter(r => !isEmptyRow(r.cells))
  const base = { sheetName, format, headerRowNumber: 0, headers: [] as string[], rows: [] as Row[] }
  if (nonEmpty.length === 0) {
    errors.add({ message: `the sheet '${sheetName}' is empty` })
    return { ...base, warnings: warnings.finish('warnings'), errors: errors.finish('problems') }
  }
  const headerRow = nonEmpty[0]!
  let lastHeader = headerRow.cells.length - 1
  while (lastHeader >= 0 && (headerRow.cells[lastHeader] === null || String(headerRow.cells[lastHeader]).trim() === '')) lastHeader--
  let dataRows = nonEmpty.slice(1)
  if (dataRows[0] && isUnitsRow(dataRows[0].cells)) dataRows = dataRows.slice(1)

  const dataWidth = Math.max(lastHeader + 1, ...dataRows.map((r) => {
    let w = r.cells.length
    while (w > 0 && (r.cells[w - 1] === null || String(r.cells[w - 1]).trim() === '')) w--
    return w
  }))
  const headers: string[] = []
  const seenHeaders = new Map<string, string>()
  for (let c = 0; c < dataWidth; c++) {
    const raw = headerRow.cells[c]
    let header = raw === null || raw === undefined ? '' : String(raw).trim()
    if (header === '') {
      header = `Column ${columnLetter(c)}`
      warnings.add({ row: headerRow.rowNumber, column: columnLetter(c), message: `column ${columnLetter(c)} has data but no header; it is listed as '${header}'` })
    }
    const key = header.toLowerCase()
    const earlier = seenHeaders.get(key)
    if (earlier) warnings.add({ row: headerRow.rowNumber, column: columnLetter(c), message: `the header '${header}' appears twice (columns ${earlier} and ${columnLetter(c)})` })
    else seenHeaders.set(key, columnLetter(c))
    headers.push(header)
  }

  if (dataRows.length === 0) {
    errors.add({ row: headerRow.rowNumber, message: `the sheet '${sheetName}' has a header row (row ${headerRow.rowNumber}) but no parts below it` })
  }
  if (dataRows.length > limits.maxRows) {
    errors.add({ message: `the sheet '${sheetName}' has ${formatCount(dataRows.length)}${format === 'csv' && dataRows.length > limits.maxRows ? ' or more' : ''} rows of parts; the limit is ${formatCount(limits.maxRows)} per upload: split the file` })
    return { ...base, headerRowNumber: headerRow.rowNumber, headers, warnings: warnings.finish('warnings'), errors: errors.finish('problems') }
  }

  const firstData = dataRows[0]?.rowNumber ?? 0
  const lastData = dataRows.at(-1)?.rowNumber ?? 0
  const gaps = allRows.filter(r => r.rowNumber > firstData && r.rowNumber < lastData && isEmptyRow(r.cells)).map(r => r.rowNumber)
  if (format === 'xlsx') {
    // exceljs skips rows with no cells at all; count the row numbers missing between data rows too.
    const present = new Set(allRows.map(r => r.rowNumber))
    for (let n = firstData + 1; n < lastData; n++) if (!present.has(n)) gaps.push(n)
    gaps.sort((a, b) => a - b)
  }
  if (gaps.length > 0) {
    const runs = groupRuns(gaps).map(([a, b]) => (a === b ? `${a}` : `${a}–${b}`))
    warnings.add({ row: gaps[0], message: `empty row${gaps.length > 1 ? 's' : ''} ${runs.join(', ')} skipped` })
  }
  const rows = dataRows.map(r => ({ rowNumber: r.rowNumber, cells: headers.map((_, i) => r.cells[i] ?? null) }))

  findDuplicates(headers, rows, errors)
  return {
    sheetName,
    format,
    headerRowNumber: headerRow.rowNumber,
    headers,
    rows,
    warnings: warnings.finish('warnings'),
    errors: errors.finish('problems'),
  }
}

/**
 * Same manufacturer and part number on two rows, found through the suggested mapping (only when both
 * columns are recognised with confidence). Validation repeats the check with the user's final mapping.
 */
function findDuplicates(headers: string[], rows: Row[], errors: Problems) {
  const { suggestions } = suggestMapping(headers)
  const partNumber = suggestions.find(s => s.key === 'partNumber')
  const manufacturer = suggestions.find(s => s.key === 'manufacturer')
  if (!partNumber || partNumber.index === null || partNumber.score < 0.9) return
  if (!manufacturer || manufacturer.index === null || manufacturer.score < 0.9) return
  const first = new Map<string, number>()
  for (const row of rows) {
    const pn = row.cells[partNumber.index]
    const mfr = row.cells[manufacturer.index]
    if (pn === null || mfr === null) continue
    const key = `${String(mfr).trim().toLowerCase().replace(/\s+/g, ' ')}\u0000${String(pn).toLowerCase().replace(/\s+/g, '')}`
    const earlier = first.get(key)
    if (earlier === undefined) first.set(key, row.rowNumber)
    else {
      errors.add({ row: row.rowNumber, column: partNumber.column, message: `rows ${earlier} and ${row.rowNumber} are the same part (${String(mfr).trim()} ${String(pn).trim()}): keep one` })
    }
  }
}
