// Flying-capacitor N-level leg: N−1 commutation cells in series, each pair of cells bridged by a flying capacitor.
import type { CapacitorDef, PositionDef, StateDef, TopologyDefinition } from '../model'

const range = (from: number, to: number): number[] => Array.from({ length: Math.max(0, to - from + 1) }, (_, k) => from + k)

/**
 * Cell j (1 = next to the DC link) holds S_j on the upper path P(j−1)→P(j) and its complement
 * S(2N−1−j) on the lower path Q(j)→Q(j−1). Flying capacitor between P(j) and Q(j) holds N−1−j units
 * (unit = V_dc/(N−1)); it is named Cf{k} by its voltage k. Every one of the 2^(N−1) cell states is
 * listed; phase-shifted carriers rotate the redundant states of a level evenly (default equal shares).
 */
function leg(N: number) {
  const C = N - 1
  const P = (j: number) => (j === 0 ? `dc${C}` : j === C ? 'out' : `P${j}`)
  const Q = (j: number) => (j === 0 ? 'dc0' : j === C ? 'out' : `Q${j}`)
  const comp = (j: number) => 2 * N - 1 - j

  const positions: PositionDef[] = []
  for (const j of range(1, C)) {
    positions.push({ name: `S${j}`, kind: 'switch', nodes: [P(j - 1), P(j)], mirror: `S${comp(j)}`, row: 0, column: 2 * j })
    positions.push({ name: `D${j}`, kind: 'diode', nodes: [P(j - 1), P(j)], mirror: `D${comp(j)}`, antiParallelTo: `S${j}`, row: 0, column: 2 * j })
  }
  for (const j of range(1, C).reverse()) {
    positions.push({ name: `S${comp(j)}`, kind: 'switch', nodes: [Q(j), Q(j - 1)], mirror: `S${j}`, row: 1, column: 2 * j })
    positions.push({ name: `D${comp(j)}`, kind: 'diode', nodes: [Q(j), Q(j - 1)], mirror: `D${j}`, antiParallelTo: `S${comp(j)}`, row: 1, column: 2 * j })
  }

  const states: StateDef[] = []
  for (let bits = 0; bits < 1 << C; bits++) {
    const v: Record<string, number> = { [`dc${C}`]: C, dc0: 0 }
    let p = C
    let q = 0
    const on: string[] = []
    const positive: string[] = []
    const negative: string[] = []
    for (const j of range(1, C)) {
      const upperOn = ((bits >> (j - 1)) & 1) === 1
      // The capacitor after cell j fixes P(j) − Q(j) = C − j; the on switch ties one side to the previous node.
      if (upperOn) { q = p - (C - j) }
      else { p = q + (C - j) }
      if (j < C) { v[P(j)] = p; v[Q(j)] = q }
      else v.out = p
      on.push(upperOn ? `S${j}` : `S${comp(j)}`)
      positive.push(upperOn ? `S${j}` : `D${comp(j)}`)
      negative.push(upperOn ? `D${j}` : `S${comp(j)}`)
    }
    const level = on.filter((_, k) => ((bits >> k) & 1) === 1).length
    states.push({ name: `s${bits.toString(2).padStart(C, '0')}`, level, on, nodeVoltages: v, positive, negative })
  }

  const capacitors: CapacitorDef[] = [
    { name: 'Cdc', kind: 'dc-link', role: 'dc-link', nodes: [`dc${C}`, 'dc0'], voltageUnits: 1, countInConverter: C, seriesCount: 1, row: 0.5, column: 0 },
    ...range(1, C - 1).map((j): CapacitorDef => ({
      name: `Cf${C - j}`, kind: 'flying', role: 'flying', nodes: [P(j), Q(j)], voltageUnits: C - j, countInConverter: 3, seriesCount: C - j, row: 0.5, column: 2 * j + 1,
    })),
  ]

  return { modelLevels: N, outputNode: 'out', carrier: 'phase-shifted' as const, capacitorModel: 'flying' as const, positions, states, capacitors }
}

export const flyingCapacitor: TopologyDefinition = {
  id: 'flying-capacitor',
  label: 'Flying-capacitor multilevel',
  description: 'N−1 nested commutation cells per phase; flying capacitors at k·V_dc/(N−1) hold the intermediate voltages, phase-shifted carriers balance them.',
  allowedLevels: range(3, 9),
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'dc-link',
  structureSource: 'T. A. Meynard, H. Foch, IEEE PESC 1992; J. Rodriguez, J.-S. Lai, F. Z. Peng, IEEE TIE 49(4) 2002',
  currentSource: 'each cell a two-level leg under phase-shifted carriers: F. Bierhoff, F. W. Fuchs, IEEE PESC 2004 closed forms',
  patternNote: 'Phase-shifted carriers (360°/(N−1) apart); averaged over a switching period every redundant state of a level is used equally.',
  leg,
  presentation: {
    drawing: 'ladder',
    drawnUnit: 'phase-leg',
    levelsInName: true,
    icon: [{ path: 'M8 6h32M8 42h32M24 6v4M24 38v4M24 24h16' }, { rect: [20, 10, 8, 5] }, { rect: [20, 17, 8, 5] }, { rect: [20, 26, 8, 5] }, { rect: [20, 33, 8, 5] }, { path: 'M12 15h8M12 33h8M12 15v7M12 26v7M8 22h8M8 26h8', thin: true }],
    form: {},
  },
}
