import { describe, expect, it } from 'vitest'
import { client, signInAs } from '../support/api'

const base = { lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.85, fundamentalHz: 50, switchingHz: 4000, modulation: 'sine' }
const cases = [
  { topology: 'two-level', levels: 2, dcVoltage: 650 },
  { topology: 'diode-clamped', levels: 3, dcVoltage: 650 },
  { topology: 'diode-clamped', levels: 5, dcVoltage: 650 },
  { topology: 't-type', levels: 3, dcVoltage: 650 },
  { topology: 'anpc', levels: 3, dcVoltage: 650 },
  { topology: 'flying-capacitor', levels: 4, dcVoltage: 650 },
  { topology: 'cascaded-h-bridge', levels: 5, dcVoltage: 200 },
  { topology: 'matrix', inputLineVoltageRms: 480 },
]

describe('POST /api/v1/stress', () => {
  for (const c of cases) {
    it(`answers ${c.topology}${c.levels ? ` N=${c.levels}` : ''} in the documented shape`, async () => {
      const api = await signInAs('viewer')
      const r = await api.json('POST', '/api/v1/stress', { ...base, ...c, overshootVoltage: 50 })
      expect(r.status).toBe(200)
      expect(r.body.modulationIndex).toBeGreaterThan(0)
      expect(r.body.devices.length).toBeGreaterThan(0)
      for (const d of r.body.devices) {
        expect(Object.keys(d)).toEqual(expect.arrayContaining(['name', 'kind', 'countPerPhase', 'blockingVoltage', 'blockingVoltageWithOvershoot', 'currentAvg', 'currentRms', 'currentPeak']))
        expect(['switch', 'diode', 'clamp-diode']).toContain(d.kind)
        expect(d.blockingVoltageWithOvershoot).toBeGreaterThanOrEqual(d.blockingVoltage)
      }
      for (const cap of r.body.capacitors) expect(['dc-link', 'split', 'flying', 'cell', 'filter']).toContain(cap.role)
      if (c.topology === 'matrix') expect(r.body.inputSide.filter.capacitance).toBeGreaterThan(0)
      expect(typeof r.body.lineVoltageFundamentalRms).toBe('number')
      expect(typeof r.body.lineVoltageThd).toBe('number')
      expect(Array.isArray(r.body.warnings)).toBe(true)
    })
  }

  it('names the field of bad input with 422, and 400 for a body that is not JSON', async () => {
    const api = await signInAs('viewer')
    const bad = await api.json('POST', '/api/v1/stress', { ...base, topology: 'diode-clamped', levels: 12, dcVoltage: 650 })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].path).toBe('levels')
    const pf = await api.json('POST', '/api/v1/stress', { ...base, topology: 'two-level', dcVoltage: 650, powerFactor: 1.5 })
    expect(pf.status).toBe(422)
    expect(pf.body.data.issues.map((i: { path: string }) => i.path)).toContain('powerFactor')
    expect((await api.request('POST', '/api/v1/stress', 'nope', { 'content-type': 'application/json' })).status).toBe(400)
  })

  // Physical bounds (shared/engine/limits.ts): just past each one → 422 naming the field and the bound in words.
  const bounds: { field: string, body: Record<string, unknown>, words: RegExp }[] = [
    { field: 'dcVoltage', body: { topology: 'two-level', dcVoltage: 100_001 }, words: /at most 100 kV/ },
    { field: 'dcVoltageMax', body: { topology: 'two-level', dcVoltage: 650, dcVoltageMax: 100_001 }, words: /at most 100 kV/ },
    { field: 'inputLineVoltageRms', body: { topology: 'matrix', inputLineVoltageRms: 70_001 }, words: /at most 70 kV/ },
    { field: 'lineVoltageRms', body: { topology: 'two-level', dcVoltage: 650, lineVoltageRms: 100_001 }, words: /at most 100 kV/ },
    { field: 'phaseCurrentRms', body: { topology: 'two-level', dcVoltage: 650, phaseCurrentRms: 100_001 }, words: /at most 100 kA/ },
    { field: 'fundamentalHz', body: { topology: 'two-level', dcVoltage: 650, fundamentalHz: 2001, switchingHz: 40_000 }, words: /at most 2 kHz/ },
    { field: 'switchingHz', body: { topology: 'two-level', dcVoltage: 650, switchingHz: 500_001 }, words: /at most 500 kHz/ },
    { field: 'overshootVoltage', body: { topology: 'two-level', dcVoltage: 650, overshootVoltage: 100_001 }, words: /at most 100 kV/ },
    { field: 'strayInductance', body: { topology: 'two-level', dcVoltage: 650, strayInductance: 0.0011 }, words: /at most 1 mH/ },
    { field: 'currentSlope', body: { topology: 'two-level', dcVoltage: 650, currentSlope: 1.1e12 }, words: /at most 10¹² A\/s/ },
    { field: 'clampDiodeUnitVoltage', body: { topology: 'diode-clamped', levels: 3, dcVoltage: 650, clampDiodeUnitVoltage: 5 }, words: /at least 10 V/ },
    { field: 'phaseCurrentRms', body: { topology: 'cascaded-h-bridge', levels: 15, dcVoltage: 12_000, lineVoltageRms: 60_000, phaseCurrentRms: 10_000 }, words: /1 GVA/ },
    { field: 'switchingHz', body: { topology: 'two-level', dcVoltage: 650, switchingHz: 140 }, words: /at least 3 × “Fundamental frequency”/ },
    { field: 'powerFactorSense', body: { topology: 'two-level', dcVoltage: 650, powerFactorSense: 'ahead' }, words: /lagging .* or leading/ },
    { field: 'inputDisplacementFactor', body: { topology: 'matrix', inputLineVoltageRms: 480, inputDisplacementFactor: 1.01 }, words: /at most 1 \(unity\)/ },
    { field: 'inputDisplacementFactor', body: { topology: 'matrix', inputLineVoltageRms: 480, inputDisplacementFactor: 0.19 }, words: /at least 0\.2/ },
    { field: 'inputFrequencyHz', body: { topology: 'matrix', inputLineVoltageRms: 480, inputFrequencyHz: 2001 }, words: /at most 2 kHz/ },
    { field: 'inputFilterResonanceHz', body: { topology: 'matrix', inputLineVoltageRms: 480, inputFilterResonanceHz: 250_001 }, words: /at most 250 kHz/ },
    { field: 'inputFilterResonanceHz', body: { topology: 'matrix', inputLineVoltageRms: 480, inputFilterResonanceHz: 2500 }, words: /below half the switching frequency/ },
  ]
  for (const b of bounds) {
    it(`refuses ${b.field} past its bound with 422 naming it (${b.words.source})`, async () => {
      const api = await signInAs('viewer')
      const r = await api.json('POST', '/api/v1/stress', { ...base, ...b.body })
      expect(r.status).toBe(422)
      const issue = r.body.data.issues.find((i: { path: string }) => i.path === b.field)
      expect(issue?.message).toMatch(b.words)
    })
  }

  it('at the bounds themselves the answer is 200 with finite figures; a leading power factor is reported as leading', async () => {
    const api = await signInAs('viewer')
    const r = await api.json('POST', '/api/v1/stress', { ...base, topology: 'two-level', dcVoltage: 100_000, lineVoltageRms: 50_000, phaseCurrentRms: 10_000, powerFactor: 0.9, powerFactorSense: 'leading', switchingHz: 2000 })
    expect(r.status).toBe(200)
    expect(JSON.stringify(r.body)).not.toMatch(/null|NaN|Infinity/)
    expect(r.body.powerFactor).toMatchObject({ value: 0.9, sense: 'leading' })
    const ev = await api.json('POST', '/api/v1/evaluate', { machineSide: { topology: 'two-level', dcVoltage: 650, switchingHz: 4000, modulation: 'sine', operatingPoints: [{ name: 'P', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.85, fundamentalHz: 50 }] }, capacitorRippleTarget: 100_001 })
    expect(ev.status).toBe(422)
    expect(ev.body.data.issues.find((i: { path: string }) => i.path === 'capacitorRippleTarget')?.message).toMatch(/at most 100 kV/)
  })

  it('accepts a personal API token as Bearer, and refuses a revoked one', async () => {
    const owner = await signInAs('design-engineer')
    const { body: created } = await owner.json('POST', '/api/tokens', { name: 'ci script' })
    const call = (token: string) => fetch(`${process.env.STRATAVOLT_TEST_URL}/api/v1/stress`, {
      method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${token}` }, body: JSON.stringify({ ...base, topology: 'two-level', dcVoltage: 650 }),
    })
    expect((await call(created.token)).status).toBe(200)
    expect((await call('sv_not-a-real-token')).status).toBe(401)
    await owner.json('DELETE', `/api/tokens/${created.id}`)
    expect((await call(created.token)).status).toBe(401)
  })

  it('evaluates several operating points and a grid side on /api/v1/evaluate', async () => {
    const api = await signInAs('viewer')
    const converter = { topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector' }
    const r = await api.json('POST', '/api/v1/evaluate', {
      machineSide: { ...converter, operatingPoints: [{ name: 'motoring', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }, { name: 'braking', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: -0.9, fundamentalHz: 50 }] },
      gridSide: { ...converter, operatingPoints: [{ name: 'grid', lineVoltageRms: 400, phaseCurrentRms: 90, powerFactor: 1, fundamentalHz: 50 }] },
    })
    expect(r.status).toBe(200)
    expect(r.body.converters.map((c: { side: string }) => c.side)).toEqual(['machine', 'grid'])
    const s1 = r.body.converters[0].envelope.devices.find((d: { name: string }) => d.name === 'S1')
    expect(['motoring', 'braking']).toContain(s1.worstPoint.currentRms)
    expect(s1.requiredVoltageRating).toBeGreaterThan(s1.blockingVoltageWithOvershoot)
  })

  it('serves an OpenAPI description generated from the schemas', async () => {
    const r = await client().json('GET', '/api/v1/openapi.json')
    expect(r.status).toBe(200)
    expect(r.body.paths['/api/v1/stress'].post).toBeTruthy()
    expect(JSON.stringify(r.body.components.schemas.StressInput)).toContain('dcVoltageMax')
  })
})

describe('POST /api/v1/stress with random bad input', () => {
  it('answers every invalid body with 4xx naming a field, never 5xx (fast-check)', async () => {
    const fc = await import('fast-check')
    const api = await signInAs('viewer')
    const valid = { ...base, topology: 'diode-clamped', levels: 3, dcVoltage: 650 }
    const fields = Object.keys(valid) as (keyof typeof valid)[]
    const junk = fc.oneof(fc.constant(null), fc.string({ maxLength: 6 }), fc.double({ noNaN: false }), fc.integer({ min: -1e6, max: 1e6 }), fc.boolean(), fc.constant([]), fc.constant({}))
    await fc.assert(fc.asyncProperty(fc.constantFrom(...fields), junk, async (field, value) => {
      const body = { ...valid, [field]: value }
      const r = await api.json('POST', '/api/v1/stress', body)
      expect(r.status).toBeLessThan(500)
      if (r.status >= 400) {
        expect([400, 422]).toContain(r.status)
        expect(r.body.data.issues.length).toBeGreaterThan(0)
        expect(typeof r.body.data.issues[0].path).toBe('string')
      }
    }), { numRuns: 60, seed: 20261202 })
  })
})
