import { desc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { draftBom } from '~~/server/services/bom'

// The design's live BOM (from its part assignments), what blocks its release, the changes against the last release, and the released revisions.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:draft')
  const { id } = paramsValid(event, idParam)
  const { snapshot, missing, stale, unacknowledged, changes, settings } = await draftBom(id, user.name)
  const releases = await useDb().select({ id: tables.boms.id, revision: tables.boms.revision, status: tables.boms.status, releasedAt: tables.boms.releasedAt, designRevision: tables.boms.designRevision })
    .from(tables.boms).where(eq(tables.boms.designId, id)).orderBy(desc(tables.boms.revision))
  return { draft: snapshot, missing, stale, unacknowledged, changes, settings, releases }
})
