// Answers encoded on the worker thread: the JSON text, gzipped only when asked and large enough to gain.
import { gunzipSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { THREAD_GZIP_MIN_BYTES, encodeAnswer } from '../../../server/workers/encode'
import { runTask } from '../../../server/workers/tasks'

const text = (bytes: Uint8Array) => Buffer.from(bytes).toString('utf8')

describe('encodeAnswer', () => {
  it('gzips a large answer for a gzip client, and the bytes unpack to the answer\'s JSON', () => {
    const answer = { rows: Array.from({ length: 600 }, (_, i) => ({ i, name: `row ${i}`, value: i / 7 })) }
    const zipped = encodeAnswer(answer, { gzip: true })
    expect(zipped.gzip).toBe(true)
    expect(JSON.parse(text(gunzipSync(zipped.body)))).toEqual(answer)
    expect(zipped.body.byteLength).toBeLessThan(JSON.stringify(answer).length / 3)
    const plain = encodeAnswer(answer, { gzip: false })
    expect(plain.gzip).toBe(false)
    expect(text(plain.body)).toBe(JSON.stringify(answer))
  })

  it('sends a body under the thread\'s gzip limit (8 KiB) as it is, even to a gzip client', () => {
    const small = { ok: true, note: 'x'.repeat(THREAD_GZIP_MIN_BYTES - 40) }
    const r = encodeAnswer(small, { gzip: true })
    expect(r.gzip).toBe(false)
    expect(text(r.body)).toBe(JSON.stringify(small))
  })

  it('a task asked to encode gives the bytes of the value it gives unencoded', async () => {
    const input = { topology: 'two-level' as const, levels: 2, dcVoltage: 650, lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50, switchingHz: 6000, modulation: 'sine' as const }
    const task = { kind: 'stress' as const, input, options: {}, provenance: 'compact' as const }
    const value = await runTask(task)
    const encoded = await runTask({ ...task, encode: { gzip: true } })
    expect(value.ok && encoded.ok).toBe(true)
    const bytes = (encoded as { value: { body: Uint8Array, gzip: boolean } }).value
    // a stress answer (≈ 6 KB) is under the limit: plain JSON
    expect(bytes.gzip).toBe(false)
    expect(JSON.parse(text(bytes.body))).toEqual((value as { value: unknown }).value)
  })
})
