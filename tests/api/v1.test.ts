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
      for (const cap of r.body.capacitors) expect(['dc-link', 'flying']).toContain(cap.kind)
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
