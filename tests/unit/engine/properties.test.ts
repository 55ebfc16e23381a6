// Property tests (fast-check): random valid inputs give finite, consistent stresses; random bad inputs
// are refused with an EngineInputError naming the corrupted field.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { EngineInputError, evaluateStress, linearLimit, topologies, type StressInput } from '../../../shared/engine'

const validInput: fc.Arbitrary<StressInput> = fc.constantFrom(...topologies).chain((t) => {
  const levels = t.allowedLevels === 'ignored' ? fc.constant(undefined) : fc.constantFrom(...t.allowedLevels)
  return fc.record({
    topology: fc.constant(t.id),
    levels,
    dcVoltage: fc.double({ min: 50, max: 20000, noNaN: true }),
    dcMargin: fc.double({ min: 1, max: 1.3, noNaN: true }),
    inputLineVoltageRms: fc.double({ min: 100, max: 13800, noNaN: true }),
    index: fc.double({ min: 0, max: 1.3, noNaN: true }),
    phaseCurrentRms: fc.double({ min: 0, max: 5000, noNaN: true }),
    powerFactor: fc.double({ min: -1, max: 1, noNaN: true }),
    fundamentalHz: fc.double({ min: 0.5, max: 400, noNaN: true }),
    ratio: fc.double({ min: 12, max: 300, noNaN: true }),
    modulation: fc.constantFrom(...t.modulations),
    overshootVoltage: fc.option(fc.double({ min: 0, max: 500, noNaN: true }), { nil: undefined }),
  }).map((r): StressInput => {
    const N = r.levels ?? 3
    const half = t.supply === 'cell' ? ((N - 1) / 2) * r.dcVoltage : t.supply === 'ac-input' ? r.inputLineVoltageRms * Math.SQRT2 / Math.sqrt(3) : r.dcVoltage / 2
    return {
      topology: r.topology,
      levels: r.levels,
      dcVoltage: r.dcVoltage,
      dcVoltageMax: r.dcVoltage * r.dcMargin,
      inputLineVoltageRms: r.inputLineVoltageRms,
      // The output line voltage is bounded at 100 kV (limits.ts); a 15-level cascade of 20 kV cells would ask more.
      lineVoltageRms: Math.min((r.index * half * Math.sqrt(3)) / Math.SQRT2, 100_000),
      phaseCurrentRms: r.phaseCurrentRms,
      powerFactor: r.powerFactor,
      fundamentalHz: r.fundamentalHz,
      switchingHz: r.fundamentalHz * r.ratio,
      modulation: r.modulation,
      overshootVoltage: r.overshootVoltage,
    }
  })
})

describe('random valid inputs (first principles: bounds every stress must respect)', () => {
  it('give finite, non-negative, consistent outputs', () => {
    fc.assert(fc.property(validInput, (input) => {
      const r = evaluateStress(input)
      const Ih = Math.SQRT2 * input.phaseCurrentRms
      const eps = 1e-9 * (1 + Ih)
      for (const d of r.devices) {
        for (const v of [d.blockingVoltage, d.blockingVoltageWithOvershoot, d.currentAvg, d.currentRms, d.currentPeak]) {
          expect(Number.isFinite(v) && v >= 0).toBe(true)
        }
        expect(d.blockingVoltage).toBeGreaterThan(0)
        expect(d.blockingVoltageWithOvershoot).toBeGreaterThanOrEqual(d.blockingVoltage)
        expect(d.currentPeak).toBeLessThanOrEqual(Ih + eps)
        expect(d.currentAvg).toBeLessThanOrEqual(d.currentRms + eps)
        // i² ≤ Î·|i| at every instant, so I_rms² ≤ I_peak·I_avg.
        expect(d.currentRms ** 2).toBeLessThanOrEqual(d.currentPeak * d.currentAvg * (1 + 1e-9) + eps)
      }
      for (const c of r.capacitors) {
        for (const v of [c.voltage, c.rippleCurrentRms, c.capacitanceRequired!]) expect(Number.isFinite(v) && v >= 0).toBe(true)
      }
      expect(Number.isFinite(r.lineVoltageThd) && r.lineVoltageThd >= 0).toBe(true)
      expect(Number.isFinite(r.lineVoltageFundamentalRms) && r.lineVoltageFundamentalRms >= 0).toBe(true)
      expect(r.counts.switchesTotal).toBe(3 * r.counts.switchesPerPhase)
      // Over-modulation is never silent.
      if (input.modulation !== 'six-step') {
        const amplitude = r.modulationIndex / (input.topology === 'matrix' ? 0.75 : 1)
        const over = amplitude > linearLimit[input.modulation] * (1 + 1e-9)
        expect(r.warnings.some(w => w.startsWith('Over-modulation'))).toBe(over)
        if (!over) expect(Math.abs(r.lineVoltageFundamentalRms - input.lineVoltageRms)).toBeLessThanOrEqual(1e-5 * input.lineVoltageRms + 1e-9)
      }
    }), { numRuns: 120 })
  }, 60_000)
})

type Corruption = { field: keyof StressInput, value: unknown, applies?: (i: StressInput) => boolean }
const corruptions: Corruption[] = [
  { field: 'topology', value: 'nine-phase' },
  { field: 'modulation', value: 'hysteresis' },
  { field: 'levels', value: 16, applies: i => i.topology !== 'matrix' },
  { field: 'levels', value: 2.5, applies: i => i.topology !== 'matrix' },
  { field: 'levels', value: 4, applies: i => ['two-level', 't-type', 'anpc', 'cascaded-h-bridge'].includes(i.topology) },
  { field: 'dcVoltage', value: 0, applies: i => i.topology !== 'matrix' },
  { field: 'dcVoltage', value: -400, applies: i => i.topology !== 'matrix' },
  { field: 'dcVoltage', value: Number.NaN, applies: i => i.topology !== 'matrix' },
  { field: 'dcVoltage', value: undefined, applies: i => i.topology !== 'matrix' },
  { field: 'dcVoltage', value: '700', applies: i => i.topology !== 'matrix' },
  { field: 'dcVoltageMax', value: 1, applies: i => i.topology !== 'matrix' },
  { field: 'inputLineVoltageRms', value: undefined, applies: i => i.topology === 'matrix' },
  { field: 'inputLineVoltageRms', value: -1, applies: i => i.topology === 'matrix' },
  { field: 'lineVoltageRms', value: -10, applies: i => i.modulation !== 'six-step' },
  { field: 'lineVoltageRms', value: undefined, applies: i => i.modulation !== 'six-step' },
  { field: 'phaseCurrentRms', value: -1 },
  { field: 'phaseCurrentRms', value: Number.POSITIVE_INFINITY },
  { field: 'powerFactor', value: 1.01 },
  { field: 'powerFactor', value: -3 },
  { field: 'fundamentalHz', value: 0 },
  { field: 'fundamentalHz', value: -50 },
  { field: 'switchingHz', value: 0 },
  { field: 'switchingHz', value: -1000 },
  { field: 'overshootVoltage', value: -5 },
  { field: 'strayInductance', value: -1e-9 },
  { field: 'clampDiodeUnitVoltage', value: 0 },
  { field: 'capacitorRippleTarget', value: -2 },
]

describe('random invalid inputs', () => {
  it('throw EngineInputError naming the corrupted field', () => {
    fc.assert(fc.property(validInput, fc.constantFrom(...corruptions), (input, c) => {
      fc.pre(c.applies?.(input) ?? true)
      const bad = { ...input, [c.field]: c.value } as StressInput
      let caught: unknown
      try { evaluateStress(bad) }
      catch (e) { caught = e }
      expect(caught).toBeInstanceOf(EngineInputError)
      expect((caught as EngineInputError).field).toBe(c.field)
      expect((caught as EngineInputError).message).toContain(c.field === 'dcVoltageMax' ? 'dcVoltageMax' : String(c.field))
    }), { numRuns: 300 })
  }, 60_000)
})
