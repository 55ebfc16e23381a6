// Issue 14 items 1, 6 and 7, issue 10 item 7 in Chromium at 1280 × 800: inputs and results side by side with the
// results in view while the inputs scroll, no clipped table column, the out-of-date marker, the operating-point
// selector of the waveform, one safety note per page, the home page's path, a position's first candidate
// reached in a few Tab stops, and no console error on any of these pages.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { baseUrl, signInAs, unique } from '../support/api'
import { launch, screenshot, signInPage } from '../support/browser'

const NPC_DESIGN = 'Pump drive 690 V / 400 kW'

async function page1280(browser: Browser): Promise<{ page: Page, problems: string[] }> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 800 }, locale: 'en-GB' })
  const page = await context.newPage()
  await page.route(url => !url.toString().startsWith(baseUrl) && !url.toString().startsWith('data:') && !url.toString().startsWith('blob:'), route => route.abort())
  const problems: string[] = []
  page.on('console', (m) => { if (m.type() === 'error' || /hydration/i.test(m.text())) problems.push(m.text()) })
  page.on('pageerror', e => problems.push(e.message))
  return { page, problems }
}

/** Every table container inside `scope` whose content is wider than its box (a clipped or hidden column). */
function clippedTables(page: Page, scope: string) {
  return page.evaluate((sel) => {
    const out: string[] = []
    for (const table of document.querySelectorAll(`${sel} table`)) {
      const box = table.parentElement!
      if (box.scrollWidth > box.clientWidth + 1) out.push(`${table.querySelector('caption')?.textContent?.trim() ?? table.className}: ${box.scrollWidth} > ${box.clientWidth}`)
      if (table.getBoundingClientRect().right > document.documentElement.clientWidth + 1) out.push(`${table.className} runs past the window`)
    }
    return out
  }, scope)
}

async function npcDesignId() {
  const api = await signInAs('design-engineer')
  const list = await api.json('GET', '/api/designs')
  const d = (list.body as { id: number, name: string }[]).find(x => x.name === NPC_DESIGN)
  expect(d, 'the demo NPC design').toBeTruthy()
  return d!.id
}

describe('results beside the inputs (1280 × 800)', () => {
  let browser: Browser
  let designId: number
  beforeAll(async () => {
    browser = await launch()
    designId = await npcDesignId()
  })
  afterAll(async () => { await browser?.close() })

  it('puts inputs and results side by side, keeps results and key figures in view while the inputs scroll, clips no table', async () => {
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${designId}`)
    await page.locator('[data-testid="results"] tr[data-position]').first().waitFor()
    await page.getByTestId('key-figures').waitFor()

    const inputs = (await page.getByTestId('design-inputs').boundingBox())!
    const results = (await page.getByTestId('results-column').boundingBox())!
    expect(results.x).toBeGreaterThanOrEqual(inputs.x + inputs.width)
    expect(results.y).toBeLessThan(inputs.y + 200)

    // Scroll the page through the inputs: the results column stays in the window, the key figures at its top.
    await page.mouse.move(inputs.x + 20, inputs.y + 300)
    await page.mouse.wheel(0, 900)
    await expect.poll(() => page.evaluate(() => window.scrollY)).toBeGreaterThan(300)
    const after = (await page.getByTestId('results-column').boundingBox())!
    expect(after.y).toBeGreaterThanOrEqual(0)
    expect(after.y).toBeLessThan(120)
    const figures = (await page.getByTestId('key-figures').boundingBox())!
    expect(figures.y).toBeGreaterThanOrEqual(0)
    expect(figures.y + figures.height).toBeLessThan(800)

    // Scroll inside the results to the capacitors: the key figures stay at the column's top.
    await page.locator('[data-testid="results"] table').last().scrollIntoViewIfNeeded()
    const stillThere = (await page.getByTestId('key-figures').boundingBox())!
    expect(stillThere.y).toBeGreaterThanOrEqual(0)
    expect(stillThere.y).toBeLessThan(200)

    expect(await clippedTables(page, '[data-testid="results"]')).toEqual([])
    expect(await page.locator('[data-testid="results"] table').count()).toBeGreaterThanOrEqual(3)
    // The drawing fits its box or says how to reach the rest.
    const box = await page.getByTestId('schematic-box').first().evaluate(el => ({ over: el.scrollHeight > el.clientHeight + 2 || el.scrollWidth > el.clientWidth + 2 }))
    expect(await page.getByTestId('schematic-scroll-cue').count()).toBe(box.over ? 1 : 0)

    expect(await page.getByTestId('safety-note').count()).toBe(1)
    expect(await page.getByText(/is a design aid/).count()).toBe(1)
    await screenshot(page, 'results-side-by-side')
    expect(problems).toEqual([])
  })

  it('a saved design\'s page arrives from the server with its results and its parts\' figures drawn: the browser asks for neither, hydrates without a warning and sees no unsaved change', async () => {
    const { page, problems } = await page1280(browser)
    // every console message, whatever its level: Vue reports a hydration mismatch as a warning, then an error
    const messages: string[] = []
    page.on('console', m => messages.push(`${m.type()}: ${m.text()}`))
    const resultRequests: string[] = []
    page.on('request', (r) => { if (/\/api\/designs\/(preview|\d+\/results|\d+\/parts\/summary)/.test(r.url())) resultRequests.push(r.url()) })
    await signInPage(page, 'design-engineer')

    const api = await signInAs('design-engineer')
    const positions = ((await api.json('GET', `/api/designs/${designId}/results`)).body.result.converters[0].envelope.devices as { name: string }[]).map(d => d.name)
    expect(positions.length).toBeGreaterThan(0)
    const html = await (await page.request.get(`/designs/${designId}`)).text()
    const markup = html.slice(0, html.indexOf('<script type="application/json"'))
    expect(markup).toContain('data-testid="results"')
    expect((markup.match(/<tr[^>]*data-position=/g) ?? []).length).toBeGreaterThanOrEqual(positions.length)
    expect(markup).not.toContain('unsaved changes')
    // the demo design has parts assigned: their losses and T_j come with the page, not after it (pushing the results down)
    expect(markup).toContain('data-testid="loss-summary"')
    expect(markup).toContain('data-testid="peak-junction"')

    await page.goto(`/designs/${designId}`)
    await page.locator('[data-testid="results"] tr[data-position]').first().waitFor()
    await page.waitForLoadState('networkidle')
    expect(resultRequests).toEqual([])
    expect(await page.getByText('unsaved changes').count()).toBe(0)
    expect(messages.filter(m => /hydrat|mismatch/i.test(m))).toEqual([])
    expect(problems).toEqual([])
  })

  it('a tall leg (cascaded H-bridge, 9 levels) fits its box or shows the scroll cue', async () => {
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto('/designs/new')
    await page.locator('tr[data-position="Dc1+"]').first().waitFor()
    await page.locator('label', { hasText: 'Cascaded H-bridge' }).first().click()
    await page.getByLabel('Levels (N)').first().selectOption('9')
    await page.getByTestId('schematic-box').first().waitFor()
    await page.waitForTimeout(800)
    const box = await page.getByTestId('schematic-box').first().evaluate(el => ({ over: el.scrollHeight > el.clientHeight + 2 || el.scrollWidth > el.clientWidth + 2 }))
    expect(await page.getByTestId('schematic-scroll-cue').count()).toBe(box.over ? 1 : 0)
    expect(await clippedTables(page, '[data-testid="results"]')).toEqual([])
    await screenshot(page, 'results-tall-leg')
    expect(problems).toEqual([])
  })

  it('shows the waveform and spectrum of the operating point chosen on the results', async () => {
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${designId}`)
    const select = page.getByTestId('waveform-point')
    await select.waitFor()
    await expect.poll(() => page.locator('h2', { hasText: 'Output voltage' }).textContent()).toContain('at Rated motoring')
    // the charts sit below the fold of the results column: drawn once scrolled to, a same-size placeholder until then
    expect(await page.locator('.waveform-chart canvas').count()).toBe(0)
    const placeholder = (await page.locator('.waveform-chart > div').first().boundingBox())!
    await page.locator('.waveform-chart').scrollIntoViewIfNeeded()
    await page.locator('.waveform-chart canvas').waitFor()
    await page.locator('.spectrum-chart canvas').waitFor()
    expect((await page.locator('.waveform-chart > div').first().boundingBox())!.height).toBeCloseTo(placeholder.height, 0)
    const answer = page.waitForResponse(r => r.url().includes('/api/designs/preview') && r.url().includes('machinePoint=2'))
    await select.selectOption('2')
    const response = await answer
    expect(response.status()).toBe(200)
    const body = await response.json() as { extras: { machine: { pointName: string, waveform: { time: number[] }, spectrum: { order: number, frequency: number }[] } } }
    expect(body.extras.machine.pointName).toBe('Low-frequency start')
    // 5 Hz: one period is 200 ms (the rated point's is 20 ms), the fundamental line at 5 Hz.
    expect(body.extras.machine.waveform.time.at(-1)!).toBeGreaterThan(0.15)
    expect(body.extras.machine.spectrum.find(l => l.order === 1)!.frequency).toBe(5)
    await expect.poll(() => page.locator('h2', { hasText: 'Output voltage' }).textContent()).toContain('at Low-frequency start')
    expect(await select.inputValue()).toBe('2')

    // Every sample on request, and back.
    const full = page.waitForResponse(r => r.url().includes('resolution=full'))
    await page.getByTestId('waveform-resolution').click()
    expect((await (await full).json()).extras.machine.resolution).toBe('full')
    await expect.poll(() => page.getByTestId('waveform-resolution').textContent()).toContain('Fewer samples')
    await screenshot(page, 'results-point-selector')
    expect(problems).toEqual([])
  })

  it('greys the results with "out of date" beside the inputs while a field is refused', async () => {
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${designId}`)
    await page.locator('[data-testid="results"] tr[data-position]').first().waitFor()
    const field = page.getByLabel('Phase current of Rated motoring')
    await field.fill('0.69 kV')
    await field.press('Enter')
    await page.getByTestId('out-of-date').waitFor()
    await expect.poll(() => page.getByTestId('results-column').locator('.badge', { hasText: 'out of date' }).count()).toBe(1)
    const marker = (await page.getByTestId('out-of-date').boundingBox())!
    const form = (await page.getByTestId('design-inputs').boundingBox())!
    expect(marker.x).toBeGreaterThanOrEqual(form.x + form.width) // in the results column, beside the form
    await field.fill('390 A')
    await field.press('Enter')
    await expect.poll(() => page.getByTestId('out-of-date').count()).toBe(0)
    expect(problems).toEqual([])
  })

  it('home page: the path design → parts → BOM → release with where each of the person\'s designs stands', async () => {
    // A design of its own, just saved: designed, parts next, BOM and release later.
    const api = await signInAs('design-engineer')
    const input = (await api.json('GET', `/api/designs/${designId}`)).body.input
    const created = await api.json('POST', '/api/designs', { name: unique('Path check'), input })
    expect(created.status).toBe(201)
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto('/')
    const path = page.getByTestId('design-path')
    await path.waitFor()
    expect((await path.locator('thead th').allTextContents()).map(t => t.trim())).toEqual(['Your design', 'Design', 'Parts', 'BOM', 'Release'])
    const row = path.locator(`tr[data-design="${created.body.id}"]`)
    expect(await row.locator('td').evaluateAll(cells => cells.map(c => c.getAttribute('data-state')))).toEqual(['done', 'next', 'later', 'later'])
    expect(await row.locator('td').first().textContent()).toMatch(/revision 1/)
    expect(await row.locator('td').nth(1).locator('a').getAttribute('href')).toBe(`/designs/${created.body.id}/parts`)
    expect(await page.getByTestId('safety-note').count()).toBe(1)
    expect(problems).toEqual([])
  })

  it('parts page: nothing clipped, the best candidates first with more on request, the first candidate a few Tab stops from the positions', async () => {
    const { page, problems } = await page1280(browser)
    await signInPage(page, 'design-engineer')
    await page.goto(`/designs/${designId}/parts`)
    const first = page.locator('nav[aria-label="Positions"] button').first()
    await first.waitFor()
    expect(await clippedTables(page, 'main')).toEqual([])

    // the candidates table's rows (the position's per-point T_j table is a table of its own)
    const rows = page.getByRole('table', { name: /Candidates for/ }).locator('tbody tr')
    await rows.first().waitFor()
    expect(await rows.count()).toBeLessThanOrEqual(5)
    const more = page.getByTestId('more-candidates')
    if (await more.count()) {
      const answer = page.waitForResponse(r => r.url().includes('/api/designs/') && r.url().includes('limit=50'))
      await more.click()
      expect((await answer).status()).toBe(200)
      await expect.poll(() => rows.count()).toBeGreaterThan(5)
    }

    // Keyboard: the position list is one Tab stop (arrows move in it); the next Tab stop leads to the first candidate.
    await first.focus()
    await page.keyboard.press('ArrowDown')
    const focused = await page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.position)
    expect(focused).toBeTruthy()
    expect(focused).not.toBe(await first.getAttribute('data-position'))
    let stops = 0
    let reached = false
    const inFirstRow = () => page.evaluate(() => {
      const row = document.activeElement?.closest('tbody tr')
      return !!row && row === row.parentElement?.firstElementChild
    })
    while (stops < 5 && !reached) {
      await page.keyboard.press('Tab')
      stops++
      if (await page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.testid === 'to-first-candidate')) {
        await page.keyboard.press('Enter')
      }
      reached = await inFirstRow()
    }
    expect(reached).toBe(true)
    expect(stops).toBeLessThanOrEqual(2)
    expect(await page.getByTestId('safety-note').count()).toBe(1)
    await screenshot(page, 'parts-1280')
    expect(problems).toEqual([])
  })
})
