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

/**
 * Without the demo: the first administrator (NUXT_ADMIN_EMAIL) is invited when no account exists
 * yet; the one-time link is printed to the server log (and mailed when mail works).
 */
async function createFirstAdmin(email: string) {
  const db = useDb()
  const [any] = await db.select({ id: tables.users.id }).from(tables.users).limit(1)
  if (any) return
  const [admin] = await db.insert(tables.users).values({ email: email.trim().toLowerCase(), name: 'Administrator', role: 'admin' }).returning()
  const link = await issueOneTimeLink(admin!.id, 'invite')
  console.log(`[stratavolt] first administrator ${admin!.email} created: set the password at ${link.url} (valid until ${link.expiresAt.toISOString()})`)
  void sendMail({ to: admin!.email, subject: 'You are invited to Stratavolt', text: `Set your administrator password here (the link works once, for 7 days):\n\n${link.url}\n` })
}

export default defineNitroPlugin((nitro) => {
  const ready = (async () => {
    const started = Date.now()
    await migrate(useDb(), { migrationsFolder: await migrationsFolder() })
    const config = useRuntimeConfig()
    if (config.seedDemo) await seedDemo(useDb())
    else if (config.adminEmail) await createFirstAdmin(String(config.adminEmail))
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
