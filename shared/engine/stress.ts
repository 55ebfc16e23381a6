// evaluateStress: one operating point of one converter → stresses of every device and capacitor position.
import { capacitorStresses } from './capacitors'
import { deriveCommutations, integrateSwitching } from './commutations'
import { clampStack, defaultDerating } from './derating'
import { EngineInputError } from './errors'
import { DEFAULT_INTEGRATION_POINTS, integrateLeg } from './integrate'
import { evaluateMatrixInput, matrixSwitching, synthesiseMatrix } from './matrix-input'
import { gridReference, linearLimit, SIX_STEP_INDEX } from './modulation'
import { harmonicAmplitudes, synthesise, totalHarmonicDistortion } from './synth'
import type { CompiledLeg } from './model'
import type { DeratingPolicy, DeviceStress, SpectrumLine, StressInput, StressResult } from './types'
import { resolveStressInput, type ResolvedInput } from './validate'

export interface EvaluateOptions {
  /** add one fundamental period of pole / line voltage and phase current */
  includeWaveform?: boolean
  /** add the line-voltage spectrum (orders 1…thdMaxOrder) */
  includeSpectrum?: boolean
  /** samples per fundamental period for the switched waveforms (rounded up to a power of two, 256…65536) */
  samples?: number
  /** integration points per fundamental period for the averaged currents (default 2046) */
  integrationPoints?: number
  /** voltage derating that sizes clamp-diode stacks (default: the common-practice policy) */
  derating?: Pick<DeratingPolicy, 'semiconductorVoltageUtilisation' | 'semiconductorTransientMargin'>
}

const MIN_SAMPLES = 256
const MAX_SAMPLES = 65536
/** THD covers orders 2…max(THD_MIN_ORDER, 2.5 · effective carrier ratio), limited to samples/4. */
export const THD_MIN_ORDER = 250
const SPECTRUM_FLOOR = 1e-4

/** Voltages that scale the per-unit tables of a topology. */
export interface Scales {
  /** V, base of the modulation index (half DC link; cells × V_cell; matrix: virtual half link 0.75·V̂_in,phase) */
  halfLink: number
  /** V, unit voltage of the state table at the worst-case and the nominal supply */
  unitMax: number
  unitNominal: number
  /** V switched by one carrier comparison in the synthesis */
  stepVoltage: number
  /** reported modulation index per unit of reference amplitude (matrix: transfer ratio = 3/4 of the virtual-inverter amplitude) */
  indexPerAmplitude: number
  /** effective carrier ratio of the line voltage (f_sw,eff / f) */
  effectiveRatio: number
}

export function scalesFor(p: ResolvedInput): Scales {
  const L = p.leg.def.modelLevels
  const mf = p.switchingHz / p.fundamentalHz
  switch (p.topology.supply) {
    case 'dc-link': {
      const ratio = p.modulation === 'six-step' ? 1 : p.leg.def.carrier === 'phase-shifted' ? (L - 1) * mf : mf
      return { halfLink: p.dcVoltage / 2, unitMax: p.dcVoltageMax / (L - 1), unitNominal: p.dcVoltage / (L - 1), stepVoltage: p.dcVoltage / (p.modulation === 'six-step' ? 1 : L - 1), indexPerAmplitude: 1, effectiveRatio: ratio }
    }
    case 'cell': {
      const cells = p.leg.def.cellsPerPhase ?? 1
      return { halfLink: cells * p.dcVoltage, unitMax: p.dcVoltageMax, unitNominal: p.dcVoltage, stepVoltage: p.dcVoltage, indexPerAmplitude: 1, effectiveRatio: 2 * cells * mf }
    }
    case 'ac-input': {
      // Indirect modulation: the virtual rectifier's local link is at least 1.5·V̂_in,phase·cos φ_in, so the output phase peak is at most 0.75·V̂_in,phase·cos φ_in × amplitude.
      const peakPhase = (Math.SQRT2 * p.inputLineVoltageRms) / Math.sqrt(3)
      const unit = Math.SQRT2 * p.inputLineVoltageRms
      const cosIn = p.matrixInput?.displacementFactor ?? 1
      return { halfLink: 0.75 * peakPhase * cosIn, unitMax: unit, unitNominal: unit, stepVoltage: 1.5 * peakPhase * cosIn, indexPerAmplitude: 0.75 * cosIn, effectiveRatio: mf }
    }
  }
}

function nextPowerOfTwo(n: number): number {
  return 2 ** Math.ceil(Math.log2(Math.max(1, n)))
}

function checkOptions(options: EvaluateOptions): void {
  if (options.samples !== undefined && (!Number.isFinite(options.samples) || options.samples < 1)) throw new EngineInputError('samples', 'samples must be a positive number')
  const n = options.integrationPoints
  if (n !== undefined && (!Number.isInteger(n) || n < 64 || n > 1 << 20 || n % 2 !== 0)) throw new EngineInputError('integrationPoints', 'integrationPoints must be an even integer 64…1048576')
}

const fmt = (v: number, digits = 3) => Number(v.toPrecision(digits)).toString()

/** Evaluates one operating point. Throws EngineInputError for input it cannot evaluate. */
export function evaluateStress(input: StressInput, options: EvaluateOptions = {}): StressResult {
  checkOptions(options)
  const p = resolveStressInput(input)
  const { leg, topology } = p
  const warnings = [...p.warnings]
  const notes: string[] = []
  const sixStep = p.modulation === 'six-step'
  const scales = scalesFor(p)
  const points = options.integrationPoints ?? DEFAULT_INTEGRATION_POINTS

  // Reference amplitude per unit of the half link, the index to report, and the over-modulation check.
  const requestedPhasePeak = (Math.SQRT2 * p.lineVoltageRms) / Math.sqrt(3)
  const amplitude = sixStep ? SIX_STEP_INDEX : requestedPhasePeak / scales.halfLink
  const modulationIndex = amplitude * scales.indexPerAmplitude
  const reference = gridReference(p.modulation, amplitude, points)

  const phi = p.currentPhaseAngle
  const currentPeak = Math.SQRT2 * p.phaseCurrentRms
  const currents = integrateLeg(leg, reference, currentPeak, phi, points)
  const lineVoltageFundamentalRms = (Math.sqrt(3) * currents.referenceFundamental * scales.halfLink) / Math.SQRT2

  if (!sixStep) {
    const limit = linearLimit[p.modulation as keyof typeof linearLimit]
    if (amplitude > limit * (1 + 1e-9)) {
      const actual = `the output fundamental is ${fmt(lineVoltageFundamentalRms)} V line-to-line RMS instead of the requested ${fmt(p.lineVoltageRms)} V`
      warnings.push(topology.supply === 'ac-input'
        ? `Over-modulation: voltage transfer ratio ${fmt(modulationIndex)} exceeds the matrix converter's linear limit ${fmt(limit * scales.indexPerAmplitude)} with ${p.modulation} modulation (at most (√3/2)·cos φ_in ≈ ${fmt(0.866 * (p.matrixInput?.displacementFactor ?? 1))} at input displacement factor ${fmt(p.matrixInput?.displacementFactor ?? 1)}, Wheeler et al., IEEE TIE 2002); the reference is clamped and ${actual}.`
        : `Over-modulation: modulation index ${fmt(modulationIndex)} exceeds the linear limit ${fmt(limit)} of ${p.modulation} modulation; the reference is clamped and ${actual}.`)
    }
  }

  const devices = deviceStresses(p, leg, currents, scales, points, options.derating ?? defaultDerating, warnings)
  // Supply 'cell': the table's unit is the cell voltage; otherwise one level step of the nominal link.
  // The matrix converter's commutations come from its carrier pattern (matrix-input.ts), not from a state table.
  const switching = p.matrixInput
    ? matrixSwitching(leg.positions.map(x => x.name), { phiIn: p.matrixInput.angle, inputPhasePeak: (Math.SQRT2 * p.inputLineVoltageRms) / Math.sqrt(3), inputHz: p.matrixInput.frequencyHz, fundamentalHz: p.fundamentalHz, switchingHz: p.switchingHz, reference }, scales.unitNominal, currentPeak, phi, { points })
    : integrateSwitching(leg, deriveCommutations(leg), reference, currentPeak, phi, scales.unitNominal, { points, sixStep })
  if (switching) devices.forEach((d, k) => { d.switchingDuty = switching[k]! })
  const caps = capacitorStresses({
    leg,
    reference,
    currentPeak,
    phi,
    unitVoltageMax: scales.unitMax,
    unitVoltageNominal: scales.unitNominal,
    fundamentalHz: p.fundamentalHz,
    switchingHz: p.switchingHz,
    rippleTarget: p.capacitorRippleTarget,
    points,
  })
  warnings.push(...caps.warnings)
  const matrixInput = p.matrixInput ? evaluateMatrixInput(p, reference, linearLimit[p.modulation as keyof typeof linearLimit], lineVoltageFundamentalRms) : undefined
  if (matrixInput) {
    caps.capacitors.push(matrixInput.capacitor)
    warnings.push(...matrixInput.warnings)
  }

  // Switched waveforms at the actual carrier ratio → spectrum and THD.
  const maxOrderWanted = Math.max(THD_MIN_ORDER, Math.ceil(2.5 * scales.effectiveRatio))
  const mf = p.switchingHz / p.fundamentalHz
  let samples = options.samples !== undefined
    ? nextPowerOfTwo(options.samples)
    : nextPowerOfTwo(Math.max(4 * maxOrderWanted, 4096))
  samples = Math.min(MAX_SAMPLES, Math.max(MIN_SAMPLES, samples))
  const thdMaxOrder = Math.min(maxOrderWanted, samples / 4)
  const synthesisInput = { leg, reference, sixStep, frequencyRatio: mf, stepVoltage: scales.stepVoltage, samples }
  // Matrix converter: the output is synthesised from segments of the input voltages (matrix-input.ts).
  const synthesis = p.matrixInput
    ? synthesiseMatrix({ reference, inputPhasePeak: (Math.SQRT2 * p.inputLineVoltageRms) / Math.sqrt(3), phiIn: p.matrixInput.angle, inputHz: p.matrixInput.frequencyHz, fundamentalHz: p.fundamentalHz, switchingHz: p.switchingHz, samples })
    : synthesise(synthesisInput, { pole: options.includeWaveform })
  const amplitudes = harmonicAmplitudes(synthesis.line, thdMaxOrder)
  let lineVoltageThdToOrder = totalHarmonicDistortion(amplitudes)
  // Full band: the switched waveform's own RMS, so no switching harmonic beyond the summed orders is lost.
  const lineRms = Math.sqrt(synthesis.lineMeanSquare)
  const fundamentalRms = amplitudes[1]! / Math.SQRT2
  let lineVoltageThd = fundamentalRms > 0 ? Math.sqrt(Math.max(0, lineRms ** 2 - amplitudes[0]! ** 2 - fundamentalRms ** 2)) / fundamentalRms : 0
  if (amplitudes[1]! <= 1e-9 * Math.max(scales.halfLink, 1e-9)) {
    lineVoltageThd = 0
    lineVoltageThdToOrder = 0
    warnings.push('No fundamental output voltage: THD is not defined and reported as 0.')
  }
  notes.push(`Line-voltage THD full band from the time-domain RMS of the switched waveform, √(V_rms² − V_1²) / V_1; beside it the sum over harmonic orders 2…${thdMaxOrder} from ${samples} samples per period (f_sw/f = ${fmt(mf, 4)}${sixStep ? ', six-step' : ''}).`)
  if (!sixStep && thdMaxOrder < 1.2 * scales.effectiveRatio) notes.push(`The first switching harmonics (order ≈ ${Math.round(scales.effectiveRatio)}) lie beyond order ${thdMaxOrder}; the order-limited THD covers the low-order distortion only, the full-band figure includes them.`)
  if (topology.patternNote) notes.push(topology.patternNote)
  if (topology.supply === 'ac-input') notes.push(`No DC link: the output is synthesised from segments of the input voltages at f_in = ${fmt(p.matrixInput!.frequencyHz)} Hz over one output period (input voltage phase 0 at its start); when f_in / f is not whole, input-frequency sidebands of the switching harmonics leak into neighbouring orders.`)

  const result: StressResult = {
    topology: topology.id,
    levels: p.levels,
    modulationIndex,
    devices,
    capacitors: caps.capacitors,
    lineVoltageFundamentalRms,
    lineVoltageThd,
    lineVoltageThdToOrder,
    powerFactor: { value: p.powerFactor, sense: p.powerFactorSense, currentPhaseAngle: phi },
    thdMaxOrder,
    warnings,
    notes,
    counts: countsOf(devices, caps.capacitors),
    ...(matrixInput ? { inputSide: matrixInput.inputSide } : {}),
  }
  if (options.includeSpectrum) {
    const lines: SpectrumLine[] = []
    const floor = SPECTRUM_FLOOR * amplitudes[1]!
    for (let h = 1; h <= thdMaxOrder; h++) {
      if (h === 1 || amplitudes[h]! >= floor) lines.push({ order: h, frequency: h * p.fundamentalHz, amplitude: amplitudes[h]! })
    }
    result.spectrum = lines
  }
  if (options.includeWaveform) {
    const S = samples
    const time: number[] = new Array(S)
    const current: number[] = new Array(S)
    for (let j = 0; j < S; j++) {
      time[j] = (j + 0.5) / (S * p.fundamentalHz)
      current[j] = currentPeak * Math.sin((2 * Math.PI * (j + 0.5)) / S - phi)
    }
    result.waveform = { time, lineVoltage: Array.from(synthesis.line), poleVoltage: Array.from(synthesis.pole!), phaseCurrent: current }
  }
  return result
}

function deviceStresses(p: ResolvedInput, leg: CompiledLeg, currents: ReturnType<typeof integrateLeg>, scales: Scales, points: number, derating: NonNullable<EvaluateOptions['derating']>, warnings: string[]): DeviceStress[] {
  const t = p.topology
  const commutationUnits = leg.def.commutationUnits ?? 1
  const scheme = {
    'phase-disposition': 'phase-disposition carriers',
    'phase-shifted': 'phase-shifted carriers, redundant states used evenly',
    'phase-shifted-unipolar': 'phase-shifted unipolar carriers, every cell carrying the phase current',
    'input-averaged': 'each input phase a third of the time',
  }[leg.def.carrier]
  const blockingMethod = t.supply === 'ac-input' ? 'blocking = peak input line voltage √2·V_LL,in' : `blocking by enumerating the switching states at V_dc,max`

  return leg.positions.map((pos, k): DeviceStress => {
    const blockingVoltage = pos.blockingUnits * scales.unitMax
    const overshoot = pos.commutates ? p.overshootVoltage : 0
    const device: DeviceStress = {
      name: pos.name,
      kind: pos.kind,
      countPerPhase: pos.countPerPhase,
      blockingVoltage,
      blockingVoltageWithOvershoot: blockingVoltage + overshoot,
      currentAvg: currents.avg[k]!,
      currentRms: currents.rms[k]!,
      currentPeak: currents.peak[k]!,
      commutatedVoltage: pos.commutates ? commutationUnits * scales.unitNominal : 0,
      provenance: {
        method: `Switching-period-averaged integration over one fundamental period (${points} points) of the leg's state table (${scheme}); ${blockingMethod}${pos.commutates ? ', overshoot added (commutating position)' : ', switches at the fundamental only (no overshoot added)'}.`,
        source: `${t.currentSource}; structure and blocking: ${t.structureSource}`,
      },
    }
    if (pos.kind === 'clamp-diode') {
      // Count and unit rating from the derating rule, so the stack passes its own rating check.
      const stack = clampStack(blockingVoltage, blockingVoltage + overshoot, derating, scales.unitMax, p.clampDiodeUnitVoltage)
      device.seriesCount = stack.seriesCount
      if (stack.warning) warnings.push(`${pos.name}: ${stack.warning}`)
    }
    return device
  })
}

function countsOf(devices: DeviceStress[], capacitors: StressResult['capacitors']): StressResult['counts'] {
  let switchesPerPhase = 0
  let diodesPerPhase = 0
  let clampDiodesPerPhase = 0
  for (const d of devices) {
    if (d.kind === 'switch') switchesPerPhase += d.countPerPhase
    else if (d.kind === 'diode') diodesPerPhase += d.countPerPhase
    else clampDiodesPerPhase += d.countPerPhase * (d.seriesCount ?? 1)
  }
  return {
    switchesPerPhase,
    diodesPerPhase,
    clampDiodesPerPhase,
    capacitors: capacitors.reduce((a, c) => a + c.count, 0),
    switchesTotal: 3 * switchesPerPhase,
    diodesTotal: 3 * diodesPerPhase,
    clampDiodesTotal: 3 * clampDiodesPerPhase,
  }
}
