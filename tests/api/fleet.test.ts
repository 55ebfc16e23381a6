// The fleet-ready server against the built output: work on the job queue (progress, owner-only, results),
// compact provenance of the public API, and compressed answers.
import { existsSync } from 'node:fs'
import { request } from 'node:http'
import { join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { Piscina } from 'piscina'
import { describe, expect, it } from 'vitest'
import { CATALOG_COLUMNS } from '../../catalog/columns'
import { DEMO_PARTS } from '../../catalog/demo-parts'
import { sharePartIndex } from '../../shared/catalog/matching'
import { baseUrl, signInAs, unique, type Client } from '../support/api'

const npc = {
  topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, lineVoltageRms: 690, phaseCurrentRms: 400,
  powerFactor: 0.86, fundamentalHz: 50, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 120,
}

/** Polls a job until it ends; returns the last status seen and every progress value on the way. */
async function follow(c: Client, jobId: string, timeoutMs = 60000) {
  const seen: number[] = []
  const start = Date.now()
  while (Date.now() - start < timeoutMs) {
    const r = await c.json('GET', `/api/jobs/${jobId}`)
    expect(r.status).toBe(200)
    seen.push(r.body.progress)
    if (r.body.status === 'done' || r.body.status === 'failed') return { job: r.body, seen }
    await new Promise(res => setTimeout(res, 100))
  }
  throw new Error(`job ${jobId} did not end within ${timeoutMs} ms`)
}

/** Raw bytes on the wire (fetch would inflate them) and the headers. */
function wire(path: string, cookie: string, encoding: string) {
  return new Promise<{ bytes: number, headers: Record<string, string | string[] | undefined>, status: number }>((resolve, reject) => {
    const req = request(baseUrl + path, { headers: { cookie, 'accept-encoding': encoding } }, (res) => {
      let bytes = 0
      res.on('data', (chunk: Buffer) => { bytes += chunk.length })
      res.on('end', () => resolve({ bytes, headers: res.headers, status: res.statusCode ?? 0 }))
    })
    req.on('error', reject)
    req.end()
  })
}

function capacitorCsv(partNumber: string) {
  const values: Record<string, string> = {
    partNumber, manufacturer: 'Kestrel Capacitors', kind: 'capacitor', voltageRating: '1300',
    capacitance: '0.0012', rippleCurrentRating: '95', priceBreaks: '1:51.00', currency: 'EUR', stock: '40',
  }
  const header = CATALOG_COLUMNS.map(c => c.header)
  const row = CATALOG_COLUMNS.map(c => values[c.key] ?? '')
  return [header, row].map(r => r.map(v => `"${v}"`).join(',')).join('\r\n') + '\r\n'
}

describe('work on the job queue', () => {
  it('commits an import as a queued job with progress, seen only by the person who queued it', async () => {
    const components = await signInAs('component-engineer')
    const partNumber = unique('Q-CAP')
    const form = new FormData()
    form.append('file', new Blob([capacitorCsv(partNumber)]), `${partNumber}.csv`)
    const up = await components.request('POST', '/api/catalog/imports', form)
    const uploaded = await up.json() as any
    expect(up.status).toBe(201)
    const body = { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator }
    const queued = await components.json('POST', `/api/catalog/imports/${uploaded.import.id}/commit?async=1`, body)
    expect(queued.status).toBe(202)
    expect(queued.body.jobId).toMatch(/^[0-9a-f-]{36}$/)
    // someone else cannot follow it
    const other = await signInAs('design-engineer')
    expect((await other.json('GET', `/api/jobs/${queued.body.jobId}`)).status).toBe(404)
    const { job, seen } = await follow(components, queued.body.jobId)
    expect(job.status, JSON.stringify(job)).toBe('done')
    expect(job.progress).toBe(1)
    expect(seen.every((p, i) => i === 0 || p >= seen[i - 1]!)).toBe(true)
    expect(job.result).toMatchObject({ added: 1 })
    expect((await components.json('GET', `/api/catalog/parts?q=${partNumber}`)).body.total).toBe(1)
    // the same import again: refused at once, and a job that is refused ends as failed with the route's answer
    expect((await components.json('POST', `/api/catalog/imports/${uploaded.import.id}/commit`, body)).status).toBe(409)
  })

  it('a commit refused inside the job answers with the route\'s error (422 naming the rows), nothing written', async () => {
    const components = await signInAs('component-engineer')
    const partNumber = unique('Q-BAD')
    const csv = capacitorCsv(partNumber).replace('"1300"', '"-5"')
    const form = new FormData()
    form.append('file', new Blob([csv]), `${partNumber}.csv`)
    const uploaded = await (await components.request('POST', '/api/catalog/imports', form)).json() as any
    const r = await components.json('POST', `/api/catalog/imports/${uploaded.import.id}/commit`, { mapping: uploaded.mapping, decimalSeparator: uploaded.decimalSeparator })
    expect(r.status).toBe(422)
    expect(r.body.message).toMatch(/row/)
    expect((await components.json('GET', `/api/catalog/parts?q=${partNumber}`)).body.total).toBe(0)
  })

  it('runs a trade study on the queue and gives its rows to the person who asked', async () => {
    const engineer = await signInAs('design-engineer')
    const duty = {
      dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000,
      operatingPoints: [{ name: 'rated', lineVoltageRms: 690, phaseCurrentRms: 400, powerFactor: 0.86, fundamentalHz: 50 }],
      candidates: [{ topology: 'two-level', levels: 2 }, { topology: 'diode-clamped', levels: 3 }],
    }
    const queued = await engineer.json('POST', '/api/trade-study?async=1', duty)
    expect(queued.status, JSON.stringify(queued.body)).toBe(202)
    const { job } = await follow(engineer, queued.body.jobId)
    expect(job.status).toBe('done')
    const direct = await engineer.json('POST', '/api/trade-study', duty)
    expect(direct.status).toBe(200)
    expect(job.result.rows.map((r: any) => r.label)).toEqual(direct.body.rows.map((r: any) => r.label))
  })

  it('renders a BOM PDF on the queue and serves the file to the person who queued it', async () => {
    const buyer = await signInAs('purchasing')
    const list = await buyer.json('GET', '/api/boms')
    expect(list.body.length).toBeGreaterThan(0)
    const queued = await buyer.json('GET', `/api/boms/${list.body[0].id}/export.pdf?async=1`)
    expect(queued.status).toBe(202)
    const { job } = await follow(buyer, queued.body.jobId)
    expect(job.status, JSON.stringify(job)).toBe('done')
    const file = await buyer.request('GET', queued.body.file)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toBe('application/pdf')
    expect(Buffer.from(await file.arrayBuffer()).subarray(0, 5).toString()).toBe('%PDF-')
    const viewer = await signInAs('viewer')
    expect((await viewer.request('GET', queued.body.file)).status).toBe(404)
  })
})

describe('the worker threads of the built server', () => {
  it('load from the build folder (its own packages only), evaluate, read a spreadsheet and match a design', async () => {
    const root = fileURLToPath(new URL('../..', import.meta.url))
    const file = [join(root, '.output-test', 'server', 'workers', 'engine.mjs'), join(root, '.output', 'server', 'workers', 'engine.mjs')].find(f => existsSync(f))
    expect(file, 'workers/engine.mjs beside the built server').toBeTruthy()
    const pool = new Piscina({ filename: pathToFileURL(file!).href, maxThreads: 1 })
    try {
      const stress = await pool.run({ kind: 'stress', input: npc, options: {}, provenance: 'compact' })
      expect(stress.ok).toBe(true)
      expect(stress.value.devices.length).toBeGreaterThan(4)
      // exceljs and the reader resolve inside the build's node_modules
      const csv = new TextEncoder().encode(capacitorCsv('W-1'))
      const table = await pool.run({ kind: 'read-catalog', file: csv, filename: 'w.csv', limits: { maxBytes: 1e6, maxRows: 10 } })
      expect(table.ok, JSON.stringify(table).slice(0, 300)).toBe(true)
      expect(table.value.rows.length).toBe(1)
      // part matching reads the catalogue index from shared memory, the same copy the main thread built
      const parts = DEMO_PARTS.map((p, i) => ({ ...p, partVersionId: i + 1, approved: true }))
      const { levels, dcVoltage, dcVoltageMax, switchingHz, modulation, topology, overshootVoltage, ...point } = npc
      const request = {
        input: { machineSide: { topology, levels, dcVoltage, dcVoltageMax, switchingHz, modulation, overshootVoltage, operatingPoints: [point] } },
        bomSettings: { buildQuantity: 1 }, revision: 1, assignments: [], pinned: [], approval: [], current: [], hosts: [], limit: 3, options: {},
      }
      const matched = await pool.run({ kind: 'match-design', generation: 1, index: sharePartIndex(parts, p => (p as typeof parts[number]).partVersionId), request })
      expect(matched.ok, JSON.stringify(matched).slice(0, 300)).toBe(true)
      expect(matched.value.positions[0].candidates.length).toBeGreaterThan(0)
    }
    finally {
      await pool.destroy()
    }
  })
})

describe('public API answers', () => {
  it('sends provenance texts once per answer by default, per row with ?provenance=full', async () => {
    const c = await signInAs('viewer')
    const compact = await c.json('POST', '/api/v1/stress', npc)
    const full = await c.json('POST', '/api/v1/stress?provenance=full', npc)
    expect(compact.status).toBe(200)
    expect(full.status).toBe(200)
    for (const [i, d] of (compact.body.devices as any[]).entries()) {
      expect(d.provenance).toBeUndefined()
      expect(compact.body.provenance[d.provenanceId]).toEqual(full.body.devices[i].provenance)
    }
    expect(full.body.devices[0].provenance.source.length).toBeGreaterThan(20)
    // compacting saves more than half of the provenance texts the full answer repeats per row
    const rows = [...(full.body.devices as any[]), ...(full.body.capacitors as any[])]
    const provenanceBytes = rows.reduce((n, r) => n + JSON.stringify(r.provenance ?? '').length, 0)
    expect(JSON.stringify(full.body).length - JSON.stringify(compact.body).length).toBeGreaterThan(provenanceBytes / 2)
    expect((await c.json('POST', '/api/v1/stress?provenance=verbose', npc)).status).toBe(400)
  })

  it('answers computed on a worker thread say how long the thread worked (Server-Timing), so overhead can be told from work', async () => {
    const c = await signInAs('viewer')
    const r = await c.request('POST', '/api/v1/stress', npc)
    expect(r.status).toBe(200)
    const timing = /compute;dur=([\d.]+), encode;dur=([\d.]+)/.exec(r.headers.get('server-timing') ?? '')
    expect(timing, r.headers.get('server-timing') ?? 'no Server-Timing').toBeTruthy()
    expect(Number(timing![1])).toBeGreaterThan(0)
    expect(Number(timing![2])).toBeGreaterThanOrEqual(0)
    expect((await r.json()).devices.length).toBeGreaterThan(0)
  })

  it('compresses a results answer and a matching answer (gzip), and leaves them alone when not asked', async () => {
    const engineer = await signInAs('design-engineer')
    const [design] = (await engineer.json('GET', '/api/designs')).body
    for (const [path, atLeast] of [[`/api/designs/${design.id}/results`, 3], [`/api/designs/${design.id}/parts`, 5]] as const) {
      const plain = await wire(path, engineer.cookie, 'identity')
      const zipped = await wire(path, engineer.cookie, 'gzip, deflate, br')
      expect(plain.status).toBe(200)
      expect(plain.headers['content-encoding']).toBeUndefined()
      expect(zipped.headers['content-encoding']).toBe('gzip')
      expect(String(zipped.headers.vary)).toMatch(/accept-encoding/i)
      expect(plain.bytes / zipped.bytes).toBeGreaterThan(atLeast)
    }
  })
})
