// 3×3 matrix converter: blocking voltage, device count and the output-voltage limit (Wheeler et al., IEEE TIE 2002).
import { describe, expect, it } from 'vitest'
import type { EngineInputError, Modulation, StressInput } from '../../../shared/engine'
import { evaluateStress } from '../../../shared/engine'
import { expectClose } from './helpers'

const WHEELER = 'Wheeler et al., IEEE TIE 2002'
const at = (q: number, modulation: Modulation = 'space-vector', over: Partial<StressInput> = {}): StressInput => ({
  topology: 'matrix', inputLineVoltageRms: 400, lineVoltageRms: q * 400, phaseCurrentRms: 30, powerFactor: 0.85, fundamentalHz: 50, switchingHz: 10000, modulation, ...over,
})

describe('matrix converter', () => {
  it(`every device blocks the peak input line voltage √2·V_LL,in; 18 switches + 18 diodes (${WHEELER})`, () => {
    for (const Vin of [230, 400, 690]) {
      const r = evaluateStress(at(0.7, 'space-vector', { inputLineVoltageRms: Vin, lineVoltageRms: 0.7 * Vin }))
      for (const d of r.devices) expect(d.blockingVoltage).toBeCloseTo(Math.SQRT2 * Vin, 9)
      expect(r.counts.switchesTotal).toBe(18)
      expect(r.counts.diodesTotal).toBe(18)
      // No DC link: the only capacitors are the three star-connected input filter capacitors.
      expect(r.capacitors.map(c => [c.name, c.kind, c.count])).toEqual([['Cf', 'input-filter', 3]])
    }
  })

  it.each([
    { q: 0.5, modulation: 'space-vector', warn: false },
    { q: 0.85, modulation: 'space-vector', warn: false },
    { q: 0.866, modulation: 'third-harmonic', warn: false },
    { q: 0.87, modulation: 'space-vector', warn: true },
    { q: 0.95, modulation: 'third-harmonic', warn: true },
  ] as const)(`transfer ratio $q with $modulation: warning past √3/2 (${WHEELER})`, ({ q, modulation, warn }) => {
    const r = evaluateStress(at(q, modulation))
    expect(r.modulationIndex).toBeCloseTo(q, 12)
    const over = r.warnings.some(w => /Over-modulation/.test(w) && /0\.866/.test(w))
    expect(over).toBe(warn)
    if (!warn) expectClose(r.lineVoltageFundamentalRms, q * 400, 1e-5, 'output delivered')
    else expect(r.lineVoltageFundamentalRms).toBeLessThan(q * 400)
  })

  it('each bidirectional switch carries the output current a third of the time (indirect space-vector averaging, assumption stated in provenance)', () => {
    const r = evaluateStress(at(0.7))
    const Ih = Math.SQRT2 * 30
    for (const d of r.devices) {
      expectClose(d.currentAvg, Ih / (3 * Math.PI), 1e-6, d.name)
      expectClose(d.currentRms, Math.sqrt((Ih * Ih) / 12), 1e-6, d.name)
    }
    expect(r.devices[0]!.provenance.source).toMatch(/Wheeler/)
  })

  it('needs inputLineVoltageRms and ignores dcVoltage and levels', () => {
    const { inputLineVoltageRms: _, ...rest } = at(0.5)
    expect(() => evaluateStress(rest as StressInput)).toThrowError(/inputLineVoltageRms/)
    try { evaluateStress(rest as StressInput) }
    catch (e) { expect((e as EngineInputError).field).toBe('inputLineVoltageRms') }
    const a = evaluateStress(at(0.5))
    const b = evaluateStress(at(0.5, 'space-vector', { dcVoltage: 123, levels: 7 }))
    expect(b.devices).toEqual(a.devices)
  })
})
