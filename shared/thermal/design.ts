// Junction temperature over the period and lifetime for a whole design: per position and operating point
// the mean, peak and swing of T_j for the assigned part and the candidates (dynamics.ts), the heatsink
// driven by the converter's summed losses, and the mission-profile life per position (lifetime.ts) with the
// position that limits it.
import { converterPointInputs } from '../engine/design'
import { gridInput } from '../engine/link'
import { lossProfile, type LossProfile } from '../engine/profile'
import type { ConverterResult, DesignInput } from '../engine/types'
import type { PositionDuty } from '../catalog/matching'
import type { CatalogPart } from '../catalog/types'
import { addThreePhases, binLosses, junctionDynamics, type CoolingSettings, type PointDynamics, type ProfiledDuty } from './dynamics'
import { BAYERER_DEFAULTS, CAPACITOR_LIFE_SOURCE, capacitorLife, POWER_CYCLING_SOURCE, powerCyclingLife, type BayererParameters, type PointDamage } from './lifetime'
import { FOSTER_METHOD } from './network'
import { deviceLossAtPoint } from './losses'
import { SETTLE_K } from './temperature'
import { PACKAGE_CONFIGURATIONS } from '../../catalog/columns'
import { moduleCoverage, type LegPosition } from '../bom/coverage'

export type ThermalSide = 'machine' | 'grid' | 'dc-link'

export interface ThermalChoice {
  part: CatalogPart
  seriesCount: number
  parallelCount: number
  /** the other positions of the same side inside this part's package (module coverage): they share its case */
  caseMates?: string[]
}

/**
 * Devices (chips) one package holds: a switch-with-diode slot is two (the switch and its anti-parallel diode), plus a
 * three-level NPC leg's clamp diodes; a diode part its diode slots.
 */
export function packageDevices(part: Pick<CatalogPart, 'kind' | 'packageConfiguration'>): number {
  const cfg = PACKAGE_CONFIGURATIONS[part.packageConfiguration]
  if (!cfg) return 1
  if (part.kind === 'switch-diode') return 2 * cfg.switches + (part.packageConfiguration === 'npc-leg' ? cfg.clampDiodes : 0)
  if (part.kind === 'switch') return cfg.switches
  return part.packageConfiguration === 'single' ? 1 : Math.max(cfg.diodes, cfg.clampDiodes)
}

/**
 * K/W, case to heatsink of a whole module: the catalogue's R_th,ch is per switch or diode, so the module's is the
 * per-device paths in parallel, R_th,ch / devices (assumption: equal footprints; common practice). Null without it.
 */
export function moduleCaseResistance(part: Pick<CatalogPart, 'kind' | 'packageConfiguration' | 'rthCaseHeatsink'>): number | null {
  return part.rthCaseHeatsink === undefined ? null : part.rthCaseHeatsink / packageDevices(part)
}

export interface ThermalPosition {
  side: ThermalSide
  duty: PositionDuty
  /** parts whose T_j is wanted (assigned part and candidates) */
  choices: ThermalChoice[]
  /** index into choices of the part that loads the heatsink and counts for the lifetime (assigned, else the best candidate); −1 none */
  reference: number
  referenceAssigned: boolean
}

export interface ChoiceThermal {
  perPoint: PointDynamics[]
  /** the point with the highest peak */
  worstPointName: string
  /** °C, highest mean and highest peak over the points; K, largest swing */
  meanC: number
  peakC: number
  swingK: number
  /** °C, T_j,max − margin */
  limitC: number
  peakOk: boolean
  fromFoster: boolean
  notes: string[]
  /** the other positions whose devices sit in the same package (their losses heat the shared case); absent: alone */
  caseSharedWith?: string[]
}

export interface PositionLife {
  side: ThermalSide
  position: string
  partNumber: string
  /** false: no part assigned, the best candidate stands in */
  assigned: boolean
  /** operating hours (Infinity: nothing cycles) */
  lifeHours: number
  perPoint: (PointDamage | { pointName: string, hotSpotC: number, lifeHours: number, damagePerHour: number })[]
  method: string
  source: string
  notes: string[]
}

export interface DesignLife {
  /** Σ hoursShare over the machine side's points (the mission covers that part of the hours) */
  hoursShareTotal: number
  positions: PositionLife[]
  /** the position with the shortest life */
  limiting: { side: ThermalSide, position: string, lifeHours: number } | null
  /** positions left out, with the reason */
  skipped: string[]
}

export interface DesignThermal {
  cooling: CoolingSettings
  /** said on the result */
  assumptions: string[]
  method: string
  /** per position, per choice (same order as given) */
  results: (ChoiceThermal | null)[][]
  life: DesignLife | null
}

export function coolingOf(input: DesignInput, fallbackHeatsinkC: number): CoolingSettings {
  return input.thermal
    ? { ambientTemperatureC: input.thermal.ambientTemperatureC, heatsinkRth: input.thermal.heatsinkRth, heatsinkTimeConstantS: input.thermal.heatsinkTimeConstantS }
    : { ambientTemperatureC: fallbackHeatsinkC, heatsinkRth: 0, heatsinkTimeConstantS: 1 }
}

/** Per side, the per-angle duty of every operating point (engine/profile.ts). */
export function designProfiles(input: DesignInput): Map<'machine' | 'grid', LossProfile[]> {
  const out = new Map<'machine' | 'grid', LossProfile[]>()
  out.set('machine', converterPointInputs(input.machineSide).map(p => lossProfile(p.input)))
  // The grid side as the engine reads it (DC link and levels from the machine side where absent).
  if (input.gridSide) out.set('grid', converterPointInputs(gridInput(input.machineSide, input.gridSide)).map(p => lossProfile(p.input)))
  return out
}

// Per position duty and profile list, made once per evaluation (the heatsink, the junctions and the case groups read them).
const profiledCache = new WeakMap<PositionDuty, { profiles: LossProfile[] | undefined, points: ProfiledDuty[] }>()

function profiledPoints(duty: PositionDuty, profiles: LossProfile[] | undefined): ProfiledDuty[] {
  const hit = profiledCache.get(duty)
  if (hit && hit.profiles === profiles) return hit.points
  const points = joinProfiles(duty, profiles)
  profiledCache.set(duty, { profiles, points })
  return points
}

function joinProfiles(duty: PositionDuty, profiles: LossProfile[] | undefined): ProfiledDuty[] {
  return (duty.points ?? []).map((pt, k) => {
    const prof = profiles?.[k]
    const position = prof?.positions.find(p => p.name === duty.positionName)
    return position ? { ...pt, profile: position, fundamentalHz: prof!.fundamentalHz } : pt
  })
}

type SemiKind = 'switch' | 'diode' | 'clamp-diode'

/**
 * T_j dynamics for every choice of every device position and the lifetime of the reference parts.
 * `converters` gives the capacitors' per-point ripple (lifetime of electrolytic capacitors).
 */
export function designThermal(input: DesignInput, converters: readonly ConverterResult[], positions: readonly ThermalPosition[], junctionMarginC: number, fallbackHeatsinkC: number, profiles = designProfiles(input)): DesignThermal {
  const cooling = coolingOf(input, fallbackHeatsinkC)
  const assumptions = [
    input.thermal ? `Ambient or coolant ${cooling.ambientTemperatureC} °C; heatsink ${cooling.heatsinkRth} K/W, τ ${cooling.heatsinkTimeConstantS} s, loaded by the converter's summed losses of the assigned parts (the best candidate where none is assigned), at their data temperature; each converter on its own heatsink.` : `No cooling set for the design: the heatsink is held at the derating's ${fallbackHeatsinkC} °C.`,
    'A device alone in its package on its own R_th,ch (the catalogue gives it per device); the devices of one module share its case: the module\'s R_th,ch (per-device R_th,ch / devices in the package) carries their summed losses, each device\'s at its own T_j, settled together; the case-heatsink layer carries the mean loss.',
  ]
  // Heatsink power per side and point: Σ positions, three phases 120° apart, reference parts at their data temperature.
  const heatsink = new Map<string, Float64Array[]>()
  for (const side of ['machine', 'grid'] as const) {
    const sideProfiles = profiles.get(side)
    if (!sideProfiles) continue
    const perPoint = sideProfiles.map(p => new Float64Array(p.bins))
    for (const pos of positions) {
      if (pos.side !== side || pos.duty.kind === 'capacitor' || pos.reference < 0) continue
      const choice = pos.choices[pos.reference]!
      profiledPoints(pos.duty, sideProfiles).forEach((pt, k) => {
        const p = binLosses(choice.part, pos.duty.kind as SemiKind, pt, pos.duty.switchingHz, choice.seriesCount, choice.parallelCount)
        if (p) addThreePhases(perPoint[k]!, p, pos.duty.positionsPerPhase * choice.seriesCount * choice.parallelCount, pos.duty.phases)
      })
    }
    heatsink.set(side, perPoint)
  }

  // A choice whose package holds other positions settles with them (one case, losses iterated together); the
  // group is computed once per part and member set and read by every member.
  const groups = new Map<string, Map<string, PointDynamicsOf[]>>()
  const results = positions.map((pos) => {
    if (pos.duty.kind === 'capacitor' || pos.side === 'dc-link') return pos.choices.map(() => null)
    const sideProfiles = profiles.get(pos.side)
    const points = profiledPoints(pos.duty, sideProfiles)
    const hs = heatsink.get(pos.side)
    return pos.choices.map((choice) => {
      const mates = caseMatePositions(choice, pos, positions)
      const rth = moduleCaseResistance(choice.part)
      if (!mates.length || rth === null) {
        const own = points.map((pt, k) => junctionDynamics(choice.part, pos.duty.kind as SemiKind, pt, pos.duty.switchingHz, choice.seriesCount, choice.parallelCount, cooling, hs?.[k] ?? null))
        return choiceThermal(choice.part, own, junctionMarginC)
      }
      const members = [pos, ...mates]
      const key = groupKey(choice, members)
      if (!groups.has(key)) groups.set(key, sharedCaseGroup(choice, members, sideProfiles, cooling, hs, rth))
      const mine = groups.get(key)?.get(pos.duty.positionName)
      const out = mine ? choiceThermal(choice.part, mine, junctionMarginC) : null
      return out && { ...out, caseSharedWith: mates.map(m => m.duty.positionName) }
    })
  })

  return { cooling, assumptions, method: FOSTER_METHOD, results, life: designLife(input, converters, positions, results, cooling) }
}

type PointDynamicsOf = ReturnType<typeof junctionDynamics>

/** The device positions of the same side named as a choice's case mates. */
function caseMatePositions(choice: ThermalChoice, pos: ThermalPosition, positions: readonly ThermalPosition[]): ThermalPosition[] {
  const out: ThermalPosition[] = []
  for (const name of choice.caseMates ?? []) {
    if (name === pos.duty.positionName) continue
    const mate = positions.find(p => p.side === pos.side && p.duty.positionName === name)
    if (mate && mate.duty.kind !== 'capacitor' && !out.includes(mate)) out.push(mate)
  }
  return out
}

function groupKey(choice: ThermalChoice, members: readonly ThermalPosition[]): string {
  const { part } = choice
  const id = (part as { partVersionId?: number }).partVersionId ?? ''
  return [part.manufacturer, part.partNumber, id, choice.seriesCount, choice.parallelCount, members[0]!.side, ...members.map(m => m.duty.positionName).sort()].join('|')
}

const JOINT_ITERATIONS = 60
const JOINT_RUNAWAY_NOTE = 'the devices of the shared case did not settle together: treated as thermal runaway'

/**
 * T_j over the period of every device of one package (members: the positions it fills), settled jointly per point:
 * each member's junction sees the module's R_th,ch carrying its own loss and the others' mean losses at their own
 * settled T_j; the losses are re-evaluated for all members together until no member's mean T_j moves by SETTLE_K
 * (Jacobi fixed point; a group that does not settle is reported as runaway). Modules are paralleled and stacked
 * as whole modules (coverage.ts), so every member carries the choice's series and parallel counts. A package over
 * several phases (six-pack) holds every phase's devices. A member without T_j (data missing) gets null.
 */
function sharedCaseGroup(choice: ThermalChoice, members: readonly ThermalPosition[], sideProfiles: LossProfile[] | undefined, cooling: CoolingSettings, heatsink: Float64Array[] | undefined, rth: number): Map<string, PointDynamicsOf[]> {
  const { part, seriesCount: s, parallelCount: par } = choice
  const phases = Math.max(1, PACKAGE_CONFIGURATIONS[part.packageConfiguration]?.phasesPerPackage ?? 1)
  const devices = members.map(m => m.duty.positionsPerPhase * phases)
  const pointsOf = members.map(m => profiledPoints(m.duty, sideProfiles))
  const n = pointsOf[0]!.length
  const out = members.map((): PointDynamicsOf[] => [])
  for (let k = 0; k < n; k++) {
    const run = (i: number, othersMeanW: number) => junctionDynamics(part, members[i]!.duty.kind as SemiKind, pointsOf[i]![k]!, members[i]!.duty.switchingHz, s, par, cooling, heatsink?.[k] ?? null, { rth, ownDevices: devices[i]!, othersMeanW })
    // Start from the losses at the data temperature; a member without a loss figure adds nothing to the case.
    let loss = members.map((m, i) => { const pt = pointsOf[i]![k]; return (pt && deviceLossAtPoint(part, m.duty.kind as SemiKind, pt, m.duty.switchingHz, s, par)?.total) || 0 })
    let means = members.map(() => NaN)
    let dyn: PointDynamicsOf[] = []
    let settled = false
    for (let it = 0; it < JOINT_ITERATIONS && !settled; it++) {
      const total = loss.reduce((sum, l, i) => sum + l * devices[i]!, 0)
      dyn = members.map((_, i) => run(i, total - loss[i]! * devices[i]!))
      settled = dyn.every((d, i) => !d || d.status !== 'settled' || Math.abs(d.meanC - means[i]!) < SETTLE_K)
      means = dyn.map(d => d?.meanC ?? NaN)
      loss = dyn.map((d, i) => d?.lossW ?? loss[i]!)
    }
    dyn.forEach((d, i) => {
      out[i]!.push(d && !settled && d.status === 'settled' ? { ...d, status: 'runaway', note: [d.note, JOINT_RUNAWAY_NOTE].join('; ') } : d)
    })
  }
  return new Map(members.map((m, i) => [m.duty.positionName, out[i]!]))
}

function choiceThermal(part: CatalogPart, dynamics: readonly PointDynamicsOf[], marginC: number): ChoiceThermal | null {
  if (part.junctionTemperatureMax === undefined) return null
  const perPoint: PointDynamics[] = []
  let fromFoster = true
  const notes = new Set<string>()
  let lastNote: string | null = null
  for (const d of dynamics) {
    if (!d) return null
    fromFoster &&= d.fromFoster
    // The points mostly repeat one note: split it once.
    if (d.note !== lastNote) for (const n of d.note.split('; ')) if (n) notes.add(n)
    lastNote = d.note
    const { note: _n, fromFoster: _f, ...fig } = d
    perPoint.push(fig)
  }
  if (!perPoint.length) return null
  const worst = perPoint.reduce((a, b) => (b.peakC > a.peakC ? b : a))
  const limitC = part.junctionTemperatureMax - marginC
  return {
    perPoint,
    worstPointName: worst.pointName,
    meanC: Math.max(...perPoint.map(p => p.meanC)),
    peakC: worst.peakC,
    swingK: Math.max(...perPoint.map(p => p.swingK)),
    limitC,
    peakOk: perPoint.every(p => p.status === 'settled' && p.peakC <= limitC + 1e-9),
    fromFoster,
    notes: [...notes],
  }
}

/**
 * Which positions of one side share a package: hosts in the given order (explicit module hosts first, then leg
 * order), each position not yet placed hosts a package of its part, and the package takes the positions its
 * coverage fills (shared/bom/coverage.ts) that carry the same part (`partKey`). Returns, per position, the other
 * members of its package (its case mates); a position alone in its package is absent.
 */
export function caseMatesByCoverage(leg: readonly LegPosition[], partAt: (position: string) => { key: string, part: Pick<CatalogPart, 'kind' | 'packageConfiguration'> } | null, hostsFirst: readonly string[] = []): Map<string, string[]> {
  const placed = new Set<string>()
  const out = new Map<string, string[]>()
  const order = [...hostsFirst.filter(h => leg.some(p => p.name === h)), ...leg.map(p => p.name)]
  for (const host of order) {
    if (placed.has(host)) continue
    const own = partAt(host)
    if (!own) continue
    // The package fills only positions still free that carry the same part.
    const free = leg.filter(p => p.name === host || (!placed.has(p.name) && partAt(p.name)?.key === own.key))
    const members = [host, ...(moduleCoverage(own.part, host, free)?.covers ?? [])]
    for (const m of members) placed.add(m)
    if (members.length < 2) continue
    for (const m of members) out.set(m, members.filter(x => x !== m))
  }
  return out
}

function designLife(input: DesignInput, converters: readonly ConverterResult[], positions: readonly ThermalPosition[], results: (ChoiceThermal | null)[][], cooling: CoolingSettings): DesignLife | null {
  const sideInput = (side: ThermalSide) => (side === 'grid' && input.gridSide ? gridInput(input.machineSide, input.gridSide) : input.machineSide)
  const hoursShareTotal = input.machineSide.operatingPoints.reduce((s, p) => s + (p.hoursShare ?? 0), 0)
  const anyShare = hoursShareTotal > 0 || (input.gridSide?.operatingPoints.some(p => (p.hoursShare ?? 0) > 0) ?? false)
  if (!anyShare) return null
  const params: BayererParameters = { ...BAYERER_DEFAULTS, ...(input.thermal?.lifetime ?? {}) }
  const edited = Object.keys(input.thermal?.lifetime ?? {})
  const out: PositionLife[] = []
  const skipped: string[] = []
  positions.forEach((pos, i) => {
    if (pos.reference < 0) { skipped.push(`${pos.duty.positionName}: no part`); return }
    const choice = pos.choices[pos.reference]!
    const conv = sideInput(pos.side === 'dc-link' ? 'machine' : pos.side)!
    const ops = conv.operatingPoints
    const base = { side: pos.side, position: pos.duty.positionName, partNumber: choice.part.partNumber, assigned: pos.referenceAssigned }
    if (pos.duty.kind === 'capacitor') {
      const { part } = choice
      if (part.technology !== 'electrolytic') return
      if (part.capacitorRatedLife === undefined || part.capacitorRatedTemperature === undefined || part.capacitorRthHotSpot === undefined || part.esr === undefined) {
        skipped.push(`${pos.duty.positionName} (${part.partNumber}): the catalogue lacks rated life, its temperature, R_th hot spot or ESR`)
        return
      }
      const result = converters.find(c => c.side === (pos.side === 'grid' ? 'grid' : 'machine'))
      const pts = ops.map((op, k) => {
        const cap = result?.points[k]?.capacitors.find(c => c.name === pos.duty.positionName)
        const iRms = (cap?.rippleCurrentRms ?? pos.duty.currentRms) / choice.parallelCount
        return { pointName: op.name ?? `Point ${k + 1}`, hoursShare: op.hoursShare ?? 0, lossW: part.esr! * iRms * iRms }
      })
      const life = capacitorLife(pts, part.capacitorRatedLife, part.capacitorRatedTemperature, part.capacitorRthHotSpot, cooling.ambientTemperatureC)
      out.push({ ...base, lifeHours: life.lifeHours, perPoint: life.perPoint, method: 'L = L_rated·2^((T_rated − T_hot-spot)/10 K), Miner over the points', source: CAPACITOR_LIFE_SOURCE, notes: [] })
      return
    }
    const thermal = results[i]?.[pos.reference]
    if (!thermal) { skipped.push(`${pos.duty.positionName} (${choice.part.partNumber}): no junction temperature (loss or thermal figures missing)`); return }
    const mission = thermal.perPoint.map((d, k) => ({
      pointName: d.pointName,
      hoursShare: ops[k]?.hoursShare ?? 0,
      ...(ops[k]?.startsPerHour ? { startsPerHour: ops[k]!.startsPerHour } : {}),
      fundamentalHz: ops[k]?.fundamentalHz ?? 0,
      swingK: d.swingK,
      minC: d.minC,
      meanC: d.meanC,
      heatingTimeS: d.heatingTimeS,
    }))
    const life = powerCyclingLife(mission, choice.part.voltageRating, cooling.ambientTemperatureC, params)
    const notes = [...life.notes]
    if (!thermal.fromFoster) notes.push('single R_th: the swing is an upper bound, the life a lower bound')
    notes.push(edited.length ? `model parameters edited: ${edited.join(', ')}` : 'model parameters: the defaults (values from memory, editable)')
    out.push({ ...base, lifeHours: life.lifeHours, perPoint: life.perPoint, method: 'Power cycling N_f = K·ΔT_j^β1·e^(β2/(T_j,min + 273))·t_on^β3·I^β4·V^β5·D^β6 per fundamental cycle and per start, Miner\'s rule over the points', source: POWER_CYCLING_SOURCE, notes })
  })
  const limiting = out.reduce<PositionLife | null>((a, b) => (!a || b.lifeHours < a.lifeHours ? b : a), null)
  return { hoursShareTotal, positions: out, limiting: limiting && Number.isFinite(limiting.lifeHours) ? { side: limiting.side, position: limiting.position, lifeHours: limiting.lifeHours } : null, skipped }
}
