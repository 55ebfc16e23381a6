// `npm run bench`: speed figures of the engine, the catalogue and the BOM, printed as a table.
import { spawnSync } from 'node:child_process'
import { join } from 'node:path'
import { ensureNodeModules, root } from './lib.mjs'

ensureNodeModules()
const r = spawnSync('npx', ['tsx', join(root, 'scripts', 'bench', 'index.ts'), ...process.argv.slice(2)], { cwd: root, stdio: 'inherit' })
process.exit(r.status ?? 1)
