// `npm run dev`: PostgreSQL and the fake SMTP server as for start, then `nuxt dev` with hot reload.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { dataDir, ensureNodeModules, ensurePostgres, readSecrets, root, startDetached } from './lib.mjs'

ensureNodeModules()
const databaseUrl = process.env.DATABASE_URL ?? ensurePostgres([{ name: 'stratavolt' }])('stratavolt')
const mailbox = join(dataDir, 'mailbox')
startDetached('fake-smtp', process.execPath, [join(root, 'scripts', 'fake-smtp.mjs')], { SMTP_PORT: '2525', MAILBOX_DIR: mailbox })
const child = spawn('npx', ['nuxt', 'dev', '--host', '127.0.0.1'], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, NUXT_DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: readSecrets().sessionPassword, NUXT_MAILBOX_DIR: mailbox, NUXT_SMTP_PORT: '2525' },
})
child.on('exit', code => process.exit(code ?? 0))
