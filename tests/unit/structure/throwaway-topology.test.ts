// "A topology is one file": a throw-away topology declared in tests/unit/structure/fixtures/series-pair-leg.ts and
// registered at run time reaches the form's choices, the API's input schema, the engine, the leg drawing, the
// design report and the BOM, with no edit anywhere else. The figures are checked against the two-level leg it
// doubles (first principles: devices in series carry one current and, statically balanced, share the voltage).

import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { evaluateDesign, legLayout, registerTopology, topologyById, topologyOptions, type ConverterInput, type DesignResult, type TopologyId } from '../../../shared/engine'
import { seriesPairLeg } from './fixtures/series-pair-leg'

const ID = seriesPairLeg.id
const SERIES_PAIR_POSITIONS = ['S1a', 'D1a', 'S1b', 'D1b', 'S2a', 'D2a', 'S2b', 'D2b']

function converter(topology: TopologyId): ConverterInput {
  return {
    topology,
    levels: 2,
    dcVoltage: 1100,
    dcVoltageMax: 1200,
    switchingHz: 3000,
    modulation: 'sine',
    overshootVoltage: 0,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 250, powerFactor: 0.9, fundamentalHz: 50 }],
  }
}

let unregister: () => void
let pair: DesignResult
let twoLevel: DesignResult

beforeAll(() => {
  unregister = registerTopology(seriesPairLeg)
  pair = evaluateDesign({ machineSide: converter(ID) })
  twoLevel = evaluateDesign({ machineSide: converter('two-level') })
})
afterAll(() => unregister())

describe('a throw-away topology from one file', () => {
  it('is offered by the form with its own level counts and modulations', () => {
    const offered = topologyOptions()
    expect(offered.map(o => o.id)).toContain(ID)
    expect(offered.find(o => o.id === ID)!.label).toBe('Series-pair test leg')
    expect(topologyById[ID]!.allowedLevels).toEqual([2])
    expect(topologyById[ID]!.modulations).toEqual(['sine', 'space-vector'])
  })

  it('passes the API\'s input schema once registered (the schema reads the registry when it is loaded)', async () => {
    const { converterInputSchema } = await import('../../../shared/schemas/stress')
    const parsed = converterInputSchema.safeParse(converter(ID))
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true)
    expect(converterInputSchema.safeParse(converter('no-such-leg' as TopologyId)).success).toBe(false)
  })

  it('is evaluated by the engine: each series device carries the two-level switch\'s current and blocks half its voltage', () => {
    const devices = pair.converters[0]!.envelope.devices
    expect(devices.map(d => d.name)).toEqual(SERIES_PAIR_POSITIONS)
    const ref = new Map(twoLevel.converters[0]!.envelope.devices.map(d => [d.name, d]))
    for (const d of devices) {
      const twin = ref.get(d.name.slice(0, 2))!
      expect(d.currentAvg).toBeCloseTo(twin.currentAvg, 9)
      expect(d.currentRms).toBeCloseTo(twin.currentRms, 9)
      expect(d.currentPeak).toBeCloseTo(twin.currentPeak, 9)
      // 1200 V worst-case link shared by two devices
      expect(d.blockingVoltage).toBeCloseTo(600, 9)
      expect(twin.blockingVoltage).toBeCloseTo(1200, 9)
    }
    const cap = pair.converters[0]!.envelope.capacitors.find(c => c.name === 'Cdc')!
    const refCap = twoLevel.converters[0]!.envelope.capacitors.find(c => c.name === 'Cdc')!
    expect(cap.rippleCurrentRms).toBeCloseTo(refCap.rippleCurrentRms, 9)
  })

  it('is drawn: the leg layout and the printable schematic name every position and the DC-link capacitor', async () => {
    const layout = legLayout(ID, 2)
    expect(layout.items.map(i => i.name)).toEqual(expect.arrayContaining([...SERIES_PAIR_POSITIONS, 'Cdc']))
    const { legSchematicSvg } = await import('../../../shared/drawing/leg-svg')
    const env = pair.converters[0]!.envelope
    const svg = legSchematicSvg(layout, { devices: env.devices, capacitors: env.capacitors })
    expect(svg.startsWith('<svg') || svg.startsWith('<?xml')).toBe(true)
    for (const name of [...SERIES_PAIR_POSITIONS, 'Cdc']) expect(svg, name).toContain(`>${name}`)
    expect(svg).toContain('600 V')
  })

  const pdftotext = '/usr/bin/pdftotext'
  it.skipIf(!existsSync(pdftotext))('is reported: the design report PDF carries its positions, drawn and tabled', async () => {
    const { designReportPdf, loadFontsFromNodeModules } = await import('../../../server/exports/design-pdf')
    const { legSchematicSvg } = await import('../../../shared/drawing/leg-svg')
    const { topologyName } = await import('../../../shared/engine')
    const env = pair.converters[0]!.envelope
    const pdf = await designReportPdf({
      designName: 'Throw-away topology check',
      revision: 1,
      author: 'Test',
      date: '2026-12-03T08:00:00Z',
      topologySummary: topologyName(ID, 2),
      inputs: [['DC voltage nominal', 1100, 'V']],
      operatingPoints: [],
      devices: env.devices,
      capacitors: env.capacitors,
      warnings: [],
      schematicSvg: legSchematicSvg(legLayout(ID, 2), { devices: env.devices, capacitors: env.capacitors }),
      safetyNote: 'Invented safety note for the test.',
    }, await loadFontsFromNodeModules())
    const dir = mkdtempSync(join(tmpdir(), 'throwaway-'))
    try {
      writeFileSync(join(dir, 'r.pdf'), pdf)
      const text = execFileSync(pdftotext, ['-enc', 'UTF-8', join(dir, 'r.pdf'), '-'], { encoding: 'utf8' })
      expect(text).toContain('Series-pair test leg')
      expect(text).not.toContain('could not be drawn')
      const words = text.split(/\s+/)
      for (const name of SERIES_PAIR_POSITIONS) expect(words.filter(w => w === name).length, name).toBeGreaterThanOrEqual(2)
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  }, 30000)

  it('is bought: matching sizes its positions from the engine\'s duties and the BOM counts 3 phases × each position', async () => {
    const { matchPosition, positionDutyFromDevice } = await import('../../../shared/catalog/matching')
    const { buildBomSnapshot } = await import('../../../shared/bom/build')
    const env = pair.converters[0]!.envelope
    // An invented 1200 V switch-diode part: one per 600 V device after derating, two in series for the two-level leg's 1200 V.
    const part = {
      partNumber: 'TST-SW12-400', manufacturer: 'Throwaway Test Devices', kind: 'switch-diode' as const, packageConfiguration: 'single' as const,
      voltageRating: 1200, currentRating: 400,
      priceBreaks: [{ minQuantity: 1, unitPrice: 50 }], currency: 'EUR' as const, lifecycle: 'active' as const,
    }
    const policy = { heatsinkTemperatureC: 80, junctionMarginC: 15, buildQuantity: 1 }
    const fills = env.devices.filter(d => d.kind === 'switch').map((d) => {
      const duty = positionDutyFromDevice(d, { switchingHz: 3000, topology: ID, levels: 2 })
      const best = matchPosition(duty, [part], policy).candidates[0]
      expect(best, `${d.name}: a 1200 V part fits a 600 V position`).toBeDefined()
      expect(best!.seriesCount).toBe(1)
      return {
        side: 'machine' as const, position: d.name, kind: 'switch' as const, partNumber: part.partNumber, manufacturer: part.manufacturer,
        description: 'IGBT with diode 1200 V 400 A', positionsPerPhase: d.countPerPhase, phases: 3, perPackage: 1, seriesCount: best!.seriesCount,
        parallelCount: best!.parallelCount, unitPriceBreaks: [{ quantity: 1, price: 50 }], currency: 'EUR', moq: 1, leadTimeDays: 10, stock: 100,
        lifecycle: 'active' as const, supplier: 'Throwaway Distribution', partVersionId: 1,
      }
    })
    const twoLevelDuty = positionDutyFromDevice(twoLevel.converters[0]!.envelope.devices[0]!, { switchingHz: 3000, topology: 'two-level', levels: 2 })
    const twoLevelBest = matchPosition(twoLevelDuty, [part], policy).candidates[0]
    expect(twoLevelBest === undefined || twoLevelBest.seriesCount > 1, 'the same part alone cannot block the two-level leg\'s 1200 V').toBe(true)
    const snapshot = buildBomSnapshot({
      company: 'Invented Test Works', designId: 1, designName: 'Throw-away topology check', designRevision: 1, topologySummary: seriesPairLeg.label,
      revision: 1, releasedAt: '2026-12-03T08:00:00.000Z', releasedBy: 'Test', designSummary: [], safetyNote: 'Invented safety note for the test.',
    }, { positions: fills, buildQuantity: 1, sparesPercent: 0, currency: 'EUR' })
    const line = snapshot.lines.find(l => l.partNumber === part.partNumber)!
    // four switch positions per phase leg (S1a, S1b, S2a, S2b), three legs
    expect(line.quantityPerUnit).toBe(12)
    expect(snapshot.positions.map(p => p.position)).toEqual(expect.arrayContaining(['S1a', 'S1b', 'S2a', 'S2b']))
  })

  it('leaves no trace once removed', () => {
    const remove = registerTopology({ ...seriesPairLeg, id: 'second-throwaway' as TopologyId })
    expect(topologyOptions().map(o => o.id)).toContain('second-throwaway')
    remove()
    expect(topologyOptions().map(o => o.id)).not.toContain('second-throwaway')
    expect(topologyById['second-throwaway' as TopologyId]).toBeUndefined()
  })
})
