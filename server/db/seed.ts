// The demo: an invented company's accounts (one per role). Idempotent: a second start adds nothing twice.
import type { Db } from '../utils/db'
import * as t from './schema'
import demo from './demo-accounts.json'

export async function seedDemo(db: Db) {
  const passwordHash = await hashPassword(demo.password)
  for (const account of demo.accounts) {
    await db.insert(t.users).values({ ...account, passwordHash })
      .onConflictDoNothing()
  }
}
