import { z } from 'zod'
import type { BomSnapshot } from '#shared/bom/types'
import { bomFile, loadBom, purchaseOf } from '~~/server/services/bom'

const params = z.object({ id: z.coerce.number().int().positive(), format: z.enum(['xlsx', 'pdf'], { message: "Use 'xlsx' or 'pdf'" }) })

// The released BOM as Excel or PDF, with purchasing's quotes and order references.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:read')
  const { id, format } = paramsValid(event, params)
  const bom = await loadBom(id)
  const file = await bomFile(bom.snapshot as BomSnapshot, format, await purchaseOf(id))
  setResponseHeaders(event, {
    'Content-Type': format === 'pdf' ? 'application/pdf' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    'Content-Disposition': `attachment; filename="${file.filename}"`,
  })
  return file.content
})
