import { eq } from 'drizzle-orm'
import { loadImportTable, describeImport, initialChoice, settingsOf, type ImportChoice } from '~~/server/services/catalog-import'
import { idParam } from '#shared/schemas/auth'
import { importMappingSchema } from '#shared/schemas/catalog'
import type { ImportSettings } from '#shared/catalog/types'

// Re-validates the upload with changed reading choices (header row, mapping, decimal marks, values,
// constants); writes no part. A new header row re-reads the file and suggests a mapping for its headers.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const body = await readValid(event, importMappingSchema)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const stored = row.settings as ImportSettings
  const current = await loadImportTable(row)
  let choice: ImportChoice = { ...body }
  let table = current
  if (body.headerRow !== undefined && body.headerRow !== current.headerRowNumber) {
    table = await loadImportTable(row, body.headerRow)
    choice = { ...(await initialChoice(user.id, table, body.decimalSeparator, body.headerRow)), constants: body.constants ?? stored.constants ?? {} }
  }
  else if (body.headerRow === undefined && stored.headerRow) choice.headerRow = stored.headerRow
  const described = await describeImport(row, table, choice)
  await useDb().update(tables.catalogImports).set({ mapping: choice.mapping, decimalSeparator: choice.decimalSeparator, settings: settingsOf(choice), headers: table.headers, rowCount: table.rows.length, issueCount: described.preview.issueCount }).where(eq(tables.catalogImports.id, id))
  return described
})
