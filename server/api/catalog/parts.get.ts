import { and, asc, desc, eq, gte, ilike, isNotNull, or, sql } from 'drizzle-orm'
import { partsQuerySchema } from '#shared/schemas/catalog'

// The parts browser: current version of every part, filtered, sorted and paginated on the server.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const q = queryValid(event, partsQuerySchema)
  const v = tables.partVersions
  const p = tables.parts
  const where = and(
    isNotNull(p.currentVersionId),
    q.q ? or(ilike(v.partNumber, `%${q.q}%`), ilike(v.manufacturer, `%${q.q}%`), ilike(sql`${v.data}->>'description'`, `%${q.q}%`)) : undefined,
    q.kind ? eq(v.kind, q.kind) : undefined,
    q.lifecycle ? eq(v.lifecycle, q.lifecycle) : undefined,
    q.approved ? eq(p.approved, q.approved === 'yes') : undefined,
    q.minVoltage !== undefined ? gte(v.voltageRating, q.minVoltage) : undefined,
    q.minCurrent !== undefined ? gte(v.currentRating, q.minCurrent) : undefined,
  )
  const order = (q.dir === 'asc' ? asc : desc)(v[q.sort])
  const db = useDb()
  const [rows, [count]] = await Promise.all([
    db.select({
      id: p.id, versionId: v.id, partNumber: v.partNumber, manufacturer: v.manufacturer, kind: v.kind, packageConfig: v.packageConfig,
      voltageRating: v.voltageRating, currentRating: v.currentRating, unitPrice: v.unitPrice, currency: v.currency, stock: v.stock,
      leadTimeDays: v.leadTimeDays, lifecycle: v.lifecycle, approved: p.approved,
    }).from(p).innerJoin(v, eq(v.id, p.currentVersionId)).where(where).orderBy(order, asc(p.id)).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ n: sql<number>`count(*)::int` }).from(p).innerJoin(v, eq(v.id, p.currentVersionId)).where(where),
  ])
  return { rows, total: count?.n ?? 0, page: q.page, pageSize: q.pageSize }
})
