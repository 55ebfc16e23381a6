// PostgreSQL unreachable while the app runs: every route answers 503 "the database is unavailable,
// try again" (not "Server Error"), the health route names the dependency that is down, and the
// app recovers on its own when the database is back. A second server from the test build talks
// to the test database through a TCP relay this test cuts and restores.
import { spawn, type ChildProcess } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { createServer, Socket as NetSocket, type Server, type Socket } from 'node:net'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoPassword } from '../support/api'

const root = new URL('../../', import.meta.url).pathname
const databaseUrl = new URL(process.env.STRATAVOLT_TEST_DATABASE_URL ?? 'postgres://x@127.0.0.1:1/x')

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port
      s.close(() => resolve(port))
    })
  })
}

/** A TCP relay to PostgreSQL that can be cut (connections dropped, new ones refused) and restored. */
class Relay {
  server: Server | null = null
  sockets = new Set<Socket>()
  constructor(public port: number) {}
  open() {
    return new Promise<void>((resolve) => {
      this.server = createServer((inbound) => {
        const outbound = new NetSocket()
        outbound.connect(Number(databaseUrl.port), databaseUrl.hostname)
        for (const s of [inbound, outbound]) { this.sockets.add(s); s.on('close', () => this.sockets.delete(s)); s.on('error', () => s.destroy()) }
        inbound.pipe(outbound).pipe(inbound)
      }).listen(this.port, '127.0.0.1', () => resolve())
    })
  }

  cut() {
    return new Promise<void>((resolve) => {
      for (const s of this.sockets) s.destroy()
      this.sockets.clear()
      if (!this.server) return resolve()
      this.server.close(() => resolve())
      this.server = null
    })
  }
}

let server: ChildProcess
let relay: Relay
let base = ''
let cookie = ''

async function waitUntil(check: () => Promise<boolean>, ms: number) {
  const start = Date.now()
  while (Date.now() - start < ms) {
    if (await check().catch(() => false)) return
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`not within ${ms} ms`)
}

const post = (path: string, body: unknown, extra: Record<string, string> = {}) => fetch(base + path, {
  method: 'POST', headers: { 'content-type': 'application/json', 'origin': base, ...extra }, body: JSON.stringify(body),
})

describe('database unreachable', () => {
  beforeAll(async () => {
    relay = new Relay(await freePort())
    await relay.open()
    const port = await freePort()
    const closedSmtpPort = await freePort()
    base = `http://127.0.0.1:${port}`
    const url = new URL(databaseUrl)
    url.port = String(relay.port)
    const secrets = JSON.parse(readFileSync(join(root, '.data', 'secrets.json'), 'utf8'))
    server = spawn(process.execPath, [join(root, '.output-test', 'server', 'index.mjs')], {
      env: {
        ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), NUXT_DATABASE_URL: url.toString(),
        NUXT_SESSION_PASSWORD: secrets.sessionPassword, NUXT_APP_URL: base, NUXT_SMTP_HOST: '127.0.0.1', NUXT_SMTP_PORT: String(closedSmtpPort),
      },
      stdio: 'ignore',
    })
    await waitUntil(async () => (await fetch(`${base}/api/health`)).status < 600, 60000)
    const r = await post('/api/auth/login', { email: 'viewer@example.com', password: demoPassword })
    expect(r.status).toBe(200)
    cookie = r.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  })
  afterAll(async () => {
    server?.kill('SIGTERM')
    await relay?.cut()
  })

  it('health names the mail server as down (degraded, 200) while the database is up', async () => {
    const r = await fetch(`${base}/api/health`)
    expect(r.status).toBe(200)
    expect(await r.json()).toMatchObject({ ok: false, status: 'degraded', db: { status: 'up' }, mail: { status: 'down' } })
  })

  it('answers 503 "the database is unavailable, try again" on every kind of route, then recovers', async () => {
    // a check that just succeeded (health answers from it for up to 1 s) must not hide the cut that follows
    expect((await fetch(`${base}/api/health`)).status).toBe(200)
    await relay.cut()
    const health = await fetch(`${base}/api/health`)
    expect(health.status).toBe(503)
    expect(await health.json()).toMatchObject({ ok: false, status: 'down', db: { status: 'down' } })
    const calls = [
      fetch(`${base}/api/designs`, { headers: { cookie } }),
      fetch(`${base}/api/auth/me`, { headers: { cookie } }),
      post('/api/auth/login', { email: 'viewer@example.com', password: demoPassword }),
      post('/api/auth/forgot', { email: 'viewer@example.com' }),
      post('/api/v1/stress', { topology: 'two-level' }, { cookie }),
    ]
    for (const r of await Promise.all(calls)) {
      expect(r.status, r.url).toBe(503)
      expect(r.headers.get('retry-after')).toBeTruthy()
      expect((await r.json()).message).toMatch(/database is unavailable, try again/i)
    }
    await relay.open()
    await waitUntil(async () => (await fetch(`${base}/api/health`)).status === 200, 20000)
    const designs = await fetch(`${base}/api/designs`, { headers: { cookie } })
    expect(designs.status).toBe(200)
  })
})
