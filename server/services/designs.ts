// Designs and their revisions: every save is a new revision; saves carry the revision they started from.
import { and, desc, eq } from 'drizzle-orm'
import { z } from 'zod'
import { PG_INT_MAX } from '#shared/schemas/bounds'
import { effectiveLevels, evaluateDesign, evaluateStress, gridInput, legLayout } from '#shared/engine'
import type { DesignInput, DesignResult, Waveform } from '#shared/engine/types'
import { decimationIndices } from '#shared/utils/decimate'
import type { DesignPreview } from '#shared/types/design'

/** Figures the design list shows, taken from the machine-side converter's first operating point. */
export function summarise(input: DesignInput) {
  const m = input.machineSide
  const p = m.operatingPoints[0]
  const powerKw = p ? (Math.sqrt(3) * p.lineVoltageRms * p.phaseCurrentRms * Math.abs(p.powerFactor)) / 1000 : null
  return {
    topology: m.topology,
    levels: effectiveLevels(m.topology, m.levels ?? 3),
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

/** ?machinePoint=…&gridPoint=…&resolution=… of the design results: which point's waveform, how finely sampled. */
export const previewQuery = z.object({
  machinePoint: z.coerce.number().int().min(0).max(99).default(0),
  gridPoint: z.coerce.number().int().min(0).max(99).default(0),
  resolution: z.enum(['decimated', 'full'], { error: 'resolution must be decimated or full' }).default('decimated'),
})
export type PreviewView = z.infer<typeof previewQuery> & { compact: boolean }

/** samples per waveform series the decimated answer keeps at most (extremes per bucket kept) */
export const PREVIEW_WAVEFORM_POINTS = 1200

/** x rounded to `digits` significant digits (integers stay as they are). */
const significant = (x: number, digits: number) => (Number.isInteger(x) || !Number.isFinite(x) ? x : Number(x.toPrecision(digits)))

/**
 * The waveform the charts draw: every `decimationIndices` sample, times to 5 and values to 4 significant
 * digits (finer than a chart's pixel).
 */
function decimatedWaveform(w: Waveform): Waveform {
  const picked = decimationIndices(w.time.length, [w.lineVoltage, w.poleVoltage, w.phaseCurrent], PREVIEW_WAVEFORM_POINTS)
  const take = (v: number[], digits: number) => picked.map(i => significant(v[i]!, digits))
  return { time: take(w.time, 5), lineVoltage: take(w.lineVoltage, 4), poleVoltage: take(w.poleVoltage, 4), phaseCurrent: take(w.phaseCurrent, 4) }
}

/**
 * What the results panels read of an evaluation: each point's figures keep 6 significant digits and lose
 * their per-position provenance (the envelope's provenance, which the tables show, names the per-point method).
 */
function compactResult(result: DesignResult): DesignResult {
  const slim = structuredClone(result)
  for (const c of slim.converters) {
    for (const p of c.points) {
      for (const d of [...p.devices, ...p.capacitors] as { provenance?: unknown }[]) delete d.provenance
    }
  }
  return JSON.parse(JSON.stringify(slim, (_, v) => (typeof v === 'number' ? significant(v, 6) : v)))
}

/**
 * Evaluation, leg drawings and one operating point's waveform and spectrum per side, for the design page
 * (the chosen points, else the first). `compact` answers what the visible panels need: a decimated waveform
 * (`resolution: 'full'` keeps every sample) and the slim per-point figures; without it (the PDF) all of it.
 */
export function previewDesign(input: DesignInput, view: Partial<PreviewView> = {}): DesignPreview {
  const result = withEngine(() => evaluateDesign(input))
  // The grid side as the engine reads it: DC link and levels taken from the machine side where absent.
  const sides = [['machine', input.machineSide, view.machinePoint ?? 0], ['grid', input.gridSide && gridInput(input.machineSide, input.gridSide), view.gridPoint ?? 0]] as const
  const layouts: DesignPreview['layouts'] = {}
  const extras: DesignPreview['extras'] = {}
  for (const [side, converter, index] of sides) {
    if (!converter) continue
    layouts[side] = legLayout(converter.topology, converter.levels)
    const point = converter.operatingPoints[index]
    if (!point) {
      const field = side === 'machine' ? 'machinePoint' : 'gridPoint'
      throw createError({ statusCode: 422, message: `Operating point shown: the ${side === 'machine' ? 'converter' : 'grid side'} has ${converter.operatingPoints.length} operating point${converter.operatingPoints.length === 1 ? '' : 's'}; choose one of them.`, data: { issues: [{ path: field, message: 'Choose one of the operating points.' }] } })
    }
    const { operatingPoints: _, ...rest } = converter
    const r = withEngine(() => evaluateStress({ ...rest, ...point }, { includeWaveform: true, includeSpectrum: true }))
    const full = !view.compact || view.resolution === 'full'
    const waveform = r.waveform && (full ? r.waveform : decimatedWaveform(r.waveform))
    const spectrum = r.spectrum && (view.compact ? r.spectrum.map(l => ({ order: l.order, frequency: significant(l.frequency, 6), amplitude: significant(l.amplitude, 4) })) : r.spectrum)
    extras[side] = {
      pointName: point.name ?? `Point ${index + 1}`, pointIndex: index, samples: r.waveform?.time.length ?? 0, resolution: full ? 'full' : 'decimated',
      waveform, spectrum, thd: r.lineVoltageThd, thdToOrder: r.lineVoltageThdToOrder, thdMaxOrder: r.thdMaxOrder,
    }
  }
  return { result: view.compact ? compactResult(result) : result, layouts, extras }
}
