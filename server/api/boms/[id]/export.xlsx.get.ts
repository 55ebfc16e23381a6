import { idParam } from '#shared/schemas/auth'
import { exportQuery } from '#shared/schemas/bom'
import { sendBomFile } from '~~/server/services/bom'

// The released BOM as an Excel workbook, with purchasing's entries for the roles that see them; open=1: open lines by supplier.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  const { open } = queryValid(event, exportQuery)
  return sendBomFile(event, id, 'xlsx', user.role, open === '1')
})
