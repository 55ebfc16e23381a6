// Input refusals: each names its field with a message an engineer can act on; warnings instead of silent numbers.
import { describe, expect, it } from 'vitest'
import { EngineInputError, evaluateStress, type StressInput } from '../../../shared/engine'
import { inputAt } from './helpers'

function refusal(input: StressInput, options = {}): EngineInputError {
  try { evaluateStress(input, options) }
  catch (e) { if (e instanceof EngineInputError) return e; throw e }
  throw new Error('accepted')
}

describe('EngineInputError cases', () => {
  it.each([
    { what: 'levels out of range for diode-clamped', input: inputAt('diode-clamped', 0.8, 0.9, { levels: 10 }), field: 'levels', text: /3…9/ },
    { what: 'even levels for cascaded H-bridge', input: inputAt('cascaded-h-bridge', 0.8, 0.9, { levels: 4 }), field: 'levels', text: /odd 3…15/ },
    { what: 'levels missing for flying-capacitor', input: inputAt('flying-capacitor', 0.8, 0.9, { levels: undefined }), field: 'levels', text: /required/ },
    { what: 'two-level with 3 levels', input: inputAt('two-level', 0.8, 0.9, { levels: 3 }), field: 'levels', text: /must be 2/ },
    { what: 'missing dcVoltage', input: inputAt('two-level', 0.8, 0.9, { dcVoltage: undefined }), field: 'dcVoltage', text: /required/ },
    { what: 'worst case below nominal', input: inputAt('two-level', 0.8, 0.9, { dcVoltageMax: 500 }), field: 'dcVoltageMax', text: /at least dcVoltage/ },
    { what: 'matrix without input voltage', input: { ...inputAt('two-level', 0.8, 0.9), topology: 'matrix' } as StressInput, field: 'inputLineVoltageRms', text: /required/ },
    { what: 'six-step on NPC', input: inputAt('diode-clamped', 0.8, 0.9, { modulation: 'six-step' }), field: 'modulation', text: /two-level topology only/ },
    { what: 'zero fundamental', input: inputAt('two-level', 0.8, 0.9, { fundamentalHz: 0 }), field: 'fundamentalHz', text: /greater than 0/ },
    { what: 'negative switching frequency', input: inputAt('two-level', 0.8, 0.9, { switchingHz: -5 }), field: 'switchingHz', text: /greater than 0/ },
    { what: 'switching below the fundamental', input: inputAt('two-level', 0.8, 0.9, { switchingHz: 40 }), field: 'switchingHz', text: /above fundamentalHz/ },
    { what: 'power factor above 1', input: inputAt('two-level', 0.8, 1.2), field: 'powerFactor', text: /at most 1/ },
    { what: 'unknown topology', input: { ...inputAt('two-level', 0.8, 0.9), topology: 'six-level-hexagon' } as unknown as StressInput, field: 'topology', text: /one of/ },
  ])('$what → $field', ({ input, field, text }) => {
    const e = refusal(input)
    expect(e.field).toBe(field)
    expect(e.message).toMatch(text)
    expect(e.name).toBe('EngineInputError')
  })

  it('refuses bad options by name', () => {
    expect(refusal(inputAt('two-level', 0.8, 0.9), { integrationPoints: 7 }).field).toBe('integrationPoints')
    expect(refusal(inputAt('two-level', 0.8, 0.9), { samples: -1 }).field).toBe('samples')
  })
})

describe('warnings rather than silent numbers', () => {
  it('over-modulation states the shortfall', () => {
    const r = evaluateStress(inputAt('two-level', 1.1, 0.9))
    expect(r.warnings.join(' ')).toMatch(/Over-modulation: modulation index 1\.1 exceeds the linear limit 1 of sine modulation.*instead of the requested/)
  })

  it('a low carrier ratio and a half-given overshoot are flagged', () => {
    expect(evaluateStress(inputAt('two-level', 0.8, 0.9, { switchingHz: 300 })).warnings.join(' ')).toMatch(/approximate/)
    const r = evaluateStress(inputAt('two-level', 0.8, 0.9, { strayInductance: 40e-9 }))
    expect(r.warnings.join(' ')).toMatch(/needed together/)
    expect(r.devices[0]!.blockingVoltageWithOvershoot).toBe(r.devices[0]!.blockingVoltage)
  })

  it('zero output voltage: THD reported as 0 with a warning, no NaN', () => {
    const r = evaluateStress(inputAt('diode-clamped', 0, 0.9))
    expect(r.lineVoltageThd).toBe(0)
    expect(r.warnings.join(' ')).toMatch(/THD is not defined/)
  })
})
