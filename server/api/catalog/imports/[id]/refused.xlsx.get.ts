import { eq } from 'drizzle-orm'
import { choiceOf, loadImportTable, previewOf } from '~~/server/services/catalog-import'
import { refusedRowsWorkbook } from '~~/server/services/catalog-template'
import { idParam } from '#shared/schemas/auth'

// The refused rows of an import as they were uploaded, with a Reason column: fix them and upload again.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const { id } = paramsValid(event, idParam)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  const choice = choiceOf(row)
  const table = await loadImportTable(row, choice.headerRow)
  const { refused } = previewOf(table, choice)
  const buffer = await refusedRowsWorkbook(table, refused)
  setResponseHeaders(event, {
    'Content-Type': 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    'Content-Disposition': `attachment; filename="refused-rows-${row.filename.replace(/\.[^.]*$/, '').replace(/[^\w.-]/g, '_')}.xlsx"`,
  })
  return buffer
})
