import { and, eq } from 'drizzle-orm'
import { deleteUpload } from '~~/server/services/catalog-import'
import { idParam } from '#shared/schemas/auth'

// Deletes an uncommitted import and its stored file; a committed import stays (its version refers to it).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const [row] = await useDb().delete(tables.catalogImports)
    .where(and(eq(tables.catalogImports.id, id), eq(tables.catalogImports.status, 'preview'))).returning()
  if (!row) {
    const [other] = await useDb().select({ status: tables.catalogImports.status }).from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
    if (!other) throw createError({ statusCode: 404, message: 'No such import.' })
    throw createError({ statusCode: 409, message: 'This import was committed; it is kept with its catalogue version.' })
  }
  // The row is gone first: a crash here leaves at most an orphaned file, never an import without its file.
  await deleteUpload(row)
  await audit(event, 'catalogue import deleted', { subject: row.filename, details: { importId: id } })
  return { ok: true }
})
