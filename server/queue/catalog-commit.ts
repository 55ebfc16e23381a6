// The catalogue commit as a queued job: validate the kept table, then write every part in one
// transaction as a new catalogue version, reporting progress per batch. A retry after a crash finds
// the import committed (the transaction marked it) and answers with that version instead of writing twice.
import { and, eq } from 'drizzle-orm'
import type { ColumnMapping } from '#shared/catalog/types'
import type { DecimalSeparator } from '#shared/catalog/units'
import { commitParts, type CommitSummary } from '../services/catalog'
import { headerSignature, loadImportTable, previewOf } from '../services/catalog-import'
import { jobProgress, type JobRow } from './jobs'

export interface CatalogCommitInput { importId: number, mapping: ColumnMapping, decimalSeparator: DecimalSeparator, userId: number }

export async function catalogCommitJob(job: JobRow): Promise<CommitSummary> {
  const { importId: id, mapping, decimalSeparator, userId } = job.input as CatalogCommitInput
  const db = useDb()
  const [row] = await db.select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  await jobProgress(job.id, 0.02, 'Reading the kept table')
  const table = await loadImportTable(row)
  await jobProgress(job.id, 0.05, `Validating ${table.rows.length} rows`)
  const preview = previewOf(table, mapping, decimalSeparator)
  if (preview.rowsWithErrors > 0) {
    throw createError({ statusCode: 422, message: `${preview.rowsWithErrors} row(s) still have errors; fix them in the file or the mapping. Nothing was imported.`, data: { issues: preview.issues.slice(0, 50) } })
  }
  if (preview.validParts === 0) throw createError({ statusCode: 422, message: 'The file holds no parts to import.' })
  await jobProgress(job.id, 0.1, `Writing ${preview.validParts} parts`)
  const summary = await db.transaction(async (tx) => {
    // Lock the import row so two commits of one upload cannot both pass.
    const [locked] = await tx.update(tables.catalogImports).set({ status: 'committed' })
      .where(and(eq(tables.catalogImports.id, id), eq(tables.catalogImports.status, 'preview'))).returning()
    if (!locked) throw createError({ statusCode: 409, message: 'This import was already committed.' })
    const s = await commitParts(tx, preview.parts, {
      userId, importId: id, note: `Import of ${row.filename}`, approve: false,
      // progress goes through the pool, outside this transaction, so that it is visible while it runs
      onProgress: (done, total) => jobProgress(job.id, 0.1 + 0.85 * (total ? done / total : 1), `Written ${done} of ${total}`),
    })
    await tx.update(tables.catalogImports).set({ mapping, decimalSeparator, catalogVersionId: s.catalogVersionId, issueCount: preview.issues.length }).where(eq(tables.catalogImports.id, id))
    await tx.insert(tables.headerMappings).values({ userId, signature: headerSignature(table.headers), mapping })
      .onConflictDoUpdate({ target: [tables.headerMappings.userId, tables.headerMappings.signature], set: { mapping, updatedAt: new Date() } })
    return s
  })
  await audit(null, 'catalogue import committed', { actorId: userId, subject: row.filename, details: { ...summary, jobId: job.id } })
  return summary
}
