// Keeps plots light: at most ~maxPoints samples, keeping each bucket's extremes so PWM edges stay visible.

/**
 * Indices to plot: all when there are few; otherwise the first and last sample of the series plus, per
 * bucket, the samples holding the minimum and maximum of any of the given series (in time order).
 */
export function decimationIndices(length: number, series: number[][], maxPoints = 2000): number[] {
  if (length <= maxPoints) return Array.from({ length }, (_, i) => i)
  // Each bucket can contribute 2 indices per series; size buckets so the total stays near maxPoints.
  const perBucket = Math.max(2, 2 * series.length)
  const buckets = Math.max(1, Math.floor((maxPoints - 2) / perBucket))
  const size = length / buckets
  const keep = new Set<number>([0, length - 1])
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size)
    const to = Math.min(length, Math.floor((b + 1) * size))
    for (const s of series) {
      let lo = from
      let hi = from
      for (let i = from; i < to; i++) {
        if (s[i]! < s[lo]!) lo = i
        if (s[i]! > s[hi]!) hi = i
      }
      keep.add(lo)
      keep.add(hi)
    }
  }
  return [...keep].sort((a, b) => a - b)
}
