// Junction temperature over the fundamental period (shared/thermal/dynamics.ts with the per-angle duty of
// shared/engine/profile.ts), checked against an independent switched time-domain run: a two-level leg with
// a triangular carrier, the switch's instantaneous conduction loss and its switching energies at each
// crossing, stepped through the same Foster network from cold until the period repeats.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { lossProfile } from '../../../shared/engine/profile'
import { junctionDynamics, type DynamicsPart, type ProfiledDuty } from '../../../shared/thermal/dynamics'
import { deviceLossAtPoint, pointDutiesOf } from '../../../shared/thermal/losses'
import type { StressInput } from '../../../shared/engine/types'
import { inventedModule, stiffCooling } from './fixtures'

// An invented 1200 V / 450 A switch-diode module, figures at 150 °C only (no temperature dependence here).
const part: DynamicsPart = inventedModule
const cooling = stiffCooling

function point(fundamentalHz: number, M: number): StressInput {
  // A low-speed start: full current at low voltage (M small) and low frequency.
  return { topology: 'two-level', levels: 2, dcVoltage: 650, lineVoltageRms: (M * 325 * Math.sqrt(3)) / Math.SQRT2, phaseCurrentRms: 220, powerFactor: 0.85, fundamentalHz, switchingHz: 2500, modulation: 'sine' }
}

function ours(input: StressInput) {
  const stress = evaluateStress(input)
  const duty = pointDutiesOf({ points: [{ ...stress, pointName: 'p' }] as never }, 'S1')[0]!
  const profile = lossProfile(input).positions.find(p => p.name === 'S1')!
  const profiled: ProfiledDuty = { ...duty, profile, fundamentalHz: input.fundamentalHz }
  return { duty, dyn: junctionDynamics(part, 'switch', profiled, input.switchingHz, 1, 1, cooling, null)! }
}

/** Independent: the switched two-level leg stepped in time, S1's losses into the Foster network + R_th,ch. */
function switchedRun(input: StressInput, stepsPerCarrier = 40, periods = 14) {
  const f = input.fundamentalHz
  const fsw = input.switchingHz
  const dt = 1 / (fsw * stepsPerCarrier)
  const steps = Math.round(1 / (f * dt))
  const M = (input.lineVoltageRms * Math.SQRT2) / Math.sqrt(3) / (input.dcVoltage! / 2)
  const Ipk = input.phaseCurrentRms * Math.SQRT2
  const phi = Math.acos(input.powerFactor)
  const elems = [[0.006, 0.0008], [0.02, 0.012], [0.03, 0.06], [0.009, 0.4]] as const
  const state = new Float64Array(elems.length)
  let prevOn = false
  const last = new Float64Array(steps)
  let energy = 0
  for (let period = 0; period < periods; period++) {
    for (let k = 0; k < steps; k++) {
      const t = (k + 0.5) * dt
      const theta = 2 * Math.PI * f * t
      const x = (t * fsw) % 1
      const carrier = x < 0.5 ? 4 * x - 1 : 3 - 4 * x
      const on = M * Math.sin(theta) > carrier
      const i = Ipk * Math.sin(theta - phi)
      let p = on && i > 0 ? (0.9 + 2.6e-3 * i) * i : 0
      // S1 switches hard only while it carries the current (i > 0): E·(|i|/I_ref)·(V_dc/V_ref).
      if (on !== prevOn && i > 0) p += ((on ? 38e-3 : 52e-3) * (i / 450) * (input.dcVoltage! / 600)) / dt
      prevOn = on
      let rise = 0
      elems.forEach(([r, tau], e) => {
        const a = Math.exp(-dt / tau)
        state[e] = a * state[e]! + (1 - a) * r * p
        rise += state[e]!
      })
      if (period === periods - 1) {
        last[k] = rise
        energy += p * dt
      }
    }
  }
  // R_th,ch carries the mean loss (the model's stated assumption).
  const caseRise = 0.02 * energy * f
  const tj = Array.from(last, r => cooling.ambientTemperatureC + caseRise + r)
  return { mean: tj.reduce((s, x) => s + x, 0) / steps, peak: tj.reduce((a, x) => Math.max(a, x), -Infinity) }
}

describe('junction temperature over the fundamental period', () => {
  it('the profile averages to the point\'s own duty (the same losses as the point)', () => {
    const input = point(2, 0.08)
    const { duty } = ours(input)
    const profile = lossProfile(input).positions.find(p => p.name === 'S1')!
    const mean = (a: Float64Array) => a.reduce((s, x) => s + x, 0) / a.length
    // Within 10⁻⁵: the profile samples the period at 1152 points, the point's integration at 2048.
    expect(Math.abs(mean(profile.currentAbs) / duty.currentAvg - 1)).toBeLessThan(1e-5)
    expect(Math.abs(Math.sqrt(mean(profile.currentSquare)) / duty.currentRms - 1)).toBeLessThan(1e-5)
    expect(Math.abs(mean(profile.turnOff!) / duty.switchingDuty!.turnOff - 1)).toBeLessThan(1e-3)
  })

  it('a 2 Hz start point: peak T_j well above the mean, against the switched time-domain run (independent)', () => {
    const input = point(2, 0.08)
    const { dyn, duty } = ours(input)
    const brute = switchedRun(input, 200)
    const loss = deviceLossAtPoint(part, 'switch', duty, input.switchingHz)!.total
    // Mean: T_amb + P·(ΣR_i + R_th,ch), and the switched run's mean within 1 %.
    expect(dyn.meanC).toBeCloseTo(60 + loss * 0.085, 3)
    expect(Math.abs(dyn.meanC - brute.mean)).toBeLessThan(0.01 * (brute.mean - 60))
    // Peak: the switched run (carrier ripple included) within 3 % of the rise above ambient.
    expect(Math.abs(dyn.peakC - brute.peak)).toBeLessThan(0.03 * (brute.peak - 60))
    // At 2 Hz the junction follows the half-wave of current: the peak sits far above the mean.
    expect(dyn.peakC - dyn.meanC).toBeGreaterThan(10)
    expect(dyn.swingK).toBeGreaterThan(20)
  })

  it('at 50 Hz the same current gives almost no swing (the Foster network filters it)', () => {
    const slow = ours(point(2, 0.08)).dyn
    const fast = ours(point(50, 0.08)).dyn
    expect(fast.peakC - fast.meanC).toBeLessThan((slow.peakC - slow.meanC) / 4)
    const brute = switchedRun(point(50, 0.08), 200, 60)
    expect(Math.abs(fast.peakC - brute.peak)).toBeLessThan(0.03 * (brute.peak - 60))
  })

  it('without Foster data the junction follows the instantaneous losses (single R_th, an upper bound)', () => {
    const input = point(2, 0.08)
    const stress = evaluateStress(input)
    const duty = pointDutiesOf({ points: [{ ...stress, pointName: 'p' }] as never }, 'S1')[0]!
    const profile = lossProfile(input).positions.find(p => p.name === 'S1')!
    const plain = { ...part, zthSwitchR1: undefined, zthSwitchR2: undefined, zthSwitchR3: undefined, zthSwitchR4: undefined }
    const single = junctionDynamics(plain, 'switch', { ...duty, profile, fundamentalHz: 2 }, 2500, 1, 1, cooling, null)!
    const foster = ours(input).dyn
    expect(single.fromFoster).toBe(false)
    expect(single.peakC).toBeGreaterThan(foster.peakC)
    expect(single.note).toMatch(/no Foster data/)
  })
})
