// Devices of one module share its case (shared/thermal/dynamics.ts SharedCase, shared/thermal/design.ts sharedCases):
// the module's R_th,ch carries the summed losses of its devices. Checked against a hand computation of the
// shared-case network, and over the period: a neighbour's loss in the same case lifts the peak.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { lossProfile } from '../../../shared/engine/profile'
import { junctionDynamics, type DynamicsPart, type ProfiledDuty } from '../../../shared/thermal/dynamics'
import { moduleCaseResistance, packageDevices } from '../../../shared/thermal/design'
import { pointDutiesOf } from '../../../shared/thermal/losses'
import type { StressInput } from '../../../shared/engine/types'
import { inventedModule, stiffCooling } from './fixtures'

// Invented figures, one temperature only (the losses do not move with T_j, so the hand computation is exact).
const part: DynamicsPart = inventedModule
const cooling = stiffCooling
const input: StressInput = { topology: 'two-level', levels: 2, dcVoltage: 650, lineVoltageRms: (0.1 * 325 * Math.sqrt(3)) / Math.SQRT2, phaseCurrentRms: 220, powerFactor: 0.85, fundamentalHz: 3, switchingHz: 2500, modulation: 'sine' }

function profiled(): ProfiledDuty {
  const stress = evaluateStress(input)
  const duty = pointDutiesOf({ points: [{ ...stress, pointName: 'p' }] as never }, 'S1')[0]!
  return { ...duty, profile: lossProfile(input).positions.find(p => p.name === 'S1')!, fundamentalHz: input.fundamentalHz }
}

describe('shared module case', () => {
  const duty = profiled()
  const rModule = 0.008
  const others = 250

  it('mean T_j = T_hs + R_th,ch(module)·(own + others) + R_th,jc·own (hand computation of the shared-case network)', () => {
    const d = junctionDynamics(part, 'switch', duty, 2500, 1, 1, cooling, null, { rth: rModule, ownDevices: 1, othersMeanW: others })!
    const p = d.lossW
    const rjc = 0.006 + 0.02 + 0.03 + 0.009
    expect(d.status).toBe('settled')
    expect(Math.abs(d.meanC - (60 + rModule * (p + others) + rjc * p))).toBeLessThan(0.02)
    // Two devices of the position in the package: the case carries 2·own.
    const two = junctionDynamics(part, 'switch', duty, 2500, 1, 1, cooling, null, { rth: rModule, ownDevices: 2, othersMeanW: others })!
    expect(Math.abs(two.meanC - (60 + rModule * (2 * p + others) + rjc * p))).toBeLessThan(0.02)
  })

  it('time-stepped: a second device in the same case lifts the peak by R_th,ch(module)·its loss', () => {
    const alone = junctionDynamics(part, 'switch', duty, 2500, 1, 1, cooling, null, { rth: rModule, ownDevices: 1, othersMeanW: 0 })!
    const shared = junctionDynamics(part, 'switch', duty, 2500, 1, 1, cooling, null, { rth: rModule, ownDevices: 1, othersMeanW: others })!
    expect(shared.peakC).toBeGreaterThan(alone.peakC + 1)
    expect(Math.abs(shared.peakC - alone.peakC - rModule * others)).toBeLessThan(1e-6)
    expect(Math.abs(shared.swingK - alone.swingK)).toBeLessThan(1e-6)
  })

  it('module R_th,ch: the per-device paths in parallel', () => {
    expect(packageDevices({ kind: 'switch-diode', packageConfiguration: 'half-bridge' })).toBe(4)
    expect(packageDevices({ kind: 'switch-diode', packageConfiguration: 'npc-leg' })).toBe(10)
    expect(moduleCaseResistance({ kind: 'switch-diode', packageConfiguration: 'half-bridge', rthCaseHeatsink: 0.04 })).toBeCloseTo(0.01, 12)
  })
})
