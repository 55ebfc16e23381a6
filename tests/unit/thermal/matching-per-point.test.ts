// Matching with per-point duties: each candidate's losses and T_j evaluated at every operating point
// (shared/thermal/losses.ts, temperature.ts), the worst point named; never from the envelope.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, type DesignInput } from '../../../shared/engine'
import { matchPosition, positionDutyFromDevice, type MatchPolicy } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'
import { deviceLossAtPoint, pointDutiesOf } from '../../../shared/thermal/losses'
import { lineVoltageFor } from '../engine/helpers'

const policy: MatchPolicy = { heatsinkTemperatureC: 70, junctionMarginC: 15, buildQuantity: 1 }

/** Invented 1200 V 450 A half-bridge. */
const part: CatalogPart = {
  partNumber: 'T-HB12-450', manufacturer: 'Test Devices', kind: 'switch-diode', packageConfiguration: 'half-bridge',
  voltageRating: 1200, currentRating: 600,
  switchThresholdVoltage: 0.85, switchSlopeResistance: 2.1e-3, diodeThresholdVoltage: 0.9, diodeSlopeResistance: 1.6e-3,
  turnOnEnergy: 0.045, turnOffEnergy: 0.055, recoveryEnergy: 0.030, energyReferenceVoltage: 600, energyReferenceCurrent: 450,
  rthJunctionCaseSwitch: 0.065, rthJunctionCaseDiode: 0.11, rthCaseHeatsink: 0.03, junctionTemperatureMax: 175,
  priceBreaks: [{ minQuantity: 1, unitPrice: 182 }], currency: 'EUR', lifecycle: 'active',
}

const design: DesignInput = {
  machineSide: {
    topology: 'two-level', levels: 2, dcVoltage: 700, switchingHz: 4000, modulation: 'sine',
    operatingPoints: [
      { name: 'motoring', lineVoltageRms: lineVoltageFor(0.9, 350), phaseCurrentRms: 300, powerFactor: 0.85, fundamentalHz: 50 },
      { name: 'braking', lineVoltageRms: lineVoltageFor(0.8, 350), phaseCurrentRms: 280, powerFactor: -0.85, fundamentalHz: 45 },
    ],
  },
}

describe('matching per operating point', () => {
  const conv = evaluateDesign(design).converters[0]!
  const dutyOf = (name: string) => {
    const d = conv.envelope.devices.find(x => x.name === name)!
    return { ...positionDutyFromDevice(d, { switchingHz: 4000, topology: 'two-level', levels: 2 }), points: pointDutiesOf(conv, name) }
  }

  it('switch: the motoring point decides, named; each point equals its own evaluation; the envelope figure is larger', () => {
    const c = matchPosition(dutyOf('S1'), [part], policy).candidates[0]!
    const per = pointDutiesOf(conv, 'S1').map(p => deviceLossAtPoint(part, 'switch', p, 4000)!.total)
    expect(c.losses!.pointName).toBe('motoring')
    expect(c.losses!.perPoint!.map(p => p.pointName)).toEqual(['motoring', 'braking'])
    c.losses!.perPoint!.forEach((p, k) => expect(p.total).toBeCloseTo(per[k]!, 2))
    expect(c.losses!.total).toBeCloseTo(Math.max(...per), 2)
    // The old envelope evaluation (worst currents of any point, Î/π switching) gives more than any real point here.
    const envelope = matchPosition(positionDutyFromDevice(conv.envelope.devices.find(x => x.name === 'S1')!, { switchingHz: 4000 }), [part], policy).candidates[0]!
    expect(envelope.losses!.total).toBeGreaterThanOrEqual(c.losses!.total)
    // T_j at the hottest point from its own losses (single-temperature data, stated): 70 + P·(0.065 + 0.03).
    expect(c.junctionPointName).toBe('motoring')
    expect(c.junctionTemperatureC).toBeCloseTo(70 + Math.max(...per) * 0.095, 0)
    expect(c.warnings.some(w => /single-temperature loss data/.test(w))).toBe(true)
  })

  it('diode: the braking point decides', () => {
    const c = matchPosition(dutyOf('D1'), [part], policy).candidates[0]!
    expect(c.losses!.pointName).toBe('braking')
    expect(c.junctionPointName).toBe('braking')
  })

  it('two-temperature data: cooler figures at 25 °C lower T_j; a runaway part fails the thermal check with the reason', () => {
    const twoT = { ...part, lossDataTemperature: 150, switchThresholdVoltage25: 0.75, switchSlopeResistance25: 1.5e-3, turnOnEnergy25: 0.03, turnOffEnergy25: 0.04 }
    const single = matchPosition(dutyOf('S1'), [part], policy).candidates[0]!
    const c = matchPosition(dutyOf('S1'), [twoT], policy).candidates[0]!
    expect(c.junctionTemperatureC!).toBeLessThan(single.junctionTemperatureC!)
    expect(c.losses!.perPoint![0]!.junctionStatus).toBe('settled')
    // Figures that rise steeply with T_j and a poor heat path: runaway.
    const steep = { ...twoT, switchThresholdVoltage25: 0.1, switchSlopeResistance25: 0.1e-3, turnOnEnergy25: 0.001, turnOffEnergy25: 0.001, rthCaseHeatsink: 1.5 }
    const r = matchPosition(dutyOf('S1'), [steep], policy).candidates[0]!
    expect(r.thermalOk).toBe(false)
    expect(r.warnings.some(w => /thermal runaway/.test(w))).toBe(true)
  })

  it('a bounded ranking over per-point duties keeps the order of the built candidates, also with two-temperature data', () => {
    // Parts with single- and two-temperature data, some hot enough to fail T_j, prices and resistances spread.
    const parts: CatalogPart[] = []
    for (let i = 0; i < 60; i++) {
      const hotData = i % 3 === 0
      parts.push({
        ...part,
        partNumber: `PP-${i}`,
        switchSlopeResistance: 1.6e-3 + (i % 7) * 0.5e-3,
        rthJunctionCaseSwitch: i % 5 === 0 ? 0.3 : 0.065,
        priceBreaks: [{ minQuantity: 1, unitPrice: 150 + (i % 4) * 10 }],
        ...(hotData ? { lossDataTemperature: 150, switchThresholdVoltage25: 0.75, switchSlopeResistance25: 1.2e-3, turnOnEnergy25: 0.03, turnOffEnergy25: 0.04 } : {}),
      })
    }
    const duty = dutyOf('S1')
    const full = matchPosition(duty, parts, policy)
    const top = matchPosition(duty, parts, policy, { limit: 12 })
    expect(full.candidates.some(c => !c.thermalOk)).toBe(true)
    expect(top.candidates.map(c => c.part.partNumber)).toEqual(full.candidates.slice(0, 12).map(c => c.part.partNumber))
    // the order is sortCandidates' order of the built candidates' own figures
    const key = (c: typeof full.candidates[number]) => [c.thermalOk ? 0 : 1, c.costPerDesign ?? Infinity, c.losses?.perConverter ?? Infinity]
    for (let k = 1; k < full.candidates.length; k++) {
      const [a, b] = [key(full.candidates[k - 1]!), key(full.candidates[k]!)]
      const cmp = a[0]! - b[0]! || a[1]! - b[1]! || a[2]! - b[2]!
      expect(cmp, `${full.candidates[k - 1]!.part.partNumber} before ${full.candidates[k]!.part.partNumber}`).toBeLessThanOrEqual(0)
    }
  })
})
