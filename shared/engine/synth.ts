// Switched pole and line voltages over one fundamental period (naturally sampled carriers), their spectrum and THD.
import { realFftInterleaved } from './fft'
import type { CompiledLeg } from './model'

const TWO_PI = 2 * Math.PI

/** One carrier comparison: contributes `weight` volts while α·m + β exceeds the carrier (triangle 0…1, shifted by τ periods). */
interface Comparator {
  alpha: number
  beta: number
  tau: number
  weight: number
}

/**
 * The modulator as comparisons: PD bands (level ⌊r⌋ or ⌊r⌋+1), flying-capacitor cells on carriers
 * 360°/(N−1) apart, H-bridge cells (legs A and B compare +m and −m) on carriers 180°/cells apart, and
 * the matrix converter as a two-level virtual inverter on its virtual DC link. `stepVoltage` is the
 * voltage one comparison switches (V).
 */
function comparatorsFor(leg: CompiledLeg, stepVoltage: number): { list: Comparator[], offset: number } {
  const L = leg.def.modelLevels
  switch (leg.def.carrier) {
    case 'phase-disposition':
      return {
        list: Array.from({ length: L - 1 }, (_, k) => ({ alpha: (L - 1) / 2, beta: (L - 1) / 2 - k, tau: 0, weight: stepVoltage })),
        offset: (-(L - 1) / 2) * stepVoltage,
      }
    case 'phase-shifted':
      return {
        list: Array.from({ length: L - 1 }, (_, k) => ({ alpha: 0.5, beta: 0.5, tau: k / (L - 1), weight: stepVoltage })),
        offset: (-(L - 1) / 2) * stepVoltage,
      }
    case 'phase-shifted-unipolar': {
      const cells = leg.def.cellsPerPhase ?? 1
      const list: Comparator[] = []
      for (let k = 0; k < cells; k++) {
        const tau = k / (2 * cells)
        list.push({ alpha: 0.5, beta: 0.5, tau, weight: stepVoltage }, { alpha: -0.5, beta: 0.5, tau, weight: -stepVoltage })
      }
      return { list, offset: 0 }
    }
    case 'input-averaged':
      return { list: [{ alpha: 0.5, beta: 0.5, tau: 0, weight: stepVoltage }], offset: -stepVoltage / 2 }
  }
}

/**
 * A piecewise-constant switched voltage, walked in time order: `add(t0, t1, v)` takes each constant stretch
 * (t in fundamental periods, 0…1). It keeps the exact mean square and the mean over each of `samples` intervals.
 */
class StepAccumulator {
  readonly bins: Float64Array
  sumSquare = 0
  constructor(readonly samples: number) {
    this.bins = new Float64Array(samples)
  }

  add(t0: number, t1: number, v: number): void {
    if (t1 <= t0) return
    this.sumSquare += v * v * (t1 - t0)
    if (v === 0) return
    const S = this.samples
    const x0 = t0 * S
    const x1 = t1 * S
    let j0 = Math.floor(x0)
    const j1 = Math.min(S - 1, Math.floor(x1))
    if (j0 >= j1) {
      this.bins[Math.min(S - 1, j0)]! += v * (x1 - x0)
      return
    }
    this.bins[j0]! += v * (j0 + 1 - x0)
    for (j0++; j0 < j1; j0++) this.bins[j0]! += v
    this.bins[j1]! += v * (x1 - j1)
  }
}

/** Triangle carrier 0…1 with troughs at integer carrier periods p. */
export function triangle(p: number): number {
  return 1 - Math.abs(2 * (p - Math.floor(p)) - 1)
}

/** At least this many segments per fundamental period, so a reference that moves fast between carrier vertices stays linear enough. */
const MIN_SEGMENTS = 256

export interface SynthesisInput {
  leg: CompiledLeg
  /** clamped pole reference of phase a, m(θ) */
  reference: (theta: number) => number
  sixStep: boolean
  /** f_sw / f */
  frequencyRatio: number
  /** V switched by one comparison (six-step: V_dc) */
  stepVoltage: number
  /** samples per fundamental period, a power of two */
  samples: number
}

export interface Synthesis {
  /** V, line voltage u_ab, each sample the exact mean over its interval */
  line: Float64Array
  /** V², mean square of u_ab over the period: the time-domain RMS² the full-band THD needs, with no order left out */
  lineMeanSquare: number
  /** V, phase-a pole voltage (relative to the DC midpoint / cell string), interval means; only when asked for */
  pole?: Float64Array
}

/**
 * Segment boundaries of one fundamental period (in periods, 0…1): every vertex of every carrier (troughs at
 * whole, peaks at half carrier periods, shifted by τ) and a uniform floor of MIN_SEGMENTS, sorted. Between two
 * boundaries every carrier is linear.
 */
export function segmentBoundaries(taus: number[], mf: number): Float64Array {
  // Each list is sorted already (the floor, each carrier's vertices): merged, with equal instants kept once.
  const lists = taus.length + 1
  const next = new Float64Array(lists)
  const k = new Float64Array(lists)
  const valueOf = (i: number): number => {
    if (i === taus.length) return k[i]! <= MIN_SEGMENTS ? k[i]! / MIN_SEGMENTS : Infinity
    const t = (k[i]! / 2 - taus[i]!) / mf
    return t < 1 ? t : Infinity
  }
  for (let i = 0; i < taus.length; i++) {
    k[i] = Math.floor(2 * taus[i]!) + 1
    // vertices at t ≤ 0 are not boundaries (0 is the floor's)
    while (valueOf(i) <= 0) k[i]!++
    next[i] = valueOf(i)
  }
  next[taus.length] = 0
  const out = new Float64Array(MIN_SEGMENTS + 1 + taus.length * (Math.ceil(2 * mf) + 2))
  let n = 0
  for (;;) {
    let best = 0
    for (let i = 1; i < lists; i++) if (next[i]! < next[best]!) best = i
    const t = next[best]!
    if (t === Infinity) break
    if (n === 0 || t - out[n - 1]! > 1e-15) out[n++] = t
    k[best]!++
    next[best] = valueOf(best)
  }
  return out.subarray(0, n)
}

interface PhaseRef {
  /** reference at each segment boundary */
  m: Float64Array
  /** +1 adds this phase's pole voltage, −1 subtracts it */
  sign: number
}

/**
 * Walks the segments in time order. In each, u = α·m + β − carrier is linear for every comparison (m
 * interpolated between the boundaries), so each comparison switches at most once, at the root of u; the
 * stretches between those instants are constant and go to the accumulator. Carrier crossings are thus found
 * per carrier half-period, not searched for on the sample grid. u at a boundary ends one segment and starts
 * the next, so each comparison's u is computed once per boundary and its state carried on; every comparison
 * switches the same voltage (±`stepVoltage`), so the level is offset + step × (an integer count).
 */
function walkSegments(bounds: Float64Array, taus: number[], mf: number, comparisons: (Comparator & { carrier: number })[], phases: PhaseRef[], offset: number, samples: number): StepAccumulator {
  const acc = new StepAccumulator(samples)
  // Every (comparison, phase) pair flat: α, β, the sign of its voltage step, carrier column, phase row.
  const Q = comparisons.length * phases.length
  const step = Math.abs(comparisons[0]?.weight ?? 0)
  const alpha = new Float64Array(Q)
  const beta = new Float64Array(Q)
  const dir = new Int8Array(Q)
  const column = new Int32Array(Q)
  const phaseOf = new Int32Array(Q)
  for (let q = 0, n = 0; q < comparisons.length; q++) {
    if (Math.abs(comparisons[q]!.weight) !== step) throw new Error('synthesis: every comparison must switch the same voltage')
    for (let ph = 0; ph < phases.length; ph++, n++) {
      alpha[n] = comparisons[q]!.alpha
      beta[n] = comparisons[q]!.beta
      dir[n] = phases[ph]!.sign * Math.sign(comparisons[q]!.weight)
      column[n] = comparisons[q]!.carrier
      phaseOf[n] = ph
    }
  }
  const B = bounds.length
  const m = new Float64Array(phases.length * B)
  for (let ph = 0; ph < phases.length; ph++) m.set(phases[ph]!.m, ph * B)
  const C = taus.length
  // The carriers at the current boundary (triangles, worked out per boundary rather than kept for all).
  const carrier = new Float64Array(C)
  const carriersAt = (t: number) => {
    for (let c = 0; c < C; c++) carrier[c] = triangle(t * mf + taus[c]!)
  }
  // u of each pair at the current boundary, and whether it is on (u > 0); the count of steps that are on.
  const u = new Float64Array(Q)
  const on = new Uint8Array(Q)
  let count = 0
  carriersAt(bounds[0]!)
  for (let q = 0; q < Q; q++) {
    u[q] = alpha[q]! * m[phaseOf[q]! * B]! + beta[q]! - carrier[column[q]!]!
    if (u[q]! > 0) {
      on[q] = 1
      count += dir[q]!
    }
  }
  const evT = new Float64Array(Q)
  const evD = new Int32Array(Q)
  for (let b = 0; b + 1 < B; b++) {
    const t0 = bounds[b]!
    const t1 = bounds[b + 1]!
    const dt = t1 - t0
    let n = 0
    carriersAt(t1)
    for (let q = 0; q < Q; q++) {
      const u0 = u[q]!
      const u1 = alpha[q]! * m[phaseOf[q]! * B + b + 1]! + beta[q]! - carrier[column[q]!]!
      u[q] = u1
      const was = on[q]!
      if ((u1 > 0 ? 1 : 0) === was) continue
      on[q] = was ^ 1
      // One crossing inside the segment: on at a rising u, off at a falling one.
      insertCrossing(evT, evD, n++, t0 + (dt * u0) / (u0 - u1), was ? -dir[q]! : dir[q]!)
    }
    let prev = t0
    for (let k = 0; k < n; k++) {
      acc.add(prev, evT[k]!, offset + step * count)
      count += evD[k]!
      prev = evT[k]!
    }
    acc.add(prev, t1, offset + step * count)
  }
  return acc
}

/**
 * Puts crossing (t, tag) into the first n + 1 places of times/tags, which hold n crossings sorted by time (an
 * insertion: a segment has a handful). Equal times keep their order of arrival.
 */
export function insertCrossing(times: Float64Array, tags: Int32Array, n: number, t: number, tag: number): void {
  let k = n
  while (k > 0 && times[k - 1]! > t) {
    times[k] = times[k - 1]!
    tags[k] = tags[k - 1]!
    k--
  }
  times[k] = t
  tags[k] = tag
}

/** Six-step: pole high (+V/2) while sin(θ − shift) ≥ 0, low (−V/2) otherwise; u_ab = u_a − u_b. */
function sixStepWaveforms(input: SynthesisInput, wantPole: boolean): Synthesis {
  const V = input.stepVoltage
  const S = input.samples
  const poleAt = (t: number, s: number) => ((((t - s) % 1) + 1) % 1 < 0.5 ? V / 2 : -V / 2)
  const edges = [0, 1 / 3, 1 / 2, 5 / 6, 1]
  const line = new StepAccumulator(S)
  for (let k = 0; k + 1 < edges.length; k++) {
    const mid = (edges[k]! + edges[k + 1]!) / 2
    line.add(edges[k]!, edges[k + 1]!, poleAt(mid, 0) - poleAt(mid, 1 / 3))
  }
  const out: Synthesis = { line: line.bins, lineMeanSquare: line.sumSquare }
  if (wantPole) {
    const pole = new StepAccumulator(S)
    pole.add(0, 0.5, V / 2)
    pole.add(0.5, 1, -V / 2)
    out.pole = pole.bins
  }
  return out
}

/**
 * The switched line voltage u_ab over one fundamental period (naturally sampled carriers): interval means on
 * `samples` intervals for the spectrum and the exact mean square for the full-band THD, both from the same
 * switching instants; the phase-a pole voltage too when `pole` is asked for (the waveform view).
 */
export function synthesise(input: SynthesisInput, options: { pole?: boolean } = {}): Synthesis {
  if (input.sixStep) return sixStepWaveforms(input, options.pole ?? false)
  const { list, offset } = comparatorsFor(input.leg, input.stepVoltage)
  const taus = Array.from(new Set(list.map(c => c.tau)))
  const comparisons = list.map(c => ({ ...c, carrier: taus.indexOf(c.tau) }))
  const mf = input.frequencyRatio
  const bounds = segmentBoundaries(taus, mf)
  const B = bounds.length
  const ma = new Float64Array(B)
  const mb = new Float64Array(B)
  for (let b = 0; b < B; b++) {
    const t = bounds[b]!
    ma[b] = input.reference(TWO_PI * t)
    mb[b] = input.reference(TWO_PI * t - TWO_PI / 3)
  }
  // The line voltage: the offsets of the two poles cancel.
  const line = walkSegments(bounds, taus, mf, comparisons, [{ m: ma, sign: 1 }, { m: mb, sign: -1 }], 0, input.samples)
  const out: Synthesis = { line: line.bins, lineMeanSquare: line.sumSquare }
  if (options.pole) out.pole = walkSegments(bounds, taus, mf, comparisons, [{ m: ma, sign: 1 }], offset, input.samples).bins
  return out
}

/**
 * Peak amplitude per harmonic order 0…maxOrder of a periodic signal given as interval means over
 * one period: |c_h| = |X_h| / (n·sinc(πh/n)) undoes the interval averaging.
 */
export function harmonicAmplitudes(samples: Float64Array, maxOrder: number): Float64Array {
  const n = samples.length
  const bins = realFftInterleaved(samples)
  const out = new Float64Array(maxOrder + 1)
  out[0] = Math.abs(bins[0]!) / n
  const sinc = sincTable(n)
  for (let h = 1; h <= maxOrder && h < n / 2; h++) {
    const a = bins[2 * h]!
    const b = bins[2 * h + 1]!
    out[h] = (2 * Math.sqrt(a * a + b * b)) / n / sinc[h]!
  }
  return out
}

/** sinc(πh/n) for h < n/2, kept per n. */
const sincTables = new Map<number, Float64Array>()

function sincTable(n: number): Float64Array {
  let t = sincTables.get(n)
  if (!t) {
    t = new Float64Array(n / 2)
    t[0] = 1
    for (let h = 1; h < n / 2; h++) {
      const x = (Math.PI * h) / n
      t[h] = Math.sin(x) / x
    }
    if (sincTables.size >= 16) sincTables.delete(sincTables.keys().next().value!)
    sincTables.set(n, t)
  }
  return t
}

/** THD = √(Σ_{h=2}^{H} A_h²) / A_1. */
export function totalHarmonicDistortion(amplitudes: Float64Array): number {
  const a1 = amplitudes[1]!
  let sum = 0
  for (let h = 2; h < amplitudes.length; h++) sum += amplitudes[h]! * amplitudes[h]!
  return a1 > 0 ? Math.sqrt(sum) / a1 : 0
}
