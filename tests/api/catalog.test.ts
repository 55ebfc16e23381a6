// Catalogue upload → map → preview → commit against the built server and PostgreSQL, plus the parts
// browser's query, part versions, part edits, refused files and the template downloads.
// Spreadsheets are generated here with exceljs; part numbers are unique per run so tests never collide.
import ExcelJS from 'exceljs'
import { beforeAll, describe, expect, it } from 'vitest'
import { CATALOG_COLUMNS } from '../../catalog/columns'
import { signInAs, unique, type Client } from '../support/api'
import { readCsv } from '../support/csv'

/** Headers as a supplier might write them: none is the template's own, two are traps for the suggestion. */
function untidyHeaders(extra: string) {
  return [
    'MPN', 'Mfr', 'Part class', 'Circuit', 'VCES', 'Ic nom', 'Vce0 (V)', 'rCE (mOhm)', 'VF0', 'rF (mOhm)', 'Eon', 'Eoff', 'Erec',
    'Vcc test', 'Ic test', 'Rth(j-c) IGBT', 'Rth(j-c) diode', 'Rth(c-h)', 'Tvj op', 'C (uF)', 'Irms', 'Price', 'Curr', 'Qty in stock',
    'Lead time', 'Status', 'Life cycle phase', extra,
  ]
}
// 0-based positions in untidyHeaders (column letters: C = 2, Z = 25, AA = 26)
const COL = { partClass: 2, status: 25, lifeCyclePhase: 26 }

/** Three parts with units typed into the cells; "Status" holds purchasing notes, not a lifecycle. */
function untidyRows(prefix: string, igbtPrice = '1:182.00; 10:169.50') {
  return [
    [`${prefix}-HB`, 'Norvale Semiconductor', 'IGBT + diode', 'half bridge', '1.2 kV', '450A', 0.85, 2.1, 0.9, 1.6, '18 mJ', '22 mJ', '9 mJ',
      '600 V', 450, 0.065, 0.11, 0.03, 175, null, null, igbtPrice, 'EUR', 140, '8 weeks', 'approved', 'production', 'lot 1'],
    [`${prefix}-D`, 'Norvale Semiconductor', 'diode', 'single', '3.3 kV', '800 A', null, null, 1.1, 0.9, null, null, '0.9 J',
      '1800 V', 800, null, 0.02, 0.01, 150, null, null, 310, 'EUR', 60, 84, 'in stock', 'active', 'lot 2'],
    [`${prefix}-C`, 'Kestrel Capacitors', 'cap', null, '1100 V', null, null, null, null, null, null, null, null,
      null, null, null, null, null, null, 500, 60, '1:48.00; 50:43.50', 'EUR', 900, 28, 'checked', 'nrnd', 'lot 3'],
  ]
}

async function xlsx(sheets: { name: string, rows: unknown[][], state?: 'visible' | 'hidden' }[], prepare?: (wb: ExcelJS.Workbook) => void) {
  const wb = new ExcelJS.Workbook()
  for (const s of sheets) {
    const ws = wb.addWorksheet(s.name, s.state ? { state: s.state } : undefined)
    for (const row of s.rows) ws.addRow(row)
  }
  prepare?.(wb)
  return Buffer.from(await wb.xlsx.writeBuffer())
}

function upload(c: Client, buffer: Buffer, filename: string, decimalSeparator?: '.' | ',') {
  const form = new FormData()
  form.append('file', new Blob([new Uint8Array(buffer)]), filename)
  if (decimalSeparator) form.append('decimalSeparator', decimalSeparator)
  return c.request('POST', '/api/catalog/imports', form).then(async r => ({ status: r.status, body: await r.json() as any }))
}

async function partsMatching(c: Client, q: string, extra = '') {
  const r = await c.json('GET', `/api/catalog/parts?q=${encodeURIComponent(q)}${extra}`)
  expect(r.status).toBe(200)
  return r.body as { rows: any[], total: number, page: number, pageSize: number }
}

describe('catalogue import: untidy spreadsheet to catalogue version', () => {
  let engineer: Client
  const prefix = unique('PN')
  const extraHeader = `Batch ${prefix}` // makes the header set (and so the remembered mapping) unique to this run
  let importId: number
  let firstUpload: Buffer
  let fixedMapping: Record<string, number | null>
  let igbtPartId: number

  beforeAll(async () => { engineer = await signInAs('component-engineer') })

  it('suggests a mapping from the uploaded headers and explains refused cells by row and column', async () => {
    firstUpload = await xlsx([{ name: 'Sheet1', rows: [untidyHeaders(extraHeader), ...untidyRows(prefix)] }])
    const r = await upload(engineer, firstUpload, `${prefix}-supplier.xlsx`)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    importId = r.body.import.id
    expect(r.body.import.status).toBe('preview')
    expect(r.body.headerRowNumber).toBe(1)
    const m = r.body.mapping
    expect(m).toMatchObject({ partNumber: 0, manufacturer: 1, packageConfiguration: 3, voltageRating: 4, currentRating: 5, turnOnEnergy: 10, stock: 23, leadTimeDays: 24 })
    // The traps: no header looks like "Kind"; "Status" looks like the lifecycle but holds purchasing notes.
    expect(m.kind).toBeNull()
    expect(m.lifecycle).toBe(COL.status)
    const slope = r.body.suggestions.find((s: any) => s.key === 'switchSlopeResistance')
    expect(slope).toMatchObject({ index: 7, column: 'H', reason: 'alias' })
    expect(slope.headerUnitScale).toBeCloseTo(1e-3, 12) // "(mOhm)" in the header scales bare numbers
    expect(r.body.unusedHeaders.map((h: any) => h.header)).toEqual(expect.arrayContaining(['Part class', 'Life cycle phase', extraHeader]))

    const p = r.body.preview
    expect(p.rowsRead).toBe(3)
    expect(p.rowsWithErrors).toBe(3)
    expect(p.validParts).toBe(0)
    const kindIssue = p.issues.find((i: any) => i.field === 'kind')
    expect(kindIssue).toMatchObject({ row: 1, column: '', severity: 'error' })
    expect(kindIssue.message).toMatch(/not mapped/)
    const lifecycle = p.issues.filter((i: any) => i.field === 'lifecycle')
    expect(lifecycle.map((i: any) => `${i.column}${i.row}`)).toEqual(['Z2', 'Z3', 'Z4'])
    expect(lifecycle[0].message).toMatch(/unknown value 'approved'/)
  })

  it('refuses to commit while rows have errors and writes nothing', async () => {
    const current = await engineer.json('GET', `/api/catalog/imports/${importId}`)
    const r = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, { mapping: current.body.mapping, decimalSeparator: '.' })
    expect(r.status).toBe(422)
    expect(r.body.message).toMatch(/All 3 rows have errors; nothing can be imported/)
    expect(r.body.data.issues.some((i: any) => i.row === 2 && i.column === 'Z')).toBe(true)
    expect((await partsMatching(engineer, prefix)).total).toBe(0)
    expect((await engineer.json('GET', `/api/catalog/imports/${importId}`)).body.import.status).toBe('preview')
  })

  it('re-checks a changed mapping: a bad column index is named, the fixed mapping validates every row', async () => {
    const current = (await engineer.json('GET', `/api/catalog/imports/${importId}`)).body
    const outside = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { mapping: { ...current.mapping, kind: 99 }, decimalSeparator: '.' })
    expect(outside.status).toBe(422)
    expect(outside.body.data.issues[0].path).toBe('mapping.kind')
    const twice = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { mapping: { ...current.mapping, kind: 0 }, decimalSeparator: '.' })
    expect(twice.status).toBe(422)
    expect(twice.body.message).toMatch(/mapped to both/)

    fixedMapping = { ...current.mapping, kind: COL.partClass, lifecycle: COL.lifeCyclePhase }
    const r = await engineer.json('POST', `/api/catalog/imports/${importId}/preview`, { mapping: fixedMapping, decimalSeparator: '.' })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.preview).toMatchObject({ rowsRead: 3, rowsWithErrors: 0, validParts: 3, issues: [] })
    const [igbt, diode, capacitor] = r.body.preview.sample
    // Units typed in cells and headers end up in SI: "1.2 kV", "450A", "18 mJ", "(mOhm)", "8 weeks", "(uF)".
    expect(igbt).toMatchObject({ kind: 'switch-diode', packageConfiguration: 'half-bridge', voltageRating: 1200, currentRating: 450, turnOnEnergy: 0.018, leadTimeDays: 56, lifecycle: 'active', sourceRow: 2 })
    expect(igbt.switchSlopeResistance).toBeCloseTo(0.0021, 12)
    expect(igbt.priceBreaks).toEqual([{ minQuantity: 1, unitPrice: 182 }, { minQuantity: 10, unitPrice: 169.5 }])
    expect(diode).toMatchObject({ kind: 'diode', voltageRating: 3300, currentRating: 800, recoveryEnergy: 0.9 })
    expect(capacitor).toMatchObject({ kind: 'capacitor', lifecycle: 'nrnd', rippleCurrentRating: 60 })
    expect(capacitor.capacitance).toBeCloseTo(500e-6, 15)
    expect((await partsMatching(engineer, prefix)).total).toBe(0) // a preview writes no part
  })

  it('commits the fixed mapping as one new catalogue version; the parts are searchable', async () => {
    const before = (await engineer.json('GET', '/api/catalog/versions')).body as any[]
    const r = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, { mapping: fixedMapping, decimalSeparator: '.' })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body).toMatchObject({ added: 3, updated: 0, unchanged: 0 })
    expect(r.body.number).toBeGreaterThan(before[0]?.number ?? 0)
    const versions = (await engineer.json('GET', '/api/catalog/versions')).body as any[]
    expect(versions.find(v => v.id === r.body.catalogVersionId)).toMatchObject({ number: r.body.number, partsAdded: 3, partsUpdated: 0 })

    const again = await engineer.json('POST', `/api/catalog/imports/${importId}/commit`, { mapping: fixedMapping, decimalSeparator: '.' })
    expect(again.status).toBe(409)

    const found = await partsMatching(engineer, prefix, '&sort=voltageRating&dir=desc')
    expect(found.total).toBe(3)
    expect(found.rows.map(p => p.partNumber)).toEqual([`${prefix}-D`, `${prefix}-HB`, `${prefix}-C`])
    const igbt = found.rows[1]
    expect(igbt).toMatchObject({ manufacturer: 'Norvale Semiconductor', kind: 'switch-diode', voltageRating: 1200, currentRating: 450, unitPrice: 182, currency: 'EUR', stock: 140, leadTimeDays: 56, lifecycle: 'active', approved: false })
    igbtPartId = igbt.id

    const imported = await engineer.json('GET', `/api/catalog/imports/${importId}`)
    expect(imported.body.import).toMatchObject({ status: 'committed', catalogVersionId: r.body.catalogVersionId })
    const list = (await engineer.json('GET', '/api/catalog/imports')).body as any[]
    expect(list.find(i => i.id === importId)).toMatchObject({ status: 'committed', catalogVersion: r.body.number, rowCount: 3 })
  })

  it('filters, sorts and pages on the server', async () => {
    expect((await partsMatching(engineer, prefix, '&kind=capacitor')).rows.map(p => p.partNumber)).toEqual([`${prefix}-C`])
    expect((await partsMatching(engineer, prefix, '&minVoltage=2000')).rows.map(p => p.partNumber)).toEqual([`${prefix}-D`])
    expect((await partsMatching(engineer, prefix, '&minCurrent=500')).rows.map(p => p.partNumber)).toEqual([`${prefix}-D`])
    expect((await partsMatching(engineer, prefix, '&lifecycle=nrnd')).total).toBe(1)
    expect((await partsMatching(engineer, prefix, '&approved=yes')).total).toBe(0)
    const page1 = await partsMatching(engineer, prefix, '&sort=unitPrice&dir=asc&pageSize=2&page=1')
    const page2 = await partsMatching(engineer, prefix, '&sort=unitPrice&dir=asc&pageSize=2&page=2')
    expect(page1).toMatchObject({ total: 3, page: 1, pageSize: 2 })
    expect([...page1.rows, ...page2.rows].map(p => p.unitPrice)).toEqual([48, 182, 310])
    const bad = await engineer.json('GET', '/api/catalog/parts?sort=nonsense&pageSize=5000')
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues.map((i: any) => i.path)).toEqual(expect.arrayContaining(['sort']))
  })

  it('serves the original file byte for byte', async () => {
    const r = await engineer.request('GET', `/api/catalog/imports/${importId}/file`)
    expect(r.status).toBe(200)
    expect(r.headers.get('content-disposition')).toContain(`${prefix}-supplier.xlsx`)
    expect(Buffer.from(await r.arrayBuffer()).equals(firstUpload)).toBe(true)
  })

  it('a re-upload with a changed price makes a new part version and keeps the old one readable', async () => {
    const buffer = await xlsx([{ name: 'Sheet1', rows: [untidyHeaders(extraHeader), ...untidyRows(prefix, '1:190.00; 10:175.00')] }])
    const r = await upload(engineer, buffer, `${prefix}-supplier-update.xlsx`)
    expect(r.status).toBe(201)
    // The same headers again: the mapping this engineer committed is remembered.
    expect(r.body.mapping).toMatchObject({ kind: COL.partClass, lifecycle: COL.lifeCyclePhase })
    expect(r.body.preview.rowsWithErrors).toBe(0)
    const commit = await engineer.json('POST', `/api/catalog/imports/${r.body.import.id}/commit`, { mapping: r.body.mapping, decimalSeparator: r.body.decimalSeparator })
    expect(commit.status).toBe(200)
    expect(commit.body, JSON.stringify(commit.body)).toMatchObject({ added: 0, updated: 1, unchanged: 2 })

    const part = await engineer.json('GET', `/api/catalog/parts/${igbtPartId}`)
    expect(part.status).toBe(200)
    expect(part.body.versions).toHaveLength(2)
    const [newer, older] = part.body.versions
    expect(part.body.currentVersionId).toBe(newer.id)
    expect(newer.catalogVersion).toBe(commit.body.number)
    expect(older.catalogVersion).toBeLessThan(newer.catalogVersion)
    expect(newer.data.priceBreaks[0]).toEqual({ minQuantity: 1, unitPrice: 190 })
    expect(older.data.priceBreaks[0]).toEqual({ minQuantity: 1, unitPrice: 182 })
    expect(older.data.voltageRating).toBe(1200)
    expect((await partsMatching(engineer, `${prefix}-HB`)).rows[0].unitPrice).toBe(190)
  })

  it('edits a part: field errors name the field, a change is a new version, approval is not', async () => {
    const bad = await engineer.json('PATCH', `/api/catalog/parts/${igbtPartId}`, { stock: -1, leadTimeDays: 1.5 })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues.map((i: any) => i.path)).toEqual(expect.arrayContaining(['stock', 'leadTimeDays']))
    expect((await engineer.json('PATCH', `/api/catalog/parts/${igbtPartId}`, {})).status).toBe(422)

    expect((await engineer.json('PATCH', `/api/catalog/parts/${igbtPartId}`, { stock: 12, lifecycle: 'nrnd' })).status).toBe(200)
    expect((await engineer.json('PATCH', `/api/catalog/parts/${igbtPartId}`, { approved: true })).status).toBe(200)
    const part = (await engineer.json('GET', `/api/catalog/parts/${igbtPartId}`)).body
    expect(part.approved).toBe(true)
    expect(part.versions).toHaveLength(3)
    expect(part.versions[0].data).toMatchObject({ stock: 12, lifecycle: 'nrnd', leadTimeDays: 56 })
    expect(part.versions[1].data).toMatchObject({ stock: 140, lifecycle: 'active' })
    expect((await partsMatching(engineer, `${prefix}-HB`, '&approved=yes')).total).toBe(1)

    const purchasing = await signInAs('purchasing')
    expect((await purchasing.json('GET', `/api/catalog/parts/${igbtPartId}`)).status).toBe(200)
    expect((await purchasing.json('PATCH', `/api/catalog/parts/${igbtPartId}`, { stock: 1 })).status).toBe(403)
  })

  it('edits the Foster network: a half pair is refused naming the field and writes nothing, null clears, two edits at once both land', async () => {
    const url = `/api/catalog/parts/${igbtPartId}`
    const versions = async () => (await engineer.json('GET', url)).body.versions
    const before = (await versions()).length
    const half = await engineer.json('PATCH', url, { zthSwitchR1: 0.01 })
    expect(half.status).toBe(422)
    expect(half.body.data.issues.map((i: any) => i.path)).toEqual(['zthSwitchTau1'])
    const range = await engineer.json('PATCH', url, { zthSwitchTau1: -1, zthSwitchR1: 0.01 })
    expect(range.status).toBe(422)
    expect(range.body.data.issues.map((i: any) => i.path)).toContain('zthSwitchTau1')
    expect(await versions()).toHaveLength(before)

    expect((await engineer.json('PATCH', url, { zthSwitchR1: 0.02, zthSwitchTau1: 0.01 })).status).toBe(200)
    expect((await versions())[0].data).toMatchObject({ zthSwitchR1: 0.02, zthSwitchTau1: 0.01 })
    // Two at once: both applied, the second on top of the first (catalogue lock).
    const [a, b] = await Promise.all([
      engineer.json('PATCH', url, { zthSwitchR2: 0.03, zthSwitchTau2: 0.05 }),
      engineer.json('PATCH', url, { zthDiodeR1: 0.04, zthDiodeTau1: 0.02 }),
    ])
    expect([a.status, b.status]).toEqual([200, 200])
    expect((await versions())[0].data).toMatchObject({ zthSwitchR1: 0.02, zthSwitchR2: 0.03, zthDiodeR1: 0.04 })
    expect((await engineer.json('PATCH', url, { zthSwitchR1: null, zthSwitchTau1: null })).status).toBe(200)
    const cleared = (await versions())[0].data
    expect(cleared.zthSwitchR1).toBeUndefined()
    expect(cleared.zthSwitchR2).toBe(0.03)
    const purchasing = await signInAs('purchasing')
    expect((await purchasing.json('PATCH', url, { zthSwitchR1: 0.02, zthSwitchTau1: 0.01 })).status).toBe(403)
  })
})

describe('catalogue import: files that cannot be imported', () => {
  let engineer: Client
  const prefix = unique('PN-BAD')
  const header = untidyHeaders(`Batch ${prefix}`)
  const good = untidyRows(prefix)

  beforeAll(async () => { engineer = await signInAs('component-engineer') })

  /** 422 with a message and listed problems; no import stored, no part written. */
  async function expectRefused(buffer: Buffer, name: string, message: RegExp) {
    const filename = `${unique('bad')}-${name}`
    const r = await upload(engineer, buffer, filename)
    expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(422)
    expect(r.body.message).toMatch(message)
    expect(r.body.data.problems.length).toBeGreaterThan(0)
    const imports = (await engineer.json('GET', '/api/catalog/imports')).body as any[]
    expect(imports.some(i => i.filename === filename)).toBe(false)
    expect((await partsMatching(engineer, prefix)).total).toBe(0)
    return r.body.data.problems as { row?: number, column?: string, message: string }[]
  }

  it('refuses files that are not spreadsheets', async () => {
    await expectRefused(Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\n'), 'datasheet.xlsx', /PDF, not a spreadsheet/)
    await expectRefused(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), 'photo.csv', /image, not a spreadsheet/)
    await expectRefused(Buffer.from('MPN,Mfr\nA,B\n'), 'renamed.xlsx', /named \.xlsx but is not an Excel workbook/)
  })

  it('refuses an empty file and a sheet with headers but no parts', async () => {
    await expectRefused(Buffer.alloc(0), 'empty.csv', /is empty/)
    const problems = await expectRefused(await xlsx([{ name: 'Parts', rows: [header] }]), 'header-only.xlsx', /header row \(row 1\) but no parts/)
    expect(problems[0]!.row).toBe(1)
  })

  it('refuses formulas and merged cells, naming the cell', async () => {
    const withFormula = await xlsx([{ name: 'Parts', rows: [header, ...good] }], (wb) => {
      wb.getWorksheet('Parts')!.getCell('E3').value = { formula: 'E2*2.75', result: 3300 }
    })
    const formula = await expectRefused(withFormula, 'formula.xlsx', /cell E3 holds a formula/)
    expect(formula[0]).toMatchObject({ row: 3, column: 'E' })

    const merged = await xlsx([{ name: 'Parts', rows: [header, ...good] }], (wb) => { wb.getWorksheet('Parts')!.mergeCells('B2:B3') })
    const problems = await expectRefused(merged, 'merged.xlsx', /cells B2:B3 are merged/)
    expect(problems[0]).toMatchObject({ row: 2, column: 'B' })
  })

  it('refuses a file over the 10 MB limit', async () => {
    const big = Buffer.alloc(11 * 1024 * 1024, 0x41)
    await expectRefused(big, 'huge.csv', /uploads are limited to 10\.0 MB/)
  })

  it('reads the "Parts" sheet of a workbook with several sheets and names the sheets it did not read', async () => {
    const buffer = await xlsx([
      { name: 'Read me', rows: [['Supplier price list'], ['valid until the end of the quarter']] },
      { name: 'Parts', rows: [header, ...good] },
      { name: 'Old prices', rows: [header, ...good], state: 'hidden' },
    ])
    const r = await upload(engineer, buffer, `${prefix}-sheets.xlsx`)
    expect(r.status).toBe(201)
    expect(r.body.import.sheetName).toBe('Parts')
    expect(r.body.preview.rowsRead).toBe(3)
    expect(r.body.warnings.map((w: any) => w.message).join(' ')).toMatch(/read the sheet 'Parts'; not read: 'Read me', 'Old prices' \(hidden\)/)
    expect((await partsMatching(engineer, prefix)).total).toBe(0)
  })

  it('refuses (422) a workbook whose parts are spread over several visible sheets', async () => {
    const buffer = await xlsx([
      { name: 'Parts', rows: [header, ...good] },
      { name: 'More parts', rows: [header, ...good] },
    ])
    await expectRefused(buffer, 'split.xlsx', /parts on several sheets \('Parts', 'More parts'\)/)
  })
})

describe('catalogue template downloads', () => {
  let purchasing: Client
  beforeAll(async () => { purchasing = await signInAs('purchasing') })
  const headers = CATALOG_COLUMNS.map(c => c.header)

  it('serves an .xlsx that opens with the header and units rows of catalog/columns.ts', async () => {
    const r = await purchasing.request('GET', '/api/catalog/template.xlsx')
    expect(r.status).toBe(200)
    expect(r.headers.get('content-type')).toContain('spreadsheetml')
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(await r.arrayBuffer())
    const sheet = wb.getWorksheet('Parts')!
    expect((sheet.getRow(1).values as unknown[]).slice(1)).toEqual(headers)
    expect(sheet.getRow(2).getCell(CATALOG_COLUMNS.findIndex(c => c.key === 'voltageRating') + 1).value).toBe('V')
    expect(sheet.actualRowCount).toBe(2 + 4) // header, units, one example per part kind
  })

  it('serves a .csv whose first line is the header', async () => {
    const r = await purchasing.request('GET', '/api/catalog/template.csv')
    expect(r.status).toBe(200)
    expect(r.headers.get('content-type')).toContain('text/csv')
    const firstLine = readCsv(await r.text())[0]!
    expect(firstLine).toEqual(headers)
  })

  it('maps the unchanged template by label and refuses its example rows', async () => {
    const engineer = await signInAs('component-engineer')
    const template = Buffer.from(await (await engineer.request('GET', '/api/catalog/template.xlsx')).arrayBuffer())
    const r = await upload(engineer, template, 'stratavolt-parts-template.xlsx')
    expect(r.status).toBe(201)
    expect(r.body.suggestions.every((s: any) => s.reason === 'label' && s.score === 1)).toBe(true)
    expect(r.body.preview).toMatchObject({ rowsRead: 4, rowsWithErrors: 4, validParts: 0 })
    expect(r.body.preview.issues.filter((i: any) => /template's example row/.test(i.message))).toHaveLength(4)
  })
})
