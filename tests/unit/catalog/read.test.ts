// Reading uploads: .xlsx and .csv, and everything that must be refused with the cell or row named.
// Fixtures are generated here (exceljs, a small zip writer), nothing binary is committed.
import { execFileSync } from 'node:child_process'
import fc from 'fast-check'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { buildTemplateRows } from '../../../catalog/columns'
import { detectDelimiter, parseCsv } from '../../../server/catalog/csv'
import { readCatalogFile } from '../../../server/catalog/read'
import { readZipDirectory, verifyZipEntries } from '../../../server/catalog/zip'
import { suggestMapping } from '../../../shared/catalog/mapping'
import { validateRows } from '../../../shared/catalog/validate'
import { exampleRow, templateSheet, workbookBuffer, zipBuffer } from '../../fixtures/catalog/workbooks'

const messages = (problems: { message: string }[]) => problems.map(p => p.message).join('\n')

describe('readCatalogFile: .xlsx', () => {
  it('reads the template with parts, skipping the units row, with the row numbers the user sees', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1'), exampleRow(3, 'C-1')]) }])
    const table = await readCatalogFile(buffer, 'parts.xlsx')
    expect(table.errors).toEqual([])
    expect(table.warnings).toEqual([])
    expect(table.format).toBe('xlsx')
    expect(table.sheetName).toBe('Parts')
    expect(table.headerRowNumber).toBe(1)
    expect(table.headers).toEqual(buildTemplateRows().header)
    expect(table.rows.map(r => r.rowNumber)).toEqual([3, 4])
    expect(table.rows[0]!.cells[0]).toBe('P-1')
    expect(table.rows[0]!.cells[5]).toBe(1200)
    // Read → map → validate gives the parts.
    const { mapping } = suggestMapping(table.headers)
    const result = validateRows(table, mapping, { decimalSeparator: '.' })
    expect(result.issues).toEqual([])
    expect(result.parts.map(p => p.partNumber)).toEqual(['P-1', 'C-1'])
  })

  it('refuses a formula, naming the cell', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1'), exampleRow(0, 'P-2')]) }], (wb) => {
      wb.getWorksheet('Parts')!.getCell('F4').value = { formula: 'F3*1.5', result: 1800 }
    })
    const table = await readCatalogFile(buffer, 'f.xlsx')
    expect(table.errors).toHaveLength(1)
    expect(table.errors[0]).toMatchObject({ row: 4, column: 'F' })
    expect(table.errors[0]!.message).toMatch(/cell F4 holds a formula \(=F3\*1\.5\); catalogue values must be typed in literally/)
  })

  it('refuses merged cells, naming the range', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1'), exampleRow(0, 'P-2'), exampleRow(0, 'P-3')]) }], (wb) => {
      wb.getWorksheet('Parts')!.mergeCells('B3:B5')
    })
    const table = await readCatalogFile(buffer, 'm.xlsx')
    expect(messages(table.errors)).toMatch(/cells B3:B5 are merged; unmerge them and fill every cell/)
    expect(table.errors[0]).toMatchObject({ row: 3, column: 'B' })
  })

  it('refuses hidden rows and warns about hidden columns', async () => {
    const rows = templateSheet([exampleRow(0, 'P-1'), exampleRow(0, 'P-2'), exampleRow(0, 'P-3'), exampleRow(0, 'P-4'), exampleRow(0, 'P-5')])
    const buffer = await workbookBuffer([{ name: 'Parts', rows }], (wb) => {
      const ws = wb.getWorksheet('Parts')!
      ws.getRow(4).hidden = true
      ws.getRow(5).hidden = true
      ws.getRow(7).hidden = true
      ws.getColumn(3).hidden = true
    })
    const table = await readCatalogFile(buffer, 'h.xlsx')
    expect(table.errors.map(e => e.message)).toEqual([
      'rows 4–5 are hidden; unhide them (or clear filters) or delete them, so that what you see is what is imported',
      'row 7 is hidden; unhide it (or clear filters) or delete it, so that what you see is what is imported',
    ])
    expect(messages(table.warnings)).toMatch(/column C is hidden in the sheet but will be read/)
  })

  it('reads the sheet named like "Parts" among several, says which, and skips hidden sheets', async () => {
    const buffer = await workbookBuffer([
      { name: 'Read me', rows: [['Instructions']] },
      { name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1')]), state: 'hidden' },
      { name: 'Parts (new)', rows: templateSheet([exampleRow(2, 'D-9')]) },
    ])
    const table = await readCatalogFile(buffer, 's.xlsx')
    expect(table.sheetName).toBe('Parts (new)')
    expect(table.rows[0]!.cells[0]).toBe('D-9')
    expect(messages(table.warnings)).toBe('read the sheet \'Parts (new)\'; not read: \'Read me\', \'Parts\' (hidden)')
  })

  it('reads the first visible sheet when none is named like a parts list', async () => {
    const buffer = await workbookBuffer([
      { name: 'Sheet1', rows: templateSheet([exampleRow(1, 'S-1')]) },
      { name: 'Sheet2', rows: [['x']] },
    ])
    const table = await readCatalogFile(buffer, 'x.xlsx')
    expect(table.sheetName).toBe('Sheet1')
    expect(messages(table.warnings)).toMatch(/not read: 'Sheet2'/)
  })

  it('leaves duplicate parts to validation, which names both rows (the file itself is readable)', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1'), exampleRow(1, 'P-2'), exampleRow(0, 'p-1')]) }])
    const table = await readCatalogFile(buffer, 'd.xlsx')
    expect(table.errors).toEqual([])
    const result = validateRows(table, suggestMapping(table.headers).mapping, { decimalSeparator: '.' })
    expect(result.issues.filter(i => i.field === 'partNumber').map(i => `${i.row}: ${i.message}`)).toEqual([
      '3: duplicate: Example Semiconductor p-1 is also on row 5 with other values: keep one',
      '5: duplicate: Example Semiconductor p-1 is also on row 3 with other values: keep one',
    ])
  })

  it('refuses an empty sheet and a header-only sheet', async () => {
    const empty = await readCatalogFile(await workbookBuffer([{ name: 'Parts', rows: [] }]), 'e.xlsx')
    expect(messages(empty.errors)).toBe('the sheet \'Parts\' is empty')
    const headerOnly = await readCatalogFile(await workbookBuffer([{ name: 'Parts', rows: templateSheet([]) }]), 'h.xlsx')
    expect(messages(headerOnly.errors)).toBe('the sheet \'Parts\' has a header row (row 1) but no parts below it')
    expect(headerOnly.headers).toHaveLength(buildTemplateRows().header.length)
  })

  it('converts rich text, hyperlinks, booleans and dates; refuses error values', async () => {
    const header = ['Part number', 'Manufacturer', 'Datasheet URL', 'Description', 'Lead time']
    const buffer = await workbookBuffer([{ name: 'Parts', rows: [header, [
      { richText: [{ text: 'RT-' }, { text: '1', font: { bold: true } }] },
      'Acme',
      { text: 'https://datasheets.example/rt-1.pdf', hyperlink: 'https://datasheets.example/rt-1.pdf' },
      true,
      new Date(Date.UTC(2024, 1, 1)),
    ], ['X', { error: '#DIV/0!' }]] }])
    const table = await readCatalogFile(buffer, 'r.xlsx')
    expect(table.rows[0]!.cells).toEqual(['RT-1', 'Acme', 'https://datasheets.example/rt-1.pdf', 'TRUE', '2024-02-01'])
    expect(messages(table.warnings)).toMatch(/cell E2 holds a date \(2024-02-01\); if a number was meant/)
    expect(table.errors).toEqual([{ row: 3, column: 'B', message: 'cell B3 shows the error #DIV/0!; type in the value instead' }])
  })

  it('names empty rows skipped between parts and headerless columns', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: [['Part number', 'Manufacturer', null], ['A', 'M', 'extra'], [], ['B', 'M', null]] }])
    const table = await readCatalogFile(buffer, 'g.xlsx')
    expect(table.rows.map(r => r.rowNumber)).toEqual([2, 4])
    expect(table.headers).toEqual(['Part number', 'Manufacturer', 'Column C'])
    expect(messages(table.warnings)).toMatch(/column C has data but no header/)
    expect(messages(table.warnings)).toMatch(/empty row 3 skipped/)
  })

  it('refuses more data rows than the limit', async () => {
    const rows = Array.from({ length: 51 }, (_, i) => exampleRow(0, `P-${i}`))
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet(rows) }])
    const table = await readCatalogFile(buffer, 'big.xlsx', { maxRows: 50 })
    expect(messages(table.errors)).toMatch(/has 51 rows of parts/)
    expect(messages(table.errors)).toMatch(/the limit is 50/)
    expect(table.rows).toEqual([])
    const ok = await readCatalogFile(buffer, 'big.xlsx', { maxRows: 51 })
    expect(ok.errors).toEqual([])
    expect(ok.rows).toHaveLength(51)
  })

  it('stops early on a sheet far past the row limit or absurdly wide', async () => {
    const tall = await workbookBuffer([{ name: 'Parts', rows: [['Part number'], ...Array.from({ length: 150 }, (_, i) => [`P-${i}`])] }])
    expect(messages((await readCatalogFile(tall, 'tall.xlsx', { maxRows: 50 })).errors)).toBe('\'tall.xlsx\' has more than 110 rows in a sheet; the limit is 50 parts per upload: split the file')
    const wide = await workbookBuffer([{ name: 'Parts', rows: [Array.from({ length: 1001 }, (_, i) => `H${i}`)] }])
    expect(messages((await readCatalogFile(wide, 'wide.xlsx')).errors)).toMatch(/has more than 1000 columns in a row/)
  })

  it('lists at most maxProblems problems and counts the rest', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet(Array.from({ length: 12 }, (_, i) => exampleRow(0, `P-${i}`))) }], (wb) => {
      const ws = wb.getWorksheet('Parts')!
      for (let r = 3; r <= 14; r++) ws.getCell(`F${r}`).value = { formula: '1+1', result: 2 }
    })
    const table = await readCatalogFile(buffer, 'many.xlsx', { maxProblems: 5 })
    expect(table.errors).toHaveLength(6)
    expect(table.errors[5]!.message).toBe('… and 7 more problems not listed')
  })
})

describe('readCatalogFile: files that are not spreadsheets', () => {
  it.each([
    ['a PDF', Buffer.from('%PDF-1.7\n1 0 obj'), 'x.pdf', /a PDF, not a spreadsheet/],
    ['a PNG', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]), 'x.png', /an image/],
    ['an old .xls', Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0]), 'x.xls', /Excel 97–2003 \(\.xls\).*save it as \.xlsx/],
    ['binary data', Buffer.from([1, 2, 3, 0, 5, 6, 0, 8]), 'x.bin', /a binary file, not a spreadsheet/],
    ['gzip', Buffer.from([0x1f, 0x8b, 8, 0, 0, 0]), 'x.gz', /compressed archive/],
    ['text named .xlsx', Buffer.from('Part number,Manufacturer\nA,B\n'), 'x.xlsx', /named \.xlsx but is not an Excel workbook/],
  ])('refuses %s', async (_, buffer, name, reason) => {
    const table = await readCatalogFile(buffer, name)
    expect(table.rows).toEqual([])
    expect(messages(table.errors)).toMatch(reason)
  })

  it('refuses a zip that is not a workbook, and an OpenDocument file', async () => {
    const docx = zipBuffer([{ name: 'word/document.xml', data: Buffer.from('<w/>') }])
    expect(messages((await readCatalogFile(docx, 'x.docx')).errors)).toMatch(/a Word document/)
    const ods = zipBuffer([{ name: 'mimetype', data: Buffer.from('application/vnd.oasis.opendocument.spreadsheet') }, { name: 'content.xml', data: Buffer.from('<x/>') }])
    expect(messages((await readCatalogFile(ods, 'x.ods')).errors)).toMatch(/OpenDocument file \(\.ods\).*save it as \.xlsx or \.csv/)
    const other = zipBuffer([{ name: 'a.txt', data: Buffer.from('hello') }])
    expect(messages((await readCatalogFile(other, 'x.zip')).errors)).toMatch(/a zip archive but not an Excel workbook/)
  })

  it('refuses a workbook that is damaged inside', async () => {
    const broken = zipBuffer([{ name: '[Content_Types].xml', data: Buffer.from('<Types/>') }, { name: 'xl/workbook.xml', data: Buffer.from('not xml <<<') }])
    const table = await readCatalogFile(broken, 'broken.xlsx')
    expect(table.errors).toHaveLength(1)
    expect(table.errors[0]!.message).toMatch(/could not be read as an \.xlsx workbook|no visible worksheet/)
  })

  it('refuses an empty file and an oversized one', async () => {
    expect(messages((await readCatalogFile(Buffer.alloc(0), 'empty.csv')).errors)).toBe('\'empty.csv\' is empty (0 bytes)')
    expect(messages((await readCatalogFile(Buffer.from('\uFEFF  \n\n'), 'blank.csv')).errors)).toBe('\'blank.csv\' is empty (no text)')
    const big = Buffer.alloc(6 * 1024 * 1024, 0x41)
    expect(messages((await readCatalogFile(big, 'big.csv')).errors)).toBe('\'big.csv\' is 6.0 MB; uploads are limited to 5.0 MB')
    expect(messages((await readCatalogFile(Buffer.alloc(3000, 0x41), 'x.csv', { maxBytes: 2048 })).errors)).toBe('\'x.csv\' is 3 kB; uploads are limited to 2 kB')
  })
})

describe('zip bombs', () => {
  const contentTypes = { name: '[Content_Types].xml', data: Buffer.from('<Types/>') }
  const workbookXml = { name: 'xl/workbook.xml', data: Buffer.from('<workbook/>') }

  it('refuses a workbook that inflates past the size limit, before any spreadsheet parsing', async () => {
    // 120 MB of zeros deflate to about 120 kB: over the 100 MB default.
    const bomb = zipBuffer([contentTypes, workbookXml, { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(120 * 1024 * 1024) }])
    expect(bomb.length).toBeLessThan(1024 * 1024)
    const table = await readCatalogFile(bomb, 'bomb.xlsx')
    expect(messages(table.errors)).toMatch(/would inflate to more than 100\.0 MB \(refused as a possible zip bomb\)/)
  }, 30_000)

  it('refuses an extreme compression ratio under the size limit', async () => {
    const bomb = zipBuffer([contentTypes, workbookXml, { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(30 * 1024 * 1024) }])
    const inspection = readZipDirectory(bomb)
    expect(inspection.ok).toBe(false)
    if (!inspection.ok) expect(inspection.reason).toMatch(/compressed \d+:1 .*refused as a possible zip bomb \(limit 200:1\)/)
  }, 30_000)

  it('refuses an entry that inflates past the size its directory declares', async () => {
    const liar = zipBuffer([contentTypes, workbookXml, { name: 'xl/worksheets/sheet1.xml', data: Buffer.alloc(5 * 1024 * 1024, 0x20), declaredSize: 1000 }])
    const inspection = readZipDirectory(liar)
    expect(inspection.ok).toBe(true)
    if (inspection.ok) {
      expect(inspection.totalUncompressedBytes).toBeLessThan(2000)
      expect(verifyZipEntries(liar, inspection.entries)).toMatch(/inflates to more than its declared 1000 bytes/)
    }
    expect(messages((await readCatalogFile(liar, 'liar.xlsx')).errors)).toMatch(/possible zip bomb/)
  })

  it('reads the directory of a real workbook', async () => {
    const buffer = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, 'P-1')]) }])
    const inspection = readZipDirectory(buffer)
    expect(inspection.ok).toBe(true)
    if (inspection.ok) {
      expect(inspection.entries.map(e => e.name)).toContain('xl/workbook.xml')
      expect(verifyZipEntries(buffer, inspection.entries)).toBeNull()
    }
  })
})

describe('readCatalogFile: .csv', () => {
  const header = buildTemplateRows().header
  const csvLine = (cells: (string | number | null)[], d: string) => cells.map((c) => {
    const s = c === null ? '' : String(c)
    return /[",;\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
  }).join(d)

  it('reads a comma CSV', async () => {
    const text = [csvLine(header, ','), csvLine(exampleRow(0, 'P-1'), ','), csvLine(exampleRow(3, 'C-1'), ',')].join('\n')
    const table = await readCatalogFile(Buffer.from(text), 'parts.csv')
    expect(table.errors).toEqual([])
    expect(table.delimiter).toBe(',')
    expect(table.suggestedDecimalSeparator).toBe('.')
    expect(table.rows.map(r => r.rowNumber)).toEqual([2, 3])
    const { mapping } = suggestMapping(table.headers)
    const result = validateRows(table, mapping, { decimalSeparator: '.' })
    expect(result.issues).toEqual([])
    expect(result.parts[0]!.priceBreaks).toHaveLength(3)
  })

  it('reads a ";" CSV with a BOM and decimal commas', async () => {
    const rows = [
      'Part number;Manufacturer;Kind;Voltage rating;Capacitance;Ripple current rating;ESR;Unit price breaks;Currency',
      'C-7;Acme;capacitor;1,1 kV;4,7 mF;60;1,2 mΩ;1:48,00; 50:43,50;EUR',
    ]
    const table = await readCatalogFile(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(rows.join('\r\n'))]), 'semi.csv')
    expect(table.delimiter).toBe(';')
    expect(table.suggestedDecimalSeparator).toBe(',')
    expect(table.headers[0]).toBe('Part number')
    // The unquoted ';' inside the price cell splits it: the row is wider than the header.
    expect(messages(table.warnings)).toMatch(/column J has data but no header; it is listed as 'Column J'/)
    const quoted = rows[0] + '\r\n' + 'C-7;Acme;capacitor;1,1 kV;4,7 mF;60;1,2 mΩ;"1:48,00; 50:43,50";EUR\r\n'
    const table2 = await readCatalogFile(Buffer.from(quoted), 'semi.csv')
    expect(table2.warnings).toEqual([])
    const { mapping } = suggestMapping(table2.headers)
    const result = validateRows(table2, mapping, { decimalSeparator: table2.suggestedDecimalSeparator! })
    expect(result.issues).toEqual([])
    expect(result.parts[0]).toMatchObject({ voltageRating: 1100, capacitance: 0.0047, rippleCurrentRating: 60, priceBreaks: [{ minQuantity: 1, unitPrice: 48 }, { minQuantity: 50, unitPrice: 43.5 }] })
  })

  it('reads UTF-16 text and falls back to Windows-1252 with a warning', async () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Part number\tESR\nA\t2 mΩ\n', 'utf16le')])
    const t16 = await readCatalogFile(utf16, 'unicode.txt')
    expect(t16.delimiter).toBe('\t')
    expect(t16.rows[0]!.cells).toEqual(['A', '2 mΩ'])
    const latin = Buffer.from([...Buffer.from('Part number,Capacitance\nA,4.7 '), 0xb5, ...Buffer.from('F\n')])
    const t1252 = await readCatalogFile(latin, 'latin.csv')
    expect(t1252.rows[0]!.cells).toEqual(['A', '4.7 µF'])
    expect(messages(t1252.warnings)).toMatch(/not UTF-8; it was read as Windows-1252/)
  })

  it('refuses formulas and an unclosed quote, naming the row', async () => {
    const f = await readCatalogFile(Buffer.from('Part number,Voltage rating\nA,=B1*2\n'), 'f.csv')
    expect(f.errors).toEqual([{ row: 2, column: 'B', message: 'cell B2 holds a formula (=B1*2); catalogue values must be typed in literally' }])
    const q = await readCatalogFile(Buffer.from('Part number,Description\nA,ok\nB,"never closed\nC,x\n'), 'q.csv')
    expect(q.errors[0]).toMatchObject({ row: 3 })
    expect(q.errors[0]!.message).toMatch(/a quoted cell opened on line 3 is never closed/)
  })

  it('refuses a header-only CSV and too many rows', async () => {
    expect(messages((await readCatalogFile(Buffer.from('Part number,Manufacturer\n'), 'h.csv')).errors)).toMatch(/has a header row \(row 1\) but no parts below it/)
    const many = ['Part number', ...Array.from({ length: 30 }, (_, i) => `P${i}`)].join('\n')
    const table = await readCatalogFile(Buffer.from(many), 'm.csv', { maxRows: 20 })
    expect(messages(table.errors)).toMatch(/rows of parts; the limit is 20 per upload/)
  })

  it('reports duplicates with row numbers', async () => {
    const text = 'Manufacturer,Part number\nAcme,X-1\nAcme,Y-2\nACME ,x-1\n'
    const table = await readCatalogFile(Buffer.from(text), 'dup.csv')
    expect(table.errors).toEqual([])
    const result = validateRows(table, suggestMapping(table.headers).mapping, { decimalSeparator: '.' })
    expect(result.issues.filter(i => i.field === 'partNumber').map(i => i.row)).toEqual([2, 4])
  })
})

describe('CSV parser', () => {
  it('handles quotes, doubled quotes, line breaks in cells and CRLF', () => {
    const result = parseCsv('a,"b ""x"", y",c\r\n"multi\nline",2,3\r\n', ',')
    expect(result).toEqual({ ok: true, records: [
      { rowNumber: 1, line: 1, cells: ['a', 'b "x", y', 'c'] },
      { rowNumber: 2, line: 2, cells: ['multi\nline', '2', '3'] },
    ] })
  })

  it('keeps the last record without a final line break and empty cells', () => {
    expect(parseCsv('a;;c', ';')).toEqual({ ok: true, records: [{ rowNumber: 1, line: 1, cells: ['a', '', 'c'] }] })
  })

  it('reads back any table written with RFC 4180 quoting (fast-check)', () => {
    const cell = fc.string({ unit: fc.constantFrom('a', 'Z', '1', ' ', ',', ';', '"', '\n', '\r\n', 'µ', 'Ω'), maxLength: 8 })
    fc.assert(fc.property(fc.array(fc.array(cell, { minLength: 2, maxLength: 5 }), { minLength: 1, maxLength: 6 }), fc.constantFrom<',' | ';'>(',', ';'), (table, d) => {
      const width = table[0]!.length
      const rows = table.map(r => [...r, ...Array(width).fill('')].slice(0, width))
      const text = rows.map(r => r.map(c => `"${c.replace(/"/g, '""')}"`).join(d)).join('\r\n')
      const result = parseCsv(text, d)
      expect(result.ok).toBe(true)
      if (result.ok) expect(result.records.map(r => r.cells)).toEqual(rows)
    }))
  })

  it('detects the delimiter from the first line, outside quotes', () => {
    expect(detectDelimiter('a;b;c\n1,5;2;3')).toBe(';')
    expect(detectDelimiter('"x;y;z",b\n')).toBe(',')
    expect(detectDelimiter('a\tb\tc')).toBe('\t')
    expect(detectDelimiter('single')).toBe(',')
  })
})

describe('LibreOffice-saved workbook', () => {
  const soffice = ['/usr/bin/soffice', '/usr/bin/libreoffice', '/usr/lib/libreoffice/program/soffice'].find(p => existsSync(p))

  it('reads an .xlsx that LibreOffice converted from CSV', async (ctx) => {
    ctx.skip(!soffice, 'LibreOffice is not installed here (looked for /usr/bin/soffice and /usr/bin/libreoffice); the full test script installs libreoffice-calc')
    const dir = mkdtempSync(join(tmpdir(), 'stratavolt-lo-'))
    try {
      const header = buildTemplateRows().header
      const line = (cells: (string | number | null)[]) => cells.map(c => (c === null ? '' : `"${String(c).replace(/"/g, '""')}"`)).join(',')
      writeFileSync(join(dir, 'parts.csv'), [line(header), line(exampleRow(0, 'LO-1')), line(exampleRow(2, 'LO-2'))].join('\n'))
      execFileSync(soffice!, ['--headless', '--infilter=CSV:44,34,76,1', '--convert-to', 'xlsx', '--outdir', dir, join(dir, 'parts.csv')], { timeout: 120_000, env: { ...process.env, HOME: dir } })
      const table = await readCatalogFile(readFileSync(join(dir, 'parts.xlsx')), 'parts.xlsx')
      expect(table.errors).toEqual([])
      const { mapping } = suggestMapping(table.headers)
      const result = validateRows(table, mapping, { decimalSeparator: '.' })
      expect(result.issues).toEqual([])
      expect(result.parts.map(p => p.partNumber)).toEqual(['LO-1', 'LO-2'])
      expect(result.parts[0]!.voltageRating).toBe(1200)
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  }, 180_000)
})
