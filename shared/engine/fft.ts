// A small in-place radix-2 FFT (complex, iterative) for the line-voltage spectrum.

const twiddles = new Map<number, { cos: Float64Array, sin: Float64Array }>()

function tableFor(n: number) {
  let t = twiddles.get(n)
  if (!t) {
    const cos = new Float64Array(n / 2)
    const sin = new Float64Array(n / 2)
    for (let k = 0; k < n / 2; k++) {
      cos[k] = Math.cos((2 * Math.PI * k) / n)
      sin[k] = Math.sin((2 * Math.PI * k) / n)
    }
    t = { cos, sin }
    twiddles.set(n, t)
  }
  return t
}

export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n > 0 && (n & (n - 1)) === 0
}

/** X_h = Σ_j x_j·e^(−i2πhj/n), in place; n must be a power of two. */
export function fft(re: Float64Array, im: Float64Array): void {
  const n = re.length
  if (!isPowerOfTwo(n) || im.length !== n) throw new Error('fft: length must be a power of two')
  // Bit-reversal permutation.
  for (let i = 1, j = 0; i < n; i++) {
    let bit = n >> 1
    for (; j & bit; bit >>= 1) j ^= bit
    j ^= bit
    if (i < j) {
      const tr = re[i]!; re[i] = re[j]!; re[j] = tr
      const ti = im[i]!; im[i] = im[j]!; im[j] = ti
    }
  }
  const { cos, sin } = tableFor(n)
  for (let size = 2; size <= n; size <<= 1) {
    const half = size >> 1
    const step = n / size
    for (let start = 0; start < n; start += size) {
      for (let k = 0; k < half; k++) {
        const wr = cos[k * step]!
        const wi = -sin[k * step]!
        const a = start + k
        const b = a + half
        const xr = re[b]! * wr - im[b]! * wi
        const xi = re[b]! * wi + im[b]! * wr
        re[b] = re[a]! - xr
        im[b] = im[a]! - xi
        re[a]! += xr
        im[a]! += xi
      }
    }
  }
}

/**
 * X_h, h = 0…n/2, of a real sequence x of power-of-two length n, from one complex FFT of length n/2: the even
 * and odd samples as real and imaginary parts, then X_h = E_h + e^(−i2πh/n)·O_h with E_h = (Z_h + Z*_(n/2−h))/2
 * and O_h = (Z_h − Z*_(n/2−h))/(2i) (the standard split of a real transform).
 */
export function realFft(x: Float64Array): { re: Float64Array, im: Float64Array } {
  const n = x.length
  if (!isPowerOfTwo(n) || n < 2) throw new Error('realFft: length must be a power of two, at least 2')
  const half = n / 2
  const zr = new Float64Array(half)
  const zi = new Float64Array(half)
  for (let k = 0; k < half; k++) {
    zr[k] = x[2 * k]!
    zi[k] = x[2 * k + 1]!
  }
  if (half > 1) fft(zr, zi)
  const re = new Float64Array(half + 1)
  const im = new Float64Array(half + 1)
  const { cos, sin } = tableFor(n)
  for (let k = 0; k <= half; k++) {
    const k1 = k % half
    const k2 = (half - k) % half
    const er = (zr[k1]! + zr[k2]!) / 2
    const ei = (zi[k1]! - zi[k2]!) / 2
    const or = (zi[k1]! + zi[k2]!) / 2
    const oi = -(zr[k1]! - zr[k2]!) / 2
    const c = k < half ? cos[k]! : -1
    const s = k < half ? -sin[k]! : 0
    re[k] = er + c * or - s * oi
    im[k] = ei + c * oi + s * or
  }
  return { re, im }
}
