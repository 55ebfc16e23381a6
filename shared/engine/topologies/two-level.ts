// Two-level leg: one half-bridge across the whole DC link.
import type { TopologyDefinition } from '../model'

export const twoLevel: TopologyDefinition = {
  id: 'two-level',
  label: 'Two-level',
  description: 'One half-bridge per phase: two switches with anti-parallel diodes, each blocking the full DC link.',
  allowedLevels: [2],
  defaultLevels: 2,
  modulations: ['sine', 'third-harmonic', 'space-vector', 'six-step'],
  supply: 'dc-link',
  structureSource: 'B. Wu, High-Power Converters and AC Drives, Wiley-IEEE Press 2006',
  currentSource: 'F. Bierhoff, F. W. Fuchs, IEEE PESC 2004 (closed forms, sine PWM)',
  leg: () => ({
    modelLevels: 2,
    outputNode: 'out',
    carrier: 'phase-disposition',
    capacitorModel: 'split',
    positions: [
      { name: 'S1', kind: 'switch', nodes: ['dc1', 'out'], mirror: 'S2', row: 0, column: 2 },
      { name: 'D1', kind: 'diode', nodes: ['dc1', 'out'], mirror: 'D2', antiParallelTo: 'S1', row: 0, column: 2 },
      { name: 'S2', kind: 'switch', nodes: ['out', 'dc0'], mirror: 'S1', row: 1, column: 2 },
      { name: 'D2', kind: 'diode', nodes: ['out', 'dc0'], mirror: 'D1', antiParallelTo: 'S2', row: 1, column: 2 },
    ],
    // Unit voltage = V_dc: the output sits at the positive (level 1) or the negative rail (level 0).
    states: [
      { name: 'P', level: 1, on: ['S1'], nodeVoltages: { dc0: 0, dc1: 1, out: 1 }, positive: ['S1'], negative: ['D1'] },
      { name: 'N', level: 0, on: ['S2'], nodeVoltages: { dc0: 0, dc1: 1, out: 0 }, positive: ['D2'], negative: ['S2'] },
    ],
    capacitors: [
      { name: 'Cdc', kind: 'dc-link', role: 'dc-link', nodes: ['dc1', 'dc0'], voltageUnits: 1, countInConverter: 1, splitIndex: 1, row: 0.5, column: 0 },
    ],
  }),
  presentation: {
    drawing: 'stack',
    drawnUnit: 'phase-leg',
    levelsInName: false,
    icon: [{ path: 'M8 6h32M8 42h32M24 6v10M24 32v10M24 24h14' }, { rect: [20, 16, 8, 6] }, { rect: [20, 26, 8, 6] }],
    form: {},
  },
}
