// Part matching for one device position: which catalogue parts meet the derated ratings, how many
// in series / parallel / packages, their losses, junction temperature, price at the build quantity.
//
// Losses (ENGINEERING.md, "Losses and junction temperature"):
//   conduction  P_cond = V0·I_avg + r·I_rms²                       per device
//   switching   E(i, v) = E_ref·(|i|/I_ref)·(v/V_ref) per event, summed over one period:
//               P_sw = f_sw·E_ref·(v/V_ref)·(I_sw/I_ref),  I_sw = (1/2π)∫|i(θ)|·s(θ)dθ
//               where s(θ) = 1 while the device switches. With linear scaling the sum over events is
//               the switching-averaged current; for a two-level leg with sine PWM I_sw = Î/π, which is
//               the closed form of F. Bierhoff, F. W. Fuchs, IEEE PESC 2004:
//               P_sw,T = f_sw·(E_on + E_off)·(Î/π)/I_ref·V_dc/V_ref,  P_rr,D = f_sw·E_rr·(Î/π)/I_ref·V_dc/V_ref.
//               When a duty gives no switchedCurrentAvg, Î/π is used: exact for two-level and an upper
//               bound for multilevel positions (they switch during part of their conducting half-cycle).
//               With per-point duties (PositionDuty.points) the losses are evaluated at every operating point
//               from that point's currents and commutations (shared/thermal/losses.ts) and the candidate
//               carries the point with the highest total, by name; the envelope is never used for losses then.
//   junction    T_j = T_heatsink + P·(R_th,jc + R_th,ch)            per device (no coupling between chips)

import { COLUMN_BY_KEY, PACKAGE_CONFIGURATION_IDS, PACKAGE_CONFIGURATIONS, type ColumnKey, type PartKind } from '../../catalog/columns'
import type { CapacitorEnvelope, CapacitorRole, DeviceEnvelope, TopologyId } from '../engine/types'
import { FALLBACK_METHOD, lossesOverPoints, type PointDuty } from '../thermal/losses'
import { hasTwoTemperatures, junctionOverPoints } from '../thermal/temperature'
import { approvalRank, indexParts, OBSOLETE, placeOf, slotsPerPackage, type PartIndex, type PositionKind } from './part-index'
import { priceAtQuantity } from './prices'
import type { CatalogPart, Lifecycle } from './types'
import { SizedCache } from '../utils/sized-cache'

export { priceAtQuantity } from './prices'
export { approvalRank, indexParts, openSharedIndex, sharePartIndex, slotsPerPackage, type PartIndex, type PositionKind, type SharedPartIndex } from './part-index'

/** One device or capacitor position of a converter at its worst operating point, and how often it occurs. */
export interface PositionDuty {
  positionName: string
  kind: PositionKind
  /** V, part voltage class needed after derating, for the whole position (series parts share it). */
  requiredVoltageRating: number
  /** A, semiconductors: part current rating needed after derating. */
  requiredCurrentRating?: number
  /** A RMS, capacitors: ripple-current rating needed after derating. */
  requiredRippleRating?: number
  /** F, capacitors: capacitance the position needs. */
  capacitanceRequired?: number
  /** capacitors: what the capacitor is (the engine's explicit role: dc-link, split, flying, cell, filter) */
  capacitorRole?: CapacitorRole
  /** A, average current of the position (semiconductors). */
  currentAvg: number
  /** A, RMS current (capacitors: ripple current). */
  currentRms: number
  /** A, peak current. */
  currentPeak: number
  /** A, (1/2π)∫|i|·s(θ)dθ over the instants the device switches; default currentPeak/π (two-level, Bierhoff & Fuchs). */
  switchedCurrentAvg?: number
  /** V, steady-state blocking voltage. */
  blockingVoltage: number
  /** V, voltage commutated per switching event (V_dc two-level, V_dc/(N−1) multilevel). */
  commutatedVoltage: number
  /** Hz */
  switchingHz: number
  /** Identical positions per phase leg (capacitors: capacitor positions per converter, with phases = 1). */
  positionsPerPhase: number
  phases: number
  /** Converters in the design that carry this position (2 for back-to-back with the same duty). */
  converters: number
  /** Topology, to offer leg modules only where they fit; absent = any. */
  topology?: TopologyId
  levels?: number
  /** Semiconductors: the position's duty at each operating point; losses are then computed per point. */
  points?: PointDuty[]
}

export interface MatchPolicy {
  /** °C assumed at the heatsink */
  heatsinkTemperatureC: number
  /** °C kept below T_j,max */
  junctionMarginC: number
  /** Converter sets built (a design is priced at packages per design × this). */
  buildQuantity: number
  /** Parts allowed in series per position kind (default: switch 1, diode 1, clamp-diode 8, capacitor 4). */
  maxSeries?: Partial<Record<PositionKind, number>>
  /** Parts allowed in parallel per position kind (default: 4 for semiconductors, 50 capacitors). */
  maxParallel?: Partial<Record<PositionKind, number>>
  /** Usable share of each paralleled semiconductor's current rating (default 0.9, common practice for current imbalance). */
  parallelCurrentSharing?: number
  /** Usable share of each series part's voltage rating (default 1: balanced by snubbers / sharing resistors). */
  seriesVoltageSharing?: number
  /** Offer obsolete parts (default false). */
  includeObsolete?: boolean
}

const DEFAULT_MAX_SERIES: Record<PositionKind, number> = { 'switch': 1, 'diode': 1, 'clamp-diode': 8, 'capacitor': 4 }
const DEFAULT_MAX_PARALLEL: Record<PositionKind, number> = { 'switch': 4, 'diode': 4, 'clamp-diode': 4, 'capacitor': 50 }

export interface CandidateLosses {
  /** W per device */
  conduction: number
  /** W per device (turn-on + turn-off, or reverse recovery) */
  switching: number
  /** W per device */
  total: number
  /** W for all devices of this position in one converter (phases × positions × series × parallel) */
  perConverter: number
  /** operating point these figures belong to (the one with the highest losses), when computed per point */
  pointName?: string
  /** the same figures at every operating point, in the design's order */
  perPoint?: { pointName: string, conduction: number, switching: number, total: number, perConverter: number, junctionTemperatureC?: number, junctionStatus?: 'settled' | 'above-limit' | 'runaway' }[]
}

export interface Candidate {
  part: CatalogPart
  seriesCount: number
  parallelCount: number
  /** %, (series × rating / required − 1) · 100 */
  voltageMarginPct: number
  /** %, semiconductors: current; capacitors: ripple current */
  currentMarginPct: number
  /** %, capacitors only: (capacitance of the bank / needed − 1) · 100 */
  capacitanceMarginPct?: number
  /** null when the part lacks loss data */
  losses: CandidateLosses | null
  /** Catalogue figures the part lacks for this position (why losses or T_j are not computed), by column header. */
  missingData?: string[]
  /** °C, semiconductors with thermal data */
  junctionTemperatureC?: number
  /** °C, T_j,max − margin */
  junctionLimitC?: number
  /** operating point of junctionTemperatureC (the hottest), when evaluated per point */
  junctionPointName?: string
  thermalOk: boolean
  /** Device slots of this position kind in one package. */
  slotsPerPackage: number
  packagesPerConverter: number
  packagesPerDesign: number
  /** Pieces bought for the build quantity (raised to the first price break / MOQ when needed). */
  orderQuantity: number
  /** per piece at orderQuantity; null without prices */
  unitPrice: number | null
  priceBreakQuantity: number | null
  currency?: string
  /** unitPrice × packagesPerDesign */
  costPerDesign: number | null
  stock?: number
  stockOk: boolean | null
  leadTimeDays?: number
  lifecycle: Lifecycle
  /** The package also holds other kinds of positions (e.g. the switch's own anti-parallel diode). */
  sharedPackage: boolean
  warnings: string[]
}

export interface MatchResult {
  /** Best first; at most MatchOptions.limit of them. */
  candidates: Candidate[]
  /** Parts that fit and are offered (candidates is the first `limit` of them). */
  fitting: number
  /** Parts that fit but MatchOptions.only left out. */
  leftOut: number
  /** Problems with the duty itself (then there are no candidates). */
  dutyProblems: string[]
  /** Parts looked at, and why the others were left out. */
  considered: number
  rejected: { wrongKind: number, wrongTopology: number, voltage: number, current: number, capacitance: number, obsolete: number, missingData: number }
}

function kindsFor(position: PositionKind): readonly PartKind[] {
  switch (position) {
    case 'switch': return ['switch-diode', 'switch']
    case 'diode': return ['diode', 'switch-diode']
    case 'clamp-diode': return ['diode', 'switch-diode']
    case 'capacitor': return ['capacitor']
  }
}

function fitsTopology(packageConfiguration: string | undefined, duty: Pick<PositionDuty, 'topology' | 'levels'>): boolean {
  const cfg = PACKAGE_CONFIGURATIONS[packageConfiguration as keyof typeof PACKAGE_CONFIGURATIONS]
  if (!cfg?.topologies || !duty.topology) return true
  if (!cfg.topologies.includes(duty.topology)) return false
  // Three-level leg modules fit three-level legs only.
  if ((packageConfiguration === 'npc-leg') && duty.levels !== undefined && duty.levels !== 3) return false
  return true
}

/** Packages of one part per converter for a position: modules stay within a phase leg unless they span phases. */
export function packagesPerConverter(duty: Pick<PositionDuty, 'positionsPerPhase' | 'phases'>, devicesPerPosition: number, slots: number, phasesPerPackage: number): number {
  const devicesPerPhase = duty.positionsPerPhase * devicesPerPosition
  if (phasesPerPackage > 1) {
    const slotsPerPhase = slots / phasesPerPackage
    return Math.ceil(duty.phases / phasesPerPackage) * Math.ceil(devicesPerPhase / slotsPerPhase)
  }
  return duty.phases * Math.ceil(devicesPerPhase / slots)
}

function round(value: number, digits = 2): number {
  const f = 10 ** digits
  return Math.round(value * f) / f
}

interface Sizing { series: number, parallel: number }

type Refusal = 'voltage' | 'current' | 'capacitance' | 'missingData'

/** Series and parallel counts into `into`, or why the part cannot serve (ratings NaN when the catalogue lacks them). */
function semiconductorSizing(rating: number, current: number, duty: ScanDuty, maxSeries: number, maxParallel: number, parallelSharing: number, seriesSharing: number, into: Sizing): Refusal | null {
  if (!(rating > 0) || !(current > 0)) return 'missingData'
  let series = Math.max(1, Math.ceil(duty.requiredVoltageRating / rating - 1e-9))
  if (series > 1) series = Math.ceil(duty.requiredVoltageRating / (rating * seriesSharing) - 1e-9)
  if (series > maxSeries) return 'voltage'
  const required = duty.requiredCurrent
  let parallel = Math.max(1, Math.ceil(required / current - 1e-9))
  if (parallel > 1) parallel = Math.ceil(required / (current * parallelSharing) - 1e-9)
  if (parallel > maxParallel) return 'current'
  into.series = series
  into.parallel = parallel
  return null
}

function capacitorSizing(rating: number, ripple: number, capacitance: number, duty: ScanDuty, maxSeries: number, maxParallel: number, into: Sizing): Refusal | null {
  if (!(rating > 0) || !(ripple > 0) || !(capacitance > 0)) return 'missingData'
  const series = Math.max(1, Math.ceil(duty.requiredVoltageRating / rating - 1e-9))
  if (series > maxSeries) return 'voltage'
  // A string of `series` capacitors carries the full ripple and has 1/series of one capacitance.
  const byRipple = Math.ceil(duty.requiredCurrent / ripple - 1e-9)
  const byCapacitance = duty.capacitanceRequired ? Math.ceil((duty.capacitanceRequired * series) / capacitance - 1e-9) : 1
  const parallel = Math.max(1, byRipple, byCapacitance)
  if (parallel > maxParallel) return byCapacitance >= byRipple ? 'capacitance' : 'current'
  into.series = series
  into.parallel = parallel
  return null
}

/** Column headers of the figures a semiconductor part lacks for the position's losses and / or T_j. */
export function missingFigures(part: CatalogPart, duty: PositionDuty, what: readonly ('losses' | 'thermal')[]): string[] {
  const asSwitch = duty.kind === 'switch'
  const keys: ColumnKey[] = []
  if (what.includes('losses')) {
    keys.push(...(asSwitch ? ['switchThresholdVoltage', 'switchSlopeResistance', 'turnOnEnergy', 'turnOffEnergy'] as const : ['diodeThresholdVoltage', 'diodeSlopeResistance'] as const))
    const energy = asSwitch ? (part.turnOnEnergy ?? 0) + (part.turnOffEnergy ?? 0) : (part.recoveryEnergy ?? 0)
    if (energy > 0 && duty.switchingHz > 0) keys.push('energyReferenceVoltage', 'energyReferenceCurrent')
  }
  if (what.includes('thermal')) keys.push(asSwitch ? 'rthJunctionCaseSwitch' : 'rthJunctionCaseDiode', 'junctionTemperatureMax')
  return keys.filter(k => part[k as keyof CatalogPart] === undefined).map(k => COLUMN_BY_KEY[k].header)
}

/** Losses per device of a semiconductor part at the position, or null when the part lacks the data. */
export function deviceLosses(part: CatalogPart, duty: PositionDuty, series: number, parallel: number): { conduction: number, switching: number, pointName?: string, perPoint?: { pointName: string, conduction: number, switching: number, total: number }[] } | null {
  if (duty.points?.length && duty.kind !== 'capacitor') {
    const over = lossesOverPoints(part, duty.kind, duty.points, duty.switchingHz, series, parallel)
    return over && { conduction: over.worst.conduction, switching: over.worst.switching, pointName: over.worst.pointName, perPoint: over.perPoint }
  }
  const asSwitch = duty.kind === 'switch'
  const v0 = asSwitch ? part.switchThresholdVoltage : part.diodeThresholdVoltage
  const r = asSwitch ? part.switchSlopeResistance : part.diodeSlopeResistance
  if (v0 === undefined || r === undefined) return null
  const iAvg = duty.currentAvg / parallel
  const iRms = duty.currentRms / parallel
  const conduction = v0 * iAvg + r * iRms * iRms
  const energy = asSwitch
    ? (part.turnOnEnergy !== undefined && part.turnOffEnergy !== undefined ? part.turnOnEnergy + part.turnOffEnergy : undefined)
    : (part.recoveryEnergy ?? 0)
  if (energy === undefined) return null
  let switching = 0
  if (energy > 0 && duty.switchingHz > 0 && duty.commutatedVoltage > 0) {
    const vRef = part.energyReferenceVoltage
    const iRef = part.energyReferenceCurrent
    if (!vRef || !iRef) return null
    const switchedCurrent = (duty.switchedCurrentAvg ?? duty.currentPeak / Math.PI) / parallel
    switching = duty.switchingHz * energy * (switchedCurrent / iRef) * (duty.commutatedVoltage / series / vRef)
  }
  return { conduction, switching }
}

function describePosition(kind: PositionKind): string {
  return kind === 'clamp-diode' ? 'clamp diode' : kind
}

/** Checks a duty's numbers, naming the field; empty when it can be matched. */
export function checkDuty(duty: PositionDuty): string[] {
  const problems: string[] = []
  const positive = (field: keyof PositionDuty, value: unknown, allowZero = false) => {
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
      problems.push(`${duty.positionName || 'position'}: ${String(field)} must be a number ${allowZero ? '≥' : '>'} 0, got ${String(value)}`)
    }
  }
  positive('requiredVoltageRating', duty.requiredVoltageRating)
  if (duty.kind === 'capacitor') positive('requiredRippleRating', duty.requiredRippleRating ?? duty.currentRms, true)
  else positive('requiredCurrentRating', duty.requiredCurrentRating ?? duty.currentPeak)
  positive('currentAvg', duty.currentAvg, true)
  positive('currentRms', duty.currentRms, true)
  positive('currentPeak', duty.currentPeak, true)
  positive('commutatedVoltage', duty.commutatedVoltage, true)
  positive('switchingHz', duty.switchingHz, true)
  for (const field of ['positionsPerPhase', 'phases', 'converters'] as const) {
    if (!Number.isInteger(duty[field]) || duty[field] < 1) problems.push(`${duty.positionName || 'position'}: ${field} must be a whole number ≥ 1, got ${String(duty[field])}`)
  }
  return problems
}

/**
 * Candidate parts for one position that meet the derated ratings (with series / parallel parts where
 * the policy allows). Sorted: thermally fine first, then lifecycle, then cost per design, then losses.
 */
/** What a caller wants back from matchPosition: at most `limit` candidates (best first), of the parts `only` keeps. */
export interface MatchOptions {
  /** Candidates built and returned; the rest are only counted (`fitting`). Default: all. */
  limit?: number
  /** Parts to offer; the others that fit are counted in `leftOut`. Reads every fitting part: prefer the two below. */
  only?: (part: CatalogPart) => boolean
  /** Offer only approved, active parts (approvalRank 0); the others that fit are counted in `leftOut`. */
  approvedActiveOnly?: boolean
  /** Leave out the part with this id (PartIndex built with `idOf`), counted in `leftOut`. */
  exceptId?: number
}

interface RankEntry { part: CatalogPart, slots: number, sizing: Sizing, group: number, cost: number, loss: number, order: number }

/** sortCandidates' order on rank entries; ties keep catalogue order. */
function compareRank(a: RankEntry, b: RankEntry): number {
  return a.group - b.group || (a.cost === b.cost ? 0 : a.cost < b.cost ? -1 : 1) || (a.loss === b.loss ? 0 : a.loss < b.loss ? -1 : 1) || a.order - b.order
}

/**
 * The ranking keys of sortCandidates (T_j within its limit, approval and lifecycle, cost per design,
 * losses per converter) from numbers alone, offered to `best`: ranking a large catalogue builds only
 * the candidates shown, and computes losses and T_j only for parts whose approval and cost could still
 * place them in the kept list. Must agree with buildCandidate (a unit test compares the two orders).
 */
function rankInto(best: BestRanks, part: CatalogPart, duty: PositionDuty, policy: MatchPolicy, sizing: Sizing, slots: number, order: number): boolean {
  const series = sizing.series
  const parallel = sizing.parallel
  const devices = series * parallel
  const devicesPerConverter = devices * duty.positionsPerPhase * duty.phases
  const isCapacitor = duty.kind === 'capacitor'
  const phasesPerPackage = isCapacitor ? 1 : PACKAGE_CONFIGURATIONS[part.packageConfiguration].phasesPerPackage
  const packagesPerDesign = packagesPerConverter(duty, devices, slots, phasesPerPackage) * duty.converters
  const price = priceAtQuantity(part.priceBreaks, packagesPerDesign * policy.buildQuantity, part.minimumOrderQuantity ?? 1)
  const cost = price ? round(price.unitPrice * packagesPerDesign, 2) : Infinity
  const bestGroup = approvalRank(part as CatalogPart & { approved?: boolean })
  // Bound: even with T_j within its limit the part would rank after every kept entry, so its losses are not needed.
  if (best.cannotEnter(bestGroup, cost)) return false
  let loss = Infinity
  let thermalOk = true
  if (isCapacitor) {
    if (part.esr !== undefined) loss = round(part.esr * (duty.currentRms / parallel) ** 2 * devicesPerConverter, 2)
  }
  else {
    const perDevice = deviceLosses(part, duty, series, parallel)
    if (perDevice) {
      const total = perDevice.conduction + perDevice.switching
      loss = round(total * devicesPerConverter, 2)
      const rthJc = duty.kind === 'switch' ? part.rthJunctionCaseSwitch : part.rthJunctionCaseDiode
      if (rthJc !== undefined && part.junctionTemperatureMax !== undefined) {
        const limit = part.junctionTemperatureMax - policy.junctionMarginC
        const rth = rthJc + (part.rthCaseHeatsink ?? 0)
        // Single-temperature data: the settled T_j of buildCandidate is this closed form at the point with the
        // highest losses. Two-temperature data: the same iteration buildCandidate runs.
        const settled = duty.points?.length && hasTwoTemperatures(part)
          ? junctionOverPoints(part, duty.kind as 'switch' | 'diode' | 'clamp-diode', duty.points, duty.switchingHz, series, parallel, policy.heatsinkTemperatureC, rth)
          : null
        if (settled) {
          const head = settled.perPoint.reduce((a, b) => (round(b.loss!.total, 3) > round(a.loss!.total, 3) ? b : a))
          loss = round(head.loss!.total * devicesPerConverter, 2)
          thermalOk = round(settled.worst.junctionTemperatureC, 1) <= limit && settled.worst.status === 'settled'
        }
        else {
          thermalOk = round(policy.heatsinkTemperatureC + total * rth, 1) <= limit
        }
      }
    }
  }
  const into = best.next()
  into.part = part
  into.slots = slots
  into.sizing.series = series
  into.sizing.parallel = parallel
  into.group = (thermalOk ? 0 : 6) + bestGroup
  into.cost = cost
  into.loss = loss
  into.order = order
  best.offer()
  return true
}

/** Keeps the best `limit` rank entries seen (all of them without a limit), in order. */
class BestRanks {
  readonly entries: RankEntry[] = []
  private scratch = BestRanks.blank()
  constructor(private readonly limit: number | undefined) {}
  static blank(): RankEntry {
    return { part: undefined as unknown as CatalogPart, slots: 0, sizing: { series: 0, parallel: 0 }, group: 0, cost: 0, loss: 0, order: 0 }
  }

  /** True when a part of at best this group and this cost would rank after every kept entry of a full list. */
  cannotEnter(group: number, cost: number): boolean {
    if (this.limit === undefined) return false
    if (this.limit <= 0) return true
    if (this.entries.length < this.limit) return false
    const worst = this.entries[this.entries.length - 1]!
    return group > worst.group || (group === worst.group && cost > worst.cost)
  }

  /** The entry to fill for the next part; offer() then keeps it or reuses it. */
  next(): RankEntry { return this.scratch }
  offer(): void {
    const e = this.scratch
    const list = this.entries
    if (this.limit === undefined) { list.push(e); this.scratch = BestRanks.blank(); return }
    if (this.limit <= 0) return
    if (list.length === this.limit && compareRank(e, list[list.length - 1]!) >= 0) return
    // binary search for the insertion point in the sorted, bounded list
    let lo = 0
    let hi = list.length
    while (lo < hi) {
      const mid = (lo + hi) >> 1
      if (compareRank(list[mid]!, e) <= 0) lo = mid + 1
      else hi = mid
    }
    list.splice(lo, 0, e)
    if (list.length > this.limit) list.pop()
    this.scratch = BestRanks.blank()
  }

  sorted(): RankEntry[] {
    if (this.limit === undefined) this.entries.sort(compareRank)
    return this.entries
  }
}

export function matchPosition(duty: PositionDuty, parts: readonly CatalogPart[] | PartIndex, policy: MatchPolicy, options: MatchOptions = {}): MatchResult {
  const index = isPartIndex(parts) ? parts : indexParts(parts)
  const candidates: Candidate[] = []
  const dutyProblems = checkDuty(duty)
  if (dutyProblems.length > 0) {
    const none = { wrongKind: 0, wrongTopology: 0, voltage: 0, current: 0, capacitance: 0, obsolete: 0, missingData: 0 }
    return { candidates, fitting: 0, leftOut: 0, dutyProblems, considered: 0, rejected: none }
  }
  const table = index.byPosition[duty.kind]
  const { order, slots, rank } = table
  // The scan reads the columns and the duty's ratings only: positions with equal ratings (the symmetric positions of
  // a multilevel leg) and later requests on the same catalogue index share it. `only` reads parts: never kept.
  const sd = scanDutyOf(duty, policy, options)
  const scan = options.only ? scanColumns(index, sd, options.only) : keptScan(index, sd, parts === index)
  const { fitting, leftOut } = scan
  const limit = options.limit
  const best = new BestRanks(limit)
  const sizing: Sizing = { series: 0, parallel: 0 }
  const rank1 = (k: number) => {
    const i = scan.row[k]!
    sizing.series = scan.series[k]!
    sizing.parallel = scan.parallel[k]!
    rankInto(best, index.part(order[i]!), duty, policy, sizing, slots[i]!, order[i]!)
  }
  if (limit === undefined) {
    // every fitting part, sorted at the end (ties keep catalogue order, whatever the order they were offered in)
    for (let k = 0; k < fitting; k++) rank1(k)
  }
  else if (limit > 0) {
    // The parts with the best bounds first, so the kept list is near its final state at once; then every other
    // fitting part whose bound could still place it. Same result as any order (ties keep catalogue order).
    const first = bestBounds(scan, fitting, rank, order, limit)
    for (const k of first) rank1(k)
    const seen = new Set(first)
    for (let k = 0; k < fitting; k++) {
      if (seen.has(k) || best.cannotEnter(rank[scan.row[k]!]!, scan.lowestCost[k]!)) continue
      rank1(k)
    }
  }
  for (const r of best.sorted()) candidates.push(buildCandidate(r.part, duty, policy, r.sizing, r.slots))
  return { candidates, fitting, leftOut, dutyProblems, considered: index.size, rejected: { ...scan.rejected } }
}

/**
 * What the column scan of a position reads of its duty, the policy and the options, and nothing else (the scan takes
 * only this): equal values, equal scans. The per-point duties and the position's name are not in it.
 */
interface ScanDuty {
  kind: PositionKind
  requiredVoltageRating: number
  /** A: semiconductors requiredCurrentRating (else currentPeak), capacitors requiredRippleRating (else currentRms) */
  requiredCurrent: number
  capacitanceRequired: number | null
  topology?: TopologyId
  levels?: number
  positionsPerPhase: number
  phases: number
  converters: number
  maxSeries: number
  maxParallel: number
  parallelSharing: number
  seriesSharing: number
  includeObsolete: boolean
  approvedActiveOnly: boolean
  exceptId: number | null
}

function scanDutyOf(duty: PositionDuty, policy: MatchPolicy, options: MatchOptions): ScanDuty {
  const isCapacitor = duty.kind === 'capacitor'
  return {
    kind: duty.kind,
    requiredVoltageRating: duty.requiredVoltageRating,
    requiredCurrent: isCapacitor ? (duty.requiredRippleRating ?? duty.currentRms) : (duty.requiredCurrentRating ?? duty.currentPeak),
    capacitanceRequired: isCapacitor ? (duty.capacitanceRequired ?? null) : null,
    // absent stays absent (fitsTopology reads absence); JSON leaves it out of the key
    ...(duty.topology !== undefined ? { topology: duty.topology } : {}),
    ...(duty.levels !== undefined ? { levels: duty.levels } : {}),
    positionsPerPhase: duty.positionsPerPhase,
    phases: duty.phases,
    converters: duty.converters,
    maxSeries: policy.maxSeries?.[duty.kind] ?? DEFAULT_MAX_SERIES[duty.kind],
    maxParallel: policy.maxParallel?.[duty.kind] ?? DEFAULT_MAX_PARALLEL[duty.kind],
    parallelSharing: policy.parallelCurrentSharing ?? 0.9,
    seriesSharing: policy.seriesVoltageSharing ?? 1,
    includeObsolete: !!policy.includeObsolete,
    approvedActiveOnly: !!options.approvedActiveOnly,
    exceptId: options.exceptId ?? null,
  }
}

/** A position's scan: the counts of refused and left-out parts, and per fitting part its row, counts and cost bound. */
interface Scan {
  rejected: MatchResult['rejected']
  fitting: number
  leftOut: number
  /** row in the position kind's columns, series and parallel counts, lowest cost per design (per fitting part, in row order) */
  row: Int32Array
  series: Int32Array
  parallel: Int32Array
  lowestCost: Float64Array
}

/** Bytes of scan rows kept per catalogue index (a position where every part fits: 20 bytes a part); the least recently used go first. */
export const KEPT_SCAN_BYTES = 16 * 1024 * 1024

/** Scans kept per catalogue index (an index is one catalogue generation: nothing in it changes), by their ScanDuty. */
const keptScans = new WeakMap<PartIndex, SizedCache<Scan>>()

function keptScan(index: PartIndex, sd: ScanDuty, keep: boolean): Scan {
  if (!keep) return scanColumns(index, sd)
  let kept = keptScans.get(index)
  if (!kept) keptScans.set(index, kept = new SizedCache<Scan>(KEPT_SCAN_BYTES, scan => 64 + scan.fitting * 20))
  const key = JSON.stringify(sd)
  let scan = kept.get(key)
  if (!scan) kept.set(key, scan = scanColumns(index, sd))
  return scan
}

/** The scan of one position over the columns (parts read only for `only`). */
function scanColumns(index: PartIndex, duty: ScanDuty, only?: (part: CatalogPart) => boolean): Scan {
  const { maxSeries, maxParallel, parallelSharing, seriesSharing } = duty
  const table = index.byPosition[duty.kind]
  const rejected = { wrongKind: index.size - table.count, wrongTopology: 0, voltage: 0, current: 0, capacitance: 0, obsolete: 0, missingData: 0 }
  const isCapacitor = duty.kind === 'capacitor'
  const { voltageRating, currentRating, capacitance, lowestPrice, order, slots, configuration, lifecycle, rank } = table
  const fits = topologyFits(duty)
  // Sorted by voltage rating: below `from` no part reaches the voltage even with the most series parts allowed,
  // so those are only counted (by the first check that refuses them, as the full checks would).
  const from = seriesSharing <= 1 ? firstAtLeast(voltageRating, (duty.requiredVoltageRating / maxSeries) * (1 - 1e-6)) : 0
  for (let i = 0; i < from; i++) {
    if (!fits[configuration[i]!]) rejected.wrongTopology++
    else if (!(voltageRating[i]! > 0) || !(currentRating[i]! > 0) || (isCapacitor && !(capacitance[i]! > 0))) rejected.missingData++
    else rejected.voltage++
  }
  const except = duty.exceptId !== null ? placeOf(index, duty.exceptId) : -1
  const sizing: Sizing = { series: 0, parallel: 0 }
  const kept = fittingRows(table.count)
  let fitting = 0
  let leftOut = 0
  // Every check reads the columns; the part object is read only when it could still place in the kept list
  // (on a large catalogue most of the time went into fetching parts' memory and collecting the garbage).
  for (let i = from; i < table.count; i++) {
    if (!fits[configuration[i]!]) { rejected.wrongTopology++; continue }
    const refusal = isCapacitor
      ? capacitorSizing(voltageRating[i]!, currentRating[i]!, capacitance[i]!, duty, maxSeries, maxParallel, sizing)
      : semiconductorSizing(voltageRating[i]!, currentRating[i]!, duty, maxSeries, maxParallel, parallelSharing, seriesSharing, sizing)
    if (refusal) { rejected[refusal]++; continue }
    if (lifecycle[i] === OBSOLETE && !duty.includeObsolete) { rejected.obsolete++; continue }
    const place = order[i]!
    if ((duty.approvedActiveOnly && rank[i] !== 0) || place === except) { leftOut++; continue }
    if (only && !only(index.part(place))) { leftOut++; continue }
    // At its lowest price and best group (T_j within its limit), the part's rank cannot be better than this.
    kept.row[fitting] = i
    kept.series[fitting] = sizing.series
    kept.parallel[fitting] = sizing.parallel
    kept.lowestCost[fitting] = round(lowestPrice[i]! * packagesPerDesignOf(duty, sizing, slots[i]!, isCapacitor ? 1 : PHASES_PER_PACKAGE[configuration[i]!]!), 2)
    fitting++
  }
  // copies of exactly the fitting rows: the scratch columns are reused by the next scan
  return { rejected, fitting, leftOut, row: kept.row.slice(0, fitting), series: kept.series.slice(0, fitting), parallel: kept.parallel.slice(0, fitting), lowestCost: kept.lowestCost.slice(0, fitting) }
}

interface FittingRows { row: Int32Array, series: Int32Array, parallel: Int32Array, lowestCost: Float64Array }
let scratchRows: FittingRows | null = null
/** Scratch columns for one position's fitting parts (reused: matching is synchronous, one position at a time per thread). */
function fittingRows(count: number): FittingRows {
  if (!scratchRows || scratchRows.row.length < count) {
    const n = Math.max(count, 1024)
    scratchRows = { row: new Int32Array(n), series: new Int32Array(n), parallel: new Int32Array(n), lowestCost: new Float64Array(n) }
  }
  return scratchRows
}

/** The `limit` fitting rows with the best (group, lowest cost, catalogue place) bounds, in no particular order. */
function bestBounds(kept: Pick<FittingRows, 'row' | 'lowestCost'>, fitting: number, rank: Uint8Array, order: Int32Array, limit: number): number[] {
  const better = (a: number, b: number) => {
    const ga = rank[kept.row[a]!]!
    const gb = rank[kept.row[b]!]!
    if (ga !== gb) return ga < gb
    const ca = kept.lowestCost[a]!
    const cb = kept.lowestCost[b]!
    if (ca !== cb) return ca < cb
    return order[kept.row[a]!]! < order[kept.row[b]!]!
  }
  // sorted best first; a row enters only when it beats the worst kept (most do not)
  const top: number[] = []
  for (let k = 0; k < fitting; k++) {
    if (top.length === limit && !better(k, top[limit - 1]!)) continue
    let at = top.length
    while (at > 0 && better(k, top[at - 1]!)) at--
    top.splice(at, 0, k)
    if (top.length > limit) top.pop()
  }
  return top
}

/** Phases one package spans, by package configuration code (1 for an unknown code). */
const PHASES_PER_PACKAGE = [...PACKAGE_CONFIGURATION_IDS.map(id => PACKAGE_CONFIGURATIONS[id].phasesPerPackage), 1]

/** Whether each package configuration code fits the duty's topology (the last entry: an unknown code). */
function topologyFits(duty: Pick<PositionDuty, 'topology' | 'levels'>): boolean[] {
  return [...PACKAGE_CONFIGURATION_IDS.map(id => fitsTopology(id, duty)), true]
}

function packagesPerDesignOf(duty: Pick<PositionDuty, 'positionsPerPhase' | 'phases' | 'converters'>, sizing: Sizing, slots: number, phasesPerPackage: number): number {
  return packagesPerConverter(duty, sizing.series * sizing.parallel, slots, phasesPerPackage) * duty.converters
}

/** First place of an ascending column (NaN first) whose value is at least `value`. */
function firstAtLeast(column: Float64Array, value: number): number {
  let lo = 0
  let hi = column.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (column[mid]! >= value) hi = mid
    else lo = mid + 1
  }
  return lo
}

/**
 * The assigned part rated at the counts stored with the assignment (not re-sized): margins, losses,
 * packages and price at `seriesCount` × `parallelCount`, and the counts today's duty needs. `fits` is
 * false when the stored counts are fewer than needed or the part no longer fits at all (issue 11 item 3).
 */
export function rateAssignment(part: CatalogPart, duty: PositionDuty, policy: MatchPolicy, seriesCount: number, parallelCount: number): { rated: Candidate | null, needed: { seriesCount: number, parallelCount: number } | null, fits: boolean } {
  const sized = matchPosition(duty, [part], { ...policy, includeObsolete: true }).candidates[0] ?? null
  const slots = slotsPerPackage(part, duty.kind)
  if (slots === 0 || checkDuty(duty).length > 0) return { rated: null, needed: null, fits: false }
  const rated = buildCandidate(part, duty, policy, { series: seriesCount, parallel: parallelCount }, slots)
  const needed = sized ? { seriesCount: sized.seriesCount, parallelCount: sized.parallelCount } : null
  const fits = !!sized && seriesCount >= sized.seriesCount && parallelCount >= sized.parallelCount && rated.thermalOk
  return { rated, needed, fits }
}

function isPartIndex(parts: readonly CatalogPart[] | PartIndex): parts is PartIndex {
  return !Array.isArray(parts) && (parts as PartIndex).kind === 'part-index'
}

function buildCandidate(part: CatalogPart, duty: PositionDuty, policy: MatchPolicy, sizing: Sizing, slots: number): Candidate {
  const { series, parallel } = sizing
  const warnings: string[] = []
  const isCapacitor = duty.kind === 'capacitor'
  const devices = series * parallel
  const devicesPerConverter = devices * duty.positionsPerPhase * duty.phases
  const cfg = PACKAGE_CONFIGURATIONS[part.packageConfiguration]
  const phasesPerPackage = isCapacitor ? 1 : cfg.phasesPerPackage
  const packages = packagesPerConverter(duty, devices, slots, phasesPerPackage)
  const packagesPerDesign = packages * duty.converters
  const unusedSlots = packages * slots - devicesPerConverter
  if (unusedSlots > 0 && slots > 1) {
    warnings.push(`${unusedSlots} of ${packages * slots} ${describePosition(duty.kind)} positions in these packages are not used by ${duty.positionName} (another position of the leg may use them)`)
  }
  // A switch-diode package also holds the anti-parallel diodes (and an NPC leg its clamp diodes).
  const sharedPackage = part.kind === 'switch-diode'
  if (duty.kind === 'diode' && part.kind === 'switch-diode') {
    warnings.push(`the anti-parallel diode inside ${part.partNumber}: no extra package when the switch position uses the same part`)
  }
  if (duty.kind === 'switch' && part.kind === 'switch') warnings.push('switch without anti-parallel diode: the diode position needs a part of its own')
  if (series > 1) warnings.push(`${series} in series: voltage sharing (snubbers or sharing resistors) needed`)
  if (parallel > 1 && !isCapacitor) warnings.push(`${parallel} in parallel: current sharing assumed at ${Math.round((policy.parallelCurrentSharing ?? 0.9) * 100)} % of each rating`)

  const voltageMarginPct = round(((series * part.voltageRating) / duty.requiredVoltageRating - 1) * 100, 1)
  let currentMarginPct: number
  let capacitanceMarginPct: number | undefined
  let losses: CandidateLosses | null = null
  let junctionTemperatureC: number | undefined
  let junctionLimitC: number | undefined
  let thermalOk = true
  let missingData: string[] | undefined
  let candidateJunctionPoint: string | undefined

  if (isCapacitor) {
    const rippleNeeded = duty.requiredRippleRating ?? duty.currentRms
    currentMarginPct = round(((parallel * (part.rippleCurrentRating ?? 0)) / rippleNeeded - 1) * 100, 1)
    if (duty.capacitanceRequired) capacitanceMarginPct = round(((parallel * (part.capacitance ?? 0)) / series / duty.capacitanceRequired - 1) * 100, 1)
    if (part.esr !== undefined) {
      const perCapacitor = part.esr * (duty.currentRms / parallel) ** 2
      losses = { conduction: round(perCapacitor, 3), switching: 0, total: round(perCapacitor, 3), perConverter: round(perCapacitor * devicesPerConverter, 2) }
    }
  }
  else {
    currentMarginPct = round(((parallel * (part.currentRating ?? 0)) / (duty.requiredCurrentRating ?? duty.currentPeak) - 1) * 100, 1)
    const perDevice = deviceLosses(part, duty, series, parallel)
    if (perDevice) {
      const total = perDevice.conduction + perDevice.switching
      losses = { conduction: round(perDevice.conduction, 3), switching: round(perDevice.switching, 3), total: round(total, 3), perConverter: round(total * devicesPerConverter, 2) }
      if (perDevice.pointName !== undefined) {
        if (perDevice.switching > 0 && duty.points?.some(p => !p.switchingDuty)) warnings.push(FALLBACK_METHOD)
        losses.pointName = perDevice.pointName
        losses.perPoint = perDevice.perPoint!.map(l => ({ pointName: l.pointName, conduction: round(l.conduction, 3), switching: round(l.switching, 3), total: round(l.total, 3), perConverter: round(l.total * devicesPerConverter, 2) }))
      }
      const rthJc = duty.kind === 'switch' ? part.rthJunctionCaseSwitch : part.rthJunctionCaseDiode
      if (rthJc !== undefined && part.junctionTemperatureMax !== undefined) {
        junctionTemperatureC = round(policy.heatsinkTemperatureC + total * (rthJc + (part.rthCaseHeatsink ?? 0)), 1)
        junctionLimitC = part.junctionTemperatureMax - policy.junctionMarginC
        // Per point: T_j iterated with the (temperature-dependent) losses; losses shown at the settled T_j.
        const settled = duty.points?.length ? junctionOverPoints(part, duty.kind as 'switch' | 'diode' | 'clamp-diode', duty.points, duty.switchingHz, series, parallel, policy.heatsinkTemperatureC, rthJc + (part.rthCaseHeatsink ?? 0)) : null
        if (settled) {
          const w = settled.worst
          junctionTemperatureC = round(w.junctionTemperatureC, 1)
          losses.perPoint = settled.perPoint.map(p => ({ pointName: p.pointName, conduction: round(p.loss!.conduction, 3), switching: round(p.loss!.switching, 3), total: round(p.loss!.total, 3), perConverter: round(p.loss!.total * devicesPerConverter, 2), junctionTemperatureC: round(p.junctionTemperatureC, 1), junctionStatus: p.status }))
          const head = losses.perPoint.reduce((a, b) => (b.total > a.total ? b : a))
          Object.assign(losses, { conduction: head.conduction, switching: head.switching, total: head.total, perConverter: head.perConverter, pointName: head.pointName })
          candidateJunctionPoint = w.pointName
          if (w.status !== 'settled') warnings.push(`${w.pointName}: ${w.note}`)
          else if (!hasTwoTemperatures(part)) warnings.push(w.note)
        }
        thermalOk = junctionTemperatureC <= junctionLimitC && (!settled || settled.worst.status === 'settled')
        if (!thermalOk) warnings.push(`T_j ${junctionTemperatureC} °C exceeds ${junctionLimitC} °C (T_j,max ${part.junctionTemperatureMax} °C − ${policy.junctionMarginC} °C margin)${candidateJunctionPoint ? ` at ${candidateJunctionPoint}` : ''}`)
        if (part.rthCaseHeatsink === undefined) warnings.push('no R_th case-heatsink in the catalogue: T_j leaves it out')
      }
      else {
        missingData = missingFigures(part, duty, ['thermal'])
        warnings.push(`missing ${missingData.join(', ')}: junction temperature not computed`)
      }
    }
    else {
      missingData = missingFigures(part, duty, ['losses', 'thermal'])
      warnings.push(`missing ${missingData.join(', ')}: losses and junction temperature not computed`)
    }
  }

  const needed = packagesPerDesign * policy.buildQuantity
  const price = priceAtQuantity(part.priceBreaks, needed, part.minimumOrderQuantity ?? 1)
  const orderQuantity = price?.orderQuantity ?? Math.max(needed, part.minimumOrderQuantity ?? 1)
  if (price?.raisedToMinimum) warnings.push(`order raised from ${needed} to ${orderQuantity} pieces (first price break or MOQ)`)
  if (!price) warnings.push('no price in the catalogue')
  const stockOk = part.stock === undefined ? null : part.stock >= orderQuantity
  if (stockOk === false) warnings.push(`stock ${part.stock} < ${orderQuantity} needed${part.leadTimeDays !== undefined ? `; lead time ${part.leadTimeDays} d` : ''}`)
  if (part.lifecycle === 'nrnd') warnings.push('not for new designs (NRND)')
  if (part.lifecycle === 'obsolete') warnings.push('obsolete')

  // Plain assignments (no conditional spreads): this runs for every candidate of 20 000 parts.
  const candidate: Candidate = {
    part,
    seriesCount: series,
    parallelCount: parallel,
    voltageMarginPct,
    currentMarginPct,
    losses,
    ...(missingData ? { missingData } : {}),
    thermalOk,
    slotsPerPackage: slots,
    packagesPerConverter: packages,
    packagesPerDesign,
    orderQuantity,
    unitPrice: price ? price.unitPrice : null,
    priceBreakQuantity: price ? price.breakQuantity : null,
    costPerDesign: price ? round(price.unitPrice * packagesPerDesign, 2) : null,
    stockOk,
    lifecycle: part.lifecycle,
    sharedPackage,
    warnings,
  }
  if (capacitanceMarginPct !== undefined) candidate.capacitanceMarginPct = capacitanceMarginPct
  if (junctionTemperatureC !== undefined) {
    candidate.junctionTemperatureC = junctionTemperatureC
    candidate.junctionLimitC = junctionLimitC
    if (candidateJunctionPoint) candidate.junctionPointName = candidateJunctionPoint
  }
  if (part.currency) candidate.currency = part.currency
  if (part.stock !== undefined) candidate.stock = part.stock
  if (part.leadTimeDays !== undefined) candidate.leadTimeDays = part.leadTimeDays
  return candidate
}

/** Thermally fine first, then approval and lifecycle (approvalRank), cost per design, losses per converter. */
export function sortCandidates(candidates: Candidate[]): Candidate[] {
  // Keys computed once per candidate: the comparator runs n·log n times on large catalogues.
  const keyed = candidates.map(c => ({
    c,
    group: (c.thermalOk ? 0 : 6) + approvalRank(c.part as CatalogPart & { approved?: boolean }),
    cost: c.costPerDesign ?? Infinity,
    loss: c.losses ? c.losses.perConverter : Infinity,
  }))
  keyed.sort((a, b) => a.group - b.group || (a.cost === b.cost ? 0 : a.cost < b.cost ? -1 : 1) || (a.loss === b.loss ? 0 : a.loss < b.loss ? -1 : 1))
  return keyed.map(k => k.c)
}

function formatNumber(value: number): string {
  return Number(value.toPrecision(4)).toString()
}

function formatCapacitance(farad: number): string {
  return farad >= 1e-3 ? `${formatNumber(farad * 1e3)} mF` : `${formatNumber(farad * 1e6)} µF`
}

/**
 * Explains why no part fits a position (null when some part does): what is required, the closest
 * parts and what each lacks, and parts left out for lifecycle or topology.
 */
export function whyNothingFits(duty: PositionDuty, catalogue: readonly CatalogPart[] | PartIndex, policy: MatchPolicy): string | null {
  const index = isPartIndex(catalogue) ? catalogue : indexParts(catalogue)
  const result = matchPosition(duty, index, policy, { limit: 0 })
  if (result.dutyProblems.length > 0) return result.dutyProblems.join('; ')
  if (result.fitting > 0) return null
  const maxSeries = policy.maxSeries?.[duty.kind] ?? DEFAULT_MAX_SERIES[duty.kind]
  const maxParallel = policy.maxParallel?.[duty.kind] ?? DEFAULT_MAX_PARALLEL[duty.kind]
  const noun = describePosition(duty.kind)
  const isCapacitor = duty.kind === 'capacitor'
  const kinds = kindsFor(duty.kind)
  const table = index.byPosition[duty.kind]
  if (table.count === 0) return `${duty.positionName}: the catalogue has no part that can serve as a ${noun} (kinds ${kinds.map(k => `'${k}'`).join(' or ')}).`

  const currentNeeded = isCapacitor ? (duty.requiredRippleRating ?? duty.currentRms) : (duty.requiredCurrentRating ?? duty.currentPeak)
  const needs = [`≥ ${formatNumber(duty.requiredVoltageRating)} V`, `≥ ${formatNumber(currentNeeded)} A${isCapacitor ? ' ripple' : ''}`]
  if (isCapacitor && duty.capacitanceRequired) needs.push(`≥ ${formatCapacitance(duty.capacitanceRequired)}`)
  const allowance = `allowing up to ${maxSeries} in series and ${maxParallel} in parallel`
  let message = `${duty.positionName}: no ${noun} rated ${needs.join(' and ')} (${allowance}).`

  // Closest: the smallest product of shortfalls even with the most series / parallel parts allowed (read from the columns).
  const shortfall = (k: number) => {
    const rating = table.voltageRating[k]!
    const v = duty.requiredVoltageRating / (rating * maxSeries)
    const i = currentNeeded / (table.currentRating[k]! * maxParallel)
    const c = isCapacitor && duty.capacitanceRequired ? (duty.capacitanceRequired * Math.ceil(duty.requiredVoltageRating / rating)) / (table.capacitance[k]! * maxParallel) : 1
    return Math.max(1, v) * Math.max(1, Number.isFinite(i) ? i : 1e9) * Math.max(1, Number.isFinite(c) ? c : 1e9)
  }
  // Obsolete parts are counted below rather than offered as "closest" (unless nothing else exists); ties in catalogue order.
  const all = Array.from({ length: table.count }, (_, k) => k)
  const usablePlaces = policy.includeObsolete ? all : all.filter(k => table.lifecycle[k] !== OBSOLETE)
  const short = Float64Array.from({ length: table.count }, (_, k) => shortfall(k))
  const closest = (usablePlaces.length > 0 ? usablePlaces : all).sort((a, b) => short[a]! - short[b]! || table.order[a]! - table.order[b]!).slice(0, 3).map(k => index.part(table.order[k]!))
  const describe = (p: CatalogPart) => {
    const lacks: string[] = []
    if (p.voltageRating * maxSeries < duty.requiredVoltageRating) lacks.push(`voltage ${formatNumber(p.voltageRating)} V${maxSeries > 1 ? ` × ${maxSeries}` : ''} < ${formatNumber(duty.requiredVoltageRating)} V`)
    const rating = (isCapacitor ? p.rippleCurrentRating : p.currentRating) ?? 0
    const usable = rating * maxParallel * (maxParallel > 1 && !isCapacitor ? policy.parallelCurrentSharing ?? 0.9 : 1)
    if (usable < currentNeeded) lacks.push(`current ${formatNumber(rating)} A${maxParallel > 1 ? ` × ${maxParallel}` : ''} < ${formatNumber(currentNeeded)} A`)
    if (isCapacitor && duty.capacitanceRequired && p.capacitance !== undefined) {
      const series = Math.max(1, Math.ceil(duty.requiredVoltageRating / p.voltageRating))
      if ((p.capacitance * maxParallel) / series < duty.capacitanceRequired) lacks.push(`capacitance ${formatCapacitance(p.capacitance)} × ${maxParallel} / ${series} in series < ${formatCapacitance(duty.capacitanceRequired)}`)
    }
    if (!fitsTopology(p.packageConfiguration, duty)) lacks.push(`a ${PACKAGE_CONFIGURATIONS[p.packageConfiguration].label} module made for another topology`)
    if (p.lifecycle === 'obsolete' && !policy.includeObsolete) lacks.push('obsolete')
    const rating2 = isCapacitor ? `${formatNumber(p.voltageRating)} V, ${formatCapacitance(p.capacitance ?? 0)}, ${formatNumber(p.rippleCurrentRating ?? 0)} A` : `${formatNumber(p.voltageRating)} V, ${formatNumber(p.currentRating ?? 0)} A`
    return `${p.manufacturer} ${p.partNumber} (${rating2})${lacks.length > 0 ? `: ${lacks.join('; ')}` : ''}`
  }
  message += ` Closest: ${closest.map(describe).join('; ')}.`
  if (result.rejected.obsolete > 0) message += ` ${result.rejected.obsolete} obsolete part${result.rejected.obsolete > 1 ? 's' : ''} would fit.`
  if (result.rejected.wrongTopology > 0) message += ` ${result.rejected.wrongTopology} module${result.rejected.wrongTopology > 1 ? 's are' : ' is'} made for another topology.`
  if (result.rejected.missingData > 0) message += ` ${result.rejected.missingData} part${result.rejected.missingData > 1 ? 's lack' : ' lacks'} ratings in the catalogue.`
  return message
}

export interface DutyContext {
  /** Hz */
  switchingHz: number
  /** default 3 */
  phases?: number
  /** default 1 */
  converters?: number
  topology?: TopologyId
  levels?: number
}

/** A device position of the engine's envelope as a matching duty (worst values over the operating points). */
export function positionDutyFromDevice(device: DeviceEnvelope, ctx: DutyContext): PositionDuty {
  return {
    positionName: device.name,
    kind: device.kind,
    // The whole position's rating from the engine's derating rule (derating.ts): a clamp stack's units share it.
    requiredVoltageRating: device.positionVoltageRating ?? device.requiredVoltageRating,
    requiredCurrentRating: device.requiredCurrentRating,
    currentAvg: device.currentAvg,
    currentRms: device.currentRms,
    currentPeak: device.currentPeak,
    blockingVoltage: device.blockingVoltage,
    // Without the engine's commutated voltage the steady blocking voltage is the closest stand-in.
    commutatedVoltage: device.commutatedVoltage ?? device.blockingVoltage,
    switchingHz: ctx.switchingHz,
    positionsPerPhase: device.countPerPhase,
    phases: ctx.phases ?? 3,
    converters: ctx.converters ?? 1,
    ...(ctx.topology ? { topology: ctx.topology } : {}),
    ...(ctx.levels !== undefined ? { levels: ctx.levels } : {}),
  }
}

/** A capacitor position of the engine's envelope as a matching duty (count per converter, phases = 1). */
export function positionDutyFromCapacitor(capacitor: CapacitorEnvelope, ctx: Omit<DutyContext, 'switchingHz' | 'phases'>): PositionDuty {
  return {
    positionName: capacitor.name,
    kind: 'capacitor',
    requiredVoltageRating: capacitor.requiredVoltageRating,
    requiredRippleRating: capacitor.requiredRippleRating,
    ...(capacitor.capacitanceRequired !== undefined ? { capacitanceRequired: capacitor.capacitanceRequired } : {}),
    capacitorRole: capacitor.role,
    currentAvg: 0,
    currentRms: capacitor.rippleCurrentRms,
    currentPeak: capacitor.rippleCurrentRms * Math.SQRT2,
    blockingVoltage: capacitor.voltage,
    commutatedVoltage: 0,
    switchingHz: 0,
    positionsPerPhase: capacitor.count,
    phases: 1,
    converters: ctx.converters ?? 1,
    ...(ctx.topology ? { topology: ctx.topology } : {}),
    ...(ctx.levels !== undefined ? { levels: ctx.levels } : {}),
  }
}
