// Catalogue speed figures: importing a 20 000-row .xlsx (read + map + validate) and matching every
// position of a five-level diode-clamped design against 20 000 parts.
// Run alone with `npx tsx scripts/bench/catalog.ts`.

import { performance } from 'node:perf_hooks'
import ExcelJS from 'exceljs'
import { buildTemplateRows } from '../../catalog/columns'
import { DEMO_PARTS } from '../../catalog/demo-parts'
import { readCatalogFile } from '../../server/catalog/read'
import { partToRow } from '../../shared/catalog/format'
import { suggestMapping } from '../../shared/catalog/mapping'
import { indexParts, matchPosition, positionDutyFromCapacitor, positionDutyFromDevice, type MatchPolicy, type PositionDuty } from '../../shared/catalog/matching'
import { evaluateDesign } from '../../shared/engine'
import type { CatalogPart } from '../../shared/catalog/types'
import { validateRows } from '../../shared/catalog/validate'
import { percentile } from './support'

export interface BenchFigure { name: string, p50Ms: number, p99Ms: number, runs: number, target?: string }

const PART_COUNT = 20_000

/** 20 000 distinct parts: the demo catalogue repeated with new part numbers and slightly varied figures. */
export function manyParts(count = PART_COUNT): CatalogPart[] {
  const parts: CatalogPart[] = []
  for (let i = 0; i < count; i++) {
    const base = DEMO_PARTS[i % DEMO_PARTS.length]!
    const variant = Math.floor(i / DEMO_PARTS.length)
    const f = 1 + ((variant % 7) - 3) * 0.02
    parts.push({
      ...base,
      partNumber: `${base.partNumber}-V${variant}`,
      ...(base.currentRating !== undefined ? { currentRating: Math.round(base.currentRating * f) } : {}),
      ...(base.switchSlopeResistance !== undefined ? { switchSlopeResistance: Number((base.switchSlopeResistance / f).toPrecision(3)) } : {}),
      priceBreaks: base.priceBreaks.map(b => ({ ...b, unitPrice: Math.round(b.unitPrice * f * 100) / 100 })),
    })
  }
  return parts
}

/** The template with 20 000 part rows, as an .xlsx buffer. */
export async function manyPartsWorkbook(parts: CatalogPart[]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook()
  const ws = wb.addWorksheet('Parts')
  const t = buildTemplateRows()
  ws.addRow(t.header)
  ws.addRow(t.units)
  for (const part of parts) ws.addRow(partToRow(part))
  return Buffer.from(await wb.xlsx.writeBuffer())
}

/** A five-level diode-clamped drive (4.16 kV, 300 A, V_dc 6 kV), motoring and braking: the catalogue benches' design. */
export const FIVE_LEVEL_DRIVE = {
  topology: 'diode-clamped' as const, levels: 5, dcVoltage: 6000, dcVoltageMax: 6600, switchingHz: 1000, modulation: 'space-vector' as const, overshootVoltage: 100,
  operatingPoints: [
    { name: 'Rated', lineVoltageRms: 4160, phaseCurrentRms: 300, powerFactor: 0.88, fundamentalHz: 50 },
    { name: 'Braking', lineVoltageRms: 4160, phaseCurrentRms: 250, powerFactor: -0.85, fundamentalHz: 50 },
  ],
}

/** Every position of FIVE_LEVEL_DRIVE as the engine rates it. */
export function fiveLevelDuties(): PositionDuty[] {
  const converter = FIVE_LEVEL_DRIVE
  const result = evaluateDesign({ machineSide: converter })
  const envelope = result.converters[0]!.envelope
  const ctx = { switchingHz: converter.switchingHz, topology: converter.topology, levels: converter.levels }
  return [
    ...envelope.devices.map(d => positionDutyFromDevice(d, ctx)),
    ...envelope.capacitors.map(c => positionDutyFromCapacitor(c, ctx)),
  ]
}

async function time(runs: number, fn: () => unknown | Promise<unknown>): Promise<{ p50Ms: number, p99Ms: number }> {
  const samples: number[] = []
  for (let i = 0; i < runs; i++) {
    const start = performance.now()
    await fn()
    samples.push(performance.now() - start)
  }
  samples.sort((a, b) => a - b)
  return { p50Ms: percentile(samples, 50), p99Ms: percentile(samples, 99) }
}

export async function runCatalogBench(): Promise<BenchFigure[]> {
  const parts = manyParts()
  const workbook = await manyPartsWorkbook(parts)
  const importRuns = 5
  let imported = 0
  const importTimes = await time(importRuns, async () => {
    const table = await readCatalogFile(workbook, 'bench.xlsx')
    if (table.errors.length > 0) throw new Error(`bench workbook refused: ${table.errors[0]!.message}`)
    const { mapping } = suggestMapping(table.headers)
    const result = validateRows(table, mapping, { decimalSeparator: '.' })
    if (result.issues.length > 0) throw new Error(`bench rows refused: ${result.issues[0]!.message}`)
    imported = result.parts.length
  })
  if (imported !== PART_COUNT) throw new Error(`bench imported ${imported} parts, expected ${PART_COUNT}`)

  const duties = fiveLevelDuties()
  const policy: MatchPolicy = { heatsinkTemperatureC: 70, junctionMarginC: 15, buildQuantity: 10 }
  let candidates = 0
  const matchRuns = 30
  const matchTimes = await time(matchRuns, () => {
    candidates = 0
    // Index the catalogue once per design, as a route matching all positions would.
    const index = indexParts(parts)
    for (const duty of duties) candidates += matchPosition(duty, index, policy).candidates.length
  })
  if (candidates === 0) throw new Error('bench matching found no candidates')

  return [
    { name: `catalogue import: read + map + validate ${PART_COUNT} rows (.xlsx, ${(workbook.length / 1024 / 1024).toFixed(1)} MB)`, ...importTimes, runs: importRuns, target: '< 10 s' },
    { name: `part matching: ${duties.length} positions of a 5-level design × ${PART_COUNT} parts (${candidates} candidates)`, ...matchTimes, runs: matchRuns, target: '< 300 ms' },
  ]
}

// Run directly: print the figures.
if (import.meta.url === `file://${process.argv[1]}`) {
  runCatalogBench().then(figures => console.table(figures), (error) => {
    console.error(error)
    process.exit(1)
  })
}
