import { tradeStudySchema } from '#shared/schemas/trade-study'
import { runTradeStudy } from '~~/server/services/trade-study'

// One duty through several topologies and level counts (nothing saved).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const duty = await readValid(event, tradeStudySchema)
  return runTradeStudy(duty)
})
