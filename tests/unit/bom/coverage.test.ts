// Module coverage and package counts. Slot counts come from catalog/columns.ts PACKAGE_CONFIGURATIONS;
// leg structures are the engine's (two-level: B. Wu, High-Power Converters and AC Drives, 2006, ch. 6;
// three-level NPC: A. Nabae, I. Takahashi, H. Akagi, IEEE Trans. Ind. Appl. 1981). The expected counts
// are worked by hand beside each case.

import { describe, expect, it } from 'vitest'
import { moduleCoverage, packGroup, type GroupMember } from '../../../shared/bom/coverage'
import { slotsPerPackage } from '../../../shared/catalog/matching'
import { legLayout } from '../../../shared/engine'
import type { PackageConfiguration, PartKind } from '../../../catalog/columns'

function leg(topology: 'two-level' | 'diode-clamped' | 't-type', levels: number) {
  return legLayout(topology, levels).items.filter(i => i.kind !== 'capacitor').map(i => ({ name: i.name, kind: i.kind as 'switch' | 'diode' | 'clamp-diode', countPerPhase: i.countPerPhase, nodes: i.nodes, ...(i.antiParallelTo ? { antiParallelTo: i.antiParallelTo } : {}) }))
}
const part = (kind: PartKind, packageConfiguration: PackageConfiguration) => ({ kind, packageConfiguration })

describe('moduleCoverage: positions one package fills', () => {
  const twoLevel = leg('two-level', 2)

  it('switch with anti-parallel diode (single): S1 and its diode D1', () => {
    expect(moduleCoverage(part('switch-diode', 'single'), 'S1', twoLevel)).toMatchObject({ covers: ['D1'], unusedSlots: [] })
  })

  it('switch with diode (single) at a diode position: its own anti-parallel switch, not another leg position', () => {
    // D2 is anti-parallel to S2: the one switch slot holds S2 (with D2 in its chip), nothing else.
    expect(moduleCoverage(part('switch-diode', 'single'), 'D2', twoLevel)).toMatchObject({ covers: ['S2'], unusedSlots: [] })
    // A half-bridge at D2: S2, then S1 sharing the output node, with both diodes.
    expect(moduleCoverage(part('switch-diode', 'half-bridge'), 'D2', twoLevel)?.covers.sort()).toEqual(['D1', 'S1', 'S2'])
  })

  it('half-bridge at S1: S2 shares the output node, both diodes in the chips', () => {
    expect(moduleCoverage(part('switch-diode', 'half-bridge'), 'S1', twoLevel)?.covers.sort()).toEqual(['D1', 'D2', 'S2'])
  })

  it('six-pack at S1: the whole bridge of one leg (2 switch slots per phase, 3 phases per package)', () => {
    const c = moduleCoverage(part('switch-diode', 'six-pack'), 'S1', twoLevel)!
    expect(c.covers.sort()).toEqual(['D1', 'D2', 'S2'])
    expect(c.phasesPerPackage).toBe(3)
  })

  it('three-level NPC leg module: four switches, their diodes and both clamp diodes', () => {
    const npc = leg('diode-clamped', 3)
    const c = moduleCoverage(part('switch-diode', 'npc-leg'), 'S1', npc)!
    const expected = npc.filter(p => p.name !== 'S1').map(p => p.name).sort()
    expect(c.covers.sort()).toEqual(expected)
    expect(c.unusedSlots).toEqual([])
  })

  it('a plain switch (no diode) covers only itself; a part that cannot serve the host gives null', () => {
    expect(moduleCoverage(part('switch', 'single'), 'S1', twoLevel)?.covers).toEqual([])
    expect(moduleCoverage(part('capacitor', 'single'), 'S1', twoLevel)).toBeNull()
  })
})

describe('packGroup: packages of one part over the positions it fills', () => {
  const members = (names: string[], count = 1, series = 1, parallel = 1): GroupMember[] => leg('two-level', 2).filter(p => names.includes(p.name)).map(p => ({ position: p.name, kind: p.kind, countPerPhase: count, seriesCount: series, parallelCount: parallel, ...(p.antiParallelTo ? { antiParallelTo: p.antiParallelTo } : {}) }))
  const slots = (kind: PartKind, cfg: PackageConfiguration) => (k: 'switch' | 'diode' | 'clamp-diode') => slotsPerPackage({ kind, packageConfiguration: cfg }, k)

  it('half-bridge on S1, S2, D1, D2: 1 per phase × 3 phases = 3; the diodes are never bought again', () => {
    const g = packGroup(part('switch-diode', 'half-bridge'), members(['S1', 'S2', 'D1', 'D2']), 3, slots('switch-diode', 'half-bridge'))
    expect(g.packagesPerConverter).toBe(3)
    expect(g.host).toBe('S1')
    expect(g.covered.map(c => c.position).sort()).toEqual(['D1', 'D2', 'S2'])
    expect(g.unusedSlots).toEqual([])
  })

  it('half-bridge on S1 alone: still one per leg (3), and 3 unused switch slots shown once', () => {
    const g = packGroup(part('switch-diode', 'half-bridge'), members(['S1']), 3, slots('switch-diode', 'half-bridge'))
    expect(g.packagesPerConverter).toBe(3)
    expect(g.unusedSlots).toEqual(['3 switch slots per converter'])
  })

  it('six-pack on S1, S2: one package for all three legs', () => {
    expect(packGroup(part('switch-diode', 'six-pack'), members(['S1', 'S2', 'D1', 'D2']), 3, slots('switch-diode', 'six-pack')).packagesPerConverter).toBe(1)
  })

  it('half-bridges paralleled: 2 in parallel → 2 modules per leg = 6', () => {
    expect(packGroup(part('switch-diode', 'half-bridge'), members(['S1', 'S2'], 1, 1, 2), 3, slots('switch-diode', 'half-bridge')).packagesPerConverter).toBe(6)
  })

  it('discrete switch-with-diode on S1, S2, D1, D2: 2 per leg = 6, the diodes inside', () => {
    const g = packGroup(part('switch-diode', 'single'), members(['S1', 'S2', 'D1', 'D2']), 3, slots('switch-diode', 'single'))
    expect(g.packagesPerConverter).toBe(6)
    expect(g.unusedSlots).toEqual([])
  })
})
