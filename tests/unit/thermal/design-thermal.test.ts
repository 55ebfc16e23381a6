// T_j over the period and lifetime for a whole design (shared/thermal/design.ts): the heatsink loaded by the
// converter's summed losses (checked against the losses computed independently per position), the 2 Hz
// start's peak over its mean, and the mission life naming the position that limits it.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, type DesignInput } from '../../../shared/engine'
import { positionDutyFromDevice } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'
import { designThermal, type ThermalPosition } from '../../../shared/thermal/design'
import { deviceLossAtPoint, pointDutiesOf } from '../../../shared/thermal/losses'
import { lineVoltageFor } from '../engine/helpers'

/** Invented 1200 V 450 A half-bridge with a Foster table per device (figures at 150 °C only). */
const part: CatalogPart = {
  partNumber: 'T-HB12-450F', manufacturer: 'Test Devices', kind: 'switch-diode', packageConfiguration: 'half-bridge',
  voltageRating: 1200, currentRating: 600,
  switchThresholdVoltage: 0.85, switchSlopeResistance: 2.1e-3, diodeThresholdVoltage: 0.9, diodeSlopeResistance: 1.6e-3,
  turnOnEnergy: 0.045, turnOffEnergy: 0.055, recoveryEnergy: 0.030, energyReferenceVoltage: 600, energyReferenceCurrent: 450,
  rthJunctionCaseSwitch: 0.065, rthJunctionCaseDiode: 0.11, rthCaseHeatsink: 0.03, junctionTemperatureMax: 175, lossDataTemperature: 150,
  zthSwitchR1: 0.006, zthSwitchTau1: 0.0008, zthSwitchR2: 0.02, zthSwitchTau2: 0.012, zthSwitchR3: 0.03, zthSwitchTau3: 0.06, zthSwitchR4: 0.009, zthSwitchTau4: 0.4,
  zthDiodeR1: 0.01, zthDiodeTau1: 0.0006, zthDiodeR2: 0.035, zthDiodeTau2: 0.01, zthDiodeR3: 0.05, zthDiodeTau3: 0.05, zthDiodeR4: 0.015, zthDiodeTau4: 0.3,
  priceBreaks: [{ minQuantity: 1, unitPrice: 182 }], currency: 'EUR', lifecycle: 'active',
}

const input: DesignInput = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 700, switchingHz: 2500, modulation: 'sine',
    operatingPoints: [
      { name: 'start 2 Hz', lineVoltageRms: lineVoltageFor(0.05, 350), phaseCurrentRms: 250, powerFactor: 0.8, fundamentalHz: 2, hoursShare: 0.05, startsPerHour: 4 },
      { name: 'rated', lineVoltageRms: lineVoltageFor(0.9, 350), phaseCurrentRms: 200, powerFactor: 0.85, fundamentalHz: 50, hoursShare: 0.95 },
    ],
  },
  thermal: { ambientTemperatureC: 40, heatsinkRth: 0.02, heatsinkTimeConstantS: 200 },
}

function positions(): ThermalPosition[] {
  const result = evaluateDesign(input)
  const conv = result.converters[0]!
  return conv.envelope.devices.map(d => ({
    side: 'machine' as const,
    duty: { ...positionDutyFromDevice(d, { switchingHz: 2500, topology: 'two-level', levels: 2 }), points: pointDutiesOf(conv, d.name) },
    choices: [{ part, seriesCount: 1, parallelCount: 1 }],
    reference: 0,
    referenceAssigned: true,
  }))
}

describe('design thermal evaluation', () => {
  const result = evaluateDesign(input)
  const list = positions()
  const out = designThermal(input, result.converters, list, 15, 70)

  it('heatsink mean = ambient + R_th,ha × the converter\'s summed losses (independent per-position sum)', () => {
    for (const [k, name] of ['start 2 Hz', 'rated'].entries()) {
      // Independent: every position's per-device loss at the point (figures at their data temperature) × 3 phases.
      const total = list.reduce((s, p) => s + 3 * p.duty.positionsPerPhase * deviceLossAtPoint(part, p.duty.kind as 'switch' | 'diode', p.duty.points![k]!, 2500)!.total, 0)
      const t = out.results[0]![0]!.perPoint[k]!
      expect(t.pointName).toBe(name)
      // The profile samples the period at 1152 points, the point's losses at 2048: within 10⁻⁴ K.
      expect(Math.abs(t.heatsinkC - (40 + 0.02 * total))).toBeLessThan(1e-4)
    }
  })

  it('the 2 Hz start: peak well above the mean; at 50 Hz nearly none', () => {
    const s1 = out.results[list.findIndex(p => p.duty.positionName === 'S1')]![0]!
    const [start, rated] = s1.perPoint
    expect(start!.peakC - start!.meanC).toBeGreaterThan(8)
    expect(rated!.peakC - rated!.meanC).toBeLessThan((start!.peakC - start!.meanC) / 3)
    expect(s1.fromFoster).toBe(true)
  })

  it('mission life per position, Miner over the points, the shortest named as the limit', () => {
    const life = out.life!
    expect(life.hoursShareTotal).toBeCloseTo(1, 12)
    expect(life.positions).toHaveLength(4)
    const shortest = life.positions.reduce((a, b) => (b.lifeHours < a.lifeHours ? b : a))
    expect(life.limiting).toEqual({ side: 'machine', position: shortest.position, lifeHours: shortest.lifeHours })
    expect(Number.isFinite(shortest.lifeHours) && shortest.lifeHours > 0).toBe(true)
    expect(shortest.source).toMatch(/Bayerer/)
    expect(shortest.notes.join(' ')).toMatch(/from memory/)
    // Without hour shares no lifetime is claimed.
    const none = { ...input, machineSide: { ...input.machineSide, operatingPoints: input.machineSide.operatingPoints.map(({ hoursShare: _h, startsPerHour: _s, ...p }) => p) } }
    expect(designThermal(none, result.converters, list, 15, 70).life).toBeNull()
  })

  it('a peak past T_j,max − margin is reported as not fine', () => {
    const hot = designThermal({ ...input, thermal: { ambientTemperatureC: 40, heatsinkRth: 0.2, heatsinkTimeConstantS: 200 } }, result.converters, list, 15, 70)
    expect(hot.results.some(r => r[0] && !r[0].peakOk)).toBe(true)
  })
})
