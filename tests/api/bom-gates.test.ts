// Issue 11: the BOM purchasing can order from without checking it. Approval / lifecycle gates, module
// coverage, re-rating after a design revision, capacitor banks, purchasing lines, release once with a
// mail outbox (including a crash between commit and send), role field filtering and the release diff.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import ExcelJS from 'exceljs'
import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { signInAs, unique, waitForMail, type Client } from '../support/api'

const twoLevel = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 120, powerFactor: 0.9, fundamentalHz: 50 }],
  },
}
const backToBack = {
  machineSide: twoLevel.machineSide,
  gridSide: {
    topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Grid', lineVoltageRms: 400, phaseCurrentRms: 110, powerFactor: 1, fundamentalHz: 50 }],
  },
}
const npc = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1200, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }],
  },
}

type Candidate = { partVersionId: number, seriesCount: number, parallelCount: number, packagesPerConverter: number, approved: boolean, covers: string[], lifecycle: string, part: { partNumber: string, manufacturer: string, packageConfiguration: string, kind: string } }
type Position = { side: string, position: string, coveredBy: string | null, duty: { kind: string, positionsPerPhase: number }, candidates: Candidate[], assigned: null | { partVersionId: number, seriesCount: number, parallelCount: number, coveredBy: string | null, review: { fits: boolean, stale: boolean, ratedRevision: number, needed: null | { seriesCount: number, parallelCount: number } } } }

const db = postgres(process.env.STRATAVOLT_TEST_DATABASE_URL!, { max: 2, onnotice: () => {} })
afterAll(() => db.end())

async function newDesign(eng: Client, name: string, input: unknown) {
  const r = await eng.json('POST', '/api/designs', { name: unique(name), input })
  expect(r.status).toBe(201)
  return r.body as { id: number, name: string }
}

async function positionsOf(c: Client, id: number, show = 'preferred'): Promise<Position[]> {
  // every candidate (not only the first 40), so a part ranked low still shows
  const r = await c.json('GET', `/api/designs/${id}/parts?show=${show}&limit=500`)
  expect(r.status).toBe(200)
  return r.body.positions
}

async function assign(eng: Client, id: number, p: { side: string, position: string }, c: { partVersionId: number, seriesCount: number, parallelCount: number }, fillCovered = false) {
  const r = await eng.json('PUT', `/api/designs/${id}/parts`, { side: p.side, position: p.position, partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount, fillCovered })
  expect(r.status, JSON.stringify(r.body)).toBe(200)
  return r.body as { covers: string[], filled: string[] }
}

/** Assigns the best-ranked part to every position still empty. */
async function fillRest(eng: Client, id: number) {
  for (const p of await positionsOf(eng, id)) if (!p.assigned) await assign(eng, id, p, p.candidates[0]!)
}

async function workbook(c: Client, bomId: number, query = '') {
  const r = await c.request('GET', `/api/boms/${bomId}/export.xlsx${query}`)
  expect(r.status).toBe(200)
  const wb = new ExcelJS.Workbook()
  await wb.xlsx.load(Buffer.from(await r.arrayBuffer()) as unknown as ArrayBuffer)
  return wb
}

function sheetRows(wb: ExcelJS.Workbook, name: string): unknown[][] {
  const rows: unknown[][] = []
  wb.getWorksheet(name)!.eachRow(row => rows.push((row.values as unknown[]).slice(1).map(v => (v && typeof v === 'object' && 'result' in v ? (v as { result: unknown }).result : v))))
  return rows
}

async function pdfText(c: Client, bomId: number) {
  const r = await c.request('GET', `/api/boms/${bomId}/export.pdf`)
  expect(r.status).toBe(200)
  const dir = mkdtempSync(join(tmpdir(), 'sv-bomg-pdf-'))
  writeFileSync(join(dir, 'bom.pdf'), Buffer.from(await r.arrayBuffer()))
  return execFileSync('pdftotext', ['-layout', join(dir, 'bom.pdf'), '-'], { encoding: 'utf8' })
}

async function partIdOf(comp: Client, partNumber: string) {
  const r = await comp.json('GET', `/api/catalog/parts?q=${encodeURIComponent(partNumber)}`)
  return r.body.rows.find((p: { partNumber: string }) => p.partNumber === partNumber).id as number
}

describe('approval and lifecycle gates', () => {
  it('ranks approved active parts first, hides the rest by default, and blocks release until each gated line is acknowledged', async () => {
    const eng = await signInAs('design-engineer')
    const comp = await signInAs('component-engineer')
    const design = await newDesign(eng, 'gate', twoLevel)
    const before = await positionsOf(eng, design.id)
    const s1 = before.find(p => p.position === 'S1')!
    // A part that is no position's first choice, so other tests' picks stay the same.
    const firsts = new Set(before.map(p => p.candidates[0]?.partVersionId))
    const target = s1.candidates.find(c => !firsts.has(c.partVersionId))!
    const partId = await partIdOf(comp, target.part.partNumber)
    // The component engineer sees where the part is used before changing it.
    const usage0 = await comp.json('GET', `/api/catalog/parts/${partId}/usage`)
    expect(usage0.status).toBe(200)
    expect(usage0.body).toMatchObject({ released: expect.any(Array), drafts: expect.any(Array) })
    expect((await comp.json('PATCH', `/api/catalog/parts/${partId}`, { approved: false })).status).toBe(200)
    try {
      const preferred = (await positionsOf(eng, design.id)).find(p => p.position === 'S1')!
      expect(preferred.candidates.every(c => c.approved && c.lifecycle === 'active')).toBe(true)
      expect(preferred.candidates.some(c => c.partVersionId === target.partVersionId)).toBe(false)
      const all = (await positionsOf(eng, design.id, 'all')).find(p => p.position === 'S1')!
      const shown = all.candidates.find(c => c.partVersionId === target.partVersionId)!
      expect(shown.approved).toBe(false)
      // every row says its approval and lifecycle; approved active rows first
      expect(all.candidates.every(c => typeof c.approved === 'boolean' && typeof c.lifecycle === 'string')).toBe(true)
      expect(all.candidates[0]!.approved).toBe(true)

      await assign(eng, design.id, s1, target)
      await fillRest(eng, design.id)
      const usage = await comp.json('GET', `/api/catalog/parts/${partId}/usage`)
      expect(usage.body.drafts).toContainEqual(expect.objectContaining({ designId: design.id, positions: expect.arrayContaining(['machine S1']) }))

      const blocked = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
      expect(blocked.status).toBe(422)
      expect(blocked.body.data.unacknowledged).toContainEqual(expect.objectContaining({ partNumber: target.part.partNumber, gate: ['unapproved'] }))

      const draft = await eng.json('GET', `/api/designs/${design.id}/bom`)
      const line = draft.body.draft.lines.find((l: { partNumber: string }) => l.partNumber === target.part.partNumber)
      expect(line.gate).toEqual(['unapproved'])
      const viewer = await signInAs('viewer')
      expect((await viewer.json('PUT', `/api/designs/${design.id}/bom/acknowledgements`, { lineKey: line.key, reason: 'only qualified source' })).status).toBe(403)
      const short = await eng.json('PUT', `/api/designs/${design.id}/bom/acknowledgements`, { lineKey: line.key, reason: 'ok' })
      expect(short.status).toBe(422)
      expect(short.body.data.issues[0].path).toBe('reason')
      const ack = await eng.json('PUT', `/api/designs/${design.id}/bom/acknowledgements`, { lineKey: line.key, reason: 'only qualified source for this rating' })
      expect(ack.status).toBe(200)
      const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
      expect(released.status).toBe(201)

      const buyer = await signInAs('purchasing')
      const bom = await buyer.json('GET', `/api/boms/${released.body.id}`)
      const relLine = bom.body.snapshot.lines.find((l: { key: string }) => l.key === line.key)
      expect(relLine).toMatchObject({ gate: ['unapproved'], acknowledgement: { reason: 'only qualified source for this rating', by: expect.any(String) } })
      const rows = sheetRows(await workbook(buyer, released.body.id), 'BOM')
      expect(rows.find(r => r.includes(target.part.partNumber))!.join(' ')).toMatch(/not approved by component engineering; acknowledged by .*: only qualified source/)
      expect(await pdfText(buyer, released.body.id)).toMatch(/CHECK: not approved/)
      const admin = await signInAs('admin')
      const audit = await admin.json('GET', `/api/admin/audit?q=${encodeURIComponent('BOM line acknowledged')}`)
      expect(audit.body.rows.some((a: { details: { reason?: string } }) => a.details?.reason === 'only qualified source for this rating')).toBe(true)
      const usage2 = await comp.json('GET', `/api/catalog/parts/${partId}/usage`)
      expect(usage2.body.released).toContainEqual(expect.objectContaining({ bomId: released.body.id, designId: design.id }))
    }
    finally {
      await comp.json('PATCH', `/api/catalog/parts/${partId}`, { approved: true })
    }
  })
})

describe('module coverage', () => {
  async function moduleCase(input: unknown, config: string, expectCovers: string[], perSet: number) {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, `module ${config}`, input)
    const s1 = (await positionsOf(eng, design.id, 'all')).find(p => p.position === 'S1')!
    const module = s1.candidates.find(c => c.part.packageConfiguration === config && c.part.kind === 'switch-diode')
    expect(module, `a ${config} candidate for S1`).toBeDefined()
    expect([...module!.covers].sort()).toEqual(expectCovers)
    const put = await assign(eng, design.id, s1, module!, true)
    expect([...put.filled].sort()).toEqual(expectCovers)
    const after = await positionsOf(eng, design.id)
    for (const name of expectCovers) {
      const p = after.find(x => x.position === name)!
      expect(p.coveredBy).toBe('S1')
      // its own candidates are not ranked above the module
      expect(p.candidates[0]?.partVersionId).toBe(module!.partVersionId)
    }
    await fillRest(eng, design.id)
    const draft = (await eng.json('GET', `/api/designs/${design.id}/bom`)).body.draft
    const lines = draft.lines.filter((l: { partNumber: string }) => l.partNumber === module!.part.partNumber)
    expect(lines).toHaveLength(1)
    // whole modules in parallel / series when one module's rating is not enough
    expect(lines[0].quantityPerUnit).toBe(perSet * module!.seriesCount * module!.parallelCount)
    // no other line buys a covered position
    for (const name of expectCovers) {
      const row = draft.positions.find((p: { position: string }) => p.position === name)
      expect(row).toMatchObject({ perConverter: 0, coveredBy: 'S1', partNumber: module!.part.partNumber })
      expect(draft.lines.filter((l: { references: string[] }) => l.references.some(r => r.startsWith(`machine ${name} `) && !r.includes('(in S1)')))).toEqual([])
    }
    return { eng, design, module: module! }
  }

  it('switch with anti-parallel diode (single): S1 covers D1; 6 per three-phase set (S1 and S2 each 3) — S2 its own', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'module single', twoLevel)
    const s1 = (await positionsOf(eng, design.id, 'all')).find(p => p.position === 'S1')!
    const single = s1.candidates.find(c => c.part.packageConfiguration === 'single' && c.part.kind === 'switch-diode')!
    expect(single.covers).toEqual(['D1'])
    await assign(eng, design.id, s1, single, true)
    const d1 = (await positionsOf(eng, design.id)).find(p => p.position === 'D1')!
    expect(d1.coveredBy).toBe('S1')
    await fillRest(eng, design.id)
    const draft = (await eng.json('GET', `/api/designs/${design.id}/bom`)).body.draft
    const line = draft.lines.find((l: { partNumber: string }) => l.partNumber === single.part.partNumber)
    // S1 hosts D1: at least the packages S1 itself needs (more when D1 needs more devices than S1), D1 not
    // bought again; other positions may take the same part: the line is the sum of the positions' packages.
    const same = draft.positions.filter((p: { partNumber: string }) => p.partNumber === single.part.partNumber)
    const s1Row = same.find((p: { position: string }) => p.position === 'S1')
    expect(s1Row.perConverter).toBeGreaterThanOrEqual(single.packagesPerConverter)
    expect(s1Row.perConverter % 3).toBe(0)
    expect(line.quantityPerUnit).toBe(same.reduce((n: number, p: { perConverter: number }) => n + p.perConverter, 0))
    expect(draft.positions.find((p: { position: string }) => p.position === 'D1')).toMatchObject({ perConverter: 0, coveredBy: 'S1' })
  })

  it('half-bridge: S1 covers S2 and both diodes; 3 modules per set', async () => {
    await moduleCase(twoLevel, 'half-bridge', ['D1', 'D2', 'S2'], 3)
  })

  it('six-pack: one module per set covers the whole two-level bridge', async () => {
    await moduleCase(twoLevel, 'six-pack', ['D1', 'D2', 'S2'], 1)
  })

  it('three-level NPC leg: one module per leg covers the switches, their diodes and the clamp diodes', async () => {
    const eng = await signInAs('design-engineer')
    const probe = await newDesign(eng, 'npc probe', npc)
    const names = (await positionsOf(eng, probe.id)).filter(p => p.duty.kind !== 'capacitor' && p.position !== 'S1').map(p => p.position).sort()
    await moduleCase(npc, 'npc-leg', names, 3)
  })

  it('re-assigning the host to another part releases the covered positions', async () => {
    const { eng, design } = await moduleCase(twoLevel, 'half-bridge', ['D1', 'D2', 'S2'], 3)
    const s1 = (await positionsOf(eng, design.id)).find(p => p.position === 'S1')!
    const other = s1.candidates.find(c => c.part.packageConfiguration === 'single')!
    await assign(eng, design.id, s1, other)
    const after = await positionsOf(eng, design.id)
    expect(after.find(p => p.position === 'S2')!.assigned).toBeNull()
  })
})

describe('capacitor banks and back-to-back', () => {
  it('a 2s×14p bank is 28 per set in the lines, the positions sheet, both exports and the totals', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'bank', twoLevel)
    const cap = (await positionsOf(eng, design.id)).find(p => p.duty.kind === 'capacitor')!
    await assign(eng, design.id, cap, { ...cap.candidates[0]!, seriesCount: 2, parallelCount: 14 })
    await fillRest(eng, design.id)
    await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 3, sparesPercent: 0, manualLines: [] })
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(released.status, JSON.stringify(released.body)).toBe(201)
    const buyer = await signInAs('purchasing')
    const { body: bom } = await buyer.json('GET', `/api/boms/${released.body.id}`)
    const perSet = cap.duty.positionsPerPhase * 28
    const line = bom.snapshot.lines.find((l: { partNumber: string }) => l.partNumber === cap.candidates[0]!.part.partNumber)
    expect([line.quantityPerUnit, line.quantityBuild]).toEqual([perSet, perSet * 3])
    expect(bom.snapshot.positions.find((p: { position: string }) => p.position === cap.position)).toMatchObject({ perConverter: perSet, seriesCount: 2, parallelCount: 14 })
    expect(bom.snapshot.totals.pieces).toBe(bom.snapshot.lines.reduce((a: number, l: { quantityOrder: number }) => a + l.quantityOrder, 0))
    const positions = sheetRows(await workbook(buyer, released.body.id), 'Positions')
    expect(positions.find(r => r[1] === cap.position)!.slice(4, 7)).toEqual([perSet, 2, 14])
    const text = await pdfText(buyer, released.body.id)
    expect(text).toMatch(new RegExp(`${cap.position}\\s+.*\\s${perSet}\\s+2\\s+14`))
  })

  it('back-to-back: the shared DC link is one position, bought once, never dropped', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'b2b', backToBack)
    const positions = await positionsOf(eng, design.id)
    const caps = positions.filter(p => p.duty.kind === 'capacitor')
    expect(caps.map(p => p.side)).toEqual(caps.map(() => 'dc-link'))
    expect(new Set(caps.map(p => p.position)).size).toBe(caps.length)
    expect(positions.some(p => p.side === 'grid' && p.duty.kind === 'switch')).toBe(true)
    await fillRest(eng, design.id)
    const draft = (await eng.json('GET', `/api/designs/${design.id}/bom`)).body
    expect(draft.missing).toEqual([])
    for (const cap of caps) {
      const a = (await positionsOf(eng, design.id)).find(p => p.side === 'dc-link' && p.position === cap.position)!.assigned!
      const row = draft.draft.positions.find((p: { side: string, position: string }) => p.side === 'dc-link' && p.position === cap.position)
      expect(row.perConverter).toBe(cap.duty.positionsPerPhase * a.seriesCount * a.parallelCount)
    }
    // grid-side semiconductors are in the BOM too
    expect(draft.draft.positions.some((p: { side: string }) => p.side === 'grid')).toBe(true)
  })
})

describe('revision consistency', () => {
  it('a new revision re-rates every assignment, marks those that no longer fit, blocks release until re-assigned or confirmed', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'rerate', twoLevel)
    await fillRest(eng, design.id)
    const hot = { machineSide: { ...twoLevel.machineSide, operatingPoints: [{ ...twoLevel.machineSide.operatingPoints[0]!, phaseCurrentRms: 200 }] } }
    const saved = await eng.json('PUT', `/api/designs/${design.id}`, { name: design.name, input: hot, revision: 1 })
    expect(saved.status, JSON.stringify(saved.body)).toBe(200)
    const rerated = await positionsOf(eng, design.id)
    const stale = rerated.filter(p => p.assigned?.review.stale)
    expect(stale.length).toBeGreaterThan(0)
    for (const p of stale) expect(p.assigned!.review).toMatchObject({ fits: false, ratedRevision: 1 })
    const blocked = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(blocked.status).toBe(422)
    expect(blocked.body.data.stale.length).toBe(stale.length)
    // The same part again with the counts the new duty needs; a part that cannot be sized is confirmed.
    const first = stale.find(p => p.assigned!.review.needed) ?? stale[0]
    const rest = stale.filter(p => p !== first)
    const needed = first!.assigned!.review.needed
    expect(needed, 'the first stale part can still be sized with more parts').not.toBeNull()
    await assign(eng, design.id, first!, { partVersionId: first!.assigned!.partVersionId, ...needed! })
    const again = (await positionsOf(eng, design.id)).find(p => p.position === first!.position)!
    expect(again.assigned).toMatchObject({ partVersionId: first!.assigned!.partVersionId, seriesCount: needed!.seriesCount, parallelCount: needed!.parallelCount, review: { fits: true, stale: false, ratedRevision: 2 } })
    expect((await eng.json('POST', `/api/designs/${design.id}/parts/confirm`, { side: 'machine', position: 'S1', reason: 'x' })).status).toBe(422)
    for (const p of rest) {
      const r = await eng.json('POST', `/api/designs/${design.id}/parts/confirm`, { side: p.side, position: p.position, reason: 'checked against the heatsink test; keep' })
      expect(r.status).toBe(200)
    }
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(released.status, JSON.stringify(released.body)).toBe(201)
  })
})

describe('purchasing lines', () => {
  it('records status with dates, supplier, quote and currency, order reference, promised delivery; a 3× quote asks for confirmation; open lines export', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'purchase', twoLevel)
    await fillRest(eng, design.id)
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(released.status).toBe(201)
    const id = released.body.id
    const buyer = await signInAs('purchasing')
    const { body: bom } = await buyer.json('GET', `/api/boms/${id}`)
    const [a, b] = bom.snapshot.lines.filter((l: { unitPrice: number | null }) => l.unitPrice !== null)
    const put = (key: string, body: unknown) => buyer.json('PUT', `/api/boms/${id}/lines/${encodeURIComponent(key)}`, body)
    // "12,50" typed as 1250 by a bad parse is far off the catalogue price: the server asks first
    const far = await put(a.key, { quotedUnitPrice: a.unitPrice * 100 })
    expect(far.status).toBe(409)
    expect(far.body.data).toMatchObject({ needsConfirmation: true, field: 'quotedUnitPrice' })
    expect((await put(a.key, { quotedUnitPrice: a.unitPrice * 100, confirmUnusualQuote: true })).status).toBe(200)
    expect((await put(a.key, { quotedUnitPrice: a.unitPrice * 0.9, quoteCurrency: 'EUR', supplier: 'Northdeck Distribution', status: 'quoted', statusDate: '2026-03-02' })).status).toBe(200)
    expect((await put(a.key, { status: 'ordered', orderReference: 'PO-9001', promisedDelivery: '2026-05-20' })).status).toBe(200)
    const badDate = await put(a.key, { promisedDelivery: '20.05.2026' })
    expect(badDate.status).toBe(422)
    expect(badDate.body.data.issues[0].path).toBe('promisedDelivery')
    expect((await put(a.key, { status: 'shipped' })).status).toBe(422)
    expect((await put(b.key, { status: 'received' })).status).toBe(200)
    const after = (await buyer.json('GET', `/api/boms/${id}`)).body.purchase
    expect(after[a.key]).toMatchObject({ status: 'ordered', supplier: 'Northdeck Distribution', quoteCurrency: 'EUR', orderReference: 'PO-9001', promisedDelivery: '2026-05-20', statusDates: { quoted: '2026-03-02', ordered: expect.stringMatching(/^\d{4}-\d{2}-\d{2}$/) } })
    expect(after[a.key].quotedUnitPrice).toBeCloseTo(a.unitPrice * 0.9, 6)

    const open = sheetRows(await workbook(buyer, id, '?open=1'), 'BOM')
    const header = open[0] as string[]
    expect(open.some(r => r.includes(b.partNumber))).toBe(false)
    const row = open.find(r => r.includes(a.partNumber))!
    expect(row[header.indexOf('Purchasing status')]).toBe('ordered')
    expect(row[header.indexOf('Promised delivery')]).toBe('2026-05-20')
    expect(header).toContain('Short of stock [pcs]')
    expect(header).toContain('Lead time [days]')
    expect((await buyer.request('GET', `/api/boms/${id}/export.xlsx?open=yes`)).status).toBe(400)
  })
})

describe('release once, mail through the outbox', () => {
  it('two releases at once: one 201, the other 409; a stale expectedRevision is 409; the mail is sent by the worker', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'once', twoLevel)
    await fillRest(eng, design.id)
    const [r1, r2] = await Promise.all([
      eng.json('POST', `/api/designs/${design.id}/bom/release`, { expectedRevision: 1 }),
      eng.json('POST', `/api/designs/${design.id}/bom/release`, { expectedRevision: 1 }),
    ])
    expect([r1.status, r2.status].sort()).toEqual([201, 409])
    const [noBody1, noBody2] = await Promise.all([
      eng.json('POST', `/api/designs/${design.id}/bom/release`),
      eng.json('POST', `/api/designs/${design.id}/bom/release`),
    ])
    expect([noBody1.status, noBody2.status].sort()).toEqual([201, 409])
    const boms = await db`select count(*)::int as n from boms where design_id = ${design.id}`
    expect(boms[0]!.n).toBe(2)
    expect((await eng.json('POST', `/api/designs/${design.id}/bom/release`, { expectedRevision: 1 })).status).toBe(409)
    const mail = await waitForMail('purchasing@example.com', `${design.name}, revision 1`, 20000)
    expect(mail.attachments.map(a => a.filename.split('.').pop()).sort()).toEqual(['pdf', 'xlsx'])
    // the worker marks the row sent when its transaction commits, just after the SMTP server took the mail
    const bomId = String((r1.status === 201 ? r1 : r2).body.id)
    let rows: { status: string, attempts: number }[] = []
    for (let i = 0; i < 50; i++) {
      rows = [...await db<{ status: string, attempts: number }[]>`select status, attempts from mail_outbox where payload->>'bomId' = ${bomId}`]
      if (rows[0]?.status === 'sent') break
      await new Promise(r => setTimeout(r, 100))
    }
    expect(rows).toEqual([{ status: 'sent', attempts: 1 }])
  })

  it('crash after commit: a committed outbox row whose first send fails is retried with backoff and delivered; the admin page shows it pending meanwhile', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'crash', twoLevel)
    await fillRest(eng, design.id)
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(released.status).toBe(201)
    // As if the process died right after committing a release: the row is there, nothing was sent for it.
    const to = `purchasing+fail-once-${Date.now()}@example.com`
    const subject = `BOM released: ${design.name}, revision 1 (after restart)`
    const [row] = await db`insert into mail_outbox (kind, "to", subject, payload) values ('bom-released', ${to}, ${subject}, ${db.json({ bomId: released.body.id, releasedBy: 'Test' })}) returning id`
    const admin = await signInAs('admin')
    let pending: { id: number, attempts: number, lastError: string | null } | undefined
    for (let i = 0; i < 100 && !pending; i++) {
      const page = await admin.json('GET', '/api/admin/outbox')
      expect(page.status).toBe(200)
      pending = page.body.pending.find((p: { id: number, attempts: number }) => p.id === row!.id && p.attempts === 1)
      if (!pending) await new Promise(r => setTimeout(r, 200))
    }
    expect(pending, 'first attempt failed and the row waits for its retry').toBeDefined()
    expect(pending!.lastError).toMatch(/busy|450/)
    // The backoff has passed (moved forward instead of waiting 30 s).
    await db`update mail_outbox set next_attempt_at = now() where id = ${row!.id}`
    const mail = await waitForMail(to, subject, 20000)
    expect(mail.attachments).toHaveLength(2)
    let done: { status: string, attempts: number } | undefined
    for (let i = 0; i < 50 && done?.status !== 'sent'; i++) {
      [done] = await db<{ status: string, attempts: number }[]>`select status, attempts from mail_outbox where id = ${row!.id}`
      if (done?.status !== 'sent') await new Promise(r => setTimeout(r, 100))
    }
    expect(done).toEqual({ status: 'sent', attempts: 2 })
    const viewer = await signInAs('viewer')
    expect((await viewer.json('GET', '/api/admin/outbox')).status).toBe(403)
  })
})

describe('access: fields each role receives', () => {
  it('viewers see released BOMs without purchasing\'s fields and a design\'s parts without catalogue data', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'access', twoLevel)
    await fillRest(eng, design.id)
    const released = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    const buyer = await signInAs('purchasing')
    const { body: bom } = await buyer.json('GET', `/api/boms/${released.body.id}`)
    const key = bom.snapshot.lines[0].key
    await buyer.json('PUT', `/api/boms/${released.body.id}/lines/${encodeURIComponent(key)}`, { supplier: 'Secret Supplier Ltd', orderReference: 'PO-SECRET-1', quotedUnitPrice: bom.snapshot.lines[0].unitPrice })
    const viewer = await signInAs('viewer')
    const seen = await viewer.json('GET', `/api/boms/${released.body.id}`)
    expect(seen.status).toBe(200)
    expect(seen.body.purchase).toEqual({})
    expect(seen.body.snapshot.lines.every((l: { supplier: unknown }) => l.supplier === null)).toBe(true)
    expect(JSON.stringify(seen.body)).not.toContain('PO-SECRET-1')
    const wb = await workbook(viewer, released.body.id)
    expect(JSON.stringify(sheetRows(wb, 'BOM'))).not.toMatch(/PO-SECRET-1|Secret Supplier/)
    expect(await pdfText(viewer, released.body.id)).not.toMatch(/PO-SECRET-1|Secret Supplier/)
    const buyerSees = (await buyer.json('GET', `/api/boms/${released.body.id}`)).body
    expect(buyerSees.purchase[key]).toMatchObject({ supplier: 'Secret Supplier Ltd', orderReference: 'PO-SECRET-1' })

    const parts = await viewer.json('GET', `/api/designs/${design.id}/parts`)
    expect(parts.status).toBe(200)
    for (const p of parts.body.positions) {
      expect(p).not.toHaveProperty('candidates')
      expect(Object.keys(p.assigned.part).sort()).toEqual(['kind', 'manufacturer', 'packageConfiguration', 'partNumber'])
      expect(p.assigned.evaluation ?? {}).not.toHaveProperty('unitPrice')
    }
    const compSees = await (await signInAs('component-engineer')).json('GET', `/api/designs/${design.id}/parts`)
    expect(compSees.body.positions[0].candidates.length).toBeGreaterThan(0)
  })
})

describe('release diff', () => {
  it('a release compares with the previous one line by line, on screen data and as a sheet in the workbook', async () => {
    const eng = await signInAs('design-engineer')
    const design = await newDesign(eng, 'diff', twoLevel)
    await fillRest(eng, design.id)
    await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 10, sparesPercent: 0, manualLines: [] })
    expect((await eng.json('POST', `/api/designs/${design.id}/bom/release`)).status).toBe(201)
    await eng.json('PUT', `/api/designs/${design.id}/bom/settings`, { buildQuantity: 20, sparesPercent: 0, manualLines: [{ description: 'Busbar', quantityPerUnit: 1, unitPrice: 40 }] })
    const draft = (await eng.json('GET', `/api/designs/${design.id}/bom`)).body
    expect(draft.changes.some((c: { change: string }) => c.change === 'added')).toBe(true)
    const second = await eng.json('POST', `/api/designs/${design.id}/bom/release`)
    expect(second.status).toBe(201)
    const buyer = await signInAs('purchasing')
    const { body: bom } = await buyer.json('GET', `/api/boms/${second.body.id}`)
    expect(bom.previous).toMatchObject({ revision: 1 })
    expect(bom.changes.some((c: { change: string, fields: { field: string }[] }) => c.change === 'changed' && c.fields.some(f => f.field === 'quantityOrder'))).toBe(true)
    const changes = sheetRows(await workbook(buyer, second.body.id), 'Changes')
    expect(String(changes[0]![0])).toContain('rev 1 → 2')
    expect(changes.some(r => r[0] === 'added' && String(r[6]).includes('Busbar'))).toBe(true)
    expect(changes.some(r => r[0] === 'changed' && r[3] === 'quantityOrder')).toBe(true)
  })
})
