// `npm start`: install what is missing, start PostgreSQL and the fake SMTP server, build, serve.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import {
  dataDir, demoAccounts, detachedRunning, ensureBuild, ensureNodeModules, ensurePortFree, ensurePostgres, log, readSecrets, root,
  startDetached, waitForHttp, waitForPort,
} from './lib.mjs'

const port = Number(process.env.PORT ?? 3000)
const smtpPort = Number(process.env.STRATAVOLT_SMTP_PORT ?? 2525)

try {
  ensureNodeModules()
  const databaseUrl = process.env.DATABASE_URL ?? ensurePostgres([{ name: 'stratavolt' }])('stratavolt')
  // Demo mode (demo accounts with a published password, invented designs and catalogue): on for the
  // project-local database, off when the operator points the app at their own DATABASE_URL.
  // STRATAVOLT_DEMO=1 / 0 overrides either way.
  const demo = process.env.STRATAVOLT_DEMO !== undefined ? process.env.STRATAVOLT_DEMO === '1' : !process.env.DATABASE_URL
  const secrets = readSecrets()
  const mailbox = join(dataDir, 'mailbox')
  const useFakeSmtp = !process.env.NUXT_SMTP_HOST
  await ensurePortFree(port, 'PORT', 'the app')
  if (useFakeSmtp) {
    if (!detachedRunning('fake-smtp')) await ensurePortFree(smtpPort, 'STRATAVOLT_SMTP_PORT', 'the fake mail server')
    startDetached('fake-smtp', process.execPath, [join(root, 'scripts', 'fake-smtp.mjs')], { SMTP_PORT: String(smtpPort), MAILBOX_DIR: mailbox })
    await waitForPort(smtpPort)
  }
  const entry = ensureBuild()
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    HOST: process.env.HOST ?? '127.0.0.1',
    PORT: String(port),
    NUXT_DATABASE_URL: databaseUrl,
    NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD ?? secrets.sessionPassword,
    NUXT_APP_URL: process.env.NUXT_APP_URL ?? `http://127.0.0.1:${port}`,
    STRATAVOLT_DEMO: demo ? '1' : '0',
    NUXT_SEED_DEMO: demo ? 'true' : 'false',
    ...(useFakeSmtp ? { NUXT_SMTP_HOST: '127.0.0.1', NUXT_SMTP_PORT: String(smtpPort), NUXT_MAILBOX_DIR: mailbox } : {}),
  }
  const server = spawn(process.execPath, [entry], { cwd: root, env, stdio: 'inherit' })
  server.on('exit', code => process.exit(code ?? 0))
  for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.kill(sig))
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 120000)
  log(`Stratavolt is ready at http://127.0.0.1:${port}`)
  if (demo) {
    log(`demo mode: demo company ${demoAccounts.company}; every demo account's password: ${demoAccounts.password}`)
    for (const a of demoAccounts.accounts) log(`  ${a.role.padEnd(19)} ${a.email}`)
  }
  else log('demo mode is off (own DATABASE_URL): no demo data was added; see README "First admin" to create the first account')
  log('stop with Ctrl+C; `npm run stop` stops PostgreSQL and the fake SMTP server too')
}
catch (err) {
  console.error(`[stratavolt] start failed: ${err.message}`)
  process.exit(1)
}
