// Active neutral-point-clamped three-level leg: the NPC clamp diodes replaced by switches S5, S6.
import type { TopologyDefinition } from '../model'

/**
 * Assumed pattern (our choice among the zero-state options analysed by Brückner, Bernet, Güldner,
 * IEEE TIE 2005): in the positive half wave of the reference S2 stays on and S1 commutates against
 * the upper neutral path S5/D5 (P = S1 S2 S6 ↔ 0U = S2 S5); in the negative half wave S3 stays on and
 * S4 commutates against the lower neutral path S6/D6 (N = S3 S4 S5 ↔ 0L = S3 S6). S6 (S5) is on in P (N)
 * so that S3 and S4 (S1 and S2) share the blocking voltage. S2 and S3 then switch only at the fundamental.
 */
const pattern = 'Positive half wave: S2 on, S1 commutates against the upper neutral path S5/D5; negative half wave: S3 on, S4 commutates against S6/D6; S6 (S5) on in the P (N) state to split the blocking voltage.'

export const anpc: TopologyDefinition = {
  id: 'anpc',
  label: 'Active NPC three-level',
  description: 'Neutral-point-clamped leg whose clamp diodes are replaced by switches, so the neutral path can be chosen and the losses spread.',
  allowedLevels: [3],
  defaultLevels: 3,
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'dc-link',
  structureSource: 'T. Brückner, S. Bernet, H. Güldner, IEEE TIE 2005',
  currentSource: 'T. Brückner, S. Bernet, H. Güldner, IEEE TIE 2005 (pattern); leg current balance (first principles)',
  patternNote: pattern,
  // Unit voltage = V_dc/2. U: junction S1/S2, L: junction S3/S4. A node with nothing on to hold it keeps the voltage of the previous state.
  leg: () => {
    const dc = { dc0: 0, dc1: 1, dc2: 2 }
    return {
      modelLevels: 3,
      outputNode: 'out',
      carrier: 'phase-disposition',
      capacitorModel: 'split',
      positions: [
        { name: 'S1', kind: 'switch', nodes: ['dc2', 'U'], mirror: 'S4', row: 0, column: 2 },
        { name: 'D1', kind: 'diode', nodes: ['dc2', 'U'], mirror: 'D4', antiParallelTo: 'S1', row: 0, column: 2 },
        { name: 'S2', kind: 'switch', nodes: ['U', 'out'], mirror: 'S3', row: 1, column: 2 },
        { name: 'D2', kind: 'diode', nodes: ['U', 'out'], mirror: 'D3', antiParallelTo: 'S2', row: 1, column: 2 },
        { name: 'S3', kind: 'switch', nodes: ['out', 'L'], mirror: 'S2', row: 2, column: 2 },
        { name: 'D3', kind: 'diode', nodes: ['out', 'L'], mirror: 'D2', antiParallelTo: 'S3', row: 2, column: 2 },
        { name: 'S4', kind: 'switch', nodes: ['L', 'dc0'], mirror: 'S1', row: 3, column: 2 },
        { name: 'D4', kind: 'diode', nodes: ['L', 'dc0'], mirror: 'D1', antiParallelTo: 'S4', row: 3, column: 2 },
        { name: 'S5', kind: 'switch', nodes: ['U', 'dc1'], mirror: 'S6', row: 0.5, column: 1 },
        { name: 'D5', kind: 'diode', nodes: ['U', 'dc1'], mirror: 'D6', antiParallelTo: 'S5', row: 0.5, column: 1 },
        { name: 'S6', kind: 'switch', nodes: ['dc1', 'L'], mirror: 'S5', row: 2.5, column: 1 },
        { name: 'D6', kind: 'diode', nodes: ['dc1', 'L'], mirror: 'D5', antiParallelTo: 'S6', row: 2.5, column: 1 },
      ],
      states: [
        { name: 'P', level: 2, on: ['S1', 'S2', 'S6'], nodeVoltages: { ...dc, out: 2, U: 2, L: 1 }, positive: ['S1', 'S2'], negative: ['D2', 'D1'] },
        { name: '0U', level: 1, on: ['S2', 'S5'], share: [1, 0], nodeVoltages: { ...dc, out: 1, U: 1, L: 1 }, positive: ['D5', 'S2'], negative: ['D2', 'S5'] },
        { name: '0L', level: 1, on: ['S3', 'S6'], share: [0, 1], nodeVoltages: { ...dc, out: 1, U: 1, L: 1 }, positive: ['S6', 'D3'], negative: ['S3', 'D6'] },
        { name: 'N', level: 0, on: ['S3', 'S4', 'S5'], nodeVoltages: { ...dc, out: 0, U: 1, L: 0 }, positive: ['D4', 'D3'], negative: ['S3', 'S4'] },
      ],
      capacitors: [
        { name: 'Cdc1', kind: 'dc-link', role: 'split', nodes: ['dc1', 'dc0'], voltageUnits: 1, countInConverter: 1, splitIndex: 1, row: 2.5, column: 0 },
        { name: 'Cdc2', kind: 'dc-link', role: 'split', nodes: ['dc2', 'dc1'], voltageUnits: 1, countInConverter: 1, splitIndex: 2, row: 0.5, column: 0 },
      ],
    }
  },
  presentation: {
    drawing: 'stack',
    drawnUnit: 'phase-leg',
    levelsInName: false,
    icon: [{ path: 'M8 6h32M8 42h32M8 24h6M30 24h10' }, { rect: [26, 8, 7, 5] }, { rect: [26, 16, 7, 5] }, { rect: [26, 27, 7, 5] }, { rect: [26, 35, 7, 5] }, { rect: [14, 14, 7, 5] }, { rect: [14, 29, 7, 5] }, { path: 'M17 19v10M21 16h5M21 31h5' }],
    form: {},
  },
}
