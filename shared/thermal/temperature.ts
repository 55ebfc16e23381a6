// Temperature-dependent loss figures and the junction temperature settled with the losses.
//
// Part data: the catalogue's loss figures are given at the data temperature T_data (the datasheet's
// hot value, column "Tj of loss data"); optional 25 °C values of the same figures make them linear in
// T_j between the two (and extrapolated linearly beyond them up to T_j,max, refused past it). A part
// with one temperature only keeps its figures at every T_j, said as an assumption on the result.
//
// Junction: T_j = T_heatsink + P(T_j)·(R_th,jc + R_th,ch), iterated (fixed point) until it moves less
// than SETTLE_K; with P linear in T_j the fixed point exists when R_th·dP/dT_j < 1, otherwise the
// losses outgrow the heat removal: thermal runaway (first principles).
import type { CatalogPart } from '../catalog/types'
import type { DeviceKind } from '../engine/types'
import { deviceLossAtPoint, type DeviceLoss, type LossPart, type PointDuty } from './losses'

export const REFERENCE_TEMPERATURE_C = 25
export const SETTLE_K = 0.01
const MAX_ITERATIONS = 200

/** The figures that change with T_j, and their 25 °C columns. */
export const TEMPERATURE_PAIRS = [
  ['switchThresholdVoltage', 'switchThresholdVoltage25'],
  ['switchSlopeResistance', 'switchSlopeResistance25'],
  ['diodeThresholdVoltage', 'diodeThresholdVoltage25'],
  ['diodeSlopeResistance', 'diodeSlopeResistance25'],
  ['turnOnEnergy', 'turnOnEnergy25'],
  ['turnOffEnergy', 'turnOffEnergy25'],
  ['recoveryEnergy', 'recoveryEnergy25'],
] as const

export type TemperaturePart = LossPart & Pick<CatalogPart, 'junctionTemperatureMax' | 'lossDataTemperature'
  | 'switchThresholdVoltage25' | 'switchSlopeResistance25' | 'diodeThresholdVoltage25' | 'diodeSlopeResistance25'
  | 'turnOnEnergy25' | 'turnOffEnergy25' | 'recoveryEnergy25'>

/** Whether the part gives its figures at two temperatures (the hot data temperature and 25 °C). */
export function hasTwoTemperatures(part: TemperaturePart): boolean {
  return part.lossDataTemperature !== undefined && part.lossDataTemperature > REFERENCE_TEMPERATURE_C
    && TEMPERATURE_PAIRS.some(([, cold]) => part[cold] !== undefined)
}

/**
 * The part's loss figures at junction temperature `tj` (°C): linear through (25 °C, cold value) and
 * (T_data, hot value) where both are given; hot value otherwise. Throws RangeError past T_j,max.
 */
export function partAtTemperature<T extends TemperaturePart>(part: T, tj: number): T {
  if (part.junctionTemperatureMax !== undefined && tj > part.junctionTemperatureMax + 1e-9) {
    throw new RangeError(`T_j ${Math.round(tj * 10) / 10} °C is past T_j,max ${part.junctionTemperatureMax} °C: the loss figures are not extrapolated there`)
  }
  if (!hasTwoTemperatures(part)) return part
  const hotT = part.lossDataTemperature!
  const out = { ...part }
  const x = (tj - REFERENCE_TEMPERATURE_C) / (hotT - REFERENCE_TEMPERATURE_C)
  for (const [hot, cold] of TEMPERATURE_PAIRS) {
    const h = part[hot]
    const c = part[cold]
    if (h === undefined || c === undefined) continue
    // Never below zero (a figure extrapolated below 25 °C stays physical).
    out[hot] = Math.max(0, c + (h - c) * x)
  }
  return out
}

/** The loss figures alone at `tj` (what deviceLossAtPoint reads), the same numbers as partAtTemperature without copying the whole part. */
export function lossFiguresAt(part: TemperaturePart, tj: number): LossPart {
  if (part.junctionTemperatureMax !== undefined && tj > part.junctionTemperatureMax + 1e-9) return partAtTemperature(part, tj)
  if (!hasTwoTemperatures(part)) return part
  const x = (tj - REFERENCE_TEMPERATURE_C) / (part.lossDataTemperature! - REFERENCE_TEMPERATURE_C)
  return {
    switchThresholdVoltage: between(part.switchThresholdVoltage, part.switchThresholdVoltage25, x),
    switchSlopeResistance: between(part.switchSlopeResistance, part.switchSlopeResistance25, x),
    diodeThresholdVoltage: between(part.diodeThresholdVoltage, part.diodeThresholdVoltage25, x),
    diodeSlopeResistance: between(part.diodeSlopeResistance, part.diodeSlopeResistance25, x),
    turnOnEnergy: between(part.turnOnEnergy, part.turnOnEnergy25, x),
    turnOffEnergy: between(part.turnOffEnergy, part.turnOffEnergy25, x),
    recoveryEnergy: between(part.recoveryEnergy, part.recoveryEnergy25, x),
    energyReferenceVoltage: part.energyReferenceVoltage,
    energyReferenceCurrent: part.energyReferenceCurrent,
  }
}

/** partAtTemperature's rule for one figure: the hot value where the 25 °C one is missing. */
function between(hot: number | undefined, cold: number | undefined, x: number): number | undefined {
  return hot === undefined || cold === undefined ? hot : Math.max(0, cold + (hot - cold) * x)
}

export type JunctionStatus = 'settled' | 'above-limit' | 'runaway'

export interface SettledJunction {
  status: JunctionStatus
  /** °C, settled (or the last value before the limit was passed) */
  junctionTemperatureC: number
  loss: DeviceLoss | null
  iterations: number
  /** assumption or explanation, one sentence */
  note: string
}

/**
 * Iterates T_j with the losses of one device at one point until it settles. `rth` = R_th,jc + R_th,ch (K/W).
 * 'above-limit': the losses at T_j,max still heat the junction past T_j,max (no settled value below it);
 * 'runaway': the iteration diverges (R_th·dP/dT_j ≥ 1).
 */
export function settleJunction(part: TemperaturePart, kind: DeviceKind, duty: PointDuty, switchingHz: number, series: number, parallel: number, heatsinkC: number, rth: number): SettledJunction {
  const two = hasTwoTemperatures(part)
  const tjMax = part.junctionTemperatureMax ?? Infinity
  const lossAt = (tj: number) => deviceLossAtPoint(lossFiguresAt(part, Math.min(tj, tjMax)), kind, duty, switchingHz, series, parallel)
  let tj = two ? heatsinkC : (part.lossDataTemperature ?? heatsinkC)
  let loss = lossAt(tj)
  if (!loss) return { status: 'settled', junctionTemperatureC: NaN, loss: null, iterations: 0, note: 'loss figures missing' }
  const single = two ? '' : `single-temperature loss data: the figures${part.lossDataTemperature !== undefined ? ` (given at ${part.lossDataTemperature} °C)` : ''} are used at every T_j (assumption)`
  if (two) {
    // Loop gain R_th·dP/dT_j over the data's range: at or above 1 no junction temperature balances the losses.
    const top = Number.isFinite(tjMax) ? tjMax : part.lossDataTemperature!
    const slope = (lossAt(top)!.total - lossAt(REFERENCE_TEMPERATURE_C)!.total) / (top - REFERENCE_TEMPERATURE_C)
    if (rth * slope >= 1) {
      // Reported T_j: what the losses at the top of the range alone would give (a lower bound).
      return { status: 'runaway', junctionTemperatureC: heatsinkC + lossAt(top)!.total * rth, loss: lossAt(top), iterations: 0, note: `thermal runaway: the losses rise by ${slope.toPrecision(3)} W/K, the heat path (${rth.toPrecision(3)} K/W) cannot remove the increase (loop gain ${(rth * slope).toPrecision(3)} ≥ 1)` }
    }
  }
  for (let k = 1; k <= MAX_ITERATIONS; k++) {
    const next = heatsinkC + loss!.total * rth
    const step = Math.abs(next - tj)
    if (next > tjMax) {
      // Past the limit: does the loss at T_j,max itself keep the junction above it?
      const atLimit = lossAt(tjMax)!
      const hot = heatsinkC + atLimit.total * rth
      if (hot > tjMax) {
        return { status: 'above-limit', junctionTemperatureC: hot, loss: atLimit, iterations: k, note: `T_j passes T_j,max ${tjMax} °C even with the losses at T_j,max${single ? `; ${single}` : ''}` }
      }
    }
    tj = next
    loss = lossAt(tj)!
    if (step < SETTLE_K) {
      return { status: 'settled', junctionTemperatureC: tj, loss, iterations: k, note: two ? `loss figures linear in T_j between ${REFERENCE_TEMPERATURE_C} °C and ${part.lossDataTemperature} °C, settled at T_j` : single }
    }
  }
  return { status: 'runaway', junctionTemperatureC: tj, loss, iterations: MAX_ITERATIONS, note: 'T_j did not settle: treated as thermal runaway' }
}

export interface PointJunction extends SettledJunction {
  pointName: string
}

/** The junction settled at every operating point; `worst` = the hottest point (runaway first). */
export function junctionOverPoints(part: TemperaturePart, kind: DeviceKind, points: readonly PointDuty[], switchingHz: number, series: number, parallel: number, heatsinkC: number, rth: number): { perPoint: PointJunction[], worst: PointJunction } | null {
  const perPoint = points.map(p => ({ pointName: p.pointName, ...settleJunction(part, kind, p, switchingHz, series, parallel, heatsinkC, rth) }))
  if (perPoint.length === 0 || perPoint.some(p => !p.loss)) return null
  const rank = (p: PointJunction) => (p.status === 'runaway' ? 2 : p.status === 'above-limit' ? 1 : 0)
  const worst = perPoint.reduce((a, b) => (rank(b) > rank(a) || (rank(b) === rank(a) && b.junctionTemperatureC > a.junctionTemperatureC) ? b : a))
  return { perPoint, worst }
}
