import { createHash, randomBytes } from 'node:crypto'
import type { H3Event, SessionConfig } from 'h3'
import { eq, lt, sql } from 'drizzle-orm'
import { can, isRole, type Permission, type Role } from '#shared/roles'
import { cachedTokenUser, rememberTokenUser, tokenCacheLive, tokenLookupStarted } from './auth-cache'

type CookieSerializeOptions = Exclude<NonNullable<SessionConfig['cookie']>, false>

export interface CurrentUser {
  id: number
  email: string
  name: string
  role: Role
  /** the person's chosen locale, or null for the company default */
  locale: string | null
}

export function sha256(value: string) {
  return createHash('sha256').update(value).digest('hex')
}

export function newSecretToken(bytes = 32) {
  return randomBytes(bytes).toString('base64url')
}

/** The client's address as the socket sees it (forwarded headers are not trusted: they are free to forge). */
export function clientAddress(event: H3Event) {
  return getRequestIP(event) ?? 'unknown'
}

let dummyHash: Promise<string> | undefined
/** A real password hash of nothing anyone knows: checked when an account is unknown, so both take as long. */
export function dummyPasswordHash() {
  dummyHash ??= hashPassword(newSecretToken(24))
  return dummyHash
}

/**
 * Session cookie options. `Secure` follows the deployment: on when NUXT_APP_URL is https or the
 * request came over TLS (also behind a proxy that says so in X-Forwarded-Proto; that can only make
 * the cookie stricter); NUXT_COOKIE_SECURE=true / false forces it (plain-http intranet: false).
 */
export function sessionCookie(event: H3Event): { cookie: CookieSerializeOptions } {
  const config = useRuntimeConfig(event)
  const setting = String(config.cookieSecure ?? '').trim().toLowerCase()
  const secure = setting === 'true' || setting === '1'
    ? true
    : setting === 'false' || setting === '0'
      ? false
      : String(config.appUrl).startsWith('https:') || getRequestProtocol(event, { xForwardedProto: true }) === 'https'
  return { cookie: { ...(config.session?.cookie as CookieSerializeOptions | undefined), secure } }
}

type TokenOwnerRow = { id: number, email: string, name: string, role: string, disabled: boolean, locale: string | null }

/**
 * One round trip: the token's owner as the database knows them now (role changes apply at once), and
 * last_used_at moved on at most once a minute, so a busy token does not write (and lock its row) per request.
 */
async function tokenOwner(hash: string): Promise<TokenOwnerRow | undefined> {
  const [row] = await useDb().execute<TokenOwnerRow>(sql`
    with hit as (
      select t.id as token_id, t.last_used_at, u.id, u.email, u.name, u.role, u.disabled, u.locale
      from api_tokens t join users u on u.id = t.user_id
      where t.token_hash = ${hash} and t.revoked_at is null
    ), touched as (
      update api_tokens set last_used_at = now() from hit
      where api_tokens.id = hit.token_id and (hit.last_used_at is null or hit.last_used_at < now() - interval '1 minute')
    )
    select id, email, name, role, disabled, locale from hit`)
  return row
}

/**
 * Lookups of a token's owner in flight, by token hash and the auth-cache epoch they started at. When the cached
 * owner expires under a busy client, the requests that miss at once share one query instead of queueing one
 * each for the pool's connections; one that starts after a change (a later epoch) asks again.
 */
const tokenLookups = new Map<string, { epoch: number, row: Promise<TokenOwnerRow | undefined> }>()

async function userFromBearer(event: H3Event, token: string): Promise<CurrentUser | null> {
  const hash = sha256(token)
  const cached = cachedTokenUser(hash)
  if (cached) {
    event.context.viaToken = true
    return cached
  }
  const startedAt = tokenLookupStarted()
  let lookup = tokenCacheLive() ? tokenLookups.get(hash) : undefined
  if (!lookup || lookup.epoch !== startedAt) {
    const row = tokenOwner(hash)
    const mine = { epoch: startedAt, row }
    lookup = mine
    if (tokenCacheLive()) {
      tokenLookups.set(hash, mine)
      const drop = () => { if (tokenLookups.get(hash) === mine) tokenLookups.delete(hash) }
      row.then(drop, drop)
    }
  }
  const row = await lookup.row
  if (!row || row.disabled || !isRole(row.role)) return null
  event.context.viaToken = true
  const user: CurrentUser = { id: row.id, email: row.email, name: row.name, role: row.role, locale: row.locale ?? null }
  rememberTokenUser(hash, user, startedAt)
  return user
}

/**
 * The signed-in person (session cookie, or a Bearer token on /api/v1), checked against the database on every
 * request; a token's owner may come from the few-second cache of auth-cache.ts, which every change drops.
 */
export async function currentUser(event: H3Event): Promise<CurrentUser | null> {
  if (event.context.user !== undefined) return event.context.user
  let user: CurrentUser | null = null
  const header = getHeader(event, 'authorization')
  if (header?.startsWith('Bearer ') && event.path.startsWith('/api/v1/')) {
    user = await userFromBearer(event, header.slice(7).trim())
  }
  else {
    const session = await getUserSession(event)
    if (session.user) {
      // one query: the user row, and whether this very session was ended by a sign-out
      const [found] = await useDb().select({
        row: tables.users,
        revoked: sql<boolean>`exists (select 1 from ${tables.revokedSessions} where ${tables.revokedSessions.sessionId} = ${session.id ?? ''})`,
      }).from(tables.users).where(eq(tables.users.id, session.user.id))
      const row = found?.row
      if (row && !found.revoked && !row.disabled && row.sessionVersion === session.sessionVersion && isRole(row.role)) {
        user = { id: row.id, email: row.email, name: row.name, role: row.role, locale: row.locale ?? null }
      }
      else {
        await clearUserSession(event, sessionCookie(event))
      }
    }
  }
  event.context.user = user
  return user
}

/**
 * Signs in `user` on this request with a fresh session id: a cookie the client still sends (for
 * instance one ended by sign-out) is not carried over into the new session.
 */
export async function startSession(event: H3Event, user: CurrentUser, sessionVersion: number) {
  delete event.node.req.headers.cookie
  delete event.node.req.headers['x-nuxt-session-session']
  await replaceUserSession(event, { user, sessionVersion }, sessionCookie(event))
}

/** Ends this session everywhere (sign-out): its id is refused from now on, by every instance. */
export async function endSession(event: H3Event, userId: number | null) {
  const session = await getUserSession(event)
  const db = useDb()
  if (session.id) {
    await db.insert(tables.revokedSessions).values({ sessionId: session.id, userId }).onConflictDoNothing()
    // now and then, forget revocations older than any cookie can live
    if (Math.random() < 0.05) {
      const maxAgeS = Number(useRuntimeConfig(event).session?.maxAge ?? 12 * 3600)
      await db.delete(tables.revokedSessions).where(lt(tables.revokedSessions.revokedAt, new Date(Date.now() - maxAgeS * 1000 - 3600_000)))
    }
  }
  await clearUserSession(event, sessionCookie(event))
}

/** The one role guard: 401 when nobody is signed in, 403 when the role may not do this. */
export async function requireRole(event: H3Event, permission: Permission): Promise<CurrentUser> {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Please sign in.' })
  if (!can(user.role, permission)) throw createError({ statusCode: 403, message: 'Your role does not allow this.' })
  return user
}

declare module 'h3' {
  interface H3EventContext {
    user?: CurrentUser | null
    viaToken?: boolean
  }
}
