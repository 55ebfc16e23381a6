// Linear ranges, over-modulation warnings, and the synthesised waveform / spectrum against the averaged model.
import { describe, expect, it } from 'vitest'
import { evaluateStress, topologies, type Modulation } from '../../../shared/engine'
import { gridReference, makeReference } from '../../../shared/engine/modulation'
import { expectClose, inputAt } from './helpers'

const HL = 'Holmes & Lipo, IEEE Press/Wiley 2003'

describe('linear range and over-modulation', () => {
  it.each([
    { modulation: 'sine', M: 0.99, over: false },
    { modulation: 'sine', M: 1.05, over: true },
    { modulation: 'third-harmonic', M: 1.1, over: false },
    { modulation: 'third-harmonic', M: 1.16, over: true },
    { modulation: 'space-vector', M: 1.15, over: false },
    { modulation: 'space-vector', M: 1.25, over: true },
  ] as { modulation: Modulation, M: number, over: boolean }[])(`$modulation M=$M: linear limit 1 (sine) or 2/√3 (injection) (${HL}; ENGINEERING.md)`, ({ modulation, M, over }) => {
    for (const topology of ['two-level', 'diode-clamped', 'flying-capacitor', 'cascaded-h-bridge'] as const) {
      const input = inputAt(topology, M, 0.9, { modulation, levels: topology === 'two-level' ? 2 : 5 })
      const r = evaluateStress(input)
      expect(r.warnings.some(w => w.startsWith('Over-modulation')), topology).toBe(over)
      expect(r.modulationIndex).toBeCloseTo(M, 12)
      // Inside the range the requested fundamental is produced; past it the clamped reference gives less, and says so.
      if (!over) expectClose(r.lineVoltageFundamentalRms, input.lineVoltageRms, 1e-5, topology)
      else expect(r.lineVoltageFundamentalRms).toBeLessThan(input.lineVoltageRms * (1 - 1e-6))
    }
  })
})

const PWM: Modulation[] = ['sine', 'third-harmonic', 'space-vector']
const spectrumCases = topologies.flatMap(t => (t.allowedLevels === 'ignored' ? [3] : t.allowedLevels.filter(n => [2, 3, 5, 9].includes(n)))
  .flatMap(N => PWM.map(modulation => ({ id: t.id, N, modulation }))))

describe('switched waveform and spectrum', () => {
  it.each(spectrumCases)(`$id N=$N $modulation: spectrum fundamental equals the averaged model (natural sampling, ${HL}; tol 1e-3)`, ({ id, N, modulation }) => {
    const input = id === 'matrix'
      ? { topology: id, inputLineVoltageRms: 400, lineVoltageRms: 300, phaseCurrentRms: 10, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 4850, modulation }
      : inputAt(id, 0.9, 0.9, { levels: N, modulation, switchingHz: 4850 })
    const r = evaluateStress(input, { includeSpectrum: true, includeWaveform: true })
    const a1 = r.spectrum!.find(l => l.order === 1)!
    expect(a1.frequency).toBe(50)
    expectClose(a1.amplitude / Math.SQRT2, r.lineVoltageFundamentalRms, 1e-3, 'fundamental')
    // THD from the listed lines (≥ 0.01 % of the fundamental) agrees with the reported THD.
    const listed = Math.sqrt(r.spectrum!.filter(l => l.order > 1).reduce((s, l) => s + l.amplitude ** 2, 0)) / a1.amplitude
    expectClose(listed, r.lineVoltageThdToOrder, 1e-3, 'THD from lines')
    // The full band holds every order: never below the order-limited sum.
    expect(r.lineVoltageThd).toBeGreaterThanOrEqual(r.lineVoltageThdToOrder * (1 - 1e-9))
    expect(r.spectrum!.every(l => l.order <= r.thdMaxOrder!)).toBe(true)
    // The waveform's own RMS equals the root-sum-square of its harmonics (Parseval; first principles).
    const w = r.waveform!
    const rms = Math.sqrt(w.lineVoltage.reduce((s, v) => s + v * v, 0) / w.lineVoltage.length)
    expect(rms).toBeGreaterThanOrEqual(r.lineVoltageFundamentalRms * Math.sqrt(1 + r.lineVoltageThdToOrder ** 2) * 0.99)
    expect(w.time).toHaveLength(w.lineVoltage.length)
    expect(w.time[w.time.length - 1]!).toBeLessThan(1 / 50)
  })

  it('line-voltage THD falls as levels are added (PD carriers; common practice, Rodriguez, Lai, Peng, IEEE TIE 2002)', () => {
    const thd = [3, 5, 7, 9].map(N => evaluateStress(inputAt('diode-clamped', 0.9, 0.9, { levels: N })).lineVoltageThd)
    for (let k = 1; k < thd.length; k++) expect(thd[k]!).toBeLessThan(thd[k - 1]!)
  })

  it('level values of the pole voltage: only the N levels of the leg appear away from switching edges (first principles)', () => {
    const r = evaluateStress(inputAt('diode-clamped', 0.8, 0.9, { levels: 5, dcVoltage: 4000 }), { includeWaveform: true, samples: 1 << 15 })
    const levels = new Set(r.waveform!.poleVoltage.filter(v => Math.abs(v / 1000 - Math.round(v / 1000)) < 1e-9).map(v => Math.round(v)))
    expect([...levels].sort((a, b) => a - b)).toEqual([-2000, -1000, 0, 1000, 2000])
  })

  it('samples option: rounded up to a power of two and bounds the THD order', () => {
    const r = evaluateStress(inputAt('two-level', 0.8, 0.9), { includeWaveform: true, samples: 3000 })
    expect(r.waveform!.lineVoltage).toHaveLength(4096)
    expect(r.thdMaxOrder).toBeLessThanOrEqual(1024)
  })
})

describe('gridReference', () => {
  it.each(['sine', 'third-harmonic', 'space-vector', 'six-step'] as const)('%s: its grid values are makeReference at the grid angles (bit for bit); the integration angles and their −2π/3 shifts read them (to 1e-12, the angles\' rounding), any other angle is exact', (modulation) => {
    for (const a of [0.4, 1.1, 1.3]) {
      const exact = makeReference(modulation, a)
      const points = 2046
      const remembered = gridReference(modulation, a, points)
      const d = (2 * Math.PI) / points
      for (let k = 0; k < points; k++) {
        for (const shift of [0, (2 * Math.PI) / 3, (4 * Math.PI) / 3]) {
          const t = (k + 0.5) * d - shift
          expect(Math.abs(remembered(t) - exact(t))).toBeLessThan(1e-12)
        }
      }
      for (let j = 0; j < 3 * points; j++) expect(remembered.values[j]).toBe(exact(((j + 0.5) * 2 * Math.PI) / (3 * points)))
      for (const t of [0.123, 1, 2.5, -0.7]) expect(remembered(t)).toBe(exact(t))
    }
  })
})
