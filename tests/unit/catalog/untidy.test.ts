// The untidy supplier sheet (tests/fixtures/catalog/untidy.ts) goes from file to parts without editing:
// header row found, title / blank / notes rows skipped with a note, exact repeat skipped, conflicting
// repeat refused naming both rows, decimal commas per column, units in cells, currency from "Price €",
// supplier words for kinds, configurations and lifecycles mapped to ours.
import { describe, expect, it } from 'vitest'
import { readCatalogFile } from '../../../server/catalog/read'
import { suggestMapping } from '../../../shared/catalog/mapping'
import { validateRows } from '../../../shared/catalog/validate'
import { cellDecimalMark, currencyInHeader, decimalMarkOf, detectDecimalSeparators, suggestValue } from '../../../shared/catalog/values'
import { COLUMN_BY_KEY } from '../../../catalog/columns'
import { workbookBuffer } from '../../fixtures/catalog/workbooks'
import { UNTIDY_HEADERS, untidyRows } from '../../fixtures/catalog/untidy'

async function readUntidy(headerRow?: number) {
  const buffer = await workbookBuffer([{ name: 'Price list', rows: untidyRows('U') }])
  return readCatalogFile(buffer, 'supplier.xlsx', headerRow ? { headerRow } : {})
}

function suggestedValueMapping(unknown: { field: string, value: string, suggestion: string | null }[]) {
  const out: Record<string, Record<string, string>> = {}
  for (const u of unknown) if (u.suggestion) (out[u.field] ??= {})[u.value.toLowerCase()] = u.suggestion
  return out
}

describe('an untidy supplier sheet', () => {
  it('finds the header row below a title and a blank row, and notes every skipped row', async () => {
    const table = await readUntidy()
    expect(table.errors).toEqual([])
    expect(table.headerRowNumber).toBe(3)
    expect(table.headers).toEqual(UNTIDY_HEADERS)
    expect(table.rows.map(r => r.rowNumber)).toEqual([4, 5, 6, 8, 9, 10, 11])
    expect(table.skipped).toEqual([
      { rowNumber: 1, reason: 'above-header', text: 'Norvale Semiconductor — price list Q3 (confidential)' },
      { rowNumber: 7, reason: 'blank', text: '' },
      { rowNumber: 13, reason: 'notes', text: 'Prices in EUR per piece, valid until further notice.' },
      { rowNumber: 14, reason: 'notes', text: '* lead times are factory lead times' },
    ])
    const warnings = table.warnings.map(w => w.message).join('\n')
    expect(warnings).toMatch(/headers were found on row 3; row 1 above it was skipped/)
    expect(warnings).toMatch(/rows 13–14 below the parts look like notes and were skipped/)
    // The best header candidate is row 3; the title row names no column.
    expect(table.headerCandidates.find(c => c.rowNumber === 3)!.score).toBeGreaterThan(15)
    expect(table.headerCandidates.find(c => c.rowNumber === 1)!.score).toBe(0)
  })

  it('lets the user choose another header row, and says when the chosen row is empty', async () => {
    const chosen = await readUntidy(4)
    expect(chosen.headerRowNumber).toBe(4)
    expect(chosen.skipped.filter(s => s.reason === 'above-header').map(s => s.rowNumber)).toEqual([1, 3])
    const empty = await readUntidy(2)
    expect(empty.errors[0]!.message).toMatch(/row 2 is empty or not in the sheet/)
  })

  it('detects decimal commas per column, reads units in cells and takes the currency from "Price €"', async () => {
    const table = await readUntidy()
    const { mapping } = suggestMapping(table.headers)
    expect(mapping).toMatchObject({ partNumber: 0, manufacturer: 1, kind: 2, packageConfiguration: 3, priceBreaks: 20, currency: null })
    const separators = detectDecimalSeparators(table, mapping, '.')
    expect(separators.find(s => s.key === 'voltageRating')).toMatchObject({ separator: ',', source: 'cells' })
    expect(separators.find(s => s.key === 'priceBreaks')).toMatchObject({ separator: ',', source: 'cells' })
    // Stock holds whole numbers only: no evidence, the file's default stays.
    expect(separators.find(s => s.key === 'stock')).toMatchObject({ separator: '.', source: 'file' })
    const columnDecimalSeparators = Object.fromEntries(separators.map(s => [s.key, s.separator]))
    const first = validateRows(table, mapping, { decimalSeparator: '.', columnDecimalSeparators })
    expect(first.currencyFromHeader).toBe('EUR')
    // The kind words are not ours: refused until mapped, each with a suggestion.
    expect(first.unknownValues.map(u => `${u.field}:${u.value}→${u.suggestion}`).sort()).toEqual([
      'kind:IGBT module→switch-diode', 'kind:film capacitor→capacitor',
      'lifecycle:mass production→active', 'lifecycle:phase out→nrnd', 'packageConfiguration:2in1→half-bridge',
    ])
    const kindIssue = first.issues.find(i => i.field === 'kind')!
    expect(kindIssue).toMatchObject({ row: 4, column: 'C' })
    expect(kindIssue.message).toMatch(/Kind: unknown value 'IGBT module'.*it looks like 'switch-diode'/)

    const result = validateRows(table, mapping, { decimalSeparator: '.', columnDecimalSeparators, valueMapping: suggestedValueMapping(first.unknownValues) })
    expect(result.parts.map(p => p.partNumber)).toEqual(['U-HB', 'U-SW', 'U-D', 'U-C'])
    const [hb, sw, d, c] = result.parts
    expect(hb).toMatchObject({ kind: 'switch-diode', packageConfiguration: 'half-bridge', voltageRating: 1200, currentRating: 450, switchThresholdVoltage: 0.85, currency: 'EUR', leadTimeDays: 56, lifecycle: 'active' })
    expect(hb!.switchSlopeResistance).toBeCloseTo(2.1e-3, 12)
    expect(hb!.rthJunctionCaseSwitch).toBeCloseTo(0.065, 12)
    expect(hb!.priceBreaks).toEqual([{ minQuantity: 1, unitPrice: 182 }, { minQuantity: 10, unitPrice: 169.5 }])
    // Optional figures stay optional: no diode data, no Rth(c-h).
    expect(sw).toMatchObject({ kind: 'switch-diode', packageConfiguration: 'half-bridge', voltageRating: 1700 })
    expect(sw!.diodeThresholdVoltage).toBeUndefined()
    expect(sw!.rthCaseHeatsink).toBeUndefined()
    expect(d).toMatchObject({ kind: 'diode', voltageRating: 3300, lifecycle: 'nrnd' })
    expect(c!.capacitance).toBeCloseTo(500e-6, 15)
    expect(c!.priceBreaks).toEqual([{ minQuantity: 1, unitPrice: 48 }, { minQuantity: 50, unitPrice: 43.5 }])
    // Row 9 repeats row 4: skipped, reported as a warning, not refused.
    expect(result.duplicatesSkipped).toEqual([{ rowNumber: 9, sameAs: 4 }])
    expect(result.issues.find(i => i.row === 9)).toMatchObject({ severity: 'warning', message: 'repeats row 4 exactly; skipped' })
    // Rows 10 and 11 differ: both refused, each naming the other.
    expect(result.refused.map(r => r.rowNumber)).toEqual([10, 11])
    expect(result.refused[0]!.reasons).toEqual(['duplicate: Kestrel Capacitors U-X is also on row 11 with other values: keep one'])
    expect(result.rowsWithErrors).toBe(2)
    expect(result.issueCount).toBe(3)
    expect(result.carried).toContain('currency')
    expect(result.carried).not.toContain('rthCaseHeatsink')
  })

  it('lets a constant stand for a missing column, and a chosen column separator win', async () => {
    const table = await readUntidy()
    const { mapping } = suggestMapping(table.headers)
    const noMaker = { ...mapping, manufacturer: null }
    const r = validateRows(table, noMaker, { decimalSeparator: ',', constants: { manufacturer: 'Norvale Semiconductor', currency: 'USD' }, valueMapping: { kind: { 'igbt module': 'switch-diode', 'rectifier diode': 'diode', 'film capacitor': 'capacitor' }, packageConfiguration: { '2in1': 'half-bridge' }, lifecycle: { 'mass production': 'active', 'phase out': 'nrnd' } } })
    expect(r.parts.every(p => p.manufacturer === 'Norvale Semiconductor')).toBe(true)
    expect(r.parts[0]!.currency).toBe('USD')
    expect(r.currencyFromHeader).toBeNull()
    // Reading the voltage column with '.' (chosen) turns '1,2 kV' into a refusal naming the mark… except that a
    // value with its unit typed in carries its own unambiguous mark, so it still reads.
    const chosen = validateRows(table, mapping, { decimalSeparator: ',', columnDecimalSeparators: { stock: '.' } })
    expect(chosen.issues.some(i => i.field === 'voltageRating')).toBe(false)
  })

  it('flags every unmapped required column at once', () => {
    const table = { headers: ['Part', 'Maker', 'Kind'], headerRowNumber: 1, rows: [{ rowNumber: 2, cells: ['A-1', 'M', 'switch-diode'] }, { rowNumber: 3, cells: ['A-2', 'M', 'capacitor'] }] }
    const r = validateRows(table, suggestMapping(table.headers).mapping, { decimalSeparator: '.' })
    const headerIssues = r.issues.filter(i => i.row === 1).map(i => i.field)
    expect(headerIssues).toEqual(expect.arrayContaining(['voltageRating', 'currentRating', 'packageConfiguration', 'switchThresholdVoltage', 'capacitance', 'rippleCurrentRating']))
    expect(r.issues.find(i => i.field === 'voltageRating')!.message).toBe(`'${COLUMN_BY_KEY.voltageRating.header}' is required for switch-diode, capacitor parts but no uploaded column is mapped to it`)
    expect(r.refused.map(x => x.rowNumber)).toEqual([2, 3])
  })
})

describe('value helpers', () => {
  it('reads a currency from a header', () => {
    expect(currencyInHeader('Price €')).toBe('EUR')
    expect(currencyInHeader('Unit price [USD]')).toBe('USD')
    expect(currencyInHeader('Preis (CHF)')).toBe('CHF')
    expect(currencyInHeader('Price')).toBeNull()
    expect(currencyInHeader('Used in')).toBeNull()
  })

  it('tells unambiguous decimal marks from thousands groups', () => {
    expect(decimalMarkOf('2,1')).toBe(',')
    expect(decimalMarkOf('0,065')).toBe(',')
    expect(decimalMarkOf('1.5')).toBe('.')
    expect(decimalMarkOf('1,234.5')).toBe('.')
    expect(decimalMarkOf('1.234,5')).toBe(',')
    expect(decimalMarkOf('1,234')).toBeNull()
    expect(decimalMarkOf('1200')).toBeNull()
    expect(cellDecimalMark('2,1 mΩ')).toBe(',')
    expect(cellDecimalMark('2,1')).toBeNull() // no unit: the column decides
  })

  it('suggests our value for supplier words', () => {
    expect(suggestValue(COLUMN_BY_KEY.kind, 'IGBT module')).toBe('switch-diode')
    expect(suggestValue(COLUMN_BY_KEY.kind, 'IGBT only')).toBe('switch')
    expect(suggestValue(COLUMN_BY_KEY.packageConfiguration, '6in1')).toBe('six-pack')
    expect(suggestValue(COLUMN_BY_KEY.lifecycle, 'Not for new designs')).toBe('nrnd')
    expect(suggestValue(COLUMN_BY_KEY.kind, 'zzz')).toBeNull()
  })
})
