// BOM quantities, MOQ, price breaks, spares, modules and manual lines.
// Expected values are worked by hand from the rules in PRODUCT.md flow 7 (the arithmetic is shown
// beside each case); the grouping rule (sum positions, then divide by positions per package) is ours.

import { describe, expect, it } from 'vitest'
import { BomInputError, buildBomLines, buildBomSnapshot, priceOrder } from '../../../shared/bom/build'
import { capacitorFill, demoInput, positionFill, snapshotHeader } from './fixtures'

function lineOf(result: ReturnType<typeof buildBomLines>, partNumber: string) {
  const line = result.lines.find(l => l.partNumber === partNumber)
  if (!line) throw new Error(`no line for ${partNumber}`)
  return line
}

describe('buildBomLines: the demo NPC back-to-back BOM (worked by hand)', () => {
  const result = buildBomLines(demoInput())

  it('groups positions by manufacturer + part number, one line per part, manual lines last', () => {
    expect(result.lines.map(l => l.partNumber)).toEqual(['ORS-IG12-150', 'ORS-IG12-100', 'TV-FD06-100', 'VSW-HB12-300', 'MQF-F1100-500', 'HS-400-FA', ''])
    expect(result.lines.map(l => l.category)).toEqual(['switch', 'switch', 'clamp-diode', 'module', 'capacitor', 'manual', 'manual'])
  })

  it('single switches: S1 + S4, 1/phase × 3 phases each = 6 per set; ×10 = 60; spares ceil(60 × 5 %) = 3; order 63 at the 50-piece break 79.50 → 5008.50', () => {
    const l = lineOf(result, 'ORS-IG12-150')
    expect([l.quantityPerUnit, l.quantityBuild, l.quantitySpares, l.quantityOrder]).toEqual([6, 60, 3, 63])
    expect([l.priceBreakQuantity, l.unitPrice, l.extendedPrice]).toEqual([50, 79.5, 5008.5])
    expect(l.references).toEqual(['machine S1 (×3)', 'machine S4 (×3)'])
  })

  it('clamp-diode stacks: 2 positions × 3 phases × 2 in series = 12 per set; ×10 = 120; spares 6; 126 at the 100-piece break 8.60 → 1083.60', () => {
    const l = lineOf(result, 'TV-FD06-100')
    expect([l.quantityPerUnit, l.quantityBuild, l.quantitySpares, l.quantityOrder]).toEqual([12, 120, 6, 126])
    expect([l.priceBreakQuantity, l.unitPrice, l.extendedPrice]).toEqual([100, 8.6, 1083.6])
    expect(l.references).toEqual(['machine Dc1+ (×6)', 'machine Dc1- (×6)'])
  })

  it('half-bridge modules: (3 + 3 positions) / 2 = 3 per set; ×10 = 30; spares ceil(1.5) = 2; need 32 < MOQ 40 → 40 at the 25-piece break 295 → 11800', () => {
    const l = lineOf(result, 'VSW-HB12-300')
    expect([l.quantityPerUnit, l.quantityBuild, l.quantitySpares, l.quantityOrder]).toEqual([3, 30, 2, 40])
    expect([l.priceBreakQuantity, l.unitPrice, l.extendedPrice]).toEqual([25, 295, 11800])
    expect(l.warnings).toContain('order raised from 32 to the MOQ of 40 pcs')
  })

  it('capacitors count directly: 8 per set; 80 + 4 spares = 84 ≥ MOQ 10, first break 64 → 5376', () => {
    const l = lineOf(result, 'MQF-F1100-500')
    expect([l.quantityPerUnit, l.quantityBuild, l.quantitySpares, l.quantityOrder, l.unitPrice, l.extendedPrice]).toEqual([8, 80, 4, 84, 64, 5376])
    expect(l.references).toEqual(['dc-link C1 (×8)'])
  })

  it('manual lines: heatsink 1 per set → 10 + ceil(0.5) = 11 at 120 → 1320; the busbar has no price', () => {
    const heatsink = result.lines[5]!
    expect(heatsink).toMatchObject({ key: 'manual-1', manual: true, quantityPerUnit: 1, quantityBuild: 10, quantitySpares: 1, quantityOrder: 11, unitPrice: 120, extendedPrice: 1320, partVersionId: null })
    const busbar = result.lines[6]!
    expect(busbar).toMatchObject({ key: 'manual-2', manual: true, quantityOrder: 21, unitPrice: null, extendedPrice: null, priceBreakQuantity: null })
  })

  it('totals: 5008.50 + 3855.60 + 1083.60 + 11800 + 5376 + 1320 = 28443.70; pieces 63+63+126+40+84+11+21 = 408; one unpriced line', () => {
    expect(result.totals).toEqual({ lines: 7, pieces: 408, extendedPrice: 28443.7, unpricedLines: 1, otherCurrencyLines: 0 })
  })

  it('lists every position with its count per converter set for the positions table', () => {
    expect(result.positions).toHaveLength(9)
    expect(result.positions[4]).toEqual({ side: 'machine', position: 'Dc1+', partNumber: 'TV-FD06-100', manufacturer: 'Tannvik Power Devices', perConverter: 6, seriesCount: 2, parallelCount: 1 })
    expect(result.positions[8]).toMatchObject({ side: 'dc-link', position: 'C1', perConverter: 8 })
  })
})

describe('modules: sum positions first, then divide by positions per package (worked by hand)', () => {
  const base = { buildQuantity: 1, sparesPercent: 0 }

  it('six-pack: S1 and S2 at 1/phase × 3 phases = 6 positions / 6 = 1 module', () => {
    const r = buildBomLines({ ...base, positions: [positionFill({ position: 'S1', perPackage: 6 }), positionFill({ position: 'S2', perPackage: 6 })] })
    expect(r.lines[0]!.quantityPerUnit).toBe(1)
  })

  it('three-level NPC leg module (4 switches + 2 clamp diodes = 6 positions): (4 + 2) × 3 phases / 6 = 3 modules', () => {
    const r = buildBomLines({ ...base, positions: [
      positionFill({ position: 'S1-S4', positionsPerPhase: 4, perPackage: 6 }),
      positionFill({ position: 'Dc', kind: 'clamp-diode', positionsPerPhase: 2, perPackage: 6 }),
    ] })
    expect(r.lines).toHaveLength(1)
    expect(r.lines[0]!.quantityPerUnit).toBe(3)
  })

  it('rounds up after summing: one position × 3 phases on a half-bridge = ceil(3 / 2) = 2', () => {
    const r = buildBomLines({ ...base, positions: [positionFill({ perPackage: 2 })] })
    expect(r.lines[0]!.quantityPerUnit).toBe(2)
  })

  it('parallel and series multiply: 1/phase × 3 × 2 series × 3 parallel = 18 singles', () => {
    const r = buildBomLines({ ...base, positions: [positionFill({ seriesCount: 2, parallelCount: 3 })] })
    expect(r.lines[0]!.quantityPerUnit).toBe(18)
    expect(r.lines[0]!.references).toEqual(['machine S1 (×18)'])
  })

  it('groups case-insensitively on manufacturer + part number, but the same number from two makers stays two lines', () => {
    const r = buildBomLines({ ...base, positions: [
      positionFill({ position: 'S1' }),
      positionFill({ position: 'S2', partNumber: ' ors-ig12-150 ' }),
      positionFill({ position: 'S3', manufacturer: 'Carrow Carbide' }),
    ] })
    expect(r.lines.map(l => l.quantityPerUnit)).toEqual([6, 3])
  })

  it('refuses one part with two package sizes, naming the field', () => {
    expect(() => buildBomLines({ ...base, positions: [positionFill({ perPackage: 2 }), positionFill({ position: 'S2', perPackage: 6 })] }))
      .toThrow(/positions\.1\.perPackage: 6 differs from 2/)
  })
})

describe('spares rounding (worked by hand)', () => {
  const oneLine = (perSet: number, build: number, sparesPercent: number) =>
    buildBomLines({ buildQuantity: build, sparesPercent, positions: [positionFill({ positionsPerPhase: perSet, phases: 1, moq: null })] }).lines[0]!

  it.each<[number, number, number, number, string]>([
    // [per set, sets, spares %, spares expected, arithmetic]
    [1, 7, 10, 1, '7 × 10 % = 0.7 → 1'],
    [10, 300, 1.1, 33, '3000 × 1.1 % = 33 exactly (in binary 33.00000000000001, which must not give 34)'],
    [30, 100, 9.3, 279, '3000 × 9.3 % = 279 exactly (in binary 279.00000000000006)'],
    [3, 1, 0, 0, 'no spares at 0 %'],
    [5, 20, 2, 2, '100 × 2 % = 2'],
    [1, 1, 0.5, 1, '1 × 0.5 % = 0.005 → 1'],
    [6, 7, 100, 42, '42 × 100 % = 42'],
  ])('%i/set × %i sets at %s %% → %i spares (%s)', (perSet, build, pct, spares) => {
    const l = oneLine(perSet, build, pct)
    expect(l.quantitySpares).toBe(spares)
    expect(l.quantityOrder).toBe(perSet * build + spares)
  })
})

describe('MOQ and price breaks (worked by hand)', () => {
  const breaks = [{ quantity: 100, price: 9.9 }, { quantity: 1, price: 12.5 }, { quantity: 50, price: 10.8 }]

  it.each<[number, number | null, number, number, number]>([
    // [need, moq, order, break, unit price]
    [49, null, 49, 1, 12.5],
    [50, null, 50, 50, 10.8],
    [99, null, 99, 50, 10.8],
    [100, null, 100, 100, 9.9],
    [30, 60, 60, 50, 10.8],
    [60, 60, 60, 50, 10.8],
    [1000, 60, 1000, 100, 9.9],
  ])('need %i, MOQ %s → order %i at the %i-piece break %d (breaks given out of order)', (need, moq, order, brk, price) => {
    const p = priceOrder(need, breaks, moq)
    expect([p.quantityOrder, p.priceBreakQuantity, p.unitPrice]).toEqual([order, brk, price])
  })

  it('a first break above the need raises the order to it: need 63, breaks from 100 at 0.50 → 100 at 0.50', () => {
    expect(priceOrder(63, [{ quantity: 100, price: 0.5 }, { quantity: 1000, price: 0.42 }], 1)).toEqual({ quantityOrder: 100, priceBreakQuantity: 100, unitPrice: 0.5, raisedBy: 'first-price-break' })
  })

  it('no breaks: order = max(need, MOQ), unpriced', () => {
    expect(priceOrder(12, [], 20)).toEqual({ quantityOrder: 20, priceBreakQuantity: null, unitPrice: null, raisedBy: 'moq' })
  })

  it('extended price is unit × order without binary noise: 3 × 10.80 = 32.40', () => {
    const l = buildBomLines({ buildQuantity: 1, sparesPercent: 0, positions: [positionFill({ phases: 1, positionsPerPhase: 3, unitPriceBreaks: [{ quantity: 1, price: 10.8 }] })] }).lines[0]!
    expect(l.extendedPrice).toBe(32.4)
  })
})

describe('currencies, warnings and bad input', () => {
  it('a line priced in another currency stays out of the total and says so', () => {
    const r = buildBomLines({ buildQuantity: 1, sparesPercent: 0, currency: 'EUR', positions: [
      positionFill({ phases: 1, unitPriceBreaks: [{ quantity: 1, price: 10 }] }),
      positionFill({ phases: 1, partNumber: 'CCX-SC12-80', currency: 'USD', unitPriceBreaks: [{ quantity: 1, price: 40 }] }),
    ] })
    expect(r.totals).toMatchObject({ extendedPrice: 10, otherCurrencyLines: 1, unpricedLines: 0 })
    expect(r.lines[1]!.warnings).toContain('priced in USD, not in the BOM currency EUR: not in the total')
  })

  it('warns about short stock and lifecycle', () => {
    const l = buildBomLines({ buildQuantity: 10, sparesPercent: 0, positions: [positionFill({ stock: 12, lifecycle: 'obsolete' })] }).lines[0]!
    expect(l.warnings).toEqual(['stock 12 pcs is below the order of 30 pcs', 'lifecycle: obsolete'])
  })

  it('names every bad field', () => {
    try {
      buildBomLines({
        buildQuantity: 0,
        sparesPercent: -1,
        positions: [positionFill({ perPackage: 0, unitPriceBreaks: [{ quantity: 1.5, price: -2 }] })],
        capacitors: [capacitorFill({ count: 2.5 })],
        manualLines: [{ description: '', quantityPerUnit: 0 }],
      })
      expect.unreachable('should have thrown')
    }
    catch (e) {
      expect(e).toBeInstanceOf(BomInputError)
      expect((e as BomInputError).issues.map(i => i.field)).toEqual([
        'buildQuantity', 'sparesPercent', 'positions.0.unitPriceBreaks.0.quantity', 'positions.0.unitPriceBreaks.0.price',
        'positions.0.perPackage', 'capacitors.0.count', 'manualLines.0.description', 'manualLines.0.quantityPerUnit',
      ])
    }
  })

  it('an empty BOM has zero totals', () => {
    expect(buildBomLines({ buildQuantity: 1, sparesPercent: 0, positions: [] }).totals).toEqual({ lines: 0, pieces: 0, extendedPrice: 0, unpricedLines: 0, otherCurrencyLines: 0 })
  })

  it('buildBomSnapshot carries the header, build quantity, spares and currency', () => {
    const s = buildBomSnapshot(snapshotHeader(), demoInput())
    expect(s).toMatchObject({ designName: 'Harbour crane hoist 400 kW', buildQuantity: 10, sparesPercent: 5, currency: 'EUR' })
    expect(s.totals.extendedPrice).toBe(28443.7)
  })
})
