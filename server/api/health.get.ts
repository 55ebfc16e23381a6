import { sql } from 'drizzle-orm'
import { heldCatalogue } from '~~/server/services/catalog'

/** ms: a dependency that does not answer within this counts as down. */
const CHECK_TIMEOUT_MS = 2000
/** ms: the mail check (an SMTP handshake) is repeated at most this often. */
const MAIL_CHECK_EVERY_MS = 10_000

function within<T>(promise: Promise<T>, ms: number): Promise<T> {
  return Promise.race([promise, new Promise<T>((_, reject) => setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms).unref())])
}

let mailCheck: { at: number, result: Promise<string | null> } | null = null

/** null when the SMTP server answers, else why not. Cached briefly: health is polled often. */
function mailProblem(): Promise<string | null> {
  if (!mailCheck || Date.now() - mailCheck.at > MAIL_CHECK_EVERY_MS) {
    mailCheck = { at: Date.now(), result: within(verifyMailTransport(), CHECK_TIMEOUT_MS).then(() => null, (err: unknown) => err instanceof Error ? err.message : String(err)) }
  }
  return mailCheck.result
}

// Which dependency is down. 503 when the database does not answer (this instance cannot serve:
// a load balancer should send requests elsewhere); 200 otherwise. The mail server is reported
// too ("degraded" when it is down: pages work, mail is recorded as failed), without a 503, since
// no other instance would do better.
export default defineEventHandler(async (event) => {
  const [db, mail] = await Promise.all([
    within(useDb().execute(sql`select 1`), CHECK_TIMEOUT_MS).then(() => null, (err: unknown) => databaseProblem(err)),
    mailProblem(),
  ])
  setResponseStatus(event, db ? 503 : 200)
  setResponseHeader(event, 'Cache-Control', 'no-store')
  return {
    ok: !db && !mail,
    status: db ? 'down' : mail ? 'degraded' : 'up',
    db: db ? { status: 'down', message: db } : { status: 'up' },
    mail: mail ? { status: 'down', message: mail } : { status: 'up' },
    // the matching index this instance holds: instances on one generation report one digest, built once
    catalogue: heldCatalogue(),
  }
})
