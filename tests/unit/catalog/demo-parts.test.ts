// The demo catalogue: invented, deterministic, plausible, and importable through the normal path.
import { describe, expect, it } from 'vitest'
import { buildDemoParts, DEMO_PARTS } from '../../../catalog/demo-parts'
import { partsToTable } from '../../../shared/catalog/format'
import { matchPosition, type PositionDuty } from '../../../shared/catalog/matching'
import { suggestMapping } from '../../../shared/catalog/mapping'
import { validateRows } from '../../../shared/catalog/validate'

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

describe('demo catalogue', () => {
  it('has about 150 distinct parts and is the same on every build', () => {
    expect(DEMO_PARTS.length).toBeGreaterThanOrEqual(140)
    expect(DEMO_PARTS.length).toBeLessThanOrEqual(160)
    expect(new Set(DEMO_PARTS.map(p => `${p.manufacturer}|${p.partNumber}`)).size).toBe(DEMO_PARTS.length)
    expect(buildDemoParts()).toEqual(DEMO_PARTS)
  })

  it('imports cleanly through the template columns (export → validate round trip)', () => {
    const { headers, rows } = partsToTable(DEMO_PARTS)
    const { mapping } = suggestMapping(headers)
    const result = validateRows({ headers, headerRowNumber: 1, rows: rows.map((cells, i) => ({ rowNumber: i + 2, cells })) }, mapping, { decimalSeparator: '.' })
    expect(result.issues).toEqual([])
    expect(result.parts.map(({ sourceRow, ...p }) => p)).toEqual(DEMO_PARTS)
  })

  it('covers the voltage classes, kinds, packages and technologies asked for', () => {
    const semis = DEMO_PARTS.filter(p => p.kind !== 'capacitor')
    expect(new Set(semis.map(p => p.voltageRating))).toEqual(new Set([650, 1200, 1700, 3300, 4500, 6500]))
    for (const cfg of ['single', 'half-bridge', 'six-pack', 'npc-leg', 't-type-leg', 'anpc-leg', 'dual-diode', 'h-bridge', 'chopper']) {
      expect(DEMO_PARTS.some(p => p.packageConfiguration === cfg), cfg).toBe(true)
    }
    expect(new Set(DEMO_PARTS.filter(p => p.technology === 'sic-mosfet').map(p => p.voltageRating))).toEqual(new Set([650, 1200]))
    expect(DEMO_PARTS.some(p => p.technology === 'film')).toBe(true)
    expect(DEMO_PARTS.some(p => p.technology === 'electrolytic')).toBe(true)
    for (const v of [650, 1200, 1700, 3300, 4500, 6500]) expect(DEMO_PARTS.some(p => p.kind === 'diode' && p.voltageRating === v), `diode ${v} V`).toBe(true)
    expect(new Set(DEMO_PARTS.map(p => p.lifecycle))).toEqual(new Set(['active', 'nrnd', 'obsolete']))
  })

  it('uses example domains, EUR prices with 2–3 ascending breaks and falling unit prices', () => {
    for (const p of DEMO_PARTS) {
      expect(p.datasheetUrl).toMatch(/^https:\/\/datasheets\.example\//)
      expect(p.currency).toBe('EUR')
      expect(p.priceBreaks.length).toBeGreaterThanOrEqual(2)
      expect(p.priceBreaks.length).toBeLessThanOrEqual(3)
      for (let i = 1; i < p.priceBreaks.length; i++) {
        expect(p.priceBreaks[i]!.minQuantity).toBeGreaterThan(p.priceBreaks[i - 1]!.minQuantity)
        expect(p.priceBreaks[i]!.unitPrice).toBeLessThanOrEqual(p.priceBreaks[i - 1]!.unitPrice)
      }
    }
  })

  it('scales figures sensibly with the voltage class (from memory: higher class, higher V0 and energy per ampere)', () => {
    const igbts = DEMO_PARTS.filter(p => p.technology === 'si-igbt' && p.kind === 'switch-diode')
    const classes = [650, 1200, 1700, 3300, 4500, 6500]
    const energyPerA = classes.map(v => median(igbts.filter(p => p.voltageRating === v).map(p => (p.turnOnEnergy! + p.turnOffEnergy!) / p.currentRating!)))
    const v0 = classes.map(v => median(igbts.filter(p => p.voltageRating === v).map(p => p.switchThresholdVoltage!)))
    const onStateAtRated = classes.map(v => median(igbts.filter(p => p.voltageRating === v).map(p => p.switchThresholdVoltage! + p.switchSlopeResistance! * p.currentRating!)))
    for (let i = 1; i < classes.length; i++) {
      expect(energyPerA[i]!, `energy/A ${classes[i]} V`).toBeGreaterThan(energyPerA[i - 1]!)
      expect(v0[i]!, `V0 ${classes[i]} V`).toBeGreaterThan(v0[i - 1]!)
      expect(onStateAtRated[i]!, `V_on ${classes[i]} V`).toBeGreaterThan(onStateAtRated[i - 1]!)
    }
    // Energy test voltage at roughly half the class (datasheet practice, from memory).
    for (const p of DEMO_PARTS.filter(p => p.kind !== 'capacitor')) {
      const ratio = p.energyReferenceVoltage! / p.voltageRating
      expect(ratio).toBeGreaterThanOrEqual(0.5)
      expect(ratio).toBeLessThan(0.7)
    }
  })

  it('offers parts for a 690 V two-level drive switch at 1700 V class', () => {
    const duty: PositionDuty = {
      positionName: 'S', kind: 'switch', requiredVoltageRating: 1100 / 0.65, requiredCurrentRating: 566,
      currentAvg: 180, currentRms: 280, currentPeak: 566, blockingVoltage: 1100, commutatedVoltage: 1000, switchingHz: 3000,
      positionsPerPhase: 2, phases: 3, converters: 1, topology: 'two-level',
    }
    const { candidates } = matchPosition(duty, DEMO_PARTS, { heatsinkTemperatureC: 80, junctionMarginC: 15, buildQuantity: 10 })
    expect(candidates.length).toBeGreaterThan(3)
    expect(candidates.every(c => c.part.voltageRating * c.seriesCount >= 1692)).toBe(true)
    expect(candidates.some(c => c.part.voltageRating === 1700 && c.thermalOk)).toBe(true)
  })
})
