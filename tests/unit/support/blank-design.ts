import type { DesignInput } from '../../../shared/engine/types'

/** A valid three-level NPC design input (the form's default), to break one field at a time. */
export function blankDesignInput(): DesignInput {
  return {
    machineSide: {
      topology: 'diode-clamped',
      levels: 3,
      dcVoltage: 1100,
      dcVoltageMax: 1250,
      switchingHz: 4000,
      modulation: 'space-vector',
      overshootVoltage: 100,
      operatingPoints: [{ name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 400, powerFactor: 0.86, fundamentalHz: 50 }],
    },
  }
}
