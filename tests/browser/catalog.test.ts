// Catalogue flow in Chromium: a component engineer uploads an untidy spreadsheet, fixes the column
// mapping, reads why rows are refused, commits, and finds the part in the parts browser.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import ExcelJS from 'exceljs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

/** Supplier headers: "Part class" is not recognised as the kind; "Status" looks like the lifecycle but is not. */
async function untidyWorkbook(prefix: string): Promise<Buffer> {
  const wb = new ExcelJS.Workbook()
  const ws = wb.addWorksheet('Price list')
  ws.addRow(['MPN', 'Mfr', 'Part class', 'Circuit', 'VCES', 'Ic nom', 'Vce0 (V)', 'rCE (mOhm)', 'VF0', 'rF (mOhm)', 'Eon', 'Eoff', 'Erec',
    'Vcc test', 'Ic test', 'Rth(j-c) IGBT', 'Rth(j-c) diode', 'Rth(c-h)', 'Tvj op', 'C (uF)', 'Irms', 'Price', 'Curr', 'Qty in stock',
    'Lead time', 'Status', 'Life cycle phase', `Browser batch ${prefix}`])
  ws.addRow([`${prefix}-HB`, 'Norvale Semiconductor', 'IGBT + diode', 'half bridge', '1.7 kV', '600A', 0.9, 2.4, 0.95, 1.8, '28 mJ', '31 mJ', '12 mJ',
    '900 V', 600, 0.05, 0.09, 0.025, 175, null, null, '1:264.00; 10:249.00', 'EUR', 35, '10 weeks', 'approved', 'production', 'b1'])
  ws.addRow([`${prefix}-C`, 'Kestrel Capacitors', 'cap', null, '1100 V', null, null, null, null, null, null, null, null,
    null, null, null, null, null, null, 680, 72, '1:52.00', 'EUR', 400, 21, 'checked', 'active', 'b2'])
  return Buffer.from(await wb.xlsx.writeBuffer())
}

describe('catalogue upload in Chromium', () => {
  let browser: Browser
  let dir: string
  beforeAll(async () => {
    browser = await launch()
    dir = mkdtempSync(join(tmpdir(), 'stratavolt-catalog-'))
  })
  afterAll(async () => {
    await browser?.close()
    if (dir) rmSync(dir, { recursive: true, force: true })
  })

  let committedPrefix = ''

  it('component engineer: upload → fix mapping → bad rows explained → commit → part in the browser', async () => {
    const prefix = unique('PNB')
    const file = join(dir, `${prefix}-supplier.xlsx`)
    writeFileSync(file, await untidyWorkbook(prefix))

    const page = await newPage(browser)
    await signInPage(page, 'component-engineer')
    await page.getByRole('link', { name: 'Parts catalogue' }).first().click()
    await page.waitForURL('**/catalog')
    await page.getByRole('link', { name: 'Upload spreadsheet' }).click()
    await page.waitForURL('**/catalog/import')

    // Step 1: a normal file input inside the drop zone. A file with a formula is refused, the cell named.
    await expect.poll(() => page.getByTestId('drop-zone').textContent()).toContain('20,000 rows')
    const withFormula = new ExcelJS.Workbook()
    await withFormula.xlsx.load(await untidyWorkbook(`${prefix}-F`) as unknown as ExcelJS.Buffer)
    withFormula.worksheets[0]!.getCell('E3').value = { formula: 'E2*0.65', result: 1100 }
    const formulaFile = join(dir, `${prefix}-formula.xlsx`)
    writeFileSync(formulaFile, Buffer.from(await withFormula.xlsx.writeBuffer()))
    await page.getByLabel('Spreadsheet file').setInputFiles(formulaFile)
    await page.getByRole('button', { name: 'Upload and check' }).click()
    const problems = page.getByTestId('import-problems')
    await expect.poll(() => problems.textContent()).toContain('cell E3 holds a formula')
    expect(await problems.textContent()).toContain('Nothing was saved')
    expect((await problems.locator('tbody tr').first().locator('td').allTextContents()).map(t => t.trim()))
      .toEqual(['3', 'E', 'E3', expect.stringContaining('cell E3 holds a formula (=E2*0.65)')])
    await screenshot(page, 'catalog-upload-refused')

    await page.getByLabel('Spreadsheet file').setInputFiles(file)
    expect(await problems.count()).toBe(0)
    await page.getByRole('button', { name: 'Upload and check' }).click()

    // Step 2: the kind column was not recognised; the last check says so beside it.
    await page.getByRole('heading', { name: '2 · Map the columns' }).waitFor()
    await expect.poll(() => page.getByTestId('mapping-issue-kind').textContent()).toContain('not mapped')
    const kind = page.getByLabel('Kind', { exact: true })
    expect(await kind.inputValue()).toBe('')
    await kind.selectOption({ label: 'C · Part class' })
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'changed since the last check' }).count()).toBe(1)
    await screenshot(page, 'catalog-mapping')

    // Step 3: the wrongly suggested lifecycle column refuses every row, each explained by row and cell.
    await page.getByRole('button', { name: 'Next: preview' }).click()
    await page.getByRole('heading', { name: /3 · Preview/ }).waitFor()
    await expect.poll(() => page.getByTestId('rows-with-errors').textContent()).toBe('2')
    const issues = page.getByTestId('issues-table')
    await expect.poll(() => issues.textContent()).toContain('unknown value \'approved\'')
    const firstIssue = issues.locator('tbody tr').first()
    expect((await firstIssue.locator('td').allTextContents()).map(t => t.trim())).toEqual(['2', 'Z', 'Lifecycle', expect.stringContaining('Lifecycle: unknown value \'approved\''), 'error'])
    const commit = page.getByRole('button', { name: 'Commit as new catalogue version' })
    expect(await commit.isDisabled()).toBe(true)
    await screenshot(page, 'catalog-preview')
    await page.getByLabel('Filter issues').fill('checked')
    await expect.poll(() => issues.locator('tbody tr').count()).toBe(1)

    // Back to the mapping: the real lifecycle column is "Life cycle phase" (AA).
    await page.getByRole('button', { name: 'Back to the mapping' }).click()
    await page.getByLabel('Lifecycle', { exact: true }).selectOption({ label: 'AA · Life cycle phase' })
    await page.getByRole('button', { name: 'Re-check' }).click()
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Checked:' }).textContent()).toContain('2 valid, 0 with errors')
    await page.getByRole('button', { name: 'Next: preview' }).click()
    await page.getByTestId('no-issues').waitFor()
    expect(await page.getByTestId('valid-parts').textContent()).toBe('2')
    await expect.poll(() => page.getByTestId('sample-table').textContent()).toContain('1.7 kV')
    expect(await commit.isEnabled()).toBe(true)
    await commit.click()
    const summary = page.getByTestId('commit-summary')
    await expect.poll(() => summary.textContent()).toMatch(/Committed as catalogue version \d+/)
    expect(await summary.textContent()).toContain('2 added · 0 updated · 0 unchanged')
    committedPrefix = prefix

    // The parts browser finds the committed part; headers sort on the server and say so.
    await summary.getByRole('link', { name: 'Browse the parts' }).click()
    await page.waitForURL('**/catalog**')
    await page.getByLabel('Search').fill(prefix)
    const row = page.locator(`tr[data-part-number="${prefix}-HB"]`)
    await row.waitFor()
    await expect.poll(() => page.getByTestId('parts-total').textContent()).toBe('2')
    expect(await row.textContent()).toContain('1.7 kV')
    expect(await row.textContent()).toContain('264.00 EUR')
    expect(await row.textContent()).toContain('Not approved')
    const voltageHeader = page.locator('th', { has: page.getByRole('button', { name: /Voltage rating/ }) })
    await voltageHeader.getByRole('button').click()
    await expect.poll(() => voltageHeader.getAttribute('aria-sort')).toBe('ascending')
    await expect.poll(() => page.locator('tbody tr').first().getAttribute('data-part-number')).toBe(`${prefix}-C`)
    await voltageHeader.getByRole('button').click()
    await expect.poll(() => voltageHeader.getAttribute('aria-sort')).toBe('descending')
    await expect.poll(() => page.locator('tbody tr').first().getAttribute('data-part-number')).toBe(`${prefix}-HB`)
    expect(page.url()).toContain('sort=voltageRating')
    await screenshot(page, 'catalog-browser')
    // Minimum ratings accept SI prefixes; a value that is not a voltage is explained beside the box.
    await page.getByLabel('Min. voltage [V]').fill('1.5 kV')
    await expect.poll(() => page.getByTestId('parts-total').textContent()).toBe('1')
    await page.getByLabel('Min. voltage [V]').fill('lots')
    await expect.poll(() => page.locator('#parts-min-voltage-error').textContent()).toContain('Enter a voltage')
    await page.getByLabel('Min. voltage [V]').fill('')
    await expect.poll(() => page.getByTestId('parts-total').textContent()).toBe('2')

    // The part page shows the grouped figures with units, its history, and the write controls.
    await row.getByRole('link', { name: `${prefix}-HB` }).click()
    await page.getByRole('heading', { name: `${prefix}-HB` }).waitFor()
    await expect.poll(() => page.locator('[data-field="turnOnEnergy"]').first().textContent()).toContain('28 mJ')
    expect(await page.locator('[data-field="leadTimeDays"]').first().textContent()).toContain('70 days')
    await page.getByLabel('Stock [pcs]').fill('-3')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await expect.poll(() => page.locator('#edit-stock-error').textContent()).toMatch(/0|greater|least/i)
    await page.getByLabel('Stock [pcs]').fill('20')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await expect.poll(() => page.getByTestId('version-history').locator('tbody tr').count()).toBe(2)
    expect(await page.getByTestId('version-history').locator('tbody tr').first().textContent()).toMatch(/Stock:\s*35 pcs\s*→\s*changed to\s*20 pcs/)
    await screenshot(page, 'catalog-part')
  })

  it('purchasing reads parts, imports and versions without write controls; server-rendered pages hydrate cleanly', async () => {
    const page = await newPage(browser)
    const hydrationMessages: string[] = []
    page.on('console', (m) => { if (/hydration/i.test(m.text())) hydrationMessages.push(m.text()) })
    await signInPage(page, 'purchasing')
    await page.getByRole('link', { name: 'Parts catalogue' }).first().click()
    await page.waitForURL('**/catalog')
    await page.locator('table tbody tr').first().waitFor()
    expect(await page.getByRole('link', { name: 'Upload spreadsheet' }).count()).toBe(0)
    expect(await page.getByRole('link', { name: 'Template (.xlsx)' }).getAttribute('href')).toBe('/api/catalog/template.xlsx')
    await page.locator('table tbody tr a').first().click()
    await page.getByRole('heading', { name: 'Version history' }).waitFor()
    expect(await page.getByRole('button', { name: 'Save changes' }).count()).toBe(0)

    // Straight from the server: the URL's page size shows in the select, the order in aria-sort.
    await page.goto('/catalog?pageSize=25&sort=stock&dir=desc')
    expect(await page.getByLabel('Per page').first().inputValue()).toBe('25')
    expect(await page.locator('th', { has: page.getByRole('button', { name: /Stock/ }) }).getAttribute('aria-sort')).toBe('descending')
    await expect.poll(() => page.locator('table tbody tr').count()).toBe(25)

    // The import committed by the engineer above: read-only, with the original file to download.
    await page.goto('/catalog/imports')
    const link = page.getByRole('link', { name: `${committedPrefix}-supplier.xlsx` })
    const href = await link.getAttribute('href')
    expect(href).toMatch(/^\/catalog\/imports\/\d+$/)
    await page.goto(href!)
    await expect.poll(() => page.getByTestId('committed-note').textContent()).toMatch(/Committed as catalogue version \d+/)
    expect(await page.getByRole('link', { name: 'Download the original file' }).getAttribute('href')).toBe(`/api${href}/file`)
    expect(await page.getByRole('button', { name: 'Commit as new catalogue version' }).count()).toBe(0)
    await expect.poll(async () => {
      await page.getByRole('button', { name: '2 · Map columns' }).click()
      return page.getByRole('heading', { name: '2 · Map the columns' }).count()
    }).toBe(1)
    const kind = page.getByLabel('Kind', { exact: true })
    expect(await kind.isDisabled()).toBe(true)
    expect(await kind.inputValue()).toBe('2') // the engineer's fix: column C, "Part class"

    await page.goto('/catalog/versions')
    await expect.poll(() => page.locator('table').textContent()).toContain(`Import of ${committedPrefix}-supplier.xlsx`)
    expect(hydrationMessages).toEqual([])
  })
})
