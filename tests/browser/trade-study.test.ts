import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { signInAs, unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

// Issue 12 item 5: the trade study started from the open design with one click, with that design's inputs.
const input = {
  machineSide: {
    topology: 'cascaded-h-bridge', levels: 9, dcVoltage: 700, dcVoltageMax: 800, switchingHz: 1500, modulation: 'sine', overshootVoltage: 50,
    operatingPoints: [{ name: 'Full load', lineVoltageRms: 3300, phaseCurrentRms: 180, powerFactor: 0.88, fundamentalHz: 50 }],
  },
  derating: { heatsinkTemperatureC: 65 },
}

/** "5.6 k" or "5600" → 5600 (the field shows SI prefixes) */
function volts(text: string): number {
  const m = text.replace(/\s/g, '').replace(',', '.').match(/([\d.]+)(k)?/)
  if (!m) throw new Error(`no number in "${text}"`)
  return Math.round(Number(m[1]) * (m[2] ? 1000 : 1))
}

describe('trade study from a design in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('opens the study with the design\'s duty, derating and topology as the first row', async () => {
    const a = await signInAs('design-engineer')
    const created = await a.json('POST', '/api/designs', { name: unique('Study from design'), input })
    expect(created.status).toBe(201)
    const page = await newPage(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${created.body.id}`)
    await page.locator('#main').getByRole('link', { name: 'Trade study' }).click()
    await page.waitForURL(/\/compare\?/)
    await page.getByTestId('study-origin').waitFor()
    // cells of 700 V, N = 9: the whole link is 8 × 700 V
    expect(volts(await page.locator('#ts-dc').inputValue())).toBe(5600)
    expect(await page.getByLabel('Candidate 1 topology').inputValue()).toBe('cascaded-h-bridge')
    expect(await page.getByLabel('Candidate 1 levels').inputValue()).toBe('9')
    expect((await page.locator('#derating-heatsinkTemperatureC').inputValue()).replace(/\D/g, '')).toBe('65')
    await page.getByRole('cell', { name: /Cascaded H-bridge, N = 9/ }).first().waitFor({ timeout: 30000 })
    await screenshot(page, 'trade-study-from-design')
  })
})
