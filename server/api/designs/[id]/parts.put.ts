import { and, eq, inArray } from 'drizzle-orm'
import { loadDesign } from '~~/server/services/designs'
import { designPositions, legPositions } from '~~/server/services/parts'
import { moduleCoverage } from '#shared/bom/coverage'
import { idParam } from '#shared/schemas/auth'
import { assignmentWithCoverSchema } from '#shared/schemas/parts'
import type { CatalogPart } from '#shared/catalog/types'
import type { DesignInput } from '#shared/engine/types'

// Assigns a part version to one position with its series × parallel counts, rated against the current
// design revision; the same part may be assigned again with new counts. A module also fills the
// positions it covers when `fillCovered` is set (the answer names them either way, to offer it).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'parts:assign')
  const { id } = paramsValid(event, idParam)
  const { fillCovered, ...body } = await readValid(event, assignmentWithCoverSchema)
  const design = await loadDesign(id)
  const positions = designPositions(design.input as DesignInput)
  const target = positions.find(p => p.side === body.side && p.duty.positionName === body.position)
  if (!target) throw createError({ statusCode: 422, message: `position: ${body.side} side has no position ${body.position}.`, data: { issues: [{ path: 'position', message: 'No such position in this design' }] } })
  const [version] = await useDb().select({ id: tables.partVersions.id, partNumber: tables.partVersions.partNumber, data: tables.partVersions.data }).from(tables.partVersions).where(eq(tables.partVersions.id, body.partVersionId))
  if (!version) throw createError({ statusCode: 422, message: 'partVersionId: no such part version.', data: { issues: [{ path: 'partVersionId', message: 'No such part version' }] } })
  const part = version.data as CatalogPart
  const covers = target.duty.kind === 'capacitor' ? [] : (moduleCoverage(part, body.position, legPositions(design.input as DesignInput, body.side))?.covers ?? [])
  const t = tables.partAssignments
  const row = (position: string, coveredBy: string | null) => ({ designId: id, side: body.side, position, partVersionId: body.partVersionId, seriesCount: body.seriesCount, parallelCount: body.parallelCount, designRevision: design.revision, confirmedRevision: null, confirmedReason: null, coveredBy, assignedBy: user.id, assignedAt: new Date() })
  await useDb().transaction(async (tx) => {
    // Positions this one hosted before are released from the old module (they need their own part again).
    await tx.delete(t).where(and(eq(t.designId, id), eq(t.side, body.side), eq(t.coveredBy, body.position)))
    const own = row(body.position, null)
    await tx.insert(t).values(own).onConflictDoUpdate({ target: [t.designId, t.side, t.position], set: own })
    if (fillCovered && covers.length) {
      await tx.delete(t).where(and(eq(t.designId, id), eq(t.side, body.side), inArray(t.position, covers)))
      await tx.insert(t).values(covers.map(p => row(p, body.position)))
    }
  })
  await audit(event, 'part assigned', { subject: `design ${id} ${body.side} ${body.position}`, details: { partNumber: version.partNumber, partVersionId: body.partVersionId, seriesCount: body.seriesCount, parallelCount: body.parallelCount, designRevision: design.revision, ...(fillCovered && covers.length ? { covers } : {}) } })
  return { ok: true, designRevision: design.revision, covers, filled: fillCovered ? covers : [] }
})
