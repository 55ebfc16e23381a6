import { idParam } from '#shared/schemas/auth'
import { releaseSchema } from '#shared/schemas/bom'
import { releaseBom } from '~~/server/services/bom'

// Releases the BOM once as an immutable snapshot; the mail to purchasing (Excel and PDF) goes through the outbox.
// Body (optional): { expectedRevision } — the draft revision the page showed; a release meanwhile answers 409.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:release')
  const { id } = paramsValid(event, idParam)
  const { expectedRevision } = getRequestHeader(event, 'content-type')?.includes('json') ? await readValid(event, releaseSchema) : { expectedRevision: undefined }
  const { bom, mailQueued } = await releaseBom(id, user, expectedRevision)
  await audit(event, 'BOM released', { subject: `design ${id} BOM rev. ${bom.revision}`, details: { bomId: bom.id, mailQueued } })
  setResponseStatus(event, 201)
  return { id: bom.id, revision: bom.revision, mailQueued, changes: bom.changes }
})
