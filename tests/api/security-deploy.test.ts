// Production defaults: a server pointed at an operator's own (empty) database adds no demo data
// and publishes no password; the first administrator comes from NUXT_ADMIN_EMAIL; the session
// cookie's Secure flag follows the deployment (https app URL: on; plain http: off; forced by
// NUXT_COOKIE_SECURE). Servers from the test build, on the empty test database.
import { spawn, type ChildProcess } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { createServer } from 'node:net'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { demoPassword } from '../support/api'

const root = new URL('../../', import.meta.url).pathname
const emptyDb = process.env.STRATAVOLT_TEST_EMPTY_DATABASE_URL ?? ''
const started: ChildProcess[] = []

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port
      s.close(() => resolve(port))
    })
  })
}

/** Starts a server from the test build; resolves with its URL and everything it logged. */
async function startServer(env: Record<string, string>) {
  const port = await freePort()
  const base = `http://127.0.0.1:${port}`
  const secrets = JSON.parse(readFileSync(join(root, '.data', 'secrets.json'), 'utf8'))
  let log = ''
  const child = spawn(process.execPath, [join(root, '.output-test', 'server', 'index.mjs')], {
    // NUXT_SEED_DEMO is not passed on: the server's own default decides
    env: { PATH: process.env.PATH ?? '', NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), NUXT_DATABASE_URL: emptyDb, NUXT_SESSION_PASSWORD: secrets.sessionPassword, NUXT_SMTP_PORT: '1', NUXT_APP_URL: base, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  started.push(child)
  child.stdout!.on('data', (d) => { log += d })
  child.stderr!.on('data', (d) => { log += d })
  const t0 = Date.now()
  while (Date.now() - t0 < 60000) {
    try { if ((await fetch(`${base}/api/health`)).status === 200) break }
    catch { /* not yet */ }
    await new Promise(r => setTimeout(r, 250))
  }
  return { base, log: () => log }
}

const login = (base: string, email: string, password: string) => fetch(`${base}/api/auth/login`, {
  method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password }),
})

/** Whether a Set-Cookie header carries the Secure attribute. */
const secure = (r: Response) => r.headers.getSetCookie().some(c => c.split(';').slice(1).some(a => a.trim().toLowerCase() === 'secure'))

afterAll(() => { for (const c of started) c.kill('SIGTERM') })

describe('production defaults', () => {
  it('an own database gets no demo data; the first admin is invited from NUXT_ADMIN_EMAIL; plain http: no Secure cookie', async () => {
    const s = await startServer({ NUXT_ADMIN_EMAIL: 'first-admin@example.com' })
    expect((await login(s.base, 'admin@example.com', demoPassword)).status).toBe(401)
    const link = s.log().match(/first administrator first-admin@example\.com created: set the password at (\S+)/)
    expect(link, s.log()).toBeTruthy()
    const token = new URL(link![1]!).searchParams.get('token')
    const set = await fetch(`${s.base}/api/auth/set-password`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': s.base }, body: JSON.stringify({ token, password: 'first-admin-password' }) })
    expect(set.status).toBe(200)
    expect((await set.json()).user.role).toBe('admin')
    expect(set.headers.getSetCookie().join(';').toLowerCase()).toContain('httponly')
    expect(secure(set)).toBe(false)
    // no demo designs or catalogue either
    const c = set.headers.getSetCookie().map(x => x.split(';')[0]).join('; ')
    expect(await (await fetch(`${s.base}/api/designs`, { headers: { cookie: c } })).json()).toEqual([])
    expect((await (await fetch(`${s.base}/api/catalog/parts`, { headers: { cookie: c } })).json()).total).toBe(0)
  })

  it('behind TLS (https app URL) the session cookie is Secure; NUXT_COOKIE_SECURE=false turns it off', async () => {
    const tls = await startServer({ NUXT_APP_URL: 'https://stratavolt.example.net' })
    // the Origin check compares with the Host this request names
    const r = await fetch(`${tls.base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': tls.base }, body: JSON.stringify({ email: 'first-admin@example.com', password: 'first-admin-password' }) })
    expect(r.status).toBe(200)
    expect(secure(r)).toBe(true)
    const plain = await startServer({ NUXT_APP_URL: 'https://stratavolt.example.net', NUXT_COOKIE_SECURE: 'false' })
    const r2 = await login(plain.base, 'first-admin@example.com', 'first-admin-password')
    expect(r2.status).toBe(200)
    expect(secure(r2)).toBe(false)
  })
})
