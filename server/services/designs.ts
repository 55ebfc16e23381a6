// Designs and their revisions: every save is a new revision; saves carry the revision they started from.
import { and, desc, eq } from 'drizzle-orm'
import { z } from 'zod'
import { PG_INT_MAX } from '#shared/schemas/bounds'
import { evaluateDesign, evaluateStress, gridInput, legLayout } from '#shared/engine'
import type { DesignInput } from '#shared/engine/types'
import type { DesignPreview } from '#shared/types/design'

/** Figures the design list shows, taken from the machine-side converter's first operating point. */
export function summarise(input: DesignInput) {
  const m = input.machineSide
  const p = m.operatingPoints[0]
  const powerKw = p ? (Math.sqrt(3) * p.lineVoltageRms * p.phaseCurrentRms * Math.abs(p.powerFactor)) / 1000 : null
  return {
    topology: m.topology,
    levels: m.topology === 'two-level' ? 2 : m.topology === 'matrix' ? 3 : (m.levels ?? 3),
    dcVoltage: m.dcVoltage ?? null,
    powerKw: powerKw === null ? null : Math.round(powerKw * 10) / 10,
    backToBack: !!input.gridSide,
  }
}

export async function loadDesign(id: number) {
  const [design] = await useDb().select().from(tables.designs).where(eq(tables.designs.id, id))
  if (!design) throw createError({ statusCode: 404, message: 'No such design.' })
  return design
}

/** One saved revision of a design with its author; 404 when the design has no such revision. */
export async function loadRevision(designId: number, revision: number) {
  const r = tables.designRevisions
  const [row] = await useDb().select({ revision: r.revision, name: r.name, input: r.input, createdAt: r.createdAt, author: tables.users.name })
    .from(r).leftJoin(tables.users, eq(tables.users.id, r.authorId))
    .where(and(eq(r.designId, designId), eq(r.revision, revision)))
  if (!row) throw createError({ statusCode: 404, message: `Design ${designId} has no revision ${revision}.` })
  return { ...row, input: row.input as DesignInput }
}

/** ?revision=N of the design routes. */
export const revisionQuery = z.object({ revision: z.coerce.number().int().positive().max(PG_INT_MAX).optional() })

export async function createDesign(tx: Tx, fields: { name: string, description: string, input: DesignInput, ownerId: number }) {
  const [design] = await tx.insert(tables.designs).values({ ...fields, ...summarise(fields.input), revision: 1 }).returning()
  await tx.insert(tables.designRevisions).values({ designId: design!.id, revision: 1, name: fields.name, input: fields.input, authorId: fields.ownerId })
  return design!
}

/** Saves a new revision unless someone else saved since `fromRevision` (409 then, nothing written). */
export async function saveRevision(id: number, fromRevision: number, fields: { name: string, description: string, input: DesignInput }, authorId: number) {
  return useDb().transaction(async (tx) => {
    const [updated] = await tx.update(tables.designs)
      .set({ ...fields, ...summarise(fields.input), revision: fromRevision + 1, updatedAt: new Date() })
      .where(and(eq(tables.designs.id, id), eq(tables.designs.revision, fromRevision)))
      .returning()
    if (!updated) {
      const [current] = await tx.select({ revision: tables.designs.revision }).from(tables.designs).where(eq(tables.designs.id, id))
      if (!current) throw createError({ statusCode: 404, message: 'No such design.' })
      const [last] = await tx.select({ at: tables.designRevisions.createdAt, author: tables.users.name })
        .from(tables.designRevisions).leftJoin(tables.users, eq(tables.users.id, tables.designRevisions.authorId))
        .where(eq(tables.designRevisions.designId, id)).orderBy(desc(tables.designRevisions.revision)).limit(1)
      throw createError({
        statusCode: 409,
        message: `Someone else saved this design meanwhile (revision ${current.revision}${last?.author ? ` by ${last.author}` : ''}). Your changes are still in the form: reload the latest revision in another tab, compare, and save again.`,
        data: { currentRevision: current.revision },
      })
    }
    await tx.insert(tables.designRevisions).values({ designId: id, revision: updated.revision, name: fields.name, input: fields.input, authorId })
    return updated
  })
}

/** Evaluation, leg drawings and the first operating point's waveform of each side, for the design page. */
export function previewDesign(input: DesignInput): DesignPreview {
  const result = withEngine(() => evaluateDesign(input))
  // The grid side as the engine reads it: DC link and levels taken from the machine side where absent.
  const sides = [['machine', input.machineSide], ['grid', input.gridSide && gridInput(input.machineSide, input.gridSide)]] as const
  const layouts: DesignPreview['layouts'] = {}
  const extras: DesignPreview['extras'] = {}
  for (const [side, converter] of sides) {
    if (!converter) continue
    layouts[side] = legLayout(converter.topology, converter.levels)
    const point = converter.operatingPoints[0]!
    const { operatingPoints: _, ...rest } = converter
    const r = withEngine(() => evaluateStress({ ...rest, ...point }, { includeWaveform: true, includeSpectrum: true }))
    extras[side] = { pointName: point.name ?? 'Point 1', waveform: r.waveform, spectrum: r.spectrum, thd: r.lineVoltageThd, thdToOrder: r.lineVoltageThdToOrder, thdMaxOrder: r.thdMaxOrder }
  }
  return { result, layouts, extras }
}
