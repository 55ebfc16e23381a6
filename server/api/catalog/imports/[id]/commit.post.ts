import { commitParts } from '~~/server/services/catalog'
import { loadImportTable, previewOf, headerSignature } from '~~/server/services/catalog-import'
import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/auth'
import { importMappingSchema } from '#shared/schemas/catalog'
import type { ColumnMapping } from '#shared/catalog/types'

// Writes the import as a new catalogue version in one transaction — only when no row has an error.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { mapping, decimalSeparator } = await readValid(event, importMappingSchema)
  const db = useDb()
  const [row] = await db.select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const table = await loadImportTable(row)
  const preview = previewOf(table, mapping as ColumnMapping, decimalSeparator)
  if (preview.rowsWithErrors > 0) {
    throw createError({ statusCode: 422, message: `${preview.rowsWithErrors} row(s) still have errors; fix them in the file or the mapping. Nothing was imported.`, data: { issues: preview.issues.slice(0, 50) } })
  }
  if (preview.validParts === 0) throw createError({ statusCode: 422, message: 'The file holds no parts to import.' })
  const summary = await db.transaction(async (tx) => {
    // Lock the import row so two commits of one upload cannot both pass.
    const [locked] = await tx.update(tables.catalogImports).set({ status: 'committed' })
      .where(and(eq(tables.catalogImports.id, id), eq(tables.catalogImports.status, 'preview'))).returning()
    if (!locked) throw createError({ statusCode: 409, message: 'This import was already committed.' })
    const s = await commitParts(tx, preview.parts, { userId: user.id, importId: id, note: `Import of ${row.filename}`, approve: false })
    await tx.update(tables.catalogImports).set({ mapping, decimalSeparator, catalogVersionId: s.catalogVersionId, issueCount: preview.issues.length }).where(eq(tables.catalogImports.id, id))
    await tx.insert(tables.headerMappings).values({ userId: user.id, signature: headerSignature(table.headers), mapping })
      .onConflictDoUpdate({ target: [tables.headerMappings.userId, tables.headerMappings.signature], set: { mapping, updatedAt: new Date() } })
    return s
  })
  await audit(event, 'catalogue import committed', { subject: row.filename, details: summary })
  return summary
})
