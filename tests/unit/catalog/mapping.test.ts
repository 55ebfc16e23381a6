// Header mapping: suggestions for an untidy, real-world-looking header set, and applying a mapping.
import { describe, expect, it } from 'vitest'
import { buildTemplateRows, CATALOG_COLUMNS } from '../../../catalog/columns'
import { applyMapping, checkMapping, columnLetter, normaliseHeader, similarity, suggestMapping } from '../../../shared/catalog/mapping'

describe('column letters and header normalising', () => {
  it('numbers columns like a spreadsheet', () => {
    expect([0, 1, 25, 26, 27, 51, 52, 701, 702].map(columnLetter)).toEqual(['A', 'B', 'Z', 'AA', 'AB', 'AZ', 'BA', 'ZZ', 'AAA'])
  })

  it('drops units in brackets but keeps subscripts', () => {
    expect(normaliseHeader('VCES [V]')).toBe('vces')
    expect(normaliseHeader('Eon (mJ)')).toBe('eon')
    expect(normaliseHeader('Rth(j-c) IGBT')).toBe('rth j c igbt')
    expect(normaliseHeader('  Part #  ')).toBe('part number')
    expect(normaliseHeader('rCE (mOhm)')).toBe('r ce')
    expect(normaliseHeader('Capacitance, µF')).toBe('capacitance')
    expect(normaliseHeader('partNumber')).toBe('part number')
  })

  it('similarity is 1 for equal strings and low for unrelated ones', () => {
    expect(similarity('manufacturer', 'manufacturer')).toBe(1)
    expect(similarity('manufacturer', 'manufacturers')).toBeGreaterThan(0.9)
    expect(similarity('stock', 'capacitance')).toBeLessThan(0.2)
  })
})

describe('suggestMapping', () => {
  it('maps the template header exactly', () => {
    const { mapping, suggestions } = suggestMapping(buildTemplateRows().header)
    CATALOG_COLUMNS.forEach((c, i) => expect(mapping[c.key], c.key).toBe(i))
    expect(suggestions.every(s => s.score === 1 && s.reason === 'label')).toBe(true)
  })

  it('maps an untidy distributor export', () => {
    const headers = [
      'MPN', 'Mfr.', 'Type', 'Config', 'VCES [V]', 'Ic nom (A)', 'Vce0', 'rCE (mOhm)', 'VF0', 'rF',
      'Eon (mJ)', 'E_off [mJ]', 'Erec (mJ)', 'Vcc test', 'Rth(j-c) IGBT', 'Rth(j-c) Diode', 'Rth(c-h)',
      'Tvj op max', 'Price', 'Curr.', 'Min. order qty', 'Qty in stock', 'Lead time (weeks)', 'Status',
      'Distributor', 'Datasheet', 'Notes', 'Internal ID', 'I test',
    ]
    const { mapping, suggestions, unusedHeaders } = suggestMapping(headers)
    const expected: Record<string, string> = {
      partNumber: 'MPN', manufacturer: 'Mfr.', kind: 'Type', packageConfiguration: 'Config', voltageRating: 'VCES [V]',
      currentRating: 'Ic nom (A)', switchThresholdVoltage: 'Vce0', switchSlopeResistance: 'rCE (mOhm)',
      diodeThresholdVoltage: 'VF0', diodeSlopeResistance: 'rF', turnOnEnergy: 'Eon (mJ)', turnOffEnergy: 'E_off [mJ]',
      recoveryEnergy: 'Erec (mJ)', energyReferenceVoltage: 'Vcc test', rthJunctionCaseSwitch: 'Rth(j-c) IGBT',
      rthJunctionCaseDiode: 'Rth(j-c) Diode', rthCaseHeatsink: 'Rth(c-h)', junctionTemperatureMax: 'Tvj op max',
      priceBreaks: 'Price', currency: 'Curr.', minimumOrderQuantity: 'Min. order qty', stock: 'Qty in stock',
      leadTimeDays: 'Lead time (weeks)', lifecycle: 'Status', supplier: 'Distributor', datasheetUrl: 'Datasheet',
      description: 'Notes', energyReferenceCurrent: 'I test',
    }
    for (const [key, header] of Object.entries(expected)) {
      expect(headers[mapping[key as keyof typeof mapping] ?? -1], key).toBe(header)
    }
    // Capacitor columns have no counterpart here.
    expect(mapping.capacitance).toBeNull()
    expect(mapping.rippleCurrentRating).toBeNull()
    expect(unusedHeaders.map(h => h.header)).toEqual(['Internal ID'])
    // Units named in headers are reported so the preview can say "read as mJ / weeks / mΩ".
    const scale = (key: string) => suggestions.find(s => s.key === key)?.headerUnitScale
    expect(scale('turnOnEnergy')).toBe(1e-3)
    expect(scale('switchSlopeResistance')).toBe(1e-3)
    expect(scale('leadTimeDays')).toBe(7)
    expect(scale('voltageRating')).toBeUndefined()
  })

  it('gives each uploaded header to one column only, the surest first', () => {
    const { mapping } = suggestMapping(['Manufacturer part number', 'Manufacturer'])
    expect(mapping.partNumber).toBe(0)
    expect(mapping.manufacturer).toBe(1)
  })

  it('suggests nothing for unrelated headers', () => {
    const { mapping } = suggestMapping(['Colour', 'Weight', 'Shelf'])
    expect(Object.values(mapping).every(v => v === null)).toBe(true)
  })
})

describe('applying and checking a mapping', () => {
  it('picks mapped cells with their column letters', () => {
    const table = { rows: [{ rowNumber: 7, cells: ['X1', 'Acme', 1200] }] }
    const rows = applyMapping(table, { partNumber: 0, voltageRating: 2, manufacturer: null })
    expect(rows).toEqual([{ rowNumber: 7, cells: { partNumber: { value: 'X1', column: 'A' }, voltageRating: { value: 1200, column: 'C' } } }])
  })

  it('reports a column used twice or outside the sheet', () => {
    const problems = checkMapping({ partNumber: 0, manufacturer: 0, voltageRating: 9 }, ['a', 'b'])
    expect(problems.map(p => p.field)).toEqual(['manufacturer', 'voltageRating'])
    expect(problems[0]!.message).toMatch(/column A \('a'\) is mapped to both 'partNumber' and 'manufacturer'/)
    expect(problems[1]!.message).toMatch(/column 9, which the sheet does not have/)
  })
})
