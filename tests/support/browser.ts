// Debian's Chromium driven by playwright-core; screenshots go to test-results/ (not committed).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser, type Page } from 'playwright-core'
import { baseUrl, demoEmail, demoPassword } from './api'
import type { Role } from '../../shared/roles'

export const artifactsDir = new URL('../../test-results/', import.meta.url).pathname

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
  })
}

export async function newPage(browser: Browser, width = 1280, locale = 'en-GB'): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width, height: 900 }, acceptDownloads: true, locale })
  const page = await context.newPage()
  // The app must never reach outside this machine.
  await page.route(url => !url.toString().startsWith(baseUrl) && !url.toString().startsWith('data:') && !url.toString().startsWith('blob:'), route => route.abort())
  return page
}

export async function signInPage(page: Page, role: Role) {
  await page.goto('/sign-in')
  await page.getByLabel('E-mail').fill(demoEmail[role])
  await page.getByLabel('Password').fill(demoPassword)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/sign-in'))
  // the client-side navigation finishes when the signed-in layout is on screen
  await page.locator('main#main').waitFor()
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(artifactsDir, { recursive: true })
  await page.screenshot({ path: `${artifactsDir}${name}.png`, fullPage: true })
}
