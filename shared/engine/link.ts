// The one DC link a back-to-back pair shares: which grid sides fit the machine side's link, the link
// capacitors' combined current (both converters switching), one bank sized for it, and the power balance.
import { DEFAULT_RIPPLE_FRACTION, splitLinkCurrents, withSwitchedCharge, type CurrentFigures, type SplitLinkDetail } from './capacitors'
import { EngineInputError } from './errors'
import { DEFAULT_INTEGRATION_POINTS } from './integrate'
import { makeReference, SIX_STEP_INDEX } from './modulation'
import { topologies, topologyById } from './topologies'
import type {
  CapacitorEnvelope, ConverterInput, ConverterResult, DeratingPolicy, LinkCarriers, LinkPointPair, OperatingPoint, SharedLinkCapacitor, SharedLinkResult, StressInput, TopologyId,
} from './types'
import { legFor, resolveStressInput } from './validate'

/** Roles of the capacitors that sit on the DC link itself (the bank a back-to-back pair shares). */
const LINK_ROLES = new Set(['dc-link', 'split'])
export const isLinkCapacitor = (c: { role: string }) => LINK_ROLES.has(c.role)

/**
 * DC nodes the three legs of a topology draw current from (2: the rails only; N for a diode-clamped
 * N-level leg), or null when it has no DC link to share (cell supplies, the matrix converter).
 * A flying-capacitor leg switches the rails with its outermost cell, so its link is a two-node link.
 */
export function linkNodes(topology: TopologyId, levels?: number): number | null {
  const t = topologyById[topology]
  if (!t || t.supply !== 'dc-link') return null
  const n = levels ?? t.defaultLevels ?? (t.allowedLevels === 'ignored' ? undefined : t.allowedLevels[0])
  if (n === undefined || t.allowedLevels === 'ignored' || !t.allowedLevels.includes(n)) return null
  const model = legFor(t, n).def
  if (model.capacitorModel === 'split') return model.modelLevels
  if (model.capacitorModel === 'flying') return 2
  return null
}

/** Grid-side topologies (with their level counts) that fit the machine side's DC link; empty when it has none. */
export function compatibleGridSides(topology: TopologyId, levels?: number): { topology: TopologyId, levels: number[] }[] {
  const nodes = linkNodes(topology, levels)
  if (nodes === null) return []
  return topologies.flatMap((t) => {
    if (t.allowedLevels === 'ignored') return []
    const fit = t.allowedLevels.filter(n => linkNodes(t.id, n) === nodes)
    return fit.length ? [{ topology: t.id, levels: fit }] : []
  })
}

/** The grid side on the machine side's DC link: same link structure and voltages; levels default to the machine side's when they fit. */
export function gridInput(machine: ConverterInput, grid: ConverterInput): ConverterInput {
  if (typeof grid !== 'object' || grid === null) throw new EngineInputError('gridSide', 'gridSide must be an object')
  const machineNodes = linkNodes(machine.topology, machine.levels)
  if (machineNodes === null) throw new EngineInputError('gridSide', `a ${topologyById[machine.topology]?.label ?? machine.topology} machine side has no DC link to share with a grid-side converter`)
  const fits = compatibleGridSides(machine.topology, machine.levels)
  const match = fits.find(f => f.topology === grid.topology)
  const names = fits.map(f => `${f.topology}${f.levels.length > 1 || f.levels[0] !== 2 ? ` (N = ${f.levels.join(', ')})` : ''}`).join(', ')
  if (!match) throw new EngineInputError('gridSide.topology', `gridSide.topology must share the machine side's DC link (${machineNodes} DC nodes): one of ${names}`)
  const levels = grid.levels ?? (grid.topology === machine.topology ? machine.levels : undefined) ?? (match.levels.length === 1 ? match.levels[0] : undefined)
  if (levels === undefined || !match.levels.includes(levels)) {
    throw new EngineInputError('gridSide.levels', `gridSide.levels must be one of ${match.levels.join(', ')} for a ${grid.topology} grid side on this DC link (${machineNodes} DC nodes)`)
  }
  for (const key of ['dcVoltage', 'dcVoltageMax'] as const) {
    if (grid[key] !== undefined && machine[key] !== undefined && grid[key] !== machine[key]) {
      throw new EngineInputError(`gridSide.${key}`, `gridSide.${key} must equal machineSide.${key} (${machine[key]}): shared DC link`)
    }
  }
  return { ...grid, levels, dcVoltage: grid.dcVoltage ?? machine.dcVoltage, dcVoltageMax: grid.dcVoltageMax ?? machine.dcVoltageMax }
}

/**
 * Samples per fundamental period of each side for the worst-case search over both angles (every 22nd of the 2046
 * integration points, 3.9°: the charge is flat at its extremes, so the search is within about 6e-4 of the peak).
 */
const PAIR_GRID = 93
/** Bins of the carrier value for the carrier-synchronous correlation. */
const CARRIER_BINS = 4096

/** One side at one operating point, tabulated for combining. */
interface SideTab {
  figures: CurrentFigures[]
  /** C per capacitor, the switched charge with the carrier locked to this side's fundamental beyond its quasi-static charge (≥ 0) */
  lockedExcess: Float64Array
  /** C, low-frequency charge of capacitor j at the centre of sample k: q[j·n + k] (n = PAIR_GRID) */
  charge: Float64Array
  /** carrier bounds (5 per sample) and the within-period charge path P at them (per unit of i·T_sw/2), J·5 per sample */
  bounds: Float64Array
  path: Float64Array
  /** ∫ over each carrier bin of the θ-averaged capacitor current, per capacitor: profile[j·BINS + b] (A per unit carrier) */
  profile: Float64Array
  switchingHz: number
}

function tabulate(conv: ConverterInput, op: OperatingPoint, links: number, points: number): SideTab {
  const { operatingPoints: _points, ...converter } = conv
  const input: StressInput = { ...converter, ...op }
  const p = resolveStressInput(input)
  const amplitude = p.modulation === 'six-step' ? SIX_STEP_INDEX : (Math.SQRT2 * p.lineVoltageRms) / Math.sqrt(3) / (p.dcVoltage / 2)
  const reference = makeReference(p.modulation, amplitude)
  const J = links - 1
  const detail: SplitLinkDetail = { bounds: new Float64Array(5 * points), values: new Float64Array(4 * J * points), charged: new Float64Array(J * points) }
  const quasiStatic = splitLinkCurrents(links, reference, Math.SQRT2 * p.phaseCurrentRms, p.currentPhaseAngle, points, p.switchingHz, p.fundamentalHz, detail)
  const figures = withSwitchedCharge(quasiStatic, links, { reference, currentPeak: Math.SQRT2 * p.phaseCurrentRms, phi: p.currentPhaseAngle, switchingHz: p.switchingHz, fundamentalHz: p.fundamentalHz })
  // What the carrier locked to this side's fundamental adds to its quasi-static charge (capacitors.ts withSwitchedCharge).
  const lockedExcess = Float64Array.from(figures, (f, j) => f.charge - quasiStatic[j]!.charge)
  const stride = points / PAIR_GRID
  if (!Number.isInteger(stride)) throw new Error(`shared link: ${points} integration points are not a multiple of ${PAIR_GRID}`)
  const n = PAIR_GRID
  const charge = new Float64Array(J * n)
  const bounds = new Float64Array(5 * n)
  const path = new Float64Array(5 * J * n)
  const profile = new Float64Array(J * CARRIER_BINS)
  const diff = new Float64Array(J * (CARRIER_BINS + 1))
  const w = 1 / CARRIER_BINS
  const dt = 1 / (p.fundamentalHz * points)
  // Low-frequency charge (as in capacitors.ts `figures`): the natural-sampled average integrated to each sample's centre.
  for (let j = 0; j < J; j++) {
    let mean = 0
    for (let k = 0; k < points; k++) mean += detail.charged[j * points + k]!
    mean /= points
    let q = 0
    for (let k = 0; k < points; k++) {
      const dq = (detail.charged[j * points + k]! - mean) * dt
      if (k % stride === 0) charge[j * n + k / stride] = q + 0.5 * dq
      q += dq
    }
  }
  // Ramp of height v from carrier value x to 1, accumulated bin by bin (exact integral per bin).
  const ramp = (j: number, x: number, v: number) => {
    const b = Math.min(CARRIER_BINS - 1, Math.floor(x * CARRIER_BINS))
    profile[j * CARRIER_BINS + b]! += v * ((b + 1) * w - x)
    diff[j * (CARRIER_BINS + 1) + b + 1]! += v
  }
  for (let k = 0; k < points; k++) {
    const bk = detail.bounds.subarray(5 * k, 5 * k + 5)
    const keep = k % stride === 0
    if (keep) bounds.set(bk, 5 * (k / stride))
    for (let j = 0; j < J; j++) {
      let avg = 0
      for (let q = 0; q < 4; q++) avg += (bk[q + 1]! - bk[q]!) * detail.values[(4 * k + q) * J + j]!
      let acc = 0
      for (let q = 0; q < 4; q++) {
        const v = detail.values[(4 * k + q) * J + j]!
        const len = bk[q + 1]! - bk[q]!
        if (len > 0) { ramp(j, bk[q]!, v / points); ramp(j, bk[q + 1]!, -v / points) }
        if (keep) {
          acc += len * (v - avg)
          path[(5 * (k / stride) + q + 1) * J + j] = acc
        }
      }
      if (keep) path[5 * (k / stride) * J + j] = 0
    }
  }
  for (let j = 0; j < J; j++) {
    let level = 0
    for (let b = 0; b < CARRIER_BINS; b++) {
      level += diff[j * (CARRIER_BINS + 1) + b]!
      profile[j * CARRIER_BINS + b]! += level * w
    }
  }
  return { figures, lockedExcess, charge, bounds, path, profile, switchingHz: p.switchingHz }
}

/** The within-period path of one side at carrier value c (linear between its bounds). */
function pathAt(t: SideTab, k: number, j: number, J: number, c: number): number {
  const b = t.bounds
  for (let q = 0; q < 4; q++) {
    const lo = b[5 * k + q]!
    const hi = b[5 * k + q + 1]!
    if (c <= hi || q === 3) {
      const p0 = t.path[(5 * k + q) * J + j]!
      const p1 = t.path[(5 * k + q + 1) * J + j]!
      return hi > lo ? p0 + ((p1 - p0) * (c - lo)) / (hi - lo) : p1
    }
  }
  return 0
}

interface Combined { rmsSynchronised?: number, rmsIndependent: number, chargeSynchronised?: number, chargeIndependent: number, mean: number }

/**
 * Capacitor j's current with both converters on the link (ripple-free DC source current, as each side alone).
 * Independent carriers: the two ripple currents are uncorrelated, so their mean squares add (RSS), and every
 * alignment of the two sides' charge swings occurs in time, so the charges add. One common carrier (same
 * f_sw, in phase): the within-period currents correlate through the common carrier value c, so
 * var = var_m + var_g + 2·(∫Ā_m·Ā_g dc − mean_m·mean_g) with Ā the carrier-value profile averaged over the
 * fundamental (the two fundamentals' relative phase taken as uniformly distributed: they are not locked);
 * the charge is the worst over both angles of the low-frequency charges plus the combined within-period swing.
 */
function combine(m: SideTab, g: SideTab, j: number, J: number): Combined {
  const fm = m.figures[j]!
  const fg = g.figures[j]!
  const rmsIndependent = Math.hypot(fm.rms, fg.rms)
  const chargeIndependent = fm.charge + fg.charge
  const out: Combined = { rmsIndependent, chargeIndependent, mean: fm.mean + fg.mean }
  if (m.switchingHz !== g.switchingHz) return out
  let cross = 0
  for (let b = 0; b < CARRIER_BINS; b++) cross += m.profile[j * CARRIER_BINS + b]! * g.profile[j * CARRIER_BINS + b]!
  const cov = cross * CARRIER_BINS - fm.mean * fg.mean
  out.rmsSynchronised = Math.sqrt(Math.max(0, fm.rms ** 2 + fg.rms ** 2 + 2 * cov))
  // Worst case over both angles: the combined path is linear between the union of both sides' bounds.
  const toCharge = 1 / (2 * m.switchingHz)
  let hi = -Infinity
  let lo = Infinity
  for (let km = 0; km < PAIR_GRID; km++) {
    const qm = m.charge[j * PAIR_GRID + km]!
    for (let kg = 0; kg < PAIR_GRID; kg++) {
      let peak = 0
      for (let q = 1; q < 4; q++) {
        const cm = m.bounds[5 * km + q]!
        const a = Math.abs(m.path[(5 * km + q) * J + j]! + pathAt(g, kg, j, J, cm))
        if (a > peak) peak = a
        const cg = g.bounds[5 * kg + q]!
        const b = Math.abs(g.path[(5 * kg + q) * J + j]! + pathAt(m, km, j, J, cg))
        if (b > peak) peak = b
      }
      const centre = qm + g.charge[j * PAIR_GRID + kg]!
      const swing = peak * toCharge
      if (centre + swing > hi) hi = centre + swing
      if (centre - swing < lo) lo = centre - swing
    }
  }
  // Each side's locked-carrier excess on top: the quasi-static charges combined above average out the jumps that a
  // carrier locked to a fundamental makes at its reference's kinks (space-vector references near pf ±1).
  out.chargeSynchronised = hi - lo + m.lockedExcess[j]! + g.lockedExcess[j]!
  return out
}

const SQRT3 = Math.sqrt(3)
/** W and var at a converter's AC terminals from the produced fundamental. */
function powerOf(point: ConverterResult['points'][number], op: OperatingPoint) {
  const s = SQRT3 * point.lineVoltageFundamentalRms * op.phaseCurrentRms
  const phi = point.powerFactor.currentPhaseAngle
  return { p: s * Math.cos(phi), q: s * Math.sin(phi) }
}

/** Machine and grid points that run together: the same name, else the same index (equal counts), else the closest balancing power; every point in at least one pair. */
function pairPoints(mPower: number[], gPower: number[], mNames: string[], gNames: string[]): { m: number, g: number, by: LinkPointPair['pairedBy'] }[] {
  const pairs: { m: number, g: number, by: LinkPointPair['pairedBy'] }[] = []
  const usedG = new Set<number>()
  const nearest = (target: number, list: number[]) => list.reduce((best, p, i) => (Math.abs(p - target) < Math.abs(list[best]! - target) ? i : best), 0)
  mNames.forEach((name, m) => {
    const byName = gNames.indexOf(name)
    const g = byName >= 0 ? byName : mNames.length === gNames.length ? m : nearest(mPower[m]!, gPower)
    pairs.push({ m, g, by: byName >= 0 ? 'name' : mNames.length === gNames.length ? 'index' : 'nearest power' })
    usedG.add(g)
  })
  gNames.forEach((_, g) => {
    if (!usedG.has(g)) pairs.push({ m: nearest(gPower[g]!, mPower), g, by: 'nearest power' })
  })
  return pairs
}

const fmt = (v: number) => Number(v.toPrecision(3)).toString()

/**
 * The shared DC link of a back-to-back design: the machine side's link capacitors become one bank rated
 * and sized from both converters' combined current at every operating-point pair.
 */
export function sharedLink(machine: ConverterInput, grid: ConverterInput, results: [ConverterResult, ConverterResult], derating: DeratingPolicy, rippleTarget: number | undefined, carriers: LinkCarriers, points = DEFAULT_INTEGRATION_POINTS): SharedLinkResult {
  const [mr, gr] = results
  const links = linkNodes(machine.topology, machine.levels)!
  const J = links - 1
  const mPow = machine.operatingPoints.map((op, i) => powerOf(mr.points[i]!, op))
  // The grid side takes power in: its regeneration sign (power from its AC side into the link) is positive here.
  const gPow = grid.operatingPoints.map((op, i) => { const x = powerOf(gr.points[i]!, op); return { p: -x.p, q: x.q } })
  const pairs = pairPoints(mPow.map(x => x.p), gPow.map(x => x.p), mr.points.map(p => p.pointName), gr.points.map(p => p.pointName))
  const mTabs = new Map<number, SideTab>()
  const gTabs = new Map<number, SideTab>()
  const tabOf = (cache: Map<number, SideTab>, conv: ConverterInput, i: number) => {
    let t = cache.get(i)
    if (!t) { t = tabulate(conv, conv.operatingPoints[i]!, links, points); cache.set(i, t) }
    return t
  }
  // Link capacitors of the machine side's definition, in their per-point order; capacitor j+1 of the split link is splitIndex j+1.
  const defs = mr.points[0]!.capacitors.filter(isLinkCapacitor)
  const splitOf = (name: string) => legFor(topologyById[machine.topology], machine.levels ?? topologyById[machine.topology].defaultLevels ?? 2).def.capacitors.find(c => c.name === name)?.splitIndex ?? 1
  const dcMax = machine.dcVoltageMax ?? machine.dcVoltage!
  const dcNominal = machine.dcVoltage!
  const worst = defs.map(() => ({ sync: 0, indep: 0, qSync: 0, qIndep: 0, at: { sync: '', indep: '', qSync: '', qIndep: '' } }))
  const pairOut: LinkPointPair[] = pairs.map(({ m, g, by }) => {
    const mt = tabOf(mTabs, machine, m)
    const gt = tabOf(gTabs, grid, g)
    const name = `${mr.points[m]!.pointName} + ${gr.points[g]!.pointName}`
    const ripple: LinkPointPair['rippleCurrentRms'] = {}
    defs.forEach((d, k) => {
      const c = combine(mt, gt, splitOf(d.name) - 1, J)
      ripple[d.name] = { ...(c.rmsSynchronised !== undefined ? { synchronised: c.rmsSynchronised } : {}), independent: c.rmsIndependent }
      const w = worst[k]!
      if (c.rmsIndependent > w.indep) { w.indep = c.rmsIndependent; w.at.indep = name }
      if ((c.rmsSynchronised ?? 0) > w.sync) { w.sync = c.rmsSynchronised!; w.at.sync = name }
      if (c.chargeIndependent > w.qIndep) { w.qIndep = c.chargeIndependent; w.at.qIndep = name }
      if ((c.chargeSynchronised ?? 0) > w.qSync) { w.qSync = c.chargeSynchronised!; w.at.qSync = name }
    })
    const pm = mPow[m]!
    const pg = gPow[g]!
    const scale = Math.max(Math.abs(pm.p), Math.abs(pg.p), 1e-9)
    return {
      machinePoint: mr.points[m]!.pointName,
      gridPoint: gr.points[g]!.pointName,
      pairedBy: by,
      machinePowerW: pm.p,
      gridPowerW: pg.p,
      machineReactiveVar: pm.q,
      gridReactiveVar: pg.q,
      imbalanceW: pg.p - pm.p,
      balanced: Math.abs(pg.p - pm.p) <= 0.05 * scale,
      rippleCurrentRms: ripple,
    }
  })
  const synchronisable = machine.switchingHz === grid.switchingHz
  const assumption = carriers === 'synchronised'
    ? `one common carrier: both converters switch at ${fmt(machine.switchingHz)} Hz with their triangular carriers in phase`
    : 'independent carriers: the two converters\' ripple currents are uncorrelated (RSS) and, in time, every alignment of their charge swings occurs'
  const capacitors: SharedLinkCapacitor[] = defs.map((d, k) => {
    const w = worst[k]!
    const nominal = (d.voltage * dcNominal) / dcMax
    const target = rippleTarget ?? DEFAULT_RIPPLE_FRACTION * nominal
    const sync = carriers === 'synchronised'
    const rms = sync ? w.sync : w.indep
    const charge = sync ? w.qSync : w.qIndep
    const env: SharedLinkCapacitor = {
      name: d.name,
      kind: d.kind,
      role: d.role,
      side: 'shared',
      count: d.count,
      voltage: d.voltage,
      ...(d.seriesCount !== undefined ? { seriesCount: d.seriesCount } : {}),
      rippleCurrentRms: rms,
      ...(synchronisable ? { rippleCurrentRmsSynchronised: w.sync, capacitanceSynchronised: w.qSync / target } : {}),
      rippleCurrentRmsIndependent: w.indep,
      capacitanceIndependent: w.qIndep / target,
      capacitanceRequired: charge / target,
      rippleTarget: target,
      requiredVoltageRating: 0,
      requiredRippleRating: rms / derating.capacitorRippleUtilisation,
      worstPoint: { voltage: '', rippleCurrentRms: sync ? w.at.sync : w.at.indep, capacitanceRequired: sync ? w.at.qSync : w.at.qIndep },
      provenance: {
        method: `One bank for both converters: capacitor current = the machine side's plus the grid side's switched DC-side currents (each the mean square over its switching periods, ripple-free DC source), combined at every operating-point pair for ${assumption}; the worst pair rates it. Capacitance = peak-to-peak charge of the combined current / ripple target (peak-to-peak capacitor voltage over time, switching ripple included). Synchronised: ${synchronisable ? `${fmt(w.sync)} A RMS, ${fmt(w.qSync / target * 1e6)} µF` : 'not possible, the switching frequencies differ'}; independent: ${fmt(w.indep)} A RMS, ${fmt(w.qIndep / target * 1e6)} µF.`,
        source: 'first principles (superposition of both converters\' DC-side currents on one link; J. W. Kolar, S. D. Round, IEE Proc. EPA 153(4) 2006 for each side); checked against a switched time-domain simulation of the link with both converters switching',
      },
    }
    return env
  })
  // Voltage: the envelope's worst-case DC voltage of the machine side's own bank (the grid side's is the same link).
  const own = new Map(mr.envelope.capacitors.map(c => [c.name, c]))
  for (const c of capacitors) {
    const e = own.get(c.name) as CapacitorEnvelope | undefined
    c.voltage = e?.voltage ?? c.voltage
    c.requiredVoltageRating = c.voltage / derating.capacitorVoltageUtilisation
    c.worstPoint!.voltage = e?.worstPoint?.voltage ?? ''
  }
  const notes = [
    `Shared DC link sized and rated for ${assumption}.`,
    'Each operating-point pair is one machine-side point running with one grid-side point (same name, else same position in the lists, else the grid point closest in real power); the two fundamentals are not locked to each other.',
    'Power balance: the grid side takes in the machine side\'s real power plus both converters\' losses; each side\'s reactive power is its own and does not pass through the link.',
  ]
  return { carriers, capacitors, pairs: pairOut, notes }
}

/**
 * The balance of a pair once both converters' losses are known (parts assigned): the grid side takes in the
 * machine side's real power plus both losses, P_grid = P_machine + L_machine + L_grid, in motoring and in
 * regeneration alike. `residualW` is what is left; within 2 % of the larger power it balances.
 */
export function balanceWithLosses(pair: Pick<LinkPointPair, 'machinePowerW' | 'gridPowerW'>, machineLossW: number, gridLossW: number): { lossesW: number, residualW: number, balanced: boolean } {
  const lossesW = machineLossW + gridLossW
  const residualW = pair.gridPowerW - pair.machinePowerW - lossesW
  const scale = Math.max(Math.abs(pair.gridPowerW), Math.abs(pair.machinePowerW), 1e-9)
  return { lossesW, residualW, balanced: Math.abs(residualW) <= 0.02 * scale }
}
