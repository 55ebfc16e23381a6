// The job queue's workers run in every app instance unless STRATAVOLT_QUEUE_WORKERS=0 (web-only instances);
// they start once migrations are applied and stop, finishing the job in hand, on shutdown.
import { catalogCommitJob } from '../queue/catalog-commit'
import { startWorkers, stopBoss } from '../queue/jobs'
import { bomPdfJob, tradeStudyJob } from '../queue/work'

export default defineNitroPlugin((nitro) => {
  if (process.env.STRATAVOLT_QUEUE_WORKERS === '0') return
  nitro.hooks.hook('stratavolt:database-ready' as 'close', async () => {
    try {
      await startWorkers({ 'catalog-commit': catalogCommitJob, 'trade-study': tradeStudyJob, 'bom-pdf': bomPdfJob })
    }
    catch (err) {
      console.error('[queue] the workers did not start:', err)
    }
  })
  nitro.hooks.hook('close', () => stopBoss())
})
