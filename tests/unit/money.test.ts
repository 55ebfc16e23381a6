// Money (issue 15 item 5): amounts hold six-place decimals, and one price-break rule serves matching and the BOM.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { orderAtBreaks, priceAtQuantity } from '../../shared/catalog/prices'
import { priceOrder } from '../../shared/bom/build'
import { extendedPrice, roundMoney } from '../../shared/utils/money'

describe('money holds six-place decimals', () => {
  it('products and sums carry no binary noise', () => {
    expect(10.8 * 3).not.toBe(32.4) // the noise this guards against
    expect(extendedPrice(10.8, 3)).toBe(32.4)
    expect(roundMoney(Array.from({ length: 1000 }, () => 0.1).reduce((a, b) => a + b, 0))).toBe(100)
    expect(extendedPrice(0.0125, 7)).toBe(0.0875)
  })

  it('is the decimal nearest to the exact product for prices with up to six places (fast-check)', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 10 ** 9 }), fc.integer({ min: 1, max: 10 ** 5 }), (micro, pieces) => {
      // exact: integer micro-units × pieces in BigInt, written back as a decimal
      const exact = BigInt(micro) * BigInt(pieces)
      const text = `${exact / 1_000_000n}.${(exact % 1_000_000n).toString().padStart(6, '0')}`
      expect(extendedPrice(micro / 1e6, pieces)).toBe(Number(text))
    }))
  })
})

describe('one price-break rule', () => {
  const breaks = fc.uniqueArray(fc.record({ minQuantity: fc.integer({ min: 1, max: 500 }), unitPrice: fc.integer({ min: 1, max: 10 ** 6 }).map(n => n / 100) }), { selector: b => b.minQuantity, maxLength: 5 })

  it('orders max(need, MOQ, first break) at the largest break not above the order (brute force over the breaks)', () => {
    fc.assert(fc.property(breaks, fc.integer({ min: 0, max: 1000 }), fc.option(fc.integer({ min: 1, max: 800 }), { nil: undefined }), (list, need, moq) => {
      const order = orderAtBreaks(list, need, moq)
      const first = list.length ? Math.min(...list.map(b => b.minQuantity)) : 0
      expect(order.orderQuantity).toBe(Math.max(need, moq ?? 0, first))
      const applying = list.filter(b => b.minQuantity <= order.orderQuantity).sort((a, b) => b.minQuantity - a.minQuantity)[0]
      expect(order.unitPrice).toBe(applying?.unitPrice ?? null)
      expect(order.breakQuantity).toBe(applying?.minQuantity ?? null)
    }))
  })

  it('matching and the BOM read the same answer from it', () => {
    fc.assert(fc.property(breaks, fc.integer({ min: 1, max: 1000 }), fc.integer({ min: 1, max: 800 }), (list, need, moq) => {
      const bom = priceOrder(need, list.map(b => ({ quantity: b.minQuantity, price: b.unitPrice })), moq)
      const matching = priceAtQuantity(list, need, moq)
      if (list.length === 0) {
        expect(matching).toBeNull()
        expect(bom.unitPrice).toBeNull()
        return
      }
      expect(matching).toEqual({ unitPrice: bom.unitPrice, breakQuantity: bom.priceBreakQuantity, orderQuantity: bom.quantityOrder, raisedToMinimum: bom.raisedBy !== null })
    }))
  })
})
