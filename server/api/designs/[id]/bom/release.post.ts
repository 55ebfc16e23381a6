import { idParam } from '#shared/schemas/auth'
import { releaseBom } from '~~/server/services/bom'

// Releases the BOM as an immutable snapshot and mails purchasing the Excel and PDF files.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:release')
  const { id } = paramsValid(event, idParam)
  const { bom, mailSent } = await releaseBom(id, user)
  await audit(event, 'BOM released', { subject: `design ${id} BOM rev. ${bom.revision}`, details: { bomId: bom.id, mailSent } })
  setResponseStatus(event, 201)
  return { id: bom.id, revision: bom.revision, mailSent, changes: bom.changes }
})
