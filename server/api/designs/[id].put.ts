import { saveRevision } from '~~/server/services/designs'
import { evaluateDesign } from '#shared/engine'
import { idParam } from '#shared/schemas/auth'
import { designSaveSchema } from '#shared/schemas/design'

// Saves a new revision; 409 when someone else saved since the revision the editor started from.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'designs:write')
  const { id } = paramsValid(event, idParam)
  const { revision, ...fields } = await readValid(event, designSaveSchema)
  withEngine(() => evaluateDesign(fields.input), 'input')
  const design = await saveRevision(id, revision, fields, user.id)
  await audit(event, 'design saved', { subject: `${id} ${design.name}`, details: { revision: design.revision } })
  return design
})
