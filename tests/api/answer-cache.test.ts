// Issue 14 item 7: a saved design's results and its assigned parts' figures are computed once and kept in
// PostgreSQL (computed_answers), keyed by everything they are computed from. These tests show the stored answer is
// the computed one, that a change of input, assignment or catalogue gives fresh figures, that two requests at once
// keep one row, that the role still decides what is sent, and that a design keeps only a few rows.
import postgres from 'postgres'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { signInAs, unique, type Client } from '../support/api'

const db = postgres(process.env.STRATAVOLT_TEST_DATABASE_URL!, { max: 2, onnotice: () => {} })
afterAll(() => db.end())

// Answers are stored by content, so a design with another design's input (in this file or another) would find that
// one's answer: each test's designs carry a current of their own.
let current = 0
beforeEach(() => { current = 200 + Math.round(Math.random() * 1e6) / 1e4 })
const input = (dcVoltage = 1100) => ({
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage, dcVoltageMax: 1250, switchingHz: 3000, modulation: 'sine', overshootVoltage: 100,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: current, powerFactor: 0.85, fundamentalHz: 50 }],
  },
})

/** The cache's word in Server-Timing (`hit` or `miss`), the status and the decoded body. */
async function get(api: Client, path: string, headers: Record<string, string> = {}) {
  const r = await api.request('GET', path, undefined, headers)
  const text = await r.text()
  return { status: r.status, cache: /cache;desc=(\w+)/.exec(r.headers.get('server-timing') ?? '')?.[1], encoding: r.headers.get('content-encoding'), text, body: r.status === 200 ? JSON.parse(text) : null }
}

const rows = async (designId: number, kind: string) => (await db`select key from computed_answers where design_id = ${designId} and kind = ${kind}`).length

async function newDesign(api: Client, dcVoltage = 1100): Promise<number> {
  const created = await api.json('POST', '/api/designs', { name: unique('cache test'), input: input(dcVoltage) })
  expect(created.status).toBe(201)
  return created.body.id
}

describe('stored results of a saved design', () => {
  it('the second opening sends the stored answer, the same as computed; a new revision is computed afresh', async () => {
    const api = await signInAs('design-engineer')
    const id = await newDesign(api)
    const first = await get(api, `/api/designs/${id}/results`)
    expect(first.status).toBe(200)
    expect(first.cache).toBe('miss')
    const second = await get(api, `/api/designs/${id}/results`)
    expect(second.cache).toBe('hit')
    expect(second.body).toEqual(first.body)
    // what the live preview computes for the same input (compact like the page's)
    const preview = await api.json('POST', '/api/designs/preview', input())
    expect(second.body.result.converters[0].points[0].modulationIndex).toBe(preview.body.result.converters[0].points[0].modulationIndex)

    const saved = await api.json('PUT', `/api/designs/${id}`, { name: unique('cache test'), input: input(1000), revision: 1 })
    expect(saved.status).toBe(200)
    const changed = await get(api, `/api/designs/${id}/results`)
    expect(changed.cache).toBe('miss')
    const m = (b: typeof first.body) => b.result.converters[0].points[0].modulationIndex as number
    // the same output voltage from a lower DC link needs a higher modulation index
    expect(m(changed.body)).toBeGreaterThan(m(first.body))
    // the earlier revision is still its own answer
    const old = await get(api, `/api/designs/${id}/results?revision=1`)
    expect(old.cache).toBe('hit')
    expect(m(old.body)).toBe(m(first.body))
    // another operating point shown is another answer; every sample is never stored
    expect((await get(api, `/api/designs/${id}/results?machinePoint=0&resolution=full`)).cache).toBeUndefined()
  })

  it('a client that does not take gzip gets the stored answer unpacked', async () => {
    const api = await signInAs('viewer')
    const engineer = await signInAs('design-engineer')
    const id = await newDesign(engineer)
    const zipped = await get(api, `/api/designs/${id}/results`, { 'accept-encoding': 'gzip' })
    expect(zipped.encoding).toBe('gzip')
    const plain = await get(api, `/api/designs/${id}/results`, { 'accept-encoding': 'identity' })
    expect(plain.cache).toBe('hit')
    expect(plain.encoding).toBeNull()
    expect(plain.body).toEqual(zipped.body)
  })

  it('two openings at once both answer the same and keep one row', async () => {
    const api = await signInAs('design-engineer')
    const id = await newDesign(api, 1150)
    const both = await Promise.all([get(api, `/api/designs/${id}/results`), get(api, `/api/designs/${id}/results`)])
    expect(both.map(r => r.status)).toEqual([200, 200])
    expect(both[1].body).toEqual(both[0].body)
    expect(await rows(id, 'design-results')).toBe(1)
    expect((await get(api, `/api/designs/${id}/results`)).cache).toBe('hit')
  })

  it('keeps at most four answers per design', async () => {
    const api = await signInAs('design-engineer')
    const id = await newDesign(api)
    for (let point = 0; point < 6; point++) {
      const many = { machineSide: { ...input().machineSide, operatingPoints: Array.from({ length: 6 }, (_, i) => ({ ...input().machineSide.operatingPoints[0], name: `P${i}`, phaseCurrentRms: current + 10 * i })) } }
      if (point === 0) expect((await api.json('PUT', `/api/designs/${id}`, { name: unique('cache test'), input: many, revision: 1 })).status).toBe(200)
      expect((await get(api, `/api/designs/${id}/results?machinePoint=${point}`)).status).toBe(200)
    }
    expect(await rows(id, 'design-results')).toBe(4)
    // the latest ones stay
    expect((await get(api, `/api/designs/${id}/results?machinePoint=5`)).cache).toBe('hit')
  })
})

describe('stored figures of the assigned parts', () => {
  it('follow an assignment, and each role still gets its own view of the stored figures', async () => {
    const api = await signInAs('design-engineer')
    const id = await newDesign(api)
    const none = await get(api, `/api/designs/${id}/parts/summary`)
    expect(none.status).toBe(200)
    expect(none.cache).toBe('miss')
    expect(none.body.summary[0].assignedPositions).toBe(0)
    expect((await get(api, `/api/designs/${id}/parts/summary`)).cache).toBe('hit')

    const parts = await api.json('GET', `/api/designs/${id}/parts`)
    const s1 = parts.body.positions.find((p: { position: string }) => p.position === 'S1')
    const c = s1.candidates[0]
    expect((await api.json('PUT', `/api/designs/${id}/parts`, { side: 'machine', position: 'S1', partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })).status).toBe(200)
    const one = await get(api, `/api/designs/${id}/parts/summary`)
    expect(one.cache).toBe('miss')
    expect(one.body.summary[0].assignedPositions).toBe(1)
    expect(typeof one.body.summary[0].costPerDesign).toBe('number')

    // stored by the engineer's request; the viewer sees the same figures without prices
    const viewer = await signInAs('viewer')
    const seen = await get(viewer, `/api/designs/${id}/parts/summary`)
    expect(seen.cache).toBe('hit')
    expect(seen.body.summary[0].semiconductorLossW).toBe(one.body.summary[0].semiconductorLossW)
    expect(seen.body.summary[0].costPerDesign).toBeNull()
  })

  it('a design with the same input and parts finds the figures stored for another', async () => {
    const api = await signInAs('design-engineer')
    const first = await newDesign(api)
    const second = await newDesign(api)
    const a = await get(api, `/api/designs/${first}/parts/summary`)
    const b = await get(api, `/api/designs/${second}/parts/summary`)
    expect([a.cache, b.cache]).toEqual(['miss', 'hit'])
    expect(b.body.summary).toEqual(a.body.summary)
    expect(b.body.design.id).toBe(second)
  })

  it('a catalogue change (a new generation) computes the figures again', async () => {
    const api = await signInAs('design-engineer')
    const id = await newDesign(api)
    expect((await get(api, `/api/designs/${id}/parts/summary`)).cache).toBe('miss')
    expect((await get(api, `/api/designs/${id}/parts/summary`)).cache).toBe('hit')
    // the statement triggers bump the generation on any change to parts; touch one part without changing it
    await db`update parts set approved = approved where id = (select min(id) from parts)`
    expect((await get(api, `/api/designs/${id}/parts/summary`)).cache).toBe('miss')
  })
})
