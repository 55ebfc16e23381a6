import { idParam } from '#shared/schemas/auth'
import { loadBom, purchaseOf } from '~~/server/services/bom'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  const bom = await loadBom(id)
  return { ...bom, purchase: await purchaseOf(id) }
})
