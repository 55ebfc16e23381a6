// T-type three-level leg: a two-level half-bridge plus a bidirectional switch to the neutral point.
import type { TopologyDefinition } from '../model'

export const tType: TopologyDefinition = {
  id: 't-type',
  label: 'T-type three-level',
  description: 'Outer half-bridge across the full DC link plus a back-to-back switch pair from the output to the neutral point.',
  allowedLevels: [3],
  defaultLevels: 3,
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'dc-link',
  structureSource: 'first principles (state enumeration); common practice',
  currentSource: 'leg current balance (first principles); outer switch as NPC outer switch, Orfanoudakis et al., IET PEMD 2010',
  patternNote: 'Inner pair in common-emitter connection (node E): S2 from the output, S3 from the neutral point.',
  // Unit voltage = V_dc/2; outer switches block two units, the inner pair one unit each.
  leg: () => ({
    modelLevels: 3,
    outputNode: 'out',
    carrier: 'phase-disposition',
    capacitorModel: 'split',
    positions: [
      { name: 'S1', kind: 'switch', nodes: ['dc2', 'out'], mirror: 'S4', row: 0, column: 2 },
      { name: 'D1', kind: 'diode', nodes: ['dc2', 'out'], mirror: 'D4', antiParallelTo: 'S1', row: 0, column: 2 },
      { name: 'S2', kind: 'switch', nodes: ['out', 'E'], mirror: 'S3', row: 1, column: 1.5 },
      { name: 'D2', kind: 'diode', nodes: ['out', 'E'], mirror: 'D3', antiParallelTo: 'S2', row: 1, column: 1.5 },
      { name: 'S3', kind: 'switch', nodes: ['dc1', 'E'], mirror: 'S2', row: 1, column: 1 },
      { name: 'D3', kind: 'diode', nodes: ['dc1', 'E'], mirror: 'D2', antiParallelTo: 'S3', row: 1, column: 1 },
      { name: 'S4', kind: 'switch', nodes: ['out', 'dc0'], mirror: 'S1', row: 2, column: 2 },
      { name: 'D4', kind: 'diode', nodes: ['out', 'dc0'], mirror: 'D1', antiParallelTo: 'S4', row: 2, column: 2 },
    ],
    states: [
      { name: 'P', level: 2, on: ['S1', 'S3'], nodeVoltages: { dc0: 0, dc1: 1, dc2: 2, out: 2, E: 1 }, positive: ['S1'], negative: ['D1'] },
      { name: 'O', level: 1, on: ['S2', 'S3'], nodeVoltages: { dc0: 0, dc1: 1, dc2: 2, out: 1, E: 1 }, positive: ['S3', 'D2'], negative: ['S2', 'D3'] },
      { name: 'N', level: 0, on: ['S4', 'S2'], nodeVoltages: { dc0: 0, dc1: 1, dc2: 2, out: 0, E: 0 }, positive: ['D4'], negative: ['S4'] },
    ],
    capacitors: [
      { name: 'Cdc1', kind: 'dc-link', role: 'split', nodes: ['dc1', 'dc0'], voltageUnits: 1, countInConverter: 1, splitIndex: 1, row: 1.5, column: 0 },
      { name: 'Cdc2', kind: 'dc-link', role: 'split', nodes: ['dc2', 'dc1'], voltageUnits: 1, countInConverter: 1, splitIndex: 2, row: 0.5, column: 0 },
    ],
  }),
  presentation: {
    drawing: 'stack',
    drawnUnit: 'phase-leg',
    levelsInName: false,
    icon: [{ path: 'M8 6h32M8 42h32M28 6v8M28 34v8M8 24h8M26 24h14' }, { rect: [24, 14, 8, 7] }, { rect: [24, 27, 8, 7] }, { rect: [14, 21, 10, 6] }],
    form: {},
  },
}
