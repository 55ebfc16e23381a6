// The job queue: pg-boss on the app's PostgreSQL (its own schema `pgboss`), so any instance can take any
// job and a job outlives the instance that queued it. Our table background_jobs holds what the UI polls:
// status, progress (0…1), a message, the result or the error the route would have answered.
import { randomUUID } from 'node:crypto'
import { eq, sql } from 'drizzle-orm'
import PgBoss from 'pg-boss'

export const QUEUES = ['catalog-commit', 'trade-study', 'bom-pdf'] as const
export type QueueName = (typeof QUEUES)[number]

/** Retries for work that failed on the way (database gone, instance killed): 2 more attempts, backing off. */
const RETRY = { retryLimit: 2, retryDelay: 2, retryBackoff: true, expireInSeconds: 15 * 60 }

let boss: Promise<PgBoss> | null = null

/** The instance's pg-boss client, started once (pg-boss creates and migrates its schema itself, under a lock). */
export function useBoss(): Promise<PgBoss> {
  boss ??= (async () => {
    const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
    if (!url) throw new Error('NUXT_DATABASE_URL is not set')
    const b = new PgBoss({ connectionString: url, max: 4, application_name: 'stratavolt-queue' })
    b.on('error', err => console.error('[queue]', err))
    await b.start()
    for (const q of QUEUES) await b.createQueue(q, { name: q, ...RETRY })
    return b
  })().catch((err) => {
    boss = null
    throw err
  })
  return boss
}

export async function stopBoss() {
  if (!boss) return
  const b = await boss.catch(() => null)
  boss = null
  await b?.stop({ graceful: true, timeout: 10_000 })
}

/** Workers this instance runs, by queue (woken at once when this instance queues a job). */
export const localWorkers = new Map<QueueName, string>()

export type JobRow = typeof tables.backgroundJobs.$inferSelect

/** Queues a job: our row first (so it can be polled at once), then the pg-boss job that carries its id. */
export async function enqueue(kind: QueueName, input: unknown, userId: number | null): Promise<string> {
  const id = randomUUID()
  await useDb().insert(tables.backgroundJobs).values({ id, kind, input, createdBy: userId })
  const b = await useBoss()
  await b.send(kind, { jobId: id }, RETRY)
  const worker = localWorkers.get(kind)
  if (worker) b.notifyWorker(worker)
  return id
}

export async function jobProgress(id: string, progress: number, message: string) {
  await useDb().update(tables.backgroundJobs).set({ status: 'running', progress: Math.max(0, Math.min(1, progress)), message, updatedAt: new Date() })
    .where(eq(tables.backgroundJobs.id, id))
}

export async function loadJob(id: string): Promise<JobRow | undefined> {
  const [row] = await useDb().select().from(tables.backgroundJobs).where(eq(tables.backgroundJobs.id, id))
  return row
}

/** Waits for a job to end (polling our row); null when it is still running after `timeoutMs`. */
export async function waitForJob(id: string, timeoutMs: number): Promise<JobRow | null> {
  const start = Date.now()
  let delay = 50
  while (Date.now() - start < timeoutMs) {
    const row = await loadJob(id)
    if (row && (row.status === 'done' || row.status === 'failed')) return row
    await new Promise(r => setTimeout(r, delay))
    delay = Math.min(500, delay * 1.5)
  }
  return null
}

/** The answer of a finished job as its route gives it: the result, or the error it ended with. */
export function jobAnswer(row: JobRow) {
  if (row.status === 'failed') {
    const e = (row.error ?? {}) as { statusCode?: number, message?: string, data?: unknown }
    throw createError({ statusCode: e.statusCode ?? 500, message: e.message ?? 'The job failed.', data: e.data })
  }
  return row.result
}

type Handler = (job: JobRow) => Promise<unknown>

/**
 * Runs one job: a refusal (4xx, e.g. "already committed") ends it as failed at once; anything else is
 * thrown back to pg-boss, which retries it, and only the last attempt marks the job failed.
 */
async function runJob(id: string, handler: Handler, lastAttempt: boolean) {
  const db = useDb()
  const [row] = await db.update(tables.backgroundJobs).set({ status: 'running', updatedAt: new Date(), attempts: sql`${tables.backgroundJobs.attempts} + 1` })
    .where(eq(tables.backgroundJobs.id, id)).returning()
  if (!row || row.status === 'done') return
  try {
    const result = await handler(row)
    await db.update(tables.backgroundJobs).set({ status: 'done', progress: 1, message: 'Done', result, error: null, updatedAt: new Date() }).where(eq(tables.backgroundJobs.id, id))
  }
  catch (err) {
    const e = err as { statusCode?: number, message?: string, data?: unknown }
    const refused = typeof e.statusCode === 'number' && e.statusCode < 500
    if (refused || lastAttempt) {
      const error = refused ? { statusCode: e.statusCode, message: e.message, data: e.data } : { statusCode: 500, message: 'The job failed after several attempts; try again later.' }
      await db.update(tables.backgroundJobs).set({ status: 'failed', message: error.message ?? '', error, updatedAt: new Date() }).where(eq(tables.backgroundJobs.id, id))
      if (!refused) console.error(`[queue] job ${id} failed`, err)
      return
    }
    await db.update(tables.backgroundJobs).set({ status: 'queued', message: 'Retrying after an error', updatedAt: new Date() }).where(eq(tables.backgroundJobs.id, id))
    throw err
  }
}

/** Starts this instance's workers for every queue (one job at a time each). */
export async function startWorkers(handlers: Record<QueueName, Handler>) {
  const b = await useBoss()
  for (const q of QUEUES) {
    const workerId = await b.work<{ jobId: string }>(q, { batchSize: 1, pollingIntervalSeconds: 1, includeMetadata: true }, async ([job]) => {
      if (!job) return
      await runJob(job.data.jobId, handlers[q], job.retryCount >= job.retryLimit)
    })
    localWorkers.set(q, workerId)
  }
}
