// Trade study rows against the demo catalogue: every row has losses, peak T_j and cost, or names the
// position and the catalogue field that keeps them out; the level counts chosen are the ones run.
import { describe, expect, it } from 'vitest'
import { DEMO_PARTS } from '../../../catalog/demo-parts'
import { indexParts } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'
import { tradeStudyRows } from '../../../server/services/trade-study'
import type { TradeStudyInput } from '../../../shared/schemas/trade-study'

const duty: TradeStudyInput = {
  dcVoltage: 1100,
  dcVoltageMax: 1250,
  switchingHz: 3000,
  overshootVoltage: 100,
  operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: 0.85, fundamentalHz: 50 }],
}

describe('trade study rows', () => {
  it('gives losses, peak T_j and cost for the chosen level counts', () => {
    const { rows } = tradeStudyRows({ ...duty, candidates: [{ topology: 'diode-clamped', levels: 7 }, { topology: 'cascaded-h-bridge', levels: 13 }, { topology: 'two-level' }] }, indexParts(DEMO_PARTS))
    expect(rows.map(r => [r.topology, r.levels])).toEqual([['diode-clamped', 7], ['cascaded-h-bridge', 13], ['two-level', 2]])
    const two = rows[2]!
    expect(two.semiconductorLossW).toBeGreaterThan(0)
    expect(two.semiconductorCost).toBeGreaterThan(0)
    // the peak over the period is never below the mean (shared/thermal/dynamics.ts, periodic steady state)
    expect(two.peakJunctionC).toBeGreaterThanOrEqual(two.meanJunctionC!)
    for (const r of rows) expect(r.semiconductorLossW !== null || (r.missing?.length ?? 0) > 0).toBe(true)
  })

  it('names the position and the field when the best part lacks loss data', () => {
    // The same catalogue with the switches' threshold voltage blanked: the switch positions must say so.
    const stripped = DEMO_PARTS.map(p => (p.kind === 'capacitor' ? p : { ...p, switchThresholdVoltage: undefined, switchThresholdVoltage25: undefined } as CatalogPart))
    const { rows } = tradeStudyRows({ ...duty, candidates: [{ topology: 'two-level' }] }, indexParts(stripped))
    const row = rows[0]!
    expect(row.semiconductorLossW).toBeNull()
    const s1 = row.missing!.find(m => m.position === 'S1')!
    expect(s1.figure).toBe('losses')
    expect(s1.fields.length).toBeGreaterThan(0)
    expect(s1.reason).toContain('S1')
  })
})
