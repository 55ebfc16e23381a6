// Capacitance for a ripple target, proved by simulating what it sizes: a brute-force switched
// time-domain run of the capacitor voltages, independent of the engine's sizing code.
//
// The circuit: ideal switches; each leg's pole set by natural-sampled PWM (the reference compared
// with triangular carriers every time step, at the design's carrier ratio f_sw/f); sinusoidal load
// currents of the operating point injected at the pole's DC node; a stiff DC source V_s behind its
// choke L_s and series resistance R_s feeding the capacitor stack (or, for an H-bridge cell, the
// cell's isolated supply); a balancing resistor R_b across every capacitor (time constant R_b·C =
// 0.1 s) so that the floating voltages have one steady state. L_s puts the source resonance with
// the bank at f/10 (5 Hz, damping ratio 0.3): the supply then carries the DC current and none of the
// ripple (Kolar & Round's assumption of a ripple-free DC source current, which the engine also
// makes), to within 0.3 % at the lowest ripple frequency 2f. Periodic steady state by shooting:
// the network is linear and the switched currents do not depend on its state, so the state after
// one fundamental period is x(T) = Φ·x(0) + x_forced, and x(0) = (I − Φ)⁻¹·x_forced; the run from
// that x(0) is checked to close on itself.
//
// Ripple = peak-to-peak capacitor voltage over one fundamental period in that steady state,
// switching-frequency ripple included (the definition in the engine's provenance).
//
// Acceptance band 0.97…1.03 of the target: the engine treats each switching period as quasi-static
// (reference and current held over the period) and takes the worst period on a continuous angle,
// while the simulation has 100 discrete carrier periods per fundamental with the reference moving
// within each; both effects are of order 1/(f_sw/f) of the within-period swing (≈ 1 %). A band
// that also refuses 3 % too much capacitance keeps the sizing from hiding behind margin.
// Space-vector references near a power factor of ±1 are in the two-level table: at each of the reference's six
// kinks per period the mean current of the switching period depends on where the kink falls within it, and a
// carrier locked to the fundamental meets every kink at the same phase; the quasi-static figure alone measured
// 1.039, 1.031 and 1.042 of the target in those three rows, the engine's switched-charge figure (switched-charge.ts)
// brings them inside the band (see shared/engine/README.md).
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import type { StressResult } from '../../../shared/engine'
import { expectClose, inputAt, solve } from './helpers'

const TWO_PI = 2 * Math.PI
const F1 = 50
/** even and a multiple of 2·(cells) so that no step straddles a carrier peak or valley */
const STEPS_PER_CARRIER = 1200

/**
 * Time grid of the shortest run that is periodic at the design's carrier ratio f_sw/f: one fundamental period for a
 * whole ratio, q periods when f_sw/f × q is whole (99.5: two, 80.25: four).
 */
interface Grid { fsw: number, steps: number, dt: number, periods: number }
function gridFor(fsw: number): Grid {
  const ratio = fsw / F1
  const periods = [1, 2, 3, 4].find(q => Number.isInteger(Math.round(ratio * q * 1e9) / 1e9))
  if (periods === undefined) throw new Error(`carrier ratio ${ratio} does not repeat within four periods`)
  const steps = Math.round(ratio * periods) * STEPS_PER_CARRIER
  return { fsw, steps, dt: periods / (F1 * steps), periods }
}
/** Triangular carrier in [0, 1], valley at integer p (same convention as the engine's PD bands). */
const tri = (p: number) => 1 - Math.abs(2 * (p - Math.floor(p)) - 1)

/**
 * Fraction of time step k during which a switch compared with `level` is on (level above the
 * carrier, the carrier shifted by `shift` periods): the carrier is linear within the step, so the
 * crossing instant is solved exactly; a switching edge sampled to the nearest step instead would
 * add a random walk to the capacitor charge that grows with the number of periods.
 */
function onFraction(g: Grid, level: number, k: number, shift = 0): number {
  const a = tri(g.fsw * k * g.dt + shift)
  const b = tri(g.fsw * (k + 1) * g.dt + shift)
  const u = Math.min(1, Math.max(0, (level - a) / (b - a)))
  return b > a ? u : 1 - u
}

interface Network {
  grid: Grid
  /** F, capacitor j (index 0 = the one next to DC node 0) */
  capacitance: number[]
  /** V, DC source across the whole stack; absent: no source (flying capacitor) */
  sourceVoltage?: number
  /** current withdrawn through capacitor j's top node by the legs at step n: w[n·J + j] (A) */
  drawn: Float64Array
}

interface SimResult {
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
function simulate(net: Network): SimResult {
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

const Ih = Math.SQRT2 * 100
const phaseCurrent = (theta: number, phi: number) => Ih * Math.sin(theta - phi)

/** Pole references of the sim, written out independently of shared/engine/modulation.ts. */
function poleReference(modulation: 'sine' | 'space-vector', M: number, theta: number): number {
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
function stackDrawn(g: Grid, L: number, M: number, pf: number, modulation: 'sine' | 'space-vector'): Float64Array {
  const { steps: N_STEPS, dt: DT } = g
  const J = L - 1
  const phi = Math.acos(pf)
  const w = new Float64Array(N_STEPS * J)
  for (let k = 0; k < N_STEPS; k++) {
    const theta = TWO_PI * F1 * (k + 0.5) * DT
    for (let x = 0; x < 3; x++) {
      const th = theta - (x * TWO_PI) / 3
      const r = ((1 + poleReference(modulation, M, th)) * (L - 1)) / 2
      const i = phaseCurrent(th, phi)
      // The pole sits at a node ≥ j while r − (j − 1) is above the carrier (PD bands).
      for (let j = 1; j <= J; j++) w[k * J + j - 1]! += onFraction(g, r - (j - 1), k) * i
    }
  }
  return w
}

/** Simulated ripple over the engine's target, per capacitor (the engine asked for `capacitance`). */
function ratios(r: StressResult, names: string[], sim: SimResult): Array<{ name: string, ratio: number }> {
  return names.map((name, j) => ({ name, ratio: sim.ripple[j]! / r.capacitors.find(c => c.name === name)!.rippleTarget! }))
}

function expectWithinBand(list: Array<{ name: string, ratio: number }>, what: string): void {
  for (const { name, ratio } of list) {
    expect(ratio, `${what} ${name}: simulated ripple / target = ${ratio.toFixed(4)}`).toBeGreaterThanOrEqual(0.97)
    expect(ratio, `${what} ${name}: simulated ripple / target = ${ratio.toFixed(4)}`).toBeLessThanOrEqual(1.03)
  }
}

describe('two-level DC link: simulated peak-to-peak ripple with the engine\'s capacitance', () => {
  it.each([
    { M: 0.85, pf: 0.8, modulation: 'sine' as const, fsw: 5000 },
    { M: 0.5, pf: 1.0, modulation: 'sine' as const, fsw: 5000 },
    { M: 1.1, pf: 0.9, modulation: 'space-vector' as const, fsw: 5000 },
    { M: 0.9, pf: -0.7, modulation: 'sine' as const, fsw: 2500 },
    { M: 0.3, pf: 0, modulation: 'sine' as const, fsw: 5000 },
    { M: 0.6, pf: 0.5, modulation: 'space-vector' as const, fsw: 2000 },
    // space vector at the edge of its linear range (2/√3 ≈ 1.155): the duties graze 0 and 1
    { M: 1.15, pf: 0.9, modulation: 'space-vector' as const, fsw: 5000 },
    // power factor near ±1 with space-vector references: the ripple is the switching swing, and the carrier locked
    // to the fundamental meets the reference's kinks at the same phase every period
    { M: 1.15, pf: -0.99, modulation: 'space-vector' as const, fsw: 5000 },
    { M: 0.95, pf: -0.99, modulation: 'space-vector' as const, fsw: 4900 },
    { M: 1.0, pf: 0.99, modulation: 'space-vector' as const, fsw: 4000 },
    // carrier ratios that repeat only after two and four periods (99.5, 80.25): the charge beats at f/2 and f/4,
    // which the quasi-static figure alone missed by 9 % and more
    { M: 0.95, pf: -0.99, modulation: 'space-vector' as const, fsw: 4975 },
    { M: 0.9, pf: 0.8, modulation: 'sine' as const, fsw: 4012.5 },
    { M: 1.1, pf: 0.99, modulation: 'space-vector' as const, fsw: 4012.5 },
  ])('M=$M pf=$pf $modulation f_sw=$fsw Hz: ripple within 0.97…1.03 of the target', ({ M, pf, modulation, fsw }) => {
    const target = 8
    const g = gridFor(fsw)
    const r = evaluateStress(inputAt('two-level', M, pf, { switchingHz: fsw, modulation, capacitorRippleTarget: target }))
    const cap = r.capacitors[0]!
    const sim = simulate({ grid: g, capacitance: [cap.capacitanceRequired!], sourceVoltage: 800, drawn: stackDrawn(g, 2, M, pf, modulation) })
    expect(sim.closure).toBeLessThan(1e-3)
    expectWithinBand(ratios(r, [cap.name], sim), 'two-level')
    // Cross-check of the simulated capacitor current: J. W. Kolar, S. D. Round, IEE Proc. EPA 153(4)
    // 2006, I_C,rms = I·√(2M(√3/(4π) + cos²φ(√3/π − 9M/16))) for sine PWM (the engine's own figure
    // is checked against it in two-level.test.ts); 1 % for the finite carrier ratio.
    if (modulation === 'sine') {
      const kolar = 100 * Math.sqrt(2 * M * (Math.sqrt(3) / (4 * Math.PI) + pf * pf * (Math.sqrt(3) / Math.PI - (9 * M) / 16)))
      expectClose(sim.currentRms[0]!, kolar, 0.01, 'simulated I_C,rms vs Kolar & Round')
    }
  })
})

describe('three-level split DC link (NPC, and the T-type and ANPC with the same DC-side currents): each capacitor simulated', () => {
  it.each([
    { topology: 'diode-clamped' as const, M: 0.85, pf: 0.8, modulation: 'sine' as const, fsw: 5000 },
    { topology: 'diode-clamped' as const, M: 0.6, pf: 0.3, modulation: 'sine' as const, fsw: 5000 },
    { topology: 'diode-clamped' as const, M: 1.0, pf: 0.9, modulation: 'space-vector' as const, fsw: 3000 },
    { topology: 't-type' as const, M: 0.9, pf: -0.8, modulation: 'sine' as const, fsw: 5000 },
    { topology: 'anpc' as const, M: 0.7, pf: 0.95, modulation: 'space-vector' as const, fsw: 5000 },
    { topology: 'diode-clamped' as const, M: 0.3, pf: 0, modulation: 'sine' as const, fsw: 5000 },
    { topology: 'diode-clamped' as const, M: 1.15, pf: 1, modulation: 'space-vector' as const, fsw: 5000 },
    { topology: 'diode-clamped' as const, M: 0.95, pf: 1, modulation: 'sine' as const, fsw: 2000 },
    { topology: 't-type' as const, M: 1.15, pf: 0.85, modulation: 'space-vector' as const, fsw: 5000 },
  ])('$topology M=$M pf=$pf $modulation f_sw=$fsw Hz: every capacitor within 0.97…1.03 of the target', ({ topology, M, pf, modulation, fsw }) => {
    const target = 6
    const L = 3
    const g = gridFor(fsw)
    const r = evaluateStress(inputAt(topology, M, pf, { levels: L, switchingHz: fsw, modulation, capacitorRippleTarget: target }))
    const names = ['Cdc1', 'Cdc2']
    const capacitance = names.map(n => r.capacitors.find(c => c.name === n)!.capacitanceRequired!)
    const sim = simulate({ grid: g, capacitance, sourceVoltage: 800, drawn: stackDrawn(g, L, M, pf, modulation) })
    expect(sim.closure).toBeLessThan(1e-3)
    expectWithinBand(ratios(r, names, sim), topology)
    // The simulated capacitor currents agree with the engine's RMS figure (its own check in capacitors.test.ts).
    names.forEach((n, j) => expectClose(sim.currentRms[j]!, r.capacitors.find(c => c.name === n)!.rippleCurrentRms, 0.01, `${n} I_rms`))
  })
})

describe('flying capacitors: simulated peak-to-peak ripple under phase-shifted carriers', () => {
  it.each([
    { N: 3, M: 0.85, pf: 0.8, fsw: 5000 },
    { N: 3, M: 0.4, pf: 1.0, fsw: 5000 },
    { N: 5, M: 0.85, pf: 0.8, fsw: 5000 },
    { N: 5, M: 0.3, pf: 0.5, fsw: 3000 },
    { N: 3, M: 1.0, pf: 0, fsw: 5000 },
    { N: 4, M: 0.7, pf: 0.9, fsw: 3000 },
    { N: 7, M: 0.9, pf: 0.9, fsw: 2000 },
  ])('N=$N M=$M pf=$pf f_sw=$fsw Hz: every flying capacitor within 0.97…1.03 of the target', ({ N, M, pf, fsw }) => {
    const target = 10
    const g = gridFor(fsw)
    const r = evaluateStress(inputAt('flying-capacitor', M, pf, { levels: N, switchingHz: fsw, capacitorRippleTarget: target }))
    const phi = Math.acos(pf)
    // Cell k compares d = (1 + m)/2 with its carrier shifted by k/(N−1) of a period; the capacitor
    // between cells j−1 and j (counted from the DC link, 0-based) carries (s_j − s_{j−1})·i.
    for (let j = 1; j <= N - 2; j++) {
      const name = `Cf${N - 1 - j}`
      const cap = r.capacitors.find(c => c.name === name)!
      const drawn = new Float64Array(g.steps)
      for (let k = 0; k < g.steps; k++) {
        const theta = TWO_PI * F1 * (k + 0.5) * g.dt
        const d = (1 + M * Math.sin(theta)) / 2
        drawn[k] = (onFraction(g, d, k, j / (N - 1)) - onFraction(g, d, k, (j - 1) / (N - 1))) * phaseCurrent(theta, phi)
      }
      const sim = simulate({ grid: g, capacitance: [cap.capacitanceRequired!], drawn })
      expect(sim.closure).toBeLessThan(1e-3)
      expectWithinBand(ratios(r, [name], sim), `flying N=${N}`)
    }
    // Three levels, bound from first principles: the two cell pulses sit half a period apart and
    // each lasts at most T_sw/2, so ΔV_pp ≤ Î/(2·C·f_sw), reached when d = 1/2 at the current peak.
    if (N === 3) {
      const cap = r.capacitors.find(c => c.kind === 'flying')!
      expect(cap.rippleTarget! * cap.capacitanceRequired!).toBeLessThanOrEqual((Ih / (2 * fsw)) * (1 + 1e-9))
    }
  })

  it('N=3: the DC link of the flying-capacitor converter meets its target like a two-level link', () => {
    const target = 8
    const g = gridFor(5000)
    const r = evaluateStress(inputAt('flying-capacitor', 0.85, 0.8, { levels: 3, switchingHz: g.fsw, capacitorRippleTarget: target }))
    const cap = r.capacitors.find(c => c.kind === 'dc-link')!
    const sim = simulate({ grid: g, capacitance: [cap.capacitanceRequired!], sourceVoltage: 800, drawn: stackDrawn(g, 2, 0.85, 0.8, 'sine') })
    expectWithinBand(ratios(r, [cap.name], sim), 'flying DC link')
  })
})

describe('cascaded H-bridge cell capacitor: simulated peak-to-peak ripple, single-phase cell', () => {
  it.each([
    { M: 0.85, pf: 0.8, fsw: 5000 },
    { M: 0.5, pf: 1.0, fsw: 5000 },
    { M: 1.0, pf: -0.6, fsw: 1000 },
    { M: 0.2, pf: 0.1, fsw: 5000 },
  ])('M=$M pf=$pf f_sw=$fsw Hz: within 0.97…1.03 of the target; the 2nd harmonic dominates', ({ M, pf, fsw }) => {
    const target = 15
    const levels = 5
    const vCell = 600
    const g = gridFor(fsw)
    const r = evaluateStress(inputAt('cascaded-h-bridge', M, pf, { levels, dcVoltage: vCell, switchingHz: fsw, capacitorRippleTarget: target }))
    const cap = r.capacitors[0]!
    const phi = Math.acos(pf)
    // Unipolar PWM: legs A and B compare (1 ± m)/2 with the cell's carrier; the cell draws (s_A − s_B)·i
    // from its capacitor. Every cell of the phase has the same m; the carrier shift between cells
    // does not change one cell's capacitor voltage.
    const drawn = new Float64Array(g.steps)
    for (let k = 0; k < g.steps; k++) {
      const theta = TWO_PI * F1 * (k + 0.5) * g.dt
      const m = M * Math.sin(theta)
      drawn[k] = (onFraction(g, (1 + m) / 2, k) - onFraction(g, (1 - m) / 2, k)) * phaseCurrent(theta, phi)
    }
    const sim = simulate({ grid: g, capacitance: [cap.capacitanceRequired!], sourceVoltage: vCell, drawn })
    expect(sim.closure).toBeLessThan(1e-3)
    expectWithinBand(ratios(r, [cap.name], sim), 'H-bridge cell')
    // First principles (cell charge balance): the second harmonic of the cell power S·cos(2ωt − φ)
    // gives ΔV_pp = S/(ω·C·V_cell), S = V_cell·M·Î/2 (ΔV amplitude P/(2ωC·V_dc) at unity power
    // factor); the switching swing adds only a few per cent on top.
    const lowFrequency = (vCell * M * Ih) / 2 / (TWO_PI * F1 * cap.capacitanceRequired! * vCell)
    expect(sim.ripple[0]! / lowFrequency).toBeGreaterThan(1)
    expect(sim.ripple[0]! / lowFrequency).toBeLessThan(1.1)
  })
})
