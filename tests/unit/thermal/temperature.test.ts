// Temperature-dependent loss figures and the junction temperature settled with the losses
// (shared/thermal/temperature.ts). Checks against hand computations marked as such.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { deviceLossAtPoint, pointDutiesOf } from '../../../shared/thermal/losses'
import { hasTwoTemperatures, partAtTemperature, settleJunction, type TemperaturePart } from '../../../shared/thermal/temperature'
import { inputAt } from '../engine/helpers'

const hot: TemperaturePart = {
  switchThresholdVoltage: 0.9,
  switchSlopeResistance: 3e-3,
  diodeThresholdVoltage: 0.8,
  diodeSlopeResistance: 2e-3,
  turnOnEnergy: 30e-3,
  turnOffEnergy: 40e-3,
  recoveryEnergy: 15e-3,
  energyReferenceVoltage: 600,
  energyReferenceCurrent: 300,
  junctionTemperatureMax: 175,
  lossDataTemperature: 150,
}
const two: TemperaturePart = {
  ...hot,
  switchThresholdVoltage25: 0.8,
  switchSlopeResistance25: 2e-3,
  turnOnEnergy25: 20e-3,
  turnOffEnergy25: 30e-3,
}

describe('loss figures between two junction temperatures', () => {
  it('linear between 25 °C and the data temperature (hand computation: at 87.5 °C halfway)', () => {
    const p = partAtTemperature(two, 87.5)
    expect(p.switchThresholdVoltage).toBeCloseTo(0.85, 12)
    expect(p.switchSlopeResistance).toBeCloseTo(2.5e-3, 12)
    expect(p.turnOnEnergy).toBeCloseTo(25e-3, 12)
    // Figures without a 25 °C value keep the hot one.
    expect(p.recoveryEnergy).toBe(15e-3)
    // Extrapolated on the same line up to T_j,max (175 °C: 0.9 + 0.1·25/125 = 0.92 V).
    expect(partAtTemperature(two, 175).switchThresholdVoltage).toBeCloseTo(0.92, 12)
  })
  it('refuses T_j past T_j,max', () => {
    expect(() => partAtTemperature(two, 176)).toThrow(/past T_j,max 175 °C/)
  })
  it('single-temperature data: figures unchanged at every T_j', () => {
    expect(hasTwoTemperatures(hot)).toBe(false)
    expect(partAtTemperature(hot, 60)).toEqual(hot)
  })
})

describe('junction temperature iterated with the losses', () => {
  const stress = evaluateStress(inputAt('two-level', 0.8, 0.85, { dcVoltage: 800, switchingHz: 4000 }))
  const duty = pointDutiesOf({ points: [{ ...stress, pointName: 'rated' }] }, 'S1')[0]!
  const heatsink = 70

  it('settles at the fixed point of T = T_hs + P(T)·R_th (hand computation: P linear in T_j)', () => {
    const rth = 0.12
    const r = settleJunction(two, 'switch', duty, 4000, 1, 1, heatsink, rth)
    expect(r.status).toBe('settled')
    // P(T) = P25 + k·(T − 25) with P25, P150 the losses at the two temperatures; T* = (T_hs + R(P25 − 25k)) / (1 − Rk).
    const p25 = deviceLossAtPoint(partAtTemperature(two, 25), 'switch', duty, 4000)!.total
    const p150 = deviceLossAtPoint(partAtTemperature(two, 150), 'switch', duty, 4000)!.total
    const k = (p150 - p25) / 125
    const expected = (heatsink + rth * (p25 - 25 * k)) / (1 - rth * k)
    expect(r.junctionTemperatureC).toBeCloseTo(expected, 1)
    expect(r.loss!.total).toBeCloseTo(p25 + k * (expected - 25), 1)
    // Cooler than with the hot figures at face value.
    expect(r.junctionTemperatureC).toBeLessThan(heatsink + p150 * rth)
  })

  it('single-temperature data: T_j from the figures as given, the assumption stated', () => {
    const r = settleJunction(hot, 'switch', duty, 4000, 1, 1, heatsink, 0.12)
    const p = deviceLossAtPoint(hot, 'switch', duty, 4000)!.total
    expect(r.status).toBe('settled')
    expect(r.junctionTemperatureC).toBeCloseTo(heatsink + p * 0.12, 6)
    expect(r.note).toMatch(/single-temperature loss data.*assumption/)
  })

  it('reports thermal runaway when the losses rise faster with T_j than the heat path removes them (R_th·dP/dT ≥ 1)', () => {
    const p25 = deviceLossAtPoint(partAtTemperature(two, 25), 'switch', duty, 4000)!.total
    const p150 = deviceLossAtPoint(partAtTemperature(two, 150), 'switch', duty, 4000)!.total
    const k = (p150 - p25) / 125
    const r = settleJunction(two, 'switch', duty, 4000, 1, 1, 20, 1.2 / k)
    expect(r.status).toBe('runaway')
    expect(r.note).toMatch(/thermal runaway/)
  })

  it('above the limit without runaway when the settled value lies past T_j,max', () => {
    const r = settleJunction(two, 'switch', duty, 4000, 1, 1, heatsink, 2)
    expect(r.status).not.toBe('settled')
    expect(r.junctionTemperatureC).toBeGreaterThan(175)
  })
})
