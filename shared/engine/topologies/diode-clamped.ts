// Diode-clamped N-level leg (N = 3: the neutral-point-clamped leg).
import type { CapacitorDef, PositionDef, StateDef, TopologyDefinition } from '../model'

const range = (from: number, to: number): number[] => Array.from({ length: Math.max(0, to - from + 1) }, (_, k) => from + k)

/**
 * Upper switches S1…S(N−1) from the positive rail to the output, lower switches S(N)…S(2N−2) from
 * the output to the negative rail; junction U_j lies below S_j, junction L_j below S(N−1+j).
 * DC node l (0 = negative rail) feeds junction U(N−1−l) through the upper clamp diode Dc{l}+ and is
 * fed from junction L(N−1−l) through the lower clamp diode Dc{l}−. Unit voltage = V_dc/(N−1).
 */
function leg(N: number) {
  const upper = (j: number) => `S${j}`
  const lower = (j: number) => `S${N - 1 + j}`
  const U = (j: number) => (j === 0 ? `dc${N - 1}` : j === N - 1 ? 'out' : `U${j}`)
  const L = (j: number) => (j === 0 ? 'out' : j === N - 1 ? 'dc0' : `L${j}`)

  const positions: PositionDef[] = []
  for (const j of range(1, N - 1)) {
    const mirror = 2 * N - 1 - j
    positions.push({ name: upper(j), kind: 'switch', nodes: [U(j - 1), U(j)], mirror: `S${mirror}`, row: j - 1, column: 2 })
    positions.push({ name: `D${j}`, kind: 'diode', nodes: [U(j - 1), U(j)], mirror: `D${mirror}`, antiParallelTo: upper(j), row: j - 1, column: 2 })
  }
  for (const j of range(1, N - 1)) {
    const n = N - 1 + j
    const mirror = 2 * N - 1 - n
    positions.push({ name: lower(j), kind: 'switch', nodes: [L(j - 1), L(j)], mirror: `S${mirror}`, row: n - 1, column: 2 })
    positions.push({ name: `D${n}`, kind: 'diode', nodes: [L(j - 1), L(j)], mirror: `D${mirror}`, antiParallelTo: lower(j), row: n - 1, column: 2 })
  }
  for (const l of range(1, N - 2)) {
    const j = N - 1 - l
    positions.push({ name: `Dc${l}+`, kind: 'clamp-diode', nodes: [U(j), `dc${l}`], mirror: `Dc${N - 1 - l}-`, row: j - 0.5, column: 1 })
    positions.push({ name: `Dc${l}-`, kind: 'clamp-diode', nodes: [`dc${l}`, L(j)], mirror: `Dc${N - 1 - l}+`, row: N - 1.5 + j, column: 1 })
  }

  const states: StateDef[] = range(0, N - 1).map((l) => {
    const nodeVoltages: Record<string, number> = { out: l }
    for (const k of range(0, N - 1)) nodeVoltages[`dc${k}`] = k
    // A junction joined to the output through on-switches sits at the output; otherwise its clamp diode holds it at its DC node.
    for (const j of range(1, N - 2)) {
      nodeVoltages[`U${j}`] = j >= N - 1 - l ? l : N - 1 - j
      nodeVoltages[`L${j}`] = j <= N - 1 - l ? l : N - 1 - j
    }
    const on = range(N - l, 2 * N - 2 - l).map(k => `S${k}`)
    const top = l === N - 1
    const bottom = l === 0
    const positive = top
      ? range(1, N - 1).map(upper)
      : bottom
        ? range(N, 2 * N - 2).map(k => `D${k}`)
        : [`Dc${l}+`, ...range(N - l, N - 1).map(upper)]
    const negative = top
      ? range(1, N - 1).map(k => `D${k}`)
      : bottom
        ? range(N, 2 * N - 2).map(k => `S${k}`)
        : [...range(N, 2 * N - 2 - l).map(k => `S${k}`), `Dc${l}-`]
    return { name: `L${l}`, level: l, on, nodeVoltages, positive, negative }
  })

  const capacitors: CapacitorDef[] = range(1, N - 1).map(j => ({
    name: `Cdc${j}`, kind: 'dc-link', role: 'split', nodes: [`dc${j}`, `dc${j - 1}`], voltageUnits: 1, countInConverter: 1, splitIndex: j, row: 2 * (N - 1 - j) + 0.5, column: 0,
  }))

  return { modelLevels: N, outputNode: 'out', carrier: 'phase-disposition' as const, capacitorModel: 'split' as const, positions, states, capacitors }
}

export const diodeClamped: TopologyDefinition = {
  id: 'diode-clamped',
  label: 'Diode-clamped multilevel',
  description: 'Series string of 2(N−1) switches per phase; clamp diodes tie the string to the N−2 inner DC-link taps (N = 3 is the neutral-point-clamped leg).',
  allowedLevels: range(3, 9),
  modulations: ['sine', 'third-harmonic', 'space-vector'],
  supply: 'dc-link',
  structureSource: 'J. Rodriguez, J.-S. Lai, F. Z. Peng, IEEE TIE 49(4) 2002; A. Nabae, I. Takahashi, H. Akagi, IEEE TIA 1981',
  currentSource: 'G. I. Orfanoudakis, M. A. Yuratich, S. M. Sharkh, IET PEMD 2010 (NPC outer switch); leg current balance (first principles)',
  leg,
  presentation: {
    drawing: 'stack',
    drawnUnit: 'phase-leg',
    levelsInName: true,
    icon: [{ path: 'M8 6h32M8 42h32M8 24h8M28 6v4M28 38v4M28 24h12' }, { rect: [24, 10, 8, 5] }, { rect: [24, 17, 8, 5] }, { rect: [24, 26, 8, 5] }, { rect: [24, 33, 8, 5] }, { path: 'M16 16v16M16 16h8M16 32h8' }, { path: 'M13 19l3 3 3-3M13 29l3-3 3 3', thin: true }],
    form: { clampDiodeUnitVoltage: true },
  },
}
