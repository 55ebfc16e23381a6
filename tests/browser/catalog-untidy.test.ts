// The whole untidy flow in Chromium: a supplier sheet with every trait (title and blank rows, its own
// headers, units and decimal commas in cells, "Price €", supplier words for kinds, an exact repeat, a
// conflicting repeat, notes under the table) goes in through the UI without editing the file.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'
import { workbookBuffer } from '../fixtures/catalog/workbooks'
import { UNTIDY_HEADERS, untidyRows } from '../fixtures/catalog/untidy'

describe('untidy catalogue upload in Chromium', () => {
  let browser: Browser
  let dir: string
  beforeAll(async () => {
    browser = await launch()
    dir = mkdtempSync(join(tmpdir(), 'stratavolt-untidy-'))
  })
  afterAll(async () => {
    await browser?.close()
    if (dir) rmSync(dir, { recursive: true, force: true })
  })

  it('component engineer: the supplier sheet goes in as it is, the refused rows are named and left out', async () => {
    const prefix = unique('UB')
    const rows = untidyRows(prefix)
    rows[2] = [...UNTIDY_HEADERS, `Browser batch ${prefix}`]
    const file = join(dir, `${prefix}-pricelist.xlsx`)
    writeFileSync(file, await workbookBuffer([{ name: 'Price list', rows }]))

    const page = await newPage(browser)
    await signInPage(page, 'component-engineer')
    await page.goto('/catalog/import')
    await page.getByLabel('Spreadsheet file').setInputFiles(file)
    await page.getByRole('button', { name: 'Upload and check' }).click()
    await page.getByRole('heading', { name: '2 · Map the columns' }).waitFor()

    // Found and shown: the header row, what was skipped, the supplier's words with our values, the currency.
    expect(await page.getByLabel('Headers are on row').inputValue()).toBe('3')
    const skipped = page.getByTestId('skipped-rows')
    await expect.poll(() => skipped.textContent()).toContain('Row 1: above the headers')
    const skippedText = await skipped.textContent()
    expect(skippedText).toContain('Row 13: a note under the table')
    expect(skippedText).toContain('Row 9: repeats row 4 exactly')
    expect(await page.getByLabel('Kind: IGBT module means').inputValue()).toBe('switch-diode')
    expect(await page.getByLabel('Package configuration: 2in1 means').inputValue()).toBe('half-bridge')
    expect(await page.getByTestId('currency-from-header').textContent()).toContain('EUR')
    await screenshot(page, 'catalog-untidy-reading')

    await page.getByRole('button', { name: 'Next: preview' }).click()
    await page.getByRole('heading', { name: /3 · Preview/ }).waitFor()
    await expect.poll(() => page.getByTestId('valid-parts').textContent()).toBe('4')
    expect(await page.getByTestId('rows-with-errors').textContent()).toBe('2')
    expect(await page.getByTestId('issues-table').textContent()).toContain('is also on row 11 with other values')
    expect(await page.getByTestId('import-changes').textContent()).toContain('4 new, 0 changed, 0 unchanged')
    expect(await page.getByTestId('refused-download').getAttribute('href')).toMatch(/\/api\/catalog\/imports\/\d+\/refused\.xlsx$/)
    const commit = page.getByRole('button', { name: 'Commit as new catalogue version' })
    expect(await commit.isDisabled()).toBe(true)
    await page.getByTestId('leave-refused').check()
    expect(await page.getByText('Import the 4 valid rows and leave the 2 refused rows out').count()).toBe(1)
    await commit.click()
    const summary = page.getByTestId('commit-summary')
    await expect.poll(() => summary.textContent()).toMatch(/Committed as catalogue version \d+/)
    expect(await summary.textContent()).toContain('4 added · 0 updated · 0 unchanged · 2 refused rows left out')
    await screenshot(page, 'catalog-untidy-committed')

    await page.goto(`/catalog?q=${prefix}`)
    await expect.poll(() => page.getByTestId('parts-total').textContent()).toBe('4')
    expect(await page.locator(`tr[data-part-number="${prefix}-HB"]`).textContent()).toContain('1.2 kV')
  })
})
