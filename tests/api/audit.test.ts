// Issue 14 item 6: the audit log a page at a time, with a text filter and a day range, and the total.
import { describe, expect, it } from 'vitest'
import { signInAs, unique } from '../support/api'

describe('GET /api/admin/audit', () => {
  it('pages newest first with the total, filters by text and by day range', async () => {
    const admin = await signInAs('admin')
    const tag = unique('audit-page')
    // five entries of our own: token creations name the token as the subject
    for (let i = 0; i < 5; i++) expect((await admin.json('POST', '/api/tokens', { name: `${tag}-${i}` })).status).toBe(201)

    const first = await admin.json('GET', `/api/admin/audit?q=${tag}&pageSize=2`)
    expect(first.status).toBe(200)
    expect(first.body).toMatchObject({ total: 5, page: 1, pageSize: 2 })
    expect(first.body.rows.map((r: { subject: string }) => r.subject)).toEqual([`${tag}-4`, `${tag}-3`])
    const third = await admin.json('GET', `/api/admin/audit?q=${tag}&pageSize=2&page=3`)
    expect(third.body.rows.map((r: { subject: string }) => r.subject)).toEqual([`${tag}-0`])

    const today = new Date().toISOString().slice(0, 10)
    const inRange = await admin.json('GET', `/api/admin/audit?q=${tag}&from=${today}&to=${today}`)
    expect(inRange.body.total).toBe(5)
    const before = await admin.json('GET', `/api/admin/audit?q=${tag}&to=2020-01-01`)
    expect(before.body).toMatchObject({ total: 0, rows: [] })

    // "%" and "_" are plain characters in the filter, not wildcards
    expect((await admin.json('GET', '/api/admin/audit?q=%25%25%25zz_never')).body.total).toBe(0)
  })

  it('refuses a bad day or a range that ends before it starts, naming the field', async () => {
    const admin = await signInAs('admin')
    const bad = await admin.json('GET', '/api/admin/audit?from=14.03.2026')
    expect(bad.status).toBe(400)
    expect(bad.body.data.issues[0].path).toBe('from')
    const backwards = await admin.json('GET', '/api/admin/audit?from=2026-03-14&to=2026-03-01')
    expect(backwards.status).toBe(400)
    expect(backwards.body.data.issues[0].path).toBe('to')
    expect((await (await signInAs('viewer')).json('GET', '/api/admin/audit')).status).toBe(403)
  })
})
