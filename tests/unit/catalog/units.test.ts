// Cell values with units and SI prefixes. Expected values are worked by hand (SI prefix arithmetic).
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { parseNumberText, parseQuantity, unitFactor, unitScaleFromHeader, type QuantityOptions } from '../../../shared/catalog/units'

const dot: QuantityOptions = { decimalSeparator: '.' }
const comma: QuantityOptions = { decimalSeparator: ',' }

describe('parseQuantity: accepted spellings', () => {
  const cases: [unknown, string, typeof dot, number][] = [
    ['1.2 kV', 'V', dot, 1200],
    ['1200 V', 'V', dot, 1200],
    ['1200', 'V', dot, 1200],
    [1200, 'V', dot, 1200],
    ['1 200 V', 'V', dot, 1200],
    ['1\u00A0200 V', 'V', dot, 1200],
    ['1,200 V', 'V', dot, 1200],
    ['1.200,5 V', 'V', comma, 1200.5],
    ['1200 Vdc', 'V', dot, 1200],
    ['1.2 KV', 'V', dot, 1200],
    ['450A', 'A', dot, 450],
    ['1.2 kA', 'A', dot, 1200],
    ['60 Arms', 'A', dot, 60],
    ['2.5 mΩ', 'Ω', dot, 0.0025],
    ['2.5 mOhm', 'Ω', dot, 0.0025],
    ['2.5 mohm', 'Ω', dot, 0.0025],
    ['2,5 mΩ', 'Ω', comma, 0.0025],
    ['18 mJ', 'J', dot, 0.018],
    ['0.9 J', 'J', dot, 0.9],
    ['250 µJ', 'J', dot, 0.00025],
    ['0.12 K/W', 'K/W', dot, 0.12],
    ['0.12 °C/W', 'K/W', dot, 0.12],
    ['120 mK/W', 'K/W', dot, 0.12],
    ['4,7 µF', 'F', comma, 4.7e-6],
    ['4.7 uF', 'F', dot, 4.7e-6],
    ['4.7 μF', 'F', dot, 4.7e-6], // Greek mu
    ['470 nF', 'F', dot, 4.7e-7],
    ['4.7 mF', 'F', dot, 0.0047],
    ['175 °C', '°C', dot, 175],
    ['150 C', '°C', dot, 150],
    ['84 d', 'd', dot, 84],
    ['84 days', 'd', dot, 84],
    ['12 weeks', 'd', dot, 84],
    ['12 wk', 'd', dot, 84],
    ['.5 V', 'V', dot, 0.5],
    ['1e3 V', 'V', dot, 1000],
    ['−0.5 V', 'V', dot, -0.5],
    ['+12', '', dot, 12],
    ['  1200 V  ', 'V', dot, 1200],
    ['4 kHz', 'Hz', dot, 4000],
    ['100 pcs', 'pcs', dot, 100],
  ]
  it.each(cases)('%j in %s → %s', (raw, unit, opts, expected) => {
    const result = parseQuantity(raw, unit, opts)
    expect(result).toEqual({ ok: true, value: expected })
  })

  it('applies a header unit to bare numbers only', () => {
    expect(parseQuantity(45, 'J', { ...dot, bareNumberScale: 1e-3 })).toEqual({ ok: true, value: 0.045 })
    expect(parseQuantity('45', 'J', { ...dot, bareNumberScale: 1e-3 })).toEqual({ ok: true, value: 0.045 })
    expect(parseQuantity('0.9 J', 'J', { ...dot, bareNumberScale: 1e-3 })).toEqual({ ok: true, value: 0.9 })
  })
})

describe('parseQuantity: refused cells say why', () => {
  const cases: [unknown, string, typeof dot, RegExp][] = [
    ['12 A', 'V', dot, /expected a voltage like '1200 V' or '1\.2 kV', got '12 A' \(a current\)/],
    ['18 mJ', 'V', dot, /expected a voltage.*got '18 mJ' \(an energy\)/],
    ['2 mΩ', 'A', dot, /expected a current.*\(a resistance\)/],
    ['12 Vx', 'V', dot, /unit 'Vx' not recognised/],
    ['abc', 'V', dot, /expected a voltage like .*got 'abc'/],
    ['4,7 µF', 'F', dot, /'4,7' uses ',' but the decimal separator chosen for this upload is '\.'/],
    ['1.5 V', 'V', comma, /'1\.5' uses '\.' but the decimal separator chosen for this upload is ','/],
    ['12 00 V', 'V', dot, /digit groups must have three digits/],
    ['1.2.3 V', 'V', dot, /more than one decimal separator '\.'/],
    ['1200-1700 V', 'V', dot, /a range '1200-1700 V': give one value/],
    ['', 'V', dot, /empty cell: expected a voltage/],
    [null, 'V', dot, /empty cell/],
    [true, 'V', dot, /the logical value TRUE/],
    [Number.NaN, 'V', dot, /non-finite/],
    ['175 K', '°C', dot, /expected a temperature/],
    ['3 months', 'd', dot, /expected a duration.*unit 'months' not recognised/],
  ]
  it.each(cases)('%j in %s', (raw, unit, opts, reason) => {
    const result = parseQuantity(raw, unit, opts)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.reason).toMatch(reason)
  })
})

describe('number text and unit helpers', () => {
  it('reads thousands groups and decimal marks by the chosen separator', () => {
    expect(parseNumberText('1 234 567,25', ',')).toEqual({ ok: true, value: 1234567.25 })
    expect(parseNumberText('1\'234.5', '.')).toEqual({ ok: true, value: 1234.5 })
    expect(parseNumberText('1,5', '.').ok).toBe(false)
  })

  it('does not read K/W as kilo-per-watt', () => {
    expect(unitFactor('K/W', 'K/W')).toBe(1)
    expect(unitFactor('mK/W', 'K/W')).toBe(1e-3)
    expect(unitFactor('MΩ', 'Ω')).toBe(1e6)
    expect(unitFactor('mΩ', 'Ω')).toBe(1e-3)
  })

  it('finds the unit a header declares', () => {
    expect(unitScaleFromHeader('Eon (mJ)', 'J')).toBe(1e-3)
    expect(unitScaleFromHeader('E_off [mJ]', 'J')).toBe(1e-3)
    expect(unitScaleFromHeader('Lead time (weeks)', 'd')).toBe(7)
    expect(unitScaleFromHeader('Voltage, kV', 'V')).toBe(1000)
    expect(unitScaleFromHeader('Capacitance in µF', 'F')).toBe(1e-6)
    expect(unitScaleFromHeader('Rth jc (K/W)', 'K/W')).toBe(1)
    expect(unitScaleFromHeader('VCES', 'V')).toBeNull()
    expect(unitScaleFromHeader('Ic (V)', 'A')).toBeNull()
  })
})

describe('parseQuantity: properties (fast-check)', () => {
  const prefixes: [string, number][] = [['', 1], ['k', 1e3], ['m', 1e-3], ['µ', 1e-6], ['M', 1e6]]

  it('reads any decimal number with any SI prefix, with either decimal separator', () => {
    fc.assert(fc.property(
      fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }),
      fc.constantFrom(...prefixes),
      fc.constantFrom<'.' | ','>('.', ','),
      (x, [prefix, factor], separator) => {
        const text = x.toFixed(4).replace('.', separator)
        const result = parseQuantity(`${text} ${prefix}V`, 'V', { decimalSeparator: separator })
        expect(result.ok).toBe(true)
        if (result.ok) expect(result.value).toBeCloseTo(Number(x.toFixed(4)) * factor, Math.max(0, 6 - Math.log10(factor)))
      },
    ))
  })

  it('reads thousands groups of any integer', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 1e9 }), fc.constantFrom(' ', '\u00A0', '\''), (n, sep) => {
      const grouped = String(n).replace(/\B(?=(\d{3})+(?!\d))/g, sep)
      expect(parseQuantity(`${grouped} A`, 'A', { decimalSeparator: '.' })).toEqual({ ok: true, value: n })
    }))
  })
})
