// How a topology is described as data (positions, nodes, switching states) and compiled once per
// level count into the weight tables the one generic integrator consumes.
import type { CapacitorKind, CapacitorRole, DeviceKind, Modulation, TopologyId } from './types'

/**
 * One device position of a phase leg. `nodes` is [collector / cathode node, emitter / anode node]:
 * the position blocks V(nodes[0]) − V(nodes[1]); an IGBT conducts nodes[0] → nodes[1], a diode nodes[1] → nodes[0].
 */
export interface PositionDef {
  name: string
  kind: DeviceKind
  nodes: [string, string]
  /** identical devices per phase at this position (cascaded cells); default 1 */
  countPerPhase?: number
  /** the position with the same stresses by half-wave symmetry */
  mirror?: string
  /** the switch this diode is anti-parallel to (schematic hint) */
  antiParallelTo?: string
  /** blocking voltage in units of the topology's unit voltage, when not derived from node voltages */
  blockingUnits?: number
  /** schematic slot: row from the positive rail down, column from the DC link rightwards */
  row: number
  column: number
}

/** One switching state of the leg. */
export interface StateDef {
  name: string
  /** output level 0 … modelLevels−1 (0 = negative rail) */
  level: number
  /** switches gated on */
  on: string[]
  /** node potentials in unit voltages (0 = negative rail); used to derive blocking voltages */
  nodeVoltages?: Record<string, number>
  /** positions carrying the phase current when it flows out of the leg (i > 0) */
  positive: string[]
  /** positions carrying it when it flows into the leg (i < 0) */
  negative: string[]
  /** share of its level's time in the [positive, negative] half wave of the reference; default: equal among the level's states */
  share?: [number, number]
}

export interface CapacitorDef {
  name: string
  kind: CapacitorKind
  /** what it is (shared/engine/types.ts CapacitorRole); the BOM and matching read this, never the name */
  role: CapacitorRole
  nodes: [string, string]
  /** DC voltage in unit voltages */
  voltageUnits: number
  /** how many of it the three-phase converter holds */
  countInConverter: number
  /** unit capacitors (rated one unit voltage) in series to realise it */
  seriesCount?: number
  /** split DC link: capacitor j sits between DC nodes j−1 and j (1-based) */
  splitIndex?: number
  row: number
  column: number
}

/**
 * How the reference becomes state shares. 'phase-disposition': level ⌊r⌋ or ⌊r⌋+1 (PD carriers);
 * 'phase-shifted' (flying capacitor) and 'phase-shifted-unipolar' (H-bridge cells) average to the
 * same level shares with redundant states rotated; 'input-averaged': every state an equal share (matrix).
 */
export type CarrierScheme = 'phase-disposition' | 'phase-shifted' | 'phase-shifted-unipolar' | 'input-averaged'

/** How the capacitor stresses are computed (capacitors.ts). */
export type CapacitorModel = 'split' | 'flying' | 'cell' | 'none'

export interface LegDefinition {
  /** level count of the state table (3 for one H-bridge cell, whatever the phase's level count) */
  modelLevels: number
  outputNode: string
  positions: PositionDef[]
  states: StateDef[]
  capacitors: CapacitorDef[]
  carrier: CarrierScheme
  capacitorModel: CapacitorModel
  /** H-bridge cells per phase (cascaded H-bridge) */
  cellsPerPhase?: number
  /** commutated voltage per switching event in unit voltages; default 1 (one level step) */
  commutationUnits?: number
}

/** What the DC voltage input means for a topology. */
export type SupplyKind = 'dc-link' | 'cell' | 'ac-input'

export interface TopologyDefinition {
  id: TopologyId
  /** our own wording for the UI */
  label: string
  description: string
  /** level counts accepted; 'ignored' for the matrix converter */
  allowedLevels: number[] | 'ignored'
  defaultLevels?: number
  modulations: Modulation[]
  supply: SupplyKind
  /** published source for structure, counts and blocking voltages */
  structureSource: string
  /** published source the device currents are checked against */
  currentSource: string
  /** extra sentence on the assumed switching pattern (shown in provenance) */
  patternNote?: string
  leg: (levels: number) => LegDefinition
  /** how the UI, the report and the BOM show it; read through the registry, never by switching on the id */
  presentation: TopologyPresentation
}

/** Which drawing rule of shared/drawing/leg.ts lays out the leg: a vertical string with side branches, nested cells, H-bridge cells, crosspoints. */
export type LegDrawingKind = 'stack' | 'ladder' | 'cells' | 'matrix'

/** One mark of a topology's 48 × 48 icon (stroked in the text colour): a path, a rectangle or a filled dot. */
export type IconMark = { path: string, thin?: boolean } | { rect: [x: number, y: number, w: number, h: number] } | { dot: [x: number, y: number] }

export interface TopologyPresentation {
  drawing: LegDrawingKind
  /** what one drawing shows: a phase leg of N levels, or one output phase (no levels) */
  drawnUnit: 'phase-leg' | 'output-phase'
  /** the level count belongs in the design's short name (results heading, BOM title) */
  levelsInName: boolean
  icon: IconMark[]
  /** form fields beyond those its supply kind implies */
  form: {
    /** the clamp diodes are series strings: ask for the unit diode's voltage */
    clampDiodeUnitVoltage?: boolean
    /** the AC input side's displacement factor, frequency and filter resonance (report inputs) */
    inputSide?: boolean
  }
}

/** Sparse list of (position index, weight) pairs. */
export interface WeightRow {
  index: Int32Array
  weight: Float64Array
}

export interface CompiledPosition extends Required<Pick<PositionDef, 'name' | 'kind' | 'nodes' | 'row' | 'column'>> {
  countPerPhase: number
  mirror?: string
  antiParallelTo?: string
  blockingUnits: number
  /** commutates at the switching frequency, so the overshoot adds to its blocking voltage */
  commutates: boolean
}

export interface CompiledLeg {
  topology: TopologyDefinition
  levels: number
  def: LegDefinition
  positions: CompiledPosition[]
  /** weights[halfWave 0 = reference ≥ 0, 1 = < 0][level][sign 0 = i ≥ 0, 1 = i < 0] */
  weights: WeightRow[][][]
}

const SHARE_TOLERANCE = 1e-9

/** Turns a leg definition into weight tables; checks the definition's internal consistency. */
export function compileLeg(topology: TopologyDefinition, levels: number): CompiledLeg {
  const def = topology.leg(levels)
  const L = def.modelLevels
  const indexOf = new Map<string, number>()
  def.positions.forEach((p, i) => {
    if (indexOf.has(p.name)) throw new Error(`${topology.id}: duplicate position ${p.name}`)
    indexOf.set(p.name, i)
  })
  const idx = (name: string, state: string): number => {
    const i = indexOf.get(name)
    if (i === undefined) throw new Error(`${topology.id}: state ${state} names unknown position ${name}`)
    return i
  }

  // Shares within a level: explicit, or equal among the level's states (rotation of redundant states).
  const perLevel = Array.from({ length: L }, () => [] as StateDef[])
  for (const s of def.states) {
    if (s.level < 0 || s.level >= L) throw new Error(`${topology.id}: state ${s.name} level ${s.level} out of range`)
    perLevel[s.level]!.push(s)
  }
  const shareOf = (s: StateDef, h: 0 | 1): number => s.share ? s.share[h] : 1 / perLevel[s.level]!.length
  for (let l = 0; l < L; l++) {
    for (const h of [0, 1] as const) {
      const sum = perLevel[l]!.reduce((a, s) => a + shareOf(s, h), 0)
      if (Math.abs(sum - 1) > SHARE_TOLERANCE) throw new Error(`${topology.id}: level ${l} shares sum to ${sum}`)
    }
  }

  const P = def.positions.length
  const weights: WeightRow[][][] = [0, 1].map(h =>
    perLevel.map(states => [0, 1].map((sign) => {
      const dense = new Float64Array(P)
      for (const s of states) {
        const share = shareOf(s, h as 0 | 1)
        for (const name of sign === 0 ? s.positive : s.negative) dense[idx(name, s.name)]! += share
      }
      const list: number[] = []
      dense.forEach((w, i) => { if (w > 0) list.push(i) })
      return { index: Int32Array.from(list), weight: Float64Array.from(list.map(i => dense[i]!)) }
    })),
  )

  const positions: CompiledPosition[] = def.positions.map((p, i) => ({
    name: p.name,
    kind: p.kind,
    nodes: p.nodes,
    row: p.row,
    column: p.column,
    countPerPhase: p.countPerPhase ?? 1,
    mirror: p.mirror,
    antiParallelTo: p.antiParallelTo,
    blockingUnits: p.blockingUnits ?? blockingFromStates(def, p, topology.id),
    commutates: def.carrier === 'input-averaged' || commutatesInPattern(weights, i, L),
  }))
  return { topology, levels, def, positions, weights }
}

/** Largest reverse voltage over all switching states: V(nodes[0]) − V(nodes[1]). */
export function blockingFromStates(def: LegDefinition, p: PositionDef, id = ''): number {
  let max = -Infinity
  for (const s of def.states) {
    const v = s.nodeVoltages
    if (!v) continue
    const hi = v[p.nodes[0]]
    const lo = v[p.nodes[1]]
    if (hi === undefined || lo === undefined) throw new Error(`${id}: state ${s.name} lacks a voltage for ${p.nodes.join('/')}`)
    max = Math.max(max, hi - lo)
  }
  if (!Number.isFinite(max)) throw new Error(`${id}: no node voltages to derive blocking of ${p.name}`)
  return max
}

/**
 * A position commutates when, within one half wave and one current sign, its conduction weight
 * differs between two adjacent levels that the PD carriers alternate between in that half wave.
 */
function commutatesInPattern(weights: WeightRow[][][], position: number, L: number): boolean {
  const w = (h: number, l: number, s: number): number => {
    const row = weights[h]![l]![s]!
    for (let k = 0; k < row.index.length; k++) if (row.index[k] === position) return row.weight[k]!
    return 0
  }
  const mid = (L - 1) / 2
  for (let l = 0; l + 1 < L; l++) {
    const halves = [l + 1 > mid ? 0 : -1, l < mid ? 1 : -1].filter(h => h >= 0)
    for (const h of halves) {
      for (const s of [0, 1]) {
        if (Math.abs(w(h, l, s) - w(h, l + 1, s)) > SHARE_TOLERANCE) return true
      }
    }
  }
  return false
}
