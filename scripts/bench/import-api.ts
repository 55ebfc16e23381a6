// End-to-end catalogue import through the built server and PostgreSQL: upload a 20 000-row .xlsx
// (read, store, map, validate, preview), then commit it as a catalogue version (one transaction).
// Uses its own database `stratavolt_bench`, recreated for the run, and a server on 127.0.0.1:3300.
import { spawn } from 'node:child_process'
import { openSync } from 'node:fs'
import { join } from 'node:path'
import { performance } from 'node:perf_hooks'
// @ts-expect-error -- plain ESM helper shared with the start and test scripts
import { demoAccounts, ensureBuild, ensurePostgres, readSecrets, root, waitForHttp } from '../lib.mjs'
import { manyParts, manyPartsWorkbook } from './catalog'

export interface ImportFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const PORT = 3300

async function signIn(base: string, email: string, password: string) {
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': base }, body: JSON.stringify({ email, password }) })
  if (r.status !== 200) throw new Error(`sign-in answered ${r.status}`)
  return r.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

export async function runImportApiBench(): Promise<ImportFigure[]> {
  const url = ensurePostgres([{ name: 'stratavolt_bench', recreate: true }])('stratavolt_bench')
  ensureBuild()
  const server = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], {
    cwd: root,
    stdio: ['ignore', openSync(join(root, '.data', 'bench-server.log'), 'w'), openSync(join(root, '.data', 'bench-server.log'), 'a')],
    env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(PORT), NUXT_DATABASE_URL: url, NUXT_SESSION_PASSWORD: readSecrets().sessionPassword, NUXT_SMTP_PORT: '1', NUXT_UPLOAD_DIR: join(root, '.data', 'bench-uploads'), NUXT_SEED_DEMO: 'true' },
  })
  const base = `http://127.0.0.1:${PORT}`
  try {
    await waitForHttp(`${base}/api/health`, 120000)
    const cookie = await signIn(base, 'components@example.com', demoAccounts.password)
    const parts = manyParts(20_000)
    const workbook = await manyPartsWorkbook(parts)
    const form = new FormData()
    form.append('file', new Blob([workbook]), 'bench-20000.xlsx')
    const t0 = performance.now()
    const up = await fetch(`${base}/api/catalog/imports`, { method: 'POST', headers: { cookie, origin: base }, body: form })
    const t1 = performance.now()
    if (up.status !== 201) throw new Error(`upload answered ${up.status}: ${(await up.text()).slice(0, 300)}`)
    const described = await up.json() as { import: { id: number }, mapping: unknown, decimalSeparator: string, preview: { validParts: number } }
    const commit = await fetch(`${base}/api/catalog/imports/${described.import.id}/commit`, {
      method: 'POST', headers: { cookie, 'origin': base, 'content-type': 'application/json' }, body: JSON.stringify({ mapping: described.mapping, decimalSeparator: described.decimalSeparator }),
    })
    const t2 = performance.now()
    if (commit.status !== 200) throw new Error(`commit answered ${commit.status}: ${(await commit.text()).slice(0, 300)}`)
    const summary = await commit.json() as { added: number }
    if (summary.added !== 20_000) throw new Error(`expected 20 000 new parts, got ${summary.added}`)
    const one = (name: string, ms: number, target?: string) => ({ name, p50Ms: ms, p99Ms: ms, runs: 1, ...(target ? { target } : {}) })
    return [
      one('API upload + preview of 20000 rows (.xlsx)', t1 - t0),
      one('API commit of 20000 new parts (one transaction)', t2 - t1),
      one('API import total: upload + preview + commit', t2 - t0, '< 10 s'),
    ]
  }
  finally {
    server.kill('SIGTERM')
  }
}
