// Sessions and one-time links, probed as an attacker would: copied cookies after sign-out, old
// reset / invitation links, lower-role re-invitations, mail bombing through /forgot, timing that
// tells known from unknown addresses, and lockouts of someone else's account.
import { describe, expect, it } from 'vitest'
import { client, demoEmail, linkIn, signIn, signInAs, unique, waitForMail, type Client } from '../support/api'
import { freshAddress, requestFrom } from '../support/from-address'

const tokenOf = (text: string) => new URL(linkIn(text)).searchParams.get('token')!

/** An invited colleague who has set a password. */
async function member(role: 'viewer' | 'design-engineer' = 'viewer') {
  const admin = await signInAs('admin')
  const email = `${unique('member')}@example.com`
  const { body } = await admin.json('POST', '/api/admin/users', { email, name: 'Sam Member', role })
  const mail = await waitForMail(email, 'invited')
  const password = 'member-password-123'
  expect((await client().json('POST', '/api/auth/set-password', { token: tokenOf(mail.text), password })).status).toBe(200)
  return { id: body.id as number, email, password, admin }
}

/** Waits for the newest mail to `to` whose link differs from `notToken`. */
async function nextLinkMail(to: string, subject: string, notToken?: string) {
  const start = Date.now()
  while (Date.now() - start < 10000) {
    const m = await waitForMail(to, subject)
    const t = tokenOf(m.text)
    if (t !== notToken) return t
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('no newer mail')
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

describe('sessions end server-side', () => {
  it('sign-out ends the session: a copy of the old cookie is refused', async () => {
    const m = await member()
    const c = await signIn(m.email, m.password)
    const copy: Client = client(c.cookie)
    expect((await copy.json('GET', '/api/auth/me')).status).toBe(200)
    expect((await c.json('POST', '/api/auth/logout')).status).toBe(200)
    expect((await copy.json('GET', '/api/auth/me')).status).toBe(401)
  })

  it('a password reset ends the other sessions', async () => {
    const m = await member()
    const other = await signIn(m.email, m.password)
    expect((await client().json('POST', '/api/auth/forgot', { email: m.email })).status).toBe(200)
    const token = await nextLinkMail(m.email, 'reset')
    expect((await client().json('POST', '/api/auth/set-password', { token, password: 'brand-new-password-1' })).status).toBe(200)
    expect((await other.json('GET', '/api/auth/me')).status).toBe(401)
  })
})

describe('one-time links', () => {
  it('a newer reset link revokes the older one', async () => {
    const m = await member()
    await client().json('POST', '/api/auth/forgot', { email: m.email })
    const first = await nextLinkMail(m.email, 'reset')
    await client().json('POST', '/api/auth/forgot', { email: m.email })
    const second = await nextLinkMail(m.email, 'reset', first)
    expect((await client().json('POST', '/api/auth/set-password', { token: first, password: 'older-link-password' })).status).toBe(410)
    expect((await client().json('POST', '/api/auth/set-password', { token: second, password: 'newer-link-password' })).status).toBe(200)
  })

  it('re-inviting a pending invitee with a lower role: the new link signs in with the new role, the old link is dead, audited', async () => {
    const admin = await signInAs('admin')
    const email = `${unique('reinvite')}@example.com`
    expect((await admin.json('POST', '/api/admin/users', { email, name: 'Rita Reinvite', role: 'design-engineer' })).status).toBe(201)
    const first = await nextLinkMail(email, 'invited')
    expect((await admin.json('POST', '/api/admin/users', { email, name: 'Rita Reinvite', role: 'viewer' })).status).toBe(201)
    const second = await nextLinkMail(email, 'invited', first)
    expect((await client().json('POST', '/api/auth/set-password', { token: first, password: 'first-link-password' })).status).toBe(410)
    const invitee = client()
    expect((await invitee.json('POST', '/api/auth/set-password', { token: second, password: 'second-link-password' })).status).toBe(200)
    expect((await invitee.json('GET', '/api/auth/me')).body.user.role).toBe('viewer')
    const audit = await admin.json('GET', `/api/admin/audit?q=${encodeURIComponent(email)}`)
    const change = audit.body.rows.find((a: { action: string }) => a.action === 'role changed')
    expect(change?.details).toMatchObject({ from: 'design-engineer', to: 'viewer' })
  })
})

describe('throttling and timing', () => {
  it('throttles /forgot per address (from any client) and per client (any address)', async () => {
    const email = `${unique('bombed')}@example.com`
    const perAddress: number[] = []
    for (let i = 0; i < 5; i++) perAddress.push((await requestFrom(freshAddress(), 'POST', '/api/auth/forgot', { email })).status)
    expect(perAddress.slice(0, 3)).toEqual([200, 200, 200])
    expect(perAddress.slice(3)).toEqual([429, 429])
    const from = freshAddress()
    const perClient: number[] = []
    for (let i = 0; i < 12; i++) perClient.push((await requestFrom(from, 'POST', '/api/auth/forgot', { email: `${unique('spray')}@example.com` })).status)
    expect(perClient.filter(s => s === 200)).toHaveLength(10)
    expect(perClient.slice(10)).toEqual([429, 429])
    const r = await requestFrom(from, 'POST', '/api/auth/forgot', { email: `${unique('spray')}@example.com` })
    expect(Number(r.headers['retry-after'])).toBeGreaterThan(0)
  })

  it('sign-in takes as long for an unknown address as for a known one', async () => {
    const known: number[] = []
    const unknown: number[] = []
    for (let i = 0; i < 7; i++) {
      known.push((await requestFrom(freshAddress(), 'POST', '/api/auth/login', { email: demoEmail.viewer, password: `wrong-${i}` })).ms)
      unknown.push((await requestFrom(freshAddress(), 'POST', '/api/auth/login', { email: `${unique('ghost')}@example.com`, password: `wrong-${i}` })).ms)
    }
    const [k, u] = [median(known), median(unknown)]
    // same work on both paths (one password hash check); the bound allows for a loaded machine
    expect(Math.abs(k - u), `known ${k.toFixed(1)} ms, unknown ${u.toFixed(1)} ms`).toBeLessThan(0.35 * Math.max(k, u) + 10)
  })

  it('/forgot takes as long for an unknown address as for a known one', async () => {
    const known: number[] = []
    const unknown: number[] = []
    for (const role of ['viewer', 'purchasing', 'component-engineer', 'design-engineer', 'admin'] as const) {
      known.push((await requestFrom(freshAddress(), 'POST', '/api/auth/forgot', { email: demoEmail[role] })).ms)
      unknown.push((await requestFrom(freshAddress(), 'POST', '/api/auth/forgot', { email: `${unique('ghost')}@example.com` })).ms)
    }
    const [k, u] = [median(known), median(unknown)]
    expect(Math.abs(k - u), `known ${k.toFixed(1)} ms, unknown ${u.toFixed(1)} ms`).toBeLessThan(0.35 * Math.max(k, u) + 10)
  })

  it('a lockout holds for that account from that client only, and a reset link still lets the owner in', async () => {
    const m = await member()
    const stranger = freshAddress()
    const tries: number[] = []
    for (let i = 0; i < 6; i++) tries.push((await requestFrom(stranger, 'POST', '/api/auth/login', { email: m.email, password: `guess-${i}` })).status)
    expect(tries).toEqual([401, 401, 401, 401, 401, 429])
    // even the right password waits, from the stranger's client
    expect((await requestFrom(stranger, 'POST', '/api/auth/login', { email: m.email, password: m.password })).status).toBe(429)
    // the owner, elsewhere, is not locked out
    expect((await requestFrom(freshAddress(), 'POST', '/api/auth/login', { email: m.email, password: m.password })).status).toBe(200)
    // and a reset link lifts the lockout for every client
    await requestFrom(freshAddress(), 'POST', '/api/auth/forgot', { email: m.email })
    const token = await nextLinkMail(m.email, 'reset')
    expect((await requestFrom(stranger, 'POST', '/api/auth/set-password', { token, password: 'after-lockout-password' })).status).toBe(200)
    expect((await requestFrom(stranger, 'POST', '/api/auth/login', { email: m.email, password: 'after-lockout-password' })).status).toBe(200)
  })

  it('tells a disabled account it is disabled, only after the right password', async () => {
    const m = await member()
    expect((await m.admin.json('PATCH', `/api/admin/users/${m.id}`, { disabled: true })).status).toBe(200)
    const wrong = await requestFrom(freshAddress(), 'POST', '/api/auth/login', { email: m.email, password: 'not-the-password' })
    expect(wrong.status).toBe(401)
    expect(wrong.body.message).toBe('Wrong e-mail or password.')
    const right = await requestFrom(freshAddress(), 'POST', '/api/auth/login', { email: m.email, password: m.password })
    expect(right.status).toBe(403)
    expect(right.body.message).toContain('disabled')
  })
})
