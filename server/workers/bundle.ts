// Bundles the worker threads' entry (server/workers/engine.ts) with esbuild, beside the Nitro server:
// Nitro bundles only what its own entry imports, and a worker thread needs a file of its own. Packages
// Nitro already traces into .output/server/node_modules stay external (resolved from there at run time).
import { fileURLToPath } from 'node:url'
import { dirname, join, resolve } from 'node:path'
import { build } from 'esbuild'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..')

/** Packages the worker resolves at run time instead of bundling (each is also a dependency of the server bundle). */
const EXTERNAL = ['exceljs', 'pdfmake', 'piscina', 'drizzle-orm', 'zod', 'postgres', 'pg-boss']

export async function bundleWorker(outDir: string) {
  await build({
    entryPoints: [join(root, 'server', 'workers', 'engine.ts')],
    outfile: join(outDir, 'workers', 'engine.mjs'),
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'esm',
    external: EXTERNAL.flatMap(p => [p, `${p}/*`]),
    // the two Nitro auto-imports that service code calls on this path
    inject: [join(root, 'server', 'workers', 'shims.ts')],
    define: { 'import.meta.dev': 'false' },
    banner: { js: 'import { createRequire as __svCreateRequire } from "node:module"; const require = __svCreateRequire(import.meta.url);' },
    logLevel: 'warning',
    plugins: [{
      name: 'nuxt-aliases',
      setup(b) {
        b.onResolve({ filter: /^(#shared|~~)\// }, args => b.resolve(args.path.startsWith('#shared/') ? join(root, 'shared', args.path.slice(8)) : join(root, args.path.slice(3)), { kind: args.kind, resolveDir: root }))
      },
    }],
  })
}
