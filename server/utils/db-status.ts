// Whether PostgreSQL answers, for the health route. A load balancer polls health often and, under load, a
// round trip to PostgreSQL waits for the event loop twice and for the database process to get a core: most
// of health's time went there. So a check that succeeded less than DB_STATUS_FRESH_MS ago answers at once
// (and is renewed in the background once it is a quarter that old), unless any pool connection closed since
// (a cut network or a restarted server closes them: the next health then asks PostgreSQL itself). Without a
// fresh success every health asks, and concurrent ones share one query.
import { sql } from 'drizzle-orm'

/** ms: a dependency that does not answer within this counts as down. */
export const CHECK_TIMEOUT_MS = 2000
/** ms: how old a successful database check may be for health to report "up" without a new one. */
export const DB_STATUS_FRESH_MS = 1000

export function within<T>(promise: Promise<T>, ms: number): Promise<T> {
  return Promise.race([promise, new Promise<T>((_, reject) => setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms).unref())])
}

/** performance.now() when the last successful check started; 0 = none that still counts */
let okAt = 0
/** moves on whenever a connection closes, so a check that started before it does not count as fresh */
let closes = 0
let running: Promise<string | null> | null = null

/** Called by the pool (postgres `onclose`) whenever one of its connections closes. */
export function databaseConnectionClosed() {
  closes++
  okAt = 0
}

function check(): Promise<string | null> {
  running ??= (async () => {
    const startedAt = performance.now()
    const epoch = closes
    try {
      await within(useDb().execute(sql`select 1`), CHECK_TIMEOUT_MS)
      if (epoch === closes) okAt = startedAt
      return null
    }
    catch (err) {
      okAt = 0
      return databaseProblem(err)
    }
    finally {
      running = null
    }
  })()
  return running
}

/** null when PostgreSQL answers (now, or less than DB_STATUS_FRESH_MS ago with no connection lost since), else why not. */
export function databaseStatus(): Promise<string | null> {
  const age = performance.now() - okAt
  if (okAt > 0 && age < DB_STATUS_FRESH_MS) {
    if (age > DB_STATUS_FRESH_MS / 4) void check()
    return Promise.resolve(null)
  }
  return check()
}
