// CSV text → records with csv-parse (RFC 4180 quoting, CRLF / LF / CR line ends), with delimiter detection.
// Every CSV the app and the tests read goes through csv-parse; this file adds the row and line numbers a person
// needs to find a record, and messages that say what to fix.
import { CsvError, parse } from 'csv-parse/sync'

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

const LINE_BREAK = /\r\n|\r|\n/g
const lineBreaks = (text: string) => text.match(LINE_BREAK)?.length ?? 0

/** csv-parse, as the catalogue reads CSV: blanks before an opening quote dropped, stray quotes kept as text. */
function records(text: string, delimiter: CsvDelimiter, to?: number) {
  return parse(text, { delimiter, relax_column_count: true, relax_quotes: true, ltrim: true, bom: true, info: true, ...(to === undefined ? {} : { to }) }) as unknown as { info: { lines: number }, record: string[] }[]
}

/** Picks the delimiter that splits the first record into the most cells; ',' on a tie. */
export function detectDelimiter(text: string): CsvDelimiter {
  const cellsWith = (d: CsvDelimiter) => {
    try { return records(text, d, 1)[0]?.record.length ?? 0 }
    catch { return 0 }
  }
  let best: CsvDelimiter = ','
  let most = cellsWith(',')
  for (const d of ['\t', ';'] as const) {
    const n = cellsWith(d)
    if (n > most) { best = d; most = n }
  }
  return best
}

/** The line of the quote left open in the record that starts on `startLine`. */
function openQuoteLine(text: string, startLine: number): number {
  const lines = text.split(LINE_BREAK).slice(startLine - 1)
  let open = startLine
  let quoted = false
  lines.forEach((line, i) => {
    for (const ch of line) {
      if (ch !== '"') continue
      quoted = !quoted
      if (quoted) open = startLine + i
    }
  })
  return open
}

/**
 * Splits CSV text into records. Stops early when more than `maxRecords` records are found
 * (the caller reports the limit).
 */
export function parseCsv(text: string, delimiter: CsvDelimiter, maxRecords = Infinity): CsvParseResult {
  try {
    const parsed = records(text, delimiter, Number.isFinite(maxRecords) ? maxRecords + 1 : undefined)
    // csv-parse counts the line a record ends on; the record starts as many line breaks earlier as its cells hold
    return { ok: true, records: parsed.map((r, i) => ({ rowNumber: i + 1, line: r.info.lines - lineBreaks(r.record.join('')), cells: r.record })) }
  }
  catch (err) {
    if (!(err instanceof CsvError)) throw err
    const done = (err as CsvError & { records?: number }).records ?? 0
    const before = done > 0 ? records(text, delimiter, done).at(-1)?.info.lines ?? 0 : 0
    const row = done + 1
    if (err.code === 'CSV_QUOTE_NOT_CLOSED') {
      const line = openQuoteLine(text, before + 1)
      return { ok: false, row, line, message: `a quoted cell opened on line ${line} is never closed (a '"' is missing)` }
    }
    return { ok: false, row, line: before + 1, message: `the text cannot be read as CSV (${err.message}); save the sheet again as CSV` }
  }
}
