// Direct 3×3 matrix converter: each output phase reaches each input phase through a bidirectional switch.
import type { PositionDef, StateDef, TopologyDefinition } from '../model'

// Input phases R, S, T (so that no position name reads like a DC rail).
const inputs = ['R', 'S', 'T'] as const

/**
 * One output phase ("leg") = three bidirectional switches, each two IGBTs in common-emitter
 * connection (node eX) with anti-parallel diodes: SX+ / DX− carry current from input X to the
 * output, SX− / DX+ the other way. Listed unmerged: 6 switch and 6 diode positions per output phase,
 * 18 + 18 in the converter. Unit voltage = peak input line voltage √2·V_LL,in, which every device
 * blocks when its input phase is the extreme one. Averaged over the (unrelated) input period every
 * input phase carries the output current a third of the time — an indirect space-vector assumption.
 */
function leg() {
  const positions: PositionDef[] = []
  const states: StateDef[] = []
  inputs.forEach((X, k) => {
    positions.push(
      { name: `S${X}+`, kind: 'switch', nodes: [`in${X}`, `e${X}`], mirror: `S${X}-`, blockingUnits: 1, row: 0, column: k + 1 },
      { name: `D${X}+`, kind: 'diode', nodes: [`in${X}`, `e${X}`], mirror: `D${X}-`, antiParallelTo: `S${X}+`, blockingUnits: 1, row: 0, column: k + 1 },
      { name: `S${X}-`, kind: 'switch', nodes: ['out', `e${X}`], mirror: `S${X}+`, blockingUnits: 1, row: 1, column: k + 1 },
      { name: `D${X}-`, kind: 'diode', nodes: ['out', `e${X}`], mirror: `D${X}+`, antiParallelTo: `S${X}-`, blockingUnits: 1, row: 1, column: k + 1 },
    )
    states.push({ name: X, level: k, on: [`S${X}+`, `S${X}-`], positive: [`S${X}+`, `D${X}-`], negative: [`S${X}-`, `D${X}+`] })
  })
  // Commutation between two input phases: about the virtual DC link 1.5·V̂_in,phase = (√3/2)·√2·V_LL,in.
  return { modelLevels: 3, outputNode: 'out', carrier: 'input-averaged' as const, capacitorModel: 'none' as const, positions, states, capacitors: [], commutationUnits: Math.sqrt(3) / 2 }
}

export const matrix: TopologyDefinition = {
  id: 'matrix',
  label: '3×3 matrix converter',
  description: 'Nine bidirectional switches connect every output phase directly to every input phase; no DC link, output line voltage at most √3/2 of the input.',
  allowedLevels: 'ignored',
  defaultLevels: 3,
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'ac-input',
  structureSource: 'P. W. Wheeler et al., IEEE TIE 2002',
  currentSource: 'P. W. Wheeler et al., IEEE TIE 2002 (structure); equal input-phase shares of an indirect space-vector modulation (assumption)',
  patternNote: 'Indirect space-vector modulation realised on the nine switches: in each carrier period the input phase with the largest input-current reference stays on one rail, the other rail is split between the two other input phases, and each output is connected to the input phase of its rail (the output is made of segments of the input voltages). Linear up to a transfer ratio of 0.75·cos φ_in with a sinusoidal reference, (√3/2)·cos φ_in with third-harmonic or space-vector references.',
  leg,
  presentation: {
    drawing: 'matrix',
    drawnUnit: 'output-phase',
    levelsInName: false,
    icon: [{ path: 'M6 10h36M6 24h36M6 38h36M14 6v38M24 6v38M34 6v38', thin: true }, { dot: [14, 10] }, { dot: [24, 24] }, { dot: [34, 38] }],
    form: { inputSide: true },
  },
}
