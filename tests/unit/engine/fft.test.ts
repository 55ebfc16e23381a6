// The real-input FFT against the direct DFT sum X_h = Σ x_j·e^(−i2πhj/n), its definition.
import { describe, expect, it } from 'vitest'
import { realFft } from '../../../shared/engine/fft'

function directDft(x: Float64Array, h: number): [number, number] {
  let re = 0
  let im = 0
  for (let j = 0; j < x.length; j++) {
    re += x[j]! * Math.cos((2 * Math.PI * h * j) / x.length)
    im -= x[j]! * Math.sin((2 * Math.PI * h * j) / x.length)
  }
  return [re, im]
}

describe('realFft', () => {
  it.each([2, 4, 8, 64, 1024, 4096])('n = %i: every bin 0…n/2 equals the direct DFT (tol 1e-9 of the signal scale)', (n) => {
    // A deterministic, non-symmetric signal (a linear congruential sequence), so no bin is trivially zero.
    let seed = 12345
    const x = Float64Array.from({ length: n }, () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) - 0.5)
    const { re, im } = realFft(x)
    expect(re.length).toBe(n / 2 + 1)
    for (let h = 0; h <= n / 2; h++) {
      const [dr, di] = directDft(x, h)
      expect(Math.abs(re[h]! - dr)).toBeLessThan(1e-9 * n)
      expect(Math.abs(im[h]! - di)).toBeLessThan(1e-9 * n)
    }
  })

  it('gives the same bins on a second call of the same length (the kept buffer is copied out, not shared)', () => {
    const a = realFft(Float64Array.from({ length: 64 }, (_, j) => Math.sin(j)))
    const first = Float64Array.from(a.re)
    realFft(Float64Array.from({ length: 64 }, (_, j) => Math.cos(3 * j)))
    expect(a.re).toEqual(first)
  })

  it('refuses a length that is not a power of two', () => {
    expect(() => realFft(new Float64Array(6))).toThrow(/power of two/)
  })
})
