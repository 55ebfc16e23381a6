// `npm run dev`: PostgreSQL and the fake SMTP server as for start, then `nuxt dev` with hot reload.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { dataDir, detachedRunning, ensureNodeModules, ensurePortFree, ensurePostgres, readSecrets, root, startDetached } from './lib.mjs'

const port = Number(process.env.PORT ?? 3000)
const smtpPort = Number(process.env.STRATAVOLT_SMTP_PORT ?? 2525)

try {
  ensureNodeModules()
  const databaseUrl = process.env.DATABASE_URL ?? ensurePostgres([{ name: 'stratavolt' }])('stratavolt')
  const demo = process.env.STRATAVOLT_DEMO !== undefined ? process.env.STRATAVOLT_DEMO === '1' : !process.env.DATABASE_URL
  const mailbox = join(dataDir, 'mailbox')
  await ensurePortFree(port, 'PORT', 'the app')
  if (!detachedRunning('fake-smtp')) await ensurePortFree(smtpPort, 'STRATAVOLT_SMTP_PORT', 'the fake mail server')
  startDetached('fake-smtp', process.execPath, [join(root, 'scripts', 'fake-smtp.mjs')], { SMTP_PORT: String(smtpPort), MAILBOX_DIR: mailbox })
  const child = spawn('npx', ['nuxt', 'dev', '--host', '127.0.0.1', '--port', String(port)], {
    cwd: root,
    stdio: 'inherit',
    env: {
      ...process.env, NUXT_DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: readSecrets().sessionPassword, NUXT_MAILBOX_DIR: mailbox,
      NUXT_SMTP_PORT: String(smtpPort), NUXT_APP_URL: process.env.NUXT_APP_URL ?? `http://127.0.0.1:${port}`, NUXT_SEED_DEMO: demo ? 'true' : 'false',
    },
  })
  child.on('exit', code => process.exit(code ?? 0))
}
catch (err) {
  console.error(`[stratavolt] dev failed: ${err.message}`)
  process.exit(1)
}
