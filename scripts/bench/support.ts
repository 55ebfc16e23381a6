// What the benchmarks that start the built server share: the server on its own database and port, a
// signed-in cookie, and percentiles of sorted samples.
import { spawn } from 'node:child_process'
import { openSync } from 'node:fs'
import { join } from 'node:path'
import { ensureBuild, ensurePostgres, readSecrets, root, waitForHttp } from '../lib.mjs'

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

/**
 * The built server (.output or STRATAVOLT_BENCH_OUTPUT, built when out of date) on 127.0.0.1:`port` against database `database`,
 * recreated for the run; its output goes to .data/`name`-server.log. Resolves once health answers.
 */
export async function startBuiltServer(options: { database: string, port: number, name: string, uploads: string, seedDemo: boolean }): Promise<{ base: string, stop: () => void }> {
  const url = ensurePostgres([{ name: options.database, recreate: true }])(options.database)
  // STRATAVOLT_BENCH_OUTPUT=.output-test reuses the build `npm test` made (built again when out of date)
  const output = process.env.STRATAVOLT_BENCH_OUTPUT ?? '.output'
  const entry = ensureBuild({ output })
  const log = join(root, '.data', `${options.name}-server.log`)
  const server = spawn(process.execPath, [entry], {
    cwd: root,
    stdio: ['ignore', openSync(log, 'w'), openSync(log, 'a')],
    env: {
      ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(options.port), NUXT_DATABASE_URL: url,
      NUXT_SESSION_PASSWORD: readSecrets().sessionPassword, NUXT_SMTP_PORT: '1', NUXT_UPLOAD_DIR: join(root, '.data', options.uploads),
      ...(options.seedDemo ? { NUXT_SEED_DEMO: 'true' } : {}),
    },
  })
  const base = `http://127.0.0.1:${options.port}`
  const stop = () => { server.kill('SIGTERM') }
  try {
    await waitForHttp(`${base}/api/health`, 120000)
  }
  catch (err) {
    stop()
    throw err
  }
  return { base, stop }
}
