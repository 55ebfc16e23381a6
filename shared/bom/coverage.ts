// Module coverage: which positions of a phase leg one package fills. The slot counts come from the
// catalogue's package configurations (catalog/columns.ts PACKAGE_CONFIGURATIONS), the one place that
// says what a half-bridge, six-pack or three-level leg module holds.

import { PACKAGE_CONFIGURATIONS, type PackageConfiguration, type PartKind } from '../../catalog/columns'

/** One position of a phase leg (as legLayout gives it). */
export interface LegPosition {
  name: string
  kind: 'switch' | 'diode' | 'clamp-diode'
  countPerPhase: number
  /** nodes it connects; a half-bridge covers two switches sharing its midpoint */
  nodes?: readonly string[]
  /** the switch this diode is anti-parallel to (then a switch-with-diode part holds it in the same chip) */
  antiParallelTo?: string
}

export interface ModuleCoverage {
  /** the position the module was assigned to */
  host: string
  /** the other positions of the leg the same package fills */
  covers: string[]
  /** slots of the package no position uses, e.g. ["1 switch slot"] (shown once on the line, never priced apart) */
  unusedSlots: string[]
  /** phase legs one package spans (3 for a six-pack) */
  phasesPerPackage: number
}

/**
 * Positions of one leg that a package of `part` fills when assigned to `host`. Switch slots are filled
 * host first, then switches sharing a node with one already covered, then in leg order; a switch with
 * anti-parallel diode part also holds the diodes of the switches it covers; clamp-diode slots (NPC leg
 * module) fill the clamp positions. Each covered position takes `countPerPhase` slots; paralleled or
 * series parts are whole extra packages (modules are paralleled as modules), not extra slots.
 * Returns null when the part cannot serve the host.
 */
export function moduleCoverage(part: { kind: PartKind, packageConfiguration: PackageConfiguration }, host: string, leg: readonly LegPosition[]): ModuleCoverage | null {
  const cfg = PACKAGE_CONFIGURATIONS[part.packageConfiguration]
  const hostPosition = leg.find(p => p.name === host)
  if (!cfg || !hostPosition || !cfg.kinds.includes(part.kind)) return null
  const phases = Math.max(1, cfg.phasesPerPackage)
  const covered = new Set<string>([host])
  const unusedSlots: string[] = []
  const isSwitchPart = part.kind === 'switch-diode' || part.kind === 'switch'

  const fill = (kind: LegPosition['kind'], slotsPerPhase: number, label: string) => {
    if (slotsPerPhase <= 0) return
    let used = 0
    const chosen: LegPosition[] = []
    const take = (p: LegPosition) => {
      if (used + p.countPerPhase > slotsPerPhase || chosen.includes(p)) return false
      used += p.countPerPhase
      chosen.push(p)
      covered.add(p.name)
      return true
    }
    if (hostPosition.kind === kind && !take(hostPosition)) return
    // A diode host served through its anti-parallel switch: that switch takes the first slot (its own chip).
    const viaSwitch = kind === 'switch' && hostPosition.kind !== 'switch' ? leg.find(p => p.name === hostPosition.antiParallelTo) : undefined
    if (viaSwitch && !take(viaSwitch)) return
    const rest = leg.filter(p => p.kind === kind && p.name !== host && !p.antiParallelTo)
    // Prefer positions sharing a node with those already taken (a half-bridge's midpoint), then leg order.
    while (used < slotsPerPhase) {
      const nodes = new Set(chosen.flatMap(p => p.nodes ?? []))
      const next = rest.find(p => !covered.has(p.name) && used + p.countPerPhase <= slotsPerPhase && (p.nodes ?? []).some(n => nodes.has(n)))
        ?? rest.find(p => !covered.has(p.name) && used + p.countPerPhase <= slotsPerPhase)
      if (!next) break
      take(next)
    }
    if (used < slotsPerPhase) unusedSlots.push(`${(slotsPerPhase - used) * phases} ${label} slot${(slotsPerPhase - used) * phases > 1 ? 's' : ''}`)
  }

  if (isSwitchPart) {
    if (hostPosition.kind !== 'switch') {
      // A switch module assigned to a diode position serves it through the switch it is anti-parallel to.
      if (!(part.kind === 'switch-diode' && hostPosition.antiParallelTo)) return null
    }
    fill('switch', cfg.switches / phases, 'switch')
    if (part.kind === 'switch-diode') {
      for (const p of leg) if (p.antiParallelTo && covered.has(p.antiParallelTo)) covered.add(p.name)
      if (hostPosition.kind === 'diode' && hostPosition.antiParallelTo && !covered.has(hostPosition.antiParallelTo)) covered.add(hostPosition.antiParallelTo)
    }
    // Clamp diodes inside a three-level NPC leg module.
    if (part.kind === 'switch-diode' && part.packageConfiguration === 'npc-leg') fill('clamp-diode', cfg.clampDiodes / phases, 'clamp-diode')
  }
  else if (part.kind === 'diode') {
    const kind = hostPosition.kind === 'clamp-diode' ? 'clamp-diode' : 'diode'
    fill(kind, (kind === 'clamp-diode' ? cfg.clampDiodes : cfg.diodes) / phases, kind === 'clamp-diode' ? 'clamp-diode' : 'diode')
  }
  else return null

  return { host, covers: leg.filter(p => covered.has(p.name) && p.name !== host).map(p => p.name), unusedSlots, phasesPerPackage: phases }
}

/** Packages of a module per converter: one per `phasesPerPackage` legs, times whole modules in series and in parallel. */
export function modulePackagesPerConverter(coverage: Pick<ModuleCoverage, 'phasesPerPackage'>, phases: number, seriesCount: number, parallelCount: number): number {
  return Math.ceil(phases / coverage.phasesPerPackage) * seriesCount * parallelCount
}

/** One position of a converter side filled by the part of a group (same side, same part version). */
export interface GroupMember {
  position: string
  kind: LegPosition['kind']
  countPerPhase: number
  seriesCount: number
  parallelCount: number
  antiParallelTo?: string
  /** explicit host recorded with the assignment (module coverage) */
  coveredBy?: string | null
}

export interface PackedGroup {
  /** the position the packages are listed under */
  host: string
  /** packages per converter set */
  packagesPerConverter: number
  /** the other members: inside the host's packages, bought nowhere else */
  covered: { position: string, coveredBy: string }[]
  unusedSlots: string[]
}

/**
 * Packages of one part that fill every position of a side assigned to it: per phase, each slot kind
 * needs ceil(Σ countPerPhase × series × parallel / slots per phase) packages and the largest need wins;
 * times the package count across phases (a six-pack spans three). A switch-with-diode part holds the
 * anti-parallel diodes of its own switches at no extra slot. This is the one count of a module: a
 * position covered by a module is never bought a second time.
 */
export function packGroup(part: { kind: PartKind, packageConfiguration: PackageConfiguration }, members: readonly GroupMember[], phases: number, slotsOf: (kind: LegPosition['kind']) => number): PackedGroup {
  const cfg = PACKAGE_CONFIGURATIONS[part.packageConfiguration]
  const phasesPerPackage = Math.max(1, cfg?.phasesPerPackage ?? 1)
  const switches = new Set(members.filter(m => m.kind === 'switch').map(m => m.position))
  const inChip = (m: GroupMember) => m.kind === 'diode' && part.kind === 'switch-diode' && !!m.antiParallelTo && switches.has(m.antiParallelTo)
  // Slot kind each member uses: a diode position served by a switch-with-diode part uses a switch slot.
  const slotKind = (m: GroupMember): LegPosition['kind'] => (m.kind === 'diode' && part.kind === 'switch-diode' ? 'switch' : m.kind)
  const need = new Map<LegPosition['kind'], number>()
  for (const m of members) {
    if (inChip(m)) continue
    const k = slotKind(m)
    need.set(k, (need.get(k) ?? 0) + m.countPerPhase * m.seriesCount * m.parallelCount)
  }
  let perPhase = 0
  const perPhaseSlots = new Map<LegPosition['kind'], number>()
  for (const [k, n] of need) {
    const slots = Math.max(1, slotsOf(k) / phasesPerPackage)
    perPhaseSlots.set(k, slots)
    perPhase = Math.max(perPhase, Math.ceil(n / slots - 1e-9))
  }
  perPhase = Math.max(1, perPhase)
  const packagesPerConverter = perPhase * Math.ceil(phases / phasesPerPackage)
  const unusedSlots: string[] = []
  for (const [k, slots] of perPhaseSlots) {
    const unused = Math.round((perPhase * slots - need.get(k)!) * phases)
    if (unused > 0) unusedSlots.push(`${unused} ${k === 'clamp-diode' ? 'clamp-diode' : k} slot${unused > 1 ? 's' : ''} per converter`)
  }
  const explicitHost = members.find(m => m.coveredBy)?.coveredBy
  const host = (explicitHost && members.some(m => m.position === explicitHost) ? explicitHost : undefined)
    ?? members.find(m => m.kind === 'switch')?.position ?? members[0]!.position
  return { host, packagesPerConverter, covered: members.filter(m => m.position !== host).map(m => ({ position: m.position, coveredBy: host })), unusedSlots }
}
