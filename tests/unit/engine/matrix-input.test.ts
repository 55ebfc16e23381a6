// The matrix converter's input side against published closed forms and against a brute-force switched
// time-domain simulation written here on its own: ideal switches, each output connected to one input
// phase at every instant by carrier-level comparison, the star-connected filter capacitors and the filter
// inductors fed by a stiff grid behind a stated source resistance, integrated at 1000 steps per carrier period.
import { describe, expect, it } from 'vitest'
import { EngineInputError, evaluateDesign, evaluateStress, type StressInput } from '../../../shared/engine'
import { carrierPattern, matrixInputFigures, newPattern, newRectifier, rectifier } from '../../../shared/engine/matrix-input'
import { makeReference } from '../../../shared/engine/modulation'
import { lossProfile } from '../../../shared/engine/profile'
import { designInputSchema } from '../../../shared/schemas/stress'
import { expectClose } from './helpers'

const WHEELER = 'P. W. Wheeler et al., IEEE TIE 49(2) 2002'
const HUBER = 'L. Huber & D. Borojević, IEEE TIA 31(6) 1995'
const KOLAR = 'J. W. Kolar & S. D. Round, IEE Proc. EPA 153(4) 2006'
const TWO_PI = 2 * Math.PI
const SHIFT = TWO_PI / 3

interface Case {
  name: string
  q: number
  cosIn: number
  inSense: 'lagging' | 'leading'
  pf: number
  modulation: 'sine' | 'space-vector'
  fo: number
}

const VLL = 400
const FI = 50
const FSW = 5000
const IO = 50

const input = (c: Case, over: Partial<StressInput> = {}): StressInput => ({
  topology: 'matrix',
  inputLineVoltageRms: VLL,
  lineVoltageRms: c.q * VLL,
  phaseCurrentRms: IO,
  powerFactor: c.pf,
  fundamentalHz: c.fo,
  switchingHz: FSW,
  modulation: c.modulation,
  inputDisplacementFactor: c.cosIn,
  inputDisplacementSense: c.inSense,
  inputFrequencyHz: FI,
  ...over,
})

/** Pole reference per unit of the half virtual link (written here, not the engine's): sine or min-max injection. */
function reference(modulation: Case['modulation'], A: number, theta: number): number {
  const s = [0, 1, 2].map(k => Math.sin(theta - k * SHIFT))
  if (modulation === 'sine') return A * s[0]!
  return A * (s[0]! - (Math.max(...s) + Math.min(...s)) / 2)
}

/**
 * Which input phase each output is connected to at time t (indirect space-vector modulation, Huber &
 * Borojević 1995: the input phase with the largest |input-current reference| on one rail; the other rail
 * split between the other two phases in the sequence r₁/2, r₂/2, r₂/2, r₁/2; inside each segment output Y
 * on the positive rail while a centred window of width d_Y = (1 + m_Y·|c|)/2 is open).
 */
function connections(c: Case, t: number, out: number[], inputPhase = 0): void {
  const k = Math.floor(t * FSW)
  const tau = t * FSW - k
  const tc = (k + 0.5) / FSW
  const phiIn = (c.inSense === 'leading' ? -1 : 1) * Math.acos(c.cosIn)
  const cur = [0, 1, 2].map(x => Math.sin(TWO_PI * FI * tc + inputPhase - phiIn - x * SHIFT))
  let X = 0
  for (let x = 1; x < 3; x++) if (Math.abs(cur[x]!) > Math.abs(cur[X]!)) X = x
  const o1 = (X + 1) % 3
  const o2 = (X + 2) % 3
  const r1 = -cur[o1]! / cur[X]!
  const r2 = 1 - r1
  const bounds = [r1 / 2, r1 / 2 + r2 / 2, r1 / 2 + r2, 1]
  const seg = tau < bounds[0]! ? 0 : tau < bounds[1]! ? 1 : tau < bounds[2]! ? 2 : 3
  const segStart = seg === 0 ? 0 : bounds[seg - 1]!
  const local = (tau - segStart) / (bounds[seg]! - segStart)
  const split = seg === 0 || seg === 3 ? o1 : o2
  const positive = cur[X]! > 0 ? X : split
  const negative = cur[X]! > 0 ? split : X
  const A = (Math.SQRT2 * c.q * VLL) / (0.75 * Math.SQRT2 * VLL * c.cosIn)
  for (let y = 0; y < 3; y++) {
    const d = (1 + reference(c.modulation, A, TWO_PI * c.fo * tc - y * SHIFT) * Math.abs(cur[X]!)) / 2
    out[y] = Math.abs(local - 0.5) < d / 2 ? positive : negative
  }
}

interface SimResult {
  inputFundamentalRms: number
  inputRms: number
  inputAverage: number
  inputPeak: number
  pathAverage: number
  pathRms: number
  pathPeak: number
  capacitorRipplePp: number
  capacitorCurrentRms: number
  inductorCurrentRms: number
}

/** Brute-force run: settle 40 ms, then measure over 100 ms (whole periods of 50 Hz and of the 30 Hz output). */
function simulate(c: Case, C: number, L: number): SimResult {
  const Vph = (Math.SQRT2 * VLL) / Math.sqrt(3)
  const wi = TWO_PI * FI
  const Io = Math.SQRT2 * IO
  const phiOut = Math.acos(c.pf)
  const phiIn = (c.inSense === 'leading' ? -1 : 1) * Math.acos(c.cosIn)
  // Source resistance (stated): 0.3·√(L/C), damping the L–C resonance (ζ = 0.15) so the start settles.
  const R = 0.3 * Math.sqrt(L / C)
  // Phasors (v = Im(V·e^{jωt})): capacitor voltage V̂∠−2πx/3, converter input current by power balance at ∠−φ_in.
  const power = 3 * ((c.q * Vph) / Math.SQRT2) * (Io / Math.SQRT2) * c.pf
  const Iin = power / (1.5 * Vph * c.cosIn)
  const state = [0, 1, 2].map((x) => {
    const a = -x * SHIFT
    const vc = { re: Vph * Math.cos(a), im: Vph * Math.sin(a) }
    const iin = { re: Iin * Math.cos(a - phiIn), im: Iin * Math.sin(a - phiIn) }
    const il = { re: iin.re - wi * C * vc.im, im: iin.im + wi * C * vc.re }
    const vs = { re: vc.re + R * il.re - wi * L * il.im, im: vc.im + R * il.im + wi * L * il.re }
    return { vc: vc.im, il: il.im, vs }
  })
  const steps = 1000
  const dt = 1 / (FSW * steps)
  const settle = 0.04
  const window = 0.1
  const total = Math.round((settle + window) / dt)
  const start = Math.round(settle / dt)
  const conn = [0, 0, 0]
  const acc = { in2: 0, inAbs: 0, inPeak: 0, inSin: 0, inCos: 0, p2: 0, pAbs: 0, pPeak: 0, c2: 0, l2: 0 }
  const vcTrace = [0, 1, 2].map(() => new Float64Array(total - start))
  let n = 0
  for (let s = 0; s < total; s++) {
    const t = (s + 0.5) * dt
    connections(c, t, conn)
    const io = [0, 1, 2].map(y => Io * Math.sin(TWO_PI * c.fo * t - y * SHIFT - phiOut))
    for (let x = 0; x < 3; x++) {
      let iin = 0
      for (let y = 0; y < 3; y++) if (conn[y] === x) iin += io[y]!
      const st = state[x]!
      const vs = st.vs.re * Math.sin(wi * t) + st.vs.im * Math.cos(wi * t)
      // Semi-implicit Euler: inductor first, then the capacitor with the new inductor current.
      st.il += (dt * (vs - R * st.il - st.vc)) / L
      st.vc += (dt * (st.il - iin)) / C
      if (s >= start) {
        vcTrace[x]![n] = st.vc
        if (x === 0) {
          acc.in2 += iin * iin
          acc.inAbs += Math.abs(iin)
          acc.inPeak = Math.max(acc.inPeak, Math.abs(iin))
          acc.inSin += iin * Math.sin(wi * t)
          acc.inCos += iin * Math.cos(wi * t)
          const ip = conn[0] === 0 ? io[0]! : 0
          acc.p2 += ip * ip
          acc.pAbs += Math.abs(ip)
          acc.pPeak = Math.max(acc.pPeak, Math.abs(ip))
          acc.c2 += (st.il - iin) ** 2
          acc.l2 += st.il ** 2
        }
      }
    }
    if (s >= start) n++
  }
  // Ripple: each capacitor voltage minus its input-frequency component (projection over the whole window).
  let ripple = 0
  for (let x = 0; x < 3; x++) {
    const v = vcTrace[x]!
    let a = 0, b = 0
    for (let k = 0; k < n; k++) {
      const t = (start + k + 0.5) * dt
      a += v[k]! * Math.sin(wi * t)
      b += v[k]! * Math.cos(wi * t)
    }
    a *= 2 / n
    b *= 2 / n
    let hi = -Infinity, lo = Infinity
    for (let k = 0; k < n; k++) {
      const t = (start + k + 0.5) * dt
      const r = v[k]! - a * Math.sin(wi * t) - b * Math.cos(wi * t)
      hi = Math.max(hi, r)
      lo = Math.min(lo, r)
    }
    ripple = Math.max(ripple, hi - lo)
  }
  return {
    inputFundamentalRms: Math.hypot((2 * acc.inSin) / n, (2 * acc.inCos) / n) / Math.SQRT2,
    inputRms: Math.sqrt(acc.in2 / n),
    inputAverage: acc.inAbs / n,
    inputPeak: acc.inPeak,
    pathAverage: acc.pAbs / n,
    pathRms: Math.sqrt(acc.p2 / n),
    pathPeak: acc.pPeak,
    capacitorRipplePp: ripple,
    capacitorCurrentRms: Math.sqrt(acc.c2 / n),
    inductorCurrentRms: Math.sqrt(acc.l2 / n),
  }
}

const cases: Case[] = [
  { name: 'unity input, space-vector, q 0.75', q: 0.75, cosIn: 1, inSense: 'lagging', pf: 0.85, modulation: 'space-vector', fo: 30 },
  { name: 'input 0.9 leading, sine, q 0.6', q: 0.6, cosIn: 0.9, inSense: 'leading', pf: 0.8, modulation: 'sine', fo: 30 },
]

describe('matrix converter input side: closed forms', () => {
  it.each(cases)(`$name: input current q·I_o·cos φ_o / cos φ_in (${WHEELER}); switched RMS (${KOLAR} with ${HUBER}); switch path I_o/√3 (${WHEELER})`, (c) => {
    const r = evaluateStress(input(c))
    const s = r.inputSide!
    // Fundamental by power balance through lossless switches (Wheeler 2002, eq. for the input current).
    expectClose(s.phaseCurrent.fundamentalRms, (c.q * IO * c.pf) / c.cosIn, 1e-6, 'input fundamental')
    // Switched input current: the virtual inverter's rail current RMS² (2√3/π)·M·I_o²·(1/4 + cos²φ_o) (Kolar & Round),
    // M = q / (0.75·cos φ_in), shared by the input phases with weight |c_x| / |c_max| (mean 2/π, Huber & Borojević):
    // I_in,rms² = 16·q·I_o²·(1/4 + cos²φ_o) / (√3·π²·cos φ_in) — derived here from those two.
    const closed = Math.sqrt((16 * c.q * IO ** 2 * (0.25 + c.pf ** 2)) / (Math.sqrt(3) * Math.PI ** 2 * c.cosIn))
    expectClose(s.phaseCurrent.rms, closed, 2e-3, 'input RMS')
    // Each bidirectional switch carries the output current a third of the time on average (Wheeler 2002).
    expectClose(s.switchPath.rms, IO / Math.sqrt(3), 1e-3, 'path RMS')
    expectClose(s.switchPath.average, (2 * Math.SQRT2 * IO) / (3 * Math.PI), 2e-3, 'path mean')
    expectClose(s.switchPath.peak, Math.SQRT2 * IO, 1e-9, 'path peak')
    // Transfer limit (√3/2)·cos φ_in with injection, 0.75·cos φ_in with sine (Huber & Borojević 1995; Wheeler 2002).
    expectClose(s.transferLimit, (c.modulation === 'sine' ? 0.75 : Math.sqrt(3) / 2) * c.cosIn, 1e-12, 'limit')
    expect(s.displacement).toEqual({ value: c.cosIn, sense: c.inSense, angle: (c.inSense === 'leading' ? -1 : 1) * Math.acos(c.cosIn) })
  })

  it(`filter: f_res = 1/(2π√(LC)); capacitor current ω·C·V_ph at the input frequency; capacitor voltage = input phase voltage (first principles)`, () => {
    const r = evaluateStress(input(cases[0]!, { inputFilterResonanceHz: 800 }))
    const f = r.inputSide!.filter
    expectClose(1 / (TWO_PI * Math.sqrt(f.inductance * f.capacitance)), 800, 1e-12, 'resonance')
    expectClose(f.capacitorFundamentalCurrentRms, TWO_PI * FI * f.capacitance * (VLL / Math.sqrt(3)), 1e-12, 'capacitor fundamental')
    expectClose(f.capacitorVoltageRms, VLL / Math.sqrt(3), 1e-12, 'capacitor voltage')
    expectClose(f.reactivePower, 3 * TWO_PI * FI * f.capacitance * (VLL / Math.sqrt(3)) ** 2, 1e-12, 'reactive power')
    // Default ripple target 5 % of the peak phase voltage; default resonance √(2·f_in·f_sw) (common practice).
    const d = evaluateStress(input(cases[0]!)).inputSide!.filter
    expectClose(d.rippleTarget, 0.05 * Math.SQRT2 * VLL / Math.sqrt(3), 1e-12, 'default ripple target')
    expectClose(d.resonanceHz, Math.sqrt(2 * FI * FSW), 1e-12, 'default resonance')
    // Halving the ripple target doubles the capacitance (C = Q_pp / ΔV).
    const half = evaluateStress(input(cases[0]!, { capacitorRippleTarget: d.rippleTarget / 2 })).inputSide!.filter
    expectClose(half.capacitance, 2 * d.capacitance, 1e-9, 'C ∝ 1/ΔV')
  })

  it(`the capacitor position carries the filter figures; a lower input displacement factor lowers the transfer limit and warns (${HUBER})`, () => {
    const r = evaluateStress(input(cases[0]!))
    const cap = r.capacitors.find(x => x.kind === 'input-filter')!
    const f = r.inputSide!.filter
    expect(cap).toMatchObject({ name: 'Cf', count: 3, capacitanceRequired: f.capacitance, rippleTarget: f.rippleTarget })
    expectClose(cap.voltage, Math.SQRT2 * VLL / Math.sqrt(3) + f.rippleTarget / 2, 1e-12, 'peak voltage')
    expectClose(cap.rippleCurrentRms, Math.hypot(f.capacitorSwitchingCurrentRms, f.capacitorFundamentalCurrentRms), 1e-12, 'ripple current')
    // q 0.75 is linear at cos φ_in = 1 (limit 0.866) but not at 0.8 (limit 0.693).
    const low = evaluateStress(input(cases[0]!, { inputDisplacementFactor: 0.8 }))
    expect(low.warnings.some(w => w.startsWith('Over-modulation') && /0\.693/.test(w))).toBe(true)
    expect(low.lineVoltageFundamentalRms).toBeLessThan(0.75 * VLL)
    expect(r.warnings.some(w => w.startsWith('Over-modulation'))).toBe(false)
  })
})

describe('matrix converter input side: brute-force switched simulation', () => {
  it.each(cases)(`$name: currents, capacitor ripple with the engine's C within 4 % of the target, L–C resonance`, (c) => {
    const r = evaluateStress(input(c))
    const s = r.inputSide!
    const f = s.filter
    const sim = simulate(c, f.capacitance, f.inductance)
    expectClose(sim.inputFundamentalRms, s.phaseCurrent.fundamentalRms, 1e-2, 'input fundamental')
    expectClose(sim.inputRms, s.phaseCurrent.rms, 1e-2, 'input RMS')
    expectClose(sim.inputAverage, s.phaseCurrent.average, 1e-2, 'input mean')
    expectClose(sim.inputPeak, s.phaseCurrent.peak, 1e-2, 'input peak')
    expectClose(sim.pathRms, s.switchPath.rms, 1e-2, 'path RMS')
    expectClose(sim.pathAverage, s.switchPath.average, 1e-2, 'path mean')
    expectClose(sim.pathPeak, s.switchPath.peak, 1e-2, 'path peak')
    expectClose(sim.capacitorCurrentRms, f.capacitorCurrentRms, 3e-2, 'capacitor current')
    expectClose(sim.inductorCurrentRms, f.inductorCurrentRms, 3e-2, 'inductor current')
    // The ripple the engine's capacitance gives in the switched run meets the target within 4 %.
    expectClose(sim.capacitorRipplePp, f.rippleTarget, 4e-2, 'capacitor ripple')
  }, 60_000)

  it('free ringing of the engine\'s L and C: the period is 1/f_res (ideal L–C, first principles)', () => {
    const f = evaluateStress(input(cases[0]!)).inputSide!.filter
    const dt = 1 / (f.resonanceHz * 20_000)
    let v = 1, i = 0, t = 0, crossings: number[] = []
    for (let k = 0; k < 20_000 * 5; k++) {
      i += (dt * v) / f.inductance
      const before = v
      v -= (dt * i) / f.capacitance
      t += dt
      if (before > 0 && v <= 0) crossings.push(t - (dt * v) / (v - before))
    }
    crossings = crossings.slice(1)
    const period = (crossings[crossings.length - 1]! - crossings[0]!) / (crossings.length - 1)
    expectClose(1 / period, f.resonanceHz, 1e-3, 'ringing frequency')
  })

  it('the output is made of segments of the input voltages: sample means equal a fine-step run of the same switching, line peaks above a fixed 1.5·V̂ link', () => {
    const c = cases[0]!
    const r = evaluateStress(input(c), { includeWaveform: true, samples: 4096 })
    const w = r.waveform!
    const S = w.lineVoltage.length
    const Vph = (Math.SQRT2 * VLL) / Math.sqrt(3)
    const steps = 64
    const conn = [0, 0, 0]
    let sq = 0
    let worst = 0
    for (let j = 0; j < S; j++) {
      let sum = 0
      for (let k = 0; k < steps; k++) {
        const t = (j + (k + 0.5) / steps) / (S * c.fo)
        connections(c, t, conn)
        const u = Vph * (Math.sin(TWO_PI * FI * t - conn[0]! * SHIFT) - Math.sin(TWO_PI * FI * t - conn[1]! * SHIFT))
        sum += u
        sq += u * u
      }
      worst = Math.max(worst, Math.abs(sum / steps - w.lineVoltage[j]!))
    }
    // Edges inside a sample are resolved to 1/64 of it by the fine run: a sample may differ by up to 2·√3·V̂/64.
    expect(worst).toBeLessThan((2 * Math.sqrt(3) * Vph) / steps)
    const rms = Math.sqrt(sq / (S * steps))
    expectClose(rms, r.lineVoltageFundamentalRms * Math.sqrt(1 + r.lineVoltageThd ** 2), 5e-3, 'line RMS (full-band THD)')
    // A fixed virtual link of 1.5·V̂ could never exceed 1.5·V̂ line-to-line; the input line voltages reach √3·V̂.
    expect(Math.max(...w.lineVoltage.map(Math.abs))).toBeGreaterThan(1.6 * Vph)
    expect(Math.max(...w.lineVoltage.map(Math.abs))).toBeLessThanOrEqual(Math.sqrt(3) * Vph * (1 + 1e-9))
  })
})

// Switching losses: every change of output a's input phase in the time-stepped run is one commutation A → B of the
// output current; the voltage commutated is the instantaneous input line-to-line voltage v_AB, and with the
// current's sign known the four-step sequence makes it a turn-on of the incoming switch with recovery of the
// outgoing path's diode when the current's sign and v_B − v_A agree, else a turn-off of the outgoing switch
// (P. W. Wheeler, J. Rodríguez, J. C. Clare et al., "Matrix converters: a technology review", IEEE Trans. Ind.
// Electron. 49(2), 2002, section III: four-step commutation). The run uses this file's own connections(), the
// current and voltage at the sample where the change is seen, and classifies on its own.
describe('matrix converter switching duty: brute-force run of the commutations', () => {
  /**
   * V·A per carrier period by position and role, mean over one output period; the input and output are unrelated,
   * so the run is repeated with the input voltages starting at `offsets` phases spread over a period.
   */
  function bruteForce(c: Case, stepsPerCarrier: number, offsets: number) {
    const Vph = (Math.SQRT2 * VLL) / Math.sqrt(3)
    const Io = Math.SQRT2 * IO
    const phiOut = Math.acos(c.pf)
    const carriers = Math.round(FSW / c.fo)
    const dt = 1 / (FSW * stepsPerCarrier)
    const sums = new Map<string, number>()
    const add = (name: string, role: 'turnOn' | 'turnOff' | 'recovery', x: number) => sums.set(`${name} ${role}`, (sums.get(`${name} ${role}`) ?? 0) + x)
    const conn = [0, 0, 0]
    const phase = ['R', 'S', 'T']
    for (let o = 0; o < offsets; o++) {
      const start = (TWO_PI * o) / offsets
      connections(c, -0.5 * dt, conn, start)
      let from = conn[0]!
      for (let s = 0; s < carriers * stepsPerCarrier; s++) {
        const t = (s + 0.5) * dt
        connections(c, t, conn, start)
        const to = conn[0]!
        if (to === from) continue
        const i = Io * Math.sin(TWO_PI * c.fo * t - phiOut)
        const vA = Vph * Math.sin(TWO_PI * FI * t + start - from * SHIFT)
        const vB = Vph * Math.sin(TWO_PI * FI * t + start - to * SHIFT)
        const x = Math.abs(i) * Math.abs(vB - vA)
        const [A, B, sw, dio] = [phase[from], phase[to], i >= 0 ? '+' : '-', i >= 0 ? '-' : '+']
        if ((i >= 0) === (vB > vA)) { add(`S${B}${sw}`, 'turnOn', x); add(`D${A}${dio}`, 'recovery', x) }
        else add(`S${A}${sw}`, 'turnOff', x)
        from = to
      }
    }
    for (const [k, v] of sums) sums.set(k, v / (carriers * offsets))
    return sums
  }

  it.each([
    { name: 'sine, unity input, pf 0.85', q: 0.5, cosIn: 1, inSense: 'lagging' as const, pf: 0.85, modulation: 'sine' as const, fo: 10 },
    { name: 'space vector, input 0.9 leading, regenerating', q: 0.6, cosIn: 0.9, inSense: 'leading' as const, pf: -0.7, modulation: 'space-vector' as const, fo: 10 },
  ])('$name: Σ |i|·|v_AB| per carrier period by position and role within 1 % of the time-stepped run', (c) => {
    const r = evaluateStress(input(c))
    const brute = bruteForce(c, 1000, 6)
    let total = 0
    for (const d of r.devices) {
      for (const role of ['turnOn', 'turnOff', 'recovery'] as const) {
        const engine = d.switchingDuty![role]
        const run = brute.get(`${d.name} ${role}`) ?? 0
        total += run
        if (run === 0) expect(engine, `${d.name} ${role}`).toBe(0)
        else expectClose(engine, run, 1e-2, `${d.name} ${role}`)
      }
    }
    // The thermal profile's bins average to the same duty (shared/engine/profile.ts uses the same sums per angle bin).
    const profile = lossProfile(input(c))
    for (const d of r.devices.slice(0, 4)) {
      const bins = profile.positions.find(p => p.name === d.name)!
      const mean = (a: Float64Array) => a.reduce((x, y) => x + y, 0) / a.length
      const role = d.kind === 'switch' ? 'turnOn' : 'recovery'
      expectClose(mean(bins[role]!), d.switchingDuty![role], 2e-3, `${d.name} profile ${role}`)
    }
    // Something was switched, and every switch both turns on and off; diodes only recover.
    expect(total).toBeGreaterThan(0)
    for (const d of r.devices) {
      if (d.kind === 'switch') expect(d.switchingDuty!.turnOn * d.switchingDuty!.turnOff).toBeGreaterThan(0)
      else expect(d.switchingDuty!.turnOn + d.switchingDuty!.turnOff).toBe(0)
    }
  }, 60_000)
})

describe('matrix converter input side: the ripple-charge search', () => {
  it.each([
    { modulation: 'space-vector', A: 1.1, phiIn: 0, phiOut: 0.5 },
    { modulation: 'sine', A: 0.5, phiIn: 0.45, phiOut: 0.1 },
    { modulation: 'third-harmonic', A: 1, phiIn: -0.3, phiOut: -0.6 },
  ] as const)('$modulation A=$A: the refined sector search finds the largest charge of a 120 × 120 grid over whole input and output periods (brute force)', ({ modulation, A, phiIn, phiOut }) => {
    const ref = makeReference(modulation, A)
    const Ipk = 100
    const f = matrixInputFigures({ reference: ref, inputPhasePeak: 326, phiIn, inputHz: 50, currentPeak: Ipk, phiOut, fundamentalHz: 40, switchingHz: 5000, power: 1e4, rippleTarget: 10, resonanceHz: 500 })
    const pattern = newPattern()
    const rect = newRectifier()
    const d = new Float64Array(3)
    let best = 0
    const N = 120
    for (let a = 0; a < N; a++) {
      for (let b = 0; b < N; b++) {
        const ti = ((a + 0.5) / N) * TWO_PI
        const to = ((b + 0.5) / N) * TWO_PI
        rectifier(ti, phiIn, rect)
        const cur = [0, 1, 2].map(y => Ipk * Math.sin(to - y * SHIFT - phiOut))
        for (let y = 0; y < 3; y++) d[y] = (1 + ref(to - y * SHIFT) * rect.a) / 2
        carrierPattern(rect, d, pattern)
        for (let x = 0; x < 3; x++) {
          let mean = 0
          let prev = 0
          const i: number[] = []
          for (let j = 0; j < pattern.n; j++) {
            i.push([0, 1, 2].reduce((sum, y) => sum + (pattern.conn[3 * j + y] === x ? cur[y]! : 0), 0))
            mean += (pattern.end[j]! - prev) * i[j]!
            prev = pattern.end[j]!
          }
          let q = 0
          prev = 0
          for (let j = 0; j < pattern.n; j++) {
            q += (pattern.end[j]! - prev) * (i[j]! - mean)
            prev = pattern.end[j]!
            best = Math.max(best, Math.abs(q))
          }
        }
      }
    }
    const engine = f.chargeAbove * 5000
    expect(engine).toBeGreaterThanOrEqual(best * (1 - 1e-6))
    expect(engine).toBeLessThanOrEqual(best * 1.01)
  })
})

describe('matrix converter input side: refusals', () => {
  it.each([
    { field: 'inputDisplacementFactor', value: 1.2, message: /at most 1 \(unity\)/ },
    { field: 'inputDisplacementFactor', value: 0.1, message: /at least 0\.2/ },
    { field: 'inputFilterResonanceHz', value: 60, message: /above twice the input frequency/ },
    { field: 'inputFilterResonanceHz', value: 3000, message: /below half the switching frequency/ },
    { field: 'inputFrequencyHz', value: 5000, message: /at most 2 kHz/ },
    { field: 'inputDisplacementSense', value: 'ahead', message: /lagging \(inductive\) or leading/ },
  ])('$field = $value is refused naming the field, engine and design schema alike', ({ field, value, message }) => {
    const bad = { ...input(cases[0]!), [field]: value } as StressInput
    let error: unknown
    try { evaluateStress(bad) }
    catch (e) { error = e }
    expect(error).toBeInstanceOf(EngineInputError)
    expect((error as EngineInputError).field).toBe(field)
    expect((error as Error).message).toMatch(message)
    const { lineVoltageRms, phaseCurrentRms, powerFactor, fundamentalHz, ...converter } = bad
    const parsed = designInputSchema.safeParse({ machineSide: { ...converter, operatingPoints: [{ name: 'P', lineVoltageRms, phaseCurrentRms, powerFactor, fundamentalHz }] } })
    expect(parsed.success).toBe(false)
    expect(parsed.error!.issues.some(i => i.path.join('.') === `machineSide.${field}` && message.test(i.message))).toBe(true)
  })

  it('a design: the filter capacitor in the envelope, the inductor sized for the envelope capacitance', () => {
    const c = cases[0]!
    const r = evaluateDesign({
      machineSide: {
        topology: 'matrix', inputLineVoltageRms: VLL, switchingHz: FSW, modulation: 'space-vector', inputFrequencyHz: FI,
        operatingPoints: [
          { name: 'Rated', lineVoltageRms: c.q * VLL, phaseCurrentRms: IO, powerFactor: 0.85, fundamentalHz: 35 },
          { name: 'Overload', lineVoltageRms: 0.5 * VLL, phaseCurrentRms: 1.5 * IO, powerFactor: 0.85, fundamentalHz: 25 },
        ],
      },
    })
    const conv = r.converters[0]!
    const cap = conv.envelope.capacitors.find(x => x.kind === 'input-filter')!
    const cs = conv.points.map(p => p.inputSide!.filter.capacitance)
    expect(cap.capacitanceRequired).toBe(Math.max(...cs))
    expect(cap.worstPoint!.capacitanceRequired).toBe(cs[1]! > cs[0]! ? 'Overload' : 'Rated')
    const lf = conv.envelope.inductors!.find(x => x.name === 'Lf')!
    expectClose(1 / (TWO_PI * Math.sqrt(lf.inductance * cap.capacitanceRequired!)), lf.resonanceHz, 1e-12, 'envelope resonance')
    expect(lf.count).toBe(3)
    expect(lf.currentRms).toBeGreaterThan(0)
  })
})
