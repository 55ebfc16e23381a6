// The charge of a split DC link's capacitors from the switched currents themselves, instant by instant.
import { valuesOnGrid } from './modulation'
import { insertCrossing, segmentBoundaries, triangle } from './synth'

const TWO_PI = 2 * Math.PI

/**
 * Peak-to-peak charge (C) of each capacitor j = 1…L−1 of a split DC link over `periods` fundamental periods (after
 * which the carrier pattern repeats: f_sw/f × periods whole), from the switched currents: three legs on
 * phase-disposition carriers common to the phases, the carrier locked to the fundamental at the ratio f_sw/f (valley
 * at θ = 0, as the synthesis and the switched simulation have it),
 * natural sampling (the reference linear between the carrier's vertices and a floor of segments per period,
 * as in the synthesis). Capacitor j carries the currents of the phases whose pole sits at a DC node ≥ j, less
 * their mean over the period (the ripple-free DC source current of Kolar & Round, IEE Proc. EPA 153(4) 2006).
 *
 * Between two switching instants each capacitor's current is a sum of the phases' sinusoids, so its charge is
 * the integral in closed form, ∫ Î·sin(θ − φ_x) dθ = Î·(cos φ_x − cos(θ − φ_x)); the extremes lie at the
 * switching instants or at the stationary points between them, found in closed form. This catches what a model of quasi-static switching
 * periods averages out: where the reference has a kink (space-vector references) the carrier meets it at the
 * same phase in every fundamental period, and the period means jump there.
 */
export function switchedSplitLinkCharge(L: number, reference: (theta: number) => number, currentPeak: number, phi: number, frequencyRatio: number, fundamentalHz: number, periods = 1): Float64Array {
  const J = L - 1
  // Over `periods` fundamental periods (the carrier closes on itself after them): boundaries in units of that window.
  const window = TWO_PI * periods
  const bounds = segmentBoundaries([0], frequencyRatio * periods)
  const B = bounds.length
  // Band position r = (1 + m)(L − 1)/2 of each phase at each boundary; on the grid reference's values by
  // linear interpolation when it has them (finer than the segments themselves).
  const grid = valuesOnGrid(reference)
  const G = grid ? grid.length : 0
  const mAt = (theta: number): number => {
    if (!grid) return reference(theta)
    let x = (theta / TWO_PI) * G - 0.5
    x -= Math.floor(x / G) * G
    // (a tiny negative x rounds to G itself)
    if (x >= G) x -= G
    const j = Math.min(G - 1, Math.floor(x))
    const f = x - j
    const a = grid[j]!
    const b = grid[j + 1 === G ? 0 : j + 1]!
    return a + f * (b - a)
  }
  const r = new Float64Array(3 * B)
  for (let b = 0; b < B; b++) {
    for (let x = 0; x < 3; x++) r[x * B + b] = ((1 + mAt(window * bounds[b]! - (x * TWO_PI) / 3)) * J) / 2
  }
  const cosPx = new Float64Array(3)
  const sinPx = new Float64Array(3)
  for (let x = 0; x < 3; x++) {
    cosPx[x] = Math.cos(phi + (x * TWO_PI) / 3)
    sinPx[x] = Math.sin(phi + (x * TWO_PI) / 3)
  }
  // State of comparison (phase x, band k): the pole sits at a node above k while r_x − k exceeds the carrier.
  const u = new Float64Array(3 * J)
  const on = new Uint8Array(3 * J)
  const c0 = triangle(0)
  for (let x = 0; x < 3; x++) {
    for (let k = 0; k < J; k++) {
      u[x * J + k] = r[x * B]! - k - c0
      on[x * J + k] = u[x * J + k]! > 0 ? 1 : 0
    }
  }
  // W_j(θ) = ∫₀^θ of capacitor j's drawn current = base_j + Σ_x on(x, j)·I_x(θ), with I_x(θ) = Î·(cos φ_x − cos(θ − φ_x)):
  // switching (x, j) on or off moves I_x(θ) between the two terms, so base_j changes by ∓I_x at that instant. Between
  // two of its own switching instants capacitor j's current is a·sin θ + b·cos θ (the phases on), so only those
  // instants are recorded for it: θ, W_j, and a, b from there on.
  const base = new Float64Array(J)
  const capacity = Math.ceil(8 * frequencyRatio * periods) + 64 + 2 * J
  let count = 0
  let thetas = new Float64Array(capacity)
  let owner = new Int32Array(capacity)
  let W = new Float64Array(capacity)
  let sinPart = new Float64Array(capacity)
  let cosPart = new Float64Array(capacity)
  let cosAt = new Float64Array(capacity)
  let sinAt = new Float64Array(capacity)
  const record = (theta: number, j: number, q: number) => {
    if (count === thetas.length) {
      const grow = <T extends Float64Array | Int32Array>(a: T): T => { const g = new (a.constructor as new (n: number) => T)(2 * a.length); g.set(a); return g }
      thetas = grow(thetas)
      owner = grow(owner)
      W = grow(W)
      sinPart = grow(sinPart)
      cosPart = grow(cosPart)
      cosAt = grow(cosAt)
      sinAt = grow(sinAt)
    }
    const ct = Math.cos(theta)
    const st = Math.sin(theta)
    if (q >= 0) {
      // the toggled phase's I_x(θ) moves between base_j and the sum
      const x = Math.floor(q / J)
      const I = currentPeak * (cosPx[x]! - (ct * cosPx[x]! + st * sinPx[x]!))
      if (on[q]) base[j]! += I
      else base[j]! -= I
      on[q] = on[q]! ^ 1
    }
    let v = base[j]!
    let a = 0
    let b = 0
    for (let x = 0; x < 3; x++) {
      if (!on[x * J + j]) continue
      v += currentPeak * (cosPx[x]! - (ct * cosPx[x]! + st * sinPx[x]!))
      a += currentPeak * cosPx[x]!
      b -= currentPeak * sinPx[x]!
    }
    thetas[count] = theta
    owner[count] = j
    W[count] = v
    sinPart[count] = a
    cosPart[count] = b
    cosAt[count] = ct
    sinAt[count] = st
    count++
  }
  // base_j at θ = 0: the phases on there contribute I_x(0) = 0, so every base starts at 0.
  for (let j = 0; j < J; j++) record(0, j, -1)
  const evT = new Float64Array(3 * J)
  const evQ = new Int32Array(3 * J)
  for (let b = 0; b + 1 < B; b++) {
    const t0 = bounds[b]!
    const t1 = bounds[b + 1]!
    const dt = t1 - t0
    const c1 = triangle(t1 * frequencyRatio * periods)
    let n = 0
    for (let x = 0; x < 3; x++) {
      const r1 = r[x * B + b + 1]!
      for (let k = 0; k < J; k++) {
        const q = x * J + k
        const u0 = u[q]!
        const u1 = r1 - k - c1
        u[q] = u1
        if ((u1 > 0 ? 1 : 0) === on[q]) continue
        insertCrossing(evT, evQ, n++, t0 + (dt * u0) / (u0 - u1), q)
      }
    }
    for (let e = 0; e < n; e++) record(window * evT[e]!, evQ[e]! % J, evQ[e]!)
  }
  for (let j = 0; j < J; j++) record(window, j, -1)

  // q_j(θ) = W_j(θ) − mean_j·θ, mean_j = W_j(end) / the window's angle. Between two of its instants
  // W_j(θ) = c − a·cos θ + b·sin θ, so q_j is stationary where a·sin θ + b·cos θ = mean_j:
  // R·sin(θ + δ) = mean_j, R = √(a² + b²), δ = atan2(b, a).
  const out = new Float64Array(J)
  const mean = new Float64Array(J)
  for (let e = count - J; e < count; e++) mean[owner[e]!] = W[e]! / window
  const hi = new Float64Array(J).fill(-Infinity)
  const lo = new Float64Array(J).fill(Infinity)
  const previous = new Int32Array(J).fill(-1)
  const consider = (j: number, v: number) => {
    if (v > hi[j]!) hi[j] = v
    if (v < lo[j]!) lo[j] = v
  }
  for (let e = 0; e < count; e++) {
    const j = owner[e]!
    const m = mean[j]!
    consider(j, W[e]! - m * thetas[e]!)
    const p = previous[j]!
    previous[j] = e
    if (p < 0) continue
    const a = sinPart[p]!
    const b = cosPart[p]!
    // The slope a·sin θ + b·cos θ − mean and its derivative a·cos θ − b·sin θ at both ends: when neither changes
    // sign, the slope is monotone and keeps its sign, so there is no stationary point inside.
    const slopeP = a * sinAt[p]! + b * cosAt[p]! - m
    const slopeE = a * sinAt[e]! + b * cosAt[e]! - m
    const bendP = a * cosAt[p]! - b * sinAt[p]!
    const bendE = a * cosAt[e]! - b * sinAt[e]!
    // (only for a gap shorter than a quarter turn: the derivative, a sinusoid, cannot change sign twice there)
    if (slopeP * slopeE > 0 && bendP * bendE > 0 && thetas[e]! - thetas[p]! < Math.PI / 2) continue
    const R = Math.hypot(a, b)
    if (R < Math.abs(m) || R === 0) continue
    const c = W[p]! + a * Math.cos(thetas[p]!) - b * Math.sin(thetas[p]!)
    const delta = Math.atan2(b, a)
    const s0 = Math.asin(m / R)
    for (const root of [s0, Math.PI - s0]) {
      // every θ in (θ_p, θ_e) with θ + δ = root (mod 2π)
      let theta = root - delta
      theta += Math.ceil((thetas[p]! - theta) / TWO_PI) * TWO_PI
      for (; theta < thetas[e]!; theta += TWO_PI) {
        if (theta > thetas[p]!) consider(j, c - a * Math.cos(theta) + b * Math.sin(theta) - m * theta)
      }
    }
  }
  for (let j = 0; j < J; j++) out[j] = (hi[j]! - lo[j]!) / (TWO_PI * fundamentalHz)
  return out
}
