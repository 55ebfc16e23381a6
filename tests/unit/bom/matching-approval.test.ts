// Ranking by approval and lifecycle, and re-rating an assignment at its stored counts (issue 11 items
// 1 and 3). Figures are invented, round datasheet-like values; the rule (approved + active first) is ours.
import { describe, expect, it } from 'vitest'
import { approvalRank, matchPosition, rateAssignment, type MatchPolicy, type PositionDuty } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'

const policy: MatchPolicy = { heatsinkTemperatureC: 80, junctionMarginC: 15, buildQuantity: 1 }

function igbt(overrides: Partial<CatalogPart> & { approved?: boolean } = {}): CatalogPart & { approved?: boolean } {
  return {
    partNumber: 'T-SW12-300', manufacturer: 'Test Devices', kind: 'switch-diode', packageConfiguration: 'single',
    voltageRating: 1200, currentRating: 300,
    switchThresholdVoltage: 0.85, switchSlopeResistance: 2.1e-3, diodeThresholdVoltage: 0.9, diodeSlopeResistance: 1.6e-3,
    turnOnEnergy: 0.03, turnOffEnergy: 0.04, recoveryEnergy: 0.02, energyReferenceVoltage: 600, energyReferenceCurrent: 300,
    rthJunctionCaseSwitch: 0.09, rthJunctionCaseDiode: 0.15, rthCaseHeatsink: 0.03, junctionTemperatureMax: 175,
    priceBreaks: [{ minQuantity: 1, unitPrice: 100 }], currency: 'EUR', lifecycle: 'active',
    ...overrides,
  }
}

const duty = (peak: number): PositionDuty => ({
  positionName: 'S1', kind: 'switch', requiredVoltageRating: 900, requiredCurrentRating: peak,
  currentAvg: peak / 4, currentRms: peak / 2.5, currentPeak: peak, blockingVoltage: 600, commutatedVoltage: 600, switchingHz: 4000,
  positionsPerPhase: 1, phases: 3, converters: 1, topology: 'two-level',
})

describe('approval ranking', () => {
  it('approved active parts rank before cheaper unapproved or NRND ones', () => {
    const parts = [
      igbt({ partNumber: 'CHEAP-UNAPPROVED', approved: false, priceBreaks: [{ minQuantity: 1, unitPrice: 10 }] }),
      igbt({ partNumber: 'CHEAP-NRND', lifecycle: 'nrnd', priceBreaks: [{ minQuantity: 1, unitPrice: 20 }] }),
      igbt({ partNumber: 'DEAR-APPROVED', approved: true, priceBreaks: [{ minQuantity: 1, unitPrice: 200 }] }),
    ]
    expect(matchPosition(duty(200), parts, policy).candidates.map(c => c.part.partNumber)).toEqual(['DEAR-APPROVED', 'CHEAP-NRND', 'CHEAP-UNAPPROVED'])
    expect(approvalRank({ lifecycle: 'active', approved: true })).toBe(0)
    expect(approvalRank({ lifecycle: 'active' })).toBe(0)
    expect(approvalRank({ lifecycle: 'obsolete', approved: false })).toBeGreaterThan(approvalRank({ lifecycle: 'active', approved: false }))
  })
})

describe('rateAssignment', () => {
  it('1 × 1 of a 300 A part fits a 200 A duty; after the duty rises to 500 A it needs 2 in parallel and the stored 1 × 1 no longer fits', () => {
    const part = igbt()
    expect(rateAssignment(part, duty(200), policy, 1, 1)).toMatchObject({ fits: true, needed: { seriesCount: 1, parallelCount: 1 } })
    // 500 A / (300 A × 0.9 sharing) = 1.85 → 2 in parallel
    const after = rateAssignment(part, duty(500), policy, 1, 1)
    expect(after).toMatchObject({ fits: false, needed: { seriesCount: 1, parallelCount: 2 } })
    expect(after.rated!.currentMarginPct).toBeLessThan(0)
    expect(rateAssignment(part, duty(500), policy, 1, 2).fits).toBe(true)
  })

  it('a part that cannot be sized at all gives needed = null and fits = false', () => {
    expect(rateAssignment(igbt({ voltageRating: 600 }), duty(200), policy, 1, 1)).toMatchObject({ fits: false, needed: null })
  })
})
