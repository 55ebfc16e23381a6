import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

/** "1.23 kA" → 1230 */
function amps(text: string | null): number {
  const m = (text ?? '').replace(/\s/g, '').match(/([\d.]+)(k|m)?A/)
  if (!m) throw new Error(`no current in "${text}"`)
  return Number(m[1]) * (m[2] === 'k' ? 1000 : m[2] === 'm' ? 0.001 : 1)
}

const rmsOf = (page: Page, position: string) =>
  page.locator(`table.results-devices tr[data-position="${position}"] td`).nth(5).textContent()

describe('design workspace in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('creates an NPC design, shows clamp diodes and the schematic, and a regenerating point raises the diode stress', async () => {
    const page = await newPage(browser)
    await signInPage(page, 'design-engineer')
    await page.goto('/designs/new')
    await page.getByLabel('Design name').fill(unique('Browser NPC'))
    await page.locator('tr[data-position="Dc1+"]').first().waitFor()
    await page.getByTestId('leg-schematic').first().waitFor()
    expect(await page.locator('table.results-devices tr[data-position^="Dc"]').count()).toBeGreaterThanOrEqual(2)
    // One highlight for the drawing and the tables: pointing at a part marks its row, pointing at a row marks the part.
    const schematic = page.getByTestId('leg-schematic').first()
    await schematic.locator('[data-hover="Dc1+"]').first().hover()
    await expect.poll(() => page.locator('table.results-devices tr[data-position="Dc1+"]').first().getAttribute('aria-current')).toBe('true')
    await page.locator('table.results-devices tr[data-position="S1"]').first().hover()
    await expect.poll(() => schematic.locator('[data-hover="S1"] [stroke="#0d9488"]').count()).toBeGreaterThan(0)
    expect(await schematic.locator('[data-hover="Dc1+"] [stroke="#0d9488"]').count()).toBe(0)
    const before = amps(await rmsOf(page, 'D1'))
    await page.getByRole('button', { name: '+ Regenerative braking' }).click()
    await expect.poll(async () => amps(await rmsOf(page, 'D1')), { timeout: 15000 }).toBeGreaterThan(before * 1.2)
    await screenshot(page, 'design-results')

    await page.getByRole('button', { name: 'Save design' }).click()
    await page.waitForURL(/\/designs\/\d+$/)
    await expect.poll(() => page.getByText('revision 1 of 1').count()).toBeGreaterThan(0)

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Report (PDF)' }).click()])
    const file = await download.path()
    expect(readFileSync(file!).subarray(0, 5).toString()).toBe('%PDF-')
  })

  it('runs a trade study and opens a candidate as a design', async () => {
    const page = await newPage(browser)
    await signInPage(page, 'design-engineer')
    await page.goto('/compare')
    await page.getByRole('cell', { name: /T-type/ }).first().waitFor({ timeout: 30000 })
    expect(await page.locator('canvas').count()).toBeGreaterThan(0)
    await screenshot(page, 'trade-study')
    const row = page.locator('tr', { has: page.getByText('T-type three-level', { exact: false }) }).first()
    await row.getByRole('button', { name: 'Open as design' }).click()
    await page.waitForURL(/\/designs\/new/)
    await expect.poll(() => page.locator('input[name="topology"][value="t-type"]').isChecked()).toBe(true)
  })

  it('tells the second of two editors that someone else saved meanwhile', async () => {
    const a = await newPage(browser)
    const b = await newPage(browser)
    await signInPage(a, 'design-engineer')
    await signInPage(b, 'admin')
    await a.goto('/designs/new')
    const name = unique('Conflict')
    await a.getByLabel('Design name').fill(name)
    await a.locator('tr[data-position="S1"]').first().waitFor()
    await a.getByRole('button', { name: 'Save design' }).click()
    await a.waitForURL(/\/designs\/\d+$/)
    const url = new URL(a.url()).pathname
    await b.goto(url)
    await b.locator('tr[data-position="S1"]').first().waitFor()
    await a.getByLabel('Design name').fill(`${name} A`)
    await a.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => a.getByRole('status').filter({ hasText: 'Saved as revision 2' }).count()).toBeGreaterThan(0)
    await b.getByLabel('Design name').fill(`${name} B`)
    await b.getByRole('button', { name: 'Save revision' }).click()
    await expect.poll(() => b.getByRole('alert').filter({ hasText: 'Someone else saved' }).count()).toBeGreaterThan(0)
    // B's edit is still in the form, not lost.
    expect(await b.getByLabel('Design name').inputValue()).toBe(`${name} B`)
    await screenshot(b, 'design-conflict')
  })
})
