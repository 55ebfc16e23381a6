// Fuzzing every route of the route table as two roles (admin and viewer): generated path
// parameters, queries and bodies (random JSON, valid bodies with one field replaced, wrong
// content types, odd escapes). Every answer must be below 500 and come within a generous bound.
//
// The fuzz accounts are its own (invited here), its requests come from a client address of its
// own (throttling counts per client), and ids in paths point at its own design or at rows that do
// not exist, so the demo data the other test files use is never changed under them.
// Seed: STRATAVOLT_FUZZ_SEED=<n> replays a run; STRATAVOLT_FUZZ_RUNS=<n> changes the count.
import { request as httpRequest } from 'node:http'
import fc from 'fast-check'
import { beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, client, linkIn, signInAs, unique, waitForMail } from '../support/api'
import { freshAddress } from '../support/from-address'
import { routeTable, type RouteCase } from './route-table'

const TOTAL_RUNS = Number(process.env.STRATAVOLT_FUZZ_RUNS ?? 5200)
const SEED = Number(process.env.STRATAVOLT_FUZZ_SEED ?? Date.now() % 2 ** 31)
/** ms: a generous bound for one answer on a loaded 2-core machine (a PDF render takes ~1 s there). */
const SLOW_MS = 15000
const CONCURRENCY = 4
/** Routes that do real work on a valid request (PDF, workbook, matching, studies): fewer runs. */
const HEAVY = /report\.pdf|export\.(pdf|xlsx)|template\.xlsx|trade-study|parts\.get|bom\.get|results\.get|v1\/evaluate|preview\.post/

interface Case { route: string, method: string, path: string, role: 'admin' | 'viewer', body?: string, contentType?: string }
interface Outcome { c: Case, status: number, ms: number, error?: string }

const fuzzAddress = freshAddress()

function send(c: Case, cookie: string): Promise<Outcome> {
  const url = new URL(baseUrl)
  const body = c.body === undefined ? undefined : Buffer.from(c.body)
  return new Promise((resolve) => {
    const started = performance.now()
    const req = httpRequest({
      host: url.hostname, port: url.port, path: c.path, method: c.method, localAddress: fuzzAddress,
      headers: { origin: baseUrl, cookie, ...(body ? { 'content-type': c.contentType ?? 'application/json', 'content-length': String(body.length) } : {}) },
    }, (res) => {
      res.resume()
      res.on('end', () => resolve({ c, status: res.statusCode ?? 0, ms: performance.now() - started }))
    })
    req.setTimeout(SLOW_MS * 2, () => req.destroy(new Error('no answer')))
    req.on('error', err => resolve({ c, status: 0, ms: performance.now() - started, error: err.message }))
    req.end(body)
  })
}

// ---- generators -------------------------------------------------------------------------------

const oddSegments = ['0', '-1', '1.5', '2147483647', '2147483648', '99999999999999999999', '1e3', '0x10', 'NaN', 'abc', '%25', '%', '%zz', '%E0%A4%A', '..', '%2e%2e', '%00', '%20', 'null', 'undefined', '[]', '{}']
const segment = (ownId: number) => fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...oddSegments) },
  { weight: 2, arbitrary: fc.constant(String(ownId)) },
  { weight: 2, arbitrary: fc.integer({ min: 900_000, max: 2_147_483_647 }).map(String) },
  { weight: 2, arbitrary: fc.string({ maxLength: 12 }).map(s => encodeURIComponent(s) || 'x') },
)

const queryKeys = ['revision', 'status', 'q', 'kind', 'lifecycle', 'approved', 'minVoltage', 'minCurrent', 'sort', 'dir', 'page', 'pageSize', 'attachment', 'limit', 'format', 'x']
const queryValue = fc.oneof(
  fc.constantFrom('', '1', '0', '-1', '2147483648', '1e300', 'NaN', 'active', 'all', 'asc', 'desc', 'yes', 'switch', '%', '%zz'),
  fc.string({ maxLength: 20 }).map(encodeURIComponent),
  fc.integer().map(String),
)
const query = fc.array(fc.tuple(fc.constantFrom(...queryKeys), queryValue), { maxLength: 4 })
  .map(pairs => pairs.length ? `?${pairs.map(([k, v]) => `${k}=${v}`).join('&')}` : '')

const leaf = fc.oneof(
  fc.integer(), fc.double(), fc.constantFrom(2 ** 31, 2 ** 53, -(2 ** 31) - 1, 1e308, -1e308, 0, -0, 0.5),
  fc.string({ maxLength: 30 }), fc.constantFrom('', '\u0000', 'a\u0000b', '%', '<script>', '\'; drop table users;--', 'x'.repeat(5000)),
  fc.boolean(), fc.constant(null),
)
const value: fc.Arbitrary<unknown> = fc.letrec(tie => ({
  v: fc.oneof({ depthSize: 'small', withCrossShrink: true }, leaf, fc.array(tie('v'), { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 8 }), tie('v'), { maxKeys: 4 })),
})).v

/** Replaces, adds or removes one field somewhere in a valid body. */
function mutate(valid: Record<string, unknown>): fc.Arbitrary<unknown> {
  const paths: string[][] = []
  const walk = (o: unknown, p: string[]) => {
    if (o && typeof o === 'object') for (const [k, v] of Object.entries(o)) { paths.push([...p, k]); if (p.length < 4) walk(v, [...p, k]) }
  }
  walk(valid, [])
  if (!paths.length) return fc.constant(valid)
  return fc.tuple(fc.constantFrom(...paths), fc.oneof(value, fc.constant(undefined))).map(([path, v]) => {
    const copy = structuredClone(valid)
    let o = copy as Record<string, unknown>
    for (const k of path.slice(0, -1)) o = (Array.isArray(o) ? o[Number(k)] : o[k]) as Record<string, unknown>
    const last = path.at(-1)!
    if (v === undefined) Reflect.deleteProperty(o, last)
    else o[last] = v
    return copy
  })
}

function bodyFor(valid: Record<string, unknown> | undefined): fc.Arbitrary<{ body?: string, contentType?: string }> {
  const json = (a: fc.Arbitrary<unknown>) => a.map(v => ({ body: JSON.stringify(v) ?? 'null' }))
  return fc.oneof(
    { weight: 4, arbitrary: valid ? json(mutate(valid)) : json(fc.dictionary(fc.string({ maxLength: 10 }), value, { maxKeys: 5 })) },
    { weight: 2, arbitrary: json(value) },
    { weight: 1, arbitrary: fc.constant({}) },
    { weight: 1, arbitrary: fc.oneof(fc.string({ maxLength: 50 }), fc.constantFrom('{', '[[[[', '{"a":', '\u0000', `${'['.repeat(100)}`)).map(s => ({ body: s || ' ' })) },
    { weight: 1, arbitrary: fc.constantFrom('application/x-www-form-urlencoded', 'text/plain', 'multipart/form-data; boundary=x', 'application/json; charset=utf-16', 'application/xml').map(contentType => ({ body: 'a=1&b=2', contentType })) },
  )
}

// ---- set-up ------------------------------------------------------------------------------------

const accounts: Record<'admin' | 'viewer', { email: string, password: string, cookie: string }> = {} as never
let ownDesignId = 0
let validBodies: Record<string, Record<string, unknown>> = {}

async function signInFresh(role: 'admin' | 'viewer') {
  const a = accounts[role]
  // from an address of its own: the fuzz's failed sign-ins may have throttled its usual one
  const url = new URL(baseUrl)
  const cookie = await new Promise<string>((resolve, reject) => {
    const body = JSON.stringify({ email: a.email, password: a.password })
    const req = httpRequest({ host: url.hostname, port: url.port, path: '/api/auth/login', method: 'POST', localAddress: freshAddress(), headers: { 'origin': baseUrl, 'content-type': 'application/json', 'content-length': String(body.length) } }, (res) => {
      res.resume()
      if (res.statusCode !== 200) return reject(new Error(`fuzz sign-in answered ${res.statusCode}`))
      resolve((res.headers['set-cookie'] ?? []).map(s => s.split(';')[0]).join('; '))
    })
    req.on('error', reject)
    req.end(body)
  })
  a.cookie = cookie
}

beforeAll(async () => {
  const admin = await signInAs('admin')
  for (const role of ['admin', 'viewer'] as const) {
    const email = `${unique(`fuzz-${role}`)}@example.com`
    expect((await admin.json('POST', '/api/admin/users', { email, name: `Fuzz ${role}`, role })).status).toBe(201)
    const token = new URL(linkIn((await waitForMail(email, 'invited')).text)).searchParams.get('token')!
    const password = 'fuzz-password-12345'
    expect((await client().json('POST', '/api/auth/set-password', { token, password })).status).toBe(200)
    accounts[role] = { email, password, cookie: '' }
    await signInFresh(role)
  }
  // a design of its own to point ids at, and valid bodies to mutate
  const demo = (await admin.json('GET', '/api/designs')).body[0]
  const full = (await admin.json('GET', `/api/designs/${demo.id}`)).body
  const fuzzAdmin = client(accounts.admin.cookie)
  const created = await fuzzAdmin.json('POST', '/api/designs', { name: unique('fuzz design'), description: '', input: full.input })
  expect(created.status).toBe(201)
  ownDesignId = created.body.id
  const converter = { topology: 'diode-clamped', levels: 3, dcVoltage: 650, switchingHz: 4000, modulation: 'sine' }
  const point = { lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.85, fundamentalHz: 50 }
  validBodies = {
    'auth/login.post.ts': { email: 'someone@example.com', password: 'a-password' },
    'auth/forgot.post.ts': { email: 'someone@example.com' },
    'auth/set-password.post.ts': { token: 'x'.repeat(43), password: 'long-enough-password' },
    'admin/users.post.ts': { email: 'new-person@example.com', name: 'New Person', role: 'viewer' },
    'admin/users/[id].patch.ts': { role: 'viewer', disabled: false },
    'tokens.post.ts': { name: 'fuzz token' },
    'v1/stress.post.ts': { ...converter, ...point },
    'v1/evaluate.post.ts': { machineSide: { ...converter, operatingPoints: [point, { ...point, powerFactor: -0.8 }] } },
    'designs.post.ts': { name: 'fuzz copy', description: '', input: full.input },
    'designs/[id].put.ts': { name: 'fuzz save', description: '', input: full.input, revision: 1 },
    'designs/[id].patch.ts': { status: 'active' },
    'designs/preview.post.ts': full.input,
    'designs/[id]/parts.put.ts': { side: 'machine', position: 'S1', partVersionId: 1, seriesCount: 1, parallelCount: 1 },
    'designs/[id]/parts.delete.ts': { side: 'machine', position: 'S1' },
    'designs/[id]/bom/settings.put.ts': { buildQuantity: 2, sparesPercent: 5, manualLines: [{ description: 'x', quantityPerUnit: 1, unitPrice: 1, currency: 'EUR' }] },
    'catalog/imports/[id]/commit.post.ts': { mapping: { partNumber: 0 }, decimalSeparator: '.' },
    'catalog/imports/[id]/preview.post.ts': { mapping: { partNumber: 0 }, decimalSeparator: '.' },
    'catalog/parts/[id].patch.ts': { stock: 5, leadTimeDays: 10 },
    'trade-study.post.ts': { dcVoltage: 650, switchingHz: 4000, ...point },
    'boms/[id].patch.ts': { status: 'quoted' },
    'boms/[id]/lines/[key].put.ts': { supplier: 'x', quotedUnitPrice: 1, orderReference: 'y' },
  }
}, 120000)

/** The route's path with each `[param]` segment (taken from the file name) generated. */
function pathFor(route: RouteCase): fc.Arbitrary<string> {
  const fileSegments = route.file.replace(/\.(get|post|put|patch|delete)\.ts$/, '').split('/')
  const concrete = route.path.split('?')[0]!.split('/').slice(2) // drop '' and 'api'
  const parts = concrete.map((seg, i) => {
    const isParam = /^\[.+\]/.test(fileSegments[i] ?? '')
    if (!isParam) return fc.constant(seg)
    // users: only ids that are not anybody's (or the fuzz admin's own, refused) — never a real colleague
    if (route.file.startsWith('admin/users/')) return fc.oneof(fc.constantFrom(...oddSegments), fc.integer({ min: 900_000, max: 2_147_483_647 }).map(String))
    // a part, a BOM, an import or a token: rows the fuzz does not own are only ids that do not exist
    if (!route.file.startsWith('designs/')) return fc.oneof(fc.constantFrom(...oddSegments), fc.integer({ min: 900_000, max: 2_147_483_647 }).map(String), fc.string({ maxLength: 12 }).map(s => encodeURIComponent(s) || 'x'))
    return segment(ownDesignId)
  })
  // file names like export.pdf: keep the suffix after a generated id (boms/[id]/export.pdf → boms/<x>/export.pdf)
  return fc.tuple(...parts).map(segs => `/api/${segs.join('/')}`)
}

function casesFor(route: RouteCase, role: 'admin' | 'viewer', runs: number, seed: number): Case[] {
  const hasBody = route.method !== 'GET'
  const arb = fc.record({
    path: pathFor(route),
    q: query,
    body: hasBody ? bodyFor(validBodies[route.file]) : fc.constant({} as { body?: string, contentType?: string }),
  })
  return fc.sample(arb, { numRuns: runs, seed }).map(({ path, q, body }) => ({ route: route.file, method: route.method, path: path + q, role, ...body }))
}

describe('fuzz', () => {
  it(`${TOTAL_RUNS} generated requests over every route as admin and viewer: no 5xx, none slower than ${SLOW_MS / 1000} s`, async () => {
    const heavy = routeTable.filter(r => HEAVY.test(r.file))
    const light = routeTable.filter(r => !HEAVY.test(r.file))
    const heavyRuns = 12
    const lightRuns = Math.ceil((TOTAL_RUNS / 2 - heavy.length * heavyRuns) / light.length)
    const cases: Case[] = []
    let seed = SEED
    for (const role of ['admin', 'viewer'] as const) {
      for (const route of routeTable) cases.push(...casesFor(route, role, HEAVY.test(route.file) ? heavyRuns : lightRuns, seed++))
    }
    // interleave routes so that no route's cases run back to back
    const order = fc.sample(fc.shuffledSubarray(cases.map((_, i) => i), { minLength: cases.length, maxLength: cases.length }), { numRuns: 1, seed: SEED })[0]!
    const outcomes: Outcome[] = []
    let next = 0
    const started = performance.now()
    const worker = async () => {
      while (next < order.length) {
        const c = cases[order[next++]!]!
        const o = await send(c, accounts[c.role].cookie)
        outcomes.push(o)
        // sign-out (or a role/status change) ended the fuzz session: sign in again
        if (c.route === 'auth/logout.post.ts' || o.status === 401) await signInFresh(c.role)
      }
    }
    await Promise.all(Array.from({ length: CONCURRENCY }, worker))
    const seconds = (performance.now() - started) / 1000
    const bad = outcomes.filter(o => o.status >= 500 || o.status === 0)
    const slow = outcomes.filter(o => o.ms > SLOW_MS)
    const byStatus = outcomes.reduce<Record<number, number>>((m, o) => { m[o.status] = (m[o.status] ?? 0) + 1; return m }, {})
    const ms = outcomes.map(o => o.ms).sort((a, b) => a - b)
    console.log(`[fuzz] seed ${SEED}: ${outcomes.length} requests over ${routeTable.length} routes × 2 roles in ${seconds.toFixed(1)} s; statuses ${JSON.stringify(byStatus)}; p50 ${ms[Math.floor(ms.length / 2)]!.toFixed(1)} ms, p99 ${ms[Math.floor(ms.length * 0.99)]!.toFixed(1)} ms, max ${ms.at(-1)!.toFixed(0)} ms`)
    const show = (o: Outcome) => `${o.status} ${o.c.role} ${o.c.method} ${o.c.path} ${o.c.contentType ?? ''} ${(o.c.body ?? '').slice(0, 200)} ${o.error ?? ''} (${o.ms.toFixed(0)} ms)`
    expect(outcomes.length).toBeGreaterThanOrEqual(5000)
    expect(bad.map(show), `seed ${SEED}`).toEqual([])
    expect(slow.map(show), `seed ${SEED}`).toEqual([])
    // every route was reached as both roles
    expect(new Set(outcomes.map(o => `${o.c.role} ${o.c.route}`)).size).toBe(routeTable.length * 2)
  }, 600000)
})
