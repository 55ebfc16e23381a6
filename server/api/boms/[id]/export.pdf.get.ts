import { idParam } from '#shared/schemas/auth'
import { sendBomFile } from '~~/server/services/bom'

// The released BOM as a PDF, with purchasing's quotes and order references.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  return sendBomFile(event, id, 'pdf')
})
