// Device counts, clamp stacks and blocking voltages per topology against published tables.
import { describe, expect, it } from 'vitest'
import { evaluateStress } from '../../../shared/engine'
import { device, inputAt } from './helpers'

const RODRIGUEZ = 'Rodriguez, Lai, Peng, IEEE TIE 49(4) 2002, Table I'
const V = 4000

describe('diode-clamped N-level', () => {
  it.each([3, 4, 5, 6, 7, 8, 9].map(N => ({ N, source: RODRIGUEZ })))('N=$N ($source, exact)', ({ N }) => {
    const r = evaluateStress(inputAt('diode-clamped', 0.8, 0.9, { levels: N, dcVoltage: V }))
    const step = V / (N - 1)
    expect(r.counts.switchesPerPhase).toBe(2 * (N - 1))
    expect(r.counts.diodesPerPhase).toBe(2 * (N - 1))
    expect(r.counts.clampDiodesPerPhase).toBe((N - 1) * (N - 2))
    expect(r.counts.clampDiodesTotal).toBe(3 * (N - 1) * (N - 2))
    expect(r.capacitors.filter(c => c.kind === 'dc-link')).toHaveLength(N - 1)
    for (const c of r.capacitors) expect(c.voltage).toBeCloseTo(step, 9)
    for (const d of r.devices.filter(x => x.kind !== 'clamp-diode')) expect(d.blockingVoltage).toBeCloseTo(step, 9)
    // One clamp position per side and k = 1…N−2, blocking k·V_dc/(N−1), realised by k unit diodes.
    for (const side of ['+', '-']) {
      const clamps = r.devices.filter(d => d.kind === 'clamp-diode' && d.name.endsWith(side))
      expect(clamps.map(c => Math.round(c.blockingVoltage / step)).sort((a, b) => a - b)).toEqual(Array.from({ length: N - 2 }, (_, k) => k + 1))
      for (const c of clamps) expect(c.seriesCount).toBe(Math.round(c.blockingVoltage / step))
    }
  })

  it('clamp stacks with a chosen unit rating: the count passes the derating rule, n·unit ≥ max(V/u, (V+ΔV)/margin) (common practice)', () => {
    const r = evaluateStress(inputAt('diode-clamped', 0.8, 0.9, { levels: 5, dcVoltage: V, clampDiodeUnitVoltage: 1700 }))
    // Steps of 1000 V: k = 1, 2, 3 → 1000, 2000, 3000 V; / 0.65 → 1538, 3077, 4615 V → 1, 2, 3 units of 1700 V.
    // (⌈blocking / unit⌉ alone would give 2 units for 3000 V: 3400 V rating at 88 % utilisation, refused by the 65 % rule.)
    expect(device(r.devices, 'Dc3+').seriesCount).toBe(1)
    expect(device(r.devices, 'Dc2+').seriesCount).toBe(2)
    expect(device(r.devices, 'Dc1+').seriesCount).toBe(3)
    expect(r.counts.clampDiodesPerPhase).toBe(2 * (1 + 2 + 3))
    expect(r.warnings.some(w => w.startsWith('Dc1+: clampDiodeUnitVoltage 1700 V is too small for 2 units') && w.includes('3 units are counted'))).toBe(true)
    expect(r.warnings.some(w => w.startsWith('Dc2+'))).toBe(false)
  })
})

describe('flying-capacitor N-level', () => {
  it.each([3, 4, 5, 6, 7, 8, 9].map(N => ({ N, source: `${RODRIGUEZ}; Meynard & Foch, IEEE PESC 1992` })))('N=$N ($source, exact)', ({ N }) => {
    const r = evaluateStress(inputAt('flying-capacitor', 0.8, 0.9, { levels: N, dcVoltage: V }))
    const step = V / (N - 1)
    expect(r.counts.switchesPerPhase).toBe(2 * (N - 1))
    expect(r.counts.clampDiodesPerPhase).toBe(0)
    const flying = r.capacitors.filter(c => c.kind === 'flying')
    const link = r.capacitors.filter(c => c.kind === 'dc-link')
    expect(link.reduce((a, c) => a + c.count, 0)).toBe(N - 1)
    expect(flying).toHaveLength(N - 2)
    // Flying capacitors at k·V_dc/(N−1), k = 1…N−2; (N−1)(N−2)/2 unit capacitors per phase.
    expect(flying.map(c => Math.round(c.voltage / step)).sort((a, b) => a - b)).toEqual(Array.from({ length: N - 2 }, (_, k) => k + 1))
    expect(flying.reduce((a, c) => a + c.seriesCount!, 0)).toBe(((N - 1) * (N - 2)) / 2)
    for (const c of flying) expect(c.count).toBe(3)
    for (const d of r.devices) expect(d.blockingVoltage).toBeCloseTo(step, 9)
  })
})

describe('cascaded H-bridge', () => {
  it.each([3, 5, 7, 9, 11, 13, 15].map(N => ({ N, source: RODRIGUEZ })))('N=$N ($source, exact)', ({ N }) => {
    const r = evaluateStress(inputAt('cascaded-h-bridge', 0.8, 0.9, { levels: N, dcVoltage: 700 }))
    expect(r.counts.switchesPerPhase).toBe(2 * (N - 1))
    expect(r.counts.diodesPerPhase).toBe(2 * (N - 1))
    expect(r.counts.capacitors).toBe((3 * (N - 1)) / 2)
    for (const d of r.devices) expect(d.blockingVoltage).toBeCloseTo(700, 9)
    expect(r.modulationIndex).toBeCloseTo(0.8, 12)
  })
})

describe('three-level and two-level legs', () => {
  it('two-level: 2 switches at V_dc, one DC-link capacitor (B. Wu, Wiley-IEEE Press 2006)', () => {
    const r = evaluateStress(inputAt('two-level', 0.8, 0.9, { dcVoltage: 800 }))
    expect(r.counts).toMatchObject({ switchesPerPhase: 2, diodesPerPhase: 2, clampDiodesPerPhase: 0, capacitors: 1, switchesTotal: 6 })
  })

  it('T-type: outer switches block V_dc, inner back-to-back pair V_dc/2, commutating V_dc/2 (first principles; common practice)', () => {
    const r = evaluateStress(inputAt('t-type', 0.8, 0.9, { dcVoltage: 800 }))
    for (const n of ['S1', 'D1', 'S4', 'D4']) expect(device(r.devices, n).blockingVoltage).toBeCloseTo(800, 9)
    for (const n of ['S2', 'D2', 'S3', 'D3']) expect(device(r.devices, n).blockingVoltage).toBeCloseTo(400, 9)
    for (const d of r.devices) expect(d.commutatedVoltage).toBeCloseTo(400, 9)
    expect(r.counts).toMatchObject({ switchesPerPhase: 4, diodesPerPhase: 4, capacitors: 2 })
  })

  it('active NPC: 6 switches at V_dc/2 (Brückner, Bernet, Güldner, IEEE TIE 2005); inner pair switches at the fundamental in the assumed pattern', () => {
    const r = evaluateStress(inputAt('anpc', 0.8, 0.9, { dcVoltage: 800, overshootVoltage: 60 }))
    expect(r.counts).toMatchObject({ switchesPerPhase: 6, diodesPerPhase: 6, clampDiodesPerPhase: 0, capacitors: 2 })
    for (const d of r.devices) expect(d.blockingVoltage).toBeCloseTo(400, 9)
    for (const n of ['S2', 'D2', 'S3', 'D3']) expect(device(r.devices, n).blockingVoltageWithOvershoot).toBeCloseTo(400, 9)
    for (const n of ['S1', 'D1', 'S4', 'D4', 'S5', 'D5', 'S6', 'D6']) expect(device(r.devices, n).blockingVoltageWithOvershoot).toBeCloseTo(460, 9)
    expect(r.notes!.join(' ')).toMatch(/S1 commutates/)
  })
})
