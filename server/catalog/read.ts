// Reads an uploaded catalogue file (.xlsx or .csv) into a raw table of header + rows, refusing what
// cannot be imported faithfully: not a spreadsheet, empty, too large, zip bombs, formulas, merged
// cells, hidden rows, duplicates. Every problem names the row and cell as the user sees them.

import { CATALOG_COLUMNS, isUnitsRow } from '../../catalog/columns'
import { columnLetter, isUnitText, suggestMapping } from '../../shared/catalog/mapping'
import type { CellValue, HeaderCandidate, RawTable, SkippedRow, TableProblem } from '../../shared/catalog/types'
import { detectDelimiter, parseCsv } from './csv'
import { readZipDirectory } from './zip'
import { inflateEntry, readDateStyles, readSharedStrings, readSheet, readSheetList, XlsxLimitError, type StreamLimits, type XlsxCell, type XlsxSheetInfo } from './xlsx-stream'

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
  /** row number of the header row as the user sees it; absent = detected */
  headerRow?: number
  /** filled cells one sheet may hold (default 80 per allowed row) */
  maxCells?: number
}

export const DEFAULT_READ_LIMITS = { maxBytes: 5 * 1024 * 1024, maxRows: 20_000, maxUncompressedBytes: 100 * 1024 * 1024, maxCompressionRatio: 200, maxProblems: 500 }
type Limits = typeof DEFAULT_READ_LIMITS & { headerRow?: number, maxCells?: number }

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
  return { sheetName: '', format, headerRowNumber: 0, headers: [], rows: [], skipped: [], headerCandidates: [], warnings: [], errors: [{ message }], ...extra }
}

type Sniffed = 'zip' | 'csv' | { refuse: string }

function startsWith(buffer: Buffer, bytes: number[]): boolean {
  return bytes.every((b, i) => buffer[i] === b)
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

function readCsv(data: Buffer, fileName: string, limits: Limits): RawTable {
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

/** Excel's day count (1900 date system) as an ISO date. */
function serialToIsoDate(serial: number): string {
  return new Date(Date.UTC(1899, 11, 30) + Math.round(serial * 86_400_000)).toISOString().slice(0, 10)
}

function rangeOf(ref: string): { top: number, left: number, bottom: number, right: number } | null {
  const m = /^([A-Z]+)(\d+)(?::([A-Z]+)(\d+))?$/.exec(ref.toUpperCase())
  if (!m) return null
  const col = (letters: string) => [...letters].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0)
  return { top: Number(m[2]), left: col(m[1]!), bottom: Number(m[4] ?? m[2]), right: col(m[3] ?? m[1]!) }
}

/** Limits of the streaming read: rows and cells of one sheet, bytes one workbook part may unpack to. */
function streamLimits(limits: Limits): StreamLimits {
  return { maxRows: 2 * limits.maxRows + 10, maxCells: limits.maxCells ?? limits.maxRows * 80, maxColumns: MAX_COLUMNS, maxEntryBytes: limits.maxUncompressedBytes }
}

async function readXlsx(data: Buffer, fileName: string, limits: Limits): Promise<RawTable> {
  const zip = readZipDirectory(data, { maxUncompressedBytes: limits.maxUncompressedBytes, maxCompressionRatio: limits.maxCompressionRatio })
  if (!zip.ok) return failed(`'${fileName}': ${zip.reason}`)
  const entries = new Map(zip.entries.map(e => [e.name, e]))
  if (!entries.has('xl/workbook.xml')) {
    if (entries.has('content.xml')) return failed(`'${fileName}' is an OpenDocument file (.ods), not .xlsx: save it as .xlsx or .csv`)
    if (entries.has('word/document.xml')) return failed(`'${fileName}' is a Word document, not a spreadsheet`)
    return failed(`'${fileName}' is a zip archive but not an Excel workbook (.xlsx)`)
  }
  const bounded = streamLimits(limits)
  // Every part is inflated once first (slice by slice, nothing kept), so a part whose directory
  // understates its size is refused before anything is read from it.
  for (const entry of zip.entries) {
    const problem = inflateEntry(data, entry, bounded.maxEntryBytes, () => undefined)
    if (problem) return failed(`'${fileName}': ${problem}`)
  }
  const sheetList = readSheetList(data, entries)
  if (!Array.isArray(sheetList)) return failed(`'${fileName}': ${sheetList.problem}`)
  const visible = sheetList.filter(s => s.state === 'visible')
  if (visible.length === 0) return failed(`'${fileName}' has no visible worksheet`)
  const sheet = visible.find(s => PREFERRED_SHEET.test(s.name.trim())) ?? visible.find(s => LIKELY_SHEET.test(s.name)) ?? visible[0]!
  const sheetEntry = entries.get(sheet.path)
  if (!sheetEntry) return failed(`'${fileName}': the sheet '${sheet.name}' is missing from the workbook (${sheet.path})`)
  const strings = readSharedStrings(data, entries.get('xl/sharedStrings.xml'), bounded)
  if (!Array.isArray(strings)) return failed(`'${fileName}': ${strings.problem}`)
  const dateStyles = readDateStyles(data, entries.get('xl/styles.xml'))

  const toValue = (cell: XlsxCell | undefined): CellValue => {
    if (!cell) return null
    switch (cell.kind) {
      case 'number': return cell.date ? serialToIsoDate(cell.value) : cell.value
      case 'text': return cell.value
      case 'boolean': return cell.value ? 'TRUE' : 'FALSE'
      default: return null
    }
  }
  /** The first filled row of a sheet, read without the rest. */
  const firstRowOf = (info: XlsxSheetInfo): string[] | null => {
    const e = entries.get(info.path)
    if (!e) return null
    try {
      const r = readSheet(data, e, strings, dateStyles, bounded, true)
      if ('problem' in r) return null
      const first = r.rows.find(x => x.cells.some(Boolean))
      return first ? Array.from(first.cells, c => String(toValue(c) ?? '')) : null
    }
    catch {
      return null
    }
  }
  const looksLikeParts = (headers: string[] | null) => {
    if (!headers) return false
    const { mapping } = suggestMapping(headers)
    return mapping.partNumber != null && mapping.manufacturer != null
  }

  const warnings = new Problems(limits.maxProblems)
  const errors = new Problems(limits.maxProblems)
  const others = sheetList.filter(s => s !== sheet)
  // A catalogue split over several sheets would import half of it: refuse, naming the sheets.
  const alsoParts = visible.filter(s => s !== sheet && looksLikeParts(firstRowOf(s)))
  if (alsoParts.length > 0 && looksLikeParts(firstRowOf(sheet))) {
    return failed(`'${fileName}' has parts on several sheets ('${sheet.name}', ${alsoParts.map(s => `'${s.name}'`).join(', ')}): put them on one sheet, or upload each sheet as its own file`, 'xlsx', { sheetName: sheet.name })
  }
  if (others.length > 0) {
    warnings.add({ message: `read the sheet '${sheet.name}'; not read: ${others.map(s => `'${s.name}'${s.state !== 'visible' ? ' (hidden)' : ''}`).join(', ')}` })
  }

  let read: Exclude<ReturnType<typeof readSheet>, { problem: string }>
  try {
    const r = readSheet(data, sheetEntry, strings, dateStyles, bounded)
    if ('problem' in r) return failed(`'${fileName}': ${r.problem}`)
    read = r
  }
  catch (error) {
    if (error instanceof XlsxLimitError) {
      if (error.limit === 'rows') return failed(`'${fileName}' has more than ${formatCount(bounded.maxRows)} rows in a sheet; the limit is ${formatCount(limits.maxRows)} parts per upload: split the file`, 'xlsx', { sheetName: sheet.name })
      if (error.limit === 'columns') return failed(`'${fileName}' has more than ${MAX_COLUMNS} columns in a row; a catalogue has about ${CATALOG_COLUMNS.length}`, 'xlsx', { sheetName: sheet.name })
      return failed(`the sheet '${sheet.name}' has more than ${formatCount(bounded.maxCells)} filled cells; a catalogue of ${formatCount(limits.maxRows)} parts needs far fewer: remove the columns that are not part data, or split the file`, 'xlsx', { sheetName: sheet.name })
    }
    throw error
  }

  const rows: Row[] = []
  const hiddenRows: number[] = []
  let width = 0
  for (const r of read.rows) {
    const cells: CellValue[] = []
    let filled = false
    r.cells.forEach((cell, i) => {
      if (!cell) return
      const where = () => `${columnLetter(i)}${r.rowNumber}`
      if (cell.kind === 'formula') {
        errors.add({ row: r.rowNumber, column: columnLetter(i), message: `cell ${where()} holds a formula (=${cell.formula.slice(0, 40)}); catalogue values must be typed in literally: copy the column and paste values only` })
      }
      else if (cell.kind === 'error') {
        errors.add({ row: r.rowNumber, column: columnLetter(i), message: `cell ${where()} shows the error ${cell.value}; type in the value instead` })
      }
      else if (cell.kind === 'number' && cell.date) {
        warnings.add({ row: r.rowNumber, column: columnLetter(i), message: `cell ${where()} holds a date (${serialToIsoDate(cell.value)}); if a number was meant, format the column as text or number and type it again` })
      }
      const out = toValue(cell)
      if (out !== null && !(typeof out === 'string' && out.trim() === '')) filled = true
      cells[i] = out
      width = Math.max(width, i + 1)
    })
    if (r.hidden && filled) hiddenRows.push(r.rowNumber)
    rows.push({ rowNumber: r.rowNumber, cells })
  }

  for (const ref of read.merges) {
    const range = rangeOf(ref)
    if (!range || (range.top === range.bottom && range.left === range.right)) continue
    errors.add({ row: range.top, column: columnLetter(range.left - 1), message: `cells ${ref} are merged; unmerge them and fill every cell` })
  }
  for (const [first, last] of groupRuns(hiddenRows)) {
    errors.add({ row: first, message: first === last ? `row ${first} is hidden; unhide it (or clear filters) or delete it, so that what you see is what is imported` : `rows ${first}–${last} are hidden; unhide them (or clear filters) or delete them, so that what you see is what is imported` })
  }
  const hiddenColumns: string[] = []
  for (let c = 0; c < width; c++) {
    if (read.hiddenColumns.has(c) && rows.some(r => r.cells[c] !== null && r.cells[c] !== undefined)) hiddenColumns.push(columnLetter(c))
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

/** Rows above the header looked at when detecting it. */
const HEADER_SEARCH_ROWS = 30

function filledCount(cells: readonly CellValue[]): number {
  let n = 0
  for (const c of cells) if (c !== null && !(typeof c === 'string' && c.trim() === '')) n++
  return n
}

/** How many catalogue columns a row's cells would name if it were the header (numbers name none). */
export function headerRowScore(cells: readonly CellValue[]): number {
  const texts = cells.map(c => (typeof c === 'string' ? c : ''))
  if (texts.filter(t => t.trim() !== '').length < 2) return 0
  const { mapping } = suggestMapping(texts)
  return Object.values(mapping).filter(v => v !== null && v !== undefined).length
}

/** A row of units under the header ("V", "mJ", "K/W", "—"), as suppliers and the template write it. */
function isUnitsLikeRow(cells: readonly CellValue[]): boolean {
  if (isUnitsRow(cells)) return true
  const filled = cells.filter(c => c !== null && String(c).trim() !== '')
  if (filled.length < 2) return false
  return filled.every(c => typeof c === 'string' && (isUnitText(c) || ['-', '—', '–', 'unit', 'units', 'per piece', 'text', '%'].includes(c.trim().toLowerCase())))
}

function preview(cells: readonly CellValue[]): string {
  const text = cells.filter(c => c !== null && String(c).trim() !== '').map(c => String(c).trim()).join(' ')
  return text.length > 60 ? `${text.slice(0, 57)}…` : text
}

/**
 * Finds the header row (the row whose cells best match the catalogue columns, or `headerRow` when the
 * user chose one), skips title rows above it, a units row below it, empty rows and trailing notes
 * rows, each with a note of what was skipped; then checks limits.
 */
function buildTable(allRows: Row[], sheetName: string, format: RawTable['format'], limits: Limits, warnings: Problems, errors: Problems): RawTable {
  const nonEmpty = allRows.filter(r => !isEmptyRow(r.cells))
  const base = { sheetName, format, headerRowNumber: 0, headers: [] as string[], rows: [] as Row[], skipped: [] as SkippedRow[], headerCandidates: [] as HeaderCandidate[] }
  if (nonEmpty.length === 0) {
    errors.add({ message: `the sheet '${sheetName}' is empty` })
    return { ...base, warnings: warnings.finish('warnings'), errors: errors.finish('problems') }
  }
  const candidates = nonEmpty.slice(0, HEADER_SEARCH_ROWS).map(r => ({ rowNumber: r.rowNumber, score: headerRowScore(r.cells), text: preview(r.cells) }))
  let headerIndex = 0
  if (limits.headerRow !== undefined) {
    headerIndex = nonEmpty.findIndex(r => r.rowNumber === limits.headerRow)
    if (headerIndex < 0) {
      errors.add({ row: limits.headerRow, message: `row ${limits.headerRow} is empty or not in the sheet '${sheetName}'; choose the row that holds the column headers` })
      return { ...base, headerCandidates: candidates, warnings: warnings.finish('warnings'), errors: errors.finish('problems') }
    }
  }
  else {
    let best = 0
    candidates.forEach((c, i) => {
      if (c.score > best) {
        best = c.score
        headerIndex = i
      }
    })
  }
  const headerRow = nonEmpty[headerIndex]!
  const skipped: SkippedRow[] = []
  for (const r of nonEmpty.slice(0, headerIndex)) skipped.push({ rowNumber: r.rowNumber, reason: 'above-header', text: preview(r.cells) })

  let lastHeader = headerRow.cells.length - 1
  while (lastHeader >= 0 && (headerRow.cells[lastHeader] === null || String(headerRow.cells[lastHeader]).trim() === '')) lastHeader--
  let dataRows = nonEmpty.slice(headerIndex + 1)
  let units: CellValue[] | null = null
  if (dataRows[0] && isUnitsLikeRow(dataRows[0].cells)) {
    units = dataRows[0].cells
    skipped.push({ rowNumber: dataRows[0].rowNumber, reason: 'units', text: preview(dataRows[0].cells) })
    dataRows = dataRows.slice(1)
  }
  // Notes under the table ("prices valid until …", "* preliminary"): a row filling at most two cells
  // of a table at least four wide is a note, not a part.
  const headerWidth = filledCount(headerRow.cells)
  const notes: Row[] = []
  while (headerWidth >= 4 && dataRows.length > 0 && filledCount(dataRows.at(-1)!.cells) <= 2) notes.unshift(dataRows.pop()!)
  for (const r of notes) skipped.push({ rowNumber: r.rowNumber, reason: 'notes', text: preview(r.cells) })

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
    // A unit from the units row joins its header, so "Eon" over "mJ" reads bare numbers as millijoules.
    const unit = units?.[c]
    if (typeof unit === 'string' && !isUnitsRow(units!) && isUnitText(unit) && !/[([{]/.test(header)) header = `${header} (${unit.trim()})`
    headers.push(header)
  }

  if (dataRows.length === 0) {
    errors.add({ row: headerRow.rowNumber, message: `the sheet '${sheetName}' has a header row (row ${headerRow.rowNumber}) but no parts below it` })
  }
  if (dataRows.length > limits.maxRows) {
    errors.add({ message: `the sheet '${sheetName}' has ${formatCount(dataRows.length)}${format === 'csv' && dataRows.length > limits.maxRows ? ' or more' : ''} rows of parts; the limit is ${formatCount(limits.maxRows)} per upload: split the file` })
    return { ...base, headerRowNumber: headerRow.rowNumber, headers, headerCandidates: candidates, skipped, warnings: warnings.finish('warnings'), errors: errors.finish('problems') }
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
  const above = skipped.filter(s => s.reason === 'above-header')
  if (above.length > 0) {
    warnings.add({ row: above[0]!.rowNumber, message: `the headers were found on row ${headerRow.rowNumber}; row${above.length > 1 ? 's' : ''} ${groupRuns(above.map(s => s.rowNumber)).map(([a, b]) => (a === b ? `${a}` : `${a}–${b}`)).join(', ')} above ${above.length > 1 ? 'them were' : 'it was'} skipped ('${above[0]!.text}')` })
  }
  if (units && !isUnitsRow(units)) warnings.add({ row: headerRow.rowNumber + 1, message: `row ${skipped.find(s => s.reason === 'units')!.rowNumber} holds units; they were added to the headers above them` })
  if (gaps.length > 0) {
    const runs = groupRuns(gaps).map(([a, b]) => (a === b ? `${a}` : `${a}–${b}`))
    warnings.add({ row: gaps[0], message: `empty row${gaps.length > 1 ? 's' : ''} ${runs.join(', ')} skipped` })
    for (const n of gaps) skipped.push({ rowNumber: n, reason: 'blank', text: '' })
  }
  if (notes.length > 0) {
    warnings.add({ row: notes[0]!.rowNumber, message: `row${notes.length > 1 ? 's' : ''} ${groupRuns(notes.map(r => r.rowNumber)).map(([a, b]) => (a === b ? `${a}` : `${a}–${b}`)).join(', ')} below the parts ${notes.length > 1 ? 'look like notes and were' : 'looks like a note and was'} skipped ('${preview(notes[0]!.cells)}')` })
  }
  const rows = dataRows.map(r => ({ rowNumber: r.rowNumber, cells: headers.map((_, i) => r.cells[i] ?? null) }))
  skipped.sort((a, b) => a.rowNumber - b.rowNumber)
  return {
    sheetName,
    format,
    headerRowNumber: headerRow.rowNumber,
    headers,
    rows,
    skipped,
    headerCandidates: candidates,
    warnings: warnings.finish('warnings'),
    errors: errors.finish('problems'),
  }
}
