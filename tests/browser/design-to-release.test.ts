// Issue 10's last step in Chromium: a matrix converter (input filter capacitors matched, filter inductors to specify
// by hand) and a mixed-topology back-to-back pair (NPC machine side, T-type grid side, one shared DC-link bank) go
// from a saved design through the parts page to a released BOM, with their filter and shared-link parts on it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { signInAs, unique } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

const matrix = {
  machineSide: {
    topology: 'matrix', inputLineVoltageRms: 400, switchingHz: 8000, modulation: 'space-vector', overshootVoltage: 40,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 300, phaseCurrentRms: 40, powerFactor: 0.86, fundamentalHz: 50 }],
  },
}
const mixed = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 700, dcVoltageMax: 800, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.88, fundamentalHz: 50 }],
  },
  gridSide: {
    topology: 't-type', switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 90, powerFactor: -0.99, fundamentalHz: 50 }],
  },
}

/** Assigns every open position of the tab shown through the page's own Assign buttons (the first candidate). */
async function assignAll(page: Page, tab: string | null) {
  if (tab) await page.getByRole('tab', { name: tab, exact: true }).click()
  const nav = page.locator('nav[aria-label="Positions"] button[data-position]')
  await expect.poll(() => nav.count(), { timeout: 30000 }).toBeGreaterThan(0)
  const count = await nav.count()
  for (let i = 0; i < count; i++) {
    const button = nav.nth(i)
    if (await button.getAttribute('data-assigned') === 'yes') continue
    await button.click()
    const position = await button.getAttribute('data-position')
    await page.getByRole('button', { name: 'Assign', exact: true }).first().click()
    await expect.poll(() => page.getByRole('status').textContent(), { timeout: 30000 }).toContain(`assigned to ${position}`)
  }
}

/** Releases the design's BOM from its BOM page; returns the released BOM as the API answers it. */
async function release(page: Page, id: number) {
  await page.goto(`/designs/${id}/bom`)
  await page.getByRole('button', { name: /Release as revision 1/ }).click()
  await page.waitForURL(/\/boms\/\d+\?released=1/, { timeout: 60000 })
  const bomId = Number(new URL(page.url()).pathname.split('/').pop())
  const { body } = await (await signInAs('design-engineer')).json('GET', `/api/boms/${bomId}`)
  return body
}

describe('from design to released BOM in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('matrix converter: the input filter capacitors are assigned and bought, the filter inductors are lines to specify', async () => {
    const api = await signInAs('design-engineer')
    const created = await api.json('POST', '/api/designs', { name: unique('Browser matrix'), input: matrix })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    const page = await newPage(browser)
    page.on('dialog', d => void d.dismiss())
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${created.body.id}`)
    // The results show the input side with the filter.
    await expect.poll(() => page.getByText(/input filter/i).count(), { timeout: 30000 }).toBeGreaterThan(0)
    await page.goto(`/designs/${created.body.id}/parts`)
    await assignAll(page, null)
    const bom = await release(page, created.body.id)
    await screenshot(page, 'matrix-bom-released')
    const positions = bom.snapshot.positions.map((p: { position: string }) => p.position)
    expect(positions).toContain('Cf')
    const filterLine = bom.snapshot.lines.find((l: { references: string[] }) => l.references.some(r => /(^| )Cf( |$)/.test(r)))
    expect(filterLine, 'the filter capacitors have a priced catalogue line').toBeTruthy()
    expect(filterLine.partNumber).not.toBe('')
    const inductor = bom.snapshot.lines.find((l: { key: string }) => /Lf$/.test(l.key))
    expect(inductor, 'the filter inductors are a line to specify').toBeTruthy()
    expect(inductor).toMatchObject({ partVersionId: null, quantityPerUnit: 3 })
    // The released page lists both.
    expect(await page.locator('main').textContent()).toMatch(/Input filter inductor Lf/)
  })

  it('NPC machine side with a T-type grid side: the shared DC-link bank is assigned once and bought once', async () => {
    const api = await signInAs('design-engineer')
    const created = await api.json('POST', '/api/designs', { name: unique('Browser mixed release'), input: mixed })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    const page = await newPage(browser)
    page.on('dialog', d => void d.dismiss())
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${created.body.id}/parts`)
    await assignAll(page, 'Machine side')
    await assignAll(page, 'Grid side')
    await assignAll(page, 'Shared DC link')
    const bom = await release(page, created.body.id)
    await screenshot(page, 'mixed-b2b-bom-released')
    const link = bom.snapshot.positions.filter((p: { side: string }) => p.side === 'dc-link').map((p: { position: string }) => p.position)
    expect(link).toEqual(['Cdc1', 'Cdc2'])
    const refs = bom.snapshot.lines.flatMap((l: { references: string[] }) => l.references).filter((r: string) => /Cdc/.test(r))
    expect(refs).toHaveLength(2)
    expect(bom.snapshot.topologySummary).toMatch(/T-type/)
  })
})
