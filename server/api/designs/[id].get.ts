import { desc, eq } from 'drizzle-orm'
import { loadDesign, loadRevision, revisionQuery } from '~~/server/services/designs'
import { idParam } from '#shared/schemas/auth'

// A design with its revision history; ?revision=N reads an earlier revision's inputs.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { revision } = queryValid(event, revisionQuery)
  const design = await loadDesign(id)
  const db = useDb()
  const revisions = await db.select({ revision: tables.designRevisions.revision, name: tables.designRevisions.name, createdAt: tables.designRevisions.createdAt, author: tables.users.name })
    .from(tables.designRevisions).leftJoin(tables.users, eq(tables.users.id, tables.designRevisions.authorId))
    .where(eq(tables.designRevisions.designId, id)).orderBy(desc(tables.designRevisions.revision))
  const [owner] = design.ownerId ? await db.select({ name: tables.users.name }).from(tables.users).where(eq(tables.users.id, design.ownerId)) : []
  if (revision && revision !== design.revision) {
    const old = await loadRevision(id, revision)
    return { ...design, name: old.name, input: old.input, viewingRevision: revision, owner: owner?.name ?? null, revisions }
  }
  return { ...design, viewingRevision: design.revision, owner: owner?.name ?? null, revisions }
})
