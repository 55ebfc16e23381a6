// Helpers for tests against the built server that `npm test` starts (STRATAVOLT_TEST_URL).
import { readFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Role } from '../../shared/roles'

export const baseUrl = process.env.STRATAVOLT_TEST_URL ?? 'http://127.0.0.1:3100'
export const mailboxDir = process.env.STRATAVOLT_TEST_MAILBOX ?? ''
export const demoPassword = JSON.parse(readFileSync(new URL('../../server/db/demo-accounts.json', import.meta.url), 'utf8')).password as string

export const demoEmail: Record<Role, string> = {
  'admin': 'admin@example.com',
  'design-engineer': 'engineer@example.com',
  'component-engineer': 'components@example.com',
  'purchasing': 'purchasing@example.com',
  'viewer': 'viewer@example.com',
}

/** fetch, tried once more when a kept-alive socket was closed by the server just as it was reused. */
async function fetchWithRetry(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init)
  }
  catch (err) {
    const code = (err as { cause?: { code?: string } }).cause?.code
    if (code !== 'ECONNRESET' && code !== 'UND_ERR_SOCKET') throw err
    return fetch(url, init)
  }
}

export interface Client {
  cookie: string
  request: (method: string, path: string, body?: unknown, headers?: Record<string, string>) => Promise<Response>
  json: <T = any>(method: string, path: string, body?: unknown) => Promise<{ status: number, body: T }>
}

/** A client of the test server, or of another instance at `base` (the two-instance test). */
export function client(cookie = '', base = baseUrl): Client {
  const c: Client = {
    cookie,
    async request(method, path, body, headers = {}) {
      // State changes must name our origin, as a browser does (CSRF rule); a test may override or
      // drop it by passing `origin` ('' = no Origin header).
      const h: Record<string, string> = { origin: base, ...headers }
      if (h.origin === '') delete h.origin
      if (c.cookie) h.cookie = c.cookie
      let payload: BodyInit | undefined
      if (body !== undefined) {
        if (typeof body === 'string' || body instanceof Uint8Array || body instanceof FormData) payload = body as BodyInit
        else { payload = JSON.stringify(body); h['content-type'] = 'application/json' }
      }
      const r = await fetchWithRetry(base + path, { method, headers: h, body: payload, redirect: 'manual' })
      const set = r.headers.getSetCookie()
      if (set.length) c.cookie = set.map(s => s.split(';')[0]).join('; ')
      return r
    },
    async json(method, path, body) {
      const r = await c.request(method, path, body)
      const text = await r.text()
      let parsed: unknown = text
      try { parsed = JSON.parse(text) }
      catch { /* not JSON */ }
      return { status: r.status, body: parsed as any }
    },
  }
  return c
}

export async function signIn(email: string, password = demoPassword, base = baseUrl): Promise<Client> {
  const c = client('', base)
  const r = await c.json('POST', '/api/auth/login', { email, password })
  if (r.status !== 200) throw new Error(`sign-in as ${email} answered ${r.status}: ${JSON.stringify(r.body)}`)
  return c
}

export const signInAs = (role: Role) => signIn(demoEmail[role])

export interface StoredMail { id: string, to: string[], subject: string, text: string, attachments: { filename: string, contentType: string, size: number, contentBase64: string }[] }

/** Waits for a message to `to` whose subject contains `subject` in the fake SMTP server's mailbox. */
export async function waitForMail(to: string, subject: string, timeoutMs = 10000): Promise<StoredMail> {
  const start = Date.now()
  while (Date.now() - start < timeoutMs) {
    let names: string[] = []
    try { names = readdirSync(mailboxDir).filter(n => n.endsWith('.json')).sort().reverse() }
    catch { /* not yet */ }
    for (const n of names) {
      const m = JSON.parse(readFileSync(join(mailboxDir, n), 'utf8')) as StoredMail
      if (m.to.includes(to) && m.subject.includes(subject)) return m
    }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`no mail to ${to} about "${subject}" within ${timeoutMs} ms`)
}

export function linkIn(text: string): string {
  const m = text.match(/https?:\/\/\S+/)
  if (!m) throw new Error('no link in the message')
  return m[0]
}

export const unique = (prefix: string) => `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`
