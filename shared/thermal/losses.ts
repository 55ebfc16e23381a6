// Semiconductor losses per position and per operating point (never from an envelope mixed across points).
//
//   conduction  P_cond = V_0·I_avg + r·I_rms²   with I_avg, I_rms of the position at that point, per device
//   switching   every commutation of a carrier period charges E(i, v) = E_ref·(|i|/I_ref)·(v/V_ref) to the
//               device that commutates (linear scaling in current and voltage: common practice), with the
//               current at that instant and the voltage that device commutates (one level step; the whole
//               link in a two-level leg; in the matrix converter the input line-to-line voltage between the two
//               input phases at that instant, from its carrier pattern). The engine gives per point the mean over the fundamental period of
//               Σ |i|·v per carrier period (DeviceStress.switchingDuty, shared/engine/commutations.ts), so
//               P_sw = f_sw · Σ_role E_ref,role · duty_role / (I_ref · V_ref).
//   series / parallel parts: each carries 1/parallel of the current and 1/series of the voltage.
//   efficiency  motoring (P_ac > 0): η = P_ac / (P_ac + P_loss); regenerating: η = (|P_ac| − P_loss) / |P_ac|,
//               with P_ac = √3·V_LL·I·cosφ at the point (first principles; semiconductor losses only).
import type { CatalogPart } from '../catalog/types'
import type { ConverterResult, DeviceKind, DeviceStress, OperatingPoint } from '../engine/types'

/** One position's duty at one operating point. */
export interface PointDuty {
  pointName: string
  /** A */
  currentAvg: number
  /** A */
  currentRms: number
  /** A */
  currentPeak: number
  /** V·A per carrier period, by role; absent when the engine has no commutation model for the topology */
  switchingDuty?: DeviceStress['switchingDuty']
  /** V, one commutation's voltage (for the fallback without switchingDuty) */
  commutatedVoltage: number
}

export interface DeviceLoss {
  /** W per device */
  conduction: number
  switching: number
  total: number
}

export interface PointDeviceLoss extends DeviceLoss {
  pointName: string
}

export type LossPart = Pick<CatalogPart,
  'switchThresholdVoltage' | 'switchSlopeResistance' | 'diodeThresholdVoltage' | 'diodeSlopeResistance'
  | 'turnOnEnergy' | 'turnOffEnergy' | 'recoveryEnergy' | 'energyReferenceVoltage' | 'energyReferenceCurrent'>

export const SWITCHING_METHOD = 'Switching energies summed over the commutations of each carrier period derived from the state table, with the current at that instant and the voltage commutated; E = E_ref·(I/I_ref)·(V/V_ref) (linear scaling, common practice).'
export const FALLBACK_METHOD = 'No commutation model for this topology: switched current taken as Î/π at the full commutated voltage (an upper bound for a position that switches during part of its half-cycle).'

/**
 * Losses of one device of a part at a position kind and one point; null when the part lacks the
 * figures (missingFigures in shared/catalog/matching.ts names them).
 */
export function deviceLossAtPoint(part: LossPart, kind: DeviceKind, duty: PointDuty, switchingHz: number, series = 1, parallel = 1): DeviceLoss | null {
  const asSwitch = kind === 'switch'
  const v0 = asSwitch ? part.switchThresholdVoltage : part.diodeThresholdVoltage
  const r = asSwitch ? part.switchSlopeResistance : part.diodeSlopeResistance
  if (v0 === undefined || r === undefined) return null
  const iAvg = duty.currentAvg / parallel
  const iRms = duty.currentRms / parallel
  const conduction = v0 * iAvg + r * iRms * iRms
  const eOn = asSwitch ? part.turnOnEnergy : 0
  const eOff = asSwitch ? part.turnOffEnergy : 0
  const eRr = asSwitch ? 0 : (part.recoveryEnergy ?? 0)
  if (eOn === undefined || eOff === undefined) return null
  let switching = 0
  if ((eOn + eOff + eRr) > 0 && switchingHz > 0) {
    const vRef = part.energyReferenceVoltage
    const iRef = part.energyReferenceCurrent
    if (!vRef || !iRef) return null
    const sw = duty.switchingDuty
    // Each of `series` parts commutates 1/series of the voltage, each of `parallel` carries 1/parallel of the current.
    const scale = switchingHz / (iRef * vRef * series * parallel)
    switching = sw
      ? scale * (eOn * sw.turnOn + eOff * sw.turnOff + eRr * sw.recovery)
      : scale * (eOn + eOff + eRr) * (duty.currentPeak / Math.PI) * duty.commutatedVoltage
  }
  return { conduction, switching, total: conduction + switching }
}

/** Losses at every point, and the point with the highest total (named). Null when the part lacks figures. */
export function lossesOverPoints(part: LossPart, kind: DeviceKind, points: readonly PointDuty[], switchingHz: number, series = 1, parallel = 1): { perPoint: PointDeviceLoss[], worst: PointDeviceLoss } | null {
  const perPoint: PointDeviceLoss[] = []
  for (const p of points) {
    const loss = deviceLossAtPoint(part, kind, p, switchingHz, series, parallel)
    if (!loss) return null
    perPoint.push({ pointName: p.pointName, ...loss })
  }
  if (perPoint.length === 0) return null
  const worst = perPoint.reduce((a, b) => (b.total > a.total ? b : a))
  return { perPoint, worst }
}

/** The per-point duties of one device position of a converter, in the order of its operating points. */
export function pointDutiesOf(converter: Pick<ConverterResult, 'points'>, positionName: string): PointDuty[] {
  return converter.points.map((pt) => {
    const d = pt.devices.find(x => x.name === positionName)
    if (!d) throw new Error(`no position ${positionName} at operating point ${pt.pointName}`)
    return {
      pointName: pt.pointName,
      currentAvg: d.currentAvg,
      currentRms: d.currentRms,
      currentPeak: d.currentPeak,
      ...(d.switchingDuty ? { switchingDuty: d.switchingDuty } : {}),
      commutatedVoltage: d.commutatedVoltage ?? d.blockingVoltage,
    }
  })
}

/** W, AC-side active power at a point (negative = regeneration). */
export function acPower(point: OperatingPoint): number {
  return Math.sqrt(3) * point.lineVoltageRms * point.phaseCurrentRms * point.powerFactor
}

/** Efficiency of the semiconductors at a point: motoring P/(P + loss), regenerating (|P| − loss)/|P|; null without power. */
export function efficiencyAt(acPowerW: number, lossW: number): number | null {
  const p = Math.abs(acPowerW)
  if (!(p > 0)) return null
  return acPowerW > 0 ? p / (p + lossW) : (p - lossW) / p
}

/** One position's losses at one point, for all its devices in the converter. */
export interface PositionPointLoss {
  positionName: string
  /** W, all devices of the position in one converter */
  lossW: number
}

export interface PointLossSummary {
  pointName: string
  /** W, AC side (negative = regeneration) */
  acPowerW: number
  /** W, sum over the positions given */
  lossW: number
  efficiency: number | null
  positions: PositionPointLoss[]
}

/**
 * Totals per operating point from each position's per-point losses per converter (each position's
 * `perPoint` in the order of `points`, checked by name).
 */
export function totalsPerPoint(points: readonly (OperatingPoint & { pointName: string })[], byPosition: readonly { positionName: string, perPoint: readonly { pointName: string, lossW: number }[] }[]): PointLossSummary[] {
  return points.map((pt, k) => {
    const positions: PositionPointLoss[] = byPosition.map((p) => {
      const loss = p.perPoint[k]
      if (!loss || loss.pointName !== pt.pointName) throw new Error(`losses of ${p.positionName} lack operating point ${pt.pointName}`)
      return { positionName: p.positionName, lossW: loss.lossW }
    })
    const lossW = positions.reduce((s, p) => s + p.lossW, 0)
    const acPowerW = acPower(pt)
    return { pointName: pt.pointName, acPowerW, lossW, efficiency: efficiencyAt(acPowerW, lossW), positions }
  })
}

/** The headline: the point with the highest total losses, by name (null without points). */
export function headlinePoint(summaries: readonly PointLossSummary[]): PointLossSummary | null {
  if (summaries.length === 0) return null
  return summaries.reduce((a, b) => (b.lossW > a.lossW ? b : a))
}
