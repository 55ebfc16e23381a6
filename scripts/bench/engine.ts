// Engine speed figures: one evaluation with spectrum per topology at N = 3, 5, 9, a 20-point design,
// and the sweep over every topology and level count 2…9. Run alone with `npx tsx scripts/bench/engine.ts`.
import { performance } from 'node:perf_hooks'
import { evaluateDesign, evaluateStress, topologies, type ConverterInput, type StressInput, type TopologyDefinition } from '../../shared/engine/index'

export interface EngineBenchFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

/** Times `f` over `runs` calls after a warm-up (JIT), p50 and p99 in ms. */
function measure(name: string, runs: number, f: () => void, target?: string): EngineBenchFigure {
  for (let k = 0; k < Math.max(3, Math.ceil(runs / 5)); k++) f()
  const times: number[] = []
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now()
    f()
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)]!
  return { name, p50Ms: round(at(0.5)), p99Ms: round(at(0.99)), runs, ...(target ? { target } : {}) }
}

const round = (ms: number) => Math.round(ms * 1000) / 1000

/** A 1.1 kV-link drive point at M ≈ 0.9 (cells of 700 V for the cascaded H-bridge; 400 V input for the matrix). */
function benchInput(t: TopologyDefinition, levels: number | undefined): StressInput {
  const N = levels ?? 3
  const dcVoltage = t.supply === 'cell' ? 700 : 1100
  const halfLink = t.supply === 'cell' ? ((N - 1) / 2) * dcVoltage : dcVoltage / 2
  return {
    topology: t.id,
    levels,
    dcVoltage,
    dcVoltageMax: dcVoltage * 1.1,
    inputLineVoltageRms: 400,
    lineVoltageRms: t.supply === 'ac-input' ? 320 : (0.9 * halfLink * Math.sqrt(3)) / Math.SQRT2,
    phaseCurrentRms: 300,
    powerFactor: 0.86,
    fundamentalHz: 50,
    switchingHz: 4000,
    modulation: 'space-vector',
    overshootVoltage: 80,
  }
}

const levelsOf = (t: TopologyDefinition, wanted: number[]): (number | undefined)[] =>
  t.allowedLevels === 'ignored' ? [undefined] : t.allowedLevels.filter(n => wanted.includes(n))

export async function runEngineBench(): Promise<EngineBenchFigure[]> {
  const figures: EngineBenchFigure[] = []
  for (const t of topologies) {
    const wanted = t.id === 'two-level' ? [2] : t.id === 'cascaded-h-bridge' ? [3, 5, 9, 15] : [3, 5, 9]
    for (const levels of levelsOf(t, wanted)) {
      const input = benchInput(t, levels)
      // The ratings issue's targets: one evaluation with spectrum at most 1 ms, the 15-level H-bridge under 2 ms.
      const target = levels === 15 ? 'p50 < 2 ms' : 'p50 ≤ 1 ms'
      figures.push(measure(`evaluateStress ${t.id}${levels ? ` N=${levels}` : ''} + spectrum`, 200, () => { evaluateStress(input, { includeSpectrum: true }) }, target))
    }
  }

  const twenty: ConverterInput = {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1200, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 80,
    operatingPoints: Array.from({ length: 20 }, (_, k) => ({ name: `P${k + 1}`, lineVoltageRms: 35 * (k + 1), phaseCurrentRms: 300, powerFactor: Math.cos((k * Math.PI) / 19), fundamentalHz: 2.5 * (k + 1) })),
  }
  figures.push(measure('evaluateDesign NPC, 20 operating points', 30, () => { evaluateDesign({ machineSide: twenty }) }))

  const sweep = topologies.flatMap(t => levelsOf(t, [2, 3, 4, 5, 6, 7, 8, 9]).map(levels => benchInput(t, levels)))
  figures.push(measure(`sweep: ${sweep.length} evaluations, every topology and N = 2…9, + spectrum`, 20, () => {
    for (const input of sweep) evaluateStress(input, { includeSpectrum: true })
  }, '< 250 ms'))
  return figures
}

// Run directly: print the table.
if (process.argv[1] && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) {
  const rows = await runEngineBench()
  console.table(rows)
}
