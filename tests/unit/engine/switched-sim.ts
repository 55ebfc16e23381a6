// The brute-force switched simulation of a capacitor stack that the sizing tests hold the engine to
// (capacitor-sim.test.ts, capacitor-sim-sweep.test.ts; the circuit and its steady state are described there):
// natural-sampled PWM against triangular carriers, sinusoidal load currents, a DC source behind its choke,
// balancing resistors, periodic steady state by shooting. Written independently of shared/engine.
import { solve } from './helpers'

const TWO_PI = 2 * Math.PI
export const F1 = 50
/** even and a multiple of 2·(cells) so that no step straddles a carrier peak or valley */
export const STEPS_PER_CARRIER = 1200

/**
 * Time grid of the shortest run that is periodic at the design's carrier ratio f_sw/f: one fundamental period for a
 * whole ratio, q periods when f_sw/f × q is whole (99.5: two, 80.25: four).
 */
export interface Grid { fsw: number, steps: number, dt: number, periods: number }
export function gridFor(fsw: number, stepsPerCarrier = STEPS_PER_CARRIER): Grid {
  const ratio = fsw / F1
  const periods = [1, 2, 3, 4].find(q => Number.isInteger(Math.round(ratio * q * 1e9) / 1e9))
  if (periods === undefined) throw new Error(`carrier ratio ${ratio} does not repeat within four periods`)
  const steps = Math.round(ratio * periods) * stepsPerCarrier
  return { fsw, steps, dt: periods / (F1 * steps), periods }
}
/** Triangular carrier in [0, 1], valley at integer p (same convention as the engine's PD bands). */
export const tri = (p: number) => 1 - Math.abs(2 * (p - Math.floor(p)) - 1)

/**
 * Fraction of time step k during which a switch compared with `level` is on (level above the
 * carrier, the carrier shifted by `shift` periods): the carrier is linear within the step, so the
 * crossing instant is solved exactly; a switching edge sampled to the nearest step instead would
 * add a random walk to the capacitor charge that grows with the number of periods.
 */
export function onFraction(g: Grid, level: number, k: number, shift = 0): number {
  const a = tri(g.fsw * k * g.dt + shift)
  const b = tri(g.fsw * (k + 1) * g.dt + shift)
  const u = Math.min(1, Math.max(0, (level - a) / (b - a)))
  return b > a ? u : 1 - u
}

export interface Network {
  grid: Grid
  /** F, capacitor j (index 0 = the one next to DC node 0) */
  capacitance: number[]
  /** V, DC source across the whole stack; absent: no source (flying capacitor) */
  sourceVoltage?: number
  /** current withdrawn through capacitor j's top node by the legs at step n: w[n·J + j] (A) */
  drawn: Float64Array
}

export interface SimResult {
  /** V peak-to-peak per capacitor */
  ripple: number[]
  /** A, RMS of each capacitor's current minus its mean */
  currentRms: number[]
  /** largest |x(T) − x(0)| relative to the ripple, after shooting */
  closure: number
}

/**
 * Semi-implicit Euler over one fundamental period. State: [i_L, v_1 … v_J] with a source,
 * [v_1 … v_J] without. L_s di/dt = V_s − R_s·i − Σv; C_j dv_j/dt = i_L − w_j − v_j/R_b.
 */
export function simulate(net: Network): SimResult {
  const { steps: N_STEPS, dt: DT } = net.grid
  const J = net.capacitance.length
  const withSource = net.sourceVoltage !== undefined
  const cString = 1 / net.capacitance.reduce((s, c) => s + 1 / c, 0)
  const wr = TWO_PI * (F1 / 10)
  const Ls = 1 / (wr * wr * cString)
  const Rs = 2 * 0.3 * Math.sqrt(Ls / cString)
  const Rb = net.capacitance.map(c => 0.1 / c)
  const n = (withSource ? 1 : 0) + J

  const run = (x0: Float64Array, forced: boolean, record?: { hi: Float64Array, lo: Float64Array, s: Float64Array, s2: Float64Array }): Float64Array => {
    const x = Float64Array.from(x0)
    const vs = forced && withSource ? net.sourceVoltage! : 0
    for (let k = 0; k < N_STEPS; k++) {
      let iL = 0
      if (withSource) {
        let sumV = 0
        for (let j = 0; j < J; j++) sumV += x[1 + j]!
        x[0] = x[0]! + (DT / Ls) * (vs - Rs * x[0]! - sumV)
        iL = x[0]!
      }
      for (let j = 0; j < J; j++) {
        const idx = (withSource ? 1 : 0) + j
        const w = forced ? net.drawn[k * J + j]! : 0
        const ic = iL - w - x[idx]! / Rb[j]!
        x[idx] = x[idx]! + (DT / net.capacitance[j]!) * ic
        if (record) {
          const v = x[idx]!
          if (v > record.hi[j]!) record.hi[j] = v
          if (v < record.lo[j]!) record.lo[j] = v
          record.s[j]! += ic
          record.s2[j]! += ic * ic
        }
      }
    }
    return x
  }

  // Shooting: x(T) = Φ·x(0) + x_f for this linear network.
  const xf = run(new Float64Array(n), true)
  const phi: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0))
  for (let c = 0; c < n; c++) {
    const e = new Float64Array(n)
    e[c] = 1
    const col = run(e, false)
    for (let r = 0; r < n; r++) phi[r]![c] = col[r]!
  }
  const a = phi.map((row, r) => row.map((v, c) => (r === c ? 1 : 0) - v))
  const x0 = solve(a, Array.from(xf))
  const record = { hi: new Float64Array(J).fill(-Infinity), lo: new Float64Array(J).fill(Infinity), s: new Float64Array(J), s2: new Float64Array(J) }
  const xEnd = run(Float64Array.from(x0), true, record)
  const ripple = Array.from({ length: J }, (_, j) => record.hi[j]! - record.lo[j]!)
  let closure = 0
  for (let j = 0; j < J; j++) {
    const idx = (withSource ? 1 : 0) + j
    closure = Math.max(closure, Math.abs(xEnd[idx]! - x0[idx]!) / ripple[j]!)
  }
  const currentRms = Array.from({ length: J }, (_, j) => {
    const mean = record.s[j]! / N_STEPS
    return Math.sqrt(record.s2[j]! / N_STEPS - mean * mean)
  })
  return { ripple, currentRms, closure }
}

export const Ih = Math.SQRT2 * 100
export const phaseCurrent = (theta: number, phi: number) => Ih * Math.sin(theta - phi)

/** Pole references of the sim, written out independently of shared/engine/modulation.ts. */
export function poleReference(modulation: 'sine' | 'space-vector', M: number, theta: number): number {
  const s = (x: number) => Math.sin(theta - (x * TWO_PI) / 3)
  if (modulation === 'sine') return M * s(0)
  const mid = (Math.max(s(0), s(1), s(2)) + Math.min(s(0), s(1), s(2))) / 2
  return M * (s(0) - mid)
}

/**
 * Three legs with PD carriers common to the phases on a stack of L−1 capacitors: capacitor j
 * (1-based, between DC nodes j−1 and j) has the currents of every phase whose pole sits at a node
 * ≥ j drawn through its top.
 */
export function stackDrawn(g: Grid, L: number, M: number, pf: number, modulation: 'sine' | 'space-vector'): Float64Array {
  const { steps: N_STEPS, dt: DT } = g
  const J = L - 1
  const phi = Math.acos(pf)
  const w = new Float64Array(N_STEPS * J)
  for (let k = 0; k < N_STEPS; k++) {
    const theta = TWO_PI * F1 * (k + 0.5) * DT
    for (let x = 0; x < 3; x++) {
      const th = theta - (x * TWO_PI) / 3
      // clamped past the linear range, as the engine's reference is (and as the carrier comparison does anyway)
      const r = ((1 + Math.max(-1, Math.min(1, poleReference(modulation, M, th)))) * (L - 1)) / 2
      const i = phaseCurrent(th, phi)
      // The pole sits at a node ≥ j while r − (j − 1) is above the carrier (PD bands).
      for (let j = 1; j <= J; j++) w[k * J + j - 1]! += onFraction(g, r - (j - 1), k) * i
    }
  }
  return w
}
