import { and, eq, gt, isNull } from 'drizzle-orm'
import { authChanged } from './auth-cache'

const LIFETIME_MS = { invite: 7 * 24 * 3600 * 1000, reset: 60 * 60 * 1000 } as const
export type LinkPurpose = keyof typeof LIFETIME_MS

/**
 * Creates a one-time link (invitation or password reset); only its hash is stored. Every older
 * unused link of that account (either purpose) stops working: only the newest mail counts.
 */
export async function issueOneTimeLink(userId: number, purpose: LinkPurpose) {
  const token = newSecretToken()
  const expiresAt = new Date(Date.now() + LIFETIME_MS[purpose])
  await useDb().transaction(async (tx) => {
    await tx.update(tables.oneTimeTokens).set({ usedAt: new Date() })
      .where(and(eq(tables.oneTimeTokens.userId, userId), isNull(tables.oneTimeTokens.usedAt)))
    await tx.insert(tables.oneTimeTokens).values({ userId, purpose, tokenHash: sha256(token), expiresAt })
  })
  return { url: appUrl(`/set-password?token=${encodeURIComponent(token)}`), expiresAt }
}

/** Uses a link once: sets the password and ends every other session of that user. */
export async function setPasswordWithLink(token: string, password: string) {
  const db = useDb()
  const passwordHash = await hashPassword(password)
  return db.transaction(async (tx) => {
    const [link] = await tx.update(tables.oneTimeTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(tables.oneTimeTokens.tokenHash, sha256(token)), isNull(tables.oneTimeTokens.usedAt), gt(tables.oneTimeTokens.expiresAt, new Date())))
      .returning()
    if (!link) return null
    const [user] = await tx.select().from(tables.users).where(eq(tables.users.id, link.userId))
    if (!user || user.disabled) return null
    const [updated] = await tx.update(tables.users)
      .set({ passwordHash, sessionVersion: user.sessionVersion + 1 })
      .where(eq(tables.users.id, user.id))
      .returning()
    await authChanged(user.id, tx)
    return { user: updated!, purpose: link.purpose }
  })
}
