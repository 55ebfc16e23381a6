// The matrix converter's input filter inductors reach the BOM as lines to specify by hand (the catalogue
// has no inductor kind); the filter capacitors are ordinary capacitor positions matched from the catalogue.
import { describe, expect, it } from 'vitest'
import { buildBomSnapshot } from '../../../shared/bom/build'
import { specifiedLines } from '../../../shared/bom/specified'
import { evaluateDesign } from '../../../shared/engine'
import { positionDutyFromCapacitor } from '../../../shared/catalog/matching'
import { demoInput, snapshotHeader } from './fixtures'

const matrixDesign = () => evaluateDesign({
  machineSide: {
    topology: 'matrix', inputLineVoltageRms: 400, switchingHz: 10_000, modulation: 'space-vector',
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 300, phaseCurrentRms: 40, powerFactor: 0.85, fundamentalHz: 40 }],
  },
})

describe('matrix converter input filter in the BOM', () => {
  it('one inductor line per converter: 3 pieces, the engine\'s inductance and current in the words, no part, no price, a stable key', () => {
    const result = matrixDesign()
    const lf = result.converters[0]!.envelope.inductors![0]!
    const specified = specifiedLines(result)
    expect(specified).toHaveLength(1)
    const snapshot = buildBomSnapshot(snapshotHeader(), { ...demoInput(), specified, buildQuantity: 2, sparesPercent: 0 })
    const line = snapshot.lines.find(l => l.category === 'inductor')!
    expect(line).toMatchObject({ key: 'specify-machine-Lf', partNumber: '', partVersionId: null, unitPrice: null, quantityPerUnit: 3, quantityBuild: 6, references: ['machine Lf'] })
    expect(line.description).toMatch(/no catalogue kind, specify manually/)
    expect(line.description).toContain(`${Number((lf.inductance * 1e6).toPrecision(3))} µH`)
    expect(line.warnings).toContain('no price')
  })

  it('the filter capacitors are a capacitor duty the catalogue matching reads (voltage, ripple, capacitance, 3 per converter)', () => {
    const cap = matrixDesign().converters[0]!.envelope.capacitors.find(c => c.kind === 'input-filter')!
    const duty = positionDutyFromCapacitor(cap, { topology: 'matrix' })
    expect(duty).toMatchObject({ kind: 'capacitor', positionName: 'Cf', positionsPerPhase: 3, phases: 1, capacitanceRequired: cap.capacitanceRequired, requiredVoltageRating: cap.requiredVoltageRating })
    expect(duty.requiredRippleRating).toBe(cap.requiredRippleRating)
  })

  it('other topologies add no specified lines', () => {
    const r = evaluateDesign({ machineSide: { topology: 'two-level', levels: 2, dcVoltage: 800, switchingHz: 8000, modulation: 'sine', operatingPoints: [{ lineVoltageRms: 400, phaseCurrentRms: 50, powerFactor: 0.9, fundamentalHz: 50 }] } })
    expect(specifiedLines(r)).toEqual([])
  })
})
