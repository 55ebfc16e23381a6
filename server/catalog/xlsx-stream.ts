// A streaming .xlsx reader with hard limits: each zip entry is inflated in small slices (fflate) and
// its XML read as it arrives, so a sheet is never whole in memory and reading stops at the row, cell
// and unpacked-size limits. Reads what a catalogue import needs: sheet names and visibility, shared
// strings (rich text joined), cell values (numbers, text, booleans, errors, dates by their style),
// formulas (refused by the caller), merged ranges, hidden rows and columns.

import { Inflate } from 'fflate'
import type { ZipEntry } from './zip'

export interface StreamLimits {
  /** rows read from one sheet before stopping */
  maxRows: number
  /** filled cells read from one sheet before stopping */
  maxCells: number
  /** columns a row may reach */
  maxColumns: number
  /** bytes one entry may inflate to */
  maxEntryBytes: number
}

export type XlsxCell
  = | { kind: 'number', value: number, date: boolean }
    | { kind: 'text', value: string }
    | { kind: 'boolean', value: boolean }
    | { kind: 'error', value: string }
    | { kind: 'formula', formula: string }

export interface XlsxRow { rowNumber: number, hidden: boolean, cells: (XlsxCell | undefined)[] }

export interface XlsxSheetInfo { name: string, state: 'visible' | 'hidden' | 'veryHidden', path: string }

export class XlsxLimitError extends Error {
  constructor(readonly limit: 'rows' | 'cells' | 'columns' | 'bytes', message: string) {
    super(message)
  }
}

const SLICE = 16 * 1024

/**
 * Inflates one entry slice by slice, handing each piece of output to `onData`; stops when onData
 * returns false. Output beyond the declared size (or `maxBytes`) is refused: the caller gets the reason.
 */
export function inflateEntry(buffer: Buffer, entry: ZipEntry, maxBytes: number, onData: (chunk: Uint8Array) => boolean | undefined): string | null {
  const at = entry.localHeaderOffset
  if (at + 30 > buffer.length || buffer.readUInt32LE(at) !== 0x04034b50) return `the zip structure of the file is broken (entry '${entry.name}')`
  const start = at + 30 + buffer.readUInt16LE(at + 26) + buffer.readUInt16LE(at + 28)
  const data = buffer.subarray(start, start + entry.compressedSize)
  const ceiling = Math.min(entry.uncompressedSize, maxBytes)
  let total = 0
  let stopped = false
  let problem: string | null = null
  const take = (chunk: Uint8Array) => {
    if (stopped) return
    total += chunk.length
    if (total > entry.uncompressedSize) {
      problem = `entry '${entry.name}' inflates to more than its declared ${entry.uncompressedSize} bytes (refused as a possible zip bomb)`
      stopped = true
      return
    }
    if (total > ceiling) {
      problem = `part '${entry.name}' of the workbook unpacks to more than ${Math.round(ceiling / 1048576)} MB`
      stopped = true
      return
    }
    if (onData(chunk) === false) stopped = true
  }
  if (entry.method === 0) {
    if (entry.compressedSize !== entry.uncompressedSize) return `entry '${entry.name}' is stored with inconsistent sizes`
    for (let i = 0; i < data.length && !stopped; i += SLICE) take(data.subarray(i, Math.min(data.length, i + SLICE)))
    return problem
  }
  if (entry.method !== 8) return `entry '${entry.name}' uses compression method ${entry.method}, which workbooks do not use`
  try {
    const inflate = new Inflate((chunk) => { take(chunk) })
    for (let i = 0; i < data.length && !stopped; i += SLICE) inflate.push(data.subarray(i, Math.min(data.length, i + SLICE)), i + SLICE >= data.length)
  }
  catch (error) {
    return `entry '${entry.name}' cannot be inflated (${(error as Error).message})`
  }
  if (!problem && !stopped && total !== entry.uncompressedSize) problem = `entry '${entry.name}' inflates to ${total} bytes, not the ${entry.uncompressedSize} its directory declares`
  return problem
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: '\'' }
function decode(text: string): string {
  if (!text.includes('&')) return text
  return text.replace(/&(#x[0-9a-f]+|#\d+|\w+);/gi, (whole, name: string) => {
    if (name[0] === '#') return String.fromCodePoint(name[1] === 'x' || name[1] === 'X' ? Number.parseInt(name.slice(2), 16) : Number(name.slice(1)))
    return ENTITIES[name] ?? whole
  })
}

function attributes(tag: string): Record<string, string> {
  const out: Record<string, string> = {}
  for (const m of tag.matchAll(/([\w:]+)\s*=\s*(?:"([^"]*)"|'([^']*)')/g)) out[m[1]!.replace(/^\w+:/, p => (p === 'r:' ? 'r:' : ''))] = decode(m[2] ?? m[3] ?? '')
  return out
}

/**
 * Feeds XML text in pieces; calls `onTag(name, attrs, selfClosing, closing)` and `onText(text)`.
 * Element names lose their namespace prefix. Keeps only the unfinished tail between pieces.
 */
class XmlStream {
  private rest = ''
  private readonly decoder = new TextDecoder('utf-8')
  constructor(private readonly onTag: (name: string, tag: string, selfClosing: boolean, closing: boolean) => void, private readonly onText: (text: string) => void) {}
  push(chunk: Uint8Array, final = false) {
    const s = this.rest + this.decoder.decode(chunk, { stream: !final })
    let i = 0
    for (;;) {
      const lt = s.indexOf('<', i)
      if (lt < 0) {
        if (i < s.length) this.onText(s.slice(i))
        i = s.length
        break
      }
      if (lt > i) this.onText(s.slice(i, lt))
      // Comments, processing instructions and CDATA are skipped whole.
      if (s.startsWith('<!--', lt) || s.startsWith('<?', lt) || s.startsWith('<![CDATA[', lt)) {
        const end = s.startsWith('<!--', lt) ? s.indexOf('-->', lt) : s.startsWith('<?', lt) ? s.indexOf('?>', lt) : s.indexOf(']]>', lt)
        if (end < 0) { i = lt; break }
        if (s.startsWith('<![CDATA[', lt)) this.onText(s.slice(lt + 9, end))
        i = end + (s.startsWith('<!--', lt) || s.startsWith('<![CDATA[', lt) ? 3 : 2)
        continue
      }
      const gt = s.indexOf('>', lt)
      if (gt < 0) { i = lt; break }
      const tag = s.slice(lt + 1, gt)
      const closing = tag.startsWith('/')
      const selfClosing = tag.endsWith('/')
      const name = /^\/?([\w:.-]+)/.exec(tag)?.[1]?.replace(/^[\w.-]+:/, '') ?? ''
      this.onTag(name, tag, selfClosing, closing)
      i = gt + 1
    }
    this.rest = s.slice(i)
  }
}

function readWhole(buffer: Buffer, entry: ZipEntry | undefined, maxBytes: number): { text: string } | { problem: string } | null {
  if (!entry) return null
  const parts: Uint8Array[] = []
  const problem = inflateEntry(buffer, entry, maxBytes, (c) => {
    parts.push(c)
    return undefined
  })
  if (problem) return { problem }
  return { text: Buffer.concat(parts).toString('utf8') }
}

/** Sheets of the workbook in tab order, with their visibility and the path of their XML. */
export function readSheetList(buffer: Buffer, entries: Map<string, ZipEntry>): XlsxSheetInfo[] | { problem: string } {
  const wb = readWhole(buffer, entries.get('xl/workbook.xml'), 8 * 1024 * 1024)
  if (!wb) return { problem: 'the workbook has no xl/workbook.xml' }
  if ('problem' in wb) return wb
  const rels = readWhole(buffer, entries.get('xl/_rels/workbook.xml.rels'), 8 * 1024 * 1024)
  if (rels && 'problem' in rels) return rels
  const targets = new Map<string, string>()
  for (const m of (rels?.text ?? '').matchAll(/<(?:\w+:)?Relationship\b[^>]*>/g)) {
    const a = attributes(m[0])
    if (a.Id && a.Target) targets.set(a.Id, a.Target.startsWith('/') ? a.Target.slice(1) : `xl/${a.Target}`.replace(/\/\.\//g, '/'))
  }
  const sheets: XlsxSheetInfo[] = []
  for (const m of wb.text.matchAll(/<(?:\w+:)?sheet\b[^>]*>/g)) {
    const a = attributes(m[0])
    const id = a['r:id'] ?? Object.entries(a).find(([k]) => k.endsWith(':id') || k === 'id')?.[1]
    const path = (id && targets.get(id)) || `xl/worksheets/sheet${sheets.length + 1}.xml`
    sheets.push({ name: a.name ?? `Sheet${sheets.length + 1}`, state: a.state === 'hidden' ? 'hidden' : a.state === 'veryHidden' ? 'veryHidden' : 'visible', path })
  }
  return sheets
}

/** Shared strings in order (rich-text runs joined, phonetic runs left out). */
export function readSharedStrings(buffer: Buffer, entry: ZipEntry | undefined, limits: StreamLimits): string[] | { problem: string } {
  const strings: string[] = []
  if (!entry) return strings
  let current: string[] | null = null
  let inText = false
  let inPhonetic = false
  const xml = new XmlStream((name, _tag, selfClosing, closing) => {
    if (name === 'si') {
      if (closing) {
        strings.push(current?.join('') ?? '')
        current = null
      }
      else if (selfClosing) strings.push('')
      else current = []
    }
    else if (name === 'rPh') inPhonetic = !closing && !selfClosing
    else if (name === 't') inText = !closing && !selfClosing
  }, (text) => {
    if (inText && !inPhonetic && current) current.push(decode(text))
  })
  const problem = inflateEntry(buffer, entry, limits.maxEntryBytes, (c) => {
    xml.push(c)
    return strings.length <= limits.maxCells
  })
  if (problem) return { problem }
  return strings
}

const DATE_FORMAT_IDS = new Set([14, 15, 16, 17, 18, 19, 20, 21, 22, 27, 30, 36, 45, 46, 47, 50, 57])

/** Per cell style index: whether its number format shows a date or time. */
export function readDateStyles(buffer: Buffer, entry: ZipEntry | undefined): boolean[] {
  const styles = readWhole(buffer, entry, 8 * 1024 * 1024)
  if (!styles || 'problem' in styles) return []
  const custom = new Map<number, boolean>()
  for (const m of styles.text.matchAll(/<(?:\w+:)?numFmt\b[^>]*>/g)) {
    const a = attributes(m[0])
    const code = (a.formatCode ?? '').replace(/"[^"]*"|\[[^\]]*\]|\\./g, '')
    custom.set(Number(a.numFmtId), /[dmyhs]/i.test(code))
  }
  const xfs = /<(?:\w+:)?cellXfs\b[^>]*>([\s\S]*?)<\/(?:\w+:)?cellXfs>/.exec(styles.text)?.[1] ?? ''
  const out: boolean[] = []
  for (const m of xfs.matchAll(/<(?:\w+:)?xf\b[^>]*>/g)) {
    const id = Number(attributes(m[0]).numFmtId ?? 0)
    out.push(custom.get(id) ?? DATE_FORMAT_IDS.has(id))
  }
  return out
}

function columnIndex(ref: string): number {
  let n = 0
  for (const ch of ref) {
    const code = ch.charCodeAt(0)
    if (code < 65 || code > 90) break
    n = n * 26 + (code - 64)
  }
  return n - 1
}

export interface SheetReadResult {
  rows: XlsxRow[]
  merges: string[]
  hiddenColumns: Set<number>
  /** True when `stopAfterFirstRow` stopped the read. */
  partial: boolean
}

/**
 * Streams one worksheet. Throws XlsxLimitError when a limit is passed (before the rest is read);
 * returns a problem string for a broken entry.
 */
export function readSheet(buffer: Buffer, entry: ZipEntry, strings: readonly string[], dateStyles: readonly boolean[], limits: StreamLimits, stopAfterFirstRow = false): SheetReadResult | { problem: string } {
  const rows: XlsxRow[] = []
  const merges: string[] = []
  const hiddenColumns = new Set<number>()
  let row: XlsxRow | null = null
  let cellRef = -1
  let cellType = ''
  let cellStyle = 0
  let nextColumn = 0
  let value: string[] | null = null
  let formula: string[] | null = null
  let inlineText: string[] | null = null
  let inT = false
  let inV = false
  let cells = 0
  let stop = false
  let limitError: XlsxLimitError | null = null

  const finishCell = () => {
    if (!row || cellRef < 0) return
    let cell: XlsxCell | undefined
    if (formula !== null) cell = { kind: 'formula', formula: formula.join('') }
    else if (cellType === 'inlineStr') cell = inlineText ? { kind: 'text', value: inlineText.join('') } : undefined
    else if (value !== null) {
      const v = decode(value.join(''))
      if (cellType === 's') cell = { kind: 'text', value: strings[Number(v)] ?? '' }
      else if (cellType === 'str') cell = { kind: 'text', value: v }
      else if (cellType === 'b') cell = { kind: 'boolean', value: v === '1' || v === 'true' }
      else if (cellType === 'e') cell = { kind: 'error', value: v }
      else if (v.trim() !== '') cell = { kind: 'number', value: Number(v), date: dateStyles[cellStyle] === true }
    }
    if (cell) {
      if (cellRef >= limits.maxColumns) { limitError = new XlsxLimitError('columns', `more than ${limits.maxColumns} columns in row ${row.rowNumber}`); stop = true; return }
      if (++cells > limits.maxCells) { limitError = new XlsxLimitError('cells', `more than ${limits.maxCells} filled cells`); stop = true; return }
      row.cells[cellRef] = cell
    }
  }
  const xml = new XmlStream((name, tag, selfClosing, closing) => {
    switch (name) {
      case 'row':
        if (!closing) {
          const a = attributes(tag)
          row = { rowNumber: Number(a.r ?? (rows.at(-1)?.rowNumber ?? 0) + 1), hidden: a.hidden === '1' || a.hidden === 'true', cells: [] }
          nextColumn = 0
        }
        if (closing || selfClosing) {
          const done = row as XlsxRow | null
          if (done) rows.push(done)
          if (rows.length > limits.maxRows) { limitError = new XlsxLimitError('rows', `more than ${limits.maxRows} rows`); stop = true }
          if (stopAfterFirstRow && done && done.cells.some(Boolean)) stop = true
          row = null
        }
        break
      case 'c':
        if (closing) { finishCell(); cellRef = -1 }
        else {
          const a = attributes(tag)
          cellRef = a.r ? columnIndex(a.r) : nextColumn
          nextColumn = cellRef + 1
          cellType = a.t ?? 'n'
          cellStyle = Number(a.s ?? 0)
          value = null
          formula = null
          inlineText = null
          if (selfClosing) { finishCell(); cellRef = -1 }
        }
        break
      case 'v':
        inV = !closing && !selfClosing
        if (inV) value = []
        break
      case 'f':
        if (!closing) formula = []
        break
      case 'is':
        if (!closing && !selfClosing) inlineText = []
        break
      case 't':
        inT = !closing && !selfClosing
        break
      case 'mergeCell':
        if (!closing) { const ref = attributes(tag).ref; if (ref) merges.push(ref) }
        break
      case 'col':
        if (!closing) {
          const a = attributes(tag)
          if (a.hidden === '1' || a.hidden === 'true') for (let c = Number(a.min) - 1; c <= Number(a.max) - 1 && c < limits.maxColumns; c++) hiddenColumns.add(c)
        }
        break
    }
  }, (text) => {
    if (cellRef < 0) return
    if (inT && inlineText) inlineText.push(decode(text))
    else if (inV && value) value.push(text)
    else if (formula !== null && value === null) formula.push(decode(text))
  })
  const problem = inflateEntry(buffer, entry, limits.maxEntryBytes, (c) => {
    xml.push(c)
    return !stop
  })
  if (limitError) throw limitError
  if (problem && !stop) return { problem }
  return { rows, merges, hiddenColumns, partial: stop }
}
