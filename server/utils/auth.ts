import { createHash, randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import { can, isRole, type Permission, type Role } from '#shared/roles'

export interface CurrentUser {
  id: number
  email: string
  name: string
  role: Role
}

export function sha256(value: string) {
  return createHash('sha256').update(value).digest('hex')
}

export function newSecretToken(bytes = 32) {
  return randomBytes(bytes).toString('base64url')
}

async function userFromBearer(event: H3Event, token: string): Promise<CurrentUser | null> {
  // One round trip: the token's owner as the database knows them now (role changes apply at once), and
  // last_used_at moved on at most once a minute, so a busy token does not write (and lock its row) per request.
  const [row] = await useDb().execute<{ id: number, email: string, name: string, role: string, disabled: boolean }>(sql`
    with hit as (
      select t.id as token_id, t.last_used_at, u.id, u.email, u.name, u.role, u.disabled
      from api_tokens t join users u on u.id = t.user_id
      where t.token_hash = ${sha256(token)} and t.revoked_at is null
    ), touched as (
      update api_tokens set last_used_at = now() from hit
      where api_tokens.id = hit.token_id and (hit.last_used_at is null or hit.last_used_at < now() - interval '1 minute')
    )
    select id, email, name, role, disabled from hit`)
  if (!row || row.disabled || !isRole(row.role)) return null
  event.context.viaToken = true
  return { id: row.id, email: row.email, name: row.name, role: row.role }
}

/** The signed-in person (session cookie, or a Bearer token on /api/v1), checked against the database on every request. */
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
      const [row] = await useDb().select().from(tables.users).where(eq(tables.users.id, session.user.id))
      if (row && !row.disabled && row.sessionVersion === session.sessionVersion && isRole(row.role)) {
        user = { id: row.id, email: row.email, name: row.name, role: row.role }
      }
      else {
        await clearUserSession(event)
      }
    }
  }
  event.context.user = user
  return user
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
