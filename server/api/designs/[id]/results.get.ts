import { previewDesign, loadDesign } from '~~/server/services/designs'
import { and, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParam } from '#shared/schemas/auth'
import type { DesignInput } from '#shared/engine/types'

// Results of the saved design (or of ?revision=N).
export default defineEventHandler(async (event) => {
  await requireRole(event, 'designs:read')
  const { id } = paramsValid(event, idParam)
  const { revision } = queryValid(event, z.object({ revision: z.coerce.number().int().positive().optional() }))
  const design = await loadDesign(id)
  let input = design.input as DesignInput
  if (revision && revision !== design.revision) {
    const [old] = await useDb().select().from(tables.designRevisions).where(and(eq(tables.designRevisions.designId, id), eq(tables.designRevisions.revision, revision)))
    if (!old) throw createError({ statusCode: 404, message: `Design ${id} has no revision ${revision}.` })
    input = old.input as DesignInput
  }
  return previewDesign(input)
})
