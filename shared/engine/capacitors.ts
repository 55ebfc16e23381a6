// Capacitor stresses: DC-link (split or single), flying and H-bridge cell capacitors, from switched currents.
import type { CompiledLeg } from './model'
import { gridTrig, valuesOnGrid } from './modulation'
import { switchedSplitLinkCharge } from './switched-charge'
import type { CapacitorStress } from './types'

const TWO_PI = 2 * Math.PI
const SHIFT = TWO_PI / 3
/** Default ripple target when none is given: 5 % of the capacitor's nominal voltage, peak-to-peak (common practice). */
export const DEFAULT_RIPPLE_FRACTION = 0.05

export interface CapacitorContext {
  leg: CompiledLeg
  /** clamped pole reference of phase a */
  reference: (theta: number) => number
  /** A */
  currentPeak: number
  /** rad */
  phi: number
  /** V, unit voltage at the worst-case and at the nominal DC link */
  unitVoltageMax: number
  unitVoltageNominal: number
  fundamentalHz: number
  switchingHz: number
  /** V peak-to-peak, absolute; default DEFAULT_RIPPLE_FRACTION of each capacitor's nominal voltage */
  rippleTarget?: number
  points: number
}

export interface CurrentFigures {
  /** A, RMS of the current minus its mean */
  rms: number
  /** A, RMS of the switching-period-averaged current minus its mean (low-frequency ripple) */
  lowFrequencyRms: number
  /** A, mean (DC part) */
  mean: number
  /** C, peak-to-peak of the whole charge: low-frequency charge plus the within-period swing on top of it, over the fundamental period */
  charge: number
}

/**
 * Per switching period of a split link (for the shared DC link of a back-to-back pair, link.ts):
 * bounds[5k…5k+4] the carrier values where the joint state changes, values[(4k + q)·J + j] capacitor j+1's
 * current in interval q, charged[j·points + k] its period average with the natural-sampling shift.
 */
export interface SplitLinkDetail {
  bounds: Float64Array
  values: Float64Array
  charged: Float64Array
}

/**
 * Split DC link of L−1 series capacitors (capacitor j between DC nodes j−1 and j) feeding three legs
 * whose pole sits at DC node = level; PD carriers common to all phases. With a ripple-free DC source
 * current (Kolar & Round's assumption) capacitor j carries −Σ(currents drawn from nodes ≥ j) plus a
 * constant; in each switching period the carrier value c ∈ [0, 1] sweeps the joint states in order.
 */
export function splitLinkCurrents(L: number, reference: (theta: number) => number, currentPeak: number, phi: number, points: number, switchingHz: number, fundamentalHz: number, detail?: SplitLinkDetail): CurrentFigures[] {
  const J = L - 1
  const sum = new Float64Array(J)
  const sumSq = new Float64Array(J)
  // Per capacitor j, its values at the points computed, series[j·third + k] (third: see below).
  const third = !detail && points % 3 === 0 ? points / 3 : points
  const series = new Float64Array(J * third)
  // the same with the natural-sampling shift of the pulses, for the charge
  const charged = new Float64Array(J * third)
  // largest charge above (and, mirrored, below) its mean within the switching period centred on each sample, C
  const halfSwing = new Float64Array(J * third)
  const base = new Int32Array(3)
  const frac = new Float64Array(3)
  const cur = new Float64Array(3)
  const bounds = new Float64Array(5)
  // current of capacitor j from the phases sitting above its band (constant over the switching period)
  const above = new Float64Array(J)
  // values[q·J + j]: current of capacitor j+1 while the carrier is in interval q
  const values = new Float64Array(4 * J)
  const v = new Float64Array(4)
  const dTheta = TWO_PI / points
  const G = 3 * points
  // Band positions r of the three phases, tabulated once (their slopes are needed below); the grid reference's
  // values when it has them (phase x at point k is grid angle 3k + 1 − x·points).
  const grid = valuesOnGrid(reference, points)
  // (Only the points the loop below reads: those it visits and their neighbours.)
  const rTab = new Float64Array(3 * points)
  for (let x = 0; x < 3; x++) {
    const fill = (k: number) => {
      let g = 3 * k + 1 - x * points
      if (g < 0) g += G
      const m = grid ? grid[g]! : reference((k + 0.5) * dTheta - x * SHIFT)
      rTab[x * points + k] = ((1 + m) * (L - 1)) / 2
    }
    for (let k = 0; k <= Math.min(third, points - 1); k++) fill(k)
    fill(points - 1)
  }
  const trig = gridTrig(G)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  // Natural sampling: a moving duty shifts its pulse off the carrier valley by g·ġ·T²/4, so the pulse
  // sees the current i + i̇·g·ġ·T²/4; with θ = ωt, per unit of dg/dθ·di/dθ this is (ω/f_sw)²/4.
  const shiftFactor = ((TWO_PI * fundamentalHz) / switchingHz) ** 2 / 4
  const slope = new Float64Array(3)
  const curSlope = new Float64Array(3)

  // The three phases are alike shifted by a third of the period, and the link currents are sums over all three,
  // so they repeat every third: on a grid that divides by 3, one third is computed and the rest copied.
  // (The whole period when the caller wants every angle's detail.)
  for (let k = 0; k < third; k++) {
    const kNext = k + 1 === points ? 0 : k + 1
    const kPrev = k === 0 ? points - 1 : k - 1
    for (let x = 0; x < 3; x++) {
      const r = rTab[x * points + k]!
      slope[x] = (rTab[x * points + kNext]! - rTab[x * points + kPrev]!) / (2 * dTheta)
      let lo = Math.floor(r)
      if (lo > L - 2) lo = L - 2
      if (lo < 0) lo = 0
      base[x] = lo
      frac[x] = r - lo
      // i = Î·sin(θ − 2πx/3 − φ) from the grid's sine and cosine (angle 3k + 1 − x·points of the fine grid)
      let g = 3 * k + 1 - x * points
      if (g < 0) g += G
      cur[x] = currentPeak * (trig.sin[g]! * cosPhi - trig.cos[g]! * sinPhi)
      curSlope[x] = currentPeak * (trig.cos[g]! * cosPhi + trig.sin[g]! * sinPhi)
    }
    // Interval bounds: 0, the three duty fractions in ascending order, 1.
    const f0 = frac[0]!
    const f1 = frac[1]!
    const f2 = frac[2]!
    bounds[0] = 0
    bounds[1] = Math.min(f0, f1, f2)
    // The median exactly (each phase is compared with its own fraction, so no rounding allowed).
    bounds[2] = Math.max(Math.min(f0, f1), Math.min(Math.max(f0, f1), f2))
    bounds[3] = Math.max(f0, f1, f2)
    bounds[4] = 1
    if (detail) detail.bounds.set(bounds, 5 * k)
    // Capacitor j carries −Σ of the currents drawn from nodes above it: the phases whose band lies above j all
    // period, and a phase in band j while it sits one level up (its fraction above the carrier).
    above.fill(0)
    for (let x = 0; x < 3; x++) for (let j = 0; j < base[x]!; j++) above[j]! -= cur[x]!
    for (let j = 0; j < J; j++) {
      const inBand = base[0] === j || base[1] === j || base[2] === j
      let avg: number
      let ms: number
      let peak = 0
      let shifted = 0
      if (!inBand && !detail) {
        // No phase switches across this capacitor's band: a constant current over the switching period.
        avg = above[j]!
        ms = avg * avg
      }
      else {
        avg = 0
        ms = 0
        for (let q = 0; q < 4; q++) {
          const top = bounds[q + 1]!
          let ic = above[j]!
          for (let x = 0; x < 3; x++) if (base[x] === j && frac[x]! >= top) ic -= cur[x]!
          v[q] = ic
          if (detail) values[q * J + j] = ic
          const len = top - bounds[q]!
          avg += len * ic
          ms += len * ic * ic
        }
        // That shift for the phases switching in band j: tiny per period, but it adds up to a
        // low-frequency charge of order f/f_sw of the switching swing (e.g. with space-vector references).
        for (let x = 0; x < 3; x++) {
          const g = frac[x]!
          if (base[x] === j && g > 0 && g < 1) shifted += g * g * slope[x]! * curSlope[x]!
        }
        // Charge within the switching period about its local average: the rising carrier sweeps the
        // intervals upward over T_sw/2 (path P(c), P(0) = P(1) = 0), the falling carrier sweeps them back
        // (path −P(c)); so the charge spans ±max|P| around a zero period-mean, whatever the sign of P.
        let acc = 0
        for (let q = 0; q < 4; q++) {
          acc += (bounds[q + 1]! - bounds[q]!) * (v[q]! - avg)
          const a = acc < 0 ? -acc : acc
          if (a > peak) peak = a
        }
      }
      halfSwing[j * third + k] = peak / (2 * switchingHz)
      sum[j]! += avg
      sumSq[j]! += ms
      series[j * third + k] = avg
      charged[j * third + k] = avg - shiftFactor * shifted
    }
    if (detail) detail.values.set(values, 4 * J * k)
  }
  if (detail) detail.charged.set(charged)
  // The charge and the ripple repeat with the currents, so their figures over one third are those of the period.
  return Array.from({ length: J }, (_, j) => {
    const part = (a: Float64Array) => a.subarray(j * third, j * third + third)
    const swing = part(halfSwing)
    return figures(sum[j]! / third, sumSq[j]! / third, part(series), swing, (fundamentalHz * points) / third, swing, part(charged))
  })
}

/**
 * Peak-to-peak charge over the fundamental period, in one pass: the charge of the switching-period
 * averaged current (integrated to the centre of each sample) carries the within-period swing of the
 * switching period there, `above` and `below` its period mean (C); the ripple spans
 * max(Q_k + above_k) − min(Q_k − below_k). With no low-frequency current this is the largest
 * within-period swing, with no switching swing the low-frequency swing, and where both act their
 * sum at the angles where they add. The period mean is the right anchor: the moving average of the
 * charge over one switching period is the integral of the period-averaged current.
 */
function figures(mean: number, meanSquare: number, averaged: Float64Array, above: Float64Array, fundamentalHz: number, below: Float64Array = above, charged: Float64Array = averaged): CurrentFigures {
  const n = averaged.length
  const dt = 1 / (fundamentalHz * n)
  // The charged series' own mean, so that its charge closes over the period.
  let chargedMean = 0
  for (let k = 0; k < n; k++) chargedMean += charged[k]!
  chargedMean /= n
  let lf = 0
  let q = 0
  let hi = -Infinity
  let lo = Infinity
  for (let k = 0; k < n; k++) {
    const ac = averaged[k]! - mean
    lf += ac * ac
    const dq = (charged[k]! - chargedMean) * dt
    const centre = q + 0.5 * dq
    q += dq
    const up = above[k]!
    const down = below[k]!
    if (centre + up > hi) hi = centre + up
    if (centre - down < lo) lo = centre - down
  }
  return {
    rms: Math.sqrt(Math.max(0, meanSquare - mean * mean)),
    lowFrequencyRms: Math.sqrt(lf / n),
    mean,
    charge: hi - lo,
  }
}

/**
 * Charge within one switching period (per unit of i·T_sw) of a current +1 during a pulse of width
 * d centred at 0 and −1 during one of width d centred at δ (both periodic in 1): its largest value
 * above and below its period mean, into out[0] and out[1]. Between the pulse edges the current is
 * constant and the charge linear; `edges` is scratch space of 6.
 */
function pulsePairSwing(d: number, delta: number, edges: Float64Array, out: Float64Array): void {
  const h = d / 2
  edges[0] = 0
  edges[1] = 1
  edges[2] = h - Math.floor(h)
  edges[3] = -h - Math.floor(-h)
  edges[4] = delta + h - Math.floor(delta + h)
  edges[5] = delta - h - Math.floor(delta - h)
  for (let a = 1; a < 6; a++) {
    const v = edges[a]!
    let b = a - 1
    while (b >= 0 && edges[b]! > v) { edges[b + 1] = edges[b]!; b-- }
    edges[b + 1] = v
  }
  let g = 0
  let area = 0
  let hi = 0
  let lo = 0
  for (let e = 0; e < 5; e++) {
    const len = edges[e + 1]! - edges[e]!
    if (len <= 0) continue
    const mid = edges[e]! + len / 2
    const x0 = mid - Math.round(mid)
    const x1 = mid - delta - Math.round(mid - delta)
    const f = (x0 < h && x0 > -h ? 1 : 0) - (x1 < h && x1 > -h ? 1 : 0)
    area += len * (g + (f * len) / 2)
    g += f * len
    if (g > hi) hi = g
    if (g < lo) lo = g
  }
  out[0] = hi - area
  out[1] = area - lo
}

/**
 * Flying capacitor between two adjacent cells under phase-shifted carriers (shift δ = 1/(N−1) of a
 * period): it carries ±i while the two cells' states differ, 2·min(d, δ, 1 − d) of each switching
 * period with cell duty d = (1 + m)/2; its switching-period average is zero. Within a period the
 * charge steps up by one cell's pulse (i for d·T_sw around its carrier valley) and back down by the
 * neighbour's, δ·T_sw later; for N > 3 the two are not half a period apart, so the swing lies
 * unevenly about the period mean and its larger side flips with the sign of i.
 */
function flyingCurrents(N: number, reference: (theta: number) => number, currentPeak: number, phi: number, points: number, switchingHz: number, fundamentalHz: number): CurrentFigures {
  const delta = 1 / (N - 1)
  const averaged = new Float64Array(points)
  const above = new Float64Array(points)
  const below = new Float64Array(points)
  const sides = new Float64Array(2)
  const edges = new Float64Array(6)
  const period = 1 / switchingHz
  let ms = 0
  const { m: onGrid, sin, cos, stride, offset } = gridOf(reference, points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  // Half a period later the reference and the current are negated (every modulation's reference is odd about π):
  // the duty becomes 1 − d, whose pulse pair is this one negated and shifted by half a switching period, so its
  // sides swap, and with −i the charge above and below the mean are the same again. On an even grid reference,
  // the second half is the first half's copy.
  const half = onGrid && points % 2 === 0 ? points / 2 : points
  for (let k = 0; k < half; k++) {
    const theta = ((k + 0.5) * TWO_PI) / points
    const g = stride * k + offset
    const d = (1 + (onGrid ? onGrid[g]! : reference(theta))) / 2
    const i = currentPeak * (sin[g]! * cosPhi - cos[g]! * sinPhi)
    const t = Math.min(d, delta, 1 - d)
    ms += 2 * t * i * i
    pulsePairSwing(d, delta, edges, sides)
    const scale = Math.abs(i) * period
    above[k] = (i >= 0 ? sides[0]! : sides[1]!) * scale
    below[k] = (i >= 0 ? sides[1]! : sides[0]!) * scale
  }
  if (half < points) {
    above.copyWithin(half, 0, half)
    below.copyWithin(half, 0, half)
    ms *= 2
  }
  return { ...figures(0, ms / points, averaged, above, fundamentalHz, below), rms: Math.sqrt(ms / points) }
}

/**
 * H-bridge cell capacitor under unipolar PWM (legs at duties (1 ± m)/2 on one carrier): it carries
 * the phase current while the cell outputs ±V_cell, |m| of the period; the average m·i holds the
 * second harmonic M·Î/(2√2) RMS that dominates; the cell's DC source is taken ripple-free. The
 * output pulses repeat every half carrier period: in each, i for |m|·T_sw/2 against the mean m·i,
 * a peak-to-peak swing |i|·|m|·(1 − |m|)·T_sw/2 symmetric about the local mean.
 */
function cellCurrents(reference: (theta: number) => number, currentPeak: number, phi: number, points: number, switchingHz: number, fundamentalHz: number): CurrentFigures {
  const series = new Float64Array(points)
  const halfSwing = new Float64Array(points)
  let sum = 0
  let sumSq = 0
  const { m: onGrid, sin, cos, stride, offset } = gridOf(reference, points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  for (let k = 0; k < points; k++) {
    const g = stride * k + offset
    const m = onGrid ? onGrid[g]! : reference(((k + 0.5) * TWO_PI) / points)
    const i = currentPeak * (sin[g]! * cosPhi - cos[g]! * sinPhi)
    const am = Math.abs(m)
    series[k] = m * i
    sum += m * i
    sumSq += am * i * i
    halfSwing[k] = (Math.abs(i) * am * (1 - am)) / (4 * switchingHz)
  }
  return figures(sum / points, sumSq / points, series, halfSwing, fundamentalHz)
}

/**
 * Phase a on the integration grid: the grid reference's values when it has them (point k at index stride·k + offset
 * of its fine grid) and the kept sines and cosines of the same angles, so i = Î·sin(θ − φ) needs no sine per point.
 */
function gridOf(reference: (theta: number) => number, points: number): { m?: Float64Array, sin: Float64Array, cos: Float64Array, stride: number, offset: number } {
  const m = valuesOnGrid(reference, points)
  if (m) {
    const trig = gridTrig(3 * points)
    return { m, sin: trig.sin, cos: trig.cos, stride: 3, offset: 1 }
  }
  const trig = gridTrig(points)
  return { sin: trig.sin, cos: trig.cos, stride: 1, offset: 0 }
}

/** Carrier ratios whose pattern repeats within this many fundamental periods get the locked-carrier charge. */
export const LOCKED_PERIODS_MAX = 4

/**
 * Fundamental periods after which a carrier at `ratio` × the fundamental repeats its pattern (ratio × q whole, to
 * 1e-6), q ≤ LOCKED_PERIODS_MAX; null for a ratio below 3 (six-step switches at the fundamental) or one that does not
 * repeat that soon (a carrier drifting against the fundamental: the quasi-static envelope is the figure).
 */
export function lockedPeriods(ratio: number): number | null {
  if (!(ratio >= 3)) return null
  for (let q = 1; q <= LOCKED_PERIODS_MAX; q++) {
    const n = ratio * q
    if (Math.abs(n - Math.round(n)) <= 1e-6 * Math.max(1, n)) return q
  }
  return null
}

/**
 * The split link's charge is the larger of the quasi-static figure (each switching period on a continuous angle, the
 * envelope of a carrier that drifts against the fundamental) and, where the carrier pattern repeats within a few
 * fundamental periods, the charge of the switched currents over those periods (switched-charge.ts): where a reference
 * kink meets the carrier at the same phase every period, and the beats of a ratio such as 99.5 or 80.25.
 */
export function withSwitchedCharge(all: CurrentFigures[], L: number, ctx: Pick<CapacitorContext, 'reference' | 'currentPeak' | 'phi' | 'switchingHz' | 'fundamentalHz'>): CurrentFigures[] {
  const ratio = ctx.switchingHz / ctx.fundamentalHz
  const periods = lockedPeriods(ratio)
  if (periods === null) return all
  const switched = switchedSplitLinkCharge(L, ctx.reference, ctx.currentPeak, ctx.phi, ratio, ctx.fundamentalHz, periods)
  return all.map((f, j) => (switched[j]! > f.charge ? { ...f, charge: switched[j]! } : f))
}

export interface CapacitorOutcome {
  capacitors: CapacitorStress[]
  warnings: string[]
}

/** Stress of every capacitor position of the converter. */
export function capacitorStresses(ctx: CapacitorContext): CapacitorOutcome {
  const { leg } = ctx
  const defs = leg.def.capacitors
  const warnings: string[] = []
  const result: CapacitorStress[] = []
  const L = leg.def.modelLevels
  const build = (def: (typeof defs)[number], f: CurrentFigures, method: string, source: string): CapacitorStress => {
    const nominal = def.voltageUnits * ctx.unitVoltageNominal
    const target = ctx.rippleTarget ?? DEFAULT_RIPPLE_FRACTION * nominal
    return {
      name: def.name,
      kind: def.kind,
      role: def.role,
      count: def.countInConverter,
      voltage: def.voltageUnits * ctx.unitVoltageMax,
      rippleCurrentRms: f.rms,
      lowFrequencyRippleRms: f.lowFrequencyRms,
      ...(def.seriesCount !== undefined ? { seriesCount: def.seriesCount } : {}),
      capacitanceRequired: target > 0 ? f.charge / target : 0,
      rippleTarget: target,
      provenance: { method, source },
    }
  }
  const sizing = 'capacitance = peak-to-peak charge / ripple target, where the ripple is the peak-to-peak capacitor voltage over one fundamental period in periodic steady state, switching-frequency ripple included, and the charge is that of the switched current: the charge of its switching-period average (low-frequency) with the swing within each switching period on top, so the larger of the two counts where one dominates and their sum at the angles where both act'

  const lockedCarrier = 'where the carrier pattern repeats within four fundamental periods (f_sw/f × 1…4 whole) the charge is not taken below that of the switched currents themselves over those periods (every crossing instant solved, the charge between them in closed form): a space-vector reference\'s kinks meet a locked carrier at the same phase every period, and a ratio such as 99.5 beats at f/2'
  switch (leg.def.capacitorModel) {
    case 'split': {
      const all = withSwitchedCharge(splitLinkCurrents(L, ctx.reference, ctx.currentPeak, ctx.phi, ctx.points, ctx.switchingHz, ctx.fundamentalHz), L, ctx)
      for (const def of defs) {
        const f = all[(def.splitIndex ?? 1) - 1]!
        const source = L === 2 ? 'J. W. Kolar, S. D. Round, IEE Proc. EPA 153(4) 2006' : 'first principles (switched DC-side currents, the method of Kolar & Round, IEE Proc. EPA 153(4) 2006, applied per DC node); checked against a time-domain simulation'
        result.push(build(def, f, `Mean square of the switched DC-side current of the three legs over each switching period (common carriers), minus its mean, ripple-free DC source; ${sizing}; ${lockedCarrier}.`, source))
      }
      // Equal means ⇔ the capacitor voltages hold themselves; with N > 3 they generally cannot.
      const scale = Math.max(ctx.currentPeak, 1e-12)
      const drift = all.some(f => Math.abs(f.mean - all[all.length - 1]!.mean) > 5e-3 * scale)
      if (drift) warnings.push(`DC-link capacitor voltages do not balance themselves at this operating point (diode-clamped leg with ${L} levels, real power flowing); ripple currents assume each capacitor is held by its own supply or a balancing circuit.`)
      break
    }
    case 'flying': {
      const link = withSwitchedCharge(splitLinkCurrents(2, ctx.reference, ctx.currentPeak, ctx.phi, ctx.points, ctx.switchingHz, ctx.fundamentalHz), 2, ctx)[0]!
      const fly = flyingCurrents(L, ctx.reference, ctx.currentPeak, ctx.phi, ctx.points, ctx.switchingHz, ctx.fundamentalHz)
      for (const def of defs) {
        if (def.kind === 'dc-link') {
          result.push(build(def, link, `DC-link string carries the current switched by the outermost cell (its carrier common to the three phases), as a two-level link; ${sizing}; ${lockedCarrier}.`, 'J. W. Kolar, S. D. Round, IEE Proc. EPA 153(4) 2006 (same form); T. A. Meynard, H. Foch, IEEE PESC 1992 (structure)'))
        }
        else {
          result.push(build(def, fly, `Carries ±i while its two adjacent cells differ: 2·min(d, 1/(N−1), 1−d) of each period under phase-shifted carriers; ${sizing}.`, 'first principles; T. A. Meynard, H. Foch, IEEE PESC 1992 (structure, voltages)'))
        }
      }
      break
    }
    case 'cell': {
      const f = cellCurrents(ctx.reference, ctx.currentPeak, ctx.phi, ctx.points, ctx.switchingHz, ctx.fundamentalHz)
      for (const def of defs) {
        result.push(build(def, f, `Cell current (s_A − s_B)·i under unipolar PWM, mean square |m|·i² per period, minus its mean; second harmonic M·Î/(2√2) dominates; ${sizing}.`, 'first principles (cell power balance); common practice'))
      }
      break
    }
    case 'none':
      break
  }
  return { capacitors: result, warnings }
}
