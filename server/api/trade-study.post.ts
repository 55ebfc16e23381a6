import { z } from 'zod'
import { tradeStudySchema } from '#shared/schemas/trade-study'
import { runTradeStudy } from '~~/server/services/trade-study'
import { enqueue, jobAnswer, waitForJob } from '~~/server/queue/jobs'

/** Studies with more candidates than this go through the job queue (any instance takes them). */
const QUEUE_FROM_CANDIDATES = 12
const studyQuery = z.object({ async: z.enum(['0', '1']).optional() })

// One duty through several topologies and level counts (nothing saved). Large studies, or any with
// `?async=1` (202 + the job to poll at GET /api/jobs/:id), run on the job queue.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:read')
  const { async } = queryValid(event, studyQuery)
  const duty = await readValid(event, tradeStudySchema)
  if (async !== '1' && (duty.candidates?.length ?? 0) <= QUEUE_FROM_CANDIDATES) return runTradeStudy(duty)
  const jobId = await enqueue('trade-study', duty, user.id)
  if (async === '1') {
    setResponseStatus(event, 202)
    return { jobId, status: 'queued' }
  }
  const job = await waitForJob(jobId, 2 * 60_000)
  if (!job) {
    setResponseStatus(event, 202)
    return { jobId, status: 'running' }
  }
  return jobAnswer(job)
})
