// Switched pole and line voltages over one fundamental period (naturally sampled carriers), their spectrum and THD.
import { fft } from './fft'
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

/** Triangle carrier 0…1 with troughs at integer carrier periods p. */
function triangle(p: number): number {
  return 1 - Math.abs(2 * (p - Math.floor(p)) - 1)
}

/** Fraction of a linear segment from a to b where it is positive. */
function positiveFraction(a: number, b: number): number {
  if (a > 0) return b > 0 ? 1 : a / (a - b)
  return b > 0 ? b / (b - a) : 0
}

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
  /** V, phase-a pole voltage (relative to the DC midpoint / cell string), each sample the mean over its interval */
  pole: Float64Array
  /** V, line voltage u_ab, interval means */
  line: Float64Array
}

/**
 * Pole voltage of one phase, each sample the exact mean over its interval of the comparison
 * outcomes: u = α·m + β − carrier is linear between the sample edges and carrier vertices
 * (m interpolated linearly), so every crossing lands at its own instant, not on the sample grid.
 */
function pole(input: SynthesisInput, shift: number): Float64Array {
  const S = input.samples
  const out = new Float64Array(S)
  if (input.sixStep) {
    // High while sin(θ − shift) ≥ 0: t ∈ [s, s + ½) in fundamental periods, s = shift/2π.
    const s = shift / TWO_PI
    const V = input.stepVoltage
    for (let j = 0; j < S; j++) {
      const t0 = j / S
      const t1 = (j + 1) / S
      let high = 0
      for (const start of [s - 1, s, s + 1]) high += Math.max(0, Math.min(t1, start + 0.5) - Math.max(t0, start))
      out[j] = V * (high * S) - V / 2
    }
    return out
  }
  const m = new Float64Array(S + 1)
  for (let j = 0; j <= S; j++) m[j] = input.reference((TWO_PI * j) / S - shift)
  const { list, offset } = comparatorsFor(input.leg, input.stepVoltage)
  const dp = input.frequencyRatio / S
  out.fill(offset)
  // Comparisons sharing a carrier share its samples and vertices.
  const byCarrier = new Map<number, Comparator[]>()
  for (const c of list) byCarrier.set(c.tau, [...(byCarrier.get(c.tau) ?? []), c])
  const u = new Float64Array(S + 1)
  const carrier = new Float64Array(S + 1)
  const first = new Int32Array(S + 1)
  const maxVertices = 2 * Math.ceil(input.frequencyRatio) + 4
  const vertexZ = new Float64Array(maxVertices)
  const vertexC = new Float64Array(maxVertices)
  for (const [tau, comparisons] of byCarrier) {
    carrierGrid(tau, S, dp, maxVertices, carrier, first, vertexZ, vertexC)
    for (const c of comparisons) {
      for (let j = 0; j <= S; j++) u[j] = c.alpha * m[j]! + c.beta - carrier[j]!
      for (let j = 0; j < S; j++) {
        const from = first[j]!
        const to = first[j + 1]!
        let area: number
        if (from === to) {
          area = positiveFraction(u[j]!, u[j + 1]!)
        }
        else {
          let zPrev = 0
          let uPrev = u[j]!
          area = 0
          for (let k = from; k < to; k++) {
            const z = vertexZ[k]!
            const uv = c.alpha * (m[j]! + z * (m[j + 1]! - m[j]!)) + c.beta - vertexC[k]!
            area += (z - zPrev) * positiveFraction(uPrev, uv)
            zPrev = z
            uPrev = uv
          }
          area += (1 - zPrev) * positiveFraction(uPrev, u[j + 1]!)
        }
        out[j]! += c.weight * area
      }
    }
  }
  return out
}

/**
 * The carrier at the sample edges and its vertices (troughs at whole, peaks at half periods) inside each
 * sample interval, as fractions z of it: vertices of interval j are first[j] … first[j+1]−1.
 */
function carrierGrid(tau: number, S: number, dp: number, maxVertices: number, carrier: Float64Array, first: Int32Array, vertexZ: Float64Array, vertexC: Float64Array): void {
  for (let j = 0; j <= S; j++) carrier[j] = triangle(j * dp + tau)
  let count = 0
  let v = (Math.floor(2 * tau) + 1) / 2
  for (let j = 0; j < S; j++) {
    first[j] = count
    const p0 = j * dp + tau
    for (; v < p0 + dp && count < maxVertices; v += 0.5) {
      vertexZ[count] = (v - p0) / dp
      vertexC[count] = Math.round(2 * v) % 2 === 0 ? 0 : 1
      count++
    }
  }
  first[S] = count
}

/** Events of a piecewise-constant signal inside one sample interval: +w at a positive stretch's start, −w at its end. */
class Events {
  z: Float64Array
  w: Float64Array
  n = 0
  /** V, the stretches covering the whole interval (most of them: no event needed) */
  base = 0
  constructor(capacity: number) {
    this.z = new Float64Array(capacity)
    this.w = new Float64Array(capacity)
  }

  push(z: number, w: number): void {
    if (this.n === this.z.length) {
      const z2 = new Float64Array(2 * this.n)
      const w2 = new Float64Array(2 * this.n)
      z2.set(this.z)
      w2.set(this.w)
      this.z = z2
      this.w = w2
    }
    // Insertion keeps the events sorted by z (a handful per interval).
    let k = this.n++
    while (k > 0 && this.z[k - 1]! > z) {
      this.z[k] = this.z[k - 1]!
      this.w[k] = this.w[k - 1]!
      k--
    }
    this.z[k] = z
    this.w[k] = w
  }

  /** the stretch of [zA, zB] where the linear u runs from uA to uB above 0 */
  addPositive(zA: number, zB: number, uA: number, uB: number, weight: number): void {
    if (uA <= 0 && uB <= 0) return
    const start = uA > 0 ? zA : zA + ((zB - zA) * -uA) / (uB - uA)
    const end = uB > 0 ? zB : zA + ((zB - zA) * uA) / (uA - uB)
    if (end <= start) return
    if (start <= 0 && end >= 1) {
      this.base += weight
      return
    }
    this.push(start, weight)
    this.push(end, -weight)
  }

  /** (1/Δz)∫ v² dz over the interval, v the sum of the stretches; empties the list */
  takeMeanSquare(): number {
    let v = this.base
    this.base = 0
    let sum = 0
    let zPrev = 0
    for (let k = 0; k < this.n; k++) {
      const z = this.z[k]!
      sum += v * v * (z - zPrev)
      v += this.w[k]!
      zPrev = z
    }
    this.n = 0
    return sum + v * v * (1 - zPrev)
  }
}

/**
 * Mean square of the switched line voltage u_ab over one fundamental period, exact for the same
 * comparisons `pole` averages (every stretch between carrier vertices linear): the time-domain RMS²
 * that the full-band THD √(V_rms² − V_1²)/V_1 needs, with no harmonic order left out.
 */
export function lineMeanSquare(input: SynthesisInput): number {
  const S = input.samples
  const events = new Events(64)
  let total = 0
  if (input.sixStep) {
    // Pole high while sin(θ − shift) ≥ 0: t ∈ [s, s + ½) in fundamental periods; u_ab = V·(high_a − high_b).
    const starts = [0, 1 / 3].map(s => [s - 1, s, s + 1])
    for (let j = 0; j < S; j++) {
      const t0 = j / S
      starts.forEach((list, phase) => {
        for (const start of list) {
          const a = Math.max(t0, start)
          const b = Math.min(t0 + 1 / S, start + 0.5)
          if (b > a) {
            const w = phase === 0 ? input.stepVoltage : -input.stepVoltage
            events.push((a - t0) * S, w)
            events.push((b - t0) * S, -w)
          }
        }
      })
      total += events.takeMeanSquare()
    }
    return total / S
  }
  const ma = new Float64Array(S + 1)
  const mb = new Float64Array(S + 1)
  for (let j = 0; j <= S; j++) {
    ma[j] = input.reference((TWO_PI * j) / S)
    mb[j] = input.reference((TWO_PI * j) / S - TWO_PI / 3)
  }
  const { list } = comparatorsFor(input.leg, input.stepVoltage)
  const dp = input.frequencyRatio / S
  const maxVertices = 2 * Math.ceil(input.frequencyRatio) + 4
  const taus = Array.from(new Set(list.map(c => c.tau)))
  const grids = taus.map((tau) => {
    const g = { tau, carrier: new Float64Array(S + 1), first: new Int32Array(S + 1), vertexZ: new Float64Array(maxVertices), vertexC: new Float64Array(maxVertices), comparisons: list.filter(c => c.tau === tau) }
    carrierGrid(tau, S, dp, maxVertices, g.carrier, g.first, g.vertexZ, g.vertexC)
    return g
  })
  const phases = [ma, mb]
  for (let j = 0; j < S; j++) {
    for (const g of grids) {
      const from = g.first[j]!
      const to = g.first[j + 1]!
      for (const c of g.comparisons) {
        for (let ph = 0; ph < 2; ph++) {
          const m = phases[ph]!
          const sign = ph === 0 ? 1 : -1
          const m0 = m[j]!
          const dm = m[j + 1]! - m0
          let zPrev = 0
          let uPrev = c.alpha * m0 + c.beta - g.carrier[j]!
          for (let k = from; k < to; k++) {
            const z = g.vertexZ[k]!
            const uv = c.alpha * (m0 + z * dm) + c.beta - g.vertexC[k]!
            events.addPositive(zPrev, z, uPrev, uv, sign * c.weight)
            zPrev = z
            uPrev = uv
          }
          events.addPositive(zPrev, 1, uPrev, c.alpha * m[j + 1]! + c.beta - g.carrier[j + 1]!, sign * c.weight)
        }
      }
    }
    total += events.takeMeanSquare()
  }
  return total / S
}

export function synthesise(input: SynthesisInput): Synthesis {
  const a = pole(input, 0)
  const b = pole(input, TWO_PI / 3)
  const line = new Float64Array(a.length)
  for (let j = 0; j < a.length; j++) line[j] = a[j]! - b[j]!
  return { pole: a, line }
}

/**
 * Peak amplitude per harmonic order 0…maxOrder of a periodic signal given as interval means over
 * one period: |c_h| = |X_h| / (n·sinc(πh/n)) undoes the interval averaging.
 */
export function harmonicAmplitudes(samples: Float64Array, maxOrder: number): Float64Array {
  const n = samples.length
  const re = Float64Array.from(samples)
  const im = new Float64Array(n)
  fft(re, im)
  const out = new Float64Array(maxOrder + 1)
  out[0] = Math.abs(re[0]!) / n
  for (let h = 1; h <= maxOrder && h < n / 2; h++) {
    const x = (Math.PI * h) / n
    out[h] = (2 * Math.hypot(re[h]!, im[h]!)) / n / (Math.sin(x) / x)
  }
  return out
}

/** THD = √(Σ_{h=2}^{H} A_h²) / A_1. */
export function totalHarmonicDistortion(amplitudes: Float64Array): number {
  const a1 = amplitudes[1]!
  let sum = 0
  for (let h = 2; h < amplitudes.length; h++) sum += amplitudes[h]! * amplitudes[h]!
  return a1 > 0 ? Math.sqrt(sum) / a1 : 0
}
