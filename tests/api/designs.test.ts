import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { signInAs, unique } from '../support/api'

const input = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000, modulation: 'sine', overshootVoltage: 100,
    operatingPoints: [{ name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: 0.85, fundamentalHz: 50 }],
  },
}

describe('designs', () => {
  it('creates, saves revisions, refuses a stale save with 409, copies and archives', async () => {
    const a = await signInAs('design-engineer')
    const b = await signInAs('admin')
    const name = unique('NPC test')
    const created = await a.json('POST', '/api/designs', { name, input })
    expect(created.status).toBe(201)
    const id = created.body.id
    const first = await a.json('PUT', `/api/designs/${id}`, { name, input: { ...input, machineSide: { ...input.machineSide, switchingHz: 2500 } }, revision: 1 })
    expect(first.status).toBe(200)
    expect(first.body.revision).toBe(2)
    // b still edits revision 1: conflict, nothing written
    const stale = await b.json('PUT', `/api/designs/${id}`, { name: `${name} by b`, input, revision: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.message).toMatch(/revision 2/)
    const now = await a.json('GET', `/api/designs/${id}`)
    expect(now.body.name).toBe(name)
    expect(now.body.revisions.map((r: { revision: number }) => r.revision)).toEqual([2, 1])
    const old = await a.json('GET', `/api/designs/${id}?revision=1`)
    expect(old.body.input.machineSide.switchingHz).toBe(3000)
    const copy = await a.json('POST', `/api/designs/${id}/copy`)
    expect(copy.status).toBe(201)
    expect(copy.body.name).toContain('(copy)')
    expect((await a.json('PATCH', `/api/designs/${id}`, { status: 'archived' })).body.status).toBe('archived')
    const list = await a.json('GET', '/api/designs?status=archived')
    expect(list.body.some((d: { id: number }) => d.id === id)).toBe(true)
  })

  it('answers bad input with 422 naming the field', async () => {
    const a = await signInAs('design-engineer')
    const noName = await a.json('POST', '/api/designs', { name: '', input })
    expect(noName.status).toBe(422)
    expect(noName.body.data.issues[0].path).toBe('name')
    const badLevels = await a.json('POST', '/api/designs', { name: 'x', input: { machineSide: { ...input.machineSide, topology: 't-type', levels: 5 } } })
    expect(badLevels.status).toBe(422)
    expect(badLevels.body.data.issues[0].path).toMatch(/levels/)
    const badPoint = await a.json('POST', '/api/designs/preview', { machineSide: { ...input.machineSide, operatingPoints: [{ name: 'x', lineVoltageRms: 690, phaseCurrentRms: -1, powerFactor: 0.8, fundamentalHz: 50 }] } })
    expect(badPoint.status).toBe(422)
    expect(badPoint.body.data.issues[0].path).toMatch(/operatingPoints\.0\.phaseCurrentRms/)
  })

  it('previews results with leg layout, waveform and spectrum', async () => {
    const a = await signInAs('viewer')
    const r = await a.json('POST', '/api/designs/preview', input)
    expect(r.status).toBe(200)
    const devices = r.body.result.converters[0].envelope.devices
    expect(devices.filter((d: { kind: string }) => d.kind === 'clamp-diode').length).toBeGreaterThan(0)
    expect(r.body.layouts.machine.items.length).toBeGreaterThan(0)
    expect(r.body.extras.machine.waveform.lineVoltage.length).toBeGreaterThan(100)
    expect(r.body.extras.machine.spectrum[0].order).toBe(1)
  })

  it('compares topologies for one duty', async () => {
    const a = await signInAs('design-engineer')
    const r = await a.json('POST', '/api/trade-study', { dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 3000, operatingPoints: input.machineSide.operatingPoints })
    expect(r.status).toBe(200)
    const labels = r.body.rows.map((x: { topology: string }) => x.topology)
    expect(labels).toEqual(expect.arrayContaining(['two-level', 'diode-clamped', 't-type', 'anpc', 'flying-capacitor', 'cascaded-h-bridge', 'matrix']))
    const two = r.body.rows.find((x: { topology: string }) => x.topology === 'two-level')
    const npc = r.body.rows.find((x: { topology: string, levels: number }) => x.topology === 'diode-clamped' && x.levels === 3)
    // Rodriguez, Lai, Peng (IEEE TIE 2002): the NPC leg has twice the switches of the two-level leg, each at half the voltage.
    expect(npc.switchesTotal).toBe(2 * two.switchesTotal)
    expect(npc.highestVoltageClass).toBeLessThan(two.highestVoltageClass)
    expect(npc.semiconductorCost).toBeGreaterThan(0)
  })

  it('shows the parts that fit each position and assigns one', async () => {
    const a = await signInAs('design-engineer')
    const { body: design } = await a.json('POST', '/api/designs', { name: unique('parts test'), input })
    const r = await a.json('GET', `/api/designs/${design.id}/parts`)
    expect(r.status).toBe(200)
    const s1 = r.body.positions.find((p: { position: string }) => p.position === 'S1')
    expect(s1.candidates.length).toBeGreaterThan(0)
    const c = s1.candidates[0]
    expect(c.part.voltageRating * c.seriesCount).toBeGreaterThanOrEqual(s1.duty.requiredVoltageRating)
    // candidates name their part by version id; its catalogue data comes once in `parts`
    expect(r.body.parts[c.partVersionId]).toMatchObject({ partNumber: c.part.partNumber, manufacturer: c.part.manufacturer, voltageRating: c.part.voltageRating })
    expect(c.part.priceBreaks).toBeUndefined()
    const put = await a.json('PUT', `/api/designs/${design.id}/parts`, { side: 'machine', position: 'S1', partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
    expect(put.status).toBe(200)
    const after = await a.json('GET', `/api/designs/${design.id}/parts`)
    expect(after.body.positions.find((p: { position: string }) => p.position === 'S1').assigned.partVersionId).toBe(c.partVersionId)
    expect(after.body.summary[0].semiconductorLossW).toBeGreaterThan(0)
    // the design page's summary route gives the same figures without the candidate search
    const summary = await a.json('GET', `/api/designs/${design.id}/parts/summary`)
    expect(summary.status).toBe(200)
    expect(summary.body.summary).toEqual(after.body.summary)
    expect(summary.body.positions).toBeUndefined()
    const viewer = await signInAs('viewer')
    const seen = await viewer.json('GET', `/api/designs/${design.id}/parts/summary`)
    expect(seen.status).toBe(200)
    expect(seen.body.summary[0].semiconductorLossW).toBe(after.body.summary[0].semiconductorLossW)
    expect(seen.body.summary[0].costPerDesign).toBeNull()
    const bad = await a.json('PUT', `/api/designs/${design.id}/parts`, { side: 'machine', position: 'S99', partVersionId: c.partVersionId })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].path).toBe('position')
  })

  it('a 2 Hz start point: the parts page gives T_j peak above mean per point and the lifetime; the report PDF carries them', async () => {
    const a = await signInAs('design-engineer')
    const startInput = {
      machineSide: {
        ...input.machineSide,
        operatingPoints: [
          { name: 'Start 2 Hz', lineVoltageRms: 30, phaseCurrentRms: 300, powerFactor: 0.8, fundamentalHz: 2, hoursShare: 0.05, startsPerHour: 6 },
          { name: 'Rated', lineVoltageRms: 690, phaseCurrentRms: 250, powerFactor: 0.85, fundamentalHz: 50, hoursShare: 0.95 },
        ],
      },
      thermal: { ambientTemperatureC: 40, heatsinkRth: 0.005, heatsinkTimeConstantS: 300 },
    }
    const refused = await a.json('POST', '/api/designs', { name: unique('thermal bad'), input: { ...startInput, thermal: { ...startInput.thermal, heatsinkRth: -1 } } })
    expect(refused.status).toBe(422)
    expect(refused.body.data.issues.map((i: any) => i.path)).toContain('input.thermal.heatsinkRth')
    const { body: design } = await a.json('POST', '/api/designs', { name: unique('thermal start'), input: startInput })
    const r = await a.json('GET', `/api/designs/${design.id}/parts`)
    expect(r.status).toBe(200)
    const s1 = r.body.positions.find((p: { position: string }) => p.position === 'S1')
    const c = s1.candidates.find((x: any) => x.thermal)
    expect(c.thermal.perPoint.map((p: any) => p.pointName)).toEqual(['Start 2 Hz', 'Rated'])
    await a.json('PUT', `/api/designs/${design.id}/parts`, { side: 'machine', position: 'S1', partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
    const after = (await a.json('GET', `/api/designs/${design.id}/parts`)).body
    const t = after.positions.find((p: { position: string }) => p.position === 'S1').assigned.thermal
    const [start] = t.perPoint
    expect(start.peakC).toBeGreaterThan(start.meanC + 1)
    expect(after.thermal.life.limiting.lifeHours).toBeGreaterThan(0)
    expect(after.thermal.life.positions.find((p: any) => p.position === 'S1').source).toMatch(/Bayerer/)
    const pdf = await a.request('GET', `/api/designs/${design.id}/report.pdf`)
    expect(pdf.status).toBe(200)
    if (existsSync('/usr/bin/pdftotext')) {
      const dir = mkdtempSync(join(tmpdir(), 'report-'))
      try {
        writeFileSync(join(dir, 'r.pdf'), Buffer.from(await pdf.arrayBuffer()))
        const text = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', join(dir, 'r.pdf'), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
        for (const expected of ['Design review summary', 'Sign-off', 'Start 2 Hz', 'T_j peak', 'Lifetime from the mission profile', c.part.partNumber]) expect(text, expected).toContain(expected)
      }
      finally {
        rmSync(dir, { recursive: true, force: true })
      }
    }
  })

  it('the parts answer reports a shared module case: candidates and assigned parts name the positions in the same package', async () => {
    const a = await signInAs('design-engineer')
    const twoLevel = {
      machineSide: {
        topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 60,
        operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 150, powerFactor: 0.88, fundamentalHz: 50 }],
      },
      thermal: { ambientTemperatureC: 40, heatsinkRth: 0.01, heatsinkTimeConstantS: 300 },
    }
    const { body: design } = await a.json('POST', '/api/designs', { name: unique('shared case'), input: twoLevel })
    const r = await a.json('GET', `/api/designs/${design.id}/parts`)
    expect(r.status).toBe(200)
    const s1 = r.body.positions.find((p: { position: string }) => p.position === 'S1')
    // A switch with its diode in one package (single co-pack or a half-bridge) covers other positions: their case is shared.
    const modules = s1.candidates.filter((c: any) => c.thermal && c.covers.length)
    expect(modules.length).toBeGreaterThan(0)
    for (const c of modules) expect(c.thermal.caseSharedWith).toEqual(c.covers)
    for (const c of s1.candidates.filter((x: any) => x.thermal && !x.covers.length)) expect(c.thermal.caseSharedWith).toBeUndefined()
    const c = modules[0]
    const put = await a.json('PUT', `/api/designs/${design.id}/parts`, { side: 'machine', position: 'S1', partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount, fillCovered: true })
    expect(put.status).toBe(200)
    expect(put.body.filled).toEqual(c.covers)
    const after = (await a.json('GET', `/api/designs/${design.id}/parts`)).body
    const at = (name: string) => after.positions.find((p: { position: string }) => p.position === name).assigned
    expect(at('S1').thermal.caseSharedWith).toEqual(c.covers)
    for (const covered of c.covers) {
      expect(at(covered).coveredBy).toBe('S1')
      expect(at(covered).thermal.caseSharedWith).toContain('S1')
    }
    expect(after.thermal.assumptions.join(' ')).toMatch(/share its case/)
  })

  it('makes a design report PDF', async () => {
    const a = await signInAs('viewer')
    const r = await a.request('GET', '/api/designs/1/report.pdf')
    expect(r.status).toBe(200)
    expect(r.headers.get('content-type')).toBe('application/pdf')
    const bytes = Buffer.from(await r.arrayBuffer())
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-')
  })
})
