// Normalised pole-voltage references m(θ) (per unit of the half DC link) for each modulation.
import type { Modulation } from './types'

const TWO_PI = 2 * Math.PI
const HALF_SQRT3 = Math.sqrt(3) / 2

/** Linear-range limit of the reference amplitude: sine 1; third-harmonic (1/6) and space vector 2/√3. */
export const linearLimit: Record<Exclude<Modulation, 'six-step'>, number> = {
  'sine': 1,
  'third-harmonic': 2 / Math.sqrt(3),
  'space-vector': 2 / Math.sqrt(3),
}

/** Fundamental of the six-step pole voltage per unit of V_dc/2 (square wave: 4/π). */
export const SIX_STEP_INDEX = 4 / Math.PI

/**
 * Reference of phase a at angle θ (rad) with fundamental amplitude `a`, clamped to [−1, 1]
 * (clamping only bites past the linear range, where the caller warns). Other phases: θ − 2πk/3.
 */
export function makeReference(modulation: Modulation, a: number): (theta: number) => number {
  switch (modulation) {
    case 'six-step':
      return theta => (Math.sin(theta) >= 0 ? 1 : -1)
    case 'sine':
      return theta => clamp(a * Math.sin(theta))
    case 'third-harmonic':
      // 1/6 of the fundamental at three times its frequency flattens the peak by √3/2.
      return theta => clamp(a * (Math.sin(theta) + Math.sin(3 * theta) / 6))
    case 'space-vector':
      // Min-max common-mode injection: the same linear range and duties as space-vector modulation.
      // sin(θ ∓ 2π/3) = −sin θ / 2 ∓ (√3/2)·cos θ: one sine and one cosine per angle instead of three sines.
      return (theta) => {
        const sa = Math.sin(theta)
        const ca = HALF_SQRT3 * Math.cos(theta)
        const sb = -0.5 * sa - ca
        const sc = -0.5 * sa + ca
        const hi = sa > sb ? (sa > sc ? sa : sc) : (sb > sc ? sb : sc)
        const lo = sa < sb ? (sa < sc ? sa : sc) : (sb < sc ? sb : sc)
        return clamp(a * (sa - (hi + lo) / 2))
      }
  }
}

function clamp(m: number): number {
  return m > 1 ? 1 : m < -1 ? -1 : m
}

/**
 * The same reference, remembered on the angles the period integrations use: (k + ½)·2π/points and those
 * shifted by −2π/3 and −4π/3 (the other two phases) are all the grid (j + ½)·2π/(3·points), so each value there
 * is computed once per evaluation instead of once per integration. Any other angle is computed afresh.
 */
export function rememberOnGrid(reference: (theta: number) => number, points: number): (theta: number) => number {
  const G = 3 * points
  const values = new Float64Array(G).fill(Number.NaN)
  const perRadian = G / TWO_PI
  return (theta) => {
    const x = theta * perRadian - 0.5
    const j = Math.round(x)
    if (Math.abs(x - j) > 1e-7) return reference(theta)
    const index = ((j % G) + G) % G
    let v = values[index]!
    if (Number.isNaN(v)) {
      v = reference(((index + 0.5) * TWO_PI) / G)
      values[index] = v
    }
    return v
  }
}
