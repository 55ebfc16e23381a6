// The issue-11 path in Chromium: a back-to-back design with a shared DC link, modules assigned through
// the parts page (filling the positions they cover), release, purchasing's quote typed with a decimal
// comma and the order; then the Excel file (read by LibreOffice) and the PDF (read by pdftotext) are
// checked against the positions: every line buys exactly what its positions need.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it, onTestFinished } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, linkIn, signInAs, unique, waitForMail } from '../support/api'
import { readCsv } from '../support/csv'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

const side = (dc: number, current: number, pf: number, name: string) => ({
  topology: 'two-level', levels: 2, dcVoltage: dc, dcVoltageMax: dc + 100, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
  operatingPoints: [{ name, lineVoltageRms: 400, phaseCurrentRms: current, powerFactor: pf, fundamentalHz: 50 }],
})
const input = { machineSide: side(650, 120, 0.9, 'Rated'), gridSide: side(650, 110, 1, 'Grid') }

/** Every sheet of the workbook as LibreOffice computes it (one CSV per sheet). */
function libreofficeSheets(xlsx: Buffer): Record<string, string[][]> {
  const dir = mkdtempSync(join(tmpdir(), 'sv-bflow-'))
  writeFileSync(join(dir, 'bom.xlsx'), xlsx)
  execFileSync('soffice', [`-env:UserInstallation=file://${dir}/profile`, '--headless', '--convert-to', 'csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,-1', '--outdir', dir, join(dir, 'bom.xlsx')], { stdio: 'ignore', timeout: 120000 })
  const out: Record<string, string[][]> = {}
  for (const f of readdirSync(dir).filter(n => n.endsWith('.csv'))) {
    const name = f.replace(/^bom-?/, '').replace(/\.csv$/, '') || 'BOM'
    out[name] = readCsv(readFileSync(join(dir, f), 'utf8'))
  }
  return out
}

/** The page's "also fill the covered positions?" question: accepted for the module, declined otherwise. */
const dialogs = { accept: false }

async function assignThroughPage(page: Page, sideLabel: string | null) {
  if (sideLabel) await page.getByRole('tab', { name: sideLabel }).click()
  const nav = page.locator('nav[aria-label="Positions"] button[data-position]')
  // A module first: the first candidate of S1 whose package covers at least two other positions (a
  // half-bridge: S2 and both diodes), accepting the offer.
  if (sideLabel !== 'Shared DC link') {
    await nav.filter({ hasText: 'S1' }).first().click()
    const module = page.locator('button[data-covers*=","]').first()
    await expect.poll(() => module.count()).toBeGreaterThan(0)
    dialogs.accept = true
    await module.click()
    await expect.poll(() => page.getByRole('status').textContent()).toMatch(/assigned to S1 and /)
  }
  const count = await nav.count()
  for (let i = 0; i < count; i++) {
    const button = nav.nth(i)
    if (await button.getAttribute('data-assigned') === 'yes') continue
    await button.click()
    // decline any further module offer: a plain assignment of this one position
    dialogs.accept = false
    const position = await button.getAttribute('data-position')
    await page.getByRole('button', { name: 'Assign', exact: true }).first().click()
    await expect.poll(() => page.getByRole('status').textContent()).toContain(`assigned to ${position}.`)
  }
}

describe('back-to-back BOM with modules to purchasing in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('assigns modules through parts, releases, purchasing quotes with a decimal comma and orders; xlsx and PDF quantities match the positions', async () => {
    const api = await signInAs('design-engineer')
    const name = unique('Browser B2B')
    const { body: design } = await api.json('POST', '/api/designs', { name, input })

    const eng = await newPage(browser)
    eng.on('dialog', d => void (dialogs.accept ? d.accept() : d.dismiss()))
    await signInPage(eng, 'design-engineer')
    await eng.goto(`/designs/${design.id}/parts`)
    await assignThroughPage(eng, 'Machine side')
    await assignThroughPage(eng, 'Grid side')
    await assignThroughPage(eng, 'Shared DC link')
    const { body: parts } = await api.json('GET', `/api/designs/${design.id}/parts`)
    const summary = parts.positions.map((p: { side: string, position: string, coveredBy: string | null, assigned: { part: { partNumber: string } } | null }) => `${p.side} ${p.position} ${p.assigned?.part.partNumber ?? '-'} ${p.coveredBy ?? ''}`)
    expect(parts.positions.filter((p: { assigned: unknown }) => !p.assigned), summary.join('; ')).toEqual([])
    expect(parts.positions.filter((p: { coveredBy: string | null }) => p.coveredBy).length, summary.join('; ')).toBeGreaterThanOrEqual(4)
    await eng.getByRole('tab', { name: 'Machine side' }).click()
    await screenshot(eng, 'b2b-parts-assigned')
    await expect.poll(() => eng.locator('nav[aria-label="Positions"] .badge', { hasText: 'covered by S1' }).count()).toBeGreaterThan(0)

    await eng.goto(`/designs/${design.id}/bom`)
    const release = eng.getByRole('button', { name: /Release as revision 1/ })
    // a double click releases once
    await release.dblclick()
    await eng.waitForURL(/\/boms\/\d+\?released=1/)
    const bomPath = new URL(eng.url()).pathname
    const bomId = Number(bomPath.split('/').pop())
    await expect.poll(() => eng.getByRole('status').first().textContent()).toContain('Purchasing is being e-mailed')
    const releases = (await api.json('GET', `/api/designs/${design.id}/bom`)).body.releases
    expect(releases).toHaveLength(1)

    const mail = await waitForMail('purchasing@example.com', `${name}, revision 1`, 20000)
    expect(mail.attachments.length).toBe(2)
    expect(new URL(linkIn(mail.text)).pathname).toBe(bomPath)

    // Purchasing, who chose the German locale in the settings, types the quote with a decimal comma (the browser's
    // own language is en-GB: the person's choice decides). Back to the company default when the test ends.
    const buyerApi = await signInAs('purchasing')
    expect((await buyerApi.json('PUT', '/api/settings/locale', { locale: 'de-DE' })).status).toBe(200)
    onTestFinished(async () => { await buyerApi.json('PUT', '/api/settings/locale', { locale: null }) })
    const buyerContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1600, height: 900 }, locale: 'en-GB', acceptDownloads: true })
    const buyer = await buyerContext.newPage()
    buyer.on('dialog', d => void d.dismiss())
    await buyer.route(url => !url.toString().startsWith(baseUrl) && !url.toString().startsWith('data:') && !url.toString().startsWith('blob:'), route => route.abort())
    await signInPage(buyer, 'purchasing')
    await buyer.goto(bomPath)
    const { body: stored0 } = await (await signInAs('purchasing')).json('GET', `/api/boms/${bomId}`)
    const first = stored0.snapshot.lines[0]
    const quote = Math.round(first.unitPrice * 0.9 * 100) / 100
    const typed = quote.toFixed(2).replace('.', ',')
    const firstLine = buyer.locator(`tbody tr[data-line="${first.partNumber}"]`)
    await firstLine.getByLabel(/Supplier for/).fill('Northdeck Distribution')
    await firstLine.getByLabel(/Supplier for/).press('Tab')
    await expect.poll(() => buyer.getByRole('status').textContent()).toContain('Saved')
    await firstLine.getByLabel(/Quoted unit price for/).fill(typed)
    await firstLine.getByLabel(/Quoted unit price for/).press('Tab')
    await firstLine.getByLabel(/Order reference for/).fill('PO-2026-118')
    await firstLine.getByLabel(/Order reference for/).press('Tab')
    await firstLine.getByLabel(/Purchasing status for/).selectOption('ordered')
    await expect.poll(async () => ((await (await signInAs('purchasing')).json('GET', `/api/boms/${bomId}`)).body.purchase[first.key] ?? {}).status).toBe('ordered')
    await buyer.getByLabel('Status', { exact: true }).selectOption('ordered')
    await expect.poll(() => buyer.locator('.badge', { hasText: 'ordered' }).count()).toBeGreaterThan(0)
    await screenshot(buyer, 'b2b-bom-purchasing')

    const stored = (await (await signInAs('purchasing')).json('GET', `/api/boms/${bomId}`)).body
    expect(stored.status).toBe('ordered')
    expect(stored.purchase[first.key]).toMatchObject({ supplier: 'Northdeck Distribution', quotedUnitPrice: quote, orderReference: 'PO-2026-118', status: 'ordered' })

    // Quantities: each part's pieces per set equal the sum over its positions (covered ones count 0).
    const snapshot = stored.snapshot
    const perPart = new Map<string, number>()
    for (const p of snapshot.positions) perPart.set(p.partNumber, (perPart.get(p.partNumber) ?? 0) + p.perConverter)
    const partLines = snapshot.lines.filter((l: { manual: boolean }) => !l.manual)
    for (const l of partLines) expect(l.quantityPerUnit, l.partNumber).toBe(perPart.get(l.partNumber))
    expect(snapshot.positions.filter((p: { side: string }) => p.side === 'dc-link').length).toBeGreaterThan(0)

    const xlsx = Buffer.from(await (await (await signInAs('purchasing')).request('GET', `/api/boms/${bomId}/export.xlsx`)).arrayBuffer())
    const sheets = libreofficeSheets(xlsx)
    const bomSheet = sheets.BOM!
    const header = bomSheet[0]!
    const col = (h: string) => header.indexOf(h)
    const positionsSheet = sheets.Positions!
    const fromPositions = new Map<string, number>()
    for (const row of positionsSheet.slice(1)) fromPositions.set(row[3]!, (fromPositions.get(row[3]!) ?? 0) + Number(row[4]))
    for (const l of partLines) {
      const row = bomSheet.find(r => r[col('Part number')] === l.partNumber)!
      expect(Number(row[col('Qty per set [pcs]')]), l.partNumber).toBe(fromPositions.get(l.partNumber))
      expect(Number(row[col('Qty to order [pcs]')])).toBe(l.quantityOrder)
    }
    expect(positionsSheet.some(r => r[7] === 'module at S1')).toBe(true)
    const totalPieces = bomSheet.find(r => (r[col('Description')] ?? '').startsWith('Total'))!
    expect(Number(totalPieces[col('Qty to order [pcs]')])).toBe(snapshot.totals.pieces)

    const pdfDir = mkdtempSync(join(tmpdir(), 'sv-bflow-pdf-'))
    writeFileSync(join(pdfDir, 'bom.pdf'), Buffer.from(await (await (await signInAs('purchasing')).request('GET', `/api/boms/${bomId}/export.pdf`)).arrayBuffer()))
    const text = execFileSync('pdftotext', ['-layout', join(pdfDir, 'bom.pdf'), '-'], { encoding: 'utf8' })
    for (const l of partLines) {
      const line = text.split('\n').find(t => t.includes(l.partNumber) && /\d/.test(t))!
      expect(line, l.partNumber).toMatch(new RegExp(`\\b${l.quantityPerUnit}\\b`))
      expect(line).toMatch(new RegExp(`\\b${l.quantityOrder}\\b`))
    }
    expect(text).toContain('module at S1')
    expect(text).toContain('PO-2026-118')
  }, 300000) // a long end-to-end flow (two converters' positions by hand, LibreOffice) on a shared machine
})
