// zod schemas of the public API inputs (POST /api/v1/stress, /api/v1/evaluate), shared by forms and routes.
// Field checks live here; topology-specific cross-field checks come from the engine itself (one source).
import { z } from 'zod'
import { EngineInputError } from '../engine/errors'
import { checkDesignInput, checkStressInput } from '../engine/check'
import { INPUT_LIMITS, tooLarge, tooSmall, type LimitedField } from '../engine/limits'
import type { Modulation, TopologyId } from '../engine/types'
import { topologies } from '../engine/topologies'

// Read from the registry (one source): the registry's Record<TopologyId, …> fails to compile when an id has no definition.
export const topologyIds = topologies.map(t => t.id) as [TopologyId, ...TopologyId[]]
export const modulations = ['sine', 'third-harmonic', 'space-vector', 'six-step'] as const satisfies readonly Modulation[]
// Both lists must name every member of their union: a missing one fails to compile here.
type Missing<T, L extends readonly unknown[]> = Exclude<T, L[number]>
const _allModulations: Missing<Modulation, typeof modulations> extends never ? true : never = true
void _allModulations

/** A finite number with a message naming the field and its unit. */
function quantity(field: string, unit: string) {
  return z.number({ error: i => (i.input === undefined ? `${field} is required (${unit})` : `${field} must be a number (${unit})`) })
}
const positive = (field: string, unit: string) => quantity(field, unit).positive({ error: `${field} must be greater than 0 (${unit})` })
const nonNegative = (field: string, unit: string) => quantity(field, unit).min(0, { error: `${field} must be at least 0 (${unit})` })
/** A field of the engine's limits table (shared/engine/limits.ts): the same bounds and words as the engine. */
function bounded(field: LimitedField, kind: 'positive' | 'nonNegative') {
  const l = INPUT_LIMITS[field]
  const base = kind === 'positive' ? positive(field, l.unit) : nonNegative(field, l.unit)
  return (l.min > 0 ? base.min(l.min, { error: tooSmall(field) }) : base).max(l.max, { error: tooLarge(field) })
}

const topology = z.enum(topologyIds, { error: `topology must be one of ${topologyIds.join(', ')}` })
const modulation = z.enum(modulations, { error: `modulation must be one of ${modulations.join(', ')}` })
const levels = z.number({ error: 'levels must be a whole number (2 two-level; 3 t-type, anpc; 3…9 diode-clamped, flying-capacitor; odd 3…15 cascaded-h-bridge)' })
  .int({ error: 'levels must be a whole number' }).min(2, { error: 'levels must be at least 2' }).max(15, { error: 'levels must be at most 15' })

/** Converter fields common to the single-point and the design input. */
const converterFields = {
  topology,
  levels: levels.optional(),
  dcVoltage: bounded('dcVoltage', 'positive').optional(),
  dcVoltageMax: bounded('dcVoltageMax', 'positive').optional(),
  inputLineVoltageRms: bounded('inputLineVoltageRms', 'positive').optional(),
  inputDisplacementFactor: bounded('inputDisplacementFactor', 'positive').optional(),
  inputDisplacementSense: z.enum(['lagging', 'leading'], { error: 'inputDisplacementSense must be lagging (inductive) or leading (capacitive)' }).optional(),
  inputFrequencyHz: bounded('inputFrequencyHz', 'positive').optional(),
  inputFilterResonanceHz: bounded('inputFilterResonanceHz', 'positive').optional(),
  switchingHz: bounded('switchingHz', 'positive'),
  modulation,
  overshootVoltage: bounded('overshootVoltage', 'nonNegative').optional(),
  strayInductance: bounded('strayInductance', 'nonNegative').optional(),
  currentSlope: bounded('currentSlope', 'nonNegative').optional(),
  clampDiodeUnitVoltage: bounded('clampDiodeUnitVoltage', 'positive').optional(),
}

const pointFields = {
  phaseCurrentRms: bounded('phaseCurrentRms', 'nonNegative'),
  powerFactor: quantity('powerFactor', '−1…1').min(-1, { error: 'powerFactor must be at least −1' }).max(1, { error: 'powerFactor must be at most 1' }),
  powerFactorSense: z.enum(['lagging', 'leading'], { error: 'powerFactorSense must be lagging (inductive) or leading (capacitive)' }).optional(),
  fundamentalHz: bounded('fundamentalHz', 'positive'),
}

const onlyWhenClean = { when: (payload: { issues: unknown[] }) => payload.issues.length === 0 }

/** Adds the engine's own refusal as an issue at its field path. */
function engineIssue(ctx: z.RefinementCtx, check: () => void): void {
  try {
    check()
  }
  catch (e) {
    if (!(e instanceof EngineInputError)) throw e
    ctx.addIssue({ code: 'custom', path: e.field.split('.').map(k => (/^\d+$/.test(k) ? Number(k) : k)), message: e.message })
  }
}

/** POST /api/v1/stress body (PRODUCT.md "Public API v1"); lineVoltageRms may be left out for six-step. */
export const stressInputSchema = z.object({
  ...converterFields,
  lineVoltageRms: bounded('lineVoltageRms', 'nonNegative').optional(),
  ...pointFields,
  includeWaveform: z.boolean({ error: 'includeWaveform must be true or false' }).optional(),
})
  .superRefine((v, ctx) => {
    if (v.lineVoltageRms === undefined && v.modulation !== 'six-step') {
      ctx.addIssue({ code: 'custom', path: ['lineVoltageRms'], message: 'lineVoltageRms is required (V, output line-to-line RMS) unless modulation is six-step' })
      return
    }
    const { includeWaveform: _w, ...input } = v
    engineIssue(ctx, () => checkStressInput({ ...input, lineVoltageRms: input.lineVoltageRms ?? 0 }))
  }, onlyWhenClean)
  // Six-step ignores the requested voltage (it follows from the DC link): 0 stands in for it.
  .transform(v => ({ ...v, lineVoltageRms: v.lineVoltageRms ?? 0 }))

export const operatingPointSchema = z.object({
  name: z.string({ error: 'name must be text' }).trim().min(1, { error: 'Name the operating point' }).max(60, { error: 'name: at most 60 characters' }),
  lineVoltageRms: bounded('lineVoltageRms', 'nonNegative'),
  ...pointFields,
  // Mission profile (shared/thermal/lifetime.ts): share of the operating hours, start / stop cycles per hour.
  hoursShare: quantity('hoursShare', 'fraction of the operating hours').min(0, { error: 'hoursShare must be at least 0 %' }).max(1, { error: 'hoursShare must be at most 100 %' }).optional(),
  startsPerHour: quantity('startsPerHour', 'per operating hour').min(0, { error: 'startsPerHour must be at least 0' }).max(3600, { error: 'startsPerHour must be at most 3600 (one a second)' }).optional(),
})

export const converterInputSchema = z.object({
  ...converterFields,
  operatingPoints: z.array(operatingPointSchema, { error: 'operatingPoints must be a list' })
    .min(1, { error: 'Give at least one operating point' })
    .max(50, { error: 'At most 50 operating points' })
    .superRefine((points, ctx) => {
      const shares = points.reduce((sum, p) => sum + (p.hoursShare ?? 0), 0)
      if (shares > 1 + 1e-6) ctx.addIssue({ code: 'custom', path: [points.findLastIndex(p => (p.hoursShare ?? 0) > 0), 'hoursShare'], message: `The shares of the operating hours add up to ${Math.round(shares * 1000) / 10} %: at most 100 %` })
      const seen = new Map<string, number>()
      points.forEach((p, i) => {
        if (seen.has(p.name)) ctx.addIssue({ code: 'custom', path: [i, 'name'], message: `Operating point name "${p.name}" is already used by point ${seen.get(p.name)! + 1}` })
        else seen.set(p.name, i)
      })
    }),
})

const fraction = (field: string, max: number) => quantity(`derating.${field}`, 'fraction').positive({ error: `${field} must be greater than 0` }).max(max, { error: `${field} must be at most ${max}` })

export const deratingSchema = z.object({
  semiconductorVoltageUtilisation: fraction('semiconductorVoltageUtilisation', 1),
  semiconductorTransientMargin: quantity('derating.semiconductorTransientMargin', 'fraction').min(0.5, { error: 'semiconductorTransientMargin must be at least 0.5 (the commutation peak may use 50 … 100 % of the rating)' }).max(1, { error: 'semiconductorTransientMargin must be at most 1 (the commutation peak may never exceed the rating)' }),
  semiconductorCurrentUtilisation: fraction('semiconductorCurrentUtilisation', 2),
  capacitorVoltageUtilisation: fraction('capacitorVoltageUtilisation', 1),
  capacitorRippleUtilisation: fraction('capacitorRippleUtilisation', 2),
  junctionMarginC: quantity('junctionMarginC', '°C').min(0, { error: 'junctionMarginC must be at least 0 °C' }).max(100, { error: 'junctionMarginC must be at most 100 °C' }),
  heatsinkTemperatureC: quantity('heatsinkTemperatureC', '°C').min(-40, { error: 'heatsinkTemperatureC must be at least −40 °C' }).max(150, { error: 'heatsinkTemperatureC must be at most 150 °C' }),
}).partial()

const lifetimeParameter = (field: string, min: number, max: number) => quantity(`thermal.lifetime.${field}`, 'model parameter').min(min, { error: `${field} must be at least ${min}` }).max(max, { error: `${field} must be at most ${max}` })

/** The design's cooling and lifetime-model settings (shared/thermal/dynamics.ts, lifetime.ts); kept in the design's input. */
export const thermalSettingsSchema = z.object({
  ambientTemperatureC: quantity('ambientTemperatureC', '°C').min(-40, { error: 'ambientTemperatureC must be at least −40 °C' }).max(120, { error: 'ambientTemperatureC must be at most 120 °C' }),
  heatsinkRth: quantity('heatsinkRth', 'K/W').min(0, { error: 'heatsinkRth must be at least 0 K/W' }).max(10, { error: 'heatsinkRth must be at most 10 K/W' }),
  heatsinkTimeConstantS: quantity('heatsinkTimeConstantS', 's').positive({ error: 'heatsinkTimeConstantS must be greater than 0 s' }).max(100000, { error: 'heatsinkTimeConstantS must be at most 100 000 s' }),
  /** Bayerer model parameters over the defaults (BAYERER_DEFAULTS) */
  lifetime: z.object({
    K: lifetimeParameter('K', 1, 1e30),
    beta1: lifetimeParameter('beta1', -20, 0),
    beta2: lifetimeParameter('beta2', 0, 10000),
    beta3: lifetimeParameter('beta3', -5, 5),
    beta4: lifetimeParameter('beta4', -5, 5),
    beta5: lifetimeParameter('beta5', -5, 5),
    beta6: lifetimeParameter('beta6', -5, 5),
    currentPerBondWireA: lifetimeParameter('currentPerBondWireA', 0.1, 100),
    bondWireDiameterUm: lifetimeParameter('bondWireDiameterUm', 10, 1000),
  }).partial().optional(),
})

/** POST /api/v1/evaluate body and the design form: machine side, optional grid side, derating. */
export const designInputSchema = z.object({
  machineSide: converterInputSchema,
  gridSide: converterInputSchema.optional(),
  derating: deratingSchema.optional(),
  thermal: thermalSettingsSchema.optional(),
  capacitorRippleTarget: bounded('capacitorRippleTarget', 'positive').optional(),
  linkCarriers: z.enum(['independent', 'synchronised'], { error: 'linkCarriers must be \'independent\' (each converter its own carrier) or \'synchronised\' (one common carrier)' }).optional(),
}).superRefine((v, ctx) => engineIssue(ctx, () => checkDesignInput(v)), onlyWhenClean)

export type StressInputBody = z.input<typeof stressInputSchema>
export type DesignInputBody = z.input<typeof designInputSchema>
