// The one generic integrator: switching-period-averaged device currents over one fundamental period.
import type { CompiledLeg } from './model'

export const DEFAULT_INTEGRATION_POINTS = 2048

export interface LegCurrents {
  /** A, per position */
  avg: Float64Array
  rms: Float64Array
  peak: Float64Array
  /** fundamental (sine) coefficient of the averaged pole reference, per unit of the half link */
  referenceFundamental: number
}

/**
 * State shares of the leg at reference m: PD level shares (level ⌊r⌋ with 1 − (r − ⌊r⌋), ⌊r⌋ + 1 with
 * r − ⌊r⌋, r = (1 + m)(L − 1)/2) — which phase-shifted carriers reproduce on average — or equal shares
 * for an input-averaged (matrix) leg. Writes level shares into `out` and returns the half wave.
 */
export function levelShares(leg: CompiledLeg, m: number, out: Float64Array): 0 | 1 {
  const L = leg.def.modelLevels
  out.fill(0)
  if (leg.def.carrier === 'input-averaged') {
    out.fill(1 / L)
    return 0
  }
  const r = ((1 + m) * (L - 1)) / 2
  const lo = Math.max(0, Math.min(Math.floor(r), L - 2))
  const f = r - lo
  out[lo] = 1 - f
  out[lo + 1] = f
  return m >= 0 ? 0 : 1
}

/**
 * I_avg = (1/2π)∫ d·|i| dθ and I_rms² = (1/2π)∫ d·i² dθ per position, midpoint rule over `points`
 * samples, with d the position's conduction share from the state table and the current's sign.
 * i(θ) = Î·sin(θ − φ); `reference` gives the clamped pole reference m(θ).
 */
export function integrateLeg(
  leg: CompiledLeg,
  reference: (theta: number) => number,
  currentPeak: number,
  phi: number,
  points = DEFAULT_INTEGRATION_POINTS,
): LegCurrents {
  const P = leg.positions.length
  const L = leg.def.modelLevels
  const sumAbs = new Float64Array(P)
  const sumSq = new Float64Array(P)
  const peak = new Float64Array(P)
  const shares = new Float64Array(L)
  const dTheta = (2 * Math.PI) / points
  // The peak current a position sees: the current's peak when sampled within half a step of it.
  const peakSnap = currentPeak * Math.cos(dTheta)
  let fundamental = 0

  for (let k = 0; k < points; k++) {
    const theta = (k + 0.5) * dTheta
    const m = reference(theta)
    fundamental += m * Math.sin(theta)
    const i = currentPeak * Math.sin(theta - phi)
    const sign = i >= 0 ? 0 : 1
    const ai = Math.abs(i)
    const i2 = i * i
    const half = levelShares(leg, m, shares)
    const table = leg.weights[half]!
    for (let l = 0; l < L; l++) {
      const share = shares[l]!
      if (share <= 0) continue
      const row = table[l]![sign]!
      for (let q = 0; q < row.index.length; q++) {
        const p = row.index[q]!
        const d = share * row.weight[q]!
        sumAbs[p]! += d * ai
        sumSq[p]! += d * i2
        if (d > 1e-12 && ai > peak[p]!) peak[p] = ai
      }
    }
  }

  const avg = new Float64Array(P)
  const rms = new Float64Array(P)
  for (let p = 0; p < P; p++) {
    avg[p] = sumAbs[p]! / points
    rms[p] = Math.sqrt(sumSq[p]! / points)
    if (peak[p]! >= peakSnap) peak[p] = currentPeak
  }
  return { avg, rms, peak, referenceFundamental: (2 * fundamental) / points }
}
