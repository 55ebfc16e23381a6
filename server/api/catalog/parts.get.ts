import { and, asc, desc, eq, gte, ilike, inArray, or, sql } from 'drizzle-orm'
import { partsQuerySchema } from '#shared/schemas/catalog'

// The parts browser: current version of every part, filtered, sorted and paginated on the server.
// Reads only current versions (partial indexes per sort and filter, trigram indexes for the search);
// the unfiltered total is the count kept with the newest catalogue version.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const q = queryValid(event, partsQuerySchema)
  const v = tables.partVersions
  const p = tables.parts
  const filtered = !!(q.q || q.kind || q.lifecycle || q.approved || q.minVoltage !== undefined || q.minCurrent !== undefined)
  const where = and(
    eq(v.isCurrent, true),
    q.q ? or(ilike(v.partNumber, `%${q.q}%`), ilike(v.manufacturer, `%${q.q}%`), ilike(sql`${v.data}->>'description'`, `%${q.q}%`)) : undefined,
    q.kind ? eq(v.kind, q.kind) : undefined,
    q.lifecycle ? eq(v.lifecycle, q.lifecycle) : undefined,
    q.approved ? eq(p.approved, q.approved === 'yes') : undefined,
    q.minVoltage !== undefined ? gte(v.voltageRating, q.minVoltage) : undefined,
    q.minCurrent !== undefined ? gte(v.currentRating, q.minCurrent) : undefined,
  )
  // Ties broken by part id, the second column of every sort index.
  const order = (q.dir === 'asc' ? asc : desc)(v[q.sort])
  const tie = (q.dir === 'asc' ? asc : desc)(v.partId)
  const db = useDb()
  const columns = {
    id: v.partId, versionId: v.id, partNumber: v.partNumber, manufacturer: v.manufacturer, kind: v.kind, packageConfig: v.packageConfig,
    voltageRating: v.voltageRating, currentRating: v.currentRating, unitPrice: v.unitPrice, currency: v.currency, stock: v.stock,
    leadTimeDays: v.leadTimeDays, lifecycle: v.lifecycle,
  }
  // The page comes from the versions table alone (an index scan in sort order, also deep in the list);
  // the approval flags of its rows are read after. Only an approval filter joins the parts table first.
  const page = q.approved
    ? db.select({ ...columns, approved: p.approved }).from(v).innerJoin(p, eq(p.id, v.partId)).where(where).orderBy(order, tie).limit(q.pageSize).offset((q.page - 1) * q.pageSize)
    : db.select(columns).from(v).where(where).orderBy(order, tie).limit(q.pageSize).offset((q.page - 1) * q.pageSize).then(async (found) => {
        if (found.length === 0) return []
        const flags = await db.select({ id: p.id, approved: p.approved }).from(p).where(inArray(p.id, found.map(r => r.id)))
        const approved = new Map(flags.map(f => [f.id, f.approved]))
        return found.map(r => ({ ...r, approved: approved.get(r.id) ?? false }))
      })
  const [rows, total] = await Promise.all([
    page,
    filtered
      ? (q.approved ? db.select({ n: sql<number>`count(*)::int` }).from(v).innerJoin(p, eq(p.id, v.partId)).where(where) : db.select({ n: sql<number>`count(*)::int` }).from(v).where(where)).then(r => r[0]?.n ?? 0)
      : db.select({ n: tables.catalogVersions.partsTotal }).from(tables.catalogVersions).orderBy(desc(tables.catalogVersions.number)).limit(1).then(r => r[0]?.n ?? 0),
  ])
  return { rows, total, page: q.page, pageSize: q.pageSize }
})
