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
  let fundamental = 0
  // Kept for the peak search: the reference and which positions conduct at each grid point.
  const gridM = new Float64Array(points)
  const gridConducts = new Uint8Array(points * P)

  for (let k = 0; k < points; k++) {
    const theta = (k + 0.5) * dTheta
    const m = reference(theta)
    gridM[k] = m
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
        gridConducts[k * P + p] = 1
      }
    }
  }

  const avg = new Float64Array(P)
  const rms = new Float64Array(P)
  for (let p = 0; p < P; p++) {
    avg[p] = sumAbs[p]! / points
    rms[p] = Math.sqrt(sumSq[p]! / points)
  }
  positionPeaks(leg, reference, currentPeak, phi, gridM, gridConducts, peak)
  return { avg, rms, peak, referenceFundamental: (2 * fundamental) / points }
}

const TWO_PI = 2 * Math.PI
const EDGE_ITERATIONS = 52
const GOLDEN = (Math.sqrt(5) - 1) / 2

/** Conduction share of one position at θ (0 where it does not carry the current). */
function shareAt(leg: CompiledLeg, reference: (theta: number) => number, phi: number, theta: number, position: number, shares: Float64Array): number {
  const m = reference(theta)
  const sign = Math.sin(theta - phi) >= 0 ? 0 : 1
  const table = leg.weights[levelShares(leg, m, shares)]!
  let d = 0
  for (let l = 0; l < shares.length; l++) {
    const share = shares[l]!
    if (share <= 0) continue
    const row = table[l]![sign]!
    for (let q = 0; q < row.index.length; q++) if (row.index[q] === position) d += share * row.weight[q]!
  }
  return d
}

/**
 * Peak current per position, exact: |i| is largest inside a conduction interval either at the current's own
 * peak or at an edge of the interval, where the position's share or the current's sign changes. The edges
 * are bracketed on the grid (plus the current's peaks and zeros and the reference's extrema, so a short
 * interval between two grid points is not missed) and bisected to 10⁻¹² rad; of each final bracket
 * the larger |i| is kept, so the peak is never below the true supremum.
 */
function positionPeaks(leg: CompiledLeg, reference: (theta: number) => number, currentPeak: number, phi: number, gridM: Float64Array, gridConducts: Uint8Array, peak: Float64Array): void {
  const P = leg.positions.length
  const points = gridM.length
  const shares = new Float64Array(leg.def.modelLevels)
  const dTheta = TWO_PI / points
  const wrap = (t: number) => ((t % TWO_PI) + TWO_PI) % TWO_PI
  const extra: number[] = []
  for (const t of [phi, phi + Math.PI / 2, phi + Math.PI, phi + (3 * Math.PI) / 2]) extra.push(wrap(t), wrap(t - 1e-12), wrap(t + 1e-12))
  // Extrema of the reference between grid points: a level band it only grazes is entered there.
  for (let k = 0; k < points; k++) {
    const prev = gridM[(k + points - 1) % points]!
    const here = gridM[k]!
    const next = gridM[(k + 1) % points]!
    const isMax = here > prev && here >= next
    const isMin = here < prev && here <= next
    if (!isMax && !isMin) continue
    let a = (k + 0.5) * dTheta - dTheta
    let b = (k + 0.5) * dTheta + dTheta
    const f = (t: number) => (isMax ? -reference(t) : reference(t))
    for (let it = 0; it < 40; it++) {
      const c = b - GOLDEN * (b - a)
      const d = a + GOLDEN * (b - a)
      if (f(c) < f(d)) b = d
      else a = c
    }
    extra.push(wrap((a + b) / 2))
  }
  extra.sort((x, y) => x - y)
  // Grid points (flags from the integration) merged with the extra angles (flags computed here).
  const n = points + extra.length
  const sorted = new Float64Array(n)
  const conducts = new Uint8Array(n * P)
  for (let k = 0, g = 0, e = 0; k < n; k++) {
    const gridTheta = g < points ? (g + 0.5) * dTheta : Infinity
    if (e < extra.length && extra[e]! < gridTheta) {
      const theta = extra[e++]!
      sorted[k] = theta
      const sign = Math.sin(theta - phi) >= 0 ? 0 : 1
      const table = leg.weights[levelShares(leg, reference(theta), shares)]!
      for (let l = 0; l < shares.length; l++) {
        if (shares[l]! <= 0) continue
        const row = table[l]![sign]!
        for (let q = 0; q < row.index.length; q++) if (row.weight[q]! > 0) conducts[k * P + row.index[q]!] = 1
      }
    }
    else {
      sorted[k] = gridTheta
      for (let p = 0; p < P; p++) conducts[k * P + p] = gridConducts[g * P + p]!
      g++
    }
  }
  const absI = (t: number) => Math.abs(currentPeak * Math.sin(t - phi))
  const absAt = sorted.map(absI)
  for (let p = 0; p < P; p++) {
    let best = 0
    for (let k = 0; k < n; k++) if (conducts[k * P + p]! && absAt[k]! > best) best = absAt[k]!
    for (let k = 0; k < n; k++) {
      const here = conducts[k * P + p]!
      const k2 = (k + 1) % n
      if (conducts[k2 * P + p]! === here) continue
      // |i| is monotone between neighbouring angles (its peaks are among them): an edge here cannot beat `best`
      // unless the bracket's larger end does.
      if (Math.max(absAt[k]!, absAt[k2]!) <= best) continue
      // An edge between angles k and k2: bisect on the conduction flag.
      let a = sorted[k]!
      let b = k2 === 0 ? sorted[0]! + TWO_PI : sorted[k2]!
      for (let it = 0; it < EDGE_ITERATIONS && b - a > 1e-12; it++) {
        const c = (a + b) / 2
        if ((shareAt(leg, reference, phi, c, p, shares) > 0 ? 1 : 0) === here) a = c
        else b = c
      }
      best = Math.max(best, absI(a), absI(b))
    }
    peak[p] = Math.min(best, currentPeak)
  }
}
