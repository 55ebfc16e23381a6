// `npm run bench`: runs each benchmark module and prints one table. Figures are wall-clock on this machine.
import { runBomBench } from './bom'
import { runCatalogBench } from './catalog'
import { runEngineBench } from './engine'
import { runImportApiBench } from './import-api'
import { runLoadBench } from './load'
import { runScaleBench } from './scale'
import { runTradeBench } from './trade'
import { runUiBench } from './ui'

interface Figure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const suites: [string, () => Promise<Figure[]>][] = [
  ['engine', runEngineBench],
  ['trade', runTradeBench],
  ['catalogue', runCatalogBench],
  ['bom', runBomBench],
  ['import-api', runImportApiBench],
  ['load', runLoadBench],
  ['scale', runScaleBench],
  ['ui', runUiBench],
]
const only = process.argv[2]?.startsWith('--') ? undefined : process.argv[2]

const rows: (Figure & { suite: string })[] = []
for (const [suite, run] of suites) {
  if (only && only !== suite) continue
  process.stderr.write(`running ${suite}…\n`)
  for (const f of await run()) rows.push({ suite, ...f })
}
const fmt = (ms: number) => (Number.isNaN(ms) ? '—' : ms >= 100 ? ms.toFixed(0) : ms >= 10 ? ms.toFixed(1) : ms.toFixed(2))
const header = ['suite', 'what', 'p50 [ms]', 'p99 [ms]', 'runs', 'target']
const table = rows.map(r => [r.suite, r.name, fmt(r.p50Ms), fmt(r.p99Ms), String(r.runs), r.target ?? ''])
const widths = header.map((h, i) => Math.max(h.length, ...table.map(r => r[i]!.length)))
const line = (cells: string[]) => cells.map((c, i) => (i >= 2 && i <= 4 ? c.padStart(widths[i]!) : c.padEnd(widths[i]!))).join('  ')
console.log(line(header))
console.log(widths.map(w => '-'.repeat(w)).join('  '))
for (const r of table) console.log(line(r))
