// Cascaded H-bridge leg: (N−1)/2 identical H-bridge cells in series, each fed by its own isolated DC source.
import type { TopologyDefinition } from '../model'

/**
 * One cell is described (legs A and B, cell terminals A toward the output and B toward the
 * previous cell); every cell carries the phase current, so each position is counted (N−1)/2 times
 * per phase. Cell levels: 0 → −V_cell, 1 → 0 (two redundant states), 2 → +V_cell; unit voltage = V_cell.
 * Positive phase current enters the cell at B and leaves at A.
 */
export const cascadedHBridge: TopologyDefinition = {
  id: 'cascaded-h-bridge',
  label: 'Cascaded H-bridge',
  description: 'Series connection of (N−1)/2 H-bridge cells per phase, each with its own isolated DC source and capacitor; phase-shifted unipolar carriers.',
  allowedLevels: [3, 5, 7, 9, 11, 13, 15],
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'cell',
  structureSource: 'J. Rodriguez, J.-S. Lai, F. Z. Peng, IEEE TIE 49(4) 2002; B. Wu, High-Power Converters and AC Drives, Wiley-IEEE Press 2006',
  currentSource: 'each H-bridge leg a two-level leg under unipolar PWM: F. Bierhoff, F. W. Fuchs, IEEE PESC 2004 closed forms',
  patternNote: 'Phase-shifted unipolar carriers (180°/cells apart); legs A and B of a cell compare +m and −m with the same carrier.',
  leg: (levels) => {
    const cells = (levels - 1) / 2
    const v = (A: number, B: number) => ({ p: 1, n: 0, A, B })
    return {
      modelLevels: 3,
      outputNode: 'A',
      carrier: 'phase-shifted-unipolar',
      capacitorModel: 'cell',
      cellsPerPhase: cells,
      positions: [
        { name: 'S1', kind: 'switch', nodes: ['p', 'A'], countPerPhase: cells, mirror: 'S3', row: 0, column: 1 },
        { name: 'D1', kind: 'diode', nodes: ['p', 'A'], countPerPhase: cells, mirror: 'D3', antiParallelTo: 'S1', row: 0, column: 1 },
        { name: 'S2', kind: 'switch', nodes: ['A', 'n'], countPerPhase: cells, mirror: 'S4', row: 1, column: 1 },
        { name: 'D2', kind: 'diode', nodes: ['A', 'n'], countPerPhase: cells, mirror: 'D4', antiParallelTo: 'S2', row: 1, column: 1 },
        { name: 'S3', kind: 'switch', nodes: ['p', 'B'], countPerPhase: cells, mirror: 'S1', row: 0, column: 2 },
        { name: 'D3', kind: 'diode', nodes: ['p', 'B'], countPerPhase: cells, mirror: 'D1', antiParallelTo: 'S3', row: 0, column: 2 },
        { name: 'S4', kind: 'switch', nodes: ['B', 'n'], countPerPhase: cells, mirror: 'S2', row: 1, column: 2 },
        { name: 'D4', kind: 'diode', nodes: ['B', 'n'], countPerPhase: cells, mirror: 'D2', antiParallelTo: 'S4', row: 1, column: 2 },
      ],
      states: [
        { name: '+', level: 2, on: ['S1', 'S4'], nodeVoltages: v(1, 0), positive: ['S4', 'S1'], negative: ['D1', 'D4'] },
        { name: '0p', level: 1, on: ['S1', 'S3'], nodeVoltages: v(1, 1), positive: ['D3', 'S1'], negative: ['D1', 'S3'] },
        { name: '0n', level: 1, on: ['S2', 'S4'], nodeVoltages: v(0, 0), positive: ['S4', 'D2'], negative: ['S2', 'D4'] },
        { name: '-', level: 0, on: ['S2', 'S3'], nodeVoltages: v(0, 1), positive: ['D3', 'D2'], negative: ['S2', 'S3'] },
      ],
      capacitors: [
        { name: 'Ccell', kind: 'cell', role: 'cell', nodes: ['p', 'n'], voltageUnits: 1, countInConverter: 3 * cells, row: 0.5, column: 0 },
      ],
    }
  },
  presentation: {
    drawing: 'cells',
    drawnUnit: 'phase-leg',
    levelsInName: true,
    icon: [{ rect: [10, 6, 28, 10] }, { rect: [10, 19, 28, 10] }, { rect: [10, 32, 28, 10] }, { path: 'M24 6v-2M24 42v2M17 11h14M17 24h14M17 37h14', thin: true }],
    form: {},
  },
}
