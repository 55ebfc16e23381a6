// Physical bounds of every numeric input: the one table the engine's checks and the zod schemas read.
// Common practice: far beyond any converter built today, small enough that no figure overflows.

export interface InputLimit {
  /** smallest accepted value (inclusive unless `above`) */
  min: number
  /** the minimum itself is refused (value must be greater) */
  above?: boolean
  /** largest accepted value (inclusive) */
  max: number
  /** unit and meaning, for the message */
  unit: string
  /** the bound in words a user reads, e.g. "100 kV" */
  maxWords: string
  minWords?: string
}

export const INPUT_LIMITS = {
  dcVoltage: { min: 1, max: 100_000, unit: 'V, nominal DC link; per cell for cascaded-h-bridge', maxWords: '100 kV', minWords: '1 V' },
  dcVoltageMax: { min: 1, max: 100_000, unit: 'V, worst-case DC link', maxWords: '100 kV', minWords: '1 V' },
  inputLineVoltageRms: { min: 1, max: 70_000, unit: 'V, matrix input line-to-line RMS', maxWords: '70 kV (about 100 kV peak)', minWords: '1 V' },
  inputDisplacementFactor: { min: 0.2, max: 1, unit: 'cos φ of the matrix input, 0.2…1', maxWords: '1 (unity)', minWords: '0.2 (below it the transfer ratio (√3/2)·cos φ_in is too small to use)' },
  inputFrequencyHz: { min: 1, max: 2_000, unit: 'Hz, matrix input frequency', maxWords: '2 kHz', minWords: '1 Hz' },
  inputFilterResonanceHz: { min: 1, max: 250_000, unit: 'Hz, input filter L–C resonance; between the input frequency and half the switching frequency', maxWords: '250 kHz', minWords: '1 Hz' },
  lineVoltageRms: { min: 0, max: 100_000, unit: 'V, output line-to-line RMS', maxWords: '100 kV' },
  phaseCurrentRms: { min: 0, max: 100_000, unit: 'A RMS', maxWords: '100 kA' },
  fundamentalHz: { min: 0.01, max: 2_000, unit: 'Hz', maxWords: '2 kHz (the averaged model holds for motor and grid frequencies)', minWords: '0.01 Hz' },
  switchingHz: { min: 0.01, max: 500_000, unit: 'Hz', maxWords: '500 kHz', minWords: '0.01 Hz' },
  overshootVoltage: { min: 0, max: 100_000, unit: 'V', maxWords: '100 kV' },
  strayInductance: { min: 0, max: 1e-3, unit: 'H', maxWords: '1 mH' },
  currentSlope: { min: 0, max: 1e12, unit: 'A/s', maxWords: '10¹² A/s (1 kA/ns)' },
  clampDiodeUnitVoltage: { min: 10, max: 100_000, unit: 'V', maxWords: '100 kV', minWords: '10 V' },
  capacitorRippleTarget: { min: 1e-3, max: 100_000, unit: 'V peak-to-peak', maxWords: '100 kV', minWords: '1 mV' },
} as const satisfies Record<string, InputLimit>

export type LimitedField = keyof typeof INPUT_LIMITS

/** VA, largest apparent power √3·V_LL·I of one operating point. */
export const MAX_APPARENT_POWER = 1e9
/** Smallest f_sw / f for PWM: below it a carrier period spans a third of the fundamental and averaging fails. */
export const MIN_FREQUENCY_RATIO = 3

/** The message for a value above the field's maximum. */
export function tooLarge(field: LimitedField): string {
  const l: InputLimit = INPUT_LIMITS[field]
  return `${field} must be at most ${l.maxWords} (${l.unit})`
}

/** The message for a value below the field's minimum. */
export function tooSmall(field: LimitedField): string {
  const l: InputLimit = INPUT_LIMITS[field]
  return `${field} must be at least ${l.minWords ?? l.min} (${l.unit})`
}
