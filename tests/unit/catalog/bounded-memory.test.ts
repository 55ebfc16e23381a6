// Bounded memory on hostile and on full-size uploads: the read runs in a child process (as the server
// would) and its peak RSS is measured there; a dense-cell sheet under the 10 MB upload limit is refused
// at the cell limit, and the largest allowed catalogue (20 000 rows × 32 columns) reads, both under 400 MB.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { strToU8, zipSync } from 'fflate'
import { afterAll, describe, expect, it } from 'vitest'
import { buildTemplateRows } from '../../../catalog/columns'

const dir = mkdtempSync(join(tmpdir(), 'stratavolt-rss-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))

function xlsx(sheetXml: string): Buffer {
  return Buffer.from(zipSync({
    '[Content_Types].xml': strToU8('<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/></Types>'),
    'xl/workbook.xml': strToU8('<?xml version="1.0"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets><sheet name="Parts" sheetId="1" r:id="rId1"/></sheets></workbook>'),
    'xl/_rels/workbook.xml.rels': strToU8('<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>'),
    'xl/worksheets/sheet1.xml': strToU8(sheetXml),
  }, { level: 6 }))
}

const escape = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;')
const cellXml = (v: string | number | null) => (v === null ? '' : typeof v === 'number' ? `<c><v>${v}</v></c>` : `<c t="inlineStr"><is><t>${escape(v)}</t></is></c>`)

function measure(buffer: Buffer, name: string) {
  const file = join(dir, name)
  writeFileSync(file, buffer)
  const out = execFileSync(process.execPath, ['--import', 'tsx', join(import.meta.dirname, '../../support/measure-read.mts'), file], { encoding: 'utf8', maxBuffer: 1 << 20 })
  return JSON.parse(out.trim().split('\n').at(-1)!) as { bytes: number, rows: number, errors: string[], peakRssMB: number }
}

describe('bounded memory when reading .xlsx uploads', () => {
  it('refuses a dense-cell sheet under the upload limit at the cell limit, under 400 MB', () => {
    // 3 million filled cells of pseudo-random numbers: a few MB zipped, tens of MB of XML.
    let seed = 7
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2147483648)
    const rows: string[] = []
    for (let r = 0; r < 15_000; r++) {
      let cells = ''
      for (let c = 0; c < 200; c++) cells += `<c><v>${rand() % 100000}</v></c>`
      rows.push(`<row>${cells}</row>`)
    }
    const buffer = xlsx(`<?xml version="1.0"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${rows.join('')}</sheetData></worksheet>`)
    rows.length = 0
    expect(buffer.length).toBeLessThan(10 * 1024 * 1024)
    const result = measure(buffer, 'dense.xlsx')
    console.info(`dense sheet: ${(buffer.length / 1048576).toFixed(1)} MB zipped, peak RSS ${result.peakRssMB} MB, ${result.errors[0]}`)
    expect(result.errors[0]).toMatch(/more than 1 600 000 filled cells/)
    expect(result.peakRssMB, JSON.stringify(result)).toBeLessThan(400)
  }, 120_000)

  it('reads the largest allowed catalogue, 20 000 rows of every column, under 400 MB', () => {
    const t = buildTemplateRows()
    const rows = [`<row>${t.header.map(cellXml).join('')}</row>`]
    for (let r = 0; r < 20_000; r++) {
      const cells = [...t.examples[0]!]
      cells[0] = `P-${r}`
      rows.push(`<row>${cells.map(cellXml).join('')}</row>`)
    }
    const buffer = xlsx(`<?xml version="1.0"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${rows.join('')}</sheetData></worksheet>`)
    const result = measure(buffer, 'full.xlsx')
    console.info(`full catalogue: ${(buffer.length / 1048576).toFixed(1)} MB zipped, ${result.rows} rows, peak RSS ${result.peakRssMB} MB`)
    expect(result.errors).toEqual([])
    expect(result.rows).toBe(20_000)
    expect(result.peakRssMB, JSON.stringify(result)).toBeLessThan(400)
  }, 120_000)
})
