// Six-step (square-wave) two-level operation against the Fourier series of Holmes & Lipo (2003).
import { describe, expect, it } from 'vitest'
import { EngineInputError, evaluateStress, type StressInput } from '../../../shared/engine'
import { device, expectClose } from './helpers'

const HL = 'Holmes & Lipo, Pulse Width Modulation for Power Converters, IEEE Press/Wiley 2003'
const sixStep = (Vdc: number, pf = 0.9): StressInput => ({
  topology: 'two-level', dcVoltage: Vdc, lineVoltageRms: 0, phaseCurrentRms: 50, powerFactor: pf, fundamentalHz: 50, switchingHz: 50, modulation: 'six-step',
})

describe('six-step', () => {
  it.each([400, 650, 1100].map(Vdc => ({ Vdc, source: HL })))('V_dc=$Vdc: line fundamental RMS (√6/π)·V_dc, peak (2√3/π)·V_dc, M = 4/π ($source)', ({ Vdc }) => {
    const r = evaluateStress(sixStep(Vdc), { includeSpectrum: true })
    expectClose(r.lineVoltageFundamentalRms, (Math.sqrt(6) / Math.PI) * Vdc, 1e-5, 'RMS')
    expectClose(r.spectrum![0]!.amplitude, ((2 * Math.sqrt(3)) / Math.PI) * Vdc, 1e-5, 'peak from the spectrum')
    expect(r.modulationIndex).toBeCloseTo(4 / Math.PI, 12)
    expect(r.warnings).toEqual([])
  })

  it(`harmonics of order 6k±1 at 1/h of the fundamental, none else (${HL}; tol 1e-3)`, () => {
    const r = evaluateStress(sixStep(600), { includeSpectrum: true })
    const a1 = r.spectrum![0]!.amplitude
    const line = (h: number) => r.spectrum!.find(l => l.order === h)?.amplitude ?? 0
    for (let h = 2; h <= 49; h++) {
      if (h % 6 === 1 || h % 6 === 5) expectClose(line(h) / a1, 1 / h, 1e-3, `h=${h}`)
      else expect(line(h) / a1, `h=${h}`).toBeLessThan(1e-4)
    }
  })

  it(`line-voltage THD ≈ 31 % (${HL}) and equal to the 1/h series over the orders it covers`, () => {
    const r = evaluateStress(sixStep(600))
    let sum = 0
    for (let h = 5; h <= r.thdMaxOrder!; h++) if (h % 6 === 1 || h % 6 === 5) sum += 1 / (h * h)
    expectClose(r.lineVoltageThdToOrder, Math.sqrt(sum), 1e-3, 'truncated series')
    // The full series √(π²/9 − 1) = 0.3108 (V_LL,rms = √(2/3)·V_dc, V_LL,1 = (√6/π)·V_dc); orders beyond thdMaxOrder add < 0.003.
    expect(Math.abs(r.lineVoltageThdToOrder - Math.sqrt((Math.PI ** 2) / 9 - 1))).toBeLessThan(0.003)
    // The full-band figure from the time-domain RMS is the whole series itself.
    expectClose(r.lineVoltageThd, Math.sqrt((Math.PI ** 2) / 9 - 1), 1e-6, 'full band')
  })

  it('180° conduction: S1 avg (Î/2π)(1 + cos φ), D1 avg (Î/2π)(1 − cos φ) (derived from the square wave; first principles)', () => {
    for (const pf of [1, 0.7, 0, -0.5]) {
      const r = evaluateStress(sixStep(600, pf))
      const Ih = Math.SQRT2 * 50
      expectClose(device(r.devices, 'S1').currentAvg, (Ih / (2 * Math.PI)) * (1 + pf), 1e-4, `S1 pf=${pf}`)
      expectClose(device(r.devices, 'D1').currentAvg, (Ih / (2 * Math.PI)) * (1 - pf), pf === 1 ? 1e-6 : 1e-4, `D1 pf=${pf}`)
    }
  })

  it('ignores lineVoltageRms (it follows from the DC link) and refuses multilevel topologies', () => {
    const a = evaluateStress(sixStep(600))
    const b = evaluateStress({ ...sixStep(600), lineVoltageRms: 123 })
    expect(b.lineVoltageFundamentalRms).toBe(a.lineVoltageFundamentalRms)
    expect(b.devices).toEqual(a.devices)
    for (const topology of ['diode-clamped', 't-type', 'anpc', 'flying-capacitor', 'cascaded-h-bridge', 'matrix'] as const) {
      const input = { ...sixStep(600), topology, levels: 3, inputLineVoltageRms: 400 }
      expect(() => evaluateStress(input)).toThrowError(EngineInputError)
      try { evaluateStress(input) }
      catch (e) { expect((e as EngineInputError).field).toBe('modulation') }
    }
  })
})
