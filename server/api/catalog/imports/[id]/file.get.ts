import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'

// The original uploaded file, as it was uploaded.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const { id } = paramsValid(event, idParam)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  const raw = await useStorage('uploads').getItemRaw(row.storageKey)
  if (!raw) throw createError({ statusCode: 410, message: 'The file is no longer stored.' })
  setResponseHeaders(event, {
    'Content-Type': row.filename.toLowerCase().endsWith('.csv') ? 'text/csv' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    'Content-Disposition': `attachment; filename="${row.filename.replace(/[^\w.-]/g, '_')}"`,
  })
  return Buffer.from(raw as ArrayBuffer)
})
