// Instantaneous duty of every position over one fundamental period, for the thermal time-stepping:
// the same switching-period-averaged integrands as integrateLeg / integrateSwitching (conduction share
// d(θ) from the state table, i(θ) = Î·sin(θ − φ), commutations from the derived table), kept per angle
// bin instead of only their mean. The mean over the bins equals the point's I_avg, I_rms² and
// switching duty (a unit test checks it), so losses from a profile average to the point's losses.
import { deriveCommutations, integrateSwitching } from './commutations'
import { levelShares } from './integrate'
import { matrixSwitching } from './matrix-input'
import { makeReference, SIX_STEP_INDEX } from './modulation'
import { scalesFor } from './stress'
import type { StressInput } from './types'
import { resolveStressInput } from './validate'

/** Angle bins per fundamental period: a multiple of 3, so the other phases are the same profile shifted by B/3. */
export const PROFILE_BINS = 96
const SAMPLES_PER_BIN = 12

export interface PositionProfile {
  name: string
  /** A, per bin: mean of d·|i| (conducting share times the current) */
  currentAbs: Float64Array
  /** A², per bin: mean of d·i² */
  currentSquare: Float64Array
  /** V·A per carrier period, per bin (as DeviceStress.switchingDuty); null without a commutation model */
  turnOn: Float64Array | null
  turnOff: Float64Array | null
  recovery: Float64Array | null
}

export interface LossProfile {
  /** bin b covers θ in [2πb/B, 2π(b + 1)/B) of the fundamental period, θ = 2π·f·t */
  bins: number
  /** Hz */
  fundamentalHz: number
  positions: PositionProfile[]
}

/** The per-angle duty of every position of one operating point (the inputs evaluateStress takes). */
export function lossProfile(input: StressInput, bins = PROFILE_BINS): LossProfile {
  const p = resolveStressInput(input)
  const { leg } = p
  const scales = scalesFor(p)
  const sixStep = p.modulation === 'six-step'
  const amplitude = sixStep ? SIX_STEP_INDEX : ((Math.SQRT2 * p.lineVoltageRms) / Math.sqrt(3)) / scales.halfLink
  const points = bins * SAMPLES_PER_BIN
  const dTheta = (2 * Math.PI) / points
  const reference = makeReference(p.modulation, amplitude)
  // The reference at the sample angles, once: the conduction loop and integrateSwitching read the same values.
  const sampled = new Float64Array(points)
  for (let k = 0; k < points; k++) sampled[k] = reference((k + 0.5) * dTheta)
  const phi = p.currentPhaseAngle
  const currentPeak = Math.SQRT2 * p.phaseCurrentRms
  const P = leg.positions.length
  const L = leg.def.modelLevels
  const abs = new Float64Array(bins * P)
  const sq = new Float64Array(bins * P)
  const shares = new Float64Array(L)
  for (let k = 0; k < points; k++) {
    const theta = (k + 0.5) * dTheta
    const b = Math.floor(k / SAMPLES_PER_BIN)
    const i = currentPeak * Math.sin(theta - phi)
    const ai = Math.abs(i)
    const sign = i >= 0 ? 0 : 1
    const base = b * P
    const table = leg.weights[levelShares(leg, sampled[k]!, shares)]!
    for (let l = 0; l < L; l++) {
      const share = shares[l]!
      if (share <= 0) continue
      const row = table[l]![sign]!
      const index = row.index
      const weight = row.weight
      for (let q = 0; q < index.length; q++) {
        const d = share * weight[q]!
        const at = base + index[q]!
        abs[at]! += d * ai
        sq[at]! += d * i * i
      }
    }
  }
  const binned = { bins, sums: new Float64Array(bins * P * 3) }
  const switching = p.matrixInput
    ? matrixSwitching(leg.positions.map(x => x.name), { phiIn: p.matrixInput.angle, inputPhasePeak: (Math.SQRT2 * p.inputLineVoltageRms) / Math.sqrt(3), inputHz: p.matrixInput.frequencyHz, fundamentalHz: p.fundamentalHz, switchingHz: p.switchingHz, reference }, scales.unitNominal, currentPeak, phi, { points, binned })
    : integrateSwitching(leg, deriveCommutations(leg), reference, currentPeak, phi, scales.unitNominal, { points, sixStep, binned, sampled })
  const positions = leg.positions.map((pos, k): PositionProfile => {
    const out: PositionProfile = { name: pos.name, currentAbs: new Float64Array(bins), currentSquare: new Float64Array(bins), turnOn: null, turnOff: null, recovery: null }
    for (let b = 0; b < bins; b++) {
      out.currentAbs[b] = abs[b * P + k]! / SAMPLES_PER_BIN
      out.currentSquare[b] = sq[b * P + k]! / SAMPLES_PER_BIN
    }
    if (switching) {
      const roles = [new Float64Array(bins), new Float64Array(bins), new Float64Array(bins)] as const
      for (let b = 0; b < bins; b++) for (let r = 0; r < 3; r++) roles[r]![b] = (binned.sums[(b * P + k) * 3 + r]! / SAMPLES_PER_BIN) * scales.unitNominal
      ;[out.turnOn, out.turnOff, out.recovery] = roles
    }
    return out
  })
  return { bins, fundamentalHz: p.fundamentalHz, positions }
}
