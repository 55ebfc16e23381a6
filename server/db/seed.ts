// The demo: an invented company's accounts (one per role), its parts catalogue and designs.
// Idempotent: a second start adds nothing twice.
import { eq, sql } from 'drizzle-orm'
import { DEMO_PARTS } from '../../catalog/demo-parts'
import type { Db } from '../utils/db'
import { commitParts } from '../services/catalog'
import { createDesign } from '../services/designs'
import * as t from './schema'
import demo from './demo-accounts.json'
import { demoDesigns } from './demo-designs'

export async function seedDemo(db: Db) {
  const passwordHash = await hashPassword(demo.password)
  for (const account of demo.accounts) {
    await db.insert(t.users).values({ ...account, passwordHash }).onConflictDoNothing()
  }
  const userId = async (email: string) => (await db.select({ id: t.users.id }).from(t.users).where(eq(sql`lower(${t.users.email})`, email)))[0]?.id ?? null

  const [catalog] = await db.select({ n: sql<number>`count(*)::int` }).from(t.catalogVersions)
  if (!catalog?.n) {
    const by = await userId('components@example.com')
    await db.transaction(tx => commitParts(tx, [...DEMO_PARTS], { userId: by, note: 'Demo catalogue', approve: true }))
  }

  for (const d of demoDesigns) {
    const [exists] = await db.select({ id: t.designs.id }).from(t.designs).where(eq(t.designs.name, d.name))
    if (exists) continue
    const owner = await userId(d.owner)
    await db.transaction(tx => createDesign(tx, { name: d.name, description: d.description, input: d.input, ownerId: owner! }))
  }
}
