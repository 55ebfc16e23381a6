// Shared fixtures for the engine tests: inputs from a modulation index, tolerance checks.
import { expect } from 'vitest'
import type { StressInput, TopologyId } from '../../../shared/engine'

export const SQRT3 = Math.sqrt(3)

/** V, output line-to-line RMS that gives modulation index M on a DC link V_dc (M = Û_ph / (V_dc/2)). */
export function lineVoltageFor(M: number, halfLink: number): number {
  return (M * halfLink * SQRT3) / Math.SQRT2
}

/** A stress input at modulation index M (half link: V_dc/2, or cells·V_cell for the cascaded H-bridge). */
export function inputAt(topology: TopologyId, M: number, powerFactor: number, over: Partial<StressInput> = {}): StressInput {
  const levels = over.levels ?? (topology === 'two-level' ? 2 : 3)
  const dcVoltage = over.dcVoltage ?? (topology === 'cascaded-h-bridge' ? 600 : 800)
  const halfLink = topology === 'cascaded-h-bridge' ? ((levels - 1) / 2) * dcVoltage : dcVoltage / 2
  return {
    topology,
    levels,
    dcVoltage,
    lineVoltageRms: lineVoltageFor(M, halfLink),
    phaseCurrentRms: 100,
    powerFactor,
    fundamentalHz: 50,
    switchingHz: 5000,
    modulation: 'sine',
    ...over,
  }
}

/** |actual/expected − 1| ≤ tol (absolute when expected is 0). */
export function expectClose(actual: number, expected: number, tol: number, what = ''): void {
  const err = expected === 0 ? Math.abs(actual) : Math.abs(actual / expected - 1)
  expect(err, `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(tol)
}

export function device<T extends { name: string }>(list: T[], name: string): T {
  const d = list.find(x => x.name === name)
  if (!d) throw new Error(`no position ${name}`)
  return d
}

/** Gaussian elimination with partial pivoting, for the small circuit equations of the switched simulations. */
export function solve(a: number[][], b: number[]): number[] {
  const n = b.length
  const m = a.map((row, r) => [...row, b[r]!])
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[p]![c]!)) p = r
    ;[m[c], m[p]] = [m[p]!, m[c]!]
    for (let r = 0; r < n; r++) {
      if (r === c) continue
      const f = m[r]![c]! / m[c]![c]!
      for (let k = c; k <= n; k++) m[r]![k] = m[r]![k]! - f * m[c]![k]!
    }
  }
  return m.map((row, r) => row[n]! / row[r]!)
}
