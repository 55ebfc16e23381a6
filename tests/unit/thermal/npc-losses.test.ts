// NPC (diode-clamped, N = 3) losses per device against an independent brute-force time-domain run of
// the same switching events: the fundamental period is sampled finely, the leg state follows from
// the reference and two level-shifted in-phase triangular carriers (phase disposition, the engine's
// modulation), each sample charges conduction V_0·|i| + r·i² to the devices conducting in that state,
// and each change of state charges E_ref·(|i|/I_ref)·(V_dc/2 / V_ref) to the device that commutates,
// chosen by current sign from the NPC commutation cell listed here by hand (first principles; the
// engine instead derives it from its state table). Independent of the engine except for the
// per-point stresses it is compared with.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { deviceLossAtPoint, pointDutiesOf, type LossPart } from '../../../shared/thermal/losses'
import { inputAt } from '../engine/helpers'

const part: LossPart = {
  switchThresholdVoltage: 0.85,
  switchSlopeResistance: 3.1e-3,
  diodeThresholdVoltage: 0.75,
  diodeSlopeResistance: 2.2e-3,
  turnOnEnergy: 9e-3,
  turnOffEnergy: 14e-3,
  recoveryEnergy: 7e-3,
  energyReferenceVoltage: 300,
  energyReferenceCurrent: 200,
}

type State = 'P' | 'O' | 'N'
const Vdc = 800
const f = 50
const fsw = 5000

/** Devices conducting in each state, by current sign (i > 0 out of the leg). */
const conducting: Record<State, [string[], string[]]> = {
  P: [['S1', 'S2'], ['D1', 'D2']],
  O: [['Dc1+', 'S2'], ['S3', 'Dc1-']],
  N: [['D3', 'D4'], ['S3', 'S4']],
}

/** Energy events of a change of state: [device, which energy] for i > 0 and i < 0. */
const events: Record<string, [[string, 'on' | 'off' | 'rr'][], [string, 'on' | 'off' | 'rr'][]]> = {
  'O>P': [[['S1', 'on'], ['Dc1+', 'rr']], [['S3', 'off']]],
  'P>O': [[['S1', 'off']], [['S3', 'on'], ['D1', 'rr']]],
  'O>N': [[['S2', 'off']], [['S4', 'on'], ['Dc1-', 'rr']]],
  'N>O': [[['S2', 'on'], ['D4', 'rr']], [['S4', 'off']]],
}

/**
 * One fundamental period with the carrier shifted by `offset` of its period. With a carrier not
 * synchronised to the fundamental the pattern slides from period to period, so the long-run losses are
 * the mean over the offsets (bruteForce averages `offsets` of them).
 */
function onePeriod(M: number, phi: number, Irms: number, offset: number, samplesPerCarrier: number, fsw: number) {
  const Ih = Math.SQRT2 * Irms
  const carriers = fsw / f
  const n = carriers * samplesPerCarrier
  const dt = 1 / (f * n)
  const energy: Record<string, number> = {}
  const conduction: Record<string, number> = {}
  const add = (o: Record<string, number>, k: string, v: number) => { o[k] = (o[k] ?? 0) + v }
  const stateAt = (k: number): State => {
    const t = (k + 0.5) * dt
    const m = M * Math.sin(2 * Math.PI * f * t)
    // Triangle 0…1 at f_sw; upper carrier in [0, 1], lower in [−1, 0], in phase.
    const x = (t * fsw + offset) % 1
    const tri = x < 0.5 ? 2 * x : 2 - 2 * x
    if (m > tri) return 'P'
    if (m < tri - 1) return 'N'
    return 'O'
  }
  let previous = stateAt(n - 1)
  for (let k = 0; k < n; k++) {
    const t = (k + 0.5) * dt
    const i = Ih * Math.sin(2 * Math.PI * f * t - phi)
    const sign = i >= 0 ? 0 : 1
    const s = stateAt(k)
    for (const d of conducting[s][sign]) {
      const sw = d.startsWith('S')
      const v0 = sw ? part.switchThresholdVoltage! : part.diodeThresholdVoltage!
      const r = sw ? part.switchSlopeResistance! : part.diodeSlopeResistance!
      add(conduction, d, (v0 * Math.abs(i) + r * i * i) * dt * f)
    }
    if (s !== previous) {
      const list = events[`${previous}>${s}`]
      if (!list) throw new Error(`direct change ${previous}>${s}`)
      for (const [d, which] of list[sign]) {
        const e = which === 'on' ? part.turnOnEnergy! : which === 'off' ? part.turnOffEnergy! : part.recoveryEnergy!
        add(energy, d, e * (Math.abs(i) / part.energyReferenceCurrent!) * ((Vdc / 2) / part.energyReferenceVoltage!))
      }
    }
    previous = s
  }
  // Energies over one fundamental period × f = W
  return { conduction, switching: Object.fromEntries(Object.entries(energy).map(([d, e]) => [d, e * f])) }
}

function bruteForce(M: number, phi: number, Irms: number, fsw: number, offsets = 8, samplesPerCarrier = 1000) {
  const conduction: Record<string, number> = {}
  const switching: Record<string, number> = {}
  for (let j = 0; j < offsets; j++) {
    const run = onePeriod(M, phi, Irms, j / offsets, samplesPerCarrier, fsw)
    for (const [d, v] of Object.entries(run.conduction)) conduction[d] = (conduction[d] ?? 0) + v / offsets
    for (const [d, v] of Object.entries(run.switching)) switching[d] = (switching[d] ?? 0) + v / offsets
  }
  return { conduction, switching }
}

const positions = ['S1', 'D1', 'S2', 'D2', 'S3', 'D3', 'S4', 'D4', 'Dc1+', 'Dc1-']

describe('NPC per-device losses vs a brute-force time-domain run of the same switching events', () => {
  it.each([
    { M: 0.85, pf: 0.9 },
    { M: 0.5, pf: 0.5 },
    { M: 0.9, pf: -0.85 },
  ])('M = $M, cos φ = $pf', ({ M, pf }) => {
    const stress = evaluateStress(inputAt('diode-clamped', M, pf, { dcVoltage: Vdc, switchingHz: fsw, fundamentalHz: f, phaseCurrentRms: 150 }))
    const duties = positions.map(p => pointDutiesOf({ points: [{ ...stress, pointName: 'p' }] }, p)[0]!)
    const bf = bruteForce(M, Math.acos(pf), 150, fsw)
    let engineTotal = 0
    let bruteTotal = 0
    let engineSwitching = 0
    let bruteSwitching = 0
    positions.forEach((p, k) => {
      const kind = p.startsWith('S') ? 'switch' : p.startsWith('Dc') ? 'clamp-diode' : 'diode'
      const loss = deviceLossAtPoint(part, kind, duties[k]!, fsw)!
      const cond = bf.conduction[p] ?? 0
      const sw = bf.switching[p] ?? 0
      // Conduction: the switching-period average matches the sampled run to 0.1 %. Switching: at f_sw/f = 100 a
      // device's events see the current up to half a carrier period earlier or later than the average assumes
      // (turn-on late, turn-off early in the period), which moves a single diode's recovery loss by up to ~2 %
      // (seen here; it shrinks as f_sw/f grows); the sum over the devices is unaffected.
      expect(Math.abs(loss.conduction - cond), `${p} conduction ${loss.conduction} vs ${cond}`).toBeLessThanOrEqual(0.001 * cond + 0.01)
      expect(Math.abs(loss.switching - sw), `${p} switching ${loss.switching} vs ${sw}`).toBeLessThanOrEqual(0.025 * sw + 0.05)
      engineTotal += loss.total
      bruteTotal += cond + sw
      engineSwitching += loss.switching
      bruteSwitching += sw
    })
    expect(Math.abs(engineSwitching / bruteSwitching - 1), `switching ${engineSwitching} vs ${bruteSwitching}`).toBeLessThan(0.005)
    expect(Math.abs(engineTotal / bruteTotal - 1)).toBeLessThan(0.002)
  })
})
