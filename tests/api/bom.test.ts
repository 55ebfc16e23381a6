import { execFileSync } from 'node:child_process'
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import ExcelJS from 'exceljs'
import { describe, expect, it } from 'vitest'
import { signInAs, unique, waitForMail } from '../support/api'
import { readCsv } from '../support/csv'

const input = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 120, powerFactor: 0.9, fundamentalHz: 50 }],
  },
}

/** A design with the best-ranked part on every position. */
async function assignedDesign() {
  const eng = await signInAs('design-engineer')
  const { body: design } = await eng.json('POST', '/api/designs', { name: unique('BOM test'), input })
  const { body } = await eng.json('GET', `/api/designs/${design.id}/parts`)
  for (const p of body.positions) {
    const c = p.candidates[0]
    await eng.json('PUT', `/api/designs/${design.id}/parts`, { side: p.side, position: p.position, partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
  }
  return { eng, design }
}

function libreofficeCsv(xlsx: Buffer): string[][] {
  const dir = mkdtempSync(join(tmpdir(), 'sv-bom-'))
  writeFileSync(join(dir, 'bom.xlsx'), xlsx)
  execFileSync('soffice', [`-env:UserInstallation=file://${dir}/profile`, '--headless', '--convert-to', 'csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false', '--outdir', dir, join(dir, 'bom.xlsx')], { stdio: 'ignore', timeout: 120000 })
  const csv = readdirSync(dir).filter(f => f.endsWith('.csv')).map(f => readFileSync(join(dir, f), 'utf8'))[0]!
  // cells as LibreOffice computed them (raw values, not as formatted); quoted cells may hold commas
  return readCsv(csv)
}

describe('bill of materials', () => {
  it('refuses to release while positions lack parts', async () => {
    const eng = await signInAs('design-engineer')
    const { body: design } = await eng.json('POST', '/api/designs', { name: unique('unassigned'), input })
    const r = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(r.status).toBe(422)
    expect(r.body.message).toMatch(/Assign a part/)
  })

  it('releases a snapshot, mails purchasing both files, and keeps it when the catalogue changes', async () => {
    const { eng, design } = await assignedDesign()
    const settings = await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 20, sparesPercent: 10, manualLines: [{ description: 'Heatsink', quantityPerUnit: 1, unitPrice: 95 }] })
    expect(settings.status).toBe(200)
    const badSettings = await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 0, sparesPercent: 10, manualLines: [] })
    expect(badSettings.status).toBe(422)
    expect(badSettings.body.data.issues[0].path).toBe('buildQuantity')
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(released.status).toBe(201)
    expect(released.body.mailQueued).toBe(true)
    // the outbox worker sends it after the commit
    const mail = await waitForMail('purchasing@example.com', `${design.name}, revision 1`, 20000)
    expect(mail.attachments.map(a => a.filename).sort()).toEqual([expect.stringMatching(/\.pdf$/), expect.stringMatching(/\.xlsx$/)])

    const buyer = await signInAs('purchasing')
    const bom = await buyer.json('GET', `/api/boms/${released.body.id}`)
    expect(bom.body.snapshot.lines.some((l: { manual: boolean }) => l.manual)).toBe(true)
    const before = JSON.stringify(bom.body.snapshot)

    // A catalogue change (new part version) does not touch the released snapshot.
    const comp = await signInAs('component-engineer')
    const line = bom.body.snapshot.lines.find((l: { partVersionId: number | null }) => l.partVersionId)
    const parts = await comp.json('GET', `/api/catalog/parts?q=${encodeURIComponent(line.partNumber)}`)
    const partId = parts.body.rows.find((p: { partNumber: string }) => p.partNumber === line.partNumber).id
    expect((await comp.json('PATCH', `/api/catalog/parts/${partId}`, { stock: 7 })).status).toBe(200)
    expect(JSON.stringify((await buyer.json('GET', `/api/boms/${released.body.id}`)).body.snapshot)).toBe(before)

    // A second release is revision 2 and lists what changed.
    await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 40, sparesPercent: 10, manualLines: [] })
    const second = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(second.body.revision).toBe(2)
    expect(second.body.changes.length).toBeGreaterThan(0)
  })

  it('lets purchasing record quotes, orders and status, but not engineering content', async () => {
    const buyer = await signInAs('purchasing')
    const list = await buyer.json('GET', '/api/boms')
    const id = list.body[0].id
    const { body: bom } = await buyer.json('GET', `/api/boms/${id}`)
    const key = bom.snapshot.lines[0].key
    // a quote near the catalogue price (one far from it asks for confirmation, tested in bom-gates)
    const quote = Math.round((bom.snapshot.lines[0].unitPrice ?? 95) * 1.05 * 100) / 100
    const r = await buyer.json('PUT', `/api/boms/${id}/lines/${encodeURIComponent(key)}`, { supplier: 'Brightwater Components', quotedUnitPrice: quote, orderReference: 'PO-4711' })
    expect(r.status).toBe(200)
    expect((await buyer.json('PUT', `/api/boms/${id}/lines/${encodeURIComponent(key)}`, { quotedUnitPrice: -3 })).status).toBe(422)
    expect((await buyer.json('PATCH', `/api/boms/${id}`, { status: 'ordered' })).body.status).toBe('ordered')
    const after = await buyer.json('GET', `/api/boms/${id}`)
    expect(after.body.purchase[key]).toMatchObject({ supplier: 'Brightwater Components', quotedUnitPrice: quote, orderReference: 'PO-4711' })
    expect((await buyer.json('POST', `/api/designs/${bom.designId}/bom/release`)).status).toBe(403)
    expect((await buyer.json('PUT', `/api/designs/${bom.designId}/bom/settings`, { buildQuantity: 1, sparesPercent: 0, manualLines: [] })).status).toBe(403)
  })

  it('exports an Excel workbook whose totals LibreOffice computes to the stored total', async () => {
    const viewer = await signInAs('viewer')
    const list = await viewer.json('GET', '/api/boms')
    const { body: bom } = await viewer.json('GET', `/api/boms/${list.body.at(-1).id}`)
    const r = await viewer.request('GET', `/api/boms/${bom.id}/export.xlsx`)
    expect(r.status).toBe(200)
    const xlsx = Buffer.from(await r.arrayBuffer())
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(xlsx as unknown as ArrayBuffer)
    expect(wb.worksheets[0]!.views[0]).toMatchObject({ state: 'frozen' })
    const rows = libreofficeCsv(xlsx)
    const numbers = rows.flat().map(Number).filter(n => Number.isFinite(n))
    const total = bom.snapshot.totals.extendedPrice
    expect(numbers.some(n => Math.abs(n - total) < 0.01)).toBe(true)
  }, 90000)

  it('exports a PDF that pdftotext reads', async () => {
    const viewer = await signInAs('viewer')
    const list = await viewer.json('GET', '/api/boms')
    const { body: bom } = await viewer.json('GET', `/api/boms/${list.body.at(-1).id}`)
    const r = await viewer.request('GET', `/api/boms/${bom.id}/export.pdf`)
    const dir = mkdtempSync(join(tmpdir(), 'sv-pdf-'))
    writeFileSync(join(dir, 'bom.pdf'), Buffer.from(await r.arrayBuffer()))
    const text = execFileSync('pdftotext', ['-layout', join(dir, 'bom.pdf'), '-'], { encoding: 'utf8' })
    expect(text).toContain(bom.snapshot.designName)
    expect(text).toContain(bom.snapshot.lines[0].partNumber)
    expect(text).toContain('IEC 61800-5-1')
    expect(text).toMatch(/page 1 of \d+/i)
  })
})
