// The one generic integrator: switching-period-averaged device currents over one fundamental period.
import type { CompiledLeg } from './model'
import { gridTrig, valuesOnGrid } from './modulation'

/** Even (the half waves) and divisible by 3 (the three phases share one grid, so three-phase sums repeat every third). */
export const DEFAULT_INTEGRATION_POINTS = 2046

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
  const dTheta = (2 * Math.PI) / points
  let fundamental = 0
  // Kept for the peak search: the reference at each grid point.
  const gridM = new Float64Array(points)
  const averaged = leg.def.carrier === 'input-averaged'
  // A position's integrand is Σ over (half wave h, level l, sign s) of its table weight times share_l·|i| (and
  // share_l·i²) where the half wave and the sign are h and s: the grid sums those per (h, l, s), and the table
  // weights are applied once afterwards, so the loop over the grid does not visit the positions.
  const momentAbs = new Float64Array(2 * L * 2)
  const momentSq = new Float64Array(2 * L * 2)
  const at = (h: number, l: number, s: number) => (h * L + l) * 2 + s
  const onGrid = valuesOnGrid(reference, points)

  // sin θ and cos θ of the integration angles, kept per grid: i = Î·(sin θ·cos φ − cos θ·sin φ).
  const trig = gridTrig(points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  for (let k = 0; k < points; k++) {
    const m = onGrid ? onGrid[3 * k + 1]! : reference((k + 0.5) * dTheta)
    gridM[k] = m
    const sinTheta = trig.sin[k]!
    fundamental += m * sinTheta
    const i = currentPeak * (sinTheta * cosPhi - trig.cos[k]! * sinPhi)
    const sign = i >= 0 ? 0 : 1
    const ai = Math.abs(i)
    const i2 = i * i
    if (averaged) {
      // An input-averaged leg: every level a share 1/L, table 0.
      for (let l = 0; l < L; l++) {
        momentAbs[at(0, l, sign)]! += ai / L
        momentSq[at(0, l, sign)]! += i2 / L
      }
      continue
    }
    // PD shares sit on two neighbouring levels (the same as levelShares, inline).
    const half = m >= 0 ? 0 : 1
    const r = ((1 + m) * (L - 1)) / 2
    const floor = Math.floor(r)
    const first = floor < 0 ? 0 : floor > L - 2 ? L - 2 : floor
    const f = r - first
    const a = at(half, first, sign)
    const b = a + 2
    momentAbs[a]! += (1 - f) * ai
    momentSq[a]! += (1 - f) * i2
    momentAbs[b]! += f * ai
    momentSq[b]! += f * i2
  }
  for (let h = 0; h < 2; h++) {
    for (let l = 0; l < L; l++) {
      for (let sign = 0; sign < 2; sign++) {
        const ma = momentAbs[at(h, l, sign)]!
        const ms = momentSq[at(h, l, sign)]!
        if (ma === 0 && ms === 0) continue
        const row = leg.weights[h]![l]![sign]!
        for (let q = 0; q < row.index.length; q++) {
          const p = row.index[q]!
          sumAbs[p]! += row.weight[q]! * ma
          sumSq[p]! += row.weight[q]! * ms
        }
      }
    }
  }

  const avg = new Float64Array(P)
  const rms = new Float64Array(P)
  for (let p = 0; p < P; p++) {
    avg[p] = sumAbs[p]! / points
    rms[p] = Math.sqrt(sumSq[p]! / points)
  }
  positionPeaks(leg, reference, currentPeak, phi, gridM, peak)
  return { avg, rms, peak, referenceFundamental: (2 * fundamental) / points }
}

const TWO_PI = 2 * Math.PI
const EDGE_ITERATIONS = 52
const GOLDEN = (Math.sqrt(5) - 1) / 2

/**
 * What decides which positions conduct at θ (reference m there): the level shares that are positive, the half wave and the
 * current's sign, as one number (equal numbers, equal conduction flags). Flags into `flags` when given.
 */
function conductionKey(leg: CompiledLeg, m: number, phi: number, theta: number, shares: Float64Array, flags?: Uint8Array): number {
  return conductionKeyOf(leg, m, Math.sin(theta - phi) >= 0 ? 0 : 1, shares, flags)
}

/** The same with the current's sign (0: i ≥ 0, 1: i < 0) given; without `flags` no table is touched (the level shares inline). */
function conductionKeyOf(leg: CompiledLeg, m: number, sign: 0 | 1, shares: Float64Array, flags?: Uint8Array): number {
  if (!flags) {
    const L = leg.def.modelLevels
    if (leg.def.carrier === 'input-averaged') return sign + KEY_ALL_LEVELS[L]!
    const r = ((1 + m) * (L - 1)) / 2
    const floor = Math.floor(r)
    const lo = floor < 0 ? 0 : floor > L - 2 ? L - 2 : floor
    const f = r - lo
    let key = (m >= 0 ? 0 : 2) + sign
    if (1 - f > 0) key += 4 << lo
    if (f > 0) key += 4 << (lo + 1)
    return key
  }
  const half = levelShares(leg, m, shares)
  let key = half * 2 + sign
  for (let l = 0; l < shares.length; l++) if (shares[l]! > 0) key += 4 << l
  flags.fill(0)
  const table = leg.weights[half]!
  for (let l = 0; l < shares.length; l++) {
    if (shares[l]! <= 0) continue
    const row = table[l]![sign]!
    for (let q = 0; q < row.index.length; q++) if (row.weight[q]! > 0) flags[row.index[q]!] = 1
  }
  return key
}

/** Key bits of an input-averaged leg of L levels: every level's share (1/L) positive. */
const KEY_ALL_LEVELS = Array.from({ length: 33 }, (_, L) => { let k = 0; for (let l = 0; l < L; l++) k += 4 << l; return k })

/**
 * Peak current per position, exact: |i| is largest inside a conduction interval either at the current's own
 * peak or at an edge of the interval, where the position's share or the current's sign changes. The edges
 * are bracketed on the grid (plus the current's peaks and zeros and the reference's extrema, so a short
 * interval between two grid points is not missed) and bisected to 10⁻¹² rad; of each final bracket
 * the larger |i| is kept, so the peak is never below the true supremum.
 */
function positionPeaks(leg: CompiledLeg, reference: (theta: number) => number, currentPeak: number, phi: number, gridM: Float64Array, peak: Float64Array): void {
  const P = leg.positions.length
  const points = gridM.length
  const shares = new Float64Array(leg.def.modelLevels)
  const dTheta = TWO_PI / points
  const wrap = (t: number) => ((t % TWO_PI) + TWO_PI) % TWO_PI
  // A position that conducts at one of the current's two peaks has the peak |i| there, the largest anywhere (the
  // search below would find the same value at those angles): when every position does (redundant states used
  // evenly, two-level legs off the clamp), that is the answer.
  const atPeaks = new Uint8Array(P)
  const flags = new Uint8Array(P)
  let largest = 0
  for (const t of [wrap(phi + Math.PI / 2), wrap(phi + (3 * Math.PI) / 2)]) {
    const i = currentPeak * Math.sin(t - phi)
    conductionKeyOf(leg, reference(t), i >= 0 ? 0 : 1, shares, flags)
    for (let p = 0; p < P; p++) atPeaks[p] = atPeaks[p]! | flags[p]!
    largest = Math.max(largest, Math.abs(i))
  }
  if (atPeaks.every(f => f === 1)) {
    peak.fill(Math.min(largest, currentPeak))
    return
  }
  const extra: number[] = []
  for (const t of [phi, phi + Math.PI / 2, phi + Math.PI, phi + (3 * Math.PI) / 2]) extra.push(wrap(t), wrap(t - 1e-12), wrap(t + 1e-12))
  // Extrema of the reference between grid points: a level band it only grazes is entered there.
  for (let k = 0; k < points; k++) {
    const prev = gridM[k === 0 ? points - 1 : k - 1]!
    const here = gridM[k]!
    const next = gridM[k + 1 === points ? 0 : k + 1]!
    const isMax = here > prev && here >= next
    const isMin = here < prev && here <= next
    if (!isMax && !isMin) continue
    // Golden-section search, one new point per step: 40 steps shrink the bracket by 0.618⁴⁰ ≈ 4e-9.
    let a = (k + 0.5) * dTheta - dTheta
    let b = (k + 0.5) * dTheta + dTheta
    const f = (t: number) => (isMax ? -reference(t) : reference(t))
    let c = b - GOLDEN * (b - a)
    let d = a + GOLDEN * (b - a)
    let fc = f(c)
    let fd = f(d)
    for (let it = 0; it < 40; it++) {
      if (fc < fd) {
        b = d
        d = c
        fd = fc
        c = b - GOLDEN * (b - a)
        fc = f(c)
      }
      else {
        a = c
        c = d
        fc = fd
        d = a + GOLDEN * (b - a)
        fd = f(d)
      }
    }
    extra.push(wrap((a + b) / 2))
  }
  extra.sort((x, y) => x - y)
  // Grid points merged with the extra angles, each with its conduction key; the flags are kept once per key.
  const n = points + extra.length
  const sorted = new Float64Array(n)
  const keys = new Int32Array(n)
  const flagsOf = new Map<number, { flags: Uint8Array, absMax: number }>()
  const absI = (t: number) => Math.abs(currentPeak * Math.sin(t - phi))
  const absAt = new Float64Array(n)
  let lastKey = -1
  let lastEntry: { flags: Uint8Array, absMax: number } | undefined
  const trig = gridTrig(points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  for (let k = 0, g = 0, e = 0; k < n; k++) {
    const gridTheta = g < points ? (g + 0.5) * dTheta : Infinity
    const fromGrid = !(e < extra.length && extra[e]! < gridTheta)
    const theta = fromGrid ? gridTheta : extra[e++]!
    sorted[k] = theta
    // on the grid the current from the kept sines, elsewhere afresh
    const i = fromGrid ? currentPeak * (trig.sin[g]! * cosPhi - trig.cos[g]! * sinPhi) : currentPeak * Math.sin(theta - phi)
    const m = fromGrid ? gridM[g++]! : reference(theta)
    const sign = i >= 0 ? 0 : 1
    absAt[k] = Math.abs(i)
    const key = conductionKeyOf(leg, m, sign, shares)
    keys[k] = key
    // Neighbouring angles mostly share their key: the last entry is kept at hand.
    let entry = key === lastKey ? lastEntry! : flagsOf.get(key)
    if (!entry) {
      entry = { flags: new Uint8Array(P), absMax: 0 }
      conductionKeyOf(leg, m, sign, shares, entry.flags)
      flagsOf.set(key, entry)
    }
    lastKey = key
    lastEntry = entry
    if (absAt[k]! > entry.absMax) entry.absMax = absAt[k]!
  }
  // Largest |i| on the angles where each position conducts.
  const best = new Float64Array(P)
  for (const { flags, absMax } of flagsOf.values()) {
    for (let p = 0; p < P; p++) if (flags[p] && absMax > best[p]!) best[p] = absMax
  }
  const before = new Uint8Array(P)
  const after = new Uint8Array(P)
  for (let k = 0; k < n; k++) {
    const k2 = (k + 1) % n
    if (keys[k] === keys[k2]) continue
    // |i| is monotone between neighbouring angles (its peaks are among them): a bracket whose larger end does not
    // beat a position's best cannot raise it, whatever happens inside.
    const bracketMax = Math.max(absAt[k]!, absAt[k2]!)
    const fa = flagsOf.get(keys[k]!)!.flags
    const fb = flagsOf.get(keys[k2]!)!.flags
    let needed = false
    for (let p = 0; p < P && !needed; p++) needed = fa[p] !== fb[p] && bracketMax > best[p]!
    if (!needed) continue
    // Edges between angles k and k2: bisect on what decides conduction, once for every position, and walk on
    // past each edge found until the far end's state is reached (two edges may share a bracket).
    let a = sorted[k]!
    const b = k2 === 0 ? sorted[0]! + TWO_PI : sorted[k2]!
    const keyAt = (t: number, flags?: Uint8Array) => conductionKey(leg, reference(t), phi, t, shares, flags)
    let keyA = keyAt(a, before)
    const keyB = keyAt(b)
    for (let edge = 0; keyA !== keyB && edge < 4 * shares.length + 4; edge++) {
      let lo = a
      let hi = b
      for (let it = 0; it < EDGE_ITERATIONS && hi - lo > 1e-12; it++) {
        const c = (lo + hi) / 2
        if (keyAt(c) === keyA) lo = c
        else hi = c
      }
      keyA = keyAt(hi, after)
      // Of each final bracket the larger |i| is kept, so the peak is never below the true supremum.
      for (let p = 0; p < P; p++) if (before[p] !== after[p]) best[p] = Math.max(best[p]!, absI(lo), absI(hi))
      before.set(after)
      a = hi
    }
  }
  for (let p = 0; p < P; p++) peak[p] = Math.min(best[p]!, currentPeak)
}
