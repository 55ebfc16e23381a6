// One part identity (issue 15 item 3): partKey() and the places that key parts by it, import validation and the BOM.
// The database side (the parts.key index and the re-keying migration) is checked in tests/api/part-key.test.ts.
import { describe, expect, it } from 'vitest'
import { buildTemplateRows, CATALOG_COLUMNS, type ColumnKey } from '../../../catalog/columns'
import { suggestMapping } from '../../../shared/catalog/mapping'
import { partKey } from '../../../shared/catalog/part-key'
import type { CellValue } from '../../../shared/catalog/types'
import { validateRows } from '../../../shared/catalog/validate'
import { buildBomLines } from '../../../shared/bom/build'
import { diffBoms } from '../../../shared/bom/diff'
import { demoInput, demoSnapshot, positionFill } from '../bom/fixtures'

describe('partKey', () => {
  it.each([
    ['case', ['Osprey Ridge', 'ors-ig12-150'], ['OSPREY RIDGE', 'ORS-IG12-150']],
    ['blanks around and inside', ['  Osprey   Ridge ', ' ORS IG12 150 '], ['Osprey Ridge', 'ORSIG12150']],
    ['tabs, line breaks and no-break spaces', ['Osprey\t\u00a0Ridge', 'ORS\u3000IG12\n150'], ['Osprey Ridge', 'ORSIG12150']],
    ['full-width letters (NFKC)', ['Ｏｓｐｒｅｙ Ridge', 'ＯＲＳ-ＩＧ１２'], ['Osprey Ridge', 'ORS-IG12']],
    ['accented capitals', ['Électro Vénus', 'év-1'], ['ÉLECTRO VÉNUS', 'ÉV-1']],
  ])('one part spelled two ways is one key: %s', (_what, a, b) => {
    expect(partKey(a[0]!, a[1]!)).toBe(partKey(b[0]!, b[1]!))
  })

  it.each([
    ['the halves split differently', ['A|B', 'C'], ['A', 'B|C']],
    ['a backslash before the bar', ['A\\', 'B'], ['A', '\\B']],
    ['a blank between manufacturer words', ['Osprey Ridge', 'X1'], ['OspreyRidge', 'X1']],
    ['different part numbers', ['Osprey Ridge', 'X1'], ['Osprey Ridge', 'X2']],
    ['ß is not SS (the database maps one letter to one)', ['Straße Power', 'X1'], ['Strasse Power', 'X1']],
  ])('different parts keep different keys: %s', (_what, a, b) => {
    expect(partKey(a[0]!, a[1]!)).not.toBe(partKey(b[0]!, b[1]!))
  })

  it('reads as the BOM line keys always read for an ordinary part', () => {
    expect(partKey(' Osprey Ridge Semiconductor', 'ors-ig12-150 ')).toBe('OSPREY RIDGE SEMICONDUCTOR|ORS-IG12-150')
  })
})

describe('import validation keys rows by partKey', () => {
  const template = buildTemplateRows()
  const { mapping } = suggestMapping(template.header)
  const col = (key: ColumnKey) => CATALOG_COLUMNS.findIndex(c => c.key === key)
  const row = (manufacturer: string, partNumber: string, changes: Partial<Record<ColumnKey, CellValue>> = {}): CellValue[] => {
    const cells = [...template.examples[0]!]
    cells[col('manufacturer')] = manufacturer
    cells[col('partNumber')] = partNumber
    for (const [key, value] of Object.entries(changes)) cells[col(key as ColumnKey)] = value
    return cells
  }
  const validate = (rows: CellValue[][]) => validateRows({ headers: template.header, headerRowNumber: 1, rows: rows.map((cells, i) => ({ rowNumber: i + 3, cells })) }, mapping, { decimalSeparator: '.' })

  it('two spellings of one part with other values are both refused, naming each other', () => {
    const result = validate([row('Osprey Ridge', 'ORS-IG12-150'), row('OSPREY\u00a0 RIDGE', 'ＯＲＳ-IG12 -150', { stock: 7 })])
    expect(result.parts).toEqual([])
    expect(result.refused.map(r => r.rowNumber)).toEqual([3, 4])
    expect(result.issues.map(i => i.message).join('\n')).toContain('is also on row 3 with other values')
  })

  it('different parts in one file are kept apart', () => {
    const result = validate([row('Osprey Ridge', 'ORS-IG12-150'), row('Osprey Ridge', 'ORS-IG12-151'), row('OspreyRidge', 'ORS-IG12-150')])
    expect(result.parts).toHaveLength(3)
  })
})

describe('the BOM keys lines by partKey', () => {
  it('two positions naming one part in different spellings make one line', () => {
    const input = demoInput()
    input.positions = [
      positionFill({ position: 'S1' }),
      positionFill({ position: 'S4', manufacturer: ' osprey  ridge semiconductor', partNumber: 'ors-ig12-150' }),
    ]
    input.capacitors = []
    input.manualLines = []
    const { lines } = buildBomLines(input)
    expect(lines).toHaveLength(1)
    expect(lines[0]!.key).toBe(partKey('Osprey Ridge Semiconductor', 'ORS-IG12-150'))
    expect(lines[0]!.references).toHaveLength(2)
  })

  it('a release written with an older key of the same part is not shown as removed and added', () => {
    const previous = demoSnapshot()
    const next = demoSnapshot()
    // an older release kept the part number's inner blank in its key
    const line = previous.lines.find(l => !l.manual)!
    line.key = `${line.manufacturer.toUpperCase()}|${line.partNumber.replace('-', ' -').toUpperCase()}`
    line.partNumber = line.partNumber.replace('-', ' -')
    expect(diffBoms(previous, next).filter(c => c.change !== 'changed')).toEqual([])
  })
})
