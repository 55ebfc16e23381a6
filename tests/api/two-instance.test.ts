// Two more instances of the built server on the test database (own ports), to prove that no
// correctness-relevant state lives in one process: pending imports, the catalogue seen by matching,
// sessions and sign-in throttling are shared through PostgreSQL and the shared upload storage.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, openSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CATALOG_COLUMNS } from '../../catalog/columns'
import { readSecrets, root } from '../../scripts/lib.mjs'
import { client, demoEmail, linkIn, signIn, unique, waitForMail, type Client } from '../support/api'

const testPort = Number(process.env.STRATAVOLT_TEST_PORT ?? 3100)
const ports = [testPort + 1, testPort + 2]
const [A, B] = ports.map(p => `http://127.0.0.1:${p}`) as [string, string]
// the build the test server runs (npm test builds into .output-test when it has its own folder)
const entry = process.env.STRATAVOLT_TEST_SERVER_ENTRY
  ?? [join(root, '.output-test', 'server', 'index.mjs'), join(root, '.output', 'server', 'index.mjs')].find(p => existsSync(p))
  ?? join(root, '.output', 'server', 'index.mjs')
const children: ChildProcess[] = []

async function waitForHealth(base: string, child: ChildProcess, timeoutMs = 60000) {
  const start = Date.now()
  while (Date.now() - start < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`the instance on ${base} exited with ${child.exitCode} (see .data/two-instance-*.log)`)
    try {
      if ((await fetch(`${base}/api/health`)).status === 200) return
    }
    catch { /* not yet listening */ }
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`${base} did not answer within ${timeoutMs / 1000} s`)
}

beforeAll(async () => {
  const databaseUrl = process.env.STRATAVOLT_TEST_DATABASE_URL
  if (!databaseUrl) throw new Error('STRATAVOLT_TEST_DATABASE_URL is not set: run this file through `npm test -- tests/api/two-instance.test.ts`')
  if (!existsSync(entry)) throw new Error(`no built server at ${entry}`)
  for (const port of ports) {
    const out = openSync(join(root, '.data', `two-instance-${port}.log`), 'w')
    children.push(spawn(process.execPath, [entry], {
      cwd: root,
      stdio: ['ignore', out, out],
      env: {
        ...process.env,
        NODE_ENV: 'production',
        HOST: '127.0.0.1',
        PORT: String(port),
        NUXT_DATABASE_URL: databaseUrl,
        NUXT_SESSION_PASSWORD: readSecrets().sessionPassword,
        NUXT_APP_URL: `http://127.0.0.1:${port}`,
        NUXT_SMTP_HOST: '127.0.0.1',
        NUXT_SMTP_PORT: process.env.STRATAVOLT_TEST_SMTP_PORT ?? '2626',
        // the test server has seeded the database already; these instances only serve
        NUXT_SEED_DEMO: 'false',
        // B works no queued jobs: what is committed through B is worked by another instance
        ...(port === ports[1] ? { STRATAVOLT_QUEUE_WORKERS: '0' } : {}),
      },
    }))
  }
  await Promise.all([waitForHealth(A, children[0]!), waitForHealth(B, children[1]!)])
}, 90000)

afterAll(() => {
  for (const c of children) c.kill('SIGTERM')
})

const on = (c: Client, base: string) => client(c.cookie, base)

/** A one-row template-shaped CSV: a capacitor needs only the columns below. */
function capacitorCsv(partNumber: string) {
  const values: Record<string, string> = {
    partNumber, manufacturer: 'Kestrel Capacitors', kind: 'capacitor', voltageRating: '1300',
    capacitance: '0.0012', rippleCurrentRating: '95', priceBreaks: '1:51.00', currency: 'EUR', stock: '40',
  }
  const header = CATALOG_COLUMNS.map(c => c.header)
  const row = CATALOG_COLUMNS.map(c => values[c.key] ?? '')
  return [header, row].map(r => r.map(v => `"${v.replace(/"/g, '""')}"`).join(',')).join('\r\n') + '\r\n'
}

describe('two instances on one database', () => {
  it('an import uploaded and previewed on one instance commits on the other (a queue worker of another instance does the commit)', async () => {
    const onA = await signIn(demoEmail['component-engineer'], undefined, A)
    const onB = on(onA, B)
    const partNumber = unique('TWO-CAP')
    const form = new FormData()
    form.append('file', new Blob([capacitorCsv(partNumber)]), `${partNumber}.csv`)
    const up = await onA.request('POST', '/api/catalog/imports', form)
    const uploaded = await up.json() as any
    expect(up.status, JSON.stringify(uploaded).slice(0, 500)).toBe(201)
    expect(uploaded.preview).toMatchObject({ rowsWithErrors: 0, validParts: 1 })
    const id = uploaded.import.id as number

    const shown = await onB.json('GET', `/api/catalog/imports/${id}`)
    expect(shown.status).toBe(200)
    expect(shown.body.preview.validParts).toBe(1)
    const previewed = await onB.json('POST', `/api/catalog/imports/${id}/preview`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
    expect(previewed.status).toBe(200)
    const committed = await onB.json('POST', `/api/catalog/imports/${id}/commit`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
    expect(committed.status, JSON.stringify(committed.body)).toBe(200)
    expect(committed.body).toMatchObject({ added: 1 })
    // the other instance sees it committed at once (and refuses a second commit)
    const again = await onA.json('POST', `/api/catalog/imports/${id}/commit`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
    expect(again.status).toBe(409)
    const parts = await onA.json('GET', `/api/catalog/parts?q=${encodeURIComponent(partNumber)}`)
    expect(parts.body.total).toBe(1)
  })

  it('a catalogue commit on one instance is seen by matching on the other at once', async () => {
    const components = await signIn(demoEmail['component-engineer'], undefined, A)
    const engineerB = await signIn(demoEmail['design-engineer'], undefined, B)
    const designs = await engineerB.json('GET', '/api/designs')
    expect(designs.status).toBe(200)
    const designId = (designs.body.rows ?? designs.body)[0].id as number
    // matching on B fills B's part cache
    const before = await engineerB.json('GET', `/api/designs/${designId}/parts`)
    expect(before.status).toBe(200)
    const position = before.body.positions.find((p: any) => p.candidates.length > 0)
    expect(position).toBeTruthy()
    const candidate = position.candidates[0]
    const [found] = (await components.json('GET', `/api/catalog/parts?q=${encodeURIComponent(candidate.part.partNumber)}`)).body.rows
    const stock = (before.body.parts[candidate.partVersionId].stock ?? 0) + 17
    // a part edit is a catalogue commit: a new catalogue version with a new version of this part
    const edit = await components.json('PATCH', `/api/catalog/parts/${found.id}`, { stock })
    expect(edit.status, JSON.stringify(edit.body)).toBe(200)
    const after = await engineerB.json('GET', `/api/designs/${designId}/parts`)
    const same = after.body.positions.find((p: any) => p.side === position.side && p.position === position.position)
    const now = same.candidates.find((c: any) => c.part.partNumber === candidate.part.partNumber && c.part.manufacturer === candidate.part.manufacturer)
    expect(now).toBeTruthy()
    expect(after.body.parts[now.partVersionId].stock).toBe(stock)
    expect(now.partVersionId).not.toBe(candidate.partVersionId)
  })

  it('a kept matching answer is sent again unchanged, and an import committed through the other instance replaces it', async () => {
    const components = await signIn(demoEmail['component-engineer'], undefined, A)
    const engineerB = await signIn(demoEmail['design-engineer'], undefined, B)
    const designs = await engineerB.json('GET', '/api/designs')
    const designId = (designs.body.rows ?? designs.body)[0].id as number
    const path = `/api/designs/${designId}/parts?show=all&limit=500`
    const get = async () => {
      const r = await engineerB.request('GET', path)
      expect(r.status).toBe(200)
      return { timing: r.headers.get('server-timing') ?? '', text: await r.text() }
    }
    // the first answer of this generation may be computed or kept; the next one is kept and byte for byte the same
    // (another test file may commit to the catalogue in between: then try again)
    let first = await get()
    let again = await get()
    for (let attempt = 0; attempt < 4 && !again.timing.includes('kept'); attempt++) {
      first = again
      again = await get()
    }
    expect(again.timing).toContain('kept')
    expect(again.text).toBe(first.text)
    // a capacitor that fits the design's DC link, imported through A (the queue worker commits it)
    const partNumber = unique('KEPT-CAP')
    const form = new FormData()
    form.append('file', new Blob([capacitorCsv(partNumber)]), `${partNumber}.csv`)
    const up = await components.request('POST', '/api/catalog/imports', form)
    const uploaded = await up.json() as any
    expect(up.status, JSON.stringify(uploaded).slice(0, 500)).toBe(201)
    const committed = await components.json('POST', `/api/catalog/imports/${uploaded.import.id}/commit`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
    expect(committed.status, JSON.stringify(committed.body)).toBe(200)
    // B matches the new catalogue at once: computed, and the new part is among the candidates
    const after = await get()
    expect(after.timing).not.toContain('kept')
    const listed = Object.values(JSON.parse(after.text).parts as Record<string, { partNumber: string }>).map(p => p.partNumber)
    expect(listed).toContain(partNumber)
    expect(Object.values(JSON.parse(first.text).parts as Record<string, { partNumber: string }>).map(p => p.partNumber)).not.toContain(partNumber)
  })

  it('a session signed out on one instance is refused on the other', async () => {
    const onA = await signIn(demoEmail.viewer, undefined, A)
    const stolen = onA.cookie
    expect((await client(stolen, B).json('GET', '/api/auth/me')).status).toBe(200)
    expect((await onA.json('POST', '/api/auth/logout')).status).toBe(200)
    expect((await client(stolen, B).json('GET', '/api/auth/me')).status).toBe(401)
  })

  it('disabling an account on one instance ends its session on the other, and a role change applies there at once', async () => {
    const admin = await signIn(demoEmail.admin, undefined, A)
    const email = `${unique('fleet')}@example.com`
    const invite = await admin.json('POST', '/api/admin/users', { email, name: 'Fleet Tester', role: 'viewer' })
    expect(invite.status).toBe(201)
    const token = new URL(linkIn((await waitForMail(email, 'invited')).text)).searchParams.get('token')
    expect((await client('', B).json('POST', '/api/auth/set-password', { token, password: 'fleet-password-1' })).status).toBe(200)
    const member = await signIn(email, 'fleet-password-1', B)
    expect((await member.json('GET', '/api/auth/me')).body.user.role).toBe('viewer')
    expect((await admin.json('PATCH', `/api/admin/users/${invite.body.id}`, { role: 'purchasing' })).status).toBe(200)
    expect((await member.json('GET', '/api/auth/me')).body.user.role).toBe('purchasing')
    expect((await admin.json('PATCH', `/api/admin/users/${invite.body.id}`, { disabled: true })).status).toBe(200)
    expect((await member.json('GET', '/api/auth/me')).status).toBe(401)
  })

  it('an API token revoked on one instance is refused on the other at once, though the other had just accepted it', async () => {
    const owner = await signIn(demoEmail['design-engineer'], undefined, A)
    const created = await owner.json('POST', '/api/tokens', { name: 'fleet cache' })
    expect(created.status).toBe(201)
    const stress = { topology: 'two-level', levels: 2, dcVoltage: 650, lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 6000, modulation: 'sine' }
    const call = (base: string) => fetch(`${base}/api/v1/stress`, { method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${created.body.token}` }, body: JSON.stringify(stress) })
    // B finds the owner once and may keep them for a few seconds: the revocation must still reach it
    expect((await call(B)).status).toBe(200)
    expect((await call(B)).status).toBe(200)
    expect((await owner.json('DELETE', `/api/tokens/${created.body.id}`)).status).toBe(200)
    expect((await call(B)).status).toBe(401)
    expect((await call(A)).status).toBe(401)
  })

  it('disabling an account on one instance refuses its API token on the other at once', async () => {
    const admin = await signIn(demoEmail.admin, undefined, A)
    const email = `${unique('fleet-token')}@example.com`
    const invite = await admin.json('POST', '/api/admin/users', { email, name: 'Fleet Token', role: 'design-engineer' })
    expect(invite.status).toBe(201)
    const linkToken = new URL(linkIn((await waitForMail(email, 'invited')).text)).searchParams.get('token')
    expect((await client('', A).json('POST', '/api/auth/set-password', { token: linkToken, password: 'fleet-password-2' })).status).toBe(200)
    const member = await signIn(email, 'fleet-password-2', A)
    const created = await member.json('POST', '/api/tokens', { name: 'fleet disable' })
    expect(created.status).toBe(201)
    const stress = { topology: 'two-level', levels: 2, dcVoltage: 650, lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 6000, modulation: 'sine' }
    const call = () => fetch(`${B}/api/v1/stress`, { method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${created.body.token}` }, body: JSON.stringify(stress) })
    expect((await call()).status).toBe(200)
    expect((await admin.json('PATCH', `/api/admin/users/${invite.body.id}`, { disabled: true })).status).toBe(200)
    expect((await call()).status).toBe(401)
  })

  it('both instances build the same matching index from one catalogue generation, once per generation however many requests ask', async () => {
    const components = await signIn(demoEmail['component-engineer'], undefined, A)
    const onA = await signIn(demoEmail['design-engineer'], undefined, A)
    const onB = await signIn(demoEmail['design-engineer'], undefined, B)
    const designs = (await onB.json('GET', '/api/designs')).body
    const designId = (designs.rows ?? designs)[0].id as number
    const held = async (base: string) => (await (await fetch(`${base}/api/health`)).json()).catalogue as { generation: number, digest: string, builds: number } | null
    // eight concurrent matchings per instance: each builds (at most) the one generation they all read
    const burst = (c: Client) => Promise.all(Array.from({ length: 8 }, () => c.json('GET', `/api/designs/${designId}/parts?limit=5`)))
    const settle = async () => {
      // other test files may commit to the catalogue meanwhile: retry until both hold the same generation
      for (let attempt = 0; attempt < 5; attempt++) {
        const answers = await Promise.all([burst(onA), burst(onB)])
        for (const r of answers.flat()) expect(r.status).toBe(200)
        const [a, b] = await Promise.all([held(A), held(B)])
        expect(a?.builds).toBe(1)
        expect(b?.builds).toBe(1)
        if (a!.generation === b!.generation) return [a!, b!] as const
      }
      throw new Error('the two instances never held the same generation')
    }
    const [a1, b1] = await settle()
    expect(a1.digest).toBe(b1.digest)
    // a catalogue commit on A (a part edit): matching on B sees the new generation, built once there too
    const [found] = (await components.json('GET', '/api/catalog/parts?pageSize=1')).body.rows
    const edit = await components.json('PATCH', `/api/catalog/parts/${found.id}`, { stock: (found.stock ?? 0) + 3 })
    expect(edit.status, JSON.stringify(edit.body)).toBe(200)
    const [a2, b2] = await settle()
    expect(b2.generation).toBeGreaterThan(b1.generation)
    expect(a2.digest).toBe(b2.digest)
    expect(a2.digest).not.toBe(a1.digest)
  })

  it('sign-in throttling counts failures on both instances together', async () => {
    const email = `${unique('nobody')}@example.com`
    const statuses: number[] = []
    for (let i = 0; i < 6; i++) {
      const r = await client('', i % 2 ? B : A).json('POST', '/api/auth/login', { email, password: 'wrong-password-x' })
      statuses.push(r.status)
    }
    // five failures in all (three on A, two on B) reach the per-account limit: the sixth, on B, is refused
    expect(statuses.slice(0, 5).every(s => s === 401), statuses.join(',')).toBe(true)
    expect(statuses[5]).toBe(429)
  })
})
