import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { unassignSchema } from '#shared/schemas/parts'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'parts:assign')
  const { id } = paramsValid(event, idParam)
  const { side, position } = await readValid(event, unassignSchema)
  const t = tables.partAssignments
  const removed = await useDb().delete(t).where(and(eq(t.designId, id), eq(t.side, side), eq(t.position, position))).returning()
  if (!removed.length) throw createError({ statusCode: 404, message: 'Nothing was assigned there.' })
  await audit(event, 'part unassigned', { subject: `design ${id} ${side} ${position}` })
  return { ok: true }
})
