// The catalogue commit as a queued job: validate the kept table, then write the valid parts in one
// transaction as a new catalogue version, reporting progress per batch. A retry after a crash finds
// the import committed (the transaction marked it) and answers 409 instead of writing twice.
import { and, eq } from 'drizzle-orm'
import { commitParts, type CommitSummary } from '../services/catalog'
import { loadImportTable, previewOf, rememberChoice, settingsOf, type ImportChoice } from '../services/catalog-import'
import { jobProgress, type JobRow } from './jobs'
import { count } from '#shared/utils/format'

export interface CatalogCommitInput { importId: number, choice: ImportChoice, leaveRefused?: number, userId: number }

export async function catalogCommitJob(job: JobRow): Promise<CommitSummary & { refused: number }> {
  const { importId: id, choice, leaveRefused, userId } = job.input as CatalogCommitInput
  const db = useDb()
  const [row] = await db.select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  await jobProgress(job.id, 0.02, 'Reading the kept table')
  const table = await loadImportTable(row, choice.headerRow)
  await jobProgress(job.id, 0.05, `Validating ${table.rows.length} rows`)
  const preview = previewOf(table, choice)
  if (preview.validParts === 0) throw createError({ statusCode: 422, message: 'The file holds no parts to import.' })
  if (preview.rowsWithErrors > 0 && leaveRefused !== preview.rowsWithErrors) {
    throw createError({ statusCode: 422, message: `${count(preview.rowsWithErrors, 'row')} ${preview.rowsWithErrors === 1 ? 'has' : 'have'} errors; confirm leaving them out (leaveRefused: ${preview.rowsWithErrors}). Nothing was imported.`, data: { issues: [{ path: 'leaveRefused', message: `Confirm leaving out ${count(preview.rowsWithErrors, 'refused row')}` }] } })
  }
  await jobProgress(job.id, 0.1, `Writing ${preview.validParts} parts`)
  const summary = await db.transaction(async (tx) => {
    // Lock the import row so two commits of one upload cannot both pass.
    const [locked] = await tx.update(tables.catalogImports).set({ status: 'committed' })
      .where(and(eq(tables.catalogImports.id, id), eq(tables.catalogImports.status, 'preview'))).returning()
    if (!locked) throw createError({ statusCode: 409, message: 'This import was already committed.' })
    const s = await commitParts(tx, preview.parts, {
      userId, importId: id, note: `Import of ${row.filename}`, approve: false, carried: preview.carried,
      // progress goes through the pool, outside this transaction, so that it is visible while it runs
      onProgress: (done, total) => jobProgress(job.id, 0.1 + 0.85 * (total ? done / total : 1), `Written ${done} of ${total}`),
    })
    await tx.update(tables.catalogImports).set({
      mapping: choice.mapping, decimalSeparator: choice.decimalSeparator, settings: settingsOf(choice), catalogVersionId: s.catalogVersionId,
      issueCount: preview.issueCount, refusedCount: preview.rowsWithErrors,
    }).where(eq(tables.catalogImports.id, id))
    await rememberChoice(tx, userId, table.headers, choice)
    return s
  })
  await audit(null, 'catalogue import committed', { actorId: userId, subject: row.filename, details: { ...summary, refused: preview.rowsWithErrors, jobId: job.id } })
  return { ...summary, refused: preview.rowsWithErrors }
}
