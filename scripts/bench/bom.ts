// BOM speed figures: building a 500-line BOM and exporting it to .xlsx and PDF (build included in
// each export figure). Run alone with
// `npx tsx -e "import('./scripts/bench/bom.ts').then(m=>m.runBomBench()).then(r=>console.table(r))"`.
import { performance } from 'node:perf_hooks'
import { buildBomSnapshot } from '../../shared/bom/build'
import { bomToPdf } from '../../server/exports/bom-pdf'
import { bomToXlsx } from '../../server/exports/bom-xlsx'
import { loadFontsFromNodeModules } from '../../server/exports/pdf'
import { largeInput, snapshotHeader } from '../../tests/unit/bom/fixtures'

export interface BomBenchFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const round = (ms: number) => Math.round(ms * 10) / 10

/** Times `f` over `runs` calls after `warmUp` calls (JIT, font parsing), p50 and p99 in ms. */
async function measure(name: string, runs: number, warmUp: number, f: () => unknown, target?: string): Promise<BomBenchFigure> {
  for (let k = 0; k < warmUp; k++) await f()
  const times: number[] = []
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now()
    await f()
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)]!
  return { name, p50Ms: round(at(0.5)), p99Ms: round(at(0.99)), runs, ...(target ? { target } : {}) }
}

export async function runBomBench(): Promise<BomBenchFigure[]> {
  const input = largeInput(500)
  const header = snapshotHeader({ designName: 'Benchmark BOM, 500 lines' })
  const fonts = await loadFontsFromNodeModules()
  const lines = buildBomSnapshot(header, input).lines.length
  if (lines !== 500) throw new Error(`benchmark BOM has ${lines} lines, expected 500`)
  return [
    await measure('build 500-line BOM (buildBomSnapshot)', 50, 5, () => buildBomSnapshot(header, input)),
    await measure('build + export 500-line BOM to .xlsx', 20, 2, () => bomToXlsx(buildBomSnapshot(header, input)), 'p50 < 1000 ms'),
    await measure('build + export 500-line BOM to PDF', 10, 2, () => bomToPdf(buildBomSnapshot(header, input), fonts), 'p50 < 2000 ms'),
  ]
}
