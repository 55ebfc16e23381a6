// Which devices commutate, and with how much voltage, when a leg steps between two adjacent output
// levels: derived from the topology's state table (on-sets, conducting paths per current sign and
// node potentials), never listed by hand per topology.
//
// Rule (first principles of a hard-switched commutation cell): for a transition from state A to
// state B at a given current sign, a device that leaves the current path and blocks voltage in B
// loses energy — a switch its turn-off energy, a diode its reverse-recovery energy; a switch that
// enters the path and blocked voltage in A loses its turn-on energy; a diode taking over the current
// is taken as lossless (forward recovery neglected, common practice). The energy is scaled by the
// voltage that device commutates: its blocking voltage in the state where it does not conduct.
import type { CompiledLeg, StateDef } from './model'
import { gridTrig, valuesOnGrid } from './modulation'

export type CommutationRole = 'turn-on' | 'turn-off' | 'recovery'

/** One loss event of one device in one transition at one current sign. */
export interface CommutationEvent {
  /** index into leg.positions */
  position: number
  role: CommutationRole
  /** voltage commutated, in unit voltages of the state table */
  units: number
}

/** The switch and the diode (or second switch) between which the current moves. */
export interface CommutationPair {
  /** hard-switched switch */
  switch: string
  switchRole: 'turn-on' | 'turn-off'
  /** the device giving up (turn-on) or taking over (turn-off) the current */
  partner: string
  units: number
}

export interface Transition {
  from: string
  to: string
  /** events for phase current ≥ 0 and < 0 */
  events: [CommutationEvent[], CommutationEvent[]]
  pairs: [CommutationPair[], CommutationPair[]]
}

/** Transitions between level l and l + 1 (both directions) with their share of the carrier's steps. */
export interface LevelStep {
  lower: number
  /** each pair of states the carrier steps between, with its share (shares sum to 1) */
  routes: { share: number, up: Transition, down: Transition }[]
}

export interface CommutationTable {
  /** false when the state table lacks node potentials (matrix converter) */
  available: boolean
  reason?: string
  /** steps[halfWave][lower level] */
  steps: LevelStep[][]
  /** up-steps (and as many down-steps) per carrier period between the two active levels */
  stepsPerCarrier: number
  /** flat per (half wave, lower level, sign): Σ share·stepsPerCarrier·units per position and role, up and down together */
  weights: Float64Array[][][]
}

const EPS = 1e-9
export const ROLES: readonly CommutationRole[] = ['turn-on', 'turn-off', 'recovery']

function blocking(leg: CompiledLeg, state: StateDef, position: number): number {
  const [hi, lo] = leg.positions[position]!.nodes
  const v = state.nodeVoltages!
  return (v[hi] ?? 0) - (v[lo] ?? 0)
}

/** The loss events and commutation pairs of one transition A → B at one current sign. */
export function transitionEvents(leg: CompiledLeg, a: StateDef, b: StateDef, sign: 0 | 1): { events: CommutationEvent[], pairs: CommutationPair[] } {
  const indexOf = new Map(leg.positions.map((p, i) => [p.name, i]))
  const path = (s: StateDef) => new Set((sign === 0 ? s.positive : s.negative).map(n => indexOf.get(n)!))
  const before = path(a)
  const after = path(b)
  const events: CommutationEvent[] = []
  const leaving: { position: number, units: number }[] = []
  const entering: { position: number, units: number }[] = []
  for (const p of before) {
    if (after.has(p)) continue
    const units = blocking(leg, b, p)
    if (units <= EPS) continue
    leaving.push({ position: p, units })
    events.push({ position: p, role: leg.positions[p]!.kind === 'switch' ? 'turn-off' : 'recovery', units })
  }
  for (const p of after) {
    if (before.has(p)) continue
    const units = blocking(leg, a, p)
    if (units <= EPS) continue
    entering.push({ position: p, units })
    if (leg.positions[p]!.kind === 'switch') events.push({ position: p, role: 'turn-on', units })
  }
  // Pairs: a switch turning off hands the current to a device entering; a switch turning on takes it from a device leaving.
  const pairs: CommutationPair[] = []
  const name = (p: number) => leg.positions[p]!.name
  const isSwitch = (p: number) => leg.positions[p]!.kind === 'switch'
  for (const off of leaving.filter(d => isSwitch(d.position))) {
    for (const to of entering) pairs.push({ switch: name(off.position), switchRole: 'turn-off', partner: name(to.position), units: off.units })
  }
  for (const on of entering.filter(d => isSwitch(d.position))) {
    for (const from of leaving) pairs.push({ switch: name(on.position), switchRole: 'turn-on', partner: name(from.position), units: on.units })
  }
  return { events, pairs }
}

function distance(a: StateDef, b: StateDef): number {
  const on = new Set(a.on)
  const other = new Set(b.on)
  let d = 0
  for (const s of on) if (!other.has(s)) d++
  for (const s of other) if (!on.has(s)) d++
  return d
}

/**
 * Which pairs of states the carrier steps between: within a half wave, among the states of the two
 * levels that are used there (share > 0), those whose gate patterns differ least (one commutation
 * cell toggles), each pair weighted by the product of the two states' shares.
 */
export function deriveCommutations(leg: CompiledLeg): CommutationTable {
  const cached = tables.get(leg)
  if (cached) return cached
  const table = buildTable(leg)
  tables.set(leg, table)
  return table
}

const tables = new WeakMap<CompiledLeg, CommutationTable>()

function buildTable(leg: CompiledLeg): CommutationTable {
  const def = leg.def
  const L = def.modelLevels
  const P = leg.positions.length
  const stepsPerCarrier = def.carrier === 'phase-shifted' ? L - 1 : def.carrier === 'phase-shifted-unipolar' ? 2 : 1
  const empty = (): Float64Array[][][] => [0, 1].map(() => Array.from({ length: Math.max(0, L - 1) }, () => [0, 1].map(() => new Float64Array(P * ROLES.length))))
  if (def.carrier === 'input-averaged' || def.states.some(s => !s.nodeVoltages)) {
    return { available: false, reason: 'the state table has no node potentials (input-averaged switching model)', steps: [[], []], stepsPerCarrier, weights: empty() }
  }
  const perLevel = Array.from({ length: L }, () => [] as StateDef[])
  for (const s of def.states) perLevel[s.level]!.push(s)
  const shareOf = (s: StateDef, h: 0 | 1) => s.share ? s.share[h] : 1 / perLevel[s.level]!.length
  const weights = empty()
  const steps: LevelStep[][] = [0, 1].map((h) => {
    const half = h as 0 | 1
    return Array.from({ length: L - 1 }, (_, l): LevelStep => {
      const lows = perLevel[l]!.filter(s => shareOf(s, half) > EPS)
      const highs = perLevel[l + 1]!.filter(s => shareOf(s, half) > EPS)
      let best = Infinity
      for (const a of lows) for (const b of highs) best = Math.min(best, distance(a, b))
      const chosen: { a: StateDef, b: StateDef, w: number }[] = []
      for (const a of lows) for (const b of highs) if (distance(a, b) === best) chosen.push({ a, b, w: shareOf(a, half) * shareOf(b, half) })
      const total = chosen.reduce((s, c) => s + c.w, 0)
      const routes = chosen.map(({ a, b, w }) => {
        const make = (x: StateDef, y: StateDef): Transition => {
          const pos = transitionEvents(leg, x, y, 0)
          const neg = transitionEvents(leg, x, y, 1)
          return { from: x.name, to: y.name, events: [pos.events, neg.events], pairs: [pos.pairs, neg.pairs] }
        }
        return { share: w / total, up: make(a, b), down: make(b, a) }
      })
      for (const route of routes) {
        for (const sign of [0, 1] as const) {
          const row = weights[h]![l]![sign]!
          for (const e of [...route.up.events[sign], ...route.down.events[sign]]) row[e.position * ROLES.length + ROLES.indexOf(e.role)]! += route.share * stepsPerCarrier * e.units
        }
      }
      return { lower: l, routes }
    })
  })
  return { available: true, steps, stepsPerCarrier, weights }
}

/** Per position: mean over the fundamental period of Σ |i|·v over the commutations of one carrier period, split by role (V·A). */
export interface SwitchingDuty {
  turnOn: number
  turnOff: number
  recovery: number
}

/** The non-zero entries of each weights row, kept once per table (most positions do not switch at a given level). */
function sparseWeights(table: CommutationTable): { index: Int32Array, weight: Float64Array }[][][] {
  let rows = sparseRows.get(table)
  if (!rows) {
    rows = table.weights.map(half => half.map(level => level.map((row) => {
      const index = Int32Array.from(Array.from(row).flatMap((w, q) => (w !== 0 ? [q] : [])))
      return { index, weight: Float64Array.from(index, q => row[q]!) }
    })))
    sparseRows.set(table, rows)
  }
  return rows
}

const sparseRows = new WeakMap<CommutationTable, { index: Int32Array, weight: Float64Array }[][][]>()

/** Per-angle sums of integrateSwitching: `sums[(bin·positions + position)·3 + role]`, the same units as its sum before the mean. */
export interface SwitchingBins {
  bins: number
  sums: Float64Array
}

/**
 * Integrates the commutations over one fundamental period: at each angle the PD level shares give
 * the two levels the carrier steps between; every carrier period has `stepsPerCarrier` up- and
 * down-steps between them, each charging its events with the current at that instant. Where the
 * reference sits on a level (share 1: clamping, six-step) the carrier causes no step; six-step legs
 * instead step once per level change of the reference, at the fundamental (= the switching frequency).
 * `unitVoltage` turns unit voltages into volts. Returns null when the table is not available.
 */
export function integrateSwitching(
  leg: CompiledLeg,
  table: CommutationTable,
  reference: (theta: number) => number,
  currentPeak: number,
  phi: number,
  unitVoltage: number,
  options: { points: number, sixStep?: boolean, binned?: SwitchingBins, sampled?: Float64Array },
): SwitchingDuty[] | null {
  if (!table.available) return null
  const P = leg.positions.length
  const R = ROLES.length
  const L = leg.def.modelLevels
  const sum = new Float64Array(P * R)
  const sparse = sparseWeights(table)
  const points = options.points
  const dTheta = (2 * Math.PI) / points
  let previousLevel = -1
  // Optional per-angle record (instantaneous losses for the thermal time-stepping): the same sums by angle bin.
  const binned = options.binned
  const binOf = (theta: number) => Math.min(binned!.bins - 1, Math.max(0, Math.floor((((theta % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)) / (2 * Math.PI) * binned!.bins)))
  const levelAt = (m: number) => {
    const r = ((1 + m) * (L - 1)) / 2
    const lo = Math.max(0, Math.min(Math.floor(r), L - 2))
    return { lo, f: r - lo }
  }
  const stepAt = (theta: number, from: number, to: number, half: 0 | 1) => {
    // Six-step: one transition per level change; charge its events (not averaged over the period).
    const i = currentPeak * Math.sin(theta - phi)
    const sign = i >= 0 ? 0 : 1
    const lower = Math.min(from, to)
    for (const route of table.steps[half]![lower]!.routes) {
      const t = to > from ? route.up : route.down
      for (const e of t.events[sign]) {
        const q = e.position * R + ROLES.indexOf(e.role)
        sum[q]! += route.share * e.units * Math.abs(i) * points
        if (binned) binned.sums[binOf(theta) * P * R + q]! += route.share * e.units * Math.abs(i) * points
      }
    }
  }
  // `sampled`: the caller's reference at these same angles (θ_k = (k + ½)·2π/points), computed once for both loops;
  // a grid reference of the same grid carries them already.
  const onGrid = valuesOnGrid(reference, points)
  // Without the per-angle record, |i| is summed per (half wave, lower level, sign) and each sparse row applied once.
  const moments = binned || options.sixStep ? undefined : new Float64Array(2 * L * 2)
  const trig = gridTrig(points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  for (let k = 0; k < points; k++) {
    const theta = (k + 0.5) * dTheta
    const m = options.sampled ? options.sampled[k]! : onGrid ? onGrid[3 * k + 1]! : reference(theta)
    const half: 0 | 1 = m >= 0 ? 0 : 1
    const { lo, f } = levelAt(m)
    if (options.sixStep) {
      const level = f >= 0.5 ? lo + 1 : lo
      if (previousLevel >= 0 && level !== previousLevel) stepAt(theta - dTheta / 2, previousLevel, level, half)
      previousLevel = level
      continue
    }
    if (f <= EPS || f >= 1 - EPS) continue
    const i = currentPeak * (trig.sin[k]! * cosPhi - trig.cos[k]! * sinPhi)
    const ai = Math.abs(i)
    if (moments) {
      moments[(half * L + lo) * 2 + (i >= 0 ? 0 : 1)]! += ai
      continue
    }
    const row = sparse[half]![lo]![i >= 0 ? 0 : 1]!
    for (let q = 0; q < row.index.length; q++) sum[row.index[q]!]! += row.weight[q]! * ai
    if (binned) {
      const base = binOf(theta) * P * R
      for (let q = 0; q < row.index.length; q++) binned.sums[base + row.index[q]!]! += row.weight[q]! * ai
    }
  }
  if (moments) {
    for (let h = 0; h < 2; h++) {
      for (let l = 0; l < L - 1; l++) {
        for (let sign = 0; sign < 2; sign++) {
          const ai = moments[(h * L + l) * 2 + sign]!
          if (ai === 0) continue
          const row = sparse[h]![l]![sign]!
          for (let q = 0; q < row.index.length; q++) sum[row.index[q]!]! += row.weight[q]! * ai
        }
      }
    }
  }
  if (options.sixStep && previousLevel >= 0) {
    // close the period: the step from the last sample back to the first
    const m0 = reference(0.5 * dTheta)
    const { lo, f } = levelAt(m0)
    const first = f >= 0.5 ? lo + 1 : lo
    if (first !== previousLevel) stepAt(2 * Math.PI, previousLevel, first, m0 >= 0 ? 0 : 1)
  }
  const out: SwitchingDuty[] = []
  for (let p = 0; p < P; p++) {
    out.push({
      turnOn: (sum[p * R]! / points) * unitVoltage,
      turnOff: (sum[p * R + 1]! / points) * unitVoltage,
      recovery: (sum[p * R + 2]! / points) * unitVoltage,
    })
  }
  return out
}
