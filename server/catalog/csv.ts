// CSV text → records (RFC 4180 quoting, CRLF / LF / CR line ends), with delimiter detection.
// Hand-written because no CSV package is installed; small enough to test fully.

export type CsvDelimiter = ',' | ';' | '\t'

export interface CsvRecord {
  /** 1-based record number: the row a spreadsheet shows when it opens the file. */
  rowNumber: number
  /** 1-based line in the text where the record starts (differs when quoted cells hold line breaks). */
  line: number
  cells: string[]
}

export type CsvParseResult
  = | { ok: true, records: CsvRecord[] }
    | { ok: false, row: number, line: number, message: string }

/** Picks the delimiter that splits the first line (outside quotes) most often; ',' on a tie. */
export function detectDelimiter(text: string): CsvDelimiter {
  const counts: Record<CsvDelimiter, number> = { ',': 0, ';': 0, '\t': 0 }
  let quoted = false
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!
    if (ch === '"') quoted = !quoted
    else if (!quoted && (ch === '\n' || ch === '\r')) break
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++
  }
  let best: CsvDelimiter = ','
  for (const d of ['\t', ';'] as const) if (counts[d] > counts[best]) best = d
  return best
}

/**
 * Splits CSV text into records. Stops early when more than `maxRecords` records are found
 * (the caller reports the limit).
 */
export function parseCsv(text: string, delimiter: CsvDelimiter, maxRecords = Infinity): CsvParseResult {
  const records: CsvRecord[] = []
  let cells: string[] = []
  let cell = ''
  let line = 1
  let recordLine = 1
  let quoted = false
  let quoteStartLine = 0
  let cellWasQuoted = false
  const endCell = () => {
    cells.push(cell)
    cell = ''
    cellWasQuoted = false
  }
  const endRecord = () => {
    endCell()
    records.push({ rowNumber: records.length + 1, line: recordLine, cells })
    cells = []
  }
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          cell += '"'
          i++
        }
        else quoted = false
      }
      else {
        if (ch === '\n' || (ch === '\r' && text[i + 1] !== '\n')) line++
        cell += ch
      }
      continue
    }
    if (ch === '"' && cell.trim() === '' && !cellWasQuoted) {
      // An opening quote: whitespace before it is dropped.
      quoted = true
      cellWasQuoted = true
      quoteStartLine = line
      cell = ''
    }
    else if (ch === delimiter) endCell()
    else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && text[i + 1] === '\n') i++
      endRecord()
      if (records.length > maxRecords) return { ok: true, records }
      line++
      recordLine = line
    }
    else cell += ch
  }
  if (quoted) {
    return { ok: false, row: records.length + 1, line: quoteStartLine, message: `a quoted cell opened on line ${quoteStartLine} is never closed (a '"' is missing)` }
  }
  if (cell !== '' || cells.length > 0 || cellWasQuoted) endRecord()
  return { ok: true, records }
}
