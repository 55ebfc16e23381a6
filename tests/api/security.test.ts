// Limits and CSRF, probed the way an attacker would: chunked bodies without a length, deep JSON,
// integers past the database column types, broken path escapes, NUL in upload names, foreign
// origins and form-encoded bodies.
import { request as httpRequest } from 'node:http'
import { describe, expect, it } from 'vitest'
import { baseUrl, client, signInAs, unique } from '../support/api'
import { exampleRow, templateSheet, workbookBuffer } from '../fixtures/catalog/workbooks'

/**
 * Streams a chunked body of up to `totalBytes` (64 KiB chunks) and resolves with the status the
 * server answers and how many bytes had been written by then.
 */
function streamChunked(path: string, totalBytes: number, headers: Record<string, string> = {}): Promise<{ status: number, written: number }> {
  const url = new URL(path, baseUrl)
  return new Promise((resolve, reject) => {
    let written = 0
    let done = false
    const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked', 'origin': baseUrl, ...headers } }, (res) => {
      done = true
      res.resume()
      resolve({ status: res.statusCode ?? 0, written })
      req.destroy()
    })
    req.on('error', (err) => { if (!done) reject(err) })
    const chunk = Buffer.alloc(64 * 1024, 0x61)
    req.write('{"email":"a@example.com","password":"')
    const pump = () => {
      while (!done && written < totalBytes) {
        written += chunk.length
        if (!req.write(chunk)) { req.once('drain', pump); return }
      }
      if (!done) req.end('"}')
    }
    pump()
  })
}

describe('request limits', () => {
  it('stops a chunked body without Content-Length at the limit with 413 (sign-in, signed out)', async () => {
    const r = await streamChunked('/api/auth/login', 64 * 1024 * 1024)
    expect(r.status).toBe(413)
    // the server answered long before the 64 MB were sent
    expect(r.written).toBeLessThan(32 * 1024 * 1024)
    const forgot = await streamChunked('/api/auth/forgot', 8 * 1024 * 1024)
    expect(forgot.status).toBe(413)
  })

  it('lets a small chunked body through to validation (the limit counts bytes, not headers)', async () => {
    const ok = await streamChunked('/api/auth/login', 1024)
    expect(ok.status).toBe(400)
  })

  it('refuses JSON nested deeper than the limit with 400, not a crash', async () => {
    const deep = `{"email":"a@example.com","password":"x","extra":${'['.repeat(5000)}${']'.repeat(5000)}}`
    const r = await client().request('POST', '/api/auth/login', deep, { 'content-type': 'application/json' })
    expect(r.status).toBe(400)
    expect((await r.json()).message).toContain('nested deeper')
    const viewer = await signInAs('viewer')
    const r2 = await viewer.request('POST', '/api/v1/stress', `{"topology":${'{"a":'.repeat(100000)}1${'}'.repeat(100000)}}`, { 'content-type': 'application/json' })
    expect(r2.status).toBe(400)
  })

  it('bounds ids, revisions and stock to the database integer (2³¹ − 1): 400 / 422, never 500', async () => {
    const admin = await signInAs('admin')
    for (const path of ['/api/designs/2147483648', '/api/catalog/parts/99999999999', '/api/boms/2147483648', '/api/catalog/imports/2147483648', '/api/designs/1?revision=2147483648']) {
      const r = await admin.json('GET', path)
      expect(r.status, path).toBe(400)
    }
    const d = (await admin.json('GET', '/api/designs')).body[0]
    const full = (await admin.json('GET', `/api/designs/${d.id}`)).body
    const save = await admin.json('PUT', `/api/designs/${d.id}`, { name: full.name, description: '', input: full.input, revision: 2 ** 31 })
    expect(save.status).toBe(422)
    expect(JSON.stringify(save.body.data.issues)).toContain('revision')
    const stock = await admin.json('PATCH', '/api/catalog/parts/1', { stock: 2 ** 31 })
    expect(stock.status).toBe(422)
    expect(stock.body.data.issues[0].path).toBe('stock')
    const assign = await admin.json('PUT', `/api/designs/${d.id}/parts`, { side: 'machine', position: 'S1', partVersionId: 2 ** 40 })
    expect(assign.status).toBe(422)
    expect(assign.body.data.issues[0].path).toBe('partVersionId')
    const page = await admin.json('GET', '/api/catalog/parts?page=1e300')
    expect(page.status).toBe(400)
  })

  it('refuses a NUL character in a JSON string with 422 naming the field (PostgreSQL text cannot hold it)', async () => {
    const c = await signInAs('design-engineer')
    const r = await c.json('POST', '/api/tokens', { name: 'a\u0000b' })
    expect(r.status).toBe(422)
    expect(r.body.data.issues[0].path).toBe('name')
  })

  it('answers a lone % or a broken escape in the path with 400', async () => {
    const admin = await signInAs('admin')
    for (const path of ['/api/designs/%', '/api/designs/%zz', '/api/boms/1/lines/%E0%A4%A', '/api/catalog/parts/%']) {
      const r = await admin.request('GET', path)
      expect(r.status, path).toBe(400)
    }
    expect((await admin.request('PUT', '/api/boms/1/lines/%', { supplier: 'x' })).status).toBe(400)
  })

  it('cleans control characters and NUL out of an upload\'s file name (201, not a database error)', async () => {
    const c = await signInAs('component-engineer')
    const workbook = await workbookBuffer([{ name: 'Parts', rows: templateSheet([exampleRow(0, unique('NUL-NAME'))]) }])
    const form = new FormData()
    const tag = unique('x')
    form.append('file', new Blob([new Uint8Array(workbook)]), `evil\u0000name\u0007\u001B${tag}.xlsx`)
    const r = await c.request('POST', '/api/catalog/imports', form)
    const body = await r.json()
    expect(r.status, JSON.stringify(body).slice(0, 300)).toBe(201)
    expect(body.import.filename).toBe(`evilname${tag}.xlsx`)
  })
})

describe('cross-site requests (CSRF)', () => {
  it('refuses Origin: null, a foreign origin and a missing Origin without Sec-Fetch-Site', async () => {
    const admin = await signInAs('admin')
    const evil = await admin.request('POST', '/api/tokens', { name: 'x' }, { origin: 'http://127.0.0.1:1' })
    expect(evil.status).toBe(403)
    const nul = await admin.request('POST', '/api/tokens', { name: 'x' }, { origin: 'null' })
    expect(nul.status).toBe(403)
    const none = await admin.request('POST', '/api/admin/users', { email: `${unique('csrf')}@example.com`, name: 'X', role: 'admin' }, { origin: '' })
    expect(none.status).toBe(403)
    const crossSite = await admin.request('POST', '/api/tokens', { name: 'x' }, { 'origin': '', 'sec-fetch-site': 'same-site' })
    expect(crossSite.status).toBe(403)
    const sameOrigin = await admin.request('POST', '/api/tokens', { name: 'same-origin fetch' }, { 'origin': '', 'sec-fetch-site': 'same-origin' })
    expect(sameOrigin.status).toBe(201)
    // nothing was created by the refused requests
    const tokens = await admin.json('GET', '/api/tokens')
    expect(tokens.body.map((t: { name: string }) => t.name)).not.toContain('x')
  })

  it('refuses form-encoded and text/plain bodies on JSON routes with 415', async () => {
    const admin = await signInAs('admin')
    const form = await admin.request('POST', '/api/tokens', 'name=x', { 'content-type': 'application/x-www-form-urlencoded' })
    expect(form.status).toBe(415)
    const text = await admin.request('POST', '/api/admin/users', '{"email":"t@example.com","name":"T","role":"admin"}', { 'content-type': 'text/plain' })
    expect(text.status).toBe(415)
    const multipart = new FormData()
    multipart.append('name', 'x')
    expect((await admin.request('POST', '/api/tokens', multipart)).status).toBe(415)
  })

  it('keeps Bearer-token calls on /api/v1 working without Origin (not cookie-based)', async () => {
    const owner = await signInAs('design-engineer')
    const { body: created } = await owner.json('POST', '/api/tokens', { name: 'no-origin script' })
    const r = await fetch(`${baseUrl}/api/v1/stress`, { method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${created.token}` }, body: '{}' })
    expect(r.status).toBe(422)
    // a Bearer header does not exempt the cookie routes outside /api/v1
    const outside = await fetch(`${baseUrl}/api/tokens`, { method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${created.token}`, 'cookie': owner.cookie }, body: '{"name":"x"}' })
    expect(outside.status).toBe(403)
  })
})
