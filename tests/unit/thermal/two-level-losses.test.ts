// Two-level leg losses per operating point against the closed forms of F. Bierhoff, F. W. Fuchs,
// "Semiconductor losses in voltage source and current source IGBT converters based on analytical
// derivation", IEEE PESC 2004 (sine-triangle PWM, linear range, m = Û_ph / (V_dc/2)):
//   IGBT:  P_cond = V_CE0·Î·(1/(2π) + m·cosφ/8) + r_CE·Î²·(1/8 + m·cosφ/(3π))
//   diode: P_cond = V_F0·Î·(1/(2π) − m·cosφ/8) + r_F·Î²·(1/8 − m·cosφ/(3π))
//   IGBT:  P_sw = f_sw·(E_on + E_off)·(√2·I/π)/I_ref·(V_dc/V_ref)
//   diode: P_rr = f_sw·E_rr·(√2·I/π)/I_ref·(V_dc/V_ref)            (I = phase current RMS)
//   converter: 6·(P_T + P_D).
// Written here from the paper; the engine gets the same figures by integrating its state table.
import { describe, expect, it } from 'vitest'
import { evaluateDesign, type DesignInput } from '../../../shared/engine'
import { deviceLossAtPoint, lossesOverPoints, pointDutiesOf, totalsPerPoint, type LossPart } from '../../../shared/thermal/losses'
import { lineVoltageFor } from '../engine/helpers'

const part: LossPart = {
  switchThresholdVoltage: 0.9,
  switchSlopeResistance: 2.4e-3,
  diodeThresholdVoltage: 0.8,
  diodeSlopeResistance: 1.9e-3,
  turnOnEnergy: 21e-3,
  turnOffEnergy: 27e-3,
  recoveryEnergy: 13e-3,
  energyReferenceVoltage: 600,
  energyReferenceCurrent: 300,
}

const Vdc = 800
const fsw = 4000

function closedForm(m: number, cosphi: number, Irms: number) {
  const Ih = Math.SQRT2 * Irms
  const pT = part.switchThresholdVoltage! * Ih * (1 / (2 * Math.PI) + (m * cosphi) / 8)
    + part.switchSlopeResistance! * Ih * Ih * (1 / 8 + (m * cosphi) / (3 * Math.PI))
  const pD = part.diodeThresholdVoltage! * Ih * (1 / (2 * Math.PI) - (m * cosphi) / 8)
    + part.diodeSlopeResistance! * Ih * Ih * (1 / 8 - (m * cosphi) / (3 * Math.PI))
  const swT = fsw * (part.turnOnEnergy! + part.turnOffEnergy!) * ((Math.SQRT2 * Irms) / Math.PI) / part.energyReferenceCurrent! * (Vdc / part.energyReferenceVoltage!)
  const swD = fsw * part.recoveryEnergy! * ((Math.SQRT2 * Irms) / Math.PI) / part.energyReferenceCurrent! * (Vdc / part.energyReferenceVoltage!)
  return { condT: pT, condD: pD, swT, swD, total: 6 * (pT + swT + pD + swD) }
}

const points = [
  { name: 'rated motoring', m: 0.9, pf: 0.87, I: 250 },
  { name: 'low speed start', m: 0.15, pf: 0.3, I: 320 },
  { name: 'braking', m: 0.7, pf: -0.8, I: 180 },
]

const design: DesignInput = {
  machineSide: {
    topology: 'two-level',
    levels: 2,
    dcVoltage: Vdc,
    switchingHz: fsw,
    modulation: 'sine',
    operatingPoints: points.map(p => ({ name: p.name, lineVoltageRms: lineVoltageFor(p.m, Vdc / 2), phaseCurrentRms: p.I, powerFactor: p.pf, fundamentalHz: p.name === 'low speed start' ? 5 : 50 })),
  },
}

describe('two-level losses per operating point vs Bierhoff & Fuchs (PESC 2004)', () => {
  const conv = evaluateDesign(design).converters[0]!

  it.each(points.map((p, k) => ({ ...p, k })))('$name: each device and the converter total', ({ m, pf, I, k, name }) => {
    const cf = closedForm(m, pf, I)
    const at = (pos: string) => pointDutiesOf(conv, pos)[k]!
    const s1 = deviceLossAtPoint(part, 'switch', at('S1'), fsw)!
    const d1 = deviceLossAtPoint(part, 'diode', at('D1'), fsw)!
    expect(at('S1').pointName).toBe(name)
    // Midpoint integration over the default 2046 points against the exact closed form.
    expect(s1.conduction / cf.condT - 1).toBeCloseTo(0, 4)
    expect(d1.conduction / cf.condD - 1).toBeCloseTo(0, 4)
    expect(s1.switching / cf.swT - 1).toBeCloseTo(0, 4)
    expect(d1.switching / cf.swD - 1).toBeCloseTo(0, 4)
    const total = ['S1', 'D1', 'S2', 'D2'].reduce((s, pos) => s + 3 * deviceLossAtPoint(part, pos.startsWith('S') ? 'switch' : 'diode', at(pos), fsw)!.total, 0)
    expect(total / cf.total - 1).toBeCloseTo(0, 4)
  })

  it('per-point totals and efficiency; the worst point is named and the envelope is never used', () => {
    const byPosition = conv.envelope.devices.map(d => ({
      positionName: d.name,
      perPoint: lossesOverPoints(part, d.kind, pointDutiesOf(conv, d.name), fsw)!.perPoint.map(l => ({ pointName: l.pointName, lossW: 3 * l.total })),
    }))
    const totals = totalsPerPoint(design.machineSide.operatingPoints.map(op => ({ ...op, pointName: op.name! })), byPosition)
    points.forEach((p, k) => {
      const cf = closedForm(p.m, p.pf, p.I)
      expect(totals[k]!.lossW / cf.total - 1).toBeCloseTo(0, 4)
      const pAc = Math.sqrt(3) * design.machineSide.operatingPoints[k]!.lineVoltageRms * p.I * p.pf
      // Motoring η = P/(P + loss); braking η = (|P| − loss)/|P| (first principles).
      const eta = pAc > 0 ? pAc / (pAc + cf.total) : (-pAc - cf.total) / -pAc
      expect(totals[k]!.efficiency! - eta).toBeCloseTo(0, 6)
    })
    // The envelope (worst current of each kind from any point) gives a larger figure than any real point.
    const envelopeLoss = conv.envelope.devices.reduce((s, d) => s + 3 * (d.kind === 'switch'
      ? part.switchThresholdVoltage! * d.currentAvg + part.switchSlopeResistance! * d.currentRms ** 2
      : part.diodeThresholdVoltage! * d.currentAvg + part.diodeSlopeResistance! * d.currentRms ** 2), 0)
    const worstConduction = Math.max(...points.map((p) => { const c = closedForm(p.m, p.pf, p.I); return 6 * (c.condT + c.condD) }))
    expect(envelopeLoss).toBeGreaterThan(worstConduction * 1.02)
  })

  it('series and parallel parts: 1/series of the voltage and 1/parallel of the current each', () => {
    const duty = pointDutiesOf(conv, 'S1')[0]!
    const one = deviceLossAtPoint(part, 'switch', duty, fsw)!
    const two = deviceLossAtPoint(part, 'switch', duty, fsw, 2, 2)!
    expect(two.switching).toBeCloseTo(one.switching / 4, 9)
    expect(two.conduction).toBeCloseTo(part.switchThresholdVoltage! * duty.currentAvg / 2 + part.switchSlopeResistance! * (duty.currentRms / 2) ** 2, 9)
  })

  it('a part without energy reference data gives no losses (missing figures are named by matching)', () => {
    const duty = pointDutiesOf(conv, 'S1')[0]!
    expect(deviceLossAtPoint({ ...part, energyReferenceCurrent: undefined }, 'switch', duty, fsw)).toBeNull()
    expect(deviceLossAtPoint({ ...part, switchThresholdVoltage: undefined }, 'switch', duty, fsw)).toBeNull()
  })
})
