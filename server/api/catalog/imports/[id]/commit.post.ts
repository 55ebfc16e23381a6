import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParam } from '#shared/schemas/auth'
import { importCommitSchema } from '#shared/schemas/catalog'
import type { ImportSettings } from '#shared/catalog/types'
import { loadImportTable, previewOf, type ImportChoice } from '~~/server/services/catalog-import'
import { enqueue, jobAnswer, waitForJob } from '~~/server/queue/jobs'
import type { CatalogCommitInput } from '~~/server/queue/catalog-commit'
import { count } from '#shared/utils/format'

const commitQuery = z.object({ async: z.enum(['0', '1'], { message: 'Use async=1 to follow the commit as a job' }).optional() })

// Writes the valid rows as a new catalogue version in one transaction. Refused rows are left out only
// when the user confirmed how many (`leaveRefused` equal to the count); they download as a sheet to fix.
// Fields the file does not carry keep their current values; an identical file makes no new version.
// The write runs on the job queue (any instance); `?async=1` answers 202 with the job to poll for progress
// (GET /api/jobs/:id), otherwise the answer waits for the job and is its summary.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { async } = queryValid(event, commitQuery)
  const { leaveRefused, ...body } = await readValid(event, importCommitSchema)
  const [row] = await useDb().select().from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const choice: ImportChoice = { ...body, headerRow: body.headerRow ?? (row.settings as ImportSettings).headerRow }
  // refuse at once what the job would refuse, so the page hears it without waiting for a worker
  const preview = previewOf(await loadImportTable(row, choice.headerRow), choice)
  if (preview.validParts === 0) {
    throw createError({ statusCode: 422, message: preview.rowsWithErrors ? `${preview.rowsWithErrors === 1 ? 'The only row has' : `All ${preview.rowsWithErrors} rows have`} errors; nothing can be imported. Fix the file or the mapping.` : 'The file holds no parts to import.', data: { issues: preview.issues.slice(0, 50) } })
  }
  if (preview.rowsWithErrors > 0 && leaveRefused !== preview.rowsWithErrors) {
    throw createError({
      statusCode: 422,
      message: `${count(preview.rowsWithErrors, 'row')} ${preview.rowsWithErrors === 1 ? 'has' : 'have'} errors. Import the ${count(preview.validParts, 'valid row')} and leave the ${count(preview.rowsWithErrors, 'refused one', 'refused ones')}? Confirm with leaveRefused: ${preview.rowsWithErrors}. Nothing was imported.`,
      data: { refusedCount: preview.rowsWithErrors, validParts: preview.validParts, issues: [{ path: 'leaveRefused', message: `Confirm leaving out ${count(preview.rowsWithErrors, 'refused row')}` }, ...preview.issues.slice(0, 50).map(i => ({ path: `row ${i.row}`, message: i.message }))] },
    })
  }
  const input: CatalogCommitInput = { importId: id, choice, leaveRefused, userId: user.id }
  const jobId = await enqueue('catalog-commit', input, user.id)
  if (async === '1') {
    setResponseStatus(event, 202)
    return { jobId, status: 'queued' }
  }
  // under the HTTP server's 5 min request timeout; a longer commit answers 202 with the job to follow
  const job = await waitForJob(jobId, 4 * 60_000)
  if (!job) {
    setResponseStatus(event, 202)
    return { jobId, status: 'running' }
  }
  return jobAnswer(job)
})
