import { and, desc, eq, inArray, isNull, ne, sql } from 'drizzle-orm'
import { can } from '#shared/roles'
import demo from '../db/demo-accounts.json'
import { count } from '#shared/utils/format'

interface Task { title: string, text: string, items?: { to: string, label: string }[], action?: { to: string, label: string } }
/** Where one of the person's designs stands on the way design → parts → BOM → release. */
interface Journey { id: number, name: string, revision: number, assigned: number, bom: { id: number, revision: number, designRevision: number, status: string } | null }

/** The person's active designs with their assigned-part count and latest released BOM. */
async function journeys(ownerId: number): Promise<Journey[]> {
  const db = useDb()
  const mine = await db.select({ id: tables.designs.id, name: tables.designs.name, revision: tables.designs.revision }).from(tables.designs)
    .where(and(eq(tables.designs.ownerId, ownerId), eq(tables.designs.status, 'active'))).orderBy(desc(tables.designs.updatedAt)).limit(6)
  if (!mine.length) return []
  const ids = mine.map(d => d.id)
  const assigned = await db.select({ designId: tables.partAssignments.designId, n: sql<number>`count(*)::int` }).from(tables.partAssignments)
    .where(inArray(tables.partAssignments.designId, ids)).groupBy(tables.partAssignments.designId)
  const boms = await db.selectDistinctOn([tables.boms.designId], { designId: tables.boms.designId, id: tables.boms.id, revision: tables.boms.revision, designRevision: tables.boms.designRevision, status: tables.boms.status })
    .from(tables.boms).where(inArray(tables.boms.designId, ids)).orderBy(tables.boms.designId, desc(tables.boms.revision))
  return mine.map((d) => {
    const b = boms.find(x => x.designId === d.id)
    return { ...d, assigned: assigned.find(a => a.designId === d.id)?.n ?? 0, bom: b ? { id: b.id, revision: b.revision, designRevision: b.designRevision, status: b.status } : null }
  })
}

// What this person has to do today, by role.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'stress:evaluate')
  const db = useDb()
  const tasks: Task[] = []
  const path = can(user.role, 'designs:write') ? await journeys(user.id) : []
  if (can(user.role, 'designs:write')) {
    const mine = await db.select({ id: tables.designs.id, name: tables.designs.name }).from(tables.designs)
      .where(and(eq(tables.designs.ownerId, user.id), eq(tables.designs.status, 'active'))).orderBy(desc(tables.designs.updatedAt)).limit(5)
    tasks.push({ title: 'Your designs', text: mine.length ? 'Pick up where you left off.' : 'No designs yet: start from a topology and a DC link.', items: mine.map(d => ({ to: `/designs/${d.id}`, label: d.name })), action: { to: '/designs/new', label: 'New design' } })
    tasks.push({ title: 'Compare topologies', text: 'Run one duty through every topology and level count side by side.', action: { to: '/compare', label: 'Open trade study' } })
  }
  if (can(user.role, 'catalog:write')) {
    const [pending] = await db.select({ n: sql<number>`count(*)::int` }).from(tables.parts).where(eq(tables.parts.approved, false))
    tasks.push({ title: 'Parts catalogue', text: `${count(pending?.n ?? 0, 'part')} ${(pending?.n ?? 0) === 1 ? 'waits' : 'wait'} for approval. Upload a supplier spreadsheet to add or update parts.`, action: { to: '/catalog/import', label: 'Upload spreadsheet' } })
  }
  if (can(user.role, 'bom:purchase')) {
    const open = await db.select({ id: tables.boms.id, designName: tables.designs.name, revision: tables.boms.revision, status: tables.boms.status }).from(tables.boms)
      .innerJoin(tables.designs, eq(tables.designs.id, tables.boms.designId))
      .where(and(ne(tables.boms.status, 'received'), ne(tables.boms.status, 'cancelled'))).orderBy(desc(tables.boms.releasedAt)).limit(8)
    tasks.push({ title: 'Bills of materials to buy', text: open.length ? 'Released BOMs waiting for a quote, an order or delivery.' : 'Nothing waiting: engineering has not released a new BOM.', items: open.map(b => ({ to: `/boms/${b.id}`, label: `${b.designName}, BOM revision ${b.revision} — ${b.status.replace(/-/g, ' ')}` })), action: { to: '/boms', label: 'All BOMs' } })
  }
  if (can(user.role, 'users:manage')) {
    const invited = await db.select({ email: tables.users.email }).from(tables.users).where(isNull(tables.users.passwordHash))
    tasks.push({ title: 'People', text: invited.length ? `${count(invited.length, 'invitation')} not yet accepted.` : 'Everyone invited has signed up.', action: { to: '/admin/users', label: 'Manage people' } })
    tasks.push({ title: 'Outgoing mail', text: 'Check what the app sent: invitations, resets, released BOMs.', action: { to: '/admin/mail', label: 'Open mail' } })
  }
  if (user.role === 'viewer' || user.role === 'component-engineer') {
    tasks.push({ title: 'Designs', text: 'Read the team\'s designs and their results.', action: { to: '/designs', label: 'Browse designs' } })
  }
  if (user.role === 'viewer') tasks.push({ title: 'Released BOMs', text: 'Read what engineering released to purchasing.', action: { to: '/boms', label: 'Browse BOMs' } })
  return { company: demo.company, tasks, path }
})
