// Part matching for a design: every position's duty from the engine, the catalogue parts that meet
// it, and the parts the engineer assigned (each pinned to the part version it was matched with).
import { eq } from 'drizzle-orm'
import { evaluateDesign } from '#shared/engine'
import type { DesignInput, DesignResult } from '#shared/engine/types'
import { matchPosition, positionDutyFromCapacitor, positionDutyFromDevice, whyNothingFits, type Candidate, type MatchPolicy, type PositionDuty } from '#shared/catalog/matching'
import type { CatalogPart } from '#shared/catalog/types'
import type { BomSettings } from '#shared/schemas/design'
import { currentCatalogue, partVersionsById } from './catalog'
import { loadDesign } from './designs'

export type Side = 'machine' | 'grid'

export interface DesignPosition {
  side: Side
  duty: PositionDuty
  /** the capacitor or device description shown beside it */
  label: string
}

/** All positions of a design (devices and capacitors of each converter) as matching duties. */
export function designPositions(input: DesignInput, result: DesignResult = withEngine(() => evaluateDesign(input))): DesignPosition[] {
  const out: DesignPosition[] = []
  for (const converter of result.converters) {
    const side = converter.side as Side
    const c = side === 'grid' ? input.gridSide! : input.machineSide
    const ctx = { switchingHz: c.switchingHz, topology: c.topology, levels: c.levels }
    for (const d of converter.envelope.devices) out.push({ side, duty: positionDutyFromDevice(d, ctx), label: `${d.kind} ${d.name}` })
    for (const cap of converter.envelope.capacitors) out.push({ side, duty: positionDutyFromCapacitor(cap, { topology: c.topology, levels: c.levels }), label: `${cap.kind} capacitor ${cap.name}` })
  }
  return out
}

export function matchPolicy(input: DesignInput, result: DesignResult, bom: BomSettings): MatchPolicy {
  return { heatsinkTemperatureC: result.derating.heatsinkTemperatureC, junctionMarginC: result.derating.junctionMarginC, buildQuantity: bom.buildQuantity }
}

type Part = CatalogPart & { partVersionId: number }

export interface PositionMatch {
  side: Side
  position: string
  label: string
  duty: PositionDuty
  candidates: (Candidate & { partVersionId: number, approved: boolean })[]
  nothingFits: string | null
  assigned: null | {
    partVersionId: number
    current: boolean
    seriesCount: number
    parallelCount: number
    /** the assigned part evaluated against today's duty (null when it no longer fits) */
    evaluation: Candidate | null
    part: CatalogPart
  }
}

/** Matches every position of a design; `limit` candidates per position, best first. */
export async function matchDesign(designId: number, limit = 40) {
  const design = await loadDesign(designId)
  const input = design.input as DesignInput
  const result = withEngine(() => evaluateDesign(input))
  const policy = matchPolicy(input, result, design.bomSettings as BomSettings)
  // The part index is kept between requests until the catalogue version number changes.
  const { parts, index } = await currentCatalogue()
  const assignments = await useDb().select().from(tables.partAssignments).where(eq(tables.partAssignments.designId, designId))
  const pinned = await partVersionsById(assignments.map(a => a.partVersionId))
  const currentIds = new Set(parts.map(p => p.partVersionId))
  const positions: PositionMatch[] = designPositions(input, result).map(({ side, duty, label }) => {
    const m = matchPosition(duty, index, policy)
    const candidates = m.candidates.slice(0, limit).map(c => ({ ...c, partVersionId: (c.part as Part).partVersionId, approved: (c.part as Part & { approved: boolean }).approved }))
    const a = assignments.find(x => x.side === side && x.position === duty.positionName)
    let assigned: PositionMatch['assigned'] = null
    if (a) {
      const part = pinned.get(a.partVersionId)!
      const own = matchPosition(duty, [part], policy).candidates[0] ?? null
      assigned = { partVersionId: a.partVersionId, current: currentIds.has(a.partVersionId), seriesCount: a.seriesCount, parallelCount: a.parallelCount, evaluation: own, part }
    }
    return { side, position: duty.positionName, label, duty, candidates, nothingFits: candidates.length ? null : (whyNothingFits(duty, index, policy) ?? 'No part in the catalogue fits.'), assigned }
  })
  return { design, input, result, policy, positions, summary: lossSummary(input, positions) }
}

/** Losses, efficiency and cost from the assigned parts, per converter side. */
export function lossSummary(input: DesignInput, positions: PositionMatch[]) {
  const sides: Side[] = input.gridSide ? ['machine', 'grid'] : ['machine']
  return sides.map((side) => {
    const own = positions.filter(p => p.side === side)
    const assigned = own.filter(p => p.assigned?.evaluation)
    const lossW = assigned.reduce((s, p) => s + (p.assigned!.evaluation!.losses?.perConverter ?? 0), 0)
    const cost = assigned.reduce((s, p) => s + (p.assigned!.evaluation!.costPerDesign ?? 0), 0)
    const c = side === 'grid' ? input.gridSide! : input.machineSide
    const p0 = c.operatingPoints[0]!
    const outputW = Math.sqrt(3) * p0.lineVoltageRms * p0.phaseCurrentRms * Math.abs(p0.powerFactor)
    return {
      side,
      positions: own.length,
      assignedPositions: own.filter(p => p.assigned).length,
      semiconductorLossW: lossW,
      efficiency: outputW > 0 && assigned.length ? outputW / (outputW + lossW) : null,
      costPerDesign: cost,
      maxJunctionC: Math.max(...assigned.map(p => p.assigned!.evaluation!.junctionTemperatureC ?? -Infinity)),
    }
  })
}
