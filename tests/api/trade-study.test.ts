import { describe, expect, it } from 'vitest'
import { signInAs } from '../support/api'

// Issue 12 item 5: the trade study runs the level counts the user chose, with the derating given, and a row
// without losses or peak T_j says which position lacks which catalogue field (or that no part fits).
const duty = {
  dcVoltage: 1100,
  dcVoltageMax: 1250,
  switchingHz: 3000,
  overshootVoltage: 100,
  operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: 0.85, fundamentalHz: 50 }],
}

interface Row {
  topology: string
  levels: number | null
  error?: string
  semiconductorLossW?: number | null
  peakJunctionC?: number | null
  meanJunctionC?: number
  semiconductorCost?: number | null
  unmatched?: string[]
  voltageClasses?: { position: string, required: number }[]
  missing?: { position: string, partNumber: string | null, fields: string[], figure: string, reason: string }[]
}

describe('trade study', () => {
  it('runs the chosen level counts and gives losses, peak T_j and cost or the reason per position', async () => {
    const a = await signInAs('design-engineer')
    const candidates = [{ topology: 'diode-clamped', levels: 9 }, { topology: 'flying-capacitor', levels: 7 }, { topology: 'cascaded-h-bridge', levels: 15 }, { topology: 'two-level' }, { topology: 'matrix' }]
    const r = await a.json('POST', '/api/trade-study', { ...duty, candidates })
    expect(r.status).toBe(200)
    const rows = r.body.rows as Row[]
    expect(rows.map(x => [x.topology, x.levels])).toEqual([['diode-clamped', 9], ['flying-capacitor', 7], ['cascaded-h-bridge', 15], ['two-level', 2], ['matrix', null]])
    for (const row of rows.filter(x => !x.error)) {
      const positions = row.voltageClasses!.map(v => v.position)
      if (row.semiconductorLossW === null) {
        // never a bare dash: each reason names a position of this row, and the part's missing fields when a part fits
        expect(row.missing?.some(m => m.figure === 'losses')).toBe(true)
        for (const m of row.missing!) {
          expect(m.reason).toContain(m.position)
          if (m.partNumber !== null) expect(m.fields.length).toBeGreaterThan(0)
        }
      }
      else expect(row.semiconductorLossW).toBeGreaterThan(0)
      if (row.peakJunctionC === null) expect(row.missing?.length).toBeGreaterThan(0)
      else expect(row.peakJunctionC).toBeGreaterThanOrEqual(row.meanJunctionC!)
      if (row.semiconductorCost === null) expect((row.unmatched?.length ?? 0) + (row.missing?.length ?? 0)).toBeGreaterThan(0)
      expect(positions.length).toBeGreaterThan(0)
    }
    // the two-level row has parts with loss and thermal data in the demo catalogue
    const two = rows.find(x => x.topology === 'two-level')!
    expect(two.semiconductorLossW).toBeGreaterThan(0)
    expect(two.peakJunctionC).toBeGreaterThan(0)
  })

  it('takes the derating given: a lower voltage utilisation raises the required rating in proportion', async () => {
    const a = await signInAs('design-engineer')
    const at = async (u: number) => ((await a.json('POST', '/api/trade-study', { ...duty, derating: { semiconductorVoltageUtilisation: u }, candidates: [{ topology: 'two-level' }] })).body.rows[0] as Row).voltageClasses![0]!.required
    const [high, low] = [await at(0.65), await at(0.5)]
    // required = V_dc,max / utilisation (the utilisation check decides at 1250 V + overshoot): ratio 0.65 / 0.5
    expect(low / high).toBeCloseTo(0.65 / 0.5, 2)
  })

  it('refuses a level count the topology does not take, naming the candidate', async () => {
    const a = await signInAs('design-engineer')
    const npc = await a.json('POST', '/api/trade-study', { ...duty, candidates: [{ topology: 'two-level' }, { topology: 'diode-clamped', levels: 11 }] })
    expect(npc.status).toBe(422)
    expect(JSON.stringify(npc.body)).toContain('candidates.1.levels')
    const chb = await a.json('POST', '/api/trade-study', { ...duty, candidates: [{ topology: 'cascaded-h-bridge', levels: 4 }] })
    expect(chb.status).toBe(422)
    expect(JSON.stringify(chb.body)).toMatch(/candidates\.0\.levels/)
  })
})
