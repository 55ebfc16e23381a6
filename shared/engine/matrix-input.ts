// The 3×3 matrix converter's input side: the carrier-period switching pattern between input phases
// (indirect space-vector modulation realised directly on the nine switches), the input currents per
// phase and per bidirectional switch path, the input filter, and the output voltages synthesised from
// segments of the input voltages.
//
// Pattern of one carrier period (indirect modulation, L. Huber & D. Borojević, IEEE TIA 31(6) 1995;
// reviewed in P. W. Wheeler et al., IEEE TIE 49(2) 2002): the virtual rectifier keeps the input phase X*
// with the largest |input-current reference| c_X = sin(θ_i − φ_i − 2πX/3) on one rail for the whole
// period and splits the other rail between the two other phases, segment k lasting r_k = −c_k / c_X*
// of the period (r_1 + r_2 = 1; the phase after X*, then the one before it, each split in halves placed
// symmetrically about the period's centre: r_1/2, r_2/2, r_2/2, r_1/2). Inside each segment
// every output phase Y sits on the positive rail for the centred fraction d_Y = (1 + m_Y·|c_X*|) / 2 of
// it and on the negative rail otherwise (m_Y the pole reference per unit of 0.75·V̂_in·cos φ_i). So the
// output phase is always one of the three input voltages, never a fixed DC link; its local mean is the
// reference, and the input-current local means are sinusoidal at the displacement angle φ_i.
import { gridTrig, valuesOnGrid } from './modulation'
import type { CapacitorStress, MatrixInputSide } from './types'
import type { ResolvedInput } from './validate'

const TWO_PI = 2 * Math.PI
const SHIFT = TWO_PI / 3

/** One carrier period's connections: interval ends (fractions of the period) and, per interval, the input phase of each output. */
export interface CarrierPattern {
  /** number of intervals */
  n: number
  /** end of interval j as a fraction of the carrier period (start = end of j − 1, 0 for j = 0) */
  end: Float64Array
  /** input phase (0, 1, 2) of output phase Y in interval j: conn[3·j + Y] */
  conn: Int8Array
}

export function newPattern(): CarrierPattern {
  return { n: 0, end: new Float64Array(28), conn: new Int8Array(84) }
}

/** The virtual rectifier at input angle θ_i: clamped phase, its rail sign, |c_X*| and the two segments' phases and lengths. */
export interface RectifierState {
  clamped: number
  /** +1: the clamped phase is the positive rail; −1: the negative rail */
  sign: number
  /** |c_X*| ∈ [√3/2, 1] */
  a: number
  /** the split rail's phase in segment 1 and 2 */
  split: [number, number]
  /** the segments' lengths r_1, r_2 (sum 1) */
  r: [number, number]
}

export function rectifier(thetaI: number, phiI: number, out: RectifierState): RectifierState {
  const c0 = Math.sin(thetaI - phiI)
  const c1 = Math.sin(thetaI - phiI - SHIFT)
  const c2 = Math.sin(thetaI - phiI + SHIFT)
  const a0 = Math.abs(c0)
  const a1 = Math.abs(c1)
  const a2 = Math.abs(c2)
  const X = a0 >= a1 && a0 >= a2 ? 0 : a1 >= a2 ? 1 : 2
  const c = [c0, c1, c2]
  const cx = c[X]!
  const o1 = (X + 1) % 3
  const o2 = (X + 2) % 3
  out.clamped = X
  out.sign = cx >= 0 ? 1 : -1
  out.a = Math.abs(cx)
  out.split[0] = o1
  out.split[1] = o2
  const r1 = Math.min(1, Math.max(0, -c[o1]! / cx))
  out.r[0] = r1
  out.r[1] = 1 - r1
  return out
}

export function newRectifier(): RectifierState {
  return { clamped: 0, sign: 1, a: 1, split: [1, 2], r: [0.5, 0.5] }
}

/**
 * Fills `pattern` with the carrier period's intervals for the rectifier state and the output duties
 * d_Y (fraction of each segment on the positive rail, centred). Symmetric sequence: the two segments
 * split in halves, r_1/2, r_2/2, r_2/2, r_1/2, so each input voltage is used symmetrically about the
 * period's centre (where the references are sampled). Intervals with the same connections merge.
 */
export function carrierPattern(rect: RectifierState, d: Float64Array, pattern: CarrierPattern): void {
  // Outputs ordered by duty, largest first: their pulses nest (centred), so edges come in that order.
  let i0 = 0, i1 = 1, i2 = 2
  if (d[i1]! > d[i0]!) [i0, i1] = [i1, i0]
  if (d[i2]! > d[i1]!) [i1, i2] = [i2, i1]
  if (d[i1]! > d[i0]!) [i0, i1] = [i1, i0]
  const d0 = d[i0]!, d1 = d[i1]!, d2 = d[i2]!
  let n = 0
  let start = 0
  for (let h = 0; h < 4; h++) {
    const k = h === 0 || h === 3 ? 0 : 1
    const len = rect.r[k]! / 2
    if (len <= 0) continue
    const other = rect.split[k]!
    const p = rect.sign > 0 ? rect.clamped : other
    const q = rect.sign > 0 ? other : rect.clamped
    // 7 intervals: 0, 1, 2, 3, 2, 1, 0 outputs (in duty order) on the positive rail.
    for (let j = 0; j < 7; j++) {
      const end = j === 0 ? (1 - d0) / 2 : j === 1 ? (1 - d1) / 2 : j === 2 ? (1 - d2) / 2 : j === 3 ? (1 + d2) / 2 : j === 4 ? (1 + d1) / 2 : j === 5 ? (1 + d0) / 2 : 1
      const high = j < 4 ? j : 6 - j
      const a = high > 0 ? p : q
      const b = high > 1 ? p : q
      const c = high > 2 ? p : q
      const t = start + len * end
      if (n > 0 && pattern.conn[3 * n - 3 + i0] === a && pattern.conn[3 * n - 3 + i1] === b && pattern.conn[3 * n - 3 + i2] === c) {
        pattern.end[n - 1] = t
        continue
      }
      pattern.end[n] = t
      pattern.conn[3 * n + i0] = a
      pattern.conn[3 * n + i1] = b
      pattern.conn[3 * n + i2] = c
      n++
    }
    start += len
  }
  pattern.end[n - 1] = 1
  pattern.n = n
}

export interface MatrixInputContext {
  /** clamped pole reference of output phase a per unit of 0.75·V̂_in·cos φ_i */
  reference: (theta: number) => number
  /** V, peak input phase voltage √2·V_LL,in/√3 */
  inputPhasePeak: number
  /** rad, input current behind the input voltage (negative = leading) */
  phiIn: number
  inputHz: number
  /** A, output current peak */
  currentPeak: number
  /** rad, output current behind the output voltage */
  phiOut: number
  fundamentalHz: number
  switchingHz: number
  /** W, output real power (3 V_ph I cos φ) */
  power: number
  /** V peak-to-peak on the filter capacitor */
  rippleTarget: number
  /** Hz, L–C resonance target */
  resonanceHz: number
}

export interface MatrixInputFigures {
  /** A, converter-side input current per phase */
  phaseCurrent: { fundamentalRms: number, rms: number, average: number, peak: number }
  /** A, one bidirectional switch (input X ↔ output Y, both directions together) */
  switchPath: { average: number, rms: number, peak: number }
  /** C, largest charge excursion from the carrier period's start in one capacitor, over all input / output angle pairs */
  chargeAbove: number
  /** F per phase (star) */
  capacitance: number
  /** H per phase */
  inductance: number
  /** A RMS, the switching part of the capacitor current (converter input current minus its local mean) */
  capacitorSwitchingRms: number
  /** A RMS, the capacitor's input-frequency current ω_i·C·V_ph */
  capacitorFundamentalRms: number
  /** A RMS, grid-side (inductor) fundamental: converter input fundamental plus the capacitor current */
  inductorCurrentRms: number
  /** the grid side's displacement factor after the filter capacitor */
  gridDisplacement: { value: number, sense: 'lagging' | 'leading' }
}

const GRID_I = 96
const GRID_O = 128

/**
 * Input-side figures from the pattern. Means over the (unrelated) input and output periods: the duty of
 * each pattern interval is a product of an input-angle factor and an output-angle factor, so every mean
 * is a product of two one-dimensional means (taken numerically here); the ripple charge is searched on a
 * grid of input × output angles, refined twice around its largest value.
 */
export function matrixInputFigures(ctx: MatrixInputContext): MatrixInputFigures {
  const { reference, currentPeak, phiOut, phiIn } = ctx
  // Output-angle means (two-level virtual inverter pattern at |c_X*| = 1): the current the positive
  // rail carries while one / two outputs are on it, weighted by the duty differences (m_1 − m_2)/2, (m_2 − m_3)/2.
  let m1 = 0 // mean |i_rail|
  let m2 = 0 // mean i_rail²
  let peak = 0
  let pathAbs = 0 // mean |i_Y|
  let pathSq = 0 // mean i_Y²
  let pathAbsM = 0 // mean m_Y·|i_Y|
  let pathSqM = 0 // mean m_Y·i_Y²
  for (let k = 0; k < GRID_O; k++) {
    const th = ((k + 0.5) * TWO_PI) / GRID_O
    const m = [reference(th), reference(th - SHIFT), reference(th + SHIFT)]
    const i = [currentPeak * Math.sin(th - phiOut), currentPeak * Math.sin(th - SHIFT - phiOut), currentPeak * Math.sin(th + SHIFT - phiOut)]
    let a = 0, b = 1, c = 2
    if (m[b]! > m[a]!) [a, b] = [b, a]
    if (m[c]! > m[b]!) [b, c] = [c, b]
    if (m[b]! > m[a]!) [a, b] = [b, a]
    const w1 = (m[a]! - m[b]!) / 2
    const w2 = (m[b]! - m[c]!) / 2
    m1 += w1 * Math.abs(i[a]!) + w2 * Math.abs(i[c]!)
    m2 += w1 * i[a]! ** 2 + w2 * i[c]! ** 2
    if (w1 > 0) peak = Math.max(peak, Math.abs(i[a]!))
    if (w2 > 0) peak = Math.max(peak, Math.abs(i[c]!))
    pathAbs += Math.abs(i[0]!)
    pathSq += i[0]! ** 2
    pathAbsM += m[0]! * Math.abs(i[0]!)
    pathSqM += m[0]! * i[0]! ** 2
  }
  m1 /= GRID_O; m2 /= GRID_O; pathAbs /= GRID_O; pathSq /= GRID_O; pathAbsM /= GRID_O; pathSqM /= GRID_O

  // Input-angle means for input phase 0: its share of the rail current (w = r on the rail it holds) × |c_X*|,
  // and its duties on the positive and negative rail.
  const rect = newRectifier()
  let share = 0 // mean of w·a
  let railSum = 0 // mean (r⁺ + r⁻)/2
  let railDiff = 0 // mean a·(r⁺ − r⁻)/2
  for (let k = 0; k < GRID_I; k++) {
    rectifier(((k + 0.5) * TWO_PI) / GRID_I, phiIn, rect)
    let rp = 0, rn = 0
    if (rect.clamped === 0) { if (rect.sign > 0) rp = 1; else rn = 1 }
    else {
      const r = rect.split[0] === 0 ? rect.r[0] : rect.r[1]
      if (rect.sign > 0) rn = r; else rp = r
    }
    share += (rp + rn) * rect.a
    railSum += (rp + rn) / 2
    railDiff += (rect.a * (rp - rn)) / 2
  }
  share /= GRID_I; railSum /= GRID_I; railDiff /= GRID_I

  const rms = Math.sqrt(Math.max(0, share * m2))
  const fundamentalRms = ctx.power / (3 * (ctx.inputPhasePeak / Math.SQRT2) * Math.cos(phiIn))
  const pathAverage = railSum * pathAbs + railDiff * pathAbsM
  const pathRms = Math.sqrt(Math.max(0, railSum * pathSq + railDiff * pathSqM))

  const chargeAbove = largestCharge(ctx)
  // The inductor branch takes part of the switching current in anti-phase: at f_sw the capacitor voltage is
  // 1/(1 − (f_res/f_sw)²) of the capacitor-alone value (parallel L–C admittance, first principles).
  const lcFactor = 1 / (1 - (ctx.resonanceHz / ctx.switchingHz) ** 2)
  const capacitance = chargeAbove > 0 ? (2 * chargeAbove * lcFactor) / ctx.rippleTarget : 0
  const wr = TWO_PI * ctx.resonanceHz
  const inductance = capacitance > 0 ? 1 / (wr * wr * capacitance) : 0
  const capacitorSwitchingRms = Math.sqrt(Math.max(0, rms ** 2 - fundamentalRms ** 2))
  const vPhaseRms = ctx.inputPhasePeak / Math.SQRT2
  const capacitorFundamentalRms = TWO_PI * ctx.inputHz * capacitance * vPhaseRms
  // Phasors against the capacitor voltage: converter current I₁∠−φ_i, capacitor current j·ω·C·V.
  const re = fundamentalRms * Math.cos(phiIn)
  const im = -fundamentalRms * Math.sin(phiIn) + capacitorFundamentalRms
  const inductorCurrentRms = Math.hypot(re, im)
  const gridValue = inductorCurrentRms > 0 ? Math.abs(re) / inductorCurrentRms : 1
  return {
    phaseCurrent: { fundamentalRms, rms, average: share * m1, peak },
    switchPath: { average: pathAverage, rms: pathRms, peak: currentPeak },
    chargeAbove,
    capacitance,
    inductance,
    capacitorSwitchingRms,
    capacitorFundamentalRms,
    inductorCurrentRms,
    gridDisplacement: { value: gridValue, sense: im > 0 ? 'leading' : 'lagging' },
  }
}

/**
 * C, the largest excursion of one capacitor's charge from its value at the carrier period's start, when
 * the capacitor takes the converter input current minus its carrier-period mean (the inductor carries the
 * mean). Input and output angles over one 60° sector each (the pattern repeats, negated, every 60°), all
 * three input phases; above and below are the same over a whole period (negation), so the peak-to-peak
 * ripple is twice this.
 */
function largestCharge(ctx: MatrixInputContext): number {
  const pattern = newPattern()
  const d = new Float64Array(3)
  const T = 1 / ctx.switchingHz
  const iCur = new Float64Array(84)
  /** best value and angles over the grid ti × to */
  const search = (ti: number[], to: number[], best: { q: number, i: number, o: number }) => {
    const rects = ti.map(t => rectifier(t, ctx.phiIn, newRectifier()))
    const refs = to.map(t => [0, 1, 2].map(y => ctx.reference(t - y * SHIFT)))
    const curs = to.map(t => Float64Array.from([0, 1, 2], y => ctx.currentPeak * Math.sin(t - y * SHIFT - ctx.phiOut)))
    for (let a = 0; a < ti.length; a++) {
      const rect = rects[a]!
      for (let b = 0; b < to.length; b++) {
        const m = refs[b]!
        for (let y = 0; y < 3; y++) d[y] = (1 + m[y]! * rect.a) / 2
        carrierPattern(rect, d, pattern)
        const q = chargeExcursion(pattern, curs[b]!, iCur) * T
        if (q > best.q) { best.q = q; best.i = ti[a]!; best.o = to[b]! }
      }
    }
  }
  const sector = Math.PI / 3
  const N = 12
  const coarse = Array.from({ length: N }, (_, k) => ((k + 0.5) * sector) / N)
  const best = { q: -1, i: 0, o: 0 }
  search(coarse, coarse, best)
  let step = sector / N
  for (let pass = 0; pass < 3; pass++) {
    step /= 3
    const around = (c: number) => [-3, -2, -1, 0, 1, 2, 3].map(k => c + k * step)
    search(around(best.i), around(best.o), best)
  }
  return best.q
}

/**
 * Largest |charge| from the period's start (per unit of the period × A) of any input phase in one pattern.
 * The period boundaries are the anchor: the carrier-period means of the input current follow the sinusoid,
 * so the capacitor voltage at the boundaries follows the smooth (input-frequency) solution, while the
 * charge's mean within a period changes from period to period with the angles.
 */
function chargeExcursion(pattern: CarrierPattern, cur: Float64Array, iCur: Float64Array): number {
  // current of each input phase in each interval: iCur[3·j + x]
  const n = pattern.n
  iCur.fill(0, 0, 3 * n)
  for (let j = 0; j < n; j++) {
    for (let y = 0; y < 3; y++) iCur[3 * j + pattern.conn[3 * j + y]!]! += cur[y]!
  }
  let worst = 0
  for (let x = 0; x < 3; x++) {
    let mean = 0
    let prev = 0
    for (let j = 0; j < n; j++) {
      mean += (pattern.end[j]! - prev) * iCur[3 * j + x]!
      prev = pattern.end[j]!
    }
    // charge q(τ) = ∫(i − mean) from the period's start, back to 0 at its end: piecewise linear, extremes at the vertices
    let q = 0
    let qMax = 0
    let qMin = 0
    prev = 0
    for (let j = 0; j < n; j++) {
      q += (pattern.end[j]! - prev) * (iCur[3 * j + x]! - mean)
      if (q > qMax) qMax = q
      else if (q < qMin) qMin = q
      prev = pattern.end[j]!
    }
    const e = Math.max(qMax, -qMin)
    if (e > worst) worst = e
  }
  return worst
}

export interface MatrixSynthesisInput {
  reference: (theta: number) => number
  inputPhasePeak: number
  phiIn: number
  inputHz: number
  fundamentalHz: number
  switchingHz: number
  /** samples per output period, a power of two */
  samples: number
}

/**
 * Output pole voltage of phase a (to the input star point) and line voltage u_ab over one output period,
 * each sample the exact mean over its interval of the input voltage the output is connected to (the
 * carrier-period pattern above, references sampled at each carrier period's centre, input voltage
 * phase 0 at t = 0), and the exact mean square of u_ab over the period.
 */
export function synthesiseMatrix(input: MatrixSynthesisInput): { pole: Float64Array, line: Float64Array, lineMeanSquare: number } {
  const S = input.samples
  const To = 1 / input.fundamentalHz
  const Tc = 1 / input.switchingHz
  const dt = To / S
  const w = TWO_PI * input.inputHz
  const V = input.inputPhasePeak
  const pole = new Float64Array(S)
  const line = new Float64Array(S)
  const rect = newRectifier()
  const pattern = newPattern()
  const d = new Float64Array(3)
  // ∫ sin(ωt − α_X) dt = −(cos ωt·cos α_X + sin ωt·sin α_X)/ω; α_X = 2πX/3.
  const cosA = [1, Math.cos(SHIFT), Math.cos(2 * SHIFT)]
  const sinA = [0, Math.sin(SHIFT), Math.sin(2 * SHIFT)]
  // sin(2ωt − α_A − α_B) = sin 2ωt·cos g − cos 2ωt·sin g, g = α_A + α_B
  const cosG = [0, 1, 2, 3].map(g => Math.cos(g * SHIFT))
  const sinG = [0, 1, 2, 3].map(g => Math.sin(g * SHIFT))
  // cos / sin of ωt at the sample edges by rotation (no trigonometric call per sample)
  const edgeCos = new Float64Array(S + 1)
  const edgeSin = new Float64Array(S + 1)
  const rc = Math.cos(w * dt), rs = Math.sin(w * dt)
  edgeCos[0] = 1
  for (let j = 1; j <= S; j++) {
    edgeCos[j] = edgeCos[j - 1]! * rc - edgeSin[j - 1]! * rs
    edgeSin[j] = edgeSin[j - 1]! * rc + edgeCos[j - 1]! * rs
  }
  const scale = -V / w
  let meanSquare = 0
  let tPrev = 0
  let cPrev = 1, sPrev = 0
  let sample = 0
  /** the connection (ca, cb) of outputs a and b from tPrev to t: into the samples it covers and the mean square */
  const interval = (t: number, ca: number, cb: number) => {
    if (t <= tPrev) return
    const cEnd = Math.cos(w * t)
    const sEnd = Math.sin(w * t)
    const kPole = cosA[ca]!, sPole = sinA[ca]!
    const kLine = kPole - cosA[cb]!, sLine = sPole - sinA[cb]!
    if (ca !== cb) {
      // (sin(x−α) − sin(x−β))² = 2·sin²((β−α)/2)·(1 + cos(2x − α − β)), sin² = 3/4 for phases 120° apart
      // → ∫ = (3/2)·V̂²·[t + sin(2ωt − α − β)/(2ω)]
      const g = ca + cb
      const sinNow = 2 * sEnd * cEnd * cosG[g]! - (cEnd * cEnd - sEnd * sEnd) * sinG[g]!
      const sinPrev = 2 * sPrev * cPrev * cosG[g]! - (cPrev * cPrev - sPrev * sPrev) * sinG[g]!
      meanSquare += 1.5 * V * V * ((t - tPrev) + (sinNow - sinPrev) / (2 * w))
    }
    // sample edges inside the interval
    while (sample < S && (sample + 1) * dt <= t) {
      const c = edgeCos[sample + 1]!, s = edgeSin[sample + 1]!
      pole[sample]! += scale * ((c - cPrev) * kPole + (s - sPrev) * sPole)
      line[sample]! += scale * ((c - cPrev) * kLine + (s - sPrev) * sLine)
      cPrev = c
      sPrev = s
      sample++
    }
    if (sample < S) {
      pole[sample]! += scale * ((cEnd - cPrev) * kPole + (sEnd - sPrev) * sPole)
      line[sample]! += scale * ((cEnd - cPrev) * kLine + (sEnd - sPrev) * sLine)
    }
    cPrev = cEnd
    sPrev = sEnd
    tPrev = t
  }
  for (let k = 0; k * Tc < To && sample < S; k++) {
    const t0 = k * Tc
    const tc = t0 + Tc / 2
    rectifier(w * tc, input.phiIn, rect)
    const thO = TWO_PI * input.fundamentalHz * tc
    for (let y = 0; y < 3; y++) d[y] = (1 + input.reference(thO - y * SHIFT) * rect.a) / 2
    carrierPattern(rect, d, pattern)
    for (let j = 0; j < pattern.n; j++) interval(Math.min(To, t0 + pattern.end[j]! * Tc), pattern.conn[3 * j]!, pattern.conn[3 * j + 1]!)
  }
  for (let j = 0; j < S; j++) {
    pole[j]! /= dt
    line[j]! /= dt
  }
  return { pole, line, lineMeanSquare: meanSquare / To }
}

/** Default ripple target on the filter capacitors: 5 % of the peak input phase voltage, peak-to-peak (common practice). */
export const FILTER_RIPPLE_FRACTION = 0.05

const fmt = (v: number, digits = 3) => Number(v.toPrecision(digits)).toString()

export interface MatrixInputResult {
  inputSide: MatrixInputSide
  capacitor: CapacitorStress
  warnings: string[]
}

/**
 * The input side of one operating point. `amplitudeLimit` is the modulation's linear reference limit
 * (per unit of the half virtual link 0.75·V̂_in·cos φ_i), `lineFundamentalRms` the output actually produced.
 */
export function evaluateMatrixInput(p: ResolvedInput, reference: (theta: number) => number, amplitudeLimit: number, lineFundamentalRms: number): MatrixInputResult {
  const mi = p.matrixInput!
  const inputPhasePeak = (Math.SQRT2 * p.inputLineVoltageRms) / Math.sqrt(3)
  const currentPeak = Math.SQRT2 * p.phaseCurrentRms
  const power = Math.abs(Math.sqrt(3) * lineFundamentalRms * p.phaseCurrentRms * p.powerFactor)
  const rippleTarget = p.capacitorRippleTarget ?? FILTER_RIPPLE_FRACTION * inputPhasePeak
  const f = matrixInputFigures({
    reference,
    inputPhasePeak,
    phiIn: mi.angle,
    inputHz: mi.frequencyHz,
    currentPeak,
    phiOut: p.currentPhaseAngle,
    fundamentalHz: p.fundamentalHz,
    switchingHz: p.switchingHz,
    power,
    rippleTarget,
    resonanceHz: mi.resonanceHz,
  })
  const warnings: string[] = []
  const vPhaseRms = inputPhasePeak / Math.SQRT2
  const capacitorCurrentRms = Math.hypot(f.capacitorSwitchingRms, f.capacitorFundamentalRms)
  const reactivePower = 3 * TWO_PI * mi.frequencyHz * f.capacitance * vPhaseRms ** 2
  const apparent = 3 * vPhaseRms * f.phaseCurrent.fundamentalRms
  if (apparent > 0 && reactivePower > 0.2 * apparent) warnings.push(`The input filter capacitors draw ${fmt(reactivePower / 1000)} kvar, ${Math.round((100 * reactivePower) / apparent)} % of the input's ${fmt(apparent / 1000)} kVA at this point: the grid's displacement factor falls to ${fmt(f.gridDisplacement.value)} (${f.gridDisplacement.sense}); a larger ripple target or a higher switching frequency needs less capacitance.`)
  if (mi.resonanceHz < 10 * mi.frequencyHz || mi.resonanceHz > p.switchingHz / 5) warnings.push(`Input filter resonance ${fmt(mi.resonanceHz)} Hz is outside 10 × the input frequency … f_sw / 5 (${fmt(10 * mi.frequencyHz)} … ${fmt(p.switchingHz / 5)} Hz): the filter either amplifies low grid harmonics or passes switching ripple (common practice).`)
  const transferRatio = (Math.SQRT2 * (p.lineVoltageRms / Math.sqrt(3))) / inputPhasePeak
  const source = 'L. Huber & D. Borojević, IEEE TIA 31(6) 1995 (indirect space-vector modulation with input power-factor control); P. W. Wheeler et al., IEEE TIE 49(2) 2002 (transfer limit (√3/2)·cos φ_in, input current q·I_o·cos φ_o / cos φ_in); J. W. Kolar & S. D. Round, IEE Proc. EPA 153(4) 2006 (rail-current RMS of the virtual inverter); f_res = 1/(2π√(LC))'
  const method = `Carrier-period pattern between input phases (the phase with the largest input-current reference on one rail, the other rail split in two segments; output duties (1 + m·|c|)/2 centred in each segment). Input and switch-path means over the unrelated input and output periods as products of one-dimensional means; filter capacitors star-connected, the inductor carrying each carrier period's mean current: C = 2·max|q| / ΔV_pp / (1 − (f_res/f_sw)²) over a grid of input × output angles (q the charge of the input current minus its carrier-period mean, from the period's start: the period boundaries follow the smooth input-frequency voltage), L = 1/((2π·f_res)²·C), f_res ${mi.resonanceHz === Math.sqrt(2 * mi.frequencyHz * p.switchingHz) ? `= √(2·f_in·f_sw) by default, the geometric middle of 10·f_in … f_sw/5 (common practice)` : 'as given'}.`
  const inputSide: MatrixInputSide = {
    transferRatio,
    transferLimit: 0.75 * mi.displacementFactor * amplitudeLimit,
    displacement: { value: mi.displacementFactor, sense: mi.sense, angle: mi.angle },
    inputFrequencyHz: mi.frequencyHz,
    phaseCurrent: f.phaseCurrent,
    switchPath: f.switchPath,
    filter: {
      capacitance: f.capacitance,
      rippleTarget,
      capacitorVoltageRms: vPhaseRms,
      capacitorVoltagePeak: inputPhasePeak + rippleTarget / 2,
      capacitorCurrentRms,
      capacitorSwitchingCurrentRms: f.capacitorSwitchingRms,
      capacitorFundamentalCurrentRms: f.capacitorFundamentalRms,
      reactivePower,
      inductance: f.inductance,
      resonanceHz: mi.resonanceHz,
      inductorCurrentRms: f.inductorCurrentRms,
      gridDisplacement: f.gridDisplacement,
    },
    provenance: { method, source },
  }
  const capacitor: CapacitorStress = {
    name: 'Cf',
    kind: 'input-filter',
    role: 'filter',
    count: 3,
    voltage: inputPhasePeak + rippleTarget / 2,
    rippleCurrentRms: capacitorCurrentRms,
    capacitanceRequired: f.capacitance,
    rippleTarget,
    lowFrequencyRippleRms: f.capacitorFundamentalRms,
    provenance: {
      method: `Input filter capacitor, one per phase in star: voltage = peak input phase voltage plus half the ripple (an AC capacitor's peak, compared with the part's DC rating); ripple current = √(switching part² + (ω_in·C·V_ph)²). ${method}`,
      source,
    },
  }
  return { inputSide, capacitor, warnings }
}

// ── Switching losses: the commutations of the carrier pattern ───────────────────────────────────────────────
//
// Each change of an output's input phase in carrierPattern is one commutation of the output current between two
// input phases A → B, made by the four-step current-based sequence; the voltage commutated is the instantaneous
// input line-to-line voltage v_AB (P. W. Wheeler, J. Rodríguez, J. C. Clare et al., "Matrix converters: a technology
// review", IEEE Trans. Ind. Electron. 49(2), 2002, section III). With the current's sign s known, the step either
// turns the incoming path's switch on against v_AB (s·(v_B − v_A) > 0: turn-on of S_B, the outgoing path's diode
// D_A recovers) or the outgoing path's switch off (otherwise: turn-off of S_A, D_B takes the current lossless), as
// in a hard-switched half-bridge cell at |v_AB|. For i ≥ 0 the path of input X is S_X+ with D_X−, for i < 0 S_X−
// with D_X+ (topologies/matrix.ts).

const ROLE_INDEX = { 'turn-on': 0, 'turn-off': 1, 'recovery': 2 } as const
const COMMUTATION_GRID = 192
const INPUTS = ['R', 'S', 'T'] as const
/** output duties at which the pattern is made; the sums are linear in d between them (the edges move linearly) */
const D_LOW = 0.25
const D_HIGH = 0.75

/**
 * Output phase a's commutations, summed per position and role (`[3·position + role]`), as means over the input
 * angle, for one current sign (0: i ≥ 0, 1: i < 0), written so that the duty at an output angle with reference m
 * and current i (slope i' per carrier period) is
 *   Σ |i(t_e)|·|v_AB(t_e)| = |i|·(a0 + m·b0) + sign(i)·i'·(a1 + m·b1),
 * v_AB at each commutation's own instant t_e (the input angle moved by ω_i·(t_e − t_centre)) and the current
 * linearised about the period's centre. The edges of output a sit at centred fractions (1 ∓ d)/2 of each segment,
 * d = (1 + m·|c_X*|)/2, so the sums are linear in d; they are taken at d = 1/4 and 3/4. Units of `unitVoltage`.
 */
export interface MatrixCommutationWeights {
  a0: [Float64Array, Float64Array]
  b0: [Float64Array, Float64Array]
  a1: [Float64Array, Float64Array]
  b1: [Float64Array, Float64Array]
}

export function matrixCommutationWeights(positionNames: readonly string[], phiIn: number, unitVoltage: number, inputPhasePeak: number, inputAnglePerCarrier: number): MatrixCommutationWeights {
  const P = positionNames.length
  // position index of S_X+, D_X+, S_X−, D_X− per input phase X (−1: not in the leg), looked up once
  const lookup = (device: 'S' | 'D', sign: '+' | '-') => Int32Array.from([0, 1, 2], X => positionNames.indexOf(`${device}${INPUTS[X]}${sign}`))
  const sPlus = lookup('S', '+'), dPlus = lookup('D', '+'), sMinus = lookup('S', '-'), dMinus = lookup('D', '-')
  const pair = (): [Float64Array, Float64Array] => [new Float64Array(P * 3), new Float64Array(P * 3)]
  const out: MatrixCommutationWeights = { a0: pair(), b0: pair(), a1: pair(), b1: pair() }
  const rect = newRectifier()
  const pattern = newPattern()
  const d = new Float64Array(3)
  // per duty sample: Σ|v| and Σ|v|·Δ (Δ = t_e − t_centre in carrier periods), per sign
  const at = [0, 1].map(() => ({ v: pair(), vd: pair() }))
  const charge = (k: number, sign: 0 | 1, position: number, role: keyof typeof ROLE_INDEX, v: number, delta: number) => {
    if (position < 0) return
    at[k]!.v[sign][3 * position + ROLE_INDEX[role]]! += v
    at[k]!.vd[sign][3 * position + ROLE_INDEX[role]]! += v * delta
  }
  for (let g = 0; g < COMMUTATION_GRID; g++) {
    const thetaI = ((g + 0.5) * TWO_PI) / COMMUTATION_GRID
    rectifier(thetaI, phiIn, rect)
    for (const sample of at) for (const arr of [sample.v, sample.vd]) { arr[0].fill(0); arr[1].fill(0) }
    for (const [k, duty] of [D_LOW, D_HIGH].entries()) {
      d.fill(duty)
      carrierPattern(rect, d, pattern)
      let prevEnd = 0
      let from = -1
      for (let j = 0; j < pattern.n; j++) {
        const start = prevEnd
        prevEnd = pattern.end[j]!
        if (prevEnd - start <= 1e-12) continue
        const to = pattern.conn[3 * j]!
        if (from >= 0 && to !== from) {
          const delta = start - 0.5
          const th = thetaI + inputAnglePerCarrier * delta
          const rise = inputPhasePeak * (Math.sin(th - to * SHIFT) - Math.sin(th - from * SHIFT))
          const volts = Math.abs(rise) / unitVoltage
          // i ≥ 0: the incoming switch S_B+ turns on when v_B > v_A (D_A− recovers), else S_A+ turns off.
          if (rise > 0) { charge(k, 0, sPlus[to]!, 'turn-on', volts, delta); charge(k, 0, dMinus[from]!, 'recovery', volts, delta) }
          else charge(k, 0, sPlus[from]!, 'turn-off', volts, delta)
          // i < 0: S_B− turns on when v_B < v_A (D_A+ recovers), else S_A− turns off.
          if (rise < 0) { charge(k, 1, sMinus[to]!, 'turn-on', volts, delta); charge(k, 1, dPlus[from]!, 'recovery', volts, delta) }
          else charge(k, 1, sMinus[from]!, 'turn-off', volts, delta)
        }
        from = to
      }
    }
    // Linear in d: value(d) = low + (d − D_LOW)/(D_HIGH − D_LOW)·(high − low), d = 1/2 + m·|c|/2.
    const toHalf = (0.5 - D_LOW) / (D_HIGH - D_LOW)
    const perM = (rect.a / 2) / (D_HIGH - D_LOW)
    for (const sign of [0, 1] as const) {
      for (let q = 0; q < P * 3; q++) {
        const lo = at[0]!.v[sign][q]!, hi = at[1]!.v[sign][q]!
        const lo1 = at[0]!.vd[sign][q]!, hi1 = at[1]!.vd[sign][q]!
        out.a0[sign][q]! += (lo + toHalf * (hi - lo)) / COMMUTATION_GRID
        out.b0[sign][q]! += (perM * (hi - lo)) / COMMUTATION_GRID
        out.a1[sign][q]! += (lo1 + toHalf * (hi1 - lo1)) / COMMUTATION_GRID
        out.b1[sign][q]! += (perM * (hi1 - lo1)) / COMMUTATION_GRID
      }
    }
  }
  return out
}

// The weights depend on the input side only: the operating points of a design (and their thermal profiles) share them.
const weightsCache = new Map<string, MatrixCommutationWeights>()

function commutationWeightsOnce(positionNames: readonly string[], phiIn: number, unitVoltage: number, inputPhasePeak: number, inputAnglePerCarrier: number): MatrixCommutationWeights {
  const key = [positionNames.join(','), phiIn, unitVoltage, inputPhasePeak, inputAnglePerCarrier].join('|')
  let w = weightsCache.get(key)
  if (!w) {
    w = matrixCommutationWeights(positionNames, phiIn, unitVoltage, inputPhasePeak, inputAnglePerCarrier)
    if (weightsCache.size >= 32) weightsCache.delete(weightsCache.keys().next().value!)
    weightsCache.set(key, w)
  }
  return w
}

/**
 * The matrix converter's per-position switching duty (as integrateSwitching gives it for state-table legs): the
 * mean over the fundamental period of Σ |i|·|v_AB| per carrier period, by role, at `points` output angles
 * (i = Î·sin(θ − φ), m = reference(θ)); `binned` records the same sums per angle bin (in units of `unitVoltage`,
 * for the thermal profile).
 */
export function matrixSwitching(positionNames: readonly string[], ctx: { phiIn: number, inputPhasePeak: number, inputHz: number, fundamentalHz: number, switchingHz: number, reference: (theta: number) => number }, unitVoltage: number, currentPeak: number, phi: number, options: { points: number, binned?: { bins: number, sums: Float64Array } }): { turnOn: number, turnOff: number, recovery: number }[] {
  const P = positionNames.length
  const w = commutationWeightsOnce(positionNames, ctx.phiIn, unitVoltage, ctx.inputPhasePeak, (TWO_PI * ctx.inputHz) / ctx.switchingHz)
  const outputAnglePerCarrier = (TWO_PI * ctx.fundamentalHz) / ctx.switchingHz
  const sum = new Float64Array(P * 3)
  const { points, binned } = options
  // Each position's duty is linear in |i|, |i|·m, the slope and slope·m for each sign of i: without the per-angle
  // record those four sums per sign are taken over the period and the weights applied once.
  const moments = binned ? undefined : new Float64Array(8)
  const onGrid = valuesOnGrid(ctx.reference, points)
  const trig = gridTrig(points)
  const cosPhi = Math.cos(phi)
  const sinPhi = Math.sin(phi)
  for (let k = 0; k < points; k++) {
    const theta = ((k + 0.5) * TWO_PI) / points
    // sin and cos of θ − φ from the kept grid sines
    const i = currentPeak * (trig.sin[k]! * cosPhi - trig.cos[k]! * sinPhi)
    const sign = i >= 0 ? 0 : 1
    // slope of |i| per carrier period about the centre
    const slope = (i >= 0 ? 1 : -1) * currentPeak * (trig.cos[k]! * cosPhi + trig.sin[k]! * sinPhi) * outputAnglePerCarrier
    const m = onGrid ? onGrid[3 * k + 1]! : ctx.reference(theta)
    const ai = Math.abs(i)
    if (moments) {
      moments[4 * sign]! += ai
      moments[4 * sign + 1]! += ai * m
      moments[4 * sign + 2]! += slope
      moments[4 * sign + 3]! += slope * m
      continue
    }
    const a0 = w.a0[sign], b0 = w.b0[sign], a1 = w.a1[sign], b1 = w.b1[sign]
    const base = Math.min(binned!.bins - 1, Math.floor((theta / TWO_PI) * binned!.bins)) * P * 3
    for (let q = 0; q < P * 3; q++) {
      if (a0[q] === 0 && b0[q] === 0) continue
      const x = ai * (a0[q]! + m * b0[q]!) + slope * (a1[q]! + m * b1[q]!)
      sum[q]! += x
      binned!.sums[base + q]! += x
    }
  }
  if (moments) {
    for (let sign = 0; sign < 2; sign++) {
      const a0 = w.a0[sign]!, b0 = w.b0[sign]!, a1 = w.a1[sign]!, b1 = w.b1[sign]!
      for (let q = 0; q < P * 3; q++) sum[q]! += a0[q]! * moments[4 * sign]! + b0[q]! * moments[4 * sign + 1]! + a1[q]! * moments[4 * sign + 2]! + b1[q]! * moments[4 * sign + 3]!
    }
  }
  return positionNames.map((_, p) => ({
    turnOn: (sum[3 * p]! / points) * unitVoltage,
    turnOff: (sum[3 * p + 1]! / points) * unitVoltage,
    recovery: (sum[3 * p + 2]! / points) * unitVoltage,
  }))
}
