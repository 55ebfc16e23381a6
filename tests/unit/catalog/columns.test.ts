// The column definition drives the template, mapping and validation: check they agree.
import { describe, expect, it } from 'vitest'
import { buildTemplateRows, CATALOG_COLUMNS, describeColumns, isUnitsRow, PACKAGE_CONFIGURATIONS, PART_KINDS, unitsRowLabel } from '../../../catalog/columns'
import { suggestMapping } from '../../../shared/catalog/mapping'
import { UNIT_SPECS } from '../../../shared/catalog/units'
import { validateRows } from '../../../shared/catalog/validate'

describe('catalogue columns', () => {
  it('has unique keys, headers and a known unit for every number column', () => {
    expect(new Set(CATALOG_COLUMNS.map(c => c.key)).size).toBe(CATALOG_COLUMNS.length)
    expect(new Set(CATALOG_COLUMNS.map(c => c.header.toLowerCase())).size).toBe(CATALOG_COLUMNS.length)
    for (const c of CATALOG_COLUMNS) {
      if (c.type === 'number') expect(UNIT_SPECS[c.unit], c.key).toBeDefined()
      if (c.type === 'enum') expect(c.values?.length, c.key).toBeGreaterThan(0)
      for (const alias of Object.values(c.valueAliases ?? {})) expect(c.values, `${c.key} alias → ${alias}`).toContain(alias)
    }
  })

  it('every configuration allows at least one kind and covers at least one position', () => {
    for (const [id, cfg] of Object.entries(PACKAGE_CONFIGURATIONS)) {
      expect(cfg.kinds.length, id).toBeGreaterThan(0)
      expect(cfg.switches + cfg.diodes + cfg.clampDiodes, id).toBeGreaterThan(0)
    }
  })

  it('builds header, units and one example row per kind of equal width', () => {
    const t = buildTemplateRows()
    expect(t.header).toEqual(CATALOG_COLUMNS.map(c => c.header))
    expect(t.units).toEqual(CATALOG_COLUMNS.map(unitsRowLabel))
    expect(t.units[t.header.indexOf('Voltage rating')]).toBe('V')
    expect(t.units[t.header.indexOf('Turn-on energy Eon')]).toBe('J')
    expect(t.examples).toHaveLength(PART_KINDS.length)
    for (const row of t.examples) expect(row).toHaveLength(CATALOG_COLUMNS.length)
    expect(isUnitsRow(t.units)).toBe(true)
    expect(isUnitsRow(t.examples[0]!)).toBe(false)
  })

  it('describes every column for the guide sheet', () => {
    const guide = describeColumns()
    expect(guide).toHaveLength(CATALOG_COLUMNS.length)
    expect(guide[0]).toMatchObject({ header: 'Part number', requiredFor: 'all' })
    expect(guide.find(g => g.header === 'Turn-on energy Eon')).toMatchObject({ unit: 'J', requiredFor: 'switch-diode, switch', allowedValues: '0…100 J' })
    expect(guide.find(g => g.header === 'Lifecycle')).toMatchObject({ requiredFor: 'none', allowedValues: 'active, nrnd, obsolete' })
  })

  it('example rows fill every required cell and validate (apart from being examples)', () => {
    const t = buildTemplateRows()
    const table = { headers: t.header, headerRowNumber: 1, rows: t.examples.map((cells, i) => ({ rowNumber: i + 3, cells })) }
    const { mapping } = suggestMapping(t.header)
    const result = validateRows(table, mapping, { decimalSeparator: '.' })
    // The only complaint: each row is the template's example and must be deleted.
    expect(result.issues.map(i => [i.row, i.field])).toEqual([[3, 'partNumber'], [4, 'partNumber'], [5, 'partNumber'], [6, 'partNumber']])
    expect(result.issues[0]!.message).toMatch(/template's example row: delete it/)
    const renamed = { ...table, rows: table.rows.map(r => ({ ...r, cells: [`X-${r.rowNumber}`, ...r.cells.slice(1)] })) }
    const ok = validateRows(renamed, mapping, { decimalSeparator: '.' })
    expect(ok.issues).toEqual([])
    expect(ok.parts.map(p => p.kind)).toEqual([...PART_KINDS])
    expect(ok.parts[0]!.turnOnEnergy).toBeCloseTo(0.045, 12)
    expect(ok.parts[1]!.voltageRating).toBe(1700)
    expect(ok.parts[1]!.leadTimeDays).toBe(112)
    expect(ok.parts[3]!.capacitance).toBeCloseTo(500e-6, 15)
  })
})
