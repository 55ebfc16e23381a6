// `npm test`: the same set-up as start against a fresh test database, then every test
// (unit, API against the built server and real PostgreSQL, browser in Debian's Chromium).
// Ends by printing "N passed, N failed" on a line of its own.
import { spawn } from 'node:child_process'
import { existsSync, readFileSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import {
  dataDir, ensureBuild, ensureDebianPackages, ensureNodeModules, ensurePortFree, ensurePostgres, log, readSecrets, root,
  startDetached, stopDetached, waitForHttp, waitForPort,
} from './lib.mjs'

const port = Number(process.env.STRATAVOLT_TEST_PORT ?? 3100)
const smtpPort = Number(process.env.STRATAVOLT_TEST_SMTP_PORT ?? 2626)
const mailbox = join(dataDir, 'test-mailbox')
const resultsFile = join(root, '.vitest-results.json')

function summarise(code) {
  let passed = 0; let failed = 0; let skipped = 0
  if (existsSync(resultsFile)) {
    const r = JSON.parse(readFileSync(resultsFile, 'utf8'))
    passed = r.numPassedTests; failed = r.numFailedTests; skipped = r.numPendingTests + (r.numTodoTests ?? 0)
    // A file that failed to load counts as a failure even if it held no test.
    failed += r.testResults.filter(f => f.status === 'failed' && f.assertionResults.length === 0).length
  }
  else if (code !== 0) failed = 1
  console.log(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`)
  return failed === 0 && code === 0 ? 0 : 1
}

let exitCode
try {
  ensureNodeModules()
  ensureDebianPackages(['chromium'], () => existsSync('/usr/bin/chromium'))
  ensureDebianPackages(['poppler-utils'], () => existsSync('/usr/bin/pdftotext'))
  ensureDebianPackages(['libreoffice-calc'], () => existsSync('/usr/bin/soffice') || existsSync('/usr/bin/libreoffice'))
  // stratavolt_test_empty: for the test of a production start (no demo) on an empty database
  const dbUrl = ensurePostgres([{ name: 'stratavolt_test', recreate: true }, { name: 'stratavolt_test_empty', recreate: true }], { fast: true })
  const url = dbUrl('stratavolt_test')
  rmSync(mailbox, { recursive: true, force: true })
  stopDetached('test-smtp')
  stopDetached('test-server')
  await ensurePortFree(smtpPort, 'STRATAVOLT_TEST_SMTP_PORT', 'the test mail server')
  await ensurePortFree(port, 'STRATAVOLT_TEST_PORT', 'the test server')
  startDetached('test-smtp', process.execPath, [join(root, 'scripts', 'fake-smtp.mjs')], { SMTP_PORT: String(smtpPort), MAILBOX_DIR: mailbox })
  await waitForPort(smtpPort)
  // its own output folder: a test build never replaces the one a running `npm start` serves
  const entry = ensureBuild({ output: '.output-test' })
  startDetached('test-server', process.execPath, [entry], {
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    NUXT_DATABASE_URL: url,
    NUXT_SESSION_PASSWORD: readSecrets().sessionPassword,
    NUXT_APP_URL: `http://127.0.0.1:${port}`,
    NUXT_SMTP_HOST: '127.0.0.1',
    NUXT_SMTP_PORT: String(smtpPort),
    NUXT_MAILBOX_DIR: mailbox,
    // the tests sign in with the demo accounts
    NUXT_SEED_DEMO: 'true',
  })
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 120000)
  log('running the tests…')
  rmSync(resultsFile, { force: true })
  const args = ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${resultsFile}`, ...process.argv.slice(2)]
  const code = await new Promise((res) => {
    const child = spawn('npx', args, {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, STRATAVOLT_TEST_URL: `http://127.0.0.1:${port}`, STRATAVOLT_TEST_DATABASE_URL: url, STRATAVOLT_TEST_EMPTY_DATABASE_URL: dbUrl('stratavolt_test_empty'), STRATAVOLT_TEST_MAILBOX: mailbox },
    })
    child.on('exit', c => res(c ?? 1))
  })
  exitCode = summarise(code)
}
catch (err) {
  console.error(`[stratavolt] test set-up failed: ${err.stack ?? err.message}`)
  exitCode = summarise(1)
}
finally {
  stopDetached('test-server')
  stopDetached('test-smtp')
}
process.exit(exitCode)
