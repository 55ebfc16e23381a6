// Release gates, locale number entry, quote plausibility and purchasing views (rules of issue 11; the
// decimal and group separators per locale are Intl's, i.e. CLDR's).

import { describe, expect, it } from 'vitest'
import { buildBomLines } from '../../../shared/bom/build'
import { gateMark, gateReasons, unacknowledgedLines } from '../../../shared/bom/gates'
import { quoteNeedsConfirmation } from '../../../shared/bom/number'
import { groupBySupplier, isOpen, openLinesBySupplier, stockShortfall } from '../../../shared/bom/purchase'
import { capacitorFill, positionFill } from './fixtures'

describe('gates', () => {
  it('unapproved, NRND and obsolete parts are gated; approved active parts are not', () => {
    expect(gateReasons({ approved: true, lifecycle: 'active' })).toEqual([])
    expect(gateReasons({ approved: false, lifecycle: 'nrnd' })).toEqual(['unapproved', 'nrnd'])
    expect(gateReasons({ approved: true, lifecycle: 'obsolete' })).toEqual(['obsolete'])
  })

  it('a BOM line carries the gate; only unacknowledged gated lines block; the mark names who acknowledged', () => {
    const { lines } = buildBomLines({ positions: [positionFill({ approved: false }), positionFill({ partNumber: 'OK-1', approved: true })], buildQuantity: 1, sparesPercent: 0 })
    expect(lines[0]!.gate).toEqual(['unapproved'])
    expect(lines[1]!.gate).toBeUndefined()
    expect(unacknowledgedLines(lines).map(l => l.partNumber)).toEqual([lines[0]!.partNumber])
    expect(gateMark(lines[0]!)).toMatch(/NOT acknowledged/)
    lines[0]!.acknowledgement = { reason: 'only qualified source', by: 'A. Engineer', at: '2026-01-01T00:00:00Z' }
    expect(unacknowledgedLines(lines)).toEqual([])
    expect(gateMark(lines[0]!)).toBe('not approved by component engineering; acknowledged by A. Engineer: only qualified source')
  })
})

describe('capacitor banks carry series × parallel', () => {
  it('a 2s×14p bank is 28 pieces per set and shows 2 × 14 on the positions sheet', () => {
    const r = buildBomLines({ positions: [], capacitors: [capacitorFill({ count: 28, seriesCount: 2, parallelCount: 14 })], buildQuantity: 10, sparesPercent: 0 })
    expect(r.lines[0]!.quantityPerUnit).toBe(28)
    expect(r.lines[0]!.quantityBuild).toBe(280)
    expect(r.positions[0]).toMatchObject({ perConverter: 28, seriesCount: 2, parallelCount: 14 })
    expect(r.totals.pieces).toBe(r.lines[0]!.quantityOrder)
  })
})

describe('quoteNeedsConfirmation', () => {
  it('a quote more than 3× off the catalogue price asks for confirmation, either way', () => {
    expect(quoteNeedsConfirmation(1250, 12.5)).toBe(true)
    expect(quoteNeedsConfirmation(4, 12.5)).toBe(true)
    expect(quoteNeedsConfirmation(30, 12.5)).toBe(false)
    expect(quoteNeedsConfirmation(30, null)).toBe(false)
  })
})

describe('purchasing views', () => {
  const { lines } = buildBomLines({ positions: [positionFill({ partNumber: 'A', supplier: 'Zeta' }), positionFill({ partNumber: 'B', supplier: 'Alpha', stock: 10 }), positionFill({ partNumber: 'C', supplier: 'Zeta' })], buildQuantity: 10, sparesPercent: 0 })
  const purchase = { [lines[2]!.key]: { status: 'received' as const }, [lines[0]!.key]: { supplier: 'Alpha' } }

  it('groups by the supplier purchasing entered, else the catalogue supplier', () => {
    expect(groupBySupplier(lines, purchase).map(g => [g.supplier, g.lines.map(l => l.partNumber)])).toEqual([['Alpha', ['A', 'B']], ['Zeta', ['C']]])
  })

  it('open lines are those not received; totals follow the lines kept', () => {
    expect(isOpen(lines[2]!, purchase)).toBe(false)
    const open = openLinesBySupplier({ lines, currency: 'EUR', totals: { lines: 3, pieces: 0, extendedPrice: 0, unpricedLines: 0 } } as never, purchase)
    expect(open.lines.map(l => l.partNumber)).toEqual(['A', 'B'])
    expect(open.totals.lines).toBe(2)
  })

  it('stock shortfall: order 30 against stock 10 is 20 short', () => {
    expect(stockShortfall(lines[1]!)).toBe(20)
    expect(stockShortfall({ stock: null, quantityOrder: 5 })).toBe(0)
  })
})
