// Throttling of sign-in and password-reset requests, kept in PostgreSQL (table throttle_counters)
// so that every app instance counts the same attempts and a restart forgets nothing.
// Fixed windows: a key's count starts at its first hit and resets WINDOW after it.
import { and, gt, inArray, like, lt, sql } from 'drizzle-orm'

const WINDOW_MS = 15 * 60 * 1000

export const LIMITS = {
  /** failed sign-ins for one account from one client: then that client waits (others still get in) */
  signInPerAccountAndClient: 5,
  /** failed sign-ins from one client, all accounts together (password spraying) */
  signInPerClient: 30,
  /** reset requests for one address, from anywhere (mail bombing) */
  forgotPerAddress: 3,
  /** reset requests from one client, all addresses together */
  forgotPerClient: 10,
} as const

interface Count { hits: number, resetAt: Date }

/** Adds one hit to `key` and returns the count in its current window. */
async function hit(key: string): Promise<Count> {
  const windowEnd = new Date(Date.now() + WINDOW_MS)
  const t = tables.throttleCounters
  const [row] = await useDb().insert(t).values({ key, hits: 1, resetAt: windowEnd })
    .onConflictDoUpdate({
      target: t.key,
      set: {
        hits: sql`case when ${t.resetAt} <= now() then 1 else ${t.hits} + 1 end`,
        resetAt: sql`case when ${t.resetAt} <= now() then excluded.reset_at else ${t.resetAt} end`,
      },
    })
    .returning({ hits: t.hits, resetAt: t.resetAt })
  // now and then, drop windows that ended long ago
  if (Math.random() < 0.01) await useDb().delete(t).where(lt(t.resetAt, new Date(Date.now() - WINDOW_MS)))
  return row!
}

async function peek(keys: string[]): Promise<Map<string, Count>> {
  const t = tables.throttleCounters
  const rows = await useDb().select().from(t).where(and(inArray(t.key, keys), gt(t.resetAt, sql`now()`)))
  return new Map(rows.map(r => [r.key, { hits: r.hits, resetAt: r.resetAt }]))
}

const secondsUntil = (d: Date) => Math.max(1, Math.ceil((d.getTime() - Date.now()) / 1000))

const signInKeys = (email: string, client: string) => ({ account: `signin:${email}|${client}`, client: `signin-client:${client}` })

/** Seconds until this client may try this account again, or 0. */
export async function signInBlockedFor(email: string, client: string): Promise<number> {
  const k = signInKeys(email, client)
  const counts = await peek([k.account, k.client])
  const a = counts.get(k.account)
  const c = counts.get(k.client)
  if (a && a.hits >= LIMITS.signInPerAccountAndClient) return secondsUntil(a.resetAt)
  if (c && c.hits >= LIMITS.signInPerClient) return secondsUntil(c.resetAt)
  return 0
}

export async function recordSignInFailure(email: string, client: string) {
  const k = signInKeys(email, client)
  await hit(k.account)
  await hit(k.client)
}

/** After a successful sign-in or a password set by link: that account starts afresh from every client. */
export async function clearSignInFailures(email: string) {
  const t = tables.throttleCounters
  await useDb().delete(t).where(like(t.key, `signin:${email.replace(/[\\%_]/g, m => `\\${m}`)}|%`))
}

/**
 * Counts a reset request; returns seconds to wait when the address or the client asked too often
 * (the same answer whether or not the address has an account).
 */
export async function forgotBlockedFor(email: string, client: string): Promise<number> {
  const byAddress = await hit(`forgot:${email}`)
  const byClient = await hit(`forgot-client:${client}`)
  if (byAddress.hits > LIMITS.forgotPerAddress) return secondsUntil(byAddress.resetAt)
  if (byClient.hits > LIMITS.forgotPerClient) return secondsUntil(byClient.resetAt)
  return 0
}
