import { loadDesign } from '~~/server/services/designs'
import { designPositions } from '~~/server/services/parts'
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { assignmentSchema } from '#shared/schemas/parts'
import type { DesignInput } from '#shared/engine/types'

// Assigns a part version to one position; it stays pinned to that version until re-assigned.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'parts:assign')
  const { id } = paramsValid(event, idParam)
  const body = await readValid(event, assignmentSchema)
  const design = await loadDesign(id)
  const known = designPositions(design.input as DesignInput).some(p => p.side === body.side && p.duty.positionName === body.position)
  if (!known) throw createError({ statusCode: 422, message: `position: ${body.side} side has no position ${body.position}.`, data: { issues: [{ path: 'position', message: 'No such position in this design' }] } })
  const [version] = await useDb().select({ id: tables.partVersions.id, partNumber: tables.partVersions.partNumber }).from(tables.partVersions).where(eq(tables.partVersions.id, body.partVersionId))
  if (!version) throw createError({ statusCode: 422, message: 'partVersionId: no such part version.', data: { issues: [{ path: 'partVersionId', message: 'No such part version' }] } })
  await useDb().insert(tables.partAssignments).values({ designId: id, ...body, assignedBy: user.id })
    .onConflictDoUpdate({ target: [tables.partAssignments.designId, tables.partAssignments.side, tables.partAssignments.position], set: { partVersionId: body.partVersionId, seriesCount: body.seriesCount, parallelCount: body.parallelCount, assignedBy: user.id, assignedAt: new Date() } })
  await audit(event, 'part assigned', { subject: `design ${id} ${body.side} ${body.position}`, details: { partNumber: version.partNumber, partVersionId: body.partVersionId } })
  return { ok: true }
})
