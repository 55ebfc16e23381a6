// Two (or eight) requests at the same moment: catalogue version numbers stay unique, part edits
// do not overwrite each other, design saves from the same revision leave one winner and 409s with
// a message — never a 500.
import { describe, expect, it } from 'vitest'
import { signInAs, unique } from '../support/api'

describe('concurrent writes', () => {
  it('simultaneous part edits: every one lands, version numbers unique and consecutive, no change lost', async () => {
    const c = await signInAs('component-engineer')
    const list = await c.json('GET', '/api/catalog/parts?sort=partNumber&dir=desc&pageSize=3')
    const [a, b] = list.body.rows as { id: number }[]
    const before = (await c.json('GET', '/api/catalog/versions')).body[0].number as number
    const edits = [
      c.json('PATCH', `/api/catalog/parts/${a!.id}`, { stock: 4321 }),
      c.json('PATCH', `/api/catalog/parts/${a!.id}`, { leadTimeDays: 77 }),
      c.json('PATCH', `/api/catalog/parts/${a!.id}`, { lifecycle: 'active' }),
      c.json('PATCH', `/api/catalog/parts/${b!.id}`, { stock: 1234 }),
      c.json('PATCH', `/api/catalog/parts/${b!.id}`, { leadTimeDays: 55 }),
      c.json('PATCH', `/api/catalog/parts/${a!.id}`, { approved: true }),
      c.json('PATCH', `/api/catalog/parts/${b!.id}`, { lifecycle: 'active' }),
      c.json('PATCH', `/api/catalog/parts/${a!.id}`, { stock: 4321, leadTimeDays: 77 }),
    ]
    const results = await Promise.all(edits)
    expect(results.map(r => r.status)).toEqual(Array(8).fill(200))
    const numbers = ((await c.json('GET', '/api/catalog/versions')).body as { number: number }[]).map(v => v.number).filter(n => n > before)
    expect(new Set(numbers).size).toBe(numbers.length)
    // consecutive: no number taken twice, none skipped by a failed attempt
    expect(Math.max(...numbers) - before).toBe(numbers.length)
    const partA = (await c.json('GET', `/api/catalog/parts/${a!.id}`)).body.versions[0].data
    const partB = (await c.json('GET', `/api/catalog/parts/${b!.id}`)).body.versions[0].data
    expect(partA).toMatchObject({ stock: 4321, leadTimeDays: 77 })
    expect(partB).toMatchObject({ stock: 1234, leadTimeDays: 55 })
  })

  it('simultaneous saves of one design from the same revision: one 200, the rest 409 with a message', async () => {
    const e = await signInAs('design-engineer')
    const demo = (await e.json('GET', '/api/designs')).body[0]
    const full = (await e.json('GET', `/api/designs/${demo.id}`)).body
    const created = await e.json('POST', '/api/designs', { name: unique('race'), description: '', input: full.input })
    expect(created.status).toBe(201)
    const saves = await Promise.all(Array.from({ length: 6 }, (_, i) =>
      e.json('PUT', `/api/designs/${created.body.id}`, { name: `race save ${i}`, description: '', input: full.input, revision: 1 })))
    const statuses = saves.map(s => s.status).sort()
    expect(statuses).toEqual([200, 409, 409, 409, 409, 409])
    for (const s of saves.filter(s => s.status === 409)) expect(s.body.message).toMatch(/Someone else saved this design/)
    expect((await e.json('GET', `/api/designs/${created.body.id}`)).body.revision).toBe(2)
  })
})
