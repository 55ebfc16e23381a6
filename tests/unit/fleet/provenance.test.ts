// The compact provenance of the public API: texts once per answer, rows keep a stable id, nothing lost.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, evaluateStress } from '../../../shared/engine'
import { compactProvenance } from '../../../server/workers/provenance'
import { runTask } from '../../../server/workers/tasks'
import { withEngine } from '../../../server/workers/shims'
import { DEMO_PARTS } from '../../../catalog/demo-parts'
import { sharePartIndex } from '../../../shared/catalog/matching'
import type { DesignMatchRequest, PositionMatch } from '../../../server/services/parts'
import type { BomSettings } from '../../../shared/schemas/design'

const npc = {
  topology: 'diode-clamped' as const, levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, lineVoltageRms: 690, phaseCurrentRms: 400,
  powerFactor: 0.86, fundamentalHz: 50, switchingHz: 3000, modulation: 'space-vector' as const, overshootVoltage: 120,
}

describe('compact provenance', () => {
  it('replaces every row\'s texts by an id that resolves to the same texts', () => {
    const full = evaluateStress(npc)
    const compact = compactProvenance(full)
    const rows = [...full.devices, ...full.capacitors]
    const compactRows = [...compact.devices, ...compact.capacitors] as unknown as { provenanceId: string, provenance?: unknown }[]
    expect(compactRows.every(r => typeof r.provenanceId === 'string' && r.provenance === undefined)).toBe(true)
    rows.forEach((r, i) => expect(compact.provenance[compactRows[i]!.provenanceId]).toEqual(r.provenance))
    // the texts travel once: fewer entries than rows, and the answer shrinks by more than half of the texts' size
    // (measured against the texts, not the whole answer, whose numbers grow with every figure the engine adds)
    expect(Object.keys(compact.provenance).length).toBeLessThan(rows.length)
    const texts = rows.reduce((s, r) => s + JSON.stringify(r.provenance).length, 0)
    expect(JSON.stringify(full).length - JSON.stringify(compact).length).toBeGreaterThan(texts / 2)
  })

  it('gives the same texts the same id in every answer', () => {
    const a = compactProvenance(evaluateStress(npc))
    const b = compactProvenance(evaluateStress({ ...npc, phaseCurrentRms: 200 }))
    expect(Object.keys(a.provenance).sort()).toEqual(Object.keys(b.provenance).sort())
  })

  it('reaches nested rows of a design evaluation', () => {
    const { levels, dcVoltage, dcVoltageMax, switchingHz, modulation, topology, overshootVoltage, ...point } = npc
    const design = evaluateDesign({ machineSide: { topology, levels, dcVoltage, dcVoltageMax, switchingHz, modulation, overshootVoltage, operatingPoints: [point] } })
    const text = JSON.stringify(compactProvenance(design))
    expect(text).not.toContain('"provenance":{"method"')
    expect(text).toContain('"provenanceId":"p-')
  })
})

describe('worker tasks', () => {
  it('returns an input the engine refuses as data naming the field (a thread boundary would drop the error class)', async () => {
    const r = await runTask({ kind: 'stress', input: { ...npc, levels: 12 }, options: {} })
    expect(r.ok).toBe(false)
    expect(r).toMatchObject({ error: { kind: 'engine', field: expect.any(String), message: expect.any(String) } })
  })

  it('matches a design against the index the task carries, and follows a newer generation at once', async () => {
    // service code calls Nitro's withEngine; the worker bundle gets it from the shims, this test too
    Object.assign(globalThis, { withEngine })
    const { levels, dcVoltage, dcVoltageMax, switchingHz, modulation, topology, overshootVoltage, ...point } = npc
    const input = { machineSide: { topology, levels, dcVoltage, dcVoltageMax, switchingHz, modulation, overshootVoltage, operatingPoints: [point] } }
    const request: DesignMatchRequest = { input, bomSettings: { buildQuantity: 1 } as BomSettings, revision: 1, assignments: [], pinned: [], approval: [], current: [], hosts: [], limit: 5, options: {} }
    const parts = DEMO_PARTS.map((p, i) => ({ ...p, partVersionId: 100 + i, approved: true }))
    const first = await runTask({ kind: 'match-design', generation: 1, index: sharePartIndex(parts, p => (p as typeof parts[number]).partVersionId), request })
    expect(first.ok).toBe(true)
    const top = (r: typeof first) => (r as { value: { positions: PositionMatch[] } }).value.positions[0]!.candidates[0]!.partVersionId
    const best = top(first)
    // generation 2 no longer has that part: the thread's index of generation 1 is not used again
    const second = await runTask({ kind: 'match-design', generation: 2, index: sharePartIndex(parts.filter(p => p.partVersionId !== best), p => (p as typeof parts[number]).partVersionId), request })
    expect(second.ok).toBe(true)
    expect(top(second)).not.toBe(best)
  })
})
