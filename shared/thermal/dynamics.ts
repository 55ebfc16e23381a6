// Mean, peak and swing of the junction temperature of one device over the fundamental period, per
// operating point (network.ts for the thermal path, engine/profile.ts for the instantaneous duty).
//
//   1. mean T_j: settled with the temperature-dependent losses (temperature.ts) at the point's mean
//      heatsink temperature, R_th = Σ R_i (Foster) + R_th,ch;
//   2. instantaneous losses per angle bin from the profile with the figures at that mean T_j (the losses'
//      own change over the swing is neglected: assumption, stated);
//   3. T_j(t) = T_ambient + ΔT_ha(t) + R_th,ch·p̄ + ΔT_jc(t) in periodic steady state (network.ts); the
//      case-heatsink layer carries the mean loss p̄ (the baseplate's capacity, seconds, filters the ripple).
// The mean of the stepped T_j equals the settled mean exactly (the recurrence keeps the mean: R·mean(p)).
import type { PositionProfile } from '../engine/profile'
import { fosterNetwork, periodicRise, SINGLE_RTH_NOTE, steadyResistance, type FosterPair } from './network'
import { deviceLossAtPoint, type PointDuty } from './losses'
import { lossFiguresAt, settleJunction, type JunctionStatus, type TemperaturePart } from './temperature'
import type { CatalogPart } from '../catalog/types'

/** The design's cooling: ambient or coolant temperature and the heatsink to it. */
export interface CoolingSettings {
  /** °C, air or coolant temperature at the heatsink's inlet */
  ambientTemperatureC: number
  /** K/W, heatsink to ambient for the converter's whole semiconductor loss (0 = heatsink held at ambient) */
  heatsinkRth: number
  /** s, the heatsink's time constant */
  heatsinkTimeConstantS: number
}

/** A point's duty with its per-angle profile (absent: the point has no profile, dynamics not computed). */
export type ProfiledDuty = PointDuty & { profile?: PositionProfile, fundamentalHz?: number }

export interface PointDynamics {
  pointName: string
  status: JunctionStatus
  /** °C */
  meanC: number
  peakC: number
  minC: number
  /** K, peak − min over the period */
  swingK: number
  /** °C, heatsink mean at the point */
  heatsinkC: number
  /** s, time per period the junction is above its mean (the heating time of one cycle) */
  heatingTimeS: number
  /** W per device, mean over the period */
  lossW: number
}

export type DynamicsPart = TemperaturePart & Partial<CatalogPart>

/**
 * The case a device shares with the other devices of its module (one package over several positions):
 * the module's R_th,ch carries the sum of the module's losses, so
 *   T_j = T_heatsink + R_th,ch(module)·(n_own·p̄_own + P_others) + Z_th,jc * p_own.
 */
export interface SharedCase {
  /** K/W, case to heatsink of the whole module */
  rth: number
  /** devices of this position in one package (each with this device's loss) */
  ownDevices: number
  /** W, mean loss of the package's other devices at this point */
  othersMeanW: number
}

/**
 * W per device in each angle bin, from the profile and the part's figures (already at the wanted T_j). The
 * loss is linear in the duty (losses.ts): its coefficients come from deviceLossAtPoint at unit duties, so the
 * formula exists once and each bin costs five multiplications.
 */
export function binLosses(part: DynamicsPart, kind: 'switch' | 'diode' | 'clamp-diode', duty: ProfiledDuty, switchingHz: number, series: number, parallel: number, into?: Float64Array): Float64Array | null {
  const profile = duty.profile
  if (!profile) return null
  const withSwitching = !!(profile.turnOn && profile.turnOff && profile.recovery)
  // One duty object, its figures set per unit case (no object per call: this runs per position, point and bin set).
  const sw = { turnOn: 0, turnOff: 0, recovery: 0 }
  const unit: PointDuty = { pointName: duty.pointName, currentAvg: 0, currentRms: 0, currentPeak: duty.currentPeak, commutatedVoltage: duty.commutatedVoltage }
  if (withSwitching) unit.switchingDuty = sw
  const total = (avg: number, sq: number, on: number, off: number, rr: number) => {
    unit.currentAvg = avg
    unit.currentRms = Math.sqrt(sq)
    sw.turnOn = on
    sw.turnOff = off
    sw.recovery = rr
    return deviceLossAtPoint(part, kind, unit, switchingHz, series, parallel)?.total
  }
  const c0 = total(0, 0, 0, 0, 0)
  if (c0 === undefined) return null
  // Without a commutation model the fallback switching loss is constant over the period (in `c0`).
  const cAvg = total(1, 0, 0, 0, 0)! - c0
  const cSq = total(0, 1, 0, 0, 0)! - c0
  const cOn = withSwitching ? total(0, 0, 1, 0, 0)! - c0 : 0
  const cOff = withSwitching ? total(0, 0, 0, 1, 0)! - c0 : 0
  const cRr = withSwitching ? total(0, 0, 0, 0, 1)! - c0 : 0
  const B = profile.currentAbs.length
  // every bin is written below: a reused array needs no clearing
  const out = into?.length === B ? into : new Float64Array(B)
  for (let b = 0; b < B; b++) {
    out[b] = c0 + cAvg * profile.currentAbs[b]! + cSq * profile.currentSquare[b]!
      + (withSwitching ? cOn * profile.turnOn![b]! + cOff * profile.turnOff![b]! + cRr * profile.recovery![b]! : 0)
  }
  return out
}

// Per-bin scratch of junctionDynamics (losses, rise): it runs hundreds of times per matching and keeps neither past
// its return, so one pair per thread serves every call (fresh arrays each time were most of the matching's garbage).
let scratchLoss = new Float64Array(0)
let scratchRise = new Float64Array(0)

/**
 * T_j over one period at one point. `heatsinkPower` (W per bin, the converter's summed loss) drives the
 * heatsink; its mean sets the mean heatsink temperature. Null when the part lacks losses or thermal data.
 */
export function junctionDynamics(part: DynamicsPart, kind: 'switch' | 'diode' | 'clamp-diode', duty: ProfiledDuty, switchingHz: number, series: number, parallel: number, cooling: CoolingSettings, heatsinkPower: ArrayLike<number> | null, sharedCase?: SharedCase): (PointDynamics & { note: string, fromFoster: boolean }) | null {
  const network = fosterNetwork(part, kind)
  if (!network || !duty.profile || !duty.fundamentalHz) return null
  const B = duty.profile.currentAbs.length
  const dt = 1 / (duty.fundamentalHz * B)
  // Own share of the case-heatsink layer; a shared case adds the rise of the module's other devices.
  const rch = sharedCase ? sharedCase.rth * sharedCase.ownDevices : (part.rthCaseHeatsink ?? 0)
  const caseOffsetK = sharedCase ? sharedCase.rth * sharedCase.othersMeanW : 0
  const hsPairs: FosterPair[] = cooling.heatsinkRth > 0 ? [{ r: cooling.heatsinkRth, tau: cooling.heatsinkTimeConstantS }] : []
  let hsMeanPower = 0
  if (heatsinkPower) for (let b = 0; b < B; b++) hsMeanPower += heatsinkPower[b]! / B
  const heatsinkC = cooling.ambientTemperatureC + cooling.heatsinkRth * hsMeanPower
  const settled = settleJunction(part, kind, duty, switchingHz, series, parallel, heatsinkC + caseOffsetK, steadyResistance(network.pairs) + rch)
  if (!settled.loss) return null
  const notes = [settled.note, network.fromFoster ? '' : SINGLE_RTH_NOTE].filter(Boolean)
  const base = { pointName: duty.pointName, status: settled.status, heatsinkC, lossW: settled.loss.total, fromFoster: network.fromFoster }
  if (settled.status !== 'settled') {
    const t = settled.junctionTemperatureC
    return { ...base, meanC: t, peakC: t, minC: t, swingK: 0, heatingTimeS: 0, note: notes.join('; ') }
  }
  const atMean = lossFiguresAt(part, settled.junctionTemperatureC)
  if (scratchLoss.length !== B) {
    scratchLoss = new Float64Array(B)
    scratchRise = new Float64Array(B)
  }
  const p = binLosses(atMean, kind, duty, switchingHz, series, parallel, scratchLoss)
  if (!p) return null
  // periodicRise adds into the array it is given
  const rise = periodicRise(network.pairs, p, dt, scratchRise.fill(0))
  // The baseplate and heatsink capacities filter the fundamental ripple: R_th,ch carries the mean loss (assumption).
  let lossSum = 0
  for (let b = 0; b < B; b++) lossSum += p[b]!
  const meanLoss = lossSum / B
  for (let b = 0; b < B; b++) rise[b]! += rch * meanLoss + caseOffsetK
  if (hsPairs.length && heatsinkPower) periodicRise(hsPairs, heatsinkPower, dt, rise)
  else if (cooling.heatsinkRth > 0) for (let b = 0; b < B; b++) rise[b]! += cooling.heatsinkRth * hsMeanPower
  let peak = -Infinity
  let min = Infinity
  let sum = 0
  for (let b = 0; b < B; b++) {
    const t = cooling.ambientTemperatureC + rise[b]!
    if (t > peak) peak = t
    if (t < min) min = t
    sum += t
  }
  const mean = sum / B
  let above = 0
  for (let b = 0; b < B; b++) if (cooling.ambientTemperatureC + rise[b]! > mean) above++
  notes.push('instantaneous losses with the figures at the mean T_j (their change over the swing neglected); R_th,ch carries the mean loss')
  if (sharedCase) notes.push('one case shared with the module\'s other devices: the module\'s R_th,ch carries their summed mean loss')
  return { ...base, meanC: mean, peakC: peak, minC: min, swingK: peak - min, heatingTimeS: above * dt, note: notes.join('; ') }
}

/** W per bin of a whole converter: one position's per-device bin losses × devices per phase, the three phases 120° apart. */
export function addThreePhases(into: Float64Array, perDevice: ArrayLike<number>, devicesPerPhase: number, phases = 3): void {
  const B = into.length
  const shift = B / 3
  for (let b = 0; b < B; b++) {
    let s = 0
    for (let ph = 0; ph < phases; ph++) s += perDevice[(b + Math.round(ph * shift)) % B]!
    into[b]! += s * devicesPerPhase
  }
}
