import { outboxOverview } from '~~/server/services/outbox'

// Outgoing mail waiting in the outbox: pending (with the next attempt), failed (with the last error), latest sent.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'mail:read')
  return outboxOverview()
})
