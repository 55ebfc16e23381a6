import { heldCatalogue } from '~~/server/services/catalog'
import { CHECK_TIMEOUT_MS, databaseStatus, within } from '~~/server/utils/db-status'

/** ms: the mail check (an SMTP handshake) is repeated at most this often. */
const MAIL_CHECK_EVERY_MS = 10_000

let mailCheck: { at: number, result: Promise<string | null> } | null = null

/** null when the SMTP server answers, else why not. Cached briefly: health is polled often. */
function mailProblem(): Promise<string | null> {
  if (!mailCheck || Date.now() - mailCheck.at > MAIL_CHECK_EVERY_MS) {
    mailCheck = { at: Date.now(), result: within(verifyMailTransport(), CHECK_TIMEOUT_MS).then(() => null, (err: unknown) => err instanceof Error ? err.message : String(err)) }
  }
  return mailCheck.result
}

// Which dependency is down. 503 when the database does not answer (this instance cannot serve:
// a check at most 1 s old with no connection lost since counts, see server/utils/db-status.ts;
// a load balancer should send requests elsewhere); 200 otherwise. The mail server is reported
// too ("degraded" when it is down: pages work, mail is recorded as failed), without a 503, since
// no other instance would do better.
export default defineEventHandler(async (event) => {
  const [db, mail] = await Promise.all([
    databaseStatus(),
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
