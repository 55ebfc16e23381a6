// Part matching for a design: every position's duty from the engine, the catalogue parts that meet
// it, and the parts the engineer assigned (each pinned to the part version it was matched with and to
// the design revision its counts were rated against).
import { createHash } from 'node:crypto'
import { eq, inArray } from 'drizzle-orm'
import { balanceWithLosses, evaluateDesign, gridInput, legLayout } from '#shared/engine'
import type { CapacitorEnvelope, DesignInput, DesignResult } from '#shared/engine/types'
import { approvalRank, matchPosition, positionDutyFromCapacitor, positionDutyFromDevice, rateAssignment, whyNothingFits, type Candidate, type MatchPolicy, type PartIndex, type PositionDuty } from '#shared/catalog/matching'
import { moduleCoverage, type LegPosition } from '#shared/bom/coverage'
import type { CatalogPart } from '#shared/catalog/types'
import type { BomSettings } from '#shared/schemas/design'
import { efficiencyAt, headlinePoint, pointDutiesOf, totalsPerPoint } from '#shared/thermal/losses'
import { caseMatesByCoverage, designThermal, type ChoiceThermal, type DesignThermal, type ThermalPosition } from '#shared/thermal/design'
import type { ReportEvaluation } from '../exports/design-pdf'
import { formatNumber } from '#shared/utils/format'
import { catalogGeneration, catalogueAt, partVersionsById } from './catalog'
import { loadDesign } from './designs'
import { runInPool } from '../workers/pool'

/** 'dc-link' = the DC link a back-to-back pair shares (one bank for both converters). */
export type Side = 'machine' | 'grid' | 'dc-link'

export interface DesignPosition {
  side: Side
  duty: PositionDuty
  /** the capacitor or device description shown beside it */
  label: string
}

/**
 * Where a capacitor bank sits, from the engine's explicit `side` (never from its name or label): a back-to-back
 * pair's shared DC link is side 'dc-link', one bank bought once; every other capacitor stays with its converter.
 */
export function capacitorSide(converterSide: 'machine' | 'grid', cap: Pick<CapacitorEnvelope, 'side'>): Side {
  return cap.side === 'shared' ? 'dc-link' : converterSide
}

/** All positions of a design (devices and capacitors of each converter, a shared DC link once) as matching duties. */
export function designPositions(input: DesignInput, result: DesignResult = withEngine(() => evaluateDesign(input))): DesignPosition[] {
  const out: DesignPosition[] = []
  for (const converter of result.converters) {
    const side = converter.side as 'machine' | 'grid'
    const c = side === 'grid' ? gridInput(input.machineSide, input.gridSide!) : input.machineSide
    const ctx = { switchingHz: c.switchingHz, topology: c.topology, levels: c.levels }
    // Ratings from the envelope; losses from each operating point's own currents and commutations.
    for (const d of converter.envelope.devices) out.push({ side, duty: { ...positionDutyFromDevice(d, ctx), points: pointDutiesOf(converter, d.name) }, label: `${d.kind} ${d.name}` })
    for (const cap of converter.envelope.capacitors) {
      out.push({ side: capacitorSide(side, cap), duty: positionDutyFromCapacitor(cap, { topology: c.topology, levels: c.levels }), label: `${cap.kind} capacitor ${cap.name}` })
    }
    // The engine's one bank for both converters' link (back-to-back), listed once, after the machine side.
    if (side === 'machine' && result.sharedLink) {
      for (const cap of result.sharedLink.capacitors) {
        out.push({ side: capacitorSide(side, cap), duty: positionDutyFromCapacitor(cap, { topology: c.topology, levels: c.levels }), label: `shared DC-link capacitor ${cap.name}` })
      }
    }
  }
  return out
}

export function matchPolicy(input: DesignInput, result: DesignResult, bom: BomSettings): MatchPolicy {
  return { heatsinkTemperatureC: result.derating.heatsinkTemperatureC, junctionMarginC: result.derating.junctionMarginC, buildQuantity: bom.buildQuantity }
}

type Part = CatalogPart & { partVersionId: number, approved?: boolean }

/** Devices of one leg of a side, for module coverage. */
export function legPositions(input: DesignInput, side: Side): LegPosition[] {
  const c = side === 'grid' ? (input.gridSide && gridInput(input.machineSide, input.gridSide)) : side === 'machine' ? input.machineSide : null
  if (!c) return []
  return legLayout(c.topology, c.levels).items.filter(i => i.kind !== 'capacitor').map(i => ({ name: i.name, kind: i.kind as LegPosition['kind'], countPerPhase: i.countPerPhase, nodes: i.nodes, ...(i.antiParallelTo ? { antiParallelTo: i.antiParallelTo } : {}) }))
}

export interface AssignmentReview {
  /** design revision the stored counts were rated against */
  ratedRevision: number
  /** false when the stored series × parallel no longer meet today's duty (or the part no longer fits at all) */
  fits: boolean
  /** counts today's duty needs with this part (null when it cannot be sized) */
  needed: { seriesCount: number, parallelCount: number } | null
  /** rated against an older revision and no longer fits, not confirmed: blocks release */
  stale: boolean
  confirmed: null | { revision: number, reason: string | null }
}

export interface PositionMatch {
  side: Side
  position: string
  label: string
  duty: PositionDuty
  candidates: (Candidate & { partVersionId: number, approved: boolean, covers: string[], thermal?: ChoiceThermal | null })[]
  /** candidates left out of the default view (not approved, NRND or obsolete); `?show=all` lists them */
  hiddenCandidates: number
  /** offered parts that fit, of which `candidates` holds the best `limit` */
  fitting: number
  nothingFits: string | null
  /** the position whose module also fills this one */
  coveredBy: string | null
  assigned: null | {
    partVersionId: number
    current: boolean
    approved: boolean
    seriesCount: number
    parallelCount: number
    /** the assigned part rated at the stored counts against today's duty (null when it cannot serve it) */
    evaluation: Candidate | null
    /** T_j mean / peak / swing per operating point over the fundamental period (null without the figures) */
    thermal?: ChoiceThermal | null
    review: AssignmentReview
    coveredBy: string | null
    part: CatalogPart
  }
}

/** Approval of part versions (by the part they belong to). */
async function approvalOf(versionIds: number[]) {
  if (!versionIds.length) return new Map<number, boolean>()
  const rows = await useDb().select({ id: tables.partVersions.id, approved: tables.parts.approved }).from(tables.partVersions)
    .innerJoin(tables.parts, eq(tables.parts.id, tables.partVersions.partId)).where(inArray(tables.partVersions.id, versionIds))
  return new Map(rows.map(r => [r.id, r.approved]))
}

type Assignment = typeof tables.partAssignments.$inferSelect

/** What matching a design needs besides the catalogue index: read from PostgreSQL on the main thread, sent to a worker. */
export interface DesignMatchRequest {
  input: DesignInput
  bomSettings: BomSettings
  revision: number
  assignments: Assignment[]
  /** the assigned part versions (each as it was matched), by id */
  pinned: [number, CatalogPart][]
  /** approval of the assigned part versions' parts, by part version id */
  approval: [number, boolean][]
  /** assigned part versions that are current */
  current: number[]
  /** the current part of each covered position's host (a module listed first there) */
  hosts: Part[]
  limit: number
  options: { showAll?: boolean, summaryOnly?: boolean }
}

/**
 * Matches every position of a design; `limit` candidates per position. By default only approved,
 * active parts are listed (ranked first anyway); `showAll` lists every fitting part, ranked by
 * approvalRank after the thermal check. The engine and the matching run on a worker thread
 * (matchDesignPositions); this thread reads the design, its assignments and the catalogue generation.
 */
export async function matchDesign(designId: number, limit = 40, options: { showAll?: boolean, summaryOnly?: boolean } = {}) {
  const { design, input, task } = await designMatchTask(designId, limit, options)
  const matched = await runInPool<ReturnType<typeof matchDesignPositions>>({ kind: 'match-design', ...task })
  return { design, input, ...matched }
}

/** What a worker thread needs to match a design: read here (design, assignments, catalogue generation), sent there. */
export async function designMatchTask(designId: number, limit: number, options: { showAll?: boolean, summaryOnly?: boolean }) {
  // Independent reads at once (each a round trip the request would otherwise wait for in turn).
  const [design, generation, assignments] = await Promise.all([
    loadDesign(designId),
    catalogGeneration(),
    useDb().select().from(tables.partAssignments).where(eq(tables.partAssignments.designId, designId)),
  ])
  const input = design.input as DesignInput
  // The part index is kept between requests until the catalogue generation changes (built only for a design that exists).
  const versionIds = assignments.map(a => a.partVersionId)
  const [catalogue, pinned, approval] = await Promise.all([catalogueAt(generation), partVersionsById(versionIds), approvalOf(versionIds)])
  const hostIds = assignments.filter(a => a.coveredBy).map(a => catalogue.places.get(a.partVersionId)).filter((p): p is number => p !== undefined)
  const request: DesignMatchRequest = {
    input, bomSettings: design.bomSettings as BomSettings, revision: design.revision, assignments,
    pinned: [...pinned], approval: [...approval], current: assignments.map(a => a.partVersionId).filter(id => catalogue.places.has(id)),
    hosts: hostIds.map(place => catalogue.index.part(place) as Part), limit, options,
  }
  return { design, input, task: { generation: catalogue.generation, index: catalogue.shared, request } }
}

/**
 * A digest of everything a design's matching answer depends on: the catalogue generation (this instance holds one
 * index per generation) and the message the thread gets (design input, revision, BOM settings, assignments, the
 * assigned part versions and their approval, limit, options), plus what the route adds (`extra`). An edit of the
 * design or its assignments, or any catalogue change (which moves the generation), gives another digest.
 */
export function matchTaskKey(task: { generation: number, request: DesignMatchRequest }, ...extra: unknown[]): string {
  return createHash('sha256').update(JSON.stringify([task.generation, task.request, ...extra])).digest('base64url')
}

/** Every position of a design matched against the index (pure: runs on a worker thread). */
export function matchDesignPositions(request: DesignMatchRequest, index: PartIndex) {
  const { input, limit, options } = request
  const result = withEngine(() => evaluateDesign(input))
  const policy = matchPolicy(input, result, request.bomSettings)
  const pinned = new Map(request.pinned)
  const approval = new Map(request.approval)
  const currentIds = new Set(request.current)
  const legs = new Map<Side, LegPosition[]>((['machine', 'grid'] as const).map(s => [s, legPositions(input, s)]))
  const positions: PositionMatch[] = designPositions(input, result).map(({ side, duty, label }) => {
    const leg = legs.get(side) ?? []
    const a = request.assignments.find(x => x.side === side && x.position === duty.positionName)
    const coveredBy = a?.coveredBy ?? null
    // By default only approved, active parts; a covered position lists its host's module first, so
    // its own candidates never rank above it.
    const host = coveredBy && a ? a.partVersionId : null
    const offered = (part: CatalogPart) => options.showAll || approvalRank(part as Part) === 0
    // summaryOnly: the assigned parts alone (the design page's figures), no candidate search
    const m = options.summaryOnly
      ? { candidates: [], fitting: 0, leftOut: 0 }
      : matchPosition(duty, index, policy, { limit, approvedActiveOnly: !options.showAll, ...(host !== null ? { exceptId: host } : {}) })
    const hiddenCandidates = options.showAll ? 0 : m.leftOut
    const hostPart = host !== null ? request.hosts.find(p => p.partVersionId === host) : undefined
    const hostCandidate = hostPart && offered(hostPart) && !options.summaryOnly ? matchPosition(duty, [hostPart], policy).candidates[0] : undefined
    const pool = hostCandidate ? [hostCandidate, ...m.candidates] : m.candidates
    const candidates = pool.slice(0, limit).map(c => ({
      ...c,
      partVersionId: (c.part as Part).partVersionId,
      approved: (c.part as Part).approved !== false,
      covers: duty.kind === 'capacitor' ? [] : (moduleCoverage(c.part, duty.positionName, leg)?.covers ?? []),
    }))
    let assigned: PositionMatch['assigned'] = null
    if (a) {
      const part = pinned.get(a.partVersionId)!
      const { rated, needed, fits } = rateAssignment(part, duty, policy, a.seriesCount, a.parallelCount)
      const confirmed = a.confirmedRevision === request.revision ? { revision: a.confirmedRevision, reason: a.confirmedReason } : null
      const review: AssignmentReview = { ratedRevision: a.designRevision, fits, needed, stale: !fits && a.designRevision < request.revision && !confirmed, confirmed }
      assigned = { partVersionId: a.partVersionId, current: currentIds.has(a.partVersionId), approved: approval.get(a.partVersionId) ?? false, seriesCount: a.seriesCount, parallelCount: a.parallelCount, evaluation: rated, review, coveredBy, part }
    }
    const nothingFits = options.summaryOnly || m.fitting + m.leftOut + (hostCandidate ? 1 : 0) > 0 ? null : (whyNothingFits(duty, index, policy) ?? 'No part in the catalogue fits.')
    return { side, position: duty.positionName, label, duty, candidates, hiddenCandidates, fitting: m.fitting + (hostCandidate ? 1 : 0), nothingFits, coveredBy, assigned }
  })
  const thermal = attachThermal(input, result, positions, policy)
  const summary = lossSummary(input, positions, result)
  return { result, policy, positions, thermal, summary, linkBalance: linkBalance(result, summary) }
}

/** Candidates per position whose T_j is followed over the period (the first ones shown; the assigned part always). */
export const THERMAL_CANDIDATES = 10

/**
 * T_j over the fundamental period (mean, peak, swing per point) for the assigned part and the first candidates of
 * every position, and the mission-profile life (shared/thermal/design.ts). A peak past T_j,max − margin is a warning
 * and makes the part thermally not fine.
 */
export function attachThermal(input: DesignInput, result: DesignResult, positions: PositionMatch[], policy: MatchPolicy): Omit<DesignThermal, 'results'> {
  const mates = assignedCaseMates(input, positions)
  const list: ThermalPosition[] = positions.map((p) => {
    const own = mates.get(p.side)?.get(p.position)
    const assigned = p.assigned?.evaluation ? [{ part: p.assigned.part, seriesCount: p.assigned.seriesCount, parallelCount: p.assigned.parallelCount, ...(own ? { caseMates: own } : {}) }] : []
    // A candidate module fills the positions it covers when chosen: they would share its case.
    const shown = p.candidates.slice(0, THERMAL_CANDIDATES).map(c => ({ part: c.part, seriesCount: c.seriesCount, parallelCount: c.parallelCount, ...(c.covers.length ? { caseMates: c.covers } : {}) }))
    const choices = [...assigned, ...shown]
    return { side: p.side, duty: p.duty, choices, reference: choices.length ? 0 : -1, referenceAssigned: assigned.length > 0 }
  })
  const out = withEngine(() => designThermal(input, result.converters, list, policy.junctionMarginC, policy.heatsinkTemperatureC))
  const mark = (c: Candidate, t: ChoiceThermal | null | undefined) => {
    if (!t || t.peakOk) return
    c.thermalOk = false
    c.warnings.push(`peak T_j ${Math.round(t.peakC * 10) / 10} °C at ${t.worstPointName} passes ${t.limitC} °C (T_j,max − margin): below a few hertz the peak decides`)
  }
  positions.forEach((p, i) => {
    const row = out.results[i]!
    let k = 0
    if (p.assigned?.evaluation) {
      p.assigned.thermal = row[k++] ?? null
      mark(p.assigned.evaluation, p.assigned.thermal)
    }
    p.candidates.slice(0, THERMAL_CANDIDATES).forEach((c) => {
      c.thermal = row[k++] ?? null
      mark(c, c.thermal)
    })
  })
  const { results: _r, ...rest } = out
  return rest
}

/**
 * Per side, the case mates of each assigned part: positions assigned the same part version that one package of it
 * fills (module coverage from the recorded module host first, then in leg order), as the BOM packs them.
 */
export function assignedCaseMates(input: DesignInput, positions: readonly PositionMatch[]): Map<Side, Map<string, string[]>> {
  const out = new Map<Side, Map<string, string[]>>()
  for (const side of ['machine', 'grid'] as const) {
    const own = positions.filter(p => p.side === side && p.assigned && p.duty.kind !== 'capacitor')
    if (own.length < 2) continue
    const at = new Map(own.map(p => [p.position, { key: String(p.assigned!.partVersionId), part: p.assigned!.part }]))
    const hosts = own.map(p => p.assigned!.coveredBy).filter((h): h is string => !!h)
    out.set(side, caseMatesByCoverage(legPositions(input, side), name => at.get(name) ?? null, hosts))
  }
  return out
}

/**
 * Back-to-back, per operating-point pair: the real power through the shared link against both converters' losses
 * at their points (null losses until every position of both sides is assigned).
 */
export function linkBalance(result: DesignResult, summary: ReturnType<typeof lossSummary>) {
  if (!result.sharedLink) return null
  const side = (s: 'machine' | 'grid') => summary.find(x => x.side === s)
  const lossAt = (s: 'machine' | 'grid', point: string) => {
    const x = side(s)
    if (!x || x.assignedPositions < x.positions) return null
    return x.perPoint.find(p => p.pointName === point)?.lossW ?? null
  }
  return result.sharedLink.pairs.map((p) => {
    const lm = lossAt('machine', p.machinePoint)
    const lg = lossAt('grid', p.gridPoint)
    const withLosses = lm !== null && lg !== null ? balanceWithLosses(p, lm, lg) : null
    return { machinePoint: p.machinePoint, gridPoint: p.gridPoint, machinePowerW: p.machinePowerW, gridPowerW: p.gridPowerW, ...(withLosses ?? { lossesW: null, residualW: null, balanced: p.balanced }) }
  })
}

/**
 * Losses, efficiency and cost from the assigned parts, per converter side (a shared DC link counts on the
 * machine side). Losses and efficiency are summed per operating point (`perPoint`); the headline
 * figures belong to the point with the highest losses, named in `pointName`.
 */
export function lossSummary(input: DesignInput, positions: PositionMatch[], result?: DesignResult) {
  const sides: ('machine' | 'grid')[] = input.gridSide ? ['machine', 'grid'] : ['machine']
  return sides.map((side) => {
    const own = positions.filter(p => p.side === side || (side === 'machine' && p.side === 'dc-link'))
    // Covered positions are inside their host's package: its losses are counted there, its cost not again.
    const assigned = own.filter(p => p.assigned?.evaluation)
    const cost = assigned.filter(p => !p.assigned!.coveredBy).reduce((s, p) => s + (p.assigned!.evaluation!.costPerDesign ?? 0), 0)
    const c = side === 'grid' ? input.gridSide! : input.machineSide
    const names = result?.converters.find(x => x.side === side)?.points.map(p => p.pointName) ?? c.operatingPoints.map((op, i) => op.name ?? `Point ${i + 1}`)
    const points = c.operatingPoints.map((op, i) => ({ ...op, pointName: names[i]! }))
    // Capacitor losses (ESR) are not per point: they are added to every point with the envelope's ripple.
    const perPoint = totalsPerPoint(points, assigned.filter(p => p.assigned!.evaluation!.losses?.perPoint).map(p => ({
      positionName: p.position,
      perPoint: p.assigned!.evaluation!.losses!.perPoint!.map(l => ({ pointName: l.pointName, lossW: l.perConverter })),
    })))
    const envelopeOnlyW = assigned.filter(p => !p.assigned!.evaluation!.losses?.perPoint).reduce((s, p) => s + (p.assigned!.evaluation!.losses?.perConverter ?? 0), 0)
    for (const pt of perPoint) {
      pt.lossW += envelopeOnlyW
      pt.efficiency = assigned.length ? efficiencyAt(pt.acPowerW, pt.lossW) : null
    }
    const head = headlinePoint(perPoint)
    return {
      side,
      positions: own.length,
      assignedPositions: own.filter(p => p.assigned).length,
      /** W at `pointName` */
      semiconductorLossW: head?.lossW ?? 0,
      efficiency: head?.efficiency ?? null,
      /** operating point the headline loss and efficiency belong to */
      pointName: head?.pointName ?? null,
      perPoint: perPoint.map(pt => ({ pointName: pt.pointName, acPowerW: pt.acPowerW, lossW: pt.lossW, efficiency: pt.efficiency, positions: pt.positions })),
      costPerDesign: cost,
      maxJunctionC: Math.max(...assigned.map(p => p.assigned!.evaluation!.junctionTemperatureC ?? -Infinity)),
    }
  })
}

const round1 = (v: number) => Math.round(v * 10) / 10

/**
 * What the design report prints of the parts: assigned parts with T_j mean / peak, losses, efficiency and T_j per
 * operating point, the lifetime per position, the derating and the assumptions (item 6 of issue 12).
 */
export function reportEvaluation(match: Awaited<ReturnType<typeof matchDesign>>, locale?: string): ReportEvaluation {
  const { positions, summary, thermal, result } = match
  const d = result.derating
  const num = (v: number, digits: number) => formatNumber(v, locale, { decimals: digits })
  const pct = (v: number) => `${num(v * 100, 1)} %`
  const derating: [string, string][] = [
    ['Semiconductor voltage utilisation', pct(d.semiconductorVoltageUtilisation)],
    ['Transient margin (V + ΔV) / rating', pct(d.semiconductorTransientMargin)],
    ['Semiconductor current utilisation', pct(d.semiconductorCurrentUtilisation)],
    ['Capacitor voltage utilisation', pct(d.capacitorVoltageUtilisation)],
    ['Capacitor ripple utilisation', pct(d.capacitorRippleUtilisation)],
    ['Junction margin below T_j,max', `${d.junctionMarginC} °C`],
    ['Heatsink temperature (steady check)', `${d.heatsinkTemperatureC} °C`],
  ]
  const assigned = positions.filter(p => p.assigned)
  const parts = assigned.map(p => ({
    side: p.side,
    position: p.position,
    part: `${p.assigned!.part.manufacturer} ${p.assigned!.part.partNumber}`,
    arrangement: `${p.assigned!.seriesCount} × ${p.assigned!.parallelCount}`,
    meanC: p.assigned!.thermal ? round1(p.assigned!.thermal.meanC) : (p.assigned!.evaluation?.junctionTemperatureC ?? null),
    peakC: p.assigned!.thermal ? round1(p.assigned!.thermal.peakC) : null,
    limitC: p.assigned!.thermal?.limitC ?? p.assigned!.evaluation?.junctionLimitC ?? null,
    peakPoint: p.assigned!.thermal?.worstPointName ?? null,
  }))
  const points = summary.flatMap(s => s.perPoint.map((pt) => {
    let hottest: string | null = null
    let meanC: number | null = null
    let peakC: number | null = null
    for (const p of assigned.filter(x => (x.side === s.side || (s.side === 'machine' && x.side === 'dc-link')) && x.assigned!.thermal)) {
      const at = p.assigned!.thermal!.perPoint.find(q => q.pointName === pt.pointName)
      if (!at) continue
      meanC = Math.max(meanC ?? -Infinity, round1(at.meanC))
      if (peakC === null || at.peakC > peakC) { peakC = round1(at.peakC); hottest = p.position }
    }
    return { side: s.side, pointName: pt.pointName, lossW: pt.lossW, efficiency: pt.efficiency, meanC, peakC, hottest }
  }))
  const life = thermal.life
    ? {
        limiting: thermal.life.limiting ? `${thermal.life.limiting.position} (${thermal.life.limiting.side} side), ${num(Math.round(thermal.life.limiting.lifeHours), 0)} h of operation` : null,
        positions: thermal.life.positions.map(p => ({ side: p.side, position: p.position, part: p.partNumber, lifeHours: p.lifeHours, method: p.method, source: p.source })),
      }
    : null
  const hottest = parts.filter(p => p.peakC !== null).reduce<typeof parts[number] | null>((a, b) => (!a || b.peakC! > a.peakC! ? b : a), null)
  const headline: [string, string][] = summary.flatMap(s => [
    [`${s.side === 'grid' ? 'Grid' : 'Machine'} side: semiconductor losses`, s.pointName ? `${num(s.semiconductorLossW, 0)} W at ${s.pointName}` : '—'],
    [`${s.side === 'grid' ? 'Grid' : 'Machine'} side: efficiency`, s.efficiency === null ? '—' : `${num(s.efficiency * 100, 2)} % at ${s.pointName}`],
  ] as [string, string][])
  headline.push(['Highest peak T_j', hottest ? `${num(hottest.peakC!, 1)} °C at ${hottest.position}, ${hottest.peakPoint} (limit ${num(hottest.limitC!, 0)} °C)` : '—'])
  headline.push(['Positions with a part', `${assigned.length} of ${positions.length}`])
  if (life) headline.push(['Lifetime', life.limiting ?? 'no cycling damage'])
  const gaps = positions.filter(p => !p.assigned).map(p => `${p.position} (${p.side}): no part assigned, not in the figures`)
  if (thermal.life) gaps.push(...thermal.life.skipped.map(s => `Lifetime not estimated for ${s}`))
  return { derating, assumptions: [thermal.method, ...thermal.assumptions], parts, points, headline, life, gaps }
}
