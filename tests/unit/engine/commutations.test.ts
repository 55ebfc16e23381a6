// Commutation pairs derived from the state tables (shared/engine/commutations.ts), against the pairs
// the textbooks name for each leg.
import { describe, expect, it } from 'vitest'
import { deriveCommutations, type CommutationPair } from '../../../shared/engine/commutations'
import { topologyById } from '../../../shared/engine/topologies'
import { legFor } from '../../../shared/engine/validate'

/** "switch:role↔partner" of every step between two levels, both directions, both current signs. */
function pairsOf(topology: keyof typeof topologyById, levels: number, half: 0 | 1, lower: number): string[] {
  const table = deriveCommutations(legFor(topologyById[topology], levels))
  const out: string[] = []
  for (const route of table.steps[half]![lower]!.routes) {
    for (const t of [route.up, route.down]) {
      for (const sign of [0, 1] as const) out.push(...t.pairs[sign].map((p: CommutationPair) => `${p.switch}:${p.switchRole}↔${p.partner}@${p.units}`))
    }
  }
  return out.sort()
}

describe('NPC (diode-clamped N = 3) commutation pairs from the state table', () => {
  // Outer switch with the clamp diode of its half, inner switch with the opposite outer diode:
  // A. Nabae, I. Takahashi, H. Akagi, IEEE TIA 1981 (the leg); the pairing from first principles of the
  // NPC commutation cell, as analysed by T. Brückner, S. Bernet, H. Güldner, IEEE TIE 2005 (recalled from
  // memory); every one commutating one level step, V_dc/2.
  it('upper step (0 ↔ P): S1 with Dc1+ for i > 0, S3 with D1 for i < 0', () => {
    expect(pairsOf('diode-clamped', 3, 0, 1)).toEqual([
      'S1:turn-off↔Dc1+@1', 'S1:turn-on↔Dc1+@1', 'S3:turn-off↔D1@1', 'S3:turn-on↔D1@1',
    ])
  })
  it('lower step (N ↔ 0): S4 with Dc1− for i < 0, S2 with D4 for i > 0', () => {
    expect(pairsOf('diode-clamped', 3, 1, 0)).toEqual([
      'S2:turn-off↔D4@1', 'S2:turn-on↔D4@1', 'S4:turn-off↔Dc1-@1', 'S4:turn-on↔Dc1-@1',
    ])
  })
  it('a turn-on charges the diode that gives up the current with its recovery; the series devices that only stop conducting are not charged', () => {
    const table = deriveCommutations(legFor(topologyById['diode-clamped'], 3))
    const up = table.steps[0]![1]!.routes[0]!.up // 0 → P
    const leg = legFor(topologyById['diode-clamped'], 3)
    const down = table.steps[0]![1]!.routes[0]!.down // P → 0
    const named = (t: typeof up, sign: 0 | 1) => t.events[sign].map(e => `${leg.positions[e.position]!.name}:${e.role}`).sort()
    expect(named(up, 0)).toEqual(['Dc1+:recovery', 'S1:turn-on'])
    expect(named(up, 1)).toEqual(['S3:turn-off'])
    // P → 0, i < 0: D1 and D2 stop conducting, S3 and Dc1− take over; D2 blocks nothing afterwards, so only D1 recovers.
    expect(named(down, 1)).toEqual(['D1:recovery', 'S3:turn-on'])
    expect(named(down, 0)).toEqual(['S1:turn-off'])
  })
})

describe('other legs (first principles of each commutation cell)', () => {
  it('two-level: S1 with D2, S2 with D1, at the full link', () => {
    expect(pairsOf('two-level', 2, 0, 0)).toEqual(['S1:turn-off↔D2@1', 'S1:turn-on↔D2@1', 'S2:turn-off↔D1@1', 'S2:turn-on↔D1@1'])
  })
  it('T-type upper step: S1 with the inner diode D2, the inner switch S2 with D1', () => {
    expect(pairsOf('t-type', 3, 0, 1)).toEqual(['S1:turn-off↔D2@1', 'S1:turn-on↔D2@1', 'S2:turn-off↔D1@1', 'S2:turn-on↔D1@1'])
  })
  it('flying capacitor, 4 levels: each step toggles one cell; the three cells share the steps equally (phase-shifted carriers)', () => {
    const table = deriveCommutations(legFor(topologyById['flying-capacitor'], 4))
    expect(table.stepsPerCarrier).toBe(3)
    for (const lower of [0, 1, 2]) {
      const byCell = new Map<string, number>()
      for (const r of table.steps[0]![lower]!.routes) {
        const sw = r.up.pairs[0]![0]!.switch
        byCell.set(sw, (byCell.get(sw) ?? 0) + r.share)
      }
      expect([...byCell.keys()].sort()).toEqual(['S1', 'S2', 'S3'])
      for (const share of byCell.values()) expect(share).toBeCloseTo(1 / 3, 12)
    }
  })
  it('matrix converter: no node potentials, so no commutation model from the state table (its carrier pattern gives the commutations, matrix-input.ts)', () => {
    expect(deriveCommutations(legFor(topologyById.matrix, 3)).available).toBe(false)
  })
})
