// CSV the tests read (LibreOffice's export of our workbooks) goes through csv-parse, like the app's own reading.
import { parse } from 'csv-parse/sync'

/** Rows of cells; quoted cells may hold the delimiter, doubled quotes and line breaks. */
export function readCsv(text: string, delimiter = ','): string[][] {
  return parse(text, { delimiter, relax_column_count: true, bom: true }) as string[][]
}
