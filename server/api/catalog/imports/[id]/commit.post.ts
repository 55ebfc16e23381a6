import { and, eq } from 'drizzle-orm'
import { commitParts } from '~~/server/services/catalog'
import { loadImportTable, previewOf, rememberChoice, settingsOf, type ImportChoice } from '~~/server/services/catalog-import'
import { idParam } from '#shared/schemas/auth'
import { importCommitSchema } from '#shared/schemas/catalog'
import type { ImportSettings } from '#shared/catalog/types'

// Writes the valid rows as a new catalogue version in one transaction. Refused rows are left out only
// when the user confirmed how many (`leaveRefused` equal to the count); they download as a sheet to fix.
// Fields the file does not carry keep their current values; an identical file makes no new version.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { leaveRefused, ...body } = await readValid(event, importCommitSchema)
  const db = useDb()
  const [row] = await db.select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const choice: ImportChoice = { ...body, headerRow: body.headerRow ?? (row.settings as ImportSettings).headerRow }
  const table = await loadImportTable(row, choice.headerRow)
  const preview = previewOf(table, choice)
  if (preview.validParts === 0) {
    throw createError({ statusCode: 422, message: preview.rowsWithErrors ? `All ${preview.rowsWithErrors} row(s) have errors; nothing can be imported. Fix the file or the mapping.` : 'The file holds no parts to import.', data: { issues: preview.issues.slice(0, 50) } })
  }
  if (preview.rowsWithErrors > 0 && leaveRefused !== preview.rowsWithErrors) {
    throw createError({
      statusCode: 422,
      message: `${preview.rowsWithErrors} row(s) have errors. Import the ${preview.validParts} valid row(s) and leave the ${preview.rowsWithErrors} refused one(s)? Confirm with leaveRefused: ${preview.rowsWithErrors}. Nothing was imported.`,
      data: { refusedCount: preview.rowsWithErrors, validParts: preview.validParts, issues: [{ path: 'leaveRefused', message: `Confirm leaving out ${preview.rowsWithErrors} refused row(s)` }, ...preview.issues.slice(0, 50).map(i => ({ path: `row ${i.row}`, message: i.message }))] },
    })
  }
  const summary = await db.transaction(async (tx) => {
    // Lock the import row so two commits of one upload cannot both pass.
    const [locked] = await tx.update(tables.catalogImports).set({ status: 'committed' })
      .where(and(eq(tables.catalogImports.id, id), eq(tables.catalogImports.status, 'preview'))).returning()
    if (!locked) throw createError({ statusCode: 409, message: 'This import was already committed.' })
    const s = await commitParts(tx, preview.parts, { userId: user.id, importId: id, note: `Import of ${row.filename}`, approve: false, carried: preview.carried })
    await tx.update(tables.catalogImports).set({
      mapping: choice.mapping, decimalSeparator: choice.decimalSeparator, settings: settingsOf(choice), catalogVersionId: s.catalogVersionId,
      issueCount: preview.issueCount, refusedCount: preview.rowsWithErrors,
    }).where(eq(tables.catalogImports.id, id))
    await rememberChoice(tx, user.id, table.headers, choice)
    return s
  })
  await audit(event, 'catalogue import committed', { subject: row.filename, details: { ...summary, refused: preview.rowsWithErrors } })
  return { ...summary, refused: preview.rowsWithErrors }
})
