import { and, count, desc, gte, ilike, lt, or, type SQL } from 'drizzle-orm'
import { z } from 'zod'

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD').refine(v => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), 'Enter a real date')

const query = z.object({
  q: z.string().trim().max(100).optional(),
  /** first day shown (UTC, inclusive) */
  from: day.optional(),
  /** last day shown (UTC, inclusive) */
  to: day.optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
}).refine(v => !v.from || !v.to || v.from <= v.to, { path: ['to'], message: 'The last day must not be before the first day' })

// The audit log, newest first: a page of it, filtered by text (action, person, subject) and a day range, with the total.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'audit:read')
  const { q, from, to, page, pageSize } = queryValid(event, query)
  const t = tables.auditLog
  const where: SQL[] = []
  if (q) {
    const like = `%${q.replace(/[\\%_]/g, c => `\\${c}`)}%`
    where.push(or(ilike(t.action, like), ilike(t.actorEmail, like), ilike(t.subject, like))!)
  }
  if (from) where.push(gte(t.at, new Date(`${from}T00:00:00Z`)))
  if (to) where.push(lt(t.at, new Date(Date.parse(`${to}T00:00:00Z`) + 86_400_000)))
  const condition = where.length ? and(...where) : undefined
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select().from(t).where(condition).orderBy(desc(t.at), desc(t.id)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: count() }).from(t).where(condition),
  ])
  return { rows, total: Number(total?.n ?? 0), page, pageSize }
})
