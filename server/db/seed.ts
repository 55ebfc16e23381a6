// The demo: an invented company's accounts (one per role), its parts catalogue and designs.
// Idempotent: a second start adds nothing twice.
import { eq, sql } from 'drizzle-orm'
import { DEMO_PARTS } from '../../catalog/demo-parts'
import { legLayout } from '#shared/engine'
import type { Db } from '../utils/db'
import { commitParts } from '../services/catalog'
import { createDesign } from '../services/designs'
import { matchDesign } from '../services/parts'
import { releaseBom } from '../services/bom'
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

  // One released BOM: the pump drive with the best-ranked part on every position.
  const [anyBom] = await db.select({ id: t.boms.id }).from(t.boms).limit(1)
  const [pump] = await db.select().from(t.designs).where(eq(t.designs.name, demoDesigns[0]!.name))
  if (!anyBom && pump) {
    const engineer = await db.select().from(t.users).where(eq(sql`lower(${t.users.email})`, 'engineer@example.com'))
    await db.update(t.designs).set({ bomSettings: { buildQuantity: 12, sparesPercent: 5, manualLines: [{ description: 'Liquid-cooled heatsink plate, 3 legs', partNumber: 'BH-HS-0412', manufacturer: 'Brennholm in-house', quantityPerUnit: 1, unitPrice: 310, currency: 'EUR' }] } }).where(eq(t.designs.id, pump.id))
    const { positions } = await matchDesign(pump.id)
    const chosen = new Map<string, number>()
    const m = demoDesigns[0]!.input.machineSide
    const antiParallel = new Map(legLayout(m.topology, m.levels).items.filter(i => i.antiParallelTo).map(i => [i.name, i.antiParallelTo!]))
    // Switches first, so that an anti-parallel diode can take its switch's module when that module fits it.
    for (const p of [...positions].sort((a, b) => Number(a.duty.kind !== 'switch') - Number(b.duty.kind !== 'switch'))) {
      const switchOf = antiParallel.get(p.position)
      const partner = switchOf ? chosen.get(switchOf) : undefined
      const best = p.candidates.find(c => c.partVersionId === partner) ?? p.candidates[0]
      if (!best || p.assigned) continue
      chosen.set(p.position, best.partVersionId)
      await db.insert(t.partAssignments).values({ designId: pump.id, side: p.side, position: p.position, partVersionId: best.partVersionId, seriesCount: best.seriesCount, parallelCount: best.parallelCount, assignedBy: engineer[0]!.id })
    }
    try {
      await releaseBom(pump.id, { id: engineer[0]!.id, name: engineer[0]!.name })
    }
    catch (err) {
      console.error('[seed] the demo BOM could not be released:', err instanceof Error ? err.message : err)
    }
  }
}
