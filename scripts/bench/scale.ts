// The catalogue at scale, through the built server and PostgreSQL: 100 000 invented parts imported
// in five files of 20 000 (five catalogue versions), then the parts browser's first page and a
// sorted page, a search, and matching every position of a five-level diode-clamped design.
// Uses its own database `stratavolt_bench_scale`, recreated for the run, and a server on 127.0.0.1:3301
// (STRATAVOLT_BENCH_PORT moves it, as for the load bench).
// Run alone with `npm run bench -- scale`.
import { performance } from 'node:perf_hooks'
import { demoAccounts } from '../lib.mjs'
import { FIVE_LEVEL_DRIVE, manyParts, manyPartsWorkbook } from './catalog'
import autocannon from 'autocannon'
import { probeHealth } from './load'
import { percentile, signIn, startBuiltServer } from './support'

export interface ScaleFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const PORT = Number(process.env.STRATAVOLT_BENCH_PORT ?? Number(process.env.PORT ?? 3000) + 301)
const FILES = 5
const PER_FILE = 20_000

/** p50 and p95 (reported in the p99 column's place, named so) of `runs` sequential GETs. */
async function timeGet(base: string, cookie: string, path: string, runs: number) {
  const samples: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now()
    const r = await fetch(base + path, { headers: { cookie } })
    await r.arrayBuffer()
    if (r.status !== 200) throw new Error(`GET ${path} answered ${r.status}`)
    samples.push(performance.now() - t0)
  }
  samples.sort((a, b) => a - b)
  return { p50Ms: percentile(samples, 50), p99Ms: percentile(samples, 95), runs }
}

const fiveLevelDesign = { name: 'Scale bench five-level drive', input: { machineSide: FIVE_LEVEL_DRIVE } }

export async function runScaleBench(): Promise<ScaleFigure[]> {
  const { base, stop } = await startBuiltServer({ database: 'stratavolt_bench_scale', port: PORT, name: 'bench-scale', uploads: 'bench-scale-uploads', seedDemo: true })
  try {
    const components = await signIn(base, 'components@example.com', demoAccounts.password)
    const engineer = await signIn(base, 'engineer@example.com', demoAccounts.password)
    const all = manyParts(FILES * PER_FILE)
    const tImport = performance.now()
    for (let f = 0; f < FILES; f++) {
      const workbook = await manyPartsWorkbook(all.slice(f * PER_FILE, (f + 1) * PER_FILE))
      const form = new FormData()
      form.append('file', new Blob([new Uint8Array(workbook)]), `scale-${f + 1}.xlsx`)
      const up = await fetch(`${base}/api/catalog/imports`, { method: 'POST', headers: { cookie: components, origin: base }, body: form })
      if (up.status !== 201) throw new Error(`upload ${f + 1} answered ${up.status}: ${(await up.text()).slice(0, 300)}`)
      const described = await up.json() as { import: { id: number }, mapping: unknown, decimalSeparator: string }
      const commit = await fetch(`${base}/api/catalog/imports/${described.import.id}/commit`, {
        method: 'POST', headers: { 'cookie': components, 'origin': base, 'content-type': 'application/json' }, body: JSON.stringify({ mapping: described.mapping, decimalSeparator: described.decimalSeparator }),
      })
      if (commit.status !== 200) throw new Error(`commit ${f + 1} answered ${commit.status}: ${(await commit.text()).slice(0, 300)}`)
      process.stderr.write(`  imported ${(f + 1) * PER_FILE} parts\n`)
    }
    const importMs = performance.now() - tImport
    const listed = await (await fetch(`${base}/api/catalog/parts?pageSize=1`, { headers: { cookie: components } })).json() as { total: number }
    if (listed.total < FILES * PER_FILE) throw new Error(`expected at least ${FILES * PER_FILE} parts, the browser counts ${listed.total}`)
    const created = await fetch(`${base}/api/designs`, { method: 'POST', headers: { 'cookie': engineer, 'origin': base, 'content-type': 'application/json' }, body: JSON.stringify(fiveLevelDesign) })
    if (created.status !== 201) throw new Error(`design answered ${created.status}: ${(await created.text()).slice(0, 300)}`)
    const design = await created.json() as { id: number }
    // the first matching call builds the part index; the figure is the steady state after it
    await fetch(`${base}/api/designs/${design.id}/parts`, { headers: { cookie: engineer } })
    const figures: ScaleFigure[] = [
      { name: `API import of ${FILES} × ${PER_FILE} parts (${FILES} versions)`, p50Ms: importMs, p99Ms: importMs, runs: 1 },
      { name: 'parts page 1 of 100 000 (p95 in the p99 column)', ...await timeGet(base, components, '/api/catalog/parts?page=1&pageSize=50', 40), target: 'p95 < 100 ms' },
      { name: 'parts page 800 sorted by price desc (p95)', ...await timeGet(base, components, '/api/catalog/parts?page=800&pageSize=50&sort=unitPrice&dir=desc', 40), target: 'p95 < 100 ms' },
      { name: 'parts search "V1234" in 100 000 (p95)', ...await timeGet(base, components, '/api/catalog/parts?q=V1234&pageSize=50', 40), target: 'p95 < 100 ms' },
      { name: 'match every position of a 5-level design, 100 000 parts (p95)', ...await timeGet(base, engineer, `/api/designs/${design.id}/parts`, 15), target: 'p95 < 200 ms' },
    ]
    // Matching at 100 000 parts under load (4 connections, 15 s): it runs on the worker threads, so health answers meanwhile.
    const stopProbe = probeHealth(base)
    const loaded = await autocannon({ url: `${base}/api/designs/${design.id}/parts`, headers: { cookie: engineer }, connections: 4, duration: 15 })
    const health = await stopProbe()
    figures.push({ name: `  the same at 4 connections: ${loaded.requests.total} answers, ${loaded.errors + loaded.timeouts + loaded.non2xx} errors`, p50Ms: loaded.latency.p50, p99Ms: loaded.latency.p99, runs: loaded.requests.total })
    figures.push({ name: `  GET /api/health meanwhile${health.failures ? ` (${health.failures} failed)` : ''}`, p50Ms: percentile(health.sorted, 50), p99Ms: percentile(health.sorted, 99), runs: health.sorted.length, target: '< 50 ms' })
    return figures
  }
  finally {
    stop()
  }
}
