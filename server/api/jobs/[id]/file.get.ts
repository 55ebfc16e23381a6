import { z } from 'zod'
import { loadJob } from '~~/server/queue/jobs'
import { jobFileKey } from '~~/server/queue/work'

const jobParam = z.object({ id: z.string().uuid() })

// The file a finished job made (a large BOM's PDF), for the person who queued it.
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Please sign in.' })
  const { id } = paramsValid(event, jobParam)
  const job = await loadJob(id)
  if (!job || (job.createdBy !== user.id && user.role !== 'admin')) throw createError({ statusCode: 404, message: 'No such job.' })
  const result = job.result as { filename?: string, contentType?: string } | null
  if (job.status !== 'done' || !result?.filename) throw createError({ statusCode: 409, message: job.status === 'failed' ? 'The job failed; nothing was made.' : 'The file is not ready yet.' })
  const content = await useStorage('uploads').getItemRaw(jobFileKey(id))
  if (!content) throw createError({ statusCode: 410, message: 'The file is no longer kept; run the export again.' })
  setResponseHeaders(event, { 'Content-Type': result.contentType ?? 'application/octet-stream', 'Content-Disposition': `attachment; filename="${result.filename}"` })
  return Buffer.from(content as ArrayBuffer)
})
