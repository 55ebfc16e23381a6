// The compact provenance of the public API: texts once per answer, rows keep a stable id, nothing lost.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, evaluateStress } from '../../../shared/engine'
import { compactProvenance } from '../../../server/workers/provenance'
import { runTask } from '../../../server/workers/tasks'

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

  it('asks for the catalogue when its copy is missing or older than the request\'s generation', async () => {
    expect(await runTask({ kind: 'trade-study', generation: 7, duty: {} as never })).toEqual({ ok: false, needs: 'parts' })
  })
})
