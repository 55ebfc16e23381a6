import { eq } from 'drizzle-orm'
import { loadImportTable, describeImport, choiceOf } from '~~/server/services/catalog-import'
import { idParam } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const { id } = paramsValid(event, idParam)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  const table = await loadImportTable(row)
  return describeImport(row, table, choiceOf(row))
})
