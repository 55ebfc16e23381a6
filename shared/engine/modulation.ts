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
  const shape = unitShape(modulation)
  return modulation === 'six-step' ? shape : theta => clamp(a * shape(theta))
}

function clamp(m: number): number {
  return m > 1 ? 1 : m < -1 ? -1 : m
}

/** The reference per unit amplitude before clamping, the shape `makeReference` scales (six-step: the square wave itself). */
function unitShape(modulation: Modulation): (theta: number) => number {
  switch (modulation) {
    case 'six-step':
      return theta => (Math.sin(theta) >= 0 ? 1 : -1)
    case 'sine':
      return theta => Math.sin(theta)
    case 'third-harmonic':
      // 1/6 of the fundamental at three times its frequency flattens the peak by √3/2.
      return theta => Math.sin(theta) + Math.sin(3 * theta) / 6
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
        return sa - (hi + lo) / 2
      }
  }
}

/** Unit shapes on the grid (j + ½)·2π/G, kept per modulation and G: they do not depend on the amplitude. */
const shapesOnGrid = new Map<string, Float64Array>()
const KEPT_SHAPES = 32

function shapeOnGrid(modulation: Modulation, G: number): Float64Array {
  const key = `${modulation}:${G}`
  let shape = shapesOnGrid.get(key)
  if (!shape) {
    const f = unitShape(modulation)
    shape = new Float64Array(G)
    for (let j = 0; j < G; j++) shape[j] = f(((j + 0.5) * TWO_PI) / G)
    if (shapesOnGrid.size >= KEPT_SHAPES) shapesOnGrid.delete(shapesOnGrid.keys().next().value!)
    shapesOnGrid.set(key, shape)
  }
  return shape
}

/** A reference that also carries its values on the grid (j + ½)·2π/(3·points) (see `gridReference`). */
export interface GridReference {
  (theta: number): number
  /** m at (j + ½)·2π/(3·points), j = 0…3·points − 1: phase a at integration point k is values[3k + 1] */
  values: Float64Array
  points: number
}

/**
 * The values a grid reference carries (see `GridReference`), when `reference` is one; with `points`, only when it was
 * made for that integration grid. Otherwise undefined, and the caller computes the reference at its angles.
 */
export function valuesOnGrid(reference: (theta: number) => number, points?: number): Float64Array | undefined {
  if (!('values' in reference)) return undefined
  const r = reference as GridReference
  return points === undefined || r.points === points ? r.values : undefined
}

/**
 * `makeReference(modulation, a)` with its values on the integration grid (k + ½)·2π/points and the two
 * other phases' shifts (all on the grid (j + ½)·2π/(3·points)) taken from the kept unit shape: the same
 * numbers as computing them (a × shape, then the clamp), without a sine per angle. Any other angle is computed afresh.
 */
export function gridReference(modulation: Modulation, a: number, points: number): GridReference {
  const G = 3 * points
  const shape = shapeOnGrid(modulation, G)
  const values = new Float64Array(G)
  if (modulation === 'six-step') values.set(shape)
  else for (let j = 0; j < G; j++) values[j] = clamp(a * shape[j]!)
  const exact = makeReference(modulation, a)
  const perRadian = G / TWO_PI
  const reference = ((theta: number) => {
    const x = theta * perRadian - 0.5
    const j = Math.round(x)
    if (Math.abs(x - j) > 1e-7) return exact(theta)
    return values[((j % G) + G) % G]!
  }) as GridReference
  reference.values = values
  reference.points = points
  return reference
}

/** sin and cos of the grid angles (j + ½)·2π/G, kept per G: a current Î·sin(θ − φ) on the grid is two products, not a sine. */
const trigOnGrid = new Map<number, { sin: Float64Array, cos: Float64Array }>()

export function gridTrig(G: number): { sin: Float64Array, cos: Float64Array } {
  let t = trigOnGrid.get(G)
  if (!t) {
    t = { sin: new Float64Array(G), cos: new Float64Array(G) }
    for (let j = 0; j < G; j++) {
      t.sin[j] = Math.sin(((j + 0.5) * TWO_PI) / G)
      t.cos[j] = Math.cos(((j + 0.5) * TWO_PI) / G)
    }
    if (trigOnGrid.size >= KEPT_SHAPES) trigOnGrid.delete(trigOnGrid.keys().next().value!)
    trigOnGrid.set(G, t)
  }
  return t
}
