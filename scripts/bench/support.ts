// What the benchmarks that start the built server share: the server on its own database and port, a
// signed-in cookie, and percentiles of sorted samples.
import { spawn } from 'node:child_process'
import { closeSync, openSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { ensureBuild, ensurePortFree, ensurePostgres, readSecrets, root } from '../lib.mjs'

export function percentile(sorted: number[], p: number): number {
  const index = Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)
  return Math.round(sorted[Math.max(0, index)]! * 10) / 10
}

/** The session cookie of a demo account on the server at `base`. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password }) })
  if (r.status !== 200) throw new Error(`sign-in as ${email} answered ${r.status}`)
  return r.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

/** The last lines of the server's log, for an error message. */
function logTail(log: string): string {
  try { return readFileSync(log, 'utf8').trimEnd().split('\n').slice(-15).join('\n') }
  catch { return '(no log)' }
}

/**
 * The built server (.output or STRATAVOLT_BENCH_OUTPUT, built when out of date) on 127.0.0.1:`port` against database `database`,
 * recreated for the run (kept as it is with `keep`: migrations and the idempotent demo seed still run); its output (stdout and stderr, one file) goes to .data/`name`-server.log. Resolves once
 * health answers 200 from this server, i.e. after its migrations and seed (server/plugins/00.database.ts holds every
 * request until then).
 *
 * The port must be free first: a server left over from an earlier run (or another checkout's bench on the same
 * port) would otherwise answer health while ours exits with EADDRINUSE, and since the database was just recreated
 * under the old server, its first query fails with "relation … does not exist". The server is stopped when the
 * benchmark process exits, however it exits.
 */
export async function startBuiltServer(options: { database: string, port: number, name: string, uploads: string, seedDemo: boolean, keep?: boolean }): Promise<{ base: string, pid: number | undefined, stop: () => void }> {
  await ensurePortFree(options.port, 'STRATAVOLT_BENCH_PORT', `the ${options.name} server`)
  const url = ensurePostgres([{ name: options.database, recreate: !options.keep }])(options.database)
  // STRATAVOLT_BENCH_OUTPUT=.output-test reuses the build `npm test` made (built again when out of date)
  const output = process.env.STRATAVOLT_BENCH_OUTPUT ?? '.output'
  const entry = ensureBuild({ output })
  const log = join(root, '.data', `${options.name}-server.log`)
  // one descriptor for both streams: two (one 'w', one 'a') overwrite each other's lines
  const out = openSync(log, 'w')
  const server = spawn(process.execPath, [entry], {
    cwd: root,
    stdio: ['ignore', out, out],
    env: {
      ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(options.port), NUXT_DATABASE_URL: url,
      NUXT_SESSION_PASSWORD: readSecrets().sessionPassword, NUXT_SMTP_PORT: '1', NUXT_UPLOAD_DIR: join(root, '.data', options.uploads),
      NUXT_SEED_DEMO: options.seedDemo ? 'true' : 'false',
    },
  })
  closeSync(out)
  const base = `http://127.0.0.1:${options.port}`
  const stop = () => {
    process.off('exit', stop)
    if (server.exitCode === null && server.signalCode === null) server.kill('SIGTERM')
  }
  process.on('exit', stop)
  const exited = new Promise<never>((_, reject) => {
    server.once('exit', (code, signal) => reject(new Error(`the ${options.name} server exited (${signal ?? `code ${code}`}) before it was ready; ${log}:\n${logTail(log)}`)))
  })
  exited.catch(() => { /* only raced below */ })
  try {
    await Promise.race([waitForHealthy(`${base}/api/health`, 180000), exited])
    // health answered: make sure it was this process (the port check above leaves a short race)
    if (server.exitCode !== null || server.signalCode !== null) await exited
  }
  catch (err) {
    stop()
    if (err instanceof Error && !err.message.includes(log)) err.message += `; ${log}:\n${logTail(log)}`
    throw err
  }
  return { base, pid: server.pid, stop }
}

/** Polls until `url` answers 200 (health answers 503 while the database is down). */
async function waitForHealthy(url: string, timeoutMs: number): Promise<void> {
  const start = Date.now()
  let last = 'no answer'
  while (Date.now() - start < timeoutMs) {
    try {
      const r = await fetch(url)
      if (r.status === 200) return
      last = `${r.status} ${(await r.text()).slice(0, 200)}`
    }
    catch (err) { last = err instanceof Error ? err.message : String(err) }
    await new Promise(res => setTimeout(res, 250))
  }
  throw new Error(`${url} did not answer 200 within ${timeoutMs / 1000} s (last: ${last})`)
}
