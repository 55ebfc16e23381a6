// Quantity price breaks: the cell format and the price at a quantity (worked by hand).
import { describe, expect, it } from 'vitest'
import { formatPriceBreaks, parsePriceBreaks, priceAtQuantity } from '../../../shared/catalog/prices'

const breaks = [
  { minQuantity: 1, unitPrice: 12.5 },
  { minQuantity: 100, unitPrice: 10.8 },
  { minQuantity: 500, unitPrice: 9.9 },
]

describe('parsePriceBreaks', () => {
  it('reads quantity:price pairs', () => {
    expect(parsePriceBreaks('1:12.50; 100:10.80; 500:9.90', '.')).toEqual({ ok: true, breaks })
    expect(parsePriceBreaks('1:12,50; 100:10,80; 500:9,90', ',')).toEqual({ ok: true, breaks })
    expect(parsePriceBreaks('1+: 12.50;100 pcs:10.80;\n500:9.90;', '.')).toEqual({ ok: true, breaks })
    expect(parsePriceBreaks('1 000:4.20', '.')).toEqual({ ok: true, breaks: [{ minQuantity: 1000, unitPrice: 4.2 }] })
  })

  it('takes a lone number as the price from one piece', () => {
    expect(parsePriceBreaks(12.5, '.')).toEqual({ ok: true, breaks: [{ minQuantity: 1, unitPrice: 12.5 }] })
    expect(parsePriceBreaks('12,50', ',')).toEqual({ ok: true, breaks: [{ minQuantity: 1, unitPrice: 12.5 }] })
  })

  it.each([
    ['1-12.50; 100-10.80', /no ':' between quantity and price/],
    ['100:10.80; 50:11.00', /quantities must increase from break to break: 100 is followed by 50/],
    ['1:12.50; 1:11.00', /quantities must increase/],
    ['€12.50', /without currency/],
    ['1:12.50 EUR', /without currency/],
    ['0:12.50', /whole number of pieces ≥ 1/],
    ['2.5:12.50', /whole number of pieces/],
    ['1:abc', /the price 'abc' is not a number/],
    ['1:-3', /must not be negative|not a number/],
    [-3, /≥ 0/],
  ])('%j is refused', (raw, reason) => {
    const result = parsePriceBreaks(raw, '.')
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.reason).toMatch(reason)
  })

  it('writes breaks back in the same format', () => {
    expect(formatPriceBreaks(breaks)).toBe('1:12.50; 100:10.80; 500:9.90')
  })
})

describe('priceAtQuantity', () => {
  it.each([
    [1, 12.5, 1], [99, 12.5, 1], [100, 10.8, 100], [499, 10.8, 100], [500, 9.9, 500], [10_000, 9.9, 500],
  ])('%d pieces → %d each (break %d)', (qty, price, breakQty) => {
    expect(priceAtQuantity(breaks, qty)).toEqual({ unitPrice: price, breakQuantity: breakQty, orderQuantity: qty, raisedToMinimum: false })
  })

  it('raises the order to the first break or the MOQ', () => {
    expect(priceAtQuantity([{ minQuantity: 10, unitPrice: 3 }, { minQuantity: 100, unitPrice: 2.5 }], 3))
      .toEqual({ unitPrice: 3, breakQuantity: 10, orderQuantity: 10, raisedToMinimum: true })
    // MOQ 120 lifts 20 pieces past the 100 break.
    expect(priceAtQuantity(breaks, 20, 120)).toEqual({ unitPrice: 10.8, breakQuantity: 100, orderQuantity: 120, raisedToMinimum: true })
  })

  it('does not depend on the order of the breaks and is null without prices', () => {
    expect(priceAtQuantity([...breaks].reverse(), 150)?.unitPrice).toBe(10.8)
    expect(priceAtQuantity([], 10)).toBeNull()
  })
})
