import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { demoEmail, signInAs } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

// Issue 14 items 2–4 in Chromium: the quantity input in the operating-point table per locale, the out-of-date
// marker, a role change seen in another person's open tab, and a disabled account's tab sent to sign-in.

async function type(page: Page, label: string, text: string) {
  const field = page.getByLabel(label)
  await field.fill(text)
  await field.press('Enter')
  return field
}

describe('daily use in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('operating-point table (en-GB): "0.69 kV" is 690 V, a voltage in the current column is refused and marks the results out of date', async () => {
    const page = await newPage(browser, 1280, 'en-GB')
    await signInPage(page, 'design-engineer')
    await page.goto('/designs/new')
    await page.locator('tr[data-position="Dc1+"]').first().waitFor()
    expect(await page.getByTestId('out-of-date').count()).toBe(0)

    const voltage = await type(page, 'Line voltage of Rated motoring', '0.69 kV')
    await expect.poll(() => voltage.inputValue()).toBe('690 V')
    const current = await type(page, 'Phase current of Rated motoring', '0.69 kV')
    await page.getByText('"0.69 kV" is a voltage, not a current').waitFor()
    expect(await current.inputValue()).toBe('0.69 kV')
    await page.getByTestId('out-of-date').waitFor()
    expect(await page.getByTestId('results').getAttribute('data-out-of-date')).toBe('true')
    await screenshot(page, 'daily-use-refused-current')

    await type(page, 'Phase current of Rated motoring', '0.4k')
    await expect.poll(() => current.inputValue()).toBe('400 A')
    await expect.poll(() => page.getByTestId('out-of-date').count()).toBe(0)

    // a power factor out of range is refused in the field, never sent
    await type(page, 'Power factor of Rated motoring', '1.2')
    await page.getByText('Power factor of Rated motoring must be at most 1').waitFor()
    await type(page, 'Power factor of Rated motoring', '0.86')
    await expect.poll(() => page.getByTestId('out-of-date').count()).toBe(0)
    await page.context().close()
  })

  for (const [locale, accepted, refused, shown] of [
    ['de-DE', '4,5 kHz', '4.5 kHz', '4,5 kHz'],
    ['sv-SE', '4,5 kHz', '4.5 kHz', '4,5 kHz'],
    ['en-US', '4.5 kHz', '4,5 kHz', '4.5 kHz'],
    ['en-GB', '4.5k', '4,5 kHz', '4.5 kHz'],
  ] as const) {
    it(`switching frequency in ${locale}: "${accepted}" accepted, "${refused}" refused with the decimal mark to use`, async () => {
      const page = await newPage(browser, 1280, locale)
      await signInPage(page, 'design-engineer')
      await page.goto('/designs/new')
      await page.locator('tr[data-position="Dc1+"]').first().waitFor()
      // once the page is live it shows numbers in the browser's format (the DC link 1100 V)
      const comma = locale === 'de-DE' || locale === 'sv-SE'
      await expect.poll(() => page.getByLabel('DC link, nominal').inputValue()).toBe(comma ? '1,1 kV' : '1.1 kV')
      const field = await type(page, 'Switching frequency [Hz]', refused)
      await page.getByText(`your number format (${locale}) uses "${comma ? ',' : '.'}"`).waitFor()
      await type(page, 'Switching frequency [Hz]', accepted)
      await expect.poll(() => field.inputValue()).toBe(shown)
      await expect.poll(() => page.getByTestId('out-of-date').count()).toBe(0)
      await page.context().close()
    })
  }

  it('a role change shows in the other person\'s open tab at the next navigation; disabling sends the tab to sign-in with a note', async () => {
    const admin = await signInAs('admin')
    const users = await admin.json<{ id: number, email: string }[]>('GET', '/api/admin/users')
    const viewer = users.body.find(u => u.email === demoEmail.viewer)!
    const page = await newPage(browser)
    await signInPage(page, 'viewer')
    const nav = page.getByRole('navigation', { name: 'Main' })
    await nav.getByRole('link', { name: 'Designs' }).waitFor()
    expect(await nav.getByRole('link', { name: 'Parts catalogue' }).count()).toBe(0)
    try {
      expect((await admin.json('PATCH', `/api/admin/users/${viewer.id}`, { role: 'component-engineer' })).status).toBe(200)
      await nav.getByRole('link', { name: 'Designs' }).click()
      await page.waitForURL(/\/designs$/)
      await nav.getByRole('link', { name: 'Parts catalogue' }).waitFor()
      expect(await nav.getByRole('link', { name: 'Bills of materials' }).count()).toBe(0)
      await screenshot(page, 'daily-use-role-changed')

      // back to viewer: a page the role may no longer open is left for home, at once
      expect((await admin.json('PATCH', `/api/admin/users/${viewer.id}`, { role: 'viewer' })).status).toBe(200)
      await nav.getByRole('link', { name: 'Parts catalogue' }).click()
      await page.waitForURL(url => url.pathname === '/' && url.searchParams.get('denied') === '/catalog')
      await expect.poll(() => nav.getByRole('link', { name: 'Parts catalogue' }).count()).toBe(0)

      expect((await admin.json('PATCH', `/api/admin/users/${viewer.id}`, { disabled: true })).status).toBe(200)
      await nav.getByRole('link', { name: 'Designs' }).click()
      await page.waitForURL(url => url.pathname === '/sign-in' && url.searchParams.get('ended') === 'disabled')
      await page.getByTestId('session-ended').getByText('Your account has been disabled').waitFor()

      // the right password of a disabled account is told so; a wrong one is not
      await page.getByLabel('E-mail').fill(demoEmail.viewer)
      await page.getByLabel('Password').fill('not the password at all')
      await page.getByRole('button', { name: 'Sign in' }).click()
      await page.getByText('Wrong e-mail or password.').waitFor()
      await page.getByLabel('Password').fill((await import('../support/api')).demoPassword)
      await page.getByRole('button', { name: 'Sign in' }).click()
      await page.getByText('Your account is disabled. Ask an administrator to enable it.').waitFor()
    }
    finally {
      await admin.json('PATCH', `/api/admin/users/${viewer.id}`, { role: 'viewer', disabled: false })
      await page.context().close()
    }
  })
})
