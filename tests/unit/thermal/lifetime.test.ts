// Mission-profile lifetime (shared/thermal/lifetime.ts) against hand computations, marked as such.
import { describe, expect, it } from 'vitest'
import { BAYERER_DEFAULTS, capacitorLife, cyclesToFailure, powerCyclingLife } from '../../../shared/thermal/lifetime'

describe('power cycling life, Bayerer et al. (CIPS 2008) with Miner\'s rule', () => {
  it('cycles to failure: hand computation, factor by factor', () => {
    // Hand computation (ΔT_j 40 K, T_j,min 60 °C, t_on 0.25 s, 10 A per wire, 1200 V class, 300 µm wire):
    //   K 9.3e14 · 40^−4.416 (8.4198e−8) · e^(1285/333) (47.411) · 0.25^−0.463 (1.9000)
    //   · 10^−0.716 (0.19231) · 12^−0.761 (0.15092) · 300^−0.5 (0.057735) = 1.1820e7 cycles
    expect(Math.abs(cyclesToFailure(40, 60, 0.25, 1200) / 1.18196e7 - 1)).toBeLessThan(1e-4)
    // The defaults are the ones named on the result (from memory, editable).
    expect(BAYERER_DEFAULTS.beta1).toBe(-4.416)
    // A larger swing shortens life as ΔT^β1: doubling ΔT divides N_f by 2^4.416 ≈ 21.3.
    expect(cyclesToFailure(40, 60, 0.25, 1200) / cyclesToFailure(80, 60, 0.25, 1200)).toBeCloseTo(2 ** 4.416, 6)
    expect(cyclesToFailure(0, 60, 0.25, 1200)).toBe(Infinity)
  })

  it('Miner across a 2 Hz start point with starts and a 50 Hz point without swing: hand computation', () => {
    // Point A, 10 % of the hours: 2 Hz swing 40 K (T_j,min 60 °C, t_on 0.25 s) → 0.1·3600·2 = 720 cycles/h on
    // N_f 1.18196e7; 2 starts/h from 25 °C to the 80 °C mean, t_on = 0.1·3600/2 = 180 s:
    //   N_f = 9.3e14 · 55^−4.416 · e^(1285/298) · 180^−0.463 · 0.19231 · 0.15092 · 0.057735 = 2.16643e5.
    // Damage per hour 720/1.18196e7 + 2/2.16643e5 = 7.01474e−5 → life 14 256 h.
    const life = powerCyclingLife([
      { pointName: 'start', hoursShare: 0.1, startsPerHour: 2, fundamentalHz: 2, swingK: 40, minC: 60, meanC: 80, heatingTimeS: 0.25 },
      { pointName: 'rated', hoursShare: 0.9, fundamentalHz: 50, swingK: 0, minC: 90, meanC: 90, heatingTimeS: 0.01 },
    ], 1200, 25)
    expect(Math.abs(life.lifeHours / 14255.7 - 1)).toBeLessThan(1e-4)
    expect(life.perPoint[1]!.damagePerHour).toBe(0)
    // Outside the model's fitted range (t_on 0.25 s, ΔT 40 K): said on the result.
    expect(life.notes.join(' ')).toMatch(/heating time outside/)
    expect(life.notes.join(' ')).toMatch(/ΔT_j outside/)
  })
})

describe('electrolytic capacitor life (doubling per 10 K, common practice)', () => {
  it('hand computation over two points', () => {
    // 10 000 h at 105 °C, R_th 3.5 K/W, ambient 45 °C. 2 W → hot spot 52 °C → 10 000·2^5.3 = 393 966 h;
    // 5 W → 62.5 °C → 10 000·2^4.25 = 190 273 h. Miner with 70 % / 30 %: 1/(0.7/393 966 + 0.3/190 273) = 298 197 h.
    const life = capacitorLife([{ pointName: 'a', hoursShare: 0.7, lossW: 2 }, { pointName: 'b', hoursShare: 0.3, lossW: 5 }], 10000, 105, 3.5, 45)
    expect(life.perPoint[0]!.hotSpotC).toBeCloseTo(52, 12)
    expect(Math.abs(life.perPoint[1]!.lifeHours / 190273.14 - 1)).toBeLessThan(1e-6)
    expect(Math.abs(life.lifeHours / 298197.44 - 1)).toBeLessThan(1e-6)
  })
})
