import { idParam } from '#shared/schemas/auth'
import { bomForRole, loadBom, previousRelease, purchaseOf } from '~~/server/services/bom'

// A released BOM with purchasing's entries (for the roles that see them), and its changes against the previous release.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:read')
  const { id } = paramsValid(event, idParam)
  const bom = await loadBom(id)
  const previous = await previousRelease(bom.designId, bom.revision)
  return { ...bomForRole(bom, await purchaseOf(id), user.role), previous: previous ? { id: previous.id, revision: previous.revision } : null }
})
