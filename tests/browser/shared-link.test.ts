// Issue 10 item 6 in Chromium: a back-to-back pair whose grid side is another topology on the same DC link
// (NPC machine side, T-type grid side), chosen on the design form; the shared DC-link bank shows once on the
// results and is its own side on the parts page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

describe('mixed-topology back-to-back in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('chooses a T-type grid side for the NPC machine side among the compatible topologies; the link bank shows once', async () => {
    const page = await newPage(browser)
    await signInPage(page, 'design-engineer')
    await page.goto('/designs/new')
    await page.getByLabel('Design name').fill(unique('Browser mixed b2b'))
    await page.locator('tr[data-position="Dc1+"]').first().waitFor()
    await page.getByTestId('back-to-back').check()
    const choice = page.getByTestId('grid-topology')
    await choice.waitFor()
    // Only topologies on a three-node DC link are offered.
    const offered = await choice.locator('option').allTextContents()
    expect(offered.length).toBe(3)
    expect(offered.some(o => /T-type/i.test(o))).toBe(true)
    expect(offered.some(o => /two-level/i.test(o))).toBe(false)
    await choice.selectOption('t-type')
    const link = page.getByTestId('shared-link')
    await link.waitFor({ timeout: 30000 })
    await expect.poll(() => page.getByRole('tab', { name: /Grid side.*T-type/ }).count(), { timeout: 30000 }).toBe(1)
    await expect.poll(() => link.locator('tr[data-position="Cdc1"]').count()).toBe(1)
    expect(await link.locator('tr[data-position="Cdc2"]').count()).toBe(1)
    expect(await link.textContent()).toMatch(/independent carriers/)
    // The counts table: NPC clamp diodes give both column groups a clamp column, and the total row is the sum of
    // the two sides cell by cell (a misaligned column would break the sum).
    const counts = page.locator('table.results-counts')
    expect((await counts.locator('thead th').allTextContents()).filter(t => t.trim() === 'Clamp diodes')).toHaveLength(2)
    const cells = async (side: string) => (await counts.locator(`tr[data-side="${side}"] td`).allTextContents()).map(t => t.trim())
    const [machine, grid, total] = [await cells('machine'), await cells('grid'), await cells('total')]
    expect(machine).toHaveLength(7)
    expect(Number(machine[2])).toBeGreaterThan(0)
    expect(total.slice(0, 6)).toEqual(machine.slice(0, 6).map((m, i) => String(Number(m) + Number(grid[i]))))
    await screenshot(page, 'shared-link-results')

    await page.getByRole('button', { name: 'Save design' }).click()
    await page.waitForURL(/\/designs\/\d+$/)
    const id = new URL(page.url()).pathname.split('/').pop()
    await page.goto(`/designs/${id}/parts`)
    await page.getByRole('tab', { name: 'Shared DC link' }).waitFor({ timeout: 30000 })
    expect(await page.getByRole('tab', { name: 'Grid side' }).count()).toBe(1)
  })
})
