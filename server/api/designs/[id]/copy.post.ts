import { loadDesign, createDesign } from '~~/server/services/designs'
import { idParam } from '#shared/schemas/auth'
import type { DesignInput } from '#shared/engine/types'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:write')
  const { id } = paramsValid(event, idParam)
  const source = await loadDesign(id)
  const copy = await useDb().transaction(tx => createDesign(tx, {
    name: `${source.name} (copy)`.slice(0, 120), description: source.description, input: source.input as DesignInput, ownerId: user.id,
  }))
  await audit(event, 'design copied', { subject: `${copy.id} ${copy.name}`, details: { from: id } })
  setResponseStatus(event, 201)
  return copy
})
