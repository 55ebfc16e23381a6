// Three-level NPC (diode-clamped N = 3), sine PWM: every position against forms derived the same way.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { device, expectClose, inputAt } from './helpers'

const Ih = Math.SQRT2 * 100
const rows = [0.4, 0.8, 1.0].flatMap(M => [0, Math.PI / 6, Math.PI / 3, Math.PI / 2].map(phi => ({ M, phi, tol: 1e-4 })))

describe('NPC positions, 0 ≤ φ ≤ π/2', () => {
  it.each(rows)('M=$M φ=$phi', ({ M, phi, tol }) => {
    const r = evaluateStress(inputAt('diode-clamped', M, Math.cos(phi)))
    const d = (n: string) => device(r.devices, n)
    const c = Math.cos(phi)
    const s = Math.sin(phi)
    // Outer switch average: (M·Î/4π)((π−φ)cosφ + sinφ) — Orfanoudakis, Yuratich, Sharkh, IET PEMD 2010 (ENGINEERING.md).
    expectClose(d('S1').currentAvg, ((M * Ih) / (4 * Math.PI)) * ((Math.PI - phi) * c + s), tol, 'S1 avg')
    // Outer switch RMS² = M·Î²(1+cosφ)²/(6π): derived here the same way (∫ M sinθ·Î² sin²(θ−φ) over φ…π).
    expectClose(d('S1').currentRms, Math.sqrt((M * Ih * Ih * (1 + c) ** 2) / (6 * Math.PI)), tol, 'S1 rms')
    // Clamp diode average (Î/2π)[2 − (M/2)((π−2φ)cosφ + 2 sinφ)]: derived the same way (duty 1 − |m| at the neutral level).
    expectClose(d('Dc1+').currentAvg, (Ih / (2 * Math.PI)) * (2 - (M / 2) * ((Math.PI - 2 * phi) * c + 2 * s)), tol, 'Dc+ avg')
    // Series paths (first principles): S2 carries S1's and Dc1+'s current, D2 only D1's.
    expectClose(d('S2').currentAvg, d('S1').currentAvg + d('Dc1+').currentAvg, 1e-9, 'S2 = S1 + Dc+')
    expectClose(d('S2').currentRms ** 2, d('S1').currentRms ** 2 + d('Dc1+').currentRms ** 2, 1e-9, 'S2² = S1² + Dc+²')
    expectClose(d('D2').currentAvg, d('D1').currentAvg, 1e-9, 'D2 = D1')
    // The four output-adjacent positions carry the phase current: avg of |i| = 2Î/π, mean square Î²/2 (ENGINEERING.md).
    const adj = ['S2', 'D2', 'S3', 'D3'].map(d)
    expectClose(adj.reduce((a, x) => a + x.currentAvg, 0), (2 * Ih) / Math.PI, 1e-6, 'Σ avg')
    expectClose(adj.reduce((a, x) => a + x.currentRms ** 2, 0), (Ih * Ih) / 2, 1e-6, 'Σ rms²')
  })

  it('switches and clamp diodes block V_dc/2 and commutate V_dc/2 (Nabae, Takahashi, Akagi, IEEE TIA 1981)', () => {
    const r = evaluateStress(inputAt('diode-clamped', 0.8, 0.9, { dcVoltage: 1000, dcVoltageMax: 1100, overshootVoltage: 50 }))
    for (const d of r.devices) {
      expect(d.blockingVoltage).toBeCloseTo(550, 9)
      expect(d.blockingVoltageWithOvershoot).toBeCloseTo(600, 9)
      expect(d.commutatedVoltage).toBeCloseTo(500, 9)
    }
  })

  it('split capacitors: equal ripple, zero-mean neutral-point current, third-harmonic low-frequency part (Nabae et al. 1981; first principles)', () => {
    const r = evaluateStress(inputAt('diode-clamped', 0.9, 0.85))
    const [c1, c2] = r.capacitors
    expectClose(c1!.rippleCurrentRms, c2!.rippleCurrentRms, 1e-9, 'C1 = C2')
    expect(c1!.lowFrequencyRippleRms!).toBeGreaterThan(0.05 * Ih)
    expect(r.warnings.join(' ')).not.toMatch(/balance/)
    expect(c1!.capacitanceRequired!).toBeGreaterThan(0)
  })
})

describe('three-level legs sharing the NPC level pattern (first principles; Orfanoudakis et al., IET PEMD 2010 for the outer switch)', () => {
  it.each([[0.9, 0.85], [0.6, -0.7]])('M=%f pf=%f: T-type and active NPC outer switches equal the NPC outer switch; T-type neutral path equals the NPC clamp path', (M, pf) => {
    const npc = evaluateStress(inputAt('diode-clamped', M, pf))
    const t = evaluateStress(inputAt('t-type', M, pf))
    const a = evaluateStress(inputAt('anpc', M, pf))
    for (const n of ['S1', 'D1', 'S4', 'D4']) {
      expectClose(device(t.devices, n).currentRms, device(npc.devices, n).currentRms, 1e-12, `T-type ${n}`)
      expectClose(device(a.devices, n).currentAvg, device(npc.devices, n).currentAvg, 1e-12, `ANPC ${n}`)
    }
    // T-type: S3 and D2 carry the neutral-point current out, as Dc1+ does in the NPC.
    expectClose(device(t.devices, 'S3').currentAvg, device(npc.devices, 'Dc1+').currentAvg, 1e-12, 'T-type S3 = NPC Dc1+')
    // ANPC: the neutral-path devices together carry what the NPC clamp diodes carry.
    const anpcNeutral = ['S5', 'D5', 'S6', 'D6'].reduce((s, n) => s + device(a.devices, n).currentAvg, 0)
    expectClose(anpcNeutral, device(npc.devices, 'Dc1+').currentAvg + device(npc.devices, 'Dc1-').currentAvg, 1e-9, 'neutral path')
  })
})
