import { idParam } from '#shared/schemas/auth'
import { exportQuery } from '#shared/schemas/bom'
import type { BomSnapshot } from '#shared/bom/types'
import { loadBom, sendBomFile } from '~~/server/services/bom'
import { enqueue } from '~~/server/queue/jobs'

/** BOMs with more lines than this render on the job queue (`?async=1` queues any BOM). */
const QUEUE_FROM_LINES = 300

// The released BOM as a PDF, with purchasing's entries for the roles that see them; open=1: open lines by
// supplier. A large one is rendered on the job queue: 202 with the job to poll (GET /api/jobs/:id), then
// GET /api/jobs/:id/file.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  const { open, async } = queryValid(event, exportQuery)
  if (async === '1' || (await loadBom(id).then(b => (b.snapshot as BomSnapshot).lines.length)) > QUEUE_FROM_LINES) {
    const jobId = await enqueue('bom-pdf', { bomId: id, role: user.role, openOnly: open === '1', locale: requestLocale(event) }, user.id)
    setResponseStatus(event, 202)
    return { jobId, status: 'queued', file: `/api/jobs/${jobId}/file` }
  }
  return sendBomFile(event, id, 'pdf', user.role, open === '1')
})
