// The derating rule for semiconductor voltage classes, in one place for the engine and the catalogue matching.
import type { DeratingPolicy } from './types'

/**
 * Common practice (ENGINEERING.md "Derating"; no single source): DC link at ≤ 65 % of the
 * semiconductor rating, the commutation peak (steady blocking + overshoot) at most the rating itself,
 * peak current at or below the nominal current, capacitors up to their rated voltage (1.0 rather than
 * 0.9, because the capacitor voltage is already taken at the worst-case DC link) and ripple current at
 * or below the rating; 25 °C junction margin, 80 °C heatsink.
 */
export const defaultDerating: DeratingPolicy = {
  semiconductorVoltageUtilisation: 0.65,
  semiconductorTransientMargin: 1.0,
  semiconductorCurrentUtilisation: 1.0,
  capacitorVoltageUtilisation: 1.0,
  capacitorRippleUtilisation: 1.0,
  junctionMarginC: 25,
  heatsinkTemperatureC: 80,
}

export type VoltageCheck = 'utilisation' | 'transient'

export interface VoltageRequirement {
  /** V, rating the position needs */
  rating: number
  /** which of the two checks set it */
  decidedBy: VoltageCheck
}

/**
 * Voltage rating a position needs (common practice): (a) utilisation, steady blocking V ≤ u·rating
 * (cosmic-ray and long-term stress); (b) transient, V + ΔV ≤ margin·rating. The larger requirement wins;
 * the overshoot is never divided by u.
 */
export function voltageRequirement(steady: number, withOvershoot: number, policy: Pick<DeratingPolicy, 'semiconductorVoltageUtilisation' | 'semiconductorTransientMargin'>): VoltageRequirement {
  const byUtilisation = steady / policy.semiconductorVoltageUtilisation
  const byTransient = withOvershoot / policy.semiconductorTransientMargin
  return byTransient > byUtilisation ? { rating: byTransient, decidedBy: 'transient' } : { rating: byUtilisation, decidedBy: 'utilisation' }
}

export interface ClampStack {
  /** unit diodes in series */
  seriesCount: number
  /** V, rating each unit needs: the position's requirement shared equally */
  unitRating: number
  decidedBy: VoltageCheck
  /** set when the chosen unit rating would not carry the stack at the count its blocking alone suggests */
  warning?: string
}

/**
 * A clamp-diode stack: the count and the unit's required rating from the same rule, so the count is the
 * smallest n with n·unitRating ≥ max(V/u, (V+ΔV)/margin). Without a chosen unit rating each unit
 * blocks one level step (`levelStep`), as in the topology's own construction.
 */
export function clampStack(steady: number, withOvershoot: number, policy: Pick<DeratingPolicy, 'semiconductorVoltageUtilisation' | 'semiconductorTransientMargin'>, levelStep: number, chosenUnitRating?: number): ClampStack {
  const need = voltageRequirement(steady, withOvershoot, policy)
  if (chosenUnitRating === undefined) {
    const seriesCount = Math.max(1, Math.ceil(steady / levelStep - 1e-9))
    return { seriesCount, unitRating: need.rating / seriesCount, decidedBy: need.decidedBy }
  }
  const seriesCount = Math.max(1, Math.ceil(need.rating / chosenUnitRating - 1e-9))
  const naive = Math.max(1, Math.ceil(steady / chosenUnitRating - 1e-9))
  const stack: ClampStack = { seriesCount, unitRating: need.rating / seriesCount, decidedBy: need.decidedBy }
  if (seriesCount > naive) {
    const check = need.decidedBy === 'utilisation'
      ? `${round(steady)} V steady blocking must stay within ${round(policy.semiconductorVoltageUtilisation * 100)} % of the stack's rating`
      : `${round(withOvershoot)} V with overshoot must stay within ${round(policy.semiconductorTransientMargin * 100)} % of the stack's rating`
    stack.warning = `clampDiodeUnitVoltage ${round(chosenUnitRating)} V is too small for ${naive} unit${naive > 1 ? 's' : ''} in series (${check}): ${seriesCount} units are counted.`
  }
  return stack
}

function round(v: number): string {
  return Number(v.toPrecision(4)).toString()
}
