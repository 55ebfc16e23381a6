// The real-input FFT of the line-voltage spectrum, on the radix-4 transform of the fft.js package.
import FFT from 'fft.js'

/** One transform object per length (it holds the twiddle table) and its output buffer, kept between evaluations. */
const transforms = new Map<number, { fft: FFT, out: number[] }>()

export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n > 0 && (n & (n - 1)) === 0
}

/**
 * X_h = Σ_j x_j·e^(−i2πhj/n), h = 0…n/2, of a real sequence x of power-of-two length n (n ≥ 2). The bins above
 * n/2 are the conjugates of these and are not returned.
 */
export function realFft(x: Float64Array): { re: Float64Array, im: Float64Array } {
  const n = x.length
  if (!isPowerOfTwo(n) || n < 2) throw new Error('realFft: length must be a power of two, at least 2')
  const half = n / 2
  const re = new Float64Array(half + 1)
  const im = new Float64Array(half + 1)
  if (n === 2) {
    // The package starts at four points; two is the sum and the difference.
    re[0] = x[0]! + x[1]!
    re[1] = x[0]! - x[1]!
    return { re, im }
  }
  const out = realFftInterleaved(x)
  for (let h = 0; h <= half; h++) {
    re[h] = out[2 * h]!
    im[h] = out[2 * h + 1]!
  }
  return { re, im }
}

/**
 * The same bins interleaved (re at 2h, im at 2h + 1, h = 0…n/2; n ≥ 4) in a buffer kept per length: valid until
 * the next transform of that length, for a caller that reads them at once (no copy).
 */
export function realFftInterleaved(x: Float64Array): number[] {
  const n = x.length
  if (!isPowerOfTwo(n) || n < 4) throw new Error('realFftInterleaved: length must be a power of two, at least 4')
  let t = transforms.get(n)
  if (!t) {
    const fft = new FFT(n)
    t = { fft, out: fft.createComplexArray() as number[] }
    transforms.set(n, t)
  }
  // realTransform fills the bins 0…n/2 and leaves the rest to be mirrored, which we do not need.
  t.fft.realTransform(t.out, x as unknown as number[])
  return t.out
}
