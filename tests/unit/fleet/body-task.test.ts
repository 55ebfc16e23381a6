// /api/v1/stress and /evaluate hand the request body to a worker thread as text: the thread validates it as
// readValid does on the event loop (same statuses, messages and issues) before computing.
import { beforeAll, describe, expect, it } from 'vitest'
import { createError } from '../../../server/workers/shims'
import { stressInputSchema } from '../../../shared/schemas/stress'

// Nitro auto-imports createError; the worker bundle gets it from the shims, this test too
Object.assign(globalThis, { createError })
let runTask: typeof import('../../../server/workers/tasks').runTask
let parseValid: typeof import('../../../server/utils/validate').parseValid
beforeAll(async () => {
  ({ runTask } = await import('../../../server/workers/tasks'))
  ;({ parseValid } = await import('../../../server/utils/validate'))
})

const npc = {
  topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, lineVoltageRms: 690, phaseCurrentRms: 400,
  powerFactor: 0.86, fundamentalHz: 50, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 120,
}
const text = (bytes: Uint8Array) => Buffer.from(bytes).toString('utf8')

describe('a stress body validated on the worker thread', () => {
  it('gives the answer of the validated input, without waveform or spectrum unless asked', async () => {
    const fromBody = await runTask({ kind: 'stress-body', body: JSON.stringify(npc), provenance: 'compact', encode: { gzip: false } })
    const direct = await runTask({ kind: 'stress', input: parseValid(JSON.stringify(npc), stressInputSchema) as never, options: { includeWaveform: false, includeSpectrum: false }, provenance: 'compact', encode: { gzip: false } })
    expect(fromBody.ok && direct.ok).toBe(true)
    const a = (fromBody as { value: { body: Uint8Array, timing: { validateMs?: number } } }).value
    const b = (direct as { value: { body: Uint8Array, timing: { validateMs?: number } } }).value
    expect(JSON.parse(text(a.body))).toEqual(JSON.parse(text(b.body)))
    expect(JSON.parse(text(a.body))).not.toHaveProperty('waveform')
    expect(JSON.parse(text(a.body))).not.toHaveProperty('spectrum')
    // the thread's validation is timed apart from the computation (Server-Timing `validate`)
    expect(a.timing.validateMs).toBeGreaterThanOrEqual(0)
    expect(b.timing.validateMs).toBeUndefined()

    const withWaveform = await runTask({ kind: 'stress-body', body: JSON.stringify({ ...npc, includeWaveform: true }) })
    expect(withWaveform).toMatchObject({ ok: true, value: { waveform: expect.any(Object), spectrum: expect.any(Array) } })
  })

  it.each([
    ['not JSON', '{"topology": ', 400, /not valid JSON/],
    ['not an object', '[1, 2]', 400, /must be a JSON object/],
    ['no body', undefined, 400, /must be a JSON object/],
    ['nested too deep', `{"a":${'['.repeat(40)}${']'.repeat(40)}}`, 400, /nested deeper/],
  ])('answers a body that is %s with %i, as readValid does', async (_, body, status, message) => {
    const r = await runTask({ kind: 'stress-body', body })
    expect(r).toMatchObject({ ok: false, error: { kind: 'http', statusCode: status, message: expect.stringMatching(message) } })
  })

  it('answers a wrong field with 422 and the issues readValid gives, naming the field', async () => {
    const body = JSON.stringify({ ...npc, phaseCurrentRms: -5, topology: 'x' })
    let thrown: { statusCode?: number, message?: string, data?: unknown } = {}
    try { parseValid(body, stressInputSchema) }
    catch (e) { thrown = e as typeof thrown }
    const r = await runTask({ kind: 'stress-body', body })
    expect(r).toMatchObject({ ok: false, error: { kind: 'http', statusCode: 422 } })
    const error = (r as { error: { message: string, data: { issues: { path: string }[] } } }).error
    expect(error.message).toBe(thrown.message)
    expect(error.data).toEqual(thrown.data)
    expect(error.data.issues.map(i => i.path)).toEqual(expect.arrayContaining(['topology', 'phaseCurrentRms']))
  })

  it('answers the engine\'s refusal of a combination (levels for this topology) with 422 naming levels', async () => {
    const r = await runTask({ kind: 'stress-body', body: JSON.stringify({ ...npc, levels: 12 }) })
    expect(r).toMatchObject({ ok: false, error: { kind: 'http', statusCode: 422, data: { issues: [expect.objectContaining({ path: 'levels' })] } } })
  })

  it('validates an /evaluate body the same way', async () => {
    const { levels, dcVoltage, dcVoltageMax, switchingHz, modulation, topology, overshootVoltage, ...point } = npc
    const ok = await runTask({ kind: 'evaluate-body', body: JSON.stringify({ machineSide: { topology, levels, dcVoltage, dcVoltageMax, switchingHz, modulation, overshootVoltage, operatingPoints: [{ name: 'Rated', ...point }] } }), provenance: 'compact' })
    expect(ok).toMatchObject({ ok: true, value: { provenance: expect.any(Object) } })
    const bad = await runTask({ kind: 'evaluate-body', body: JSON.stringify({ machineSide: { topology, switchingHz, modulation, operatingPoints: [] } }) })
    expect(bad).toMatchObject({ ok: false, error: { kind: 'http', statusCode: 422 } })
  })
})
