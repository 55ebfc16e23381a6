// The size-bounded cache behind the kept matching scans and the kept parts answers (shared/utils/sized-cache.ts).
import { describe, expect, it } from 'vitest'
import { SizedCache } from '../../shared/utils/sized-cache'

const bytes = (s: string) => s.length

describe('SizedCache', () => {
  it('drops the least recently used values once the sizes pass the bound, reads count as use', () => {
    const c = new SizedCache<string>(10, bytes)
    c.set('a', 'aaaa')
    c.set('b', 'bbbb')
    expect(c.get('a')).toBe('aaaa') // a is now newer than b
    c.set('c', 'cccc') // 12 > 10: b goes, not a
    expect(c.has('b')).toBe(false)
    expect(c.get('a')).toBe('aaaa')
    expect(c.get('c')).toBe('cccc')
    expect(c.totalSize).toBe(8)
    expect(c.size).toBe(2)
  })

  it('replacing a key counts its new size only, and the newest value stays even when larger than the bound', () => {
    const c = new SizedCache<string>(10, bytes)
    c.set('a', 'aaaaaaaa')
    c.set('a', 'aa')
    expect(c.totalSize).toBe(2)
    c.set('big', 'x'.repeat(25))
    expect(c.has('a')).toBe(false)
    expect(c.get('big')).toHaveLength(25)
    expect(c.totalSize).toBe(25)
    c.set('small', 's')
    // the big one was the oldest: it goes, the newest stays
    expect(c.has('big')).toBe(false)
    expect(c.totalSize).toBe(1)
    c.clear()
    expect(c.size).toBe(0)
    expect(c.totalSize).toBe(0)
    expect(c.get('small')).toBeUndefined()
  })
})
