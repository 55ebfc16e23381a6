// Capacitor ripple currents against a brute-force time-domain simulation of the switched currents
// (first principles: carriers compared with the references sample by sample, no averaging), and
// the cascaded H-bridge second-harmonic form.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { lockedPeriods, splitLinkCurrents } from '../../../shared/engine/capacitors'
import { gridReference, makeReference } from '../../../shared/engine/modulation'
import { switchedSplitLinkCharge } from '../../../shared/engine/switched-charge'
import { expectClose, inputAt } from './helpers'

const TWO_PI = 2 * Math.PI
const tri = (p: number) => 1 - Math.abs(2 * (p - Math.floor(p)) - 1)
const mf = 200
const SAMPLES = 400_000

/** RMS of (x − mean) of a sampled signal over one fundamental period. */
function acRms(f: (theta: number, t: number) => number): number {
  let s = 0
  let s2 = 0
  for (let k = 0; k < SAMPLES; k++) {
    const t = (k + 0.5) / SAMPLES
    const x = f(TWO_PI * t, t)
    s += x
    s2 += x * x
  }
  const mean = s / SAMPLES
  return Math.sqrt(s2 / SAMPLES - mean * mean)
}

const M = 0.85
const pf = 0.8
const phi = Math.acos(pf)
const Ih = Math.SQRT2 * 100
const cur = (theta: number) => Ih * Math.sin(theta - phi)

describe('DC-link capacitors of diode-clamped legs (simulated, PD carriers common to the three phases)', () => {
  it.each([3, 5])('N=%i: each series capacitor within 1 % of the simulation', (N) => {
    const r = evaluateStress(inputAt('diode-clamped', M, pf, { levels: N, switchingHz: 50 * mf }))
    const level = (theta: number, t: number) => {
      const rr = ((1 + M * Math.sin(theta)) * (N - 1)) / 2
      let l = 0
      for (let k = 0; k < N - 1; k++) if (rr > k + tri(t * mf)) l++
      return l
    }
    for (let j = 1; j <= N - 1; j++) {
      const sim = acRms((theta, t) => {
        let ic = 0
        for (let x = 0; x < 3; x++) if (level(theta - (x * TWO_PI) / 3, t) >= j) ic -= cur(theta - (x * TWO_PI) / 3)
        return ic
      })
      expectClose(r.capacitors.find(c => c.name === `Cdc${j}`)!.rippleCurrentRms, sim, 0.01, `Cdc${j}`)
    }
    // Real power through a five-level diode-clamped leg: the inner capacitors cannot hold their voltages (Rodriguez, Lai, Peng, IEEE TIE 2002).
    expect(r.warnings.some(w => /do not balance/.test(w))).toBe(N > 3)
  })
})

describe('flying capacitors (simulated phase-shifted carriers)', () => {
  it.each([3, 5])('N=%i: every flying capacitor within 1 % of the simulation; DC link as a two-level link', (N) => {
    const r = evaluateStress(inputAt('flying-capacitor', M, pf, { levels: N, switchingHz: 50 * mf }))
    const cell = (theta: number, t: number, k: number) => ((1 + M * Math.sin(theta)) / 2 > tri(t * mf + k / (N - 1)) ? 1 : 0)
    for (let j = 1; j <= N - 2; j++) {
      const sim = acRms((theta, t) => (cell(theta, t, j) - cell(theta, t, j - 1)) * cur(theta))
      expectClose(r.capacitors.find(c => c.name === `Cf${N - 1 - j}`)!.rippleCurrentRms, sim, 0.01, `Cf${N - 1 - j}`)
    }
    const twoLevel = evaluateStress(inputAt('two-level', M, pf, { switchingHz: 50 * mf }))
    expectClose(r.capacitors.find(c => c.kind === 'dc-link')!.rippleCurrentRms, twoLevel.capacitors[0]!.rippleCurrentRms, 1e-9, 'DC link')
  })
})

describe('cascaded H-bridge cell capacitor', () => {
  it('matches the simulated unipolar cell current within 1 %', () => {
    const r = evaluateStress(inputAt('cascaded-h-bridge', M, pf, { levels: 5, switchingHz: 50 * mf }))
    const sim = acRms((theta, t) => {
      const m = M * Math.sin(theta)
      const a = (1 + m) / 2 > tri(t * mf) ? 1 : 0
      const b = (1 - m) / 2 > tri(t * mf) ? 1 : 0
      return (a - b) * cur(theta)
    })
    expectClose(r.capacitors[0]!.rippleCurrentRms, sim, 0.01, 'Ccell')
  })

  it.each([0.3, 0.7, 1.0].flatMap(m => [1, 0.5, -0.9].map(p => ({ m, p }))))('M=$m pf=$p: second-harmonic cell current M·Î/(2√2) (ENGINEERING.md; first principles: cell power balance; tol 1e-4)', ({ m, p }) => {
    const r = evaluateStress(inputAt('cascaded-h-bridge', m, p, { levels: 7, capacitorRippleTarget: 20 }))
    const c = r.capacitors[0]!
    expectClose(c.lowFrequencyRippleRms!, (m * Ih) / (2 * Math.SQRT2), 1e-4, 'I_2 rms')
    // Charge swing of the second harmonic M·Î/(2ω) sets the capacitance; the switching swing adds a few per cent.
    const lowFrequency = (m * Ih) / (2 * TWO_PI * 50) / 20
    expect(c.capacitanceRequired!).toBeGreaterThanOrEqual(lowFrequency * (1 - 1e-4))
    expect(c.capacitanceRequired!).toBeLessThan(lowFrequency * 1.1)
    expect(c.rippleTarget).toBe(20)
  })
})

describe('capacitance sizing', () => {
  it('scales inversely with the ripple target; default target 5 % of the nominal capacitor voltage (common practice)', () => {
    const a = evaluateStress(inputAt('diode-clamped', 0.9, 0.9, { dcVoltage: 1000 }))
    const b = evaluateStress(inputAt('diode-clamped', 0.9, 0.9, { dcVoltage: 1000, capacitorRippleTarget: 50 }))
    expect(a.capacitors[0]!.rippleTarget).toBeCloseTo(25, 9)
    expectClose(b.capacitors[0]!.capacitanceRequired!, a.capacitors[0]!.capacitanceRequired! / 2, 1e-12, 'C ∝ 1/ΔV')
  })
})

describe('ripple definition in the provenance', () => {
  it.each([
    { topology: 'two-level' as const, levels: 2 },
    { topology: 'diode-clamped' as const, levels: 5 },
    { topology: 't-type' as const, levels: 3 },
    { topology: 'anpc' as const, levels: 3 },
    { topology: 'flying-capacitor' as const, levels: 5 },
    { topology: 'cascaded-h-bridge' as const, levels: 7 },
  ])('$topology: every capacitor states peak-to-peak over the fundamental period, switching ripple included', ({ topology, levels }) => {
    const r = evaluateStress(inputAt(topology, 0.8, 0.9, { levels }))
    expect(r.capacitors.length).toBeGreaterThan(0)
    for (const c of r.capacitors) {
      expect(c.provenance.method).toMatch(/peak-to-peak capacitor voltage over one fundamental period in periodic steady state, switching-frequency ripple included/)
      expect(c.capacitanceRequired! > 0 && Number.isFinite(c.capacitanceRequired!)).toBe(true)
    }
  })
})

describe('the locked-carrier charge of a split link (switched-charge.ts)', () => {
  it('applies where the carrier pattern repeats within four periods, not to six-step or a drifting carrier', () => {
    expect(lockedPeriods(80)).toBe(1)
    expect(lockedPeriods(99.5)).toBe(2)
    expect(lockedPeriods(250 / 3)).toBe(3)
    expect(lockedPeriods(80.25)).toBe(4)
    expect(lockedPeriods(80.2)).toBeNull()
    expect(lockedPeriods(1)).toBeNull()
    expect(lockedPeriods(Number.NaN)).toBeNull()
  })

  it('stays finite when f_sw/f is a multiple of the fine grid (an angle a hair below 0 once rounded onto the grid\'s end)', () => {
    for (const ratio of [6138, 12276, 3069]) {
      const q = switchedSplitLinkCharge(3, gridReference('space-vector', 1, 2046), 100, 0.3, ratio, 10)
      for (const v of q) expect(Number.isFinite(v) && v > 0).toBe(true)
    }
  })

  it('six-step keeps the quasi-static figure (its switching frequency is the fundamental)', () => {
    const input = { topology: 'two-level' as const, dcVoltage: 800, lineVoltageRms: 0, phaseCurrentRms: 50, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 50, modulation: 'six-step' as const }
    const r = evaluateStress(input)
    const reference = makeReference('six-step', 4 / Math.PI)
    const quasi = splitLinkCurrents(2, reference, 50 * Math.SQRT2, r.powerFactor.currentPhaseAngle, 2046, 50, 50)[0]!
    expect(r.capacitors[0]!.capacitanceRequired! * r.capacitors[0]!.rippleTarget!).toBeCloseTo(quasi.charge, 12)
  })
})
