// Foster network time response (shared/thermal/network.ts): against its analytic step response, the steady
// response of a first-order RC to a sinusoidal loss (closed form), and brute-force stepping from cold.
import { describe, expect, it } from 'vitest'
import { fosterNetwork, fosterProblems, periodicRise, sinusoidalRise, stepPeriods, stepResponse, type FosterPair } from '../../../shared/thermal/network'

// An invented four-pair network (K/W, s), of the size a 450 A module's datasheet table gives.
const pairs: FosterPair[] = [{ r: 0.006, tau: 0.0008 }, { r: 0.02, tau: 0.012 }, { r: 0.03, tau: 0.06 }, { r: 0.009, tau: 0.4 }]

describe('Foster network', () => {
  it('stepped from cold under a constant loss follows the analytic step response Σ R_i(1 − e^(−t/τ_i)) (first principles)', () => {
    const P = 250
    const dt = 1e-4
    // 1 step per "period": stepPeriods then returns the rise after k steps.
    for (const steps of [1, 10, 100, 1000, 20000]) {
      const { rise } = stepPeriods(pairs, [P], dt, steps)
      // Exact for constant power (the exponential step is the solution over each step).
      expect(rise[0]).toBeCloseTo(P * stepResponse(pairs, steps * dt), 10)
    }
    // Long after the step: the steady R_th = Σ R_i.
    expect(stepResponse(pairs, 100)).toBeCloseTo(0.065, 12)
  })

  it('periodic steady state under a sinusoidal loss matches the first-order RC closed form per element, summed (linear circuit theory: H(jω) = R/(1 + jωτ))', () => {
    const f = 2
    const omega = 2 * Math.PI * f
    const B = 4000
    const dt = 1 / (f * B)
    const P0 = 300
    const P1 = 280
    // Power sampled at mid-step: the zero-order hold differs from the smooth sine by O(ωΔt)².
    const power = Array.from({ length: B }, (_, k) => P0 + P1 * Math.sin(omega * (k + 0.5) * dt))
    const rise = periodicRise(pairs, power, dt)
    let worst = 0
    for (let k = 0; k < B; k += 97) {
      const t = (k + 1) * dt
      const exact = pairs.reduce((s, p) => s + sinusoidalRise(p, P0, P1, omega, t), 0)
      worst = Math.max(worst, Math.abs(rise[k]! - exact))
    }
    // Swing ~ 2 · 280 W · 0.05 K/W ≈ 25 K: within 0.05 K (the hold's half-step delay on the fastest element).
    expect(worst).toBeLessThan(0.05)
    const peak = Math.max(...rise)
    const exactPeak = Math.max(...Array.from({ length: B }, (_, k) => pairs.reduce((s, p) => s + sinusoidalRise(p, P0, P1, omega, (k + 1) * dt), 0)))
    expect(Math.abs(peak - exactPeak)).toBeLessThan(0.05)
  })

  it('the periodic state solved directly equals stepping from cold until the period repeats (brute force)', () => {
    const B = 96
    const dt = 1 / (2 * B)
    const power = Array.from({ length: B }, (_, k) => (k < B / 2 ? 600 * Math.sin((Math.PI * k) / (B / 2)) : 0) + 40)
    const direct = periodicRise(pairs, power, dt)
    // τ_max 0.4 s, period 0.5 s: 60 periods leave e^(−75) of the start.
    const { rise } = stepPeriods(pairs, power, dt, 60)
    for (let k = 0; k < B; k++) expect(direct[k]).toBeCloseTo(rise[k]!, 9)
    // Mean over the period = R_th · mean loss (the recurrence keeps the mean).
    const mean = direct.reduce((s, x) => s + x, 0) / B
    expect(mean).toBeCloseTo(0.065 * (power.reduce((s, x) => s + x, 0) / B), 9)
  })

  it('an element without capacity follows the loss at once; a single R_th stands in when no Foster pairs are given', () => {
    const r = periodicRise([{ r: 0.1, tau: 0 }], [10, 20, 30], 0.01)
    expect(Array.from(r)).toEqual([1, 2, 3])
    expect(fosterNetwork({ rthJunctionCaseSwitch: 0.07 }, 'switch')).toEqual({ pairs: [{ r: 0.07, tau: 0 }], fromFoster: false })
    expect(fosterNetwork({ rthJunctionCaseSwitch: 0.07, zthSwitchR1: 0.03, zthSwitchTau1: 0.01, zthSwitchR2: 0.04, zthSwitchTau2: 0.2 }, 'switch')!.pairs).toHaveLength(2)
    expect(fosterNetwork({ rthJunctionCaseSwitch: 0.07 }, 'diode')).toBeNull()
  })

  it('names a pair given by half and an R_i sum far from R_th,jc', () => {
    const problems = fosterProblems({ zthDiodeR2: 0.02, rthJunctionCaseSwitch: 0.1, zthSwitchR1: 0.03, zthSwitchTau1: 0.01 })
    expect(problems).toContainEqual(expect.objectContaining({ field: 'zthDiodeTau2', severity: 'error' }))
    expect(problems).toContainEqual(expect.objectContaining({ field: 'zthSwitchR1', severity: 'warning' }))
    expect(fosterProblems({ rthJunctionCaseSwitch: 0.065, ...Object.fromEntries(pairs.flatMap((p, i) => [[`zthSwitchR${i + 1}`, p.r], [`zthSwitchTau${i + 1}`, p.tau]])) })).toEqual([])
  })
})
