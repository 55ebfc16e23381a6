import { idParam } from '#shared/schemas/auth'
import { acknowledgementSchema } from '#shared/schemas/bom'
import { draftBom } from '~~/server/services/bom'

// A design engineer records why a line with an unapproved / not-recommended / obsolete part may be released.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:release')
  const { id } = paramsValid(event, idParam)
  const { lineKey, reason } = await readValid(event, acknowledgementSchema)
  const { snapshot } = await draftBom(id, user.name)
  const line = snapshot.lines.find(l => l.key === lineKey)
  if (!line) throw createError({ statusCode: 422, message: `lineKey: the draft BOM has no line ${lineKey}.`, data: { issues: [{ path: 'lineKey', message: 'No such line in the draft' }] } })
  if (!line.gate?.length || line.partVersionId === null) throw createError({ statusCode: 422, message: `lineKey: ${line.partNumber} is approved and active; nothing to acknowledge.`, data: { issues: [{ path: 'lineKey', message: 'Line needs no acknowledgement' }] } })
  const t = tables.bomAcknowledgements
  const values = { designId: id, lineKey, partVersionId: line.partVersionId, reason, acknowledgedBy: user.id, acknowledgedByName: user.name, acknowledgedAt: new Date() }
  await useDb().insert(t).values(values).onConflictDoUpdate({ target: [t.designId, t.lineKey], set: values })
  await audit(event, 'BOM line acknowledged', { subject: `design ${id} ${line.partNumber}`, details: { lineKey, gate: line.gate, reason, partVersionId: line.partVersionId } })
  return { lineKey, gate: line.gate, acknowledgement: { reason, by: user.name, at: values.acknowledgedAt.toISOString() } }
})
