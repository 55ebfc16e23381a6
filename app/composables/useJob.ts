// Follows a job on the server's queue (GET /api/jobs/:id) until it ends, exposing its progress (0…1)
// and message for a progress bar; resolves with the result or throws the error the route would have given.
export interface JobStatus { id: string, status: 'queued' | 'running' | 'done' | 'failed', progress: number, message: string, result: unknown, error: { statusCode?: number, message?: string, data?: unknown } | null }

export function useJob() {
  const progress = ref(0)
  const message = ref('')
  const running = ref(false)

  async function follow<T>(jobId: string, intervalMs = 300): Promise<T> {
    running.value = true
    progress.value = 0
    message.value = 'Queued'
    try {
      for (;;) {
        const job = await $fetch<JobStatus>(`/api/jobs/${jobId}`)
        progress.value = job.progress
        message.value = job.message
        if (job.status === 'done') return job.result as T
        if (job.status === 'failed') {
          // the same shape as a failed $fetch, so forms show it the usual way
          throw Object.assign(new Error(job.error?.message ?? 'The job failed.'), { statusCode: job.error?.statusCode ?? 500, data: { message: job.error?.message, data: job.error?.data } })
        }
        await new Promise(r => setTimeout(r, intervalMs))
      }
    }
    finally {
      running.value = false
    }
  }
  return { progress, message, running, follow }
}
