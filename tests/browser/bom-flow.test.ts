import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { linkIn, signInAs, unique, waitForMail } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

const input = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 100,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 250, powerFactor: 0.86, fundamentalHz: 50 }],
  },
}

describe('BOM release to purchasing in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('engineer assigns parts and releases; purchasing gets the mail, records a quote and an order', async () => {
    const api = await signInAs('design-engineer')
    const name = unique('Browser BOM')
    const { body: design } = await api.json('POST', '/api/designs', { name, input })

    const eng = await newPage(browser)
    await signInPage(eng, 'design-engineer')
    await eng.goto(`/designs/${design.id}/parts`)
    // Assign the first candidate of every position through the page.
    const positions = await eng.locator('nav[aria-label="Positions"] button').count()
    for (let i = 0; i < positions; i++) {
      await eng.locator('nav[aria-label="Positions"] button').nth(i).click()
      const assign = eng.getByRole('button', { name: 'Assign', exact: true }).first()
      await assign.click()
      await expect.poll(() => eng.getByRole('status').textContent()).toContain('assigned')
    }
    await screenshot(eng, 'parts-assigned')
    await eng.goto(`/designs/${design.id}/bom`)
    await eng.getByRole('button', { name: /Release as revision 1/ }).click()
    await eng.waitForURL(/\/boms\/\d+\?released=1/)
    const bomPath = new URL(eng.url()).pathname
    await expect.poll(() => eng.getByRole('status').first().textContent()).toContain('Purchasing was e-mailed')

    const mail = await waitForMail('purchasing@example.com', `${name}, revision 1`)
    expect(mail.attachments.length).toBe(2)
    const link = new URL(linkIn(mail.text))
    expect(link.pathname).toBe(bomPath)

    const buyer = await newPage(browser)
    await signInPage(buyer, 'purchasing')
    await buyer.goto(link.pathname)
    const firstLine = buyer.locator('tbody tr').first()
    await firstLine.getByLabel(/Supplier for/).fill('Northdeck Distribution')
    await firstLine.getByLabel(/Supplier for/).press('Tab')
    await expect.poll(() => buyer.getByRole('status').textContent()).toContain('Saved')
    await firstLine.getByLabel(/Quoted unit price for/).fill('42.5')
    await firstLine.getByLabel(/Quoted unit price for/).press('Tab')
    await firstLine.getByLabel(/Order reference for/).fill('PO-2026-118')
    await firstLine.getByLabel(/Order reference for/).press('Tab')
    await expect.poll(() => buyer.getByText(/With quotes:/).count()).toBeGreaterThan(0)
    await buyer.getByLabel('Status').selectOption('ordered')
    await expect.poll(() => buyer.locator('.badge', { hasText: 'ordered' }).count()).toBeGreaterThan(0)
    await screenshot(buyer, 'bom-purchasing')

    const bomId = Number(bomPath.split('/').pop())
    const stored = await (await signInAs('purchasing')).json('GET', `/api/boms/${bomId}`)
    expect(stored.body.status).toBe('ordered')
    expect(Object.values(stored.body.purchase)).toContainEqual(expect.objectContaining({ supplier: 'Northdeck Distribution', quotedUnitPrice: 42.5, orderReference: 'PO-2026-118' }))
  })
})
