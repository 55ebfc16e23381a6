import { z } from 'zod'
import { idParam } from '#shared/schemas/auth'
import type { BomSnapshot } from '#shared/bom/types'
import { loadBom, sendBomFile } from '~~/server/services/bom'
import { enqueue } from '~~/server/queue/jobs'

/** BOMs with more lines than this render on the job queue (`?async=1` queues any BOM). */
const QUEUE_FROM_LINES = 300
const exportQuery = z.object({ async: z.enum(['0', '1']).optional() })

// The released BOM as a PDF, with purchasing's quotes and order references. A large one is rendered on
// the job queue: 202 with the job to poll (GET /api/jobs/:id), then GET /api/jobs/:id/file.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  const { async } = queryValid(event, exportQuery)
  if (async === '1' || (await loadBom(id).then(b => (b.snapshot as BomSnapshot).lines.length)) > QUEUE_FROM_LINES) {
    const jobId = await enqueue('bom-pdf', { bomId: id }, user.id)
    setResponseStatus(event, 202)
    return { jobId, status: 'queued', file: `/api/jobs/${jobId}/file` }
  }
  return sendBomFile(event, id, 'pdf')
})
