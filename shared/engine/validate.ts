// Input checks and normalisation for one evaluation; every refusal names its field.
import { EngineInputError } from './errors'
import { INPUT_LIMITS, MAX_APPARENT_POWER, MIN_FREQUENCY_RATIO, tooLarge, tooSmall, type LimitedField } from './limits'
import { compileLeg, type CompiledLeg, type TopologyDefinition } from './model'
import { topologyById } from './topologies'
import type { Modulation, PowerFactorSense, StressInput } from './types'

const MODULATIONS: Modulation[] = ['sine', 'third-harmonic', 'space-vector', 'six-step']
/** f_sw/f above this is outside the engine's synthesis range. */
export const MAX_FREQUENCY_RATIO = 100_000

export interface ResolvedInput {
  topology: TopologyDefinition
  leg: CompiledLeg
  /** level count reported (phase levels; 3 for the matrix converter's three input potentials) */
  levels: number
  modulation: Modulation
  /** V, nominal DC link (per cell for cascaded H-bridge; 0 for matrix) */
  dcVoltage: number
  /** V, worst-case DC link */
  dcVoltageMax: number
  /** V, matrix input line-to-line RMS (0 otherwise) */
  inputLineVoltageRms: number
  /** matrix only: the input side (undefined otherwise) */
  matrixInput?: {
    displacementFactor: number
    sense: PowerFactorSense
    /** rad, input current behind the input voltage (negative = leading) */
    angle: number
    frequencyHz: number
    resonanceHz: number
  }
  /** V, requested output line-to-line fundamental RMS (0 for six-step, where it follows from the DC link) */
  lineVoltageRms: number
  phaseCurrentRms: number
  powerFactor: number
  /** lagging (inductive, current behind the voltage) or leading (capacitive) */
  powerFactorSense: PowerFactorSense
  /** rad, φ in i = Î·sin(θ − φ): acos(pf) lagging, −acos(pf) leading */
  currentPhaseAngle: number
  fundamentalHz: number
  switchingHz: number
  /** V, overshoot added to commutating devices */
  overshootVoltage: number
  /** V, unit diode rating for clamp stacks (undefined → one level step at V_dc,max) */
  clampDiodeUnitVoltage?: number
  /** V peak-to-peak */
  capacitorRippleTarget?: number
  warnings: string[]
}

const legCache = new Map<string, CompiledLeg>()

/** Compiled leg of a topology at a level count, built once. */
export function legFor(topology: TopologyDefinition, levels: number): CompiledLeg {
  const key = `${topology.id}:${levels}`
  let leg = legCache.get(key)
  if (!leg) {
    leg = compileLeg(topology, levels)
    legCache.set(key, leg)
  }
  return leg
}

type NumberRule = { required?: boolean, min?: number, max?: number, positive?: boolean, unit: string }

/** A field of the limits table: its unit and physical bounds (limits.ts), refused in words. */
function limited(input: Record<string, unknown>, field: LimitedField, rule: { required?: boolean, positive?: boolean, unit?: string }): number | undefined {
  const v = num(input, field, { ...rule, unit: rule.unit ?? INPUT_LIMITS[field].unit, ...(rule.positive ? {} : { min: 0 }) })
  if (v === undefined) return undefined
  const l = INPUT_LIMITS[field]
  if (v < l.min) throw new EngineInputError(field, tooSmall(field))
  if (v > l.max) throw new EngineInputError(field, tooLarge(field))
  return v
}

function num(input: Record<string, unknown>, field: string, rule: NumberRule): number | undefined {
  const v = input[field]
  if (v === undefined || v === null) {
    if (rule.required) throw new EngineInputError(field, `${field} is required (${rule.unit})`)
    return undefined
  }
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new EngineInputError(field, `${field} must be a finite number (${rule.unit})`)
  if (rule.positive && v <= 0) throw new EngineInputError(field, `${field} must be greater than 0 (${rule.unit})`)
  if (rule.min !== undefined && v < rule.min) throw new EngineInputError(field, `${field} must be at least ${rule.min} (${rule.unit})`)
  if (rule.max !== undefined && v > rule.max) throw new EngineInputError(field, `${field} must be at most ${rule.max} (${rule.unit})`)
  return v
}

function describeLevels(t: TopologyDefinition): string {
  const l = t.allowedLevels
  if (l === 'ignored') return 'ignored'
  if (l.length === 1) return String(l[0])
  const odd = l.every(n => n % 2 === 1) && l.length > 1 && l[1]! - l[0]! === 2
  return `${odd ? 'odd ' : ''}${l[0]}…${l[l.length - 1]}`
}

/** Checks one evaluation's input and resolves defaults; throws EngineInputError naming the field. */
export function resolveStressInput(raw: StressInput): ResolvedInput {
  if (typeof raw !== 'object' || raw === null) throw new EngineInputError('input', 'input must be an object')
  const input = raw as unknown as Record<string, unknown>
  const warnings: string[] = []

  const id = input.topology
  const topology = typeof id === 'string' ? topologyById[id as keyof typeof topologyById] : undefined
  if (!topology) throw new EngineInputError('topology', `topology must be one of ${Object.keys(topologyById).join(', ')}`)

  const modulation = input.modulation as Modulation
  if (!MODULATIONS.includes(modulation)) throw new EngineInputError('modulation', `modulation must be one of ${MODULATIONS.join(', ')}`)
  if (!topology.modulations.includes(modulation)) {
    throw new EngineInputError('modulation', modulation === 'six-step'
      ? `six-step operation is for the two-level topology only, not ${topology.id}`
      : `${topology.id} does not support ${modulation} modulation`)
  }

  let levels: number
  if (topology.allowedLevels === 'ignored') {
    levels = topology.defaultLevels ?? 3
  }
  else {
    const given = input.levels
    if (given === undefined || given === null) {
      if (topology.defaultLevels === undefined) throw new EngineInputError('levels', `levels is required for ${topology.id} (${describeLevels(topology)})`)
      levels = topology.defaultLevels
    }
    else if (typeof given !== 'number' || !Number.isInteger(given) || !topology.allowedLevels.includes(given)) {
      throw new EngineInputError('levels', `levels must be ${describeLevels(topology)} for ${topology.id}`)
    }
    else levels = given
  }

  const sixStep = modulation === 'six-step'
  const ac = topology.supply === 'ac-input'
  const dcUnit = topology.supply === 'cell' ? 'V per cell' : 'V'
  const dcVoltage = ac ? 0 : limited(input, 'dcVoltage', { required: true, positive: true, unit: dcUnit })!
  let dcVoltageMax = dcVoltage
  if (!ac) {
    const given = limited(input, 'dcVoltageMax', { positive: true, unit: dcUnit })
    if (given !== undefined) {
      if (given < dcVoltage) throw new EngineInputError('dcVoltageMax', 'dcVoltageMax must be at least dcVoltage (V, worst-case DC link)')
      dcVoltageMax = given
    }
  }
  const inputLineVoltageRms = ac ? limited(input, 'inputLineVoltageRms', { required: true, positive: true, unit: 'V, input line-to-line RMS; required for matrix' })! : 0
  const lineVoltageRms = sixStep ? 0 : limited(input, 'lineVoltageRms', { required: true })!
  const phaseCurrentRms = limited(input, 'phaseCurrentRms', { required: true })!
  const powerFactor = num(input, 'powerFactor', { required: true, min: -1, max: 1, unit: '−1…1' })!
  const sense = input.powerFactorSense ?? 'lagging'
  if (sense !== 'lagging' && sense !== 'leading') throw new EngineInputError('powerFactorSense', 'powerFactorSense must be lagging (inductive) or leading (capacitive)')
  const fundamentalHz = limited(input, 'fundamentalHz', { required: true, positive: true })!
  const switchingHz = limited(input, 'switchingHz', { required: true, positive: true })!
  // Six-step: the output follows from the DC link, so the power bound uses the six-step line voltage √6/π·V_dc.
  const lineForPower = sixStep ? (Math.sqrt(6) / Math.PI) * dcVoltage : lineVoltageRms
  const apparentPower = Math.sqrt(3) * lineForPower * phaseCurrentRms
  if (apparentPower > MAX_APPARENT_POWER) {
    throw new EngineInputError('phaseCurrentRms', `phaseCurrentRms × line voltage gives ${Number((apparentPower / 1e9).toPrecision(3))} GVA (√3·V_LL·I); one converter must stay at or below 1 GVA`)
  }
  if (!sixStep) {
    if (switchingHz <= fundamentalHz) throw new EngineInputError('switchingHz', 'switchingHz must be above fundamentalHz for PWM (switching-period averaging needs f_sw ≫ f)')
    if (switchingHz / fundamentalHz > MAX_FREQUENCY_RATIO) throw new EngineInputError('switchingHz', `switchingHz / fundamentalHz must not exceed ${MAX_FREQUENCY_RATIO}`)
    // A ratio of exactly 3 may divide to 2.9999999999999996: the bound is kept with a rounding allowance.
    if (switchingHz / fundamentalHz < MIN_FREQUENCY_RATIO * (1 - 1e-12)) throw new EngineInputError('switchingHz', `switchingHz must be at least ${MIN_FREQUENCY_RATIO} × fundamentalHz for PWM (below that a carrier period is too long to average over)`)
    if (switchingHz / fundamentalHz < 10) warnings.push(`Switching frequency only ${(switchingHz / fundamentalHz).toFixed(1)} × the fundamental: switching-period-averaged currents are approximate below about 10 ×.`)
  }

  let matrixInput: ResolvedInput['matrixInput']
  if (ac) {
    const displacementFactor = limited(input, 'inputDisplacementFactor', { positive: true }) ?? 1
    const inSense = input.inputDisplacementSense ?? 'lagging'
    if (inSense !== 'lagging' && inSense !== 'leading') throw new EngineInputError('inputDisplacementSense', 'inputDisplacementSense must be lagging (inductive) or leading (capacitive)')
    const frequencyHz = limited(input, 'inputFrequencyHz', { positive: true }) ?? 50
    const resonanceGiven = limited(input, 'inputFilterResonanceHz', { positive: true })
    // The filter must pass the input frequency and stop the switching frequency (common practice).
    if (resonanceGiven !== undefined && resonanceGiven <= 2 * frequencyHz) throw new EngineInputError('inputFilterResonanceHz', `inputFilterResonanceHz must be above twice the input frequency (${2 * frequencyHz} Hz): the filter would resonate with the grid`)
    if (resonanceGiven !== undefined && resonanceGiven >= switchingHz / 2) throw new EngineInputError('inputFilterResonanceHz', `inputFilterResonanceHz must be below half the switching frequency (${switchingHz / 2} Hz): the filter would not stop the switching ripple`)
    // Default: the geometric middle of 10·f_in … f_sw/5 (common practice), √(2·f_in·f_sw); where that band is
    // empty (f_sw < 50·f_in) the middle of 2·f_in … f_sw/2, and below f_sw/4 whatever the input frequency
    // (no filter then passes f_in and stops f_sw: the input-side figures warn).
    const wide = Math.sqrt(2 * frequencyHz * switchingHz)
    const resonanceHz = resonanceGiven ?? (wide > 2 * frequencyHz && wide < switchingHz / 2 ? wide : Math.min(Math.sqrt(frequencyHz * switchingHz), switchingHz / 4))
    matrixInput = { displacementFactor, sense: inSense, angle: inSense === 'leading' ? -Math.acos(displacementFactor) : Math.acos(displacementFactor), frequencyHz, resonanceHz }
  }

  const overshootGiven = limited(input, 'overshootVoltage', {})
  const stray = limited(input, 'strayInductance', {})
  const slope = limited(input, 'currentSlope', {})
  let overshootVoltage = overshootGiven ?? 0
  if (overshootGiven === undefined && (stray !== undefined) !== (slope !== undefined)) {
    warnings.push('strayInductance and currentSlope are needed together for the overshoot ΔV = L_σ·di/dt; no overshoot added.')
  }
  else if (overshootGiven === undefined && stray !== undefined && slope !== undefined) {
    overshootVoltage = stray * slope
    if (overshootVoltage > INPUT_LIMITS.overshootVoltage.max) {
      throw new EngineInputError('currentSlope', `strayInductance × currentSlope gives ${Number(overshootVoltage.toPrecision(3))} V overshoot; it must stay at or below ${INPUT_LIMITS.overshootVoltage.maxWords}`)
    }
  }
  const clampDiodeUnitVoltage = limited(input, 'clampDiodeUnitVoltage', { positive: true })
  const capacitorRippleTarget = limited(input, 'capacitorRippleTarget', { positive: true })

  return {
    topology,
    leg: legFor(topology, levels),
    levels,
    modulation,
    dcVoltage,
    dcVoltageMax,
    inputLineVoltageRms,
    ...(matrixInput ? { matrixInput } : {}),
    lineVoltageRms,
    phaseCurrentRms,
    powerFactor,
    powerFactorSense: sense,
    currentPhaseAngle: sense === 'leading' ? -Math.acos(powerFactor) : Math.acos(powerFactor),
    fundamentalHz,
    switchingHz: sixStep ? fundamentalHz : switchingHz,
    overshootVoltage,
    clampDiodeUnitVoltage,
    capacitorRippleTarget,
    warnings,
  }
}
