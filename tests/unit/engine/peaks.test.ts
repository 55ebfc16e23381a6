// Peak current per position at the edges of its conduction interval: exact on a coarse grid, never below the
// true supremum (checked against a closed form and against a fine brute-force scan of the same state table).
import { describe, expect, it } from 'vitest'
import { evaluateStress, legFor, topologies } from '../../../shared/engine'
import { integrateLeg, levelShares } from '../../../shared/engine/integrate'
import { makeReference } from '../../../shared/engine/modulation'
import { device, expectClose, inputAt } from './helpers'

/** Brute force: the largest |i| at any of `n` instants where the position carries current (share > 0). */
function scannedPeak(leg: ReturnType<typeof legFor>, reference: (t: number) => number, Ih: number, phi: number, n: number): Float64Array {
  const P = leg.positions.length
  const out = new Float64Array(P)
  const shares = new Float64Array(leg.def.modelLevels)
  for (let k = 0; k < n; k++) {
    const theta = (2 * Math.PI * k) / n
    const i = Ih * Math.sin(theta - phi)
    const table = leg.weights[levelShares(leg, reference(theta), shares)]!
    for (let l = 0; l < shares.length; l++) {
      if (shares[l]! <= 0) continue
      const row = table[l]![i >= 0 ? 0 : 1]!
      for (let q = 0; q < row.index.length; q++) if (row.weight[q]! > 0) out[row.index[q]!] = Math.max(out[row.index[q]!]!, Math.abs(i))
    }
  }
  return out
}

describe('peak current at the conduction edges', () => {
  it('NPC outer switch when regenerating (φ > 90°): Î·sin φ at θ = π, where its half wave ends (first principles), on a 64-point grid', () => {
    // S1 conducts for m > 0 and i > 0: θ ∈ (φ, π); |i| is largest at the edge θ = π: Î·sin(π − φ).
    for (const pf of [-0.2, -0.5, -0.9]) {
      const r = evaluateStress(inputAt('diode-clamped', 0.8, pf), { integrationPoints: 64 })
      const phi = Math.acos(pf)
      const Ih = Math.SQRT2 * 100
      expectClose(device(r.devices, 'S1').currentPeak, Ih * Math.sin(phi), 1e-12, `S1 at pf ${pf}`)
      // Its anti-parallel diode sees the current's own peak inside its interval (0, φ).
      expectClose(device(r.devices, 'D1').currentPeak, Ih, 1e-12, `D1 at pf ${pf}`)
    }
  })

  it('a midpoint grid alone would fall below the true peak there (why the edges are solved for)', () => {
    const pf = -0.5
    const phi = Math.acos(pf)
    const Ih = Math.SQRT2 * 100
    const grid = 64
    // The last grid midpoint below π is π − π/64.
    const gridPeak = Ih * Math.sin(Math.PI - Math.PI / grid - phi)
    const r = evaluateStress(inputAt('diode-clamped', 0.8, pf), { integrationPoints: grid })
    expect(device(r.devices, 'S1').currentPeak).toBeGreaterThan(gridPeak * 1.01)
  })

  const cases = topologies.flatMap(t => t.modulations.filter(m => m !== 'six-step').flatMap(modulation =>
    [{ pf: 0.85, amplitude: 0.9 }, { pf: -0.3, amplitude: 0.55 }, { pf: 0.1, amplitude: 1.2 }].map(c => ({ id: t.id, levels: t.allowedLevels === 'ignored' ? 3 : t.allowedLevels[t.allowedLevels.length > 2 ? 2 : 0]!, modulation, ...c }))))

  it.each(cases)('$id N=$levels $modulation pf $pf, amplitude $amplitude: 64-point peaks ≥ a 2¹⁷-instant scan and within its resolution (brute force)', ({ id, levels, modulation, pf, amplitude }) => {
    const t = topologies.find(x => x.id === id)!
    const leg = legFor(t, levels)
    const reference = makeReference(modulation, amplitude)
    const Ih = 100
    for (const phi of [Math.acos(pf), -Math.acos(pf)]) {
      const coarse = integrateLeg(leg, reference, Ih, phi, 64).peak
      const fine = scannedPeak(leg, reference, Ih, phi, 1 << 17)
      for (let p = 0; p < leg.positions.length; p++) {
        const what = `${leg.positions[p]!.name} φ=${phi.toFixed(3)}`
        expect(coarse[p]!, what).toBeGreaterThanOrEqual(fine[p]! - 1e-12 * Ih)
        // The scan's step is 2π/2¹⁷: it can miss at most Î·4.8e-5 at an edge.
        expect(coarse[p]!, what).toBeLessThanOrEqual(fine[p]! + 5e-5 * Ih)
      }
    }
  })
})
