// evaluateDesign: envelope over operating points, derating into required ratings, back-to-back.
import { describe, expect, it } from 'vitest'
import { defaultDerating, EngineInputError, evaluateDesign, evaluateStress, type ConverterInput, type DesignInput } from '../../../shared/engine'
import { device, expectClose, lineVoltageFor } from './helpers'

const machine = (over: Partial<ConverterInput> = {}): ConverterInput => ({
  topology: 'two-level',
  dcVoltage: 700,
  dcVoltageMax: 800,
  switchingHz: 4000,
  modulation: 'space-vector',
  overshootVoltage: 100,
  operatingPoints: [
    { name: 'Rated motoring', lineVoltageRms: 400, phaseCurrentRms: 200, powerFactor: 0.86, fundamentalHz: 50 },
    { name: 'Regenerative braking', lineVoltageRms: 400, phaseCurrentRms: 150, powerFactor: -0.9, fundamentalHz: 50 },
    { name: 'Start', lineVoltageRms: 30, phaseCurrentRms: 230, powerFactor: 0.3, fundamentalHz: 3 },
  ],
  ...over,
})

function fieldOf(f: () => unknown): string | undefined {
  try { f() }
  catch (e) { if (e instanceof EngineInputError) return e.field; throw e }
  return undefined
}

describe('derating defaults (common practice, ENGINEERING.md)', () => {
  it('holds the documented values', () => {
    expect(defaultDerating).toEqual({ semiconductorVoltageUtilisation: 0.65, semiconductorTransientMargin: 1, semiconductorCurrentUtilisation: 1, capacitorVoltageUtilisation: 1, capacitorRippleUtilisation: 1, junctionMarginC: 25, heatsinkTemperatureC: 80 })
  })
})

describe('envelope and required ratings', () => {
  const result = evaluateDesign({ machineSide: machine() })
  const conv = result.converters[0]!

  it('takes the maximum over the points and names the point that set it', () => {
    expect(conv.side).toBe('machine')
    expect(conv.points.map(p => p.pointName)).toEqual(['Rated motoring', 'Regenerative braking', 'Start'])
    for (const [k, env] of conv.envelope.devices.entries()) {
      const per = conv.points.map(p => p.devices[k]!)
      expect(env.currentRms).toBe(Math.max(...per.map(d => d.currentRms)))
      expect(env.currentPeak).toBe(Math.max(...per.map(d => d.currentPeak)))
      const worst = conv.points.find(p => p.pointName === env.worstPoint.currentRms)!
      expect(worst.devices[k]!.currentRms).toBe(env.currentRms)
    }
    // Motoring loads the switch most, braking the diode: different worst points (ENGINEERING.md, regeneration).
    expect(device(conv.envelope.devices, 'D1').worstPoint.currentAvg).toBe('Regenerative braking')
    expect(device(conv.envelope.devices, 'S1').worstPoint.currentAvg).not.toBe('Regenerative braking')
  })

  it('required voltage = max(V_dc,max / 0.65, (V_dc,max + overshoot) / 1.0), rounded to a standard class; current = peak / 1.0 (common practice)', () => {
    const s1 = device(conv.envelope.devices, 'S1')
    // 800 V / 0.65 = 1231 V > 900 V / 1.0: the utilisation check decides; 1231 V needs the 1700 V class.
    expectClose(s1.requiredVoltageRating, 800 / 0.65, 1e-12, 'V')
    expect(s1.voltageRatingSetBy).toBe('utilisation')
    expect(s1.provenance.method).toContain('the utilisation check decides')
    expect(s1.voltageClass).toBe(1700)
    expectClose(s1.requiredCurrentRating, Math.SQRT2 * 230, 1e-9, 'I')
    const c = conv.envelope.capacitors[0]!
    expect(c.requiredVoltageRating).toBeCloseTo(800, 9)
    expect(c.requiredRippleRating).toBe(c.rippleCurrentRms)
    expect(result.derating).toEqual(defaultDerating)
  })

  it('a partial derating policy overrides only its fields', () => {
    const r = evaluateDesign({ machineSide: machine(), derating: { semiconductorVoltageUtilisation: 0.5, semiconductorCurrentUtilisation: 0.8 } })
    const s1 = device(r.converters[0]!.envelope.devices, 'S1')
    expectClose(s1.requiredVoltageRating, 1600, 1e-12, 'V')
    expect(s1.voltageClass).toBe(1700)
    expectClose(s1.requiredCurrentRating, (Math.SQRT2 * 230) / 0.8, 1e-9, 'I')
    expect(r.derating.junctionMarginC).toBe(25)
  })

  it('no class depends on dividing the overshoot by u: a 750 V two-level link with 150 V overshoot takes the 1200 V class (common practice)', () => {
    // Old rule (750 + 150) / 0.65 = 1385 V → 1700 V; the two checks: 750 / 0.65 = 1154 V, 900 / 1.0 = 900 V → 1200 V.
    const r = evaluateDesign({ machineSide: machine({ dcVoltage: 650, dcVoltageMax: 750, overshootVoltage: 150 }) })
    const s1 = device(r.converters[0]!.envelope.devices, 'S1')
    expectClose(s1.requiredVoltageRating, 750 / 0.65, 1e-12, 'V')
    expect(s1.voltageClass).toBe(1200)
  })

  it('the transient check decides when the overshoot is large, and the margin scales it (common practice)', () => {
    // 800 V / 0.65 = 1231 V < (800 + 600) V / 1.0 = 1400 V; with margin 0.9: 1556 V.
    const r = evaluateDesign({ machineSide: machine({ overshootVoltage: 600 }) })
    const s1 = device(r.converters[0]!.envelope.devices, 'S1')
    expectClose(s1.requiredVoltageRating, 1400, 1e-12, 'V')
    expect(s1.voltageRatingSetBy).toBe('transient')
    expect(s1.provenance.method).toContain('the transient check decides')
    const d = evaluateDesign({ machineSide: machine({ overshootVoltage: 600 }), derating: { semiconductorTransientMargin: 0.9 } })
    expectClose(device(d.converters[0]!.envelope.devices, 'S1').requiredVoltageRating, 1400 / 0.9, 1e-12, 'V margin 0.9')
    // A position that does not commutate (two-level: none) keeps V/u; the clamp diodes of an NPC carry no overshoot either.
    expect(fieldOf(() => evaluateDesign({ machineSide: machine(), derating: { semiconductorTransientMargin: 1.2 } }))).toBe('derating.semiconductorTransientMargin')
    expect(fieldOf(() => evaluateDesign({ machineSide: machine(), derating: { semiconductorTransientMargin: 0.4 } }))).toBe('derating.semiconductorTransientMargin')
  })

  it('a clamp stack with a chosen unit rating counts units that pass its own rating check; matching gets the whole stack (common practice)', () => {
    const r = evaluateDesign({ machineSide: machine({ topology: 'diode-clamped', levels: 5, dcVoltage: 4000, dcVoltageMax: 4400, modulation: 'sine', overshootVoltage: 300, clampDiodeUnitVoltage: 1700, operatingPoints: [{ name: 'Rated', lineVoltageRms: 2800, phaseCurrentRms: 300, powerFactor: 0.9, fundamentalHz: 50 }] }) })
    for (const dc of r.converters[0]!.envelope.devices.filter(d => d.kind === 'clamp-diode')) {
      const n = dc.seriesCount!
      // The unit's own requirement fits the chosen unit, and one unit fewer would not.
      expect(dc.requiredVoltageRating).toBeLessThanOrEqual(1700 + 1e-9)
      expect(dc.positionVoltageRating / Math.max(1, n - 1)).toBeGreaterThan(n > 1 ? 1700 : 0)
      expectClose(dc.requiredVoltageRating * n, dc.positionVoltageRating, 1e-12, dc.name)
      expectClose(dc.positionVoltageRating, Math.max(dc.blockingVoltage / 0.65, dc.blockingVoltageWithOvershoot), 1e-12, dc.name)
    }
    // 3 steps of 1100 V = 3300 V / 0.65 = 5077 V → 3 units of 1700 V (⌈3300 / 1700⌉ = 2 would be refused).
    expect(device(r.converters[0]!.envelope.devices, 'Dc1+').seriesCount).toBe(3)
    expect(r.warnings.some(w => w.includes('Dc1+: clampDiodeUnitVoltage 1700 V is too small for 2 units'))).toBe(true)
  })

  it('clamp-diode stacks are rated per unit diode', () => {
    const r = evaluateDesign({ machineSide: machine({ topology: 'diode-clamped', levels: 5, dcVoltage: 4000, dcVoltageMax: 4400, modulation: 'sine', overshootVoltage: 0, operatingPoints: [{ name: 'Rated', lineVoltageRms: 2800, phaseCurrentRms: 300, powerFactor: 0.9, fundamentalHz: 50 }] }) })
    const dc = device(r.converters[0]!.envelope.devices, 'Dc1+')
    expect(dc.seriesCount).toBe(3)
    expectClose(dc.requiredVoltageRating, 1100 / 0.65, 1e-12, 'per unit')
    expect(dc.voltageClass).toBe(1700)
  })

  it('warns when a position needs more than the 6500 V class: series devices (common practice)', () => {
    const r = evaluateDesign({ machineSide: machine({ dcVoltage: 4500, dcVoltageMax: 5000, operatingPoints: [{ name: 'Rated', lineVoltageRms: 3000, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }] }) })
    expect(device(r.converters[0]!.envelope.devices, 'S1').voltageClass).toBeUndefined()
    expect(r.warnings.some(w => /series-connected devices/.test(w))).toBe(true)
    expect(evaluateDesign({ machineSide: machine() }).warnings.some(w => /series/.test(w))).toBe(false)
  })

  it('handles 20 operating points', () => {
    const points = Array.from({ length: 20 }, (_, k) => ({ name: `P${k}`, lineVoltageRms: 20 + 20 * k, phaseCurrentRms: 100 + 5 * k, powerFactor: Math.cos((k * Math.PI) / 19), fundamentalHz: 2.5 * (k + 1) }))
    const r = evaluateDesign({ machineSide: machine({ operatingPoints: points }) })
    expect(r.converters[0]!.points).toHaveLength(20)
    expect(device(r.converters[0]!.envelope.devices, 'S1').worstPoint.currentPeak).toBe('P19')
  })
})

describe('back-to-back (ENGINEERING.md "Bidirectional power flow")', () => {
  const grid: ConverterInput = {
    topology: 'two-level', switchingHz: 4000, modulation: 'space-vector',
    operatingPoints: [{ name: 'Rectifying', lineVoltageRms: 400, phaseCurrentRms: 220, powerFactor: -0.98, fundamentalHz: 50 }],
  }
  const input: DesignInput = { machineSide: machine(), gridSide: grid }

  it('rates the grid side from its own point, on the shared DC link', () => {
    const r = evaluateDesign(input)
    const g = r.converters.find(c => c.side === 'grid')!
    const direct = evaluateStress({ ...grid, ...grid.operatingPoints[0]!, dcVoltage: 700, dcVoltageMax: 800 })
    for (const [k, d] of g.envelope.devices.entries()) {
      expect(d.currentRms).toBe(direct.devices[k]!.currentRms)
      expect(d.blockingVoltage).toBe(800)
    }
    // Power flows from the grid into the link: the grid-side diodes carry more than its switches.
    expect(device(g.envelope.devices, 'D1').currentAvg).toBeGreaterThan(device(g.envelope.devices, 'S1').currentAvg)
    expect(r.warnings.some(w => /Shared DC link/.test(w))).toBe(true)
  })

  it('warns when the grid side cannot carry the machine side\'s real power', () => {
    const weak = { ...grid, operatingPoints: [{ ...grid.operatingPoints[0]!, phaseCurrentRms: 50 }] }
    expect(evaluateDesign({ machineSide: machine(), gridSide: weak }).warnings.some(w => /cannot balance/.test(w))).toBe(true)
    expect(evaluateDesign(input).warnings.some(w => /cannot balance/.test(w))).toBe(false)
  })

  it('refuses a grid side of another kind or another DC link', () => {
    expect(fieldOf(() => evaluateDesign({ machineSide: machine(), gridSide: { ...grid, topology: 't-type' } }))).toBe('gridSide.topology')
    expect(fieldOf(() => evaluateDesign({ machineSide: machine(), gridSide: { ...grid, dcVoltage: 650 } }))).toBe('gridSide.dcVoltage')
    expect(fieldOf(() => evaluateDesign({ machineSide: machine({ topology: 'matrix', inputLineVoltageRms: 400, modulation: 'space-vector', operatingPoints: [{ name: 'a', lineVoltageRms: 300, phaseCurrentRms: 10, powerFactor: 0.9, fundamentalHz: 50 }] }), gridSide: { ...grid, topology: 'matrix' } }))).toBe('gridSide')
  })
})

describe('design input errors name the field path', () => {
  it.each([
    { what: 'point field', input: { machineSide: machine({ operatingPoints: [machine().operatingPoints[0]!, { ...machine().operatingPoints[1]!, powerFactor: 1.4 }] }) }, field: 'machineSide.operatingPoints.1.powerFactor' },
    { what: 'converter field', input: { machineSide: machine({ switchingHz: -1 }) }, field: 'machineSide.switchingHz' },
    { what: 'no points', input: { machineSide: machine({ operatingPoints: [] }) }, field: 'machineSide.operatingPoints' },
    { what: '51 points', input: { machineSide: machine({ operatingPoints: Array.from({ length: 51 }, (_, k) => ({ ...machine().operatingPoints[0]!, name: `p${k}` })) }) }, field: 'machineSide.operatingPoints' },
    { what: 'duplicate names', input: { machineSide: machine({ operatingPoints: [machine().operatingPoints[0]!, machine().operatingPoints[0]!] }) }, field: 'machineSide.operatingPoints.1.name' },
    { what: 'derating', input: { machineSide: machine(), derating: { semiconductorVoltageUtilisation: 1.5 } }, field: 'derating.semiconductorVoltageUtilisation' },
    { what: 'ripple target', input: { machineSide: machine(), capacitorRippleTarget: 0 }, field: 'capacitorRippleTarget' },
    { what: 'grid point', input: { machineSide: machine(), gridSide: { topology: 'two-level', switchingHz: 4000, modulation: 'sine', operatingPoints: [{ name: 'g', lineVoltageRms: 400, phaseCurrentRms: 10, powerFactor: 0.9, fundamentalHz: 0 }] } }, field: 'gridSide.operatingPoints.0.fundamentalHz' },
  ] as { what: string, input: DesignInput, field: string }[])('$what → $field', ({ input, field }) => {
    expect(fieldOf(() => evaluateDesign(input))).toBe(field)
  })

  it('a point lacking a name gets "Point n"', () => {
    const { name: _, ...unnamed } = machine().operatingPoints[0]!
    const r = evaluateDesign({ machineSide: machine({ operatingPoints: [unnamed] }) })
    expect(r.converters[0]!.points[0]!.pointName).toBe('Point 1')
    expect(lineVoltageFor(1, 350)).toBeGreaterThan(400)
  })
})
