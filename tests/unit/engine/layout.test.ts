// Leg layout data for the schematic: one item per position, in the order of the results.
import { describe, expect, it } from 'vitest'
import type { EngineInputError } from '../../../shared/engine'
import { evaluateStress, legLayout, topologies } from '../../../shared/engine'
import { inputAt } from './helpers'

const cases = topologies.flatMap(t => (t.allowedLevels === 'ignored' ? [undefined] : t.allowedLevels).map(N => ({ id: t.id, N })))

describe('legLayout', () => {
  it.each(cases)('$id N=$N: positions in result order, slots inside the grid, nodes joined', ({ id, N }) => {
    const layout = legLayout(id, N)
    const input = id === 'matrix'
      ? { topology: id, inputLineVoltageRms: 400, lineVoltageRms: 300, phaseCurrentRms: 10, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 5000, modulation: 'sine' as const }
      : inputAt(id, 0.5, 0.9, { levels: N })
    const r = evaluateStress(input)
    const devices = layout.items.filter(i => i.kind !== 'capacitor')
    expect(devices.map(d => d.name)).toEqual(r.devices.map(d => d.name))
    // The matrix converter's input filter capacitors sit on the input lines, not in a leg.
    expect(layout.items.filter(i => i.kind === 'capacitor').map(c => c.name)).toEqual(r.capacitors.filter(c => c.kind !== 'input-filter').map(c => c.name))
    for (const item of layout.items) {
      expect(item.row).toBeGreaterThanOrEqual(0)
      expect(item.row).toBeLessThan(layout.rows)
      expect(item.column).toBeLessThan(layout.columns)
      expect(item.nodes[0]).not.toBe(item.nodes[1])
      if (item.antiParallelTo) {
        const sw = layout.items.find(i => i.name === item.antiParallelTo)!
        expect([sw.row, sw.column, sw.nodes]).toEqual([item.row, item.column, item.nodes])
      }
    }
    expect(layout.items.some(i => i.nodes.includes(layout.outputNode))).toBe(true)
    if (id !== 'matrix' && id !== 'cascaded-h-bridge') expect(layout.dcNodes[0]).toBe('dc0')
  })

  it('refuses an impossible level count by field', () => {
    try { legLayout('diode-clamped', 12); expect.unreachable() }
    catch (e) { expect((e as EngineInputError).field).toBe('levels') }
  })
})
