// The catalogue index built on a worker thread from the rows' JSON text, and one build per generation however
// many requests ask at once.
import { describe, expect, it } from 'vitest'
import { buildCurrentIndex, currentParts, indexDigest, perGeneration, type CurrentRow } from '../../../server/catalog/current-index'
import { runTask } from '../../../server/workers/tasks'
import { DEMO_PARTS } from '../../../catalog/demo-parts'
import { openSharedIndex, sharePartIndex, type SharedPartIndex } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'

const rows: CurrentRow[] = DEMO_PARTS.map((p, i) => [1000 + i, 500 + i, i % 3 !== 0, p as CatalogPart])

describe('the part index from the rows\' text', () => {
  it('is the index the parts themselves give (same columns, ids and part texts)', async () => {
    const expected = sharePartIndex(currentParts(rows), p => (p as CatalogPart & { partVersionId: number }).partVersionId)
    const result = await runTask({ kind: 'build-index', rows: JSON.stringify(rows) })
    expect(result.ok).toBe(true)
    const { index: built, digest } = (result as { value: { index: SharedPartIndex, digest: string } }).value
    expect(digest).toBe(indexDigest(expected))
    expect(built.size).toBe(rows.length)
    expect(Array.from(built.ids)).toEqual(Array.from(expected.ids))
    expect(Buffer.from(built.text).equals(Buffer.from(expected.text))).toBe(true)
    for (const kind of ['switch', 'diode', 'clamp-diode', 'capacitor'] as const) {
      expect(Array.from(built.byPosition[kind].order)).toEqual(Array.from(expected.byPosition[kind].order))
      expect(Array.from(built.byPosition[kind].voltageRating)).toEqual(Array.from(expected.byPosition[kind].voltageRating))
    }
    // a part reads back with its ids and approval after its catalogue data
    const part = openSharedIndex(built).part(3) as CatalogPart & { partVersionId: number, partId: number, approved: boolean }
    expect(part).toEqual({ ...rows[3]![3], partVersionId: 1003, partId: 503, approved: false })
    expect(Object.keys(part).slice(-3)).toEqual(['partVersionId', 'partId', 'approved'])
  })

  it('has one digest for the same rows and another when rows come in another order (hence the ORDER BY in the query)', () => {
    const text = JSON.stringify(rows)
    expect(indexDigest(buildCurrentIndex(text))).toBe(indexDigest(buildCurrentIndex(text)))
    expect(indexDigest(buildCurrentIndex(JSON.stringify([...rows].reverse())))).not.toBe(indexDigest(buildCurrentIndex(text)))
    const changed = rows.map((r, i) => (i === 0 ? [r[0], r[1], r[2], { ...r[3], stock: (r[3].stock ?? 0) + 1 }] : r))
    expect(indexDigest(buildCurrentIndex(JSON.stringify(changed)))).not.toBe(indexDigest(buildCurrentIndex(text)))
  })

  it('is empty for no rows', () => {
    const built = buildCurrentIndex('[]')
    expect(built.size).toBe(0)
    expect(built.byPosition.switch.count).toBe(0)
  })
})

describe('perGeneration', () => {
  it('builds once for concurrent callers of one generation, again for a new one', async () => {
    const calls: number[] = []
    let release!: () => void
    const gate = new Promise<void>((r) => { release = r })
    const get = perGeneration(async (g) => {
      calls.push(g)
      await gate
      return { g }
    })
    const waiting = [get(7), get(7), get(7)]
    await Promise.resolve()
    expect(calls).toEqual([7])
    release()
    const values = await Promise.all(waiting)
    expect(values.every(v => v === values[0])).toBe(true)
    expect(await get(7)).toBe(values[0])
    expect(calls).toEqual([7])
    expect(await get(8)).toEqual({ g: 8 })
    expect(calls).toEqual([7, 8])
  })

  it('keeps the newer generation when an older build ends late, and forgets a failed build', async () => {
    let releaseOld!: () => void
    const old = new Promise<void>((r) => { releaseOld = r })
    let fail = true
    const get = perGeneration(async (g) => {
      if (g === 1) await old
      if (g === 3 && fail) {
        fail = false
        throw new Error('database gone')
      }
      return { g }
    })
    const first = get(1)
    const second = await get(2)
    releaseOld()
    await first
    expect(await get(2)).toBe(second)
    await expect(get(3)).rejects.toThrow('database gone')
    expect(await get(3)).toEqual({ g: 3 })
  })
})
