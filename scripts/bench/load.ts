// Load on the built server (its own database `stratavolt_bench`, recreated): POST /api/v1/stress and
// GET /api/designs at 1, 10 and 50 connections (autocannon), with the health route's latency probed
// every 50 ms during each run, and a single signed-in stress round trip measured on its own.
// `npm run bench -- load --duration 5` shortens the runs (default 20 s each).
import { spawn } from 'node:child_process'
import { Agent, request } from 'node:http'
import { readFileSync } from 'node:fs'
import { performance } from 'node:perf_hooks'
import autocannon from 'autocannon'
import { evaluateStress } from '../../shared/engine'
import { demoAccounts } from '../lib.mjs'
import { startBuiltServer } from './support'

export interface LoadFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const PORT = Number(process.env.STRATAVOLT_BENCH_PORT ?? Number(process.env.PORT ?? 3000) + 301)
const base = `http://127.0.0.1:${PORT}`

/** The README's example: a three-level NPC at 690 V, 400 A (no waveform). */
export const STRESS_BODY = JSON.stringify({
  topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, lineVoltageRms: 690, phaseCurrentRms: 400,
  powerFactor: 0.86, fundamentalHz: 50, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 120,
})

/** A 20-point design evaluation (a load cycle of one NPC drive): a large answer, encoded on the worker thread. */
export const EVALUATE_20_BODY = JSON.stringify({
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 120,
    operatingPoints: Array.from({ length: 20 }, (_, i) => ({ name: `Point ${i + 1}`, lineVoltageRms: 690 - 30 * i, phaseCurrentRms: 200 + 12 * i, powerFactor: 0.86, fundamentalHz: 50 - 2 * i })),
  },
})

function durationSeconds() {
  const i = process.argv.indexOf('--duration')
  const n = i > 0 ? Number(process.argv[i + 1]) : 20
  return Number.isFinite(n) && n > 0 ? n : 20
}

/** CPU time (ms, all threads) the server process has used so far, from /proc (Linux clock ticks of 10 ms). */
function serverCpuMs(pid: number | undefined) {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ')
    return (Number(fields[11]) + Number(fields[12])) * 10
  }
  catch {
    return Number.NaN
  }
}

const quantile = (sorted: number[], q: number) => sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]! : NaN

let agent = new Agent({ keepAlive: true, maxSockets: 1 })
/** `compute;dur=…` of a Server-Timing header (ms the worker thread computed), NaN without it. */
function computeMs(header: string | string[] | undefined) {
  const m = /(?:^|,)\s*compute;dur=([\d.]+)/.exec(String(header ?? ''))
  return m ? Number(m[1]) : Number.NaN
}

/** One request on a kept-alive socket; resolves with the status, the elapsed and the server's compute milliseconds. */
function timed(method: string, path: string, headers: Record<string, string>, body?: string): Promise<{ status: number, ms: number, computeMs: number }> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now()
    const req = request(`${base}${path}`, { method, headers, agent }, (res) => {
      res.resume()
      res.on('end', () => resolve({ status: res.statusCode ?? 0, ms: performance.now() - t0, computeMs: computeMs(res.headers['server-timing']) }))
    })
    req.on('error', reject)
    req.end(body)
  })
}

/**
 * Probes GET /api/health every 50 ms from a process of its own (so that the load generator's busy event
 * loop does not count as server latency) until stopped; returns the sorted latencies in ms.
 */
const PROBE = `
const { Agent, request } = require('node:http')
const agent = new Agent({ keepAlive: true, maxSockets: 1 })
const samples = []; let failures = 0; let running = true
process.stdin.on('data', () => { running = false })
;(async () => {
  while (running) {
    const t0 = performance.now()
    const status = await new Promise((resolve) => {
      const req = request(process.argv[1] + '/api/health', { agent }, (res) => { res.resume(); res.on('end', () => resolve(res.statusCode)) })
      req.on('error', () => resolve(0))
      req.end()
    })
    if (status === 200) samples.push(performance.now() - t0); else failures++
    await new Promise(r => setTimeout(r, 50))
  }
  process.stdout.write(JSON.stringify({ samples, failures }))
  process.exit(0)
})()`

export function probeHealth(server = base) {
  const child = spawn(process.execPath, ['-e', PROBE, server], { stdio: ['pipe', 'pipe', 'inherit'] })
  let out = ''
  child.stdout.on('data', (c: Buffer) => { out += c })
  const done = new Promise<void>(resolve => child.on('exit', () => resolve()))
  return async () => {
    child.stdin.write('stop\n')
    await done
    const { samples, failures } = JSON.parse(out || '{"samples":[],"failures":0}') as { samples: number[], failures: number }
    return { sorted: samples.sort((a, b) => a - b), failures }
  }
}

/** p50 / p99 of `runs` round trips one at a time (after `warm` unmeasured ones), and the server's CPU per request. */
async function oneAtATime(pid: number | undefined, method: string, path: string, headers: Record<string, string>, body: string | undefined, runs: number, warm: number) {
  for (let i = 0; i < warm; i++) await timed(method, path, headers, body)
  const samples: number[] = []
  const compute: number[] = []
  const overhead: number[] = []
  const cpu0 = serverCpuMs(pid)
  for (let i = 0; i < runs; i++) {
    const r = await timed(method, path, headers, body)
    if (r.status !== 200) throw new Error(`${method} ${path} answered ${r.status}`)
    samples.push(r.ms)
    compute.push(r.computeMs)
    overhead.push(r.ms - r.computeMs)
  }
  const up = (a: number, b: number) => a - b
  return { sorted: samples.sort(up), compute: compute.sort(up), overhead: overhead.sort(up), cpuMs: (serverCpuMs(pid) - cpu0) / runs }
}

/** The engine's own time for the same input in this process (no HTTP, no thread hop), sorted ms. */
function engineAlone(input: Parameters<typeof evaluateStress>[0], runs: number) {
  const samples: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now()
    evaluateStress(input)
    samples.push(performance.now() - t0)
  }
  return samples.sort((a, b) => a - b)
}

async function signIn(email: string) {
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password: demoAccounts.password }) })
  if (r.status !== 200) throw new Error(`sign-in answered ${r.status}`)
  return r.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

export async function runLoadBench(): Promise<LoadFigure[]> {
  const seconds = durationSeconds()
  // .output (or STRATAVOLT_BENCH_OUTPUT=.output-test: the build `npm test` made) on its own database and port
  const started = await startBuiltServer({ database: 'stratavolt_bench', port: PORT, name: 'bench-load', uploads: 'bench-uploads', seedDemo: true })
  const serverPid = started.pid
  const figures: LoadFigure[] = []
  try {
    const cookie = await signIn('engineer@example.com')
    const origin = base
    const tokenAnswer = await fetch(`${base}/api/tokens`, { method: 'POST', headers: { cookie, origin, 'content-type': 'application/json' }, body: JSON.stringify({ name: 'load bench' }) })
    if (tokenAnswer.status !== 201) throw new Error(`token creation answered ${tokenAnswer.status}: ${await tokenAnswer.text()}`)
    const { token } = await tokenAnswer.json() as { token: string }
    const stressHeaders = { 'authorization': `Bearer ${token}`, 'content-type': 'application/json', 'accept-encoding': 'gzip' }
    const designHeaders = { cookie, 'accept-encoding': 'gzip' }

    // One signed-in round trip at a time (after a warm-up). Each answer's Server-Timing says how long the worker
    // thread computed it; round trip minus that is the per-request overhead (HTTP, guard, validation, the thread
    // hop, encoding), per request. The engine alone in this process right after is printed for comparison (it
    // runs at normal priority here, the server's threads at nice 10).
    const single = await oneAtATime(serverPid, 'POST', '/api/v1/stress', stressHeaders, STRESS_BODY, 1000, 200)
    const engine = engineAlone(JSON.parse(STRESS_BODY), 500)
    figures.push({ name: `POST /api/v1/stress, one at a time (signed in, no waveform; server CPU ${single.cpuMs.toFixed(2)} ms/request)`, p50Ms: quantile(single.sorted, 0.5), p99Ms: quantile(single.sorted, 0.99), runs: single.sorted.length })
    figures.push({ name: '  of which computing on the worker thread (its Server-Timing)', p50Ms: quantile(single.compute, 0.5), p99Ms: quantile(single.compute, 0.99), runs: single.compute.length })
    figures.push({ name: '  overhead per request = round trip − worker compute', p50Ms: quantile(single.overhead, 0.5), p99Ms: quantile(single.overhead, 0.99), runs: single.overhead.length, target: 'p50 < 2 ms' })
    figures.push({ name: '  the same evaluation alone in the bench process (engine, no HTTP), right after', p50Ms: quantile(engine, 0.5), p99Ms: quantile(engine, 0.99), runs: engine.length })

    // Large answers, encoded (JSON + gzip) on the worker thread: one at a time, with the server's CPU per request
    const [firstDesign] = await (await fetch(`${base}/api/designs`, { headers: { cookie } })).json() as { id: number }[]
    const large = [
      { label: 'POST /api/v1/evaluate, 20 points', method: 'POST', path: '/api/v1/evaluate', headers: stressHeaders, body: EVALUATE_20_BODY },
      { label: 'GET /api/designs/:id/results', method: 'GET', path: `/api/designs/${firstDesign!.id}/results`, headers: designHeaders, body: undefined },
      { label: 'GET /api/designs/:id/parts (matching)', method: 'GET', path: `/api/designs/${firstDesign!.id}/parts`, headers: designHeaders, body: undefined },
    ]
    for (const l of large) {
      const r = await oneAtATime(serverPid, l.method, l.path, l.headers, l.body, 60, 10)
      figures.push({ name: `${l.label}, one at a time (gzip; server CPU ${r.cpuMs.toFixed(2)} ms/request)`, p50Ms: quantile(r.sorted, 0.5), p99Ms: quantile(r.sorted, 0.99), runs: r.sorted.length })
    }
    agent.destroy()
    agent = new Agent({ keepAlive: true, maxSockets: 1 })

    // part matching of a demo design (demo catalogue) runs on the worker threads too: health must not wait for it
    const [demoDesign] = await (await fetch(`${base}/api/designs`, { headers: { cookie } })).json() as { id: number }[]
    const routes = [
      { label: 'POST /api/v1/stress', method: 'POST' as const, path: '/api/v1/stress', headers: stressHeaders, body: STRESS_BODY, connections: [1, 10, 50] },
      { label: 'GET /api/designs', method: 'GET' as const, path: '/api/designs', headers: designHeaders, body: undefined, connections: [1, 10, 50] },
      { label: 'GET /api/designs/:id/parts', method: 'GET' as const, path: `/api/designs/${demoDesign!.id}/parts`, headers: designHeaders, body: undefined, connections: [10] },
      { label: 'POST /api/v1/evaluate (20 points)', method: 'POST' as const, path: '/api/v1/evaluate', headers: stressHeaders, body: EVALUATE_20_BODY, connections: [10] },
    ]
    for (const route of routes) {
      for (const connections of route.connections) {
        process.stderr.write(`  ${route.label} at ${connections} connection(s) for ${seconds} s…\n`)
        const stop = probeHealth()
        const cpuBefore = serverCpuMs(serverPid)
        const r = await autocannon({ url: `${base}${route.path}`, method: route.method, headers: route.headers, body: route.body, connections, duration: seconds })
        const cpuPerRequest = (serverCpuMs(serverPid) - cpuBefore) / Math.max(1, r.requests.total)
        const health = await stop()
        const errors = r.errors + r.timeouts + r.non2xx
        const stress50 = route.path === '/api/v1/stress' && connections === 50
        figures.push({
          name: `${route.label}, ${connections} conn: ${Math.round(r.requests.average)} req/s, ${errors} errors, server CPU ${cpuPerRequest.toFixed(2)} ms/req`,
          p50Ms: r.latency.p50, p99Ms: r.latency.p99, runs: r.requests.total,
          target: stress50 ? 'p99 < 150 ms, 0 errors' : '0 errors',
        })
        figures.push({
          name: `  GET /api/health meanwhile${health.failures ? ` (${health.failures} failed)` : ''}, max ${quantile(health.sorted, 1).toFixed(1)} ms`,
          p50Ms: quantile(health.sorted, 0.5), p99Ms: quantile(health.sorted, 0.99), runs: health.sorted.length,
          target: stress50 || route.path.endsWith('/parts') || route.path.endsWith('/evaluate') ? '< 50 ms' : '',
        })
      }
    }
    // how much the compression saves on a results answer and a matching answer
    const [design] = await (await fetch(`${base}/api/designs`, { headers: { cookie } })).json() as { id: number }[]
    for (const path of [`/api/designs/${design!.id}/results`, `/api/designs/${design!.id}/parts`]) {
      const plain = await fetch(`${base}${path}`, { headers: { cookie, 'accept-encoding': 'identity' } })
      const plainBytes = (await plain.arrayBuffer()).byteLength
      const zipped = await new Promise<number>((resolve, reject) => {
        const req = request(`${base}${path}`, { headers: { cookie, 'accept-encoding': 'gzip' } }, (res) => {
          let n = 0
          res.on('data', (c: Buffer) => { n += c.length })
          res.on('end', () => resolve(res.headers['content-encoding'] === 'gzip' ? n : Number.NaN))
        })
        req.on('error', reject)
        req.end()
      })
      figures.push({ name: `gzip ${path.replace(/\/\d+\//, '/:id/')}: ${(plainBytes / 1024).toFixed(0)} KiB → ${(zipped / 1024).toFixed(1)} KiB (${(plainBytes / zipped).toFixed(1)}×)`, p50Ms: 0, p99Ms: 0, runs: 1 })
    }
  }
  finally {
    agent.destroy()
    started.stop()
  }
  return figures
}
