// Issue 12 in Chromium: a design with a 2 Hz start point and a mission profile; the parts page shows the
// peak T_j above its mean for that point and the lifetime with the position that limits it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { signInAs, unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

const input = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [
      { name: 'Start 2 Hz', lineVoltageRms: 20, phaseCurrentRms: 180, powerFactor: 0.8, fundamentalHz: 2, hoursShare: 0.05, startsPerHour: 6 },
      { name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 150, powerFactor: 0.88, fundamentalHz: 50, hoursShare: 0.95 },
    ],
  },
  thermal: { ambientTemperatureC: 40, heatsinkRth: 0.01, heatsinkTimeConstantS: 300 },
}

describe('junction temperature over the period and lifetime in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('a 2 Hz start shows peak T_j above its mean and the lifetime figure', async () => {
    const api = await signInAs('design-engineer')
    const { body: design } = await api.json('POST', '/api/designs', { name: unique('Browser thermal'), input })
    const page = await newPage(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${design.id}/parts`)
    await page.locator('nav[aria-label="Positions"] button', { hasText: 'S1' }).first().click()
    const table = page.getByTestId('junction-over-period')
    await expect.poll(() => table.count()).toBe(1)
    const row = table.locator('tr[data-point="Start 2 Hz"]')
    const read = async (field: string) => Number((await row.locator(`[data-field="${field}"]`).textContent())!.replace(/[^\d.-]/g, ''))
    const mean = await read('mean')
    const peak = await read('peak')
    expect(peak).toBeGreaterThan(mean + 1)
    const life = page.getByTestId('life-limit')
    await expect.poll(() => life.textContent()).toMatch(/Limited by \S+ .* h of operation/)
    await screenshot(page, 'thermal-parts-2hz')
  })
})
