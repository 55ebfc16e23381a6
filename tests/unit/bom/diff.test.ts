// "What changed since the last release" and spreadsheet formula neutralisation.

import { describe, expect, it } from 'vitest'
import { buildBomSnapshot, diffBoms, neutraliseFormula } from '../../../shared/bom/build'
import { demoInput, demoSnapshot, positionFill, snapshotHeader } from './fixtures'

describe('diffBoms', () => {
  it('reports nothing between two identical releases', () => {
    expect(diffBoms(demoSnapshot(), demoSnapshot({ revision: 3 }))).toEqual([])
  })

  it('reports added, removed and changed lines with the fields that changed (worked by hand)', () => {
    const previous = demoSnapshot()
    const input = demoInput()
    // Outer switches move to a cheaper price list; the clamp diodes are dropped; a new fan line appears.
    input.positions = input.positions
      .filter(p => p.partNumber !== 'TV-FD06-100')
      .map(p => p.partNumber === 'ORS-IG12-150' ? { ...p, unitPriceBreaks: [{ quantity: 1, price: 80 }, { quantity: 50, price: 76 }] } : p)
    input.positions.push(positionFill({ side: 'grid', position: 'F1', kind: 'fan', partNumber: 'FAN-120', manufacturer: 'Brennholm in-house', description: 'Fan 120 mm', phases: 1, unitPriceBreaks: [] }))
    input.buildQuantity = 12 // every line's quantity changes with it
    const next = buildBomSnapshot(snapshotHeader({ revision: 3 }), input)

    const changes = diffBoms(previous, next)
    const byKey = Object.fromEntries(changes.map(c => [c.partNumber || c.description, c]))

    // ORS-IG12-150: 6/set × 12 = 72, spares ceil(3.6) = 4 → 76 at the 50 break, now 76.00 → 5776.00 (was 63 at 79.50 = 5008.50)
    const outer = byKey['ORS-IG12-150']!
    expect(outer.change).toBe('changed')
    expect(outer.fields).toEqual([
      { field: 'quantityBuild', previous: 60, next: 72 },
      { field: 'quantitySpares', previous: 3, next: 4 },
      { field: 'quantityOrder', previous: 63, next: 76 },
      { field: 'unitPrice', previous: 79.5, next: 76 },
      { field: 'extendedPrice', previous: 5008.5, next: 5776 },
    ])
    expect(outer.summary).toBe('Osprey Ridge Semiconductor ORS-IG12-150: qty for the build 60 pcs → 72 pcs; spares 3 pcs → 4 pcs; qty to order 63 pcs → 76 pcs; unit price 79.50 EUR → 76.00 EUR; extended price 5008.50 EUR → 5776.00 EUR')

    expect(byKey['FAN-120']).toMatchObject({ change: 'added', fields: [] })
    expect(byKey['TV-FD06-100']).toMatchObject({ change: 'removed', fields: [] })
    expect(changes.at(-1)!.change).toBe('removed')
    // Half-bridge modules: 3/set × 12 = 36 + ceil(1.8) = 2 → 38 < MOQ 40: the order stays 40, only build and spares change.
    expect(byKey['VSW-HB12-300']!.fields.map(f => f.field)).toEqual(['quantityBuild'])
    expect(changes.filter(c => c.change === 'changed')).toHaveLength(6)
  })

  it('matches manual lines by what they are, not by their number', () => {
    const previous = demoSnapshot()
    const input = demoInput()
    input.manualLines = [...input.manualLines!].reverse()
    const next = buildBomSnapshot(snapshotHeader(), input)
    expect(next.lines.at(-1)!.key).toBe('manual-2')
    expect(diffBoms(previous, next)).toEqual([])
  })

  it('reports a changed reference list (a part now fills one more position)', () => {
    const previous = demoSnapshot()
    const input = demoInput()
    input.positions.push(positionFill({ side: 'grid', position: 'S9', phases: 1 }))
    const changes = diffBoms(previous, buildBomSnapshot(snapshotHeader(), input))
    const refs = changes[0]!.fields.find(f => f.field === 'references')!
    expect(refs).toEqual({ field: 'references', previous: 'machine S1 (×3), machine S4 (×3)', next: 'machine S1 (×3), machine S4 (×3), grid S9' })
  })
})

describe('neutraliseFormula (OWASP CSV injection guidance)', () => {
  it.each([
    ['=1+1', '\'=1+1'],
    ['+49 30 123', '\'+49 30 123'],
    ['-2+3', '\'-2+3'],
    ['@SUM(A1:A2)', '\'@SUM(A1:A2)'],
    ['\t=1', '\'\t=1'],
    ['\r=1', '\'\r=1'],
    ['=HYPERLINK("http://example.invalid","x")', '\'=HYPERLINK("http://example.invalid","x")'],
    ['  =1+1', '\'  =1+1'],
    ['\n=1+1', '\'\n=1+1'],
    ['＝1+1', '\'＝1+1'],
  ])('%j → %j', (input, expected) => {
    expect(neutraliseFormula(input)).toBe(expected)
  })

  it.each(['IGBT 1200 V', 'ORS-IG12-150', 'a=b', '1200', '', '\'already quoted'])('leaves %j alone', (text) => {
    expect(neutraliseFormula(text)).toBe(text)
  })
})
