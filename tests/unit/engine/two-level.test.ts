// Two-level leg, sine PWM: device currents and DC-link capacitor current against published closed forms.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { device, expectClose, inputAt } from './helpers'

const I = 100
const Ih = Math.SQRT2 * I

// F. Bierhoff, F. W. Fuchs, "Semiconductor losses in voltage source and current source IGBT converters
// based on analytical derivation", IEEE PESC 2004 — valid for every φ, so regeneration rows included.
const bierhoffFuchs = [
  { M: 0.2, pf: 1.0 },
  { M: 0.5, pf: 0.8 },
  { M: 0.8, pf: 0.9 },
  { M: 1.0, pf: 0.5 },
  { M: 0.6, pf: 0.0 },
  { M: 0.9, pf: -0.7 },
  { M: 1.0, pf: -1.0 },
].map(r => ({ ...r, source: 'Bierhoff & Fuchs, IEEE PESC 2004', tol: 1e-4 }))

describe('two-level sine PWM device currents', () => {
  it.each(bierhoffFuchs)('M=$M pf=$pf ($source, rel. tol $tol)', ({ M, pf, tol }) => {
    const r = evaluateStress(inputAt('two-level', M, pf))
    const phi = Math.acos(pf)
    const c = M * Math.cos(phi)
    const s1 = device(r.devices, 'S1')
    const d1 = device(r.devices, 'D1')
    expectClose(s1.currentAvg, Ih * (1 / (2 * Math.PI) + c / 8), tol, 'I_T,avg')
    expectClose(s1.currentRms, Ih * Math.sqrt(1 / 8 + c / (3 * Math.PI)), tol, 'I_T,rms')
    expectClose(d1.currentAvg, Ih * (1 / (2 * Math.PI) - c / 8), tol, 'I_D,avg')
    expectClose(d1.currentRms, Ih * Math.sqrt(1 / 8 - c / (3 * Math.PI)), tol, 'I_D,rms')
    // Half-wave symmetry: the lower switch and diode see the same (first principles).
    expectClose(device(r.devices, 'S2').currentRms, s1.currentRms, 1e-9, 'S2 = S1')
    expectClose(device(r.devices, 'D2').currentAvg, d1.currentAvg, 1e-9, 'D2 = D1')
    expect(r.modulationIndex).toBeCloseTo(M, 12)
  })

  it('regeneration swaps switch and diode dominance (ENGINEERING.md conventions; Bierhoff & Fuchs sign of cos φ)', () => {
    const motoring = evaluateStress(inputAt('two-level', 0.9, 0.9))
    const braking = evaluateStress(inputAt('two-level', 0.9, -0.9))
    expect(device(motoring.devices, 'S1').currentAvg).toBeGreaterThan(device(motoring.devices, 'D1').currentAvg)
    expect(device(braking.devices, 'D1').currentAvg).toBeGreaterThan(device(braking.devices, 'S1').currentAvg)
    // Exact swap: motoring switch = braking diode (cos φ changes sign only).
    expectClose(device(braking.devices, 'D1').currentRms, device(motoring.devices, 'S1').currentRms, 1e-9, 'swap')
  })

  it('blocking voltages at V_dc,max plus overshoot on every commutating device (ENGINEERING.md table; common practice)', () => {
    const r = evaluateStress(inputAt('two-level', 0.8, 0.9, { dcVoltage: 700, dcVoltageMax: 800, overshootVoltage: 120 }))
    for (const d of r.devices) {
      expect(d.blockingVoltage).toBeCloseTo(800, 9)
      expect(d.blockingVoltageWithOvershoot).toBeCloseTo(920, 9)
      expect(d.commutatedVoltage).toBeCloseTo(700, 9)
    }
    const fromSlope = evaluateStress(inputAt('two-level', 0.8, 0.9, { dcVoltage: 700, strayInductance: 50e-9, currentSlope: 2e9 }))
    expect(fromSlope.devices[0]!.blockingVoltageWithOvershoot).toBeCloseTo(700 + 100, 9)
  })
})

// J. W. Kolar, S. D. Round, "Analytical calculation of the RMS current stress on the DC-link capacitor
// of voltage-PWM converter systems", IEE Proc. Electric Power Applications 153(4), 2006.
const kolarRound = [0.3, 0.6, 0.9, 1.0].flatMap(M =>
  [0, Math.PI / 6, Math.PI / 3, Math.PI / 2, (2 * Math.PI) / 3, Math.PI].map(phi => ({ M, phi, source: 'Kolar & Round, IEE Proc. EPA 153(4) 2006', tol: 1e-4 })))

describe('two-level DC-link capacitor RMS current', () => {
  it.each(kolarRound)('M=$M φ=$phi ($source, rel. tol $tol)', ({ M, phi, tol }) => {
    const r = evaluateStress(inputAt('two-level', M, Math.cos(phi)))
    const expected = I * Math.sqrt(2 * M * (Math.sqrt(3) / (4 * Math.PI) + Math.cos(phi) ** 2 * (Math.sqrt(3) / Math.PI - (9 * M) / 16)))
    const cdc = r.capacitors[0]!
    expect(cdc.kind).toBe('dc-link')
    expectClose(cdc.rippleCurrentRms, expected, tol, 'I_C,rms')
    // Balanced three-phase sine PWM: the averaged DC current is constant, no low-frequency ripple (first principles).
    expect(cdc.lowFrequencyRippleRms!).toBeLessThan(1e-6 * I)
  })
})
