// API tokens' owners kept for a few seconds, so a busy API client costs no database round trip per request.
// Correctness stays with PostgreSQL: every write that can refuse a token or change what its owner may do
// (a token revoked, an account disabled or its role changed, a password set) calls `authChanged`, which
// sends NOTIFY on CHANNEL; every instance LISTENs and drops that user's entries at once. Entries are kept
// only while this instance's LISTEN connection is up (cleared whenever it connects again, since
// notifications sent meanwhile are lost) and never longer than TOKEN_CACHE_MS, the bound on anything missed.
// Session cookies are not cached: the guard reads their user row on every request.
import { sql } from 'drizzle-orm'
import type { CurrentUser } from './auth'

const CHANNEL = 'stratavolt_auth'
/** ms an owner found for a token is trusted without asking PostgreSQL again (STRATAVOLT_TOKEN_CACHE_MS=0: never) */
export const TOKEN_CACHE_MS = Math.max(0, Number(process.env.STRATAVOLT_TOKEN_CACHE_MS ?? 5000) || 0)
/** ms between attempts to LISTEN after one failed */
const RETRY_LISTEN_MS = 10_000
const MAX_ENTRIES = 1000

interface Entry { user: CurrentUser, at: number }
/** token hash → its owner as PostgreSQL answered at `at` */
const entries = new Map<string, Entry>()
/** moves on with every drop, so a lookup that raced a change does not store what it read before it */
let epoch = 0
let listening: Promise<unknown> | null = null
let live = false
let failedAt = 0

function forget(userId: string) {
  epoch++
  if (userId === '*') return entries.clear()
  for (const [hash, e] of entries) if (String(e.user.id) === userId) entries.delete(hash)
}

/** Starts listening once; until the listener is connected nothing is cached. */
function ensureListening() {
  if (listening || TOKEN_CACHE_MS === 0 || Date.now() - failedAt < RETRY_LISTEN_MS) return
  listening = useDb().$client.listen(CHANNEL, payload => forget(payload), () => {
    // (re)connected: whatever was sent while we were away is unknown
    forget('*')
    live = true
  }).catch(() => {
    live = false
    listening = null
    failedAt = Date.now()
  })
}

/** A lookup about to ask PostgreSQL: remember the epoch it started at. */
export function tokenLookupStarted(): number {
  ensureListening()
  return epoch
}

/** Whether owners may be kept now (the cache is on and this instance hears every change): lookups may then be shared. */
export function tokenCacheLive(): boolean {
  return live && TOKEN_CACHE_MS > 0
}

/** The token's owner if this instance found them less than TOKEN_CACHE_MS ago and nothing changed since. */
export function cachedTokenUser(tokenHash: string): CurrentUser | null {
  const e = entries.get(tokenHash)
  if (!e) return null
  if (!live || Date.now() - e.at > TOKEN_CACHE_MS) {
    entries.delete(tokenHash)
    return null
  }
  return e.user
}

/** Keeps what a lookup started at `startedAt` found, unless a change arrived while it ran. */
export function rememberTokenUser(tokenHash: string, user: CurrentUser, startedAt: number) {
  if (!live || startedAt !== epoch) return
  if (entries.size >= MAX_ENTRIES) entries.delete(entries.keys().next().value!)
  entries.set(tokenHash, { user, at: Date.now() })
}

/**
 * Tells every instance (this one at once) that what the guard knows of `userId` changed. Inside a transaction
 * pass it: PostgreSQL delivers the notification when it commits.
 */
export async function authChanged(userId: number, db: { execute: (q: ReturnType<typeof sql>) => Promise<unknown> } = useDb()) {
  forget(String(userId))
  await db.execute(sql`select pg_notify(${CHANNEL}, ${String(userId)})`)
}
