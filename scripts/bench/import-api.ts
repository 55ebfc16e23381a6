// End-to-end catalogue import through the built server and PostgreSQL: upload a 20 000-row .xlsx
// (read, store, map, validate, preview), then commit it as a catalogue version (one transaction).
// Uses its own database `stratavolt_bench`, recreated for the run, and a server on 127.0.0.1:3300.
import { performance } from 'node:perf_hooks'
import { demoAccounts } from '../lib.mjs'
import { manyParts, manyPartsWorkbook } from './catalog'
import { signIn, startBuiltServer } from './support'

export interface ImportFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const PORT = 3300

export async function runImportApiBench(): Promise<ImportFigure[]> {
  const { base, stop } = await startBuiltServer({ database: 'stratavolt_bench', port: PORT, name: 'bench', uploads: 'bench-uploads', seedDemo: true })
  try {
    const cookie = await signIn(base, 'components@example.com', demoAccounts.password)
    const parts = manyParts(20_000)
    const workbook = await manyPartsWorkbook(parts)
    const form = new FormData()
    form.append('file', new Blob([new Uint8Array(workbook)]), 'bench-20000.xlsx')
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
    stop()
  }
}
