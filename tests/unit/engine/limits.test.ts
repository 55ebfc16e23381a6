// Input limits (shared/engine/limits.ts): every numeric field has a physical bound, refused in words naming
// the field and the bound, by the engine and by the zod schema alike; within the bounds no figure is null,
// NaN or infinite; a leading power factor is evaluated as leading and reported so.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { EngineInputError, evaluateDesign, evaluateStress, INPUT_LIMITS, MAX_APPARENT_POWER, topologies, type DesignInput, type LimitedField, type StressInput } from '../../../shared/engine'
import { designInputSchema, stressInputSchema } from '../../../shared/schemas/stress'
import { tradeStudySchema } from '../../../shared/schemas/trade-study'
import { inputAt } from './helpers'

function refusal(input: StressInput): EngineInputError {
  try { evaluateStress(input) }
  catch (e) { if (e instanceof EngineInputError) return e; throw e }
  throw new Error('accepted')
}

/** The schema's message at the field: the stress body, or the design body for the design-level ripple target. */
function schemaMessage(input: StressInput, field: LimitedField): string | undefined {
  if (field === 'capacitorRippleTarget') {
    const { capacitorRippleTarget, lineVoltageRms, phaseCurrentRms, powerFactor, fundamentalHz, ...converter } = input
    const r = designInputSchema.safeParse({ machineSide: { ...converter, operatingPoints: [{ name: 'P', lineVoltageRms, phaseCurrentRms, powerFactor, fundamentalHz }] }, capacitorRippleTarget })
    return r.error?.issues.find(i => i.path.join('.') === field)?.message
  }
  return stressInputSchema.safeParse(input).error?.issues.find(i => i.path.join('.') === field)?.message
}

/** A base input for each field, so that only that field is out of range. */
function baseFor(field: LimitedField): StressInput {
  if (field === 'inputLineVoltageRms') return { ...inputAt('two-level', 0.5, 0.9), topology: 'matrix', inputLineVoltageRms: 400, lineVoltageRms: 200 }
  // The matrix converter's input-side fields (ignored by the other topologies).
  if (field === 'inputDisplacementFactor' || field === 'inputFrequencyHz' || field === 'inputFilterResonanceHz') return { ...inputAt('two-level', 0.5, 0.9), topology: 'matrix', inputLineVoltageRms: 400, lineVoltageRms: 100, switchingHz: 10_000, inputFilterResonanceHz: 1000 }
  if (field === 'clampDiodeUnitVoltage') return inputAt('diode-clamped', 0.8, 0.9, { levels: 5 })
  if (field === 'strayInductance') return inputAt('two-level', 0.8, 0.9, { currentSlope: 1e6 })
  if (field === 'currentSlope') return inputAt('two-level', 0.8, 0.9, { strayInductance: 1e-9 })
  return inputAt('two-level', 0.8, 0.9, { phaseCurrentRms: 0 })
}

/** One step past the maximum, and past the minimum where it is above 0; other fields made to fit the new value. */
function outOfRange(field: LimitedField, side: 'max' | 'min'): StressInput {
  const l = INPUT_LIMITS[field]
  const v = side === 'max' ? l.max * 1.01 : l.min * 0.99
  const base = baseFor(field)
  const fit: Partial<StressInput> = {}
  // Keep the frequency ratio and the DC link ordering valid, so the bound itself is what refuses.
  if (field === 'fundamentalHz') Object.assign(fit, { switchingHz: v * 20 })
  if (field === 'switchingHz') Object.assign(fit, { fundamentalHz: side === 'max' ? 2000 : INPUT_LIMITS.fundamentalHz.min })
  if (field === 'dcVoltage' && side === 'min') Object.assign(fit, { lineVoltageRms: 0 })
  if (field === 'dcVoltageMax') Object.assign(fit, { dcVoltage: side === 'max' ? 90_000 : 0.5 })
  return { ...base, ...fit, [field]: v } as StressInput
}

describe('each bound has its message (limits.ts; common practice)', () => {
  const fields = Object.keys(INPUT_LIMITS) as LimitedField[]
  it.each(fields.map(f => ({ field: f, words: INPUT_LIMITS[f].maxWords })))('$field above $words → refused naming the field and the bound', ({ field, words }) => {
    const e = refusal(outOfRange(field, 'max'))
    expect(e.field).toBe(field)
    expect(e.message).toBe(`${field} must be at most ${words} (${INPUT_LIMITS[field].unit})`)
    // The schema (form and API 422) says the same at the same path.
    expect(schemaMessage(outOfRange(field, 'max'), field)).toBe(e.message)
  })

  it.each(fields.filter(f => INPUT_LIMITS[f].min > 0 && f !== 'dcVoltageMax').map(f => ({ field: f, words: (INPUT_LIMITS[f] as { minWords?: string }).minWords })))('$field below $words → refused naming the field and the bound', ({ field, words }) => {
    const e = refusal(outOfRange(field, 'min'))
    expect(e.field).toBe(field)
    expect(e.message).toBe(`${field} must be at least ${words} (${INPUT_LIMITS[field].unit})`)
    expect(schemaMessage(outOfRange(field, 'min'), field)).toBe(e.message)
  })

  it('apparent power above 1 GVA is refused at phaseCurrentRms, in GVA', () => {
    // √3 · 60 kV · 10 kA = 1.04 GVA.
    const e = refusal(inputAt('cascaded-h-bridge', 0.8, 0.9, { levels: 15, dcVoltage: 12_000, lineVoltageRms: 60_000, phaseCurrentRms: 10_000 }))
    expect(e.field).toBe('phaseCurrentRms')
    expect(e.message).toMatch(/1\.04 GVA .*at or below 1 GVA/)
    expect(MAX_APPARENT_POWER).toBe(1e9)
    // Just below: √3 · 60 kV · 9.6 kA = 0.998 GVA is accepted.
    expect(() => evaluateStress(inputAt('cascaded-h-bridge', 0.8, 0.9, { levels: 15, dcVoltage: 12_000, lineVoltageRms: 60_000, phaseCurrentRms: 9_600 }))).not.toThrow()
  })

  it('an overshoot L·di/dt above 100 kV is refused, naming both fields', () => {
    const e = refusal(inputAt('two-level', 0.8, 0.9, { strayInductance: 1e-3, currentSlope: 1e9 }))
    expect(e.field).toBe('currentSlope')
    expect(e.message).toMatch(/strayInductance × currentSlope gives 1000000 V overshoot; it must stay at or below 100 kV/)
  })

  it('a carrier below 3 × the fundamental is refused; the design route reports it at the converter', () => {
    const e = refusal(inputAt('two-level', 0.8, 0.9, { switchingHz: 140 }))
    expect(e.field).toBe('switchingHz')
    expect(e.message).toMatch(/at least 3 × fundamentalHz/)
    const design: DesignInput = { machineSide: { topology: 'two-level', dcVoltage: 800, switchingHz: 140, modulation: 'sine', operatingPoints: [{ name: 'P', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }] } }
    const r = designInputSchema.safeParse(design)
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(i => `${i.path.join('.')}: ${i.message}`)).toContain('machineSide.switchingHz: switchingHz must be at least 3 × fundamentalHz for PWM (below that a carrier period is too long to average over)')
  })

  it('the trade study form takes the same bounds', () => {
    const r = tradeStudySchema.safeParse({ dcVoltage: 200_000, switchingHz: 4000, operatingPoints: [{ name: 'P', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }] })
    expect(r.error?.issues.map(i => `${i.path.join('.')}: ${i.message}`)).toEqual([`dcVoltage: dcVoltage must be at most 100 kV (${INPUT_LIMITS.dcVoltage.unit})`])
  })

  it('a carrier of exactly 3 × the fundamental is accepted, whatever the division rounds to', () => {
    // (3·f)/f falls to 2.9999999999999996 for about one f in twelve (found by the property test below).
    const fs = Array.from({ length: 60 }, (_, k) => 0.01 + k * 33.3)
    expect(fs.some(f => (3 * f) / f < 3)).toBe(true)
    for (const f of fs) expect(() => evaluateStress(inputAt('two-level', 0.8, 0.9, { fundamentalHz: f, switchingHz: 3 * f }))).not.toThrow()
  })

  it('a design ripple target out of range is refused at capacitorRippleTarget', () => {
    const design: DesignInput = { machineSide: { topology: 'two-level', dcVoltage: 800, switchingHz: 4000, modulation: 'sine', operatingPoints: [{ lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }] }, capacitorRippleTarget: 1e-6 }
    try { evaluateDesign(design); throw new Error('accepted') }
    catch (e) {
      expect((e as EngineInputError).field).toBe('capacitorRippleTarget')
      expect((e as Error).message).toBe('capacitorRippleTarget must be at least 1 mV (V peak-to-peak)')
    }
  })
})

/** Every number anywhere in the object is finite; every value is defined and not null. Returns the bad path. */
function badFigure(value: unknown, path = 'result'): string | undefined {
  if (value === null || value === undefined) return `${path} is ${value}`
  if (typeof value === 'number') return Number.isFinite(value) ? undefined : `${path} = ${value}`
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const bad = badFigure(value[i], `${path}[${i}]`)
      if (bad) return bad
    }
    return undefined
  }
  if (typeof value === 'object') {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      const bad = badFigure(v, `${path}.${k}`)
      if (bad) return bad
    }
  }
  return undefined
}

/** log-uniform between lo and hi */
const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map(e => Math.min(hi, Math.max(lo, 10 ** e)))

const extremeDesign: fc.Arbitrary<DesignInput> = fc.constantFrom(...topologies).chain((t) => {
  const levels = t.allowedLevels === 'ignored' ? fc.constant(undefined) : fc.constantFrom(...t.allowedLevels)
  return fc.record({
    levels,
    dcVoltage: logUniform(1, 100_000),
    dcMargin: fc.double({ min: 1, max: 2, noNaN: true }),
    inputLineVoltageRms: logUniform(1, 70_000),
    index: fc.double({ min: 0, max: 1.4, noNaN: true }),
    phaseCurrentRms: fc.oneof(fc.constant(0), logUniform(1e-3, 100_000)),
    powerFactor: fc.double({ min: -1, max: 1, noNaN: true }),
    powerFactorSense: fc.constantFrom('lagging' as const, 'leading' as const),
    fundamentalHz: logUniform(0.01, 2000),
    ratio: logUniform(3, 2000),
    modulation: fc.constantFrom(...t.modulations),
    overshootVoltage: fc.option(logUniform(1e-3, 100_000), { nil: undefined }),
    clampDiodeUnitVoltage: fc.option(logUniform(10, 100_000), { nil: undefined }),
    rippleTarget: fc.option(logUniform(1e-3, 100_000), { nil: undefined }),
    u: fc.double({ min: 0.05, max: 1, noNaN: true }),
    margin: fc.double({ min: 0.5, max: 1, noNaN: true }),
  }).map((r): DesignInput => {
    const N = r.levels ?? 3
    const half = t.supply === 'cell' ? ((N - 1) / 2) * r.dcVoltage : t.supply === 'ac-input' ? r.inputLineVoltageRms * Math.SQRT2 / Math.sqrt(3) : r.dcVoltage / 2
    const line = Math.min((r.index * half * Math.sqrt(3)) / Math.SQRT2, 100_000)
    const sixStepLine = (Math.sqrt(6) / Math.PI) * r.dcVoltage
    // Current held to the 1 GVA bound for the voltage drawn.
    const current = Math.min(r.phaseCurrentRms, 0.999 * MAX_APPARENT_POWER / (Math.sqrt(3) * Math.max(r.modulation === 'six-step' ? sixStepLine : line, 1e-9)))
    const switchingHz = Math.min(r.fundamentalHz * r.ratio, 500_000)
    return {
      machineSide: {
        topology: t.id,
        levels: r.levels,
        dcVoltage: r.dcVoltage,
        dcVoltageMax: Math.min(r.dcVoltage * r.dcMargin, 100_000),
        inputLineVoltageRms: r.inputLineVoltageRms,
        switchingHz: Math.max(switchingHz, 3 * r.fundamentalHz),
        modulation: r.modulation,
        overshootVoltage: r.overshootVoltage,
        clampDiodeUnitVoltage: r.clampDiodeUnitVoltage,
        operatingPoints: [{ name: 'P', lineVoltageRms: line, phaseCurrentRms: current, powerFactor: r.powerFactor, powerFactorSense: r.powerFactorSense, fundamentalHz: r.fundamentalHz }],
      },
      derating: { semiconductorVoltageUtilisation: r.u, semiconductorTransientMargin: r.margin },
      ...(r.rippleTarget !== undefined ? { capacitorRippleTarget: r.rippleTarget } : {}),
    }
  })
})

describe('random valid inputs across the whole bounded range (first principles)', () => {
  it('every topology: no null, NaN or infinite figure anywhere in the design result (walked recursively)', () => {
    fc.assert(fc.property(extremeDesign, (input) => {
      expect(designInputSchema.safeParse(input).success).toBe(true)
      // Optional fields left undefined by the generator are not results: drop them before walking the result only.
      const result = evaluateDesign(JSON.parse(JSON.stringify(input)) as DesignInput)
      expect(badFigure(result)).toBeUndefined()
    }), { numRuns: 150 })
  }, 120_000)

  it('the extreme corners themselves: largest and smallest bounds together', () => {
    for (const t of topologies) {
      const levels = t.allowedLevels === 'ignored' ? undefined : t.allowedLevels[t.allowedLevels.length - 1]
      for (const corner of [
        { dcVoltage: 100_000, inputLineVoltageRms: 70_000, fundamentalHz: 2000, ratio: 3, current: 100_000 },
        { dcVoltage: 1, inputLineVoltageRms: 1, fundamentalHz: 0.01, ratio: 1000, current: 1e-3 },
      ]) {
        const modulation = t.modulations[0]!
        const half = t.supply === 'cell' ? (((levels ?? 3) - 1) / 2) * corner.dcVoltage : t.supply === 'ac-input' ? corner.inputLineVoltageRms * Math.SQRT2 / Math.sqrt(3) : corner.dcVoltage / 2
        const line = Math.min(0.8 * half * Math.sqrt(3) / Math.SQRT2, 100_000)
        const current = Math.min(corner.current, 0.99e9 / (Math.sqrt(3) * line))
        const input: DesignInput = {
          machineSide: { topology: t.id, levels, dcVoltage: corner.dcVoltage, inputLineVoltageRms: corner.inputLineVoltageRms, switchingHz: corner.fundamentalHz * corner.ratio, modulation, overshootVoltage: 100_000, clampDiodeUnitVoltage: 10, operatingPoints: [{ lineVoltageRms: line, phaseCurrentRms: current, powerFactor: 0, fundamentalHz: corner.fundamentalHz }] },
          capacitorRippleTarget: 1e-3,
        }
        expect(badFigure(evaluateDesign(input)), `${t.id} ${JSON.stringify(corner)}`).toBeUndefined()
      }
    }
  }, 60_000)
})

describe('leading power factor (capacitive operation)', () => {
  const lagging = inputAt('diode-clamped', 0.8, 0.8)
  const leading: StressInput = { ...lagging, powerFactorSense: 'leading' }

  it('the current leads the voltage by acos(pf) in the engine and is reported as leading', () => {
    const r = evaluateStress(leading, { includeWaveform: true })
    expect(r.powerFactor).toEqual({ value: 0.8, sense: 'leading', currentPhaseAngle: -Math.acos(0.8) })
    expect(evaluateStress(lagging).powerFactor).toEqual({ value: 0.8, sense: 'lagging', currentPhaseAngle: Math.acos(0.8) })
    // i(θ) = Î·sin(θ + acos 0.8): at the first sample the current is already ≈ Î·0.6 (lagging would give ≈ −Î·0.6).
    const w = r.waveform!
    const theta = 2 * Math.PI * 50 * w.time[0]!
    expect(w.phaseCurrent[0]).toBeCloseTo(Math.SQRT2 * 100 * Math.sin(theta + Math.acos(0.8)), 9)
    expect(w.phaseCurrent[0]!).toBeGreaterThan(0)
  })

  it('quarter-wave-symmetric references: each position carries the same averaged stresses leading as lagging (θ → π − θ maps one onto the other; first principles)', () => {
    const a = evaluateStress(lagging)
    const b = evaluateStress(leading)
    for (const [k, d] of a.devices.entries()) {
      const e = b.devices[k]!
      expect(e.currentAvg).toBeCloseTo(d.currentAvg, 6)
      expect(e.currentRms).toBeCloseTo(d.currentRms, 6)
    }
  })

  it('a design reports the sense per operating point; a wrong sense is refused at its path', () => {
    const r = evaluateDesign({ machineSide: { topology: 't-type', levels: 3, dcVoltage: 800, switchingHz: 8000, modulation: 'space-vector', operatingPoints: [{ name: 'Capacitive', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.3, powerFactorSense: 'leading', fundamentalHz: 50 }] } })
    expect(r.converters[0]!.points[0]!.powerFactor.sense).toBe('leading')
    try {
      evaluateDesign({ machineSide: { topology: 't-type', levels: 3, dcVoltage: 800, switchingHz: 8000, modulation: 'space-vector', operatingPoints: [{ lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.3, powerFactorSense: 'ahead' as 'leading', fundamentalHz: 50 }] } })
      throw new Error('accepted')
    }
    catch (e) {
      expect((e as EngineInputError).field).toBe('machineSide.operatingPoints.0.powerFactorSense')
    }
  })
})
