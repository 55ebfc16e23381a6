import { loadImportTable, describeImport } from '~~/server/services/catalog-import'
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { importMappingSchema } from '#shared/schemas/catalog'
import type { ColumnMapping } from '#shared/catalog/types'

// Re-validates the upload with a changed header mapping or decimal separator; writes no part.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { mapping, decimalSeparator } = await readValid(event, importMappingSchema)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const table = await loadImportTable(row)
  const described = describeImport(row, table, mapping as ColumnMapping, decimalSeparator)
  await useDb().update(tables.catalogImports).set({ mapping, decimalSeparator, issueCount: described.preview.issues.length }).where(eq(tables.catalogImports.id, id))
  return described
})
