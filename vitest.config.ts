import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

// Three kinds of test, each runnable on its own: `npx vitest run --project unit` needs nothing;
// api and browser expect the server that `npm test` starts (STRATAVOLT_TEST_URL).
const alias = {
  '~~': fileURLToPath(new URL('./', import.meta.url)),
  '#shared': fileURLToPath(new URL('./shared', import.meta.url)),
}

export default defineConfig({
  test: {
    projects: [
      // Timeouts sized for a loaded shared 2-core machine (a PDF render there can take several
      // seconds); they catch hangs, not slowness: speed is measured by `npm run bench`.
      { resolve: { alias }, test: { name: 'unit', environment: 'node', include: ['tests/unit/**/*.test.ts'], testTimeout: 60000, hookTimeout: 60000 } },
      { resolve: { alias }, test: { name: 'api', environment: 'node', include: ['tests/api/**/*.test.ts'], testTimeout: 90000, hookTimeout: 120000 } },
      { resolve: { alias }, test: { name: 'browser', environment: 'node', include: ['tests/browser/**/*.test.ts'], testTimeout: 90000, hookTimeout: 90000, fileParallelism: false } },
    ],
  },
})
