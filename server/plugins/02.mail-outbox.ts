// The outbox worker: every instance runs this loop; FOR UPDATE SKIP LOCKED lets any of them send a row
// and none send it twice. STRATAVOLT_OUTBOX_INTERVAL_MS sets the poll interval (default 2000 ms);
// STRATAVOLT_OUTBOX=off stops the loop on an instance (e.g. one that only serves pages).
import { drainOutbox } from '../services/outbox'

export default defineNitroPlugin((nitro) => {
  if (process.env.STRATAVOLT_OUTBOX === 'off') return
  const interval = Math.max(100, Number(process.env.STRATAVOLT_OUTBOX_INTERVAL_MS ?? 2000))
  let stopped = false
  let timer: ReturnType<typeof setTimeout> | undefined
  let warned = false
  const tick = async () => {
    try {
      // Drain while full batches keep coming, then wait.
      for (let round = 0; round < 20; round++) {
        const { sent, failed } = await drainOutbox()
        if (sent + failed < 5) break
      }
      warned = false
    }
    catch (err) {
      // Before migrations finish the table may not exist yet; say so once, keep polling.
      if (!warned) console.error('[outbox] could not send:', err instanceof Error ? err.message : err)
      warned = true
    }
    finally {
      if (!stopped) timer = setTimeout(tick, interval)
    }
  }
  timer = setTimeout(tick, interval)
  nitro.hooks.hook('close', () => {
    stopped = true
    if (timer) clearTimeout(timer)
  })
})
