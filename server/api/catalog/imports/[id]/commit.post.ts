import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParam } from '#shared/schemas/auth'
import { importMappingSchema } from '#shared/schemas/catalog'
import type { ColumnMapping } from '#shared/catalog/types'
import { enqueue, jobAnswer, waitForJob } from '~~/server/queue/jobs'
import type { CatalogCommitInput } from '~~/server/queue/catalog-commit'

const commitQuery = z.object({ async: z.enum(['0', '1']).optional() })

// Writes the import as a new catalogue version in one transaction — only when no row has an error.
// The work runs on the job queue (any instance); `?async=1` answers 202 with the job to poll for progress
// (GET /api/jobs/:id), otherwise the answer waits for the job and is its summary.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const { id } = paramsValid(event, idParam)
  const { async } = queryValid(event, commitQuery)
  const { mapping, decimalSeparator } = await readValid(event, importMappingSchema)
  const [row] = await useDb().select({ status: tables.catalogImports.status }).from(tables.catalogImports).where(eq(tables.catalogImports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such import.' })
  if (row.status !== 'preview') throw createError({ statusCode: 409, message: 'This import was already committed.' })
  const input: CatalogCommitInput = { importId: id, mapping: mapping as ColumnMapping, decimalSeparator, userId: user.id }
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
