// Migrates and seeds before the first request is served; exits when either fails.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import { migrate } from 'drizzle-orm/postgres-js/migrator'
import { seedDemo } from '../db/seed'

async function migrationsFolder() {
  // The built server has no drizzle/ folder: the migrations travel as server assets.
  const storage = useStorage('assets:migrations')
  const dir = mkdtempSync(join(tmpdir(), 'stratavolt-migrations-'))
  for (const key of await storage.getKeys()) {
    const path = join(dir, ...key.split(':'))
    mkdirSync(dirname(path), { recursive: true })
    const value = await storage.getItemRaw(key)
    writeFileSync(path, typeof value === 'string' ? value : Buffer.from(value as ArrayBuffer))
  }
  return dir
}

export default defineNitroPlugin((nitro) => {
  const ready = (async () => {
    const started = Date.now()
    await migrate(useDb(), { migrationsFolder: await migrationsFolder() })
    if (useRuntimeConfig().seedDemo) await seedDemo(useDb())
    console.log(`[stratavolt] database ready in ${Date.now() - started} ms`)
    // the queue workers (server/plugins/queue.ts) start now
    void nitro.hooks.callHook('stratavolt:database-ready' as 'close')
  })().catch((err) => {
    console.error('[stratavolt] database set-up failed:', err)
    process.exit(1)
  })
  nitro.hooks.hook('request', async () => {
    await ready
  })
})
