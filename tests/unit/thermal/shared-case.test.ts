// Devices of one module share its case (shared/thermal/dynamics.ts SharedCase, shared/thermal/design.ts sharedCases):
// the module's R_th,ch carries the summed losses of its devices. Checked against a hand computation of the
// shared-case network, and over the period: a neighbour's loss in the same case lifts the peak; in a design, case
// mates from module coverage and their joint settling.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, evaluateStress, legLayout, type DesignInput } from '../../../shared/engine'
import { lossProfile } from '../../../shared/engine/profile'
import { positionDutyFromDevice } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'
import { junctionDynamics, type DynamicsPart, type ProfiledDuty } from '../../../shared/thermal/dynamics'
import { caseMatesByCoverage, designThermal, moduleCaseResistance, packageDevices, type ThermalPosition } from '../../../shared/thermal/design'
import { deviceLossAtPoint, pointDutiesOf } from '../../../shared/thermal/losses'
import { partAtTemperature } from '../../../shared/thermal/temperature'
import type { StressInput } from '../../../shared/engine/types'
import { lineVoltageFor } from '../engine/helpers'
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

// A design whose module covers two positions: the three-level diode-clamped leg's outer and inner switch (S1, S2:
// they share node U1) in one half-bridge package, against the same chips in separate packages. The module's
// R_th,ch is the per-device figure over its two devices; the separate packages get that same resistance each, so
// the only difference is the neighbour's heat in the shared case.
describe('shared case in a design (case mates from module coverage)', () => {
  const rModule = 0.012
  const chips = { ...inventedModule, manufacturer: 'Test Devices', kind: 'switch' as const, voltageRating: 1200, currentRating: 600, priceBreaks: [], currency: 'EUR' as const, lifecycle: 'active' as const }
  const module: CatalogPart = { ...chips, partNumber: 'T-HB-SW', packageConfiguration: 'half-bridge', rthCaseHeatsink: 2 * rModule }
  const separate: CatalogPart = { ...chips, partNumber: 'T-SG-SW', packageConfiguration: 'single', rthCaseHeatsink: rModule }
  const input: DesignInput = {
    machineSide: {
      topology: 'diode-clamped', levels: 3, dcVoltage: 1100, switchingHz: 2500, modulation: 'sine',
      operatingPoints: [
        { name: 'start 3 Hz', lineVoltageRms: lineVoltageFor(0.06, 550), phaseCurrentRms: 260, powerFactor: 0.8, fundamentalHz: 3 },
        { name: 'rated', lineVoltageRms: lineVoltageFor(0.9, 550), phaseCurrentRms: 220, powerFactor: 0.85, fundamentalHz: 50 },
      ],
    },
    thermal: { ambientTemperatureC: 40, heatsinkRth: 0.01, heatsinkTimeConstantS: 200 },
  }
  const result = evaluateDesign(input)
  const conv = result.converters[0]!
  const leg = legLayout('diode-clamped', 3).items.filter(i => i.kind === 'switch').map(i => ({ name: i.name, kind: 'switch' as const, countPerPhase: i.countPerPhase, nodes: i.nodes }))

  function thermalOf(part: CatalogPart) {
    const mates = caseMatesByCoverage(leg, () => ({ key: part.partNumber, part }))
    const list: ThermalPosition[] = conv.envelope.devices.filter(d => d.kind === 'switch').map(d => ({
      side: 'machine',
      duty: { ...positionDutyFromDevice(d, { switchingHz: 2500, topology: 'diode-clamped', levels: 3 }), points: pointDutiesOf(conv, d.name) },
      choices: [{ part, seriesCount: 1, parallelCount: 1, ...(mates.get(d.name) ? { caseMates: mates.get(d.name) } : {}) }],
      reference: 0,
      referenceAssigned: true,
    }))
    const out = designThermal(input, result.converters, list, 15, 70)
    return { mates, list, byName: new Map(list.map((p, i) => [p.duty.positionName, out.results[i]![0]!])) }
  }

  it('module coverage makes S1/S2 and S3/S4 case mates; separate packages have none', () => {
    const { mates } = thermalOf(module)
    expect(mates.get('S1')).toEqual(['S2'])
    expect(mates.get('S2')).toEqual(['S1'])
    expect(mates.get('S3')).toEqual(['S4'])
    expect(thermalOf(separate).mates.size).toBe(0)
  })

  it('each mate runs hotter than in its own package by exactly the neighbour\'s loss × R_th,ch of the module (hand computation)', () => {
    const shared = thermalOf(module)
    const alone = thermalOf(separate)
    // Hand computation: T_j = T_hs + R_mod·(p_own + p_mate) + Z_jc * p_own in the module, T_hs + R_mod·p_own + Z_jc * p_own
    // alone (the same resistance per package); figures at one temperature, so the losses are the same in both
    // and the difference is R_mod·p_mate at every instant: mean and peak alike, the swing unchanged.
    for (const [own, mate] of [['S1', 'S2'], ['S2', 'S1'], ['S3', 'S4']] as const) {
      const t = shared.byName.get(own)!
      const a = alone.byName.get(own)!
      expect(t.caseSharedWith).toEqual([mate])
      expect(a.caseSharedWith).toBeUndefined()
      t.perPoint.forEach((pt, k) => {
        const mateLossW = deviceLossAtPoint(module, 'switch', shared.list.find(p => p.duty.positionName === mate)!.duty.points![k]!, 2500)!.total
        expect(mateLossW).toBeGreaterThan(10)
        expect(pt.meanC - a.perPoint[k]!.meanC).toBeGreaterThan(0)
        expect(Math.abs(pt.meanC - a.perPoint[k]!.meanC - rModule * mateLossW)).toBeLessThan(1e-6)
        expect(Math.abs(pt.peakC - a.perPoint[k]!.peakC - rModule * mateLossW)).toBeLessThan(1e-6)
        expect(Math.abs(pt.swingK - a.perPoint[k]!.swingK)).toBeLessThan(1e-9)
      })
    }
    // The outer and inner switches lose differently: each sees the other's loss, not its own twice.
    const p1 = deviceLossAtPoint(module, 'switch', shared.list[0]!.duty.points![1]!, 2500)!.total
    const p2 = deviceLossAtPoint(module, 'switch', shared.list[1]!.duty.points![1]!, 2500)!.total
    expect(Math.abs(p1 - p2)).toBeGreaterThan(1)
  })

  it('with temperature-dependent figures the mates settle together: each mean balances the losses at both settled T_j (hand computation of the balance)', () => {
    const warm: CatalogPart = { ...module, switchThresholdVoltage25: 0.75, switchSlopeResistance25: 1.8e-3, turnOnEnergy25: 26e-3, turnOffEnergy25: 40e-3 }
    const { list, byName } = thermalOf(warm)
    const rjc = 0.006 + 0.02 + 0.03 + 0.009
    const s1 = byName.get('S1')!
    const s2 = byName.get('S2')!
    for (const k of [0, 1]) {
      const t1 = s1.perPoint[k]!.meanC
      const t2 = s2.perPoint[k]!.meanC
      const p1 = deviceLossAtPoint(partAtTemperature(warm, t1), 'switch', list[0]!.duty.points![k]!, 2500)!.total
      const p2 = deviceLossAtPoint(partAtTemperature(warm, t2), 'switch', list[1]!.duty.points![k]!, 2500)!.total
      const hs = s1.perPoint[k]!.heatsinkC
      // T_j,1 = T_hs + R_mod·(p1(T_j,1) + p2(T_j,2)) + R_jc·p1(T_j,1), and the same for S2 (settled to 0.01 K steps).
      expect(Math.abs(t1 - (hs + rModule * (p1 + p2) + rjc * p1))).toBeLessThan(0.05)
      expect(Math.abs(t2 - (hs + rModule * (p1 + p2) + rjc * p2))).toBeLessThan(0.05)
      expect(s1.perPoint[k]!.status).toBe('settled')
    }
  })
})
