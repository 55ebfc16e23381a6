import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { confirmAssignmentSchema } from '#shared/schemas/parts'
import { loadDesign } from '~~/server/services/designs'

// Keeps an assignment that no longer fits the current design revision, with the engineer's reason (recorded, audited).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'parts:assign')
  const { id } = paramsValid(event, idParam)
  const { side, position, reason } = await readValid(event, confirmAssignmentSchema)
  const design = await loadDesign(id)
  const t = tables.partAssignments
  const updated = await useDb().update(t).set({ confirmedRevision: design.revision, confirmedReason: reason })
    .where(and(eq(t.designId, id), eq(t.side, side), eq(t.position, position))).returning({ id: t.id })
  if (!updated.length) throw createError({ statusCode: 404, message: 'Nothing is assigned there.' })
  await audit(event, 'part assignment confirmed', { subject: `design ${id} ${side} ${position}`, details: { designRevision: design.revision, reason } })
  return { side, position, confirmedRevision: design.revision }
})
