// `npm run bench`: speed figures of the engine, the catalogue and the BOM, printed as a table.
import { spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { join } from 'node:path'
import { ensureDebianPackages, ensureNodeModules, root } from './lib.mjs'

ensureNodeModules()
// the ui suite (part of a run of every suite) drives Debian's Chromium
const only = process.argv[2]?.startsWith('--') ? undefined : process.argv[2]
if (!only || only === 'ui') ensureDebianPackages(['chromium'], () => existsSync('/usr/bin/chromium'))
const r = spawnSync('npx', ['tsx', join(root, 'scripts', 'bench', 'index.ts'), ...process.argv.slice(2)], { cwd: root, stdio: 'inherit' })
process.exit(r.status ?? 1)
