import { z } from 'zod'
import { loadJob } from '~~/server/queue/jobs'

const jobParam = z.object({ id: z.string().uuid() })

// A queued job's status, progress (0…1) and, once done, its result or error — for the person who queued it.
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Please sign in.' })
  const { id } = paramsValid(event, jobParam)
  const job = await loadJob(id)
  if (!job || (job.createdBy !== user.id && user.role !== 'admin')) throw createError({ statusCode: 404, message: 'No such job.' })
  return {
    id: job.id, kind: job.kind, status: job.status, progress: job.progress, message: job.message, attempts: job.attempts,
    result: job.status === 'done' ? job.result : null, error: job.status === 'failed' ? job.error : null,
    createdAt: job.createdAt, updatedAt: job.updatedAt,
  }
})
