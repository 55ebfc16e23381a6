import { desc, eq } from 'drizzle-orm'

// Released BOMs with their status, newest first.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:read')
  const b = tables.boms
  const rows = await useDb().select({ id: b.id, designId: b.designId, revision: b.revision, status: b.status, releasedAt: b.releasedAt, snapshot: b.snapshot, releasedBy: tables.users.name })
    .from(b).leftJoin(tables.users, eq(tables.users.id, b.releasedBy)).orderBy(desc(b.releasedAt))
  return rows.map(({ snapshot, ...r }) => {
    const s = snapshot as { designName: string, totals: { lines: number, extendedPrice: number }, currency: string, buildQuantity: number }
    return { ...r, designName: s.designName, lines: s.totals.lines, total: s.totals.extendedPrice, currency: s.currency, buildQuantity: s.buildQuantity }
  })
})
