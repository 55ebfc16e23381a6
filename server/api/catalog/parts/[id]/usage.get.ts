import { idParam } from '#shared/schemas/auth'
import { bomsUsingPart } from '~~/server/services/bom'

// Released and draft BOMs that use the part: shown before its approval or lifecycle is changed.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const { id } = paramsValid(event, idParam)
  return bomsUsingPart(id)
})
