// Values by key up to a total size: the least recently read or written go first once the sizes (as `sizeOf`
// counts them, e.g. bytes) pass the bound. The newest value is always kept, whatever its size.

export class SizedCache<V> {
  private readonly entries = new Map<string, V>()
  private total = 0

  constructor(private readonly maxSize: number, private readonly sizeOf: (value: V) => number) {}

  /** The value kept for `key` (now the most recently used), or undefined. */
  get(key: string): V | undefined {
    const value = this.entries.get(key)
    if (value !== undefined) {
      // a Map keeps insertion order: delete and set again moves the entry to the most recent end
      this.entries.delete(key)
      this.entries.set(key, value)
    }
    return value
  }

  set(key: string, value: V): void {
    const before = this.entries.get(key)
    if (before !== undefined) {
      this.total -= this.sizeOf(before)
      this.entries.delete(key)
    }
    this.entries.set(key, value)
    this.total += this.sizeOf(value)
    for (const [k, old] of this.entries) {
      if (this.total <= this.maxSize || k === key) break
      this.entries.delete(k)
      this.total -= this.sizeOf(old)
    }
  }

  has(key: string): boolean {
    return this.entries.has(key)
  }

  /** Entries kept */
  get size(): number {
    return this.entries.size
  }

  /** Sum of the kept values' sizes */
  get totalSize(): number {
    return this.total
  }

  clear(): void {
    this.entries.clear()
    this.total = 0
  }
}
