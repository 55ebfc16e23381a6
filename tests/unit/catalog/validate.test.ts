// Validation of mapped rows: every kind of bad cell is named by row, column letter and field.
import { describe, expect, it } from 'vitest'
import { buildTemplateRows, CATALOG_COLUMNS, type ColumnKey } from '../../../catalog/columns'
import { columnLetter, suggestMapping } from '../../../shared/catalog/mapping'
import type { CellValue } from '../../../shared/catalog/types'
import { validateRows } from '../../../shared/catalog/validate'

const template = buildTemplateRows()
const headers = template.header
const { mapping } = suggestMapping(headers)
const col = (key: ColumnKey) => CATALOG_COLUMNS.findIndex(c => c.key === key)
const letter = (key: ColumnKey) => columnLetter(col(key))

/** A valid row of the given kind (template example, renamed), with some cells changed. */
function row(kindIndex: number, partNumber: string, changes: Partial<Record<ColumnKey, CellValue>> = {}): CellValue[] {
  const cells = [...template.examples[kindIndex]!]
  cells[0] = partNumber
  for (const [key, value] of Object.entries(changes)) cells[col(key as ColumnKey)] = value
  return cells
}

function validate(rows: CellValue[][], opts: { decimalSeparator: '.' | ',', maxIssues?: number } = { decimalSeparator: '.' }, map = mapping, hdrs = headers) {
  return validateRows({ headers: hdrs, headerRowNumber: 1, rows: rows.map((cells, i) => ({ rowNumber: i + 3, cells })) }, map, opts)
}

describe('validateRows: good rows', () => {
  it('turns a row into a part in SI units', () => {
    const result = validate([row(0, 'HB-1', { lifecycle: 'EOL', kind: 'IGBT + diode', leadTimeDays: '8 weeks' })])
    expect(result.issues).toEqual([])
    expect(result.parts).toHaveLength(1)
    const p = result.parts[0]!
    expect(p).toMatchObject({
      partNumber: 'HB-1', manufacturer: 'Example Semiconductor', kind: 'switch-diode', packageConfiguration: 'half-bridge',
      voltageRating: 1200, currentRating: 450, switchThresholdVoltage: 0.85, lifecycle: 'nrnd', currency: 'EUR', leadTimeDays: 56, sourceRow: 3,
    })
    expect(p.switchSlopeResistance).toBeCloseTo(2.1e-3, 12)
    expect(p.turnOffEnergy).toBeCloseTo(0.055, 12)
    expect(p.priceBreaks).toEqual([{ minQuantity: 1, unitPrice: 182 }, { minQuantity: 10, unitPrice: 169.5 }, { minQuantity: 100, unitPrice: 151 }])
  })

  it('reads decimal commas when chosen', () => {
    const result = validate([row(3, 'C-1', { voltageRating: '1,1 kV', esr: '1,2 mΩ', priceBreaks: '1:48,00; 50:43,50' })], { decimalSeparator: ',' })
    expect(result.issues).toEqual([])
    expect(result.parts[0]!.voltageRating).toBe(1100)
    expect(result.parts[0]!.esr).toBeCloseTo(1.2e-3, 12)
    expect(result.parts[0]!.packageConfiguration).toBe('single')
  })

  it('reads bare numbers in the unit the header names', () => {
    const hdrs = [...headers]
    hdrs[col('turnOnEnergy')] = 'Eon (mJ)'
    const result = validate([row(0, 'HB-2', { turnOnEnergy: 45 })], { decimalSeparator: '.' }, mapping, hdrs)
    expect(result.issues).toEqual([])
    expect(result.parts[0]!.turnOnEnergy).toBeCloseTo(0.045, 12)
  })

  it('leaves optional cells out and defaults the lifecycle to active', () => {
    const result = validate([row(2, 'D-1', { lifecycle: null, priceBreaks: null, currency: null, stock: null, datasheetUrl: null, supplier: null })])
    expect(result.issues).toEqual([])
    expect(result.parts[0]!.lifecycle).toBe('active')
    expect(result.parts[0]!.priceBreaks).toEqual([])
    expect(result.parts[0]).not.toHaveProperty('stock')
  })
})

describe('validateRows: every bad cell explained', () => {
  const cases: { name: string, cells: CellValue[], field: ColumnKey, message: RegExp }[] = [
    { name: 'required cell missing for the kind', cells: row(0, 'E1', { turnOnEnergy: null }), field: 'turnOnEnergy', message: /Turn-on energy Eon is required for switch-diode parts and is empty \(unit J\)/ },
    { name: 'capacitor without capacitance', cells: row(3, 'E2', { capacitance: '' }), field: 'capacitance', message: /Capacitance is required for capacitor parts/ },
    { name: 'wrong unit', cells: row(0, 'E3', { voltageRating: '12 A' }), field: 'voltageRating', message: /Voltage rating: expected a voltage like '1200 V' or '1\.2 kV', got '12 A' \(a current\)/ },
    { name: 'unknown unit', cells: row(0, 'E4', { rthJunctionCaseSwitch: '0.065 K/Wx' }), field: 'rthJunctionCaseSwitch', message: /unit 'K\/Wx' not recognised/ },
    { name: 'negative number', cells: row(0, 'E5', { stock: -5 }), field: 'stock', message: /Stock: must not be negative, got -5/ },
    { name: 'negative threshold voltage', cells: row(0, 'E6', { switchThresholdVoltage: '−0.5 V' }), field: 'switchThresholdVoltage', message: /must not be negative, got -0\.5 V/ },
    { name: 'implausible magnitude', cells: row(0, 'E7', { turnOnEnergy: '45 MJ' }), field: 'turnOnEnergy', message: /45000000 J is outside the plausible range 0…100 J; check the unit/ },
    { name: 'not a whole number', cells: row(0, 'E8', { minimumOrderQuantity: 2.5 }), field: 'minimumOrderQuantity', message: /MOQ: must be a whole number, got 2\.5/ },
    { name: 'unknown kind', cells: row(0, 'E9', { kind: 'transistor' }), field: 'kind', message: /Kind: unknown value 'transistor'; expected one of: switch-diode, switch, diode, capacitor/ },
    { name: 'empty kind', cells: row(0, 'E10', { kind: '' }), field: 'kind', message: /Kind is empty/ },
    { name: 'unknown lifecycle', cells: row(0, 'E11', { lifecycle: 'retired' }), field: 'lifecycle', message: /Lifecycle: unknown value 'retired'; expected one of: active, nrnd, obsolete/ },
    { name: 'unknown configuration', cells: row(0, 'E12', { packageConfiguration: 'quad' }), field: 'packageConfiguration', message: /unknown value 'quad'/ },
    { name: 'configuration not for the kind', cells: row(2, 'E13', { packageConfiguration: 'six-pack' }), field: 'packageConfiguration', message: /'six-pack' is not a package for diode parts; it fits 'switch-diode', 'switch'/ },
    { name: 'capacitor in a module', cells: row(3, 'E14', { packageConfiguration: 'half-bridge' }), field: 'packageConfiguration', message: /capacitors are single parts/ },
    { name: 'price break format', cells: row(0, 'E15', { priceBreaks: '1-12.50; 100-10.80' }), field: 'priceBreaks', message: /Unit price breaks: '1-12\.50' has no ':' between quantity and price/ },
    { name: 'price breaks not ascending', cells: row(0, 'E16', { priceBreaks: '100:10; 10:12' }), field: 'priceBreaks', message: /quantities must increase/ },
    { name: 'price with currency sign', cells: row(0, 'E17', { priceBreaks: '€ 12.50' }), field: 'priceBreaks', message: /currency goes in the Currency column/ },
    { name: 'prices without currency', cells: row(0, 'E18', { currency: null }), field: 'currency', message: /Currency is required when prices are given/ },
    { name: 'unknown currency', cells: row(0, 'E19', { currency: 'Euros' }), field: 'currency', message: /unknown value 'Euros'/ },
    { name: 'URL with another scheme', cells: row(0, 'E20', { datasheetUrl: 'ftp://files.example/x.pdf' }), field: 'datasheetUrl', message: /must start with https:\/\/ or http:\/\// },
    { name: 'script URL', cells: row(0, 'E21', { datasheetUrl: 'javascript:alert(1)' }), field: 'datasheetUrl', message: /must start with https:\/\// },
    { name: 'not a URL', cells: row(0, 'E22', { datasheetUrl: 'see shared drive' }), field: 'datasheetUrl', message: /'see shared drive' is not a web link/ },
    { name: 'test voltage above the rating', cells: row(0, 'E23', { energyReferenceVoltage: 1500 }), field: 'energyReferenceVoltage', message: /Energy test voltage 1500 V is above the voltage rating 1200 V/ },
    { name: 'text too long', cells: row(0, 'E24', { manufacturer: 'x'.repeat(250) }), field: 'manufacturer', message: /250 characters long; at most 200/ },
    { name: 'lead time in months', cells: row(0, 'E25', { leadTimeDays: '3 months' }), field: 'leadTimeDays', message: /expected a duration like '84 d' or '12 weeks'/ },
    { name: 'template example left in', cells: row(0, 'EXAMPLE-HB12-450'), field: 'partNumber', message: /template's example row: delete it/ },
  ]
  it.each(cases)('$name', ({ cells, field, message }) => {
    const result = validate([cells])
    expect(result.parts).toEqual([])
    expect(result.rowsWithErrors).toBe(1)
    const issue = result.issues.find(i => i.field === field)
    expect(issue, JSON.stringify(result.issues)).toBeDefined()
    expect(issue!.message).toMatch(message)
    expect(issue!.row).toBe(3)
    expect(issue!.column).toBe(letter(field))
    expect(issue!.severity).toBe('error')
  })

  it('lists every bad cell of a row, not only the first', () => {
    const result = validate([row(0, 'M1', { voltageRating: 'abc', currentRating: -3, lifecycle: 'gone' })])
    expect(result.issues.map(i => i.field).sort()).toEqual(['currentRating', 'lifecycle', 'voltageRating'])
  })

  it('keeps good rows when others are bad', () => {
    const result = validate([row(0, 'G1'), row(0, 'B1', { voltageRating: 'x' }), row(2, 'G2')])
    expect(result.parts.map(p => p.partNumber)).toEqual(['G1', 'G2'])
    expect(result.rowsRead).toBe(3)
    expect(result.rowsWithErrors).toBe(1)
    expect(result.issues[0]!.row).toBe(4)
  })

  it('refuses both rows of a duplicate and names each other', () => {
    const result = validate([row(0, 'DUP-1'), row(1, 'X'), row(0, 'dup-1 ')])
    expect(result.parts.map(p => p.partNumber)).toEqual(['X'])
    const messages = result.issues.map(i => `${i.row}: ${i.message}`)
    expect(messages).toContain('5: duplicate: Example Semiconductor dup-1 is also on row 3 with other values: keep one')
    expect(messages).toContain('3: duplicate: Example Semiconductor dup-1 is also on row 5 with other values: keep one')
    expect(result.refused.map(r => r.rowNumber)).toEqual([3, 5])
  })

  it('reports an unmapped required column once, on the header row', () => {
    const partial = { ...mapping, turnOnEnergy: null }
    const result = validate([row(0, 'U1'), row(0, 'U2'), row(2, 'U3')], { decimalSeparator: '.' }, partial)
    const unmapped = result.issues.filter(i => i.field === 'turnOnEnergy')
    expect(unmapped).toHaveLength(1)
    expect(unmapped[0]).toMatchObject({ row: 1, column: '', message: '\'Turn-on energy Eon\' is required for switch-diode parts but no uploaded column is mapped to it' })
    expect(result.parts.map(p => p.partNumber)).toEqual(['U3'])
  })

  it('reports an unmapped kind column', () => {
    const result = validate([row(0, 'K1')], { decimalSeparator: '.' }, { ...mapping, kind: null })
    expect(result.parts).toEqual([])
    expect(result.issues[0]).toMatchObject({ row: 1, field: 'kind' })
  })

  it('caps the list of issues but counts every bad row', () => {
    const rows = Array.from({ length: 30 }, (_, i) => row(0, `T${i}`, { voltageRating: 'bad' }))
    const result = validate(rows, { decimalSeparator: '.', maxIssues: 10 })
    expect(result.issues).toHaveLength(10)
    expect(result.truncated).toBe(true)
    expect(result.rowsWithErrors).toBe(30)
  })
})
