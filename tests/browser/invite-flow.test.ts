import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { linkIn, unique, waitForMail } from '../support/api'
import { launch, newPage, screenshot, signInPage } from '../support/browser'

describe('invitation flow in Chromium', () => {
  let browser: Browser
  beforeAll(async () => { browser = await launch() })
  afterAll(async () => { await browser?.close() })

  it('admin invites, the colleague sets a password from the mailed link and signs in', async () => {
    const admin = await newPage(browser)
    await signInPage(admin, 'admin')
    await screenshot(admin, 'home-admin')
    await admin.getByRole('link', { name: 'People' }).first().click()
    await admin.waitForURL('**/admin/users')
    const email = `${unique('browser-invitee')}@example.com`
    await admin.getByLabel('E-mail').fill(email)
    await admin.getByLabel('Name').fill('Bea Browser')
    await admin.getByLabel('Role', { exact: true }).selectOption('component-engineer')
    await admin.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => admin.getByRole('status').textContent()).toContain(`Invitation sent to ${email}`)
    await screenshot(admin, 'people')

    // The admin reads the message on the outgoing-mail page.
    await admin.goto('/admin/mail')
    await admin.getByRole('button', { name: /You are invited to Stratavolt/ }).first().click()
    await expect.poll(() => admin.getByTestId('mail-body').textContent()).toContain('/set-password?token=')

    const mail = await waitForMail(email, 'invited')
    const invitee = await newPage(browser)
    await invitee.goto(new URL(linkIn(mail.text)).pathname + new URL(linkIn(mail.text)).search)
    await invitee.getByLabel('New password').fill('short')
    await invitee.getByLabel('Repeat it').fill('short')
    await invitee.getByRole('button', { name: /Save password/ }).click()
    await expect.poll(() => invitee.locator('#password-error').textContent()).toContain('at least 10')
    await invitee.getByLabel('New password').fill('browser-password-1')
    await invitee.getByLabel('Repeat it').fill('browser-password-1')
    await invitee.getByRole('button', { name: /Save password/ }).click()
    await invitee.waitForURL(url => url.pathname === '/')
    await expect.poll(() => invitee.locator('main h1').textContent()).toContain('Bea')
    await expect.poll(() => invitee.getByRole('link', { name: 'Parts catalogue' }).count()).toBeGreaterThan(0)
    expect(await invitee.getByRole('link', { name: 'People' }).count()).toBe(0)

    // Sign out and in again with the new password.
    await invitee.getByRole('button', { name: 'Sign out' }).click()
    await invitee.waitForURL('**/sign-in')
    await invitee.getByLabel('E-mail').fill(email)
    await invitee.getByLabel('Password').fill('browser-password-1')
    await invitee.getByRole('button', { name: 'Sign in' }).click()
    await invitee.waitForURL(url => url.pathname === '/')
  })

  it('shows the field error beside the field for a bad sign-in', async () => {
    const page = await newPage(browser)
    await page.goto('/sign-in')
    await page.getByLabel('E-mail').fill('not-an-address')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.locator('#email-error').textContent()).toContain('valid e-mail')
    await page.getByLabel('E-mail').fill('viewer@example.com')
    await page.getByLabel('Password').fill('wrong-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.getByRole('alert').textContent()).toContain('Wrong e-mail or password')
    await screenshot(page, 'sign-in-error')
  })
})
