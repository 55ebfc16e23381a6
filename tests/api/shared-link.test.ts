// Issue 10 item 6 / issue 15 item 4: a mixed-topology back-to-back pair (NPC machine side, T-type grid side) on one
// DC link. The link bank is one set of positions on side 'dc-link' (from the engine's explicit side), listed once in
// the results, the parts and the released BOM; a grid side on another DC-link structure is refused naming the field.
import { describe, expect, it } from 'vitest'
import { signInAs, unique, type Client } from '../support/api'

const mixed = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 700, dcVoltageMax: 800, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.88, fundamentalHz: 50 }],
  },
  gridSide: {
    topology: 't-type', switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 90, powerFactor: -0.99, fundamentalHz: 50 }],
  },
  linkCarriers: 'synchronised',
}

type Position = { side: string, position: string, duty: { kind: string, positionsPerPhase: number, capacitorRole?: string }, candidates: { partVersionId: number, seriesCount: number, parallelCount: number }[], assigned: null | { seriesCount: number, parallelCount: number } }

async function positionsOf(c: Client, id: number): Promise<Position[]> {
  const r = await c.json('GET', `/api/designs/${id}/parts?limit=500`)
  expect(r.status).toBe(200)
  return r.body.positions
}

describe('mixed-topology back-to-back: one shared DC-link bank', () => {
  it('NPC machine side with a T-type grid side: the link bank is one position each, bought once, in results, parts and the released BOM', async () => {
    const eng = await signInAs('design-engineer')
    const created = await eng.json('POST', '/api/designs', { name: unique('mixed b2b'), input: mixed })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    const id = created.body.id as number

    // Results: the bank once, beside both converters' own (empty) capacitor lists.
    const preview = await eng.json('POST', '/api/designs/preview', mixed)
    expect(preview.status, JSON.stringify(preview.body)).toBe(200)
    const result = preview.body.result
    expect(result.sharedLink.capacitors.map((c: { name: string, side: string, role: string }) => [c.name, c.side, c.role])).toEqual([['Cdc1', 'shared', 'split'], ['Cdc2', 'shared', 'split']])
    expect(result.converters.map((c: { envelope: { capacitors: unknown[] } }) => c.envelope.capacitors.length)).toEqual([0, 0])
    expect(result.sharedLink.pairs[0]).toMatchObject({ machinePoint: 'Rated', gridPoint: 'Rated', pairedBy: 'name' })

    // Parts: capacitor positions only on the shared link, each once, typed by role.
    const positions = await positionsOf(eng, id)
    const caps = positions.filter(p => p.duty.kind === 'capacitor')
    expect(caps.map(p => [p.side, p.position, p.duty.capacitorRole])).toEqual([['dc-link', 'Cdc1', 'split'], ['dc-link', 'Cdc2', 'split']])
    expect(positions.some(p => p.side === 'grid' && p.position === 'S1')).toBe(true)

    for (const p of positions) {
      if (p.assigned) continue
      expect(p.candidates.length, `${p.side} ${p.position} has a fitting part`).toBeGreaterThan(0)
      const c = p.candidates[0]!
      const r = await eng.json('PUT', `/api/designs/${id}/parts`, { side: p.side, position: p.position, partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
      expect(r.status, JSON.stringify(r.body)).toBe(200)
    }
    const released = await eng.json('POST', `/api/designs/${id}/bom/release`)
    expect(released.status, JSON.stringify(released.body)).toBe(201)
    const { body: bom } = await eng.json('GET', `/api/boms/${released.body.id}`)
    const linkRows = bom.snapshot.positions.filter((p: { side: string }) => p.side === 'dc-link')
    expect(linkRows.map((p: { position: string }) => p.position)).toEqual(['Cdc1', 'Cdc2'])
    expect(bom.snapshot.positions.filter((p: { position: string }) => p.position.startsWith('Cdc')).length).toBe(2)
    // The capacitor line references each link position once and counts exactly its pieces.
    const assigned = new Map((await positionsOf(eng, id)).filter(p => p.side === 'dc-link').map(p => [p.position, p]))
    const refs = bom.snapshot.lines.flatMap((l: { references: string[] }) => l.references).filter((r: string) => /^dc-link Cdc/.test(r))
    expect(refs.length).toBe(2)
    const pieces = [...assigned.values()].reduce((s, p) => s + p.duty.positionsPerPhase * p.assigned!.seriesCount * p.assigned!.parallelCount, 0)
    const capLines = bom.snapshot.lines.filter((l: { category: string }) => l.category === 'capacitor')
    expect(capLines.reduce((s: number, l: { quantityPerUnit: number }) => s + l.quantityPerUnit, 0)).toBe(pieces)
    expect(bom.snapshot.topologySummary).toMatch(/back-to-back with a .*T-type.* grid side/)
  })

  it('a grid side on another DC-link structure is refused with 422 naming the field', async () => {
    const eng = await signInAs('design-engineer')
    const r = await eng.json('POST', '/api/designs/preview', { ...mixed, gridSide: { ...mixed.gridSide, topology: 'two-level' } })
    expect(r.status).toBe(422)
    expect(r.body.data.issues.map((i: { path: string }) => i.path)).toContain('gridSide.topology')
    const sync = await eng.json('POST', '/api/designs/preview', { ...mixed, gridSide: { ...mixed.gridSide, switchingHz: 5000 } })
    expect(sync.status).toBe(422)
    expect(sync.body.data.issues.map((i: { path: string }) => i.path)).toContain('linkCarriers')
  })
})
