import { createDesign } from '~~/server/services/designs'
import { evaluateDesign } from '#shared/engine'
import { designCreateSchema } from '#shared/schemas/design'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:write')
  const body = await readValid(event, designCreateSchema)
  withEngine(() => evaluateDesign(body.input), 'input')
  const design = await useDb().transaction(tx => createDesign(tx, { ...body, ownerId: user.id }))
  await audit(event, 'design created', { subject: `${design.id} ${design.name}` })
  setResponseStatus(event, 201)
  return design
})
