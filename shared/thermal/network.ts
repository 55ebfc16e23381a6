// Thermal network of one device and its time response to the instantaneous losses.
//
//   junction-case    Foster network Z_jc(t) = Σ R_i·(1 − e^(−t/τ_i)), up to four pairs per device from the
//                    catalogue (the datasheet's Z_th table); without them the single R_th,jc with no thermal
//                    capacity (the junction follows the instantaneous losses: an upper bound for the peak).
//   case-heatsink    R_th,ch of the part (interface material) under the baseplate: it carries the mean loss.
//   heatsink-ambient R_th,ha with one time constant τ_ha, set per design, driven by the summed losses of the
//                    converter (every position, three phases 120° apart).
//   T_j(t) = T_ambient + ΔT_ha(t) + R_th,ch·p̄ + ΔT_jc(t): the rises of networks in series added, each
//   driven by the power through it (common practice for Foster data, which has no physical inner nodes).
//
// Time stepping: the losses are piecewise constant over B bins of the fundamental period (shared/engine/
// profile.ts). Per Foster element and step Δt the exact solution for constant power is
//   x_(k+1) = a·x_k + (1 − a)·R·p_k,  a = e^(−Δt/τ)
// (zero-order hold, exact for the sampled power). The periodic steady state is the fixed point of one
// period of that recurrence, solved directly: x_0 = Σ_k a^(B−1−k)(1 − a)R·p_k / (1 − a^B); stepping from
// there repeats itself after one period (a unit test steps from cold until it does, and compares).
import { fosterKeys, type FosterDevice } from '../../catalog/columns'
import type { CatalogPart } from '../catalog/types'

export interface FosterPair {
  /** K/W */
  r: number
  /** s; 0 = no thermal capacity */
  tau: number
}

export const FOSTER_METHOD = 'Foster network junction-case Z(t) = Σ R_i(1 − e^(−t/τ_i)) from the catalogue, R_th,ch and the design\'s heatsink (R_th,ha, τ_ha) in series; losses time-stepped over the fundamental period (exact exponential step per element for the sampled losses) to periodic steady state.'
export const SINGLE_RTH_NOTE = 'no Foster data in the catalogue: junction-case taken as R_th,jc without thermal capacity, so the junction follows the instantaneous losses (an upper bound for the peak)'

/** Which device of a part a position uses ('switch' or the diode for diode and clamp-diode positions). */
export function fosterDevice(kind: 'switch' | 'diode' | 'clamp-diode'): FosterDevice {
  return kind === 'switch' ? 'Switch' : 'Diode'
}

/** The part's Foster pairs for a device; the single R_th,jc as one pair without capacity when none are given; null without either. */
export function fosterNetwork(part: Partial<CatalogPart>, kind: 'switch' | 'diode' | 'clamp-diode'): { pairs: FosterPair[], fromFoster: boolean } | null {
  const device = fosterDevice(kind)
  const pairs: FosterPair[] = []
  for (const [rKey, tauKey] of fosterKeys(device)) {
    const r = part[rKey]
    const tau = part[tauKey]
    if (r !== undefined && tau !== undefined && r > 0) pairs.push({ r, tau })
  }
  if (pairs.length) return { pairs, fromFoster: true }
  const rth = kind === 'switch' ? part.rthJunctionCaseSwitch : part.rthJunctionCaseDiode
  return rth === undefined ? null : { pairs: [{ r: rth, tau: 0 }], fromFoster: false }
}

/** K/W, the network's steady resistance Σ R_i. */
export function steadyResistance(pairs: readonly FosterPair[]): number {
  return pairs.reduce((s, p) => s + p.r, 0)
}

/** K/W, step response Z(t) = Σ R_i(1 − e^(−t/τ_i)) at t (s). */
export function stepResponse(pairs: readonly FosterPair[], t: number): number {
  return pairs.reduce((s, p) => s + p.r * (p.tau > 0 ? 1 - Math.exp(-t / p.tau) : 1), 0)
}

/**
 * K, temperature rise of the network at the end of each step in periodic steady state, driven by `power` (W,
 * one value per step of `dt` s, repeating). Adds into `out` when given (series networks share one sum).
 */
export function periodicRise(pairs: readonly FosterPair[], power: ArrayLike<number>, dt: number, out: Float64Array = new Float64Array(power.length)): Float64Array {
  const n = power.length
  for (const { r, tau } of pairs) {
    if (!(tau > 0)) {
      for (let k = 0; k < n; k++) out[k]! += r * power[k]!
      continue
    }
    const a = Math.exp(-dt / tau)
    const g = (1 - a) * r
    // x_0 of the periodic solution: one period stepped from 0, divided by (1 − a^n).
    let x = 0
    for (let k = 0; k < n; k++) x = a * x + g * power[k]!
    const an = a ** n
    x = an < 1 ? x / (1 - an) : x
    for (let k = 0; k < n; k++) {
      x = a * x + g * power[k]!
      out[k]! += x
    }
  }
  return out
}

/**
 * K, the same network stepped from `start` element states (0 = cold) for `periods` periods; returns the rise
 * at the end of each step of the last period and the element states (for the brute-force check).
 */
export function stepPeriods(pairs: readonly FosterPair[], power: ArrayLike<number>, dt: number, periods: number, start?: Float64Array): { rise: Float64Array, state: Float64Array } {
  const n = power.length
  const state = start ? Float64Array.from(start) : new Float64Array(pairs.length)
  const rise = new Float64Array(n)
  for (let period = 0; period < periods; period++) {
    for (let k = 0; k < n; k++) {
      let sum = 0
      pairs.forEach(({ r, tau }, i) => {
        state[i] = tau > 0 ? Math.exp(-dt / tau) * state[i]! + (1 - Math.exp(-dt / tau)) * r * power[k]! : r * power[k]!
        sum += state[i]!
      })
      if (period === periods - 1) rise[k] = sum
    }
  }
  return { rise, state }
}

/**
 * Steady response of one first-order element (R, τ = R·C) to P(t) = P_0 + P_1·sin(ωt): the frequency
 * response of a first-order low-pass, H(jω) = R / (1 + jωτ), so
 * ΔT(t) = R·P_0 + R·P_1/√(1 + (ωτ)²)·sin(ωt − arctan(ωτ)) (first principles, linear circuit theory).
 */
export function sinusoidalRise(pair: FosterPair, p0: number, p1: number, omega: number, t: number): number {
  const wt = omega * pair.tau
  return pair.r * p0 + (pair.r * p1 / Math.sqrt(1 + wt * wt)) * Math.sin(omega * t - Math.atan(wt))
}

/** Problems with a part's Foster columns (each names the field): a pair half given, or R_i not summing to R_th,jc. */
export function fosterProblems(part: Partial<CatalogPart>): { field: keyof CatalogPart, message: string, severity: 'error' | 'warning' }[] {
  const out: { field: keyof CatalogPart, message: string, severity: 'error' | 'warning' }[] = []
  for (const device of ['Switch', 'Diode'] as const) {
    let sum = 0
    let given = 0
    fosterKeys(device).forEach(([rKey, tauKey], i) => {
      const r = part[rKey]
      const tau = part[tauKey]
      if ((r === undefined) !== (tau === undefined)) {
        const missing = r === undefined ? rKey : tauKey
        out.push({ field: missing, message: `Zth ${device.toLowerCase()} pair ${i + 1}: give both R${i + 1} and τ${i + 1} (one of them is empty)`, severity: 'error' })
      }
      if (r !== undefined && tau !== undefined) { sum += r; given++ }
    })
    const rth = device === 'Switch' ? part.rthJunctionCaseSwitch : part.rthJunctionCaseDiode
    if (given && rth !== undefined && Math.abs(sum - rth) > 0.1 * rth) {
      out.push({ field: fosterKeys(device)[0]![0], message: `Zth ${device.toLowerCase()}: the R_i sum to ${Number(sum.toPrecision(3))} K/W but R_th junction-case is ${rth} K/W (more than 10 % apart; the Foster network is used for T_j)`, severity: 'warning' })
    }
  }
  return out
}
