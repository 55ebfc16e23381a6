// evaluateDesign: several operating points per converter → envelope per position → required ratings after derating.
import { clampStack, defaultDerating, voltageRequirement } from './derating'
import { EngineInputError } from './errors'
import { INPUT_LIMITS, tooLarge, tooSmall } from './limits'
import { gridInput, isLinkCapacitor, sharedLink } from './link'
import { evaluateStress } from './stress'
import type {
  CapacitorEnvelope, ConverterInput, ConverterResult, DeratingPolicy, DesignInput, DesignResult, DeviceEnvelope, InductorEnvelope, LinkCarriers, OperatingPoint, StressInput, StressResult,
} from './types'
import { resolveStressInput } from './validate'

export { defaultDerating } from './derating'

/** V, blocking-voltage classes of power semiconductors (common practice). */
export const STANDARD_VOLTAGE_CLASSES = [600, 650, 1200, 1700, 2500, 3300, 4500, 6500] as const

const MAX_POINTS = 50
const POINT_FIELDS = new Set(['name', 'lineVoltageRms', 'phaseCurrentRms', 'powerFactor', 'powerFactorSense', 'fundamentalHz'])

function resolveDerating(given: Partial<DeratingPolicy> | undefined): DeratingPolicy {
  if (given !== undefined && (typeof given !== 'object' || given === null)) throw new EngineInputError('derating', 'derating must be an object')
  const policy = { ...defaultDerating, ...(given ?? {}) }
  const ranges: Record<keyof DeratingPolicy, [number, number, string]> = {
    semiconductorVoltageUtilisation: [0, 1, 'fraction'],
    semiconductorTransientMargin: [0.5, 1, 'fraction'],
    semiconductorCurrentUtilisation: [0, 2, 'fraction'],
    capacitorVoltageUtilisation: [0, 1, 'fraction'],
    capacitorRippleUtilisation: [0, 2, 'fraction'],
    junctionMarginC: [0, 100, '°C'],
    heatsinkTemperatureC: [-40, 150, '°C'],
  }
  for (const [key, [min, max, unit]] of Object.entries(ranges) as [keyof DeratingPolicy, [number, number, string]][]) {
    const v = policy[key]
    const exclusiveMin = unit === 'fraction' && min === 0
    if (typeof v !== 'number' || !Number.isFinite(v) || (exclusiveMin ? v <= min : v < min) || v > max) {
      throw new EngineInputError(`derating.${key}`, `derating.${key} must be ${exclusiveMin ? 'above' : 'at least'} ${min} and at most ${max} (${unit})`)
    }
  }
  return policy
}

/** Smallest standard class at or above the required rating; undefined when even 6500 V is short. */
export function voltageClassFor(required: number): number | undefined {
  return STANDARD_VOLTAGE_CLASSES.find(c => c >= required - 1e-9)
}

const fmt = (v: number) => Number(v.toPrecision(4)).toString()

type PointResult = StressResult & { pointName: string }
interface PointInput { pointName: string, at: string, input: StressInput }

/** The single-point inputs of a converter, named and checked for shape; field paths for errors. */
function pointInputs(conv: ConverterInput, path: string, rippleTarget: number | undefined): PointInput[] {
  if (typeof conv !== 'object' || conv === null) throw new EngineInputError(path, `${path} must be an object`)
  const ops = conv.operatingPoints as unknown
  if (!Array.isArray(ops) || ops.length < 1 || ops.length > MAX_POINTS) {
    throw new EngineInputError(`${path}.operatingPoints`, `${path}.operatingPoints must hold 1…${MAX_POINTS} operating points`)
  }
  const seen = new Set<string>()
  const { operatingPoints: _omit, ...converter } = conv
  return ops.map((op: OperatingPoint, i: number) => {
    const at = `${path}.operatingPoints.${i}`
    if (typeof op !== 'object' || op === null) throw new EngineInputError(at, `${at} must be an object`)
    if (op.name !== undefined && (typeof op.name !== 'string' || op.name.trim() === '')) throw new EngineInputError(`${at}.name`, 'name must be a non-empty string')
    const pointName = op.name ?? `Point ${i + 1}`
    if (seen.has(pointName)) throw new EngineInputError(`${at}.name`, `operating point name "${pointName}" is used twice`)
    seen.add(pointName)
    const input: StressInput = {
      ...converter,
      name: pointName,
      lineVoltageRms: op.lineVoltageRms,
      phaseCurrentRms: op.phaseCurrentRms,
      powerFactor: op.powerFactor,
      ...(op.powerFactorSense !== undefined ? { powerFactorSense: op.powerFactorSense } : {}),
      fundamentalHz: op.fundamentalHz,
      ...(rippleTarget !== undefined ? { capacitorRippleTarget: rippleTarget } : {}),
    }
    return { pointName, at, input }
  })
}

/** Runs `f`, re-rooting an EngineInputError at the point (point fields) or the converter (the rest). */
function atPoint<T>(p: PointInput, path: string, f: () => T): T {
  try {
    return f()
  }
  catch (e) {
    if (e instanceof EngineInputError) throw e.under(POINT_FIELDS.has(e.field) ? p.at : path)
    throw e
  }
}

/** The single-point inputs of a converter's operating points, by name (for per-point profiles, engine/profile.ts). */
export function converterPointInputs(conv: ConverterInput): { pointName: string, input: StressInput }[] {
  return pointInputs(conv, 'converter', undefined).map(p => ({ pointName: p.pointName, input: p.input }))
}

function evaluatePoints(conv: ConverterInput, path: string, rippleTarget: number | undefined, derating: DeratingPolicy): PointResult[] {
  return pointInputs(conv, path, rippleTarget).map(p => ({ ...atPoint(p, path, () => evaluateStress(p.input, { derating })), pointName: p.pointName }))
}

function envelopeOf(points: PointResult[], derating: DeratingPolicy, clampDiodeUnitVoltage: number | undefined): ConverterResult['envelope'] {
  const first = points[0]!
  const devices: DeviceEnvelope[] = first.devices.map((d0, k) => {
    const worst = { blockingVoltage: first.pointName, currentAvg: first.pointName, currentRms: first.pointName, currentPeak: first.pointName }
    // The envelope mixes points: the per-point switching duty stays with its point.
    const { switchingDuty: _perPoint, ...env } = d0
    for (const pt of points) {
      const d = pt.devices[k]!
      if (d.blockingVoltageWithOvershoot > env.blockingVoltageWithOvershoot) { env.blockingVoltageWithOvershoot = d.blockingVoltageWithOvershoot; worst.blockingVoltage = pt.pointName }
      env.blockingVoltage = Math.max(env.blockingVoltage, d.blockingVoltage)
      if (d.currentAvg > env.currentAvg) { env.currentAvg = d.currentAvg; worst.currentAvg = pt.pointName }
      if (d.currentRms > env.currentRms) { env.currentRms = d.currentRms; worst.currentRms = pt.pointName }
      if (d.currentPeak > env.currentPeak) { env.currentPeak = d.currentPeak; worst.currentPeak = pt.pointName }
      if (d.commutatedVoltage !== undefined) env.commutatedVoltage = Math.max(env.commutatedVoltage ?? 0, d.commutatedVoltage)
      if (d.seriesCount !== undefined) env.seriesCount = Math.max(env.seriesCount ?? 1, d.seriesCount)
    }
    // Steady and transient checks (derating.ts); a clamp-diode stack is rated per unit diode, its count from the same rule.
    const need = voltageRequirement(env.blockingVoltage, env.blockingVoltageWithOvershoot, derating)
    if (env.kind === 'clamp-diode' && clampDiodeUnitVoltage !== undefined) {
      env.seriesCount = clampStack(env.blockingVoltage, env.blockingVoltageWithOvershoot, derating, env.blockingVoltage, clampDiodeUnitVoltage).seriesCount
    }
    const units = env.kind === 'clamp-diode' ? (env.seriesCount ?? 1) : 1
    const requiredVoltageRating = need.rating / units
    const voltageClass = voltageClassFor(requiredVoltageRating)
    const u = derating.semiconductorVoltageUtilisation
    const margin = derating.semiconductorTransientMargin
    const check = need.decidedBy === 'utilisation'
      ? `the utilisation check decides: steady blocking ${fmt(env.blockingVoltage)} V / ${u} ≥ (blocking + overshoot) ${fmt(env.blockingVoltageWithOvershoot)} V / ${margin}`
      : `the transient check decides: (blocking + overshoot) ${fmt(env.blockingVoltageWithOvershoot)} V / ${margin} > steady blocking ${fmt(env.blockingVoltage)} V / ${u}`
    return {
      ...env,
      worstPoint: worst,
      requiredVoltageRating,
      positionVoltageRating: need.rating,
      voltageRatingSetBy: need.decidedBy,
      requiredCurrentRating: env.currentPeak / derating.semiconductorCurrentUtilisation,
      ...(voltageClass !== undefined ? { voltageClass } : {}),
      provenance: {
        method: `Maximum over ${points.length} operating point(s); required voltage = max(steady blocking / u, (blocking + overshoot) / transient margin)${units > 1 ? `, shared by ${units} unit diodes in series` : env.kind === 'clamp-diode' ? ' per unit diode' : ''}; ${check}; required current = peak / ${derating.semiconductorCurrentUtilisation}. Per point: ${d0.provenance.method}`,
        source: `${d0.provenance.source}; derating: common practice`,
      },
    }
  })
  const capacitors: CapacitorEnvelope[] = first.capacitors.map((c0, k) => {
    const env = { ...c0 }
    const worst = { voltage: first.pointName, rippleCurrentRms: first.pointName, capacitanceRequired: first.pointName }
    for (const pt of points) {
      const c = pt.capacitors[k]!
      if (c.voltage > env.voltage) { env.voltage = c.voltage; worst.voltage = pt.pointName }
      if (c.rippleCurrentRms > env.rippleCurrentRms) { env.rippleCurrentRms = c.rippleCurrentRms; worst.rippleCurrentRms = pt.pointName }
      if ((c.capacitanceRequired ?? 0) > (env.capacitanceRequired ?? 0)) { env.capacitanceRequired = c.capacitanceRequired; worst.capacitanceRequired = pt.pointName }
      if (c.lowFrequencyRippleRms !== undefined) env.lowFrequencyRippleRms = Math.max(env.lowFrequencyRippleRms ?? 0, c.lowFrequencyRippleRms)
    }
    return {
      ...env,
      worstPoint: worst,
      requiredVoltageRating: env.voltage / derating.capacitorVoltageUtilisation,
      requiredRippleRating: env.rippleCurrentRms / derating.capacitorRippleUtilisation,
      provenance: { method: `Maximum over ${points.length} operating point(s); required ratings = voltage / ${derating.capacitorVoltageUtilisation}, ripple / ${derating.capacitorRippleUtilisation}. Per point: ${c0.provenance.method}`, source: `${c0.provenance.source}; derating: common practice` },
    }
  })
  return { devices, capacitors }
}

function converterResult(side: 'machine' | 'grid', conv: ConverterInput, path: string, derating: DeratingPolicy, rippleTarget: number | undefined): ConverterResult {
  const points = evaluatePoints(conv, path, rippleTarget, derating)
  const warnings = Array.from(new Set(points.flatMap(p => p.warnings.map(w => `${p.pointName}: ${w}`))))
  const envelope: ConverterResult['envelope'] = envelopeOf(points, derating, conv.clampDiodeUnitVoltage)
  const inductors = filterInductors(points, envelope.capacitors)
  if (inductors.length) envelope.inductors = inductors
  return { side, points, envelope, warnings }
}

/**
 * The matrix converter's input filter inductors, one per phase: sized for the resonance target with the
 * envelope's capacitance (so the bank bought and the inductor agree), current at each point with that
 * capacitance: |I_in,1∠−φ_in + j·ω_in·C·V_ph|, the worst point's.
 */
function filterInductors(points: PointResult[], capacitors: CapacitorEnvelope[]): InductorEnvelope[] {
  const cap = capacitors.find(c => c.kind === 'input-filter')
  const sides = points.map(p => p.inputSide)
  if (!cap || sides.some(s => !s)) return []
  const C = cap.capacitanceRequired ?? 0
  const f0 = sides[0]!.filter
  const wr = 2 * Math.PI * f0.resonanceHz
  let worst = 0
  let worstPoint = points[0]!.pointName
  points.forEach((p, k) => {
    const s = sides[k]!
    const i1 = s.phaseCurrent.fundamentalRms
    const ic = 2 * Math.PI * s.inputFrequencyHz * C * s.filter.capacitorVoltageRms
    const current = Math.hypot(i1 * Math.cos(s.displacement.angle), -i1 * Math.sin(s.displacement.angle) + ic)
    if (current > worst) { worst = current; worstPoint = p.pointName }
  })
  return [{
    name: 'Lf',
    count: 3,
    inductance: C > 0 ? 1 / (wr * wr * C) : 0,
    resonanceHz: f0.resonanceHz,
    currentRms: worst,
    currentPeak: Math.SQRT2 * worst,
    worstPoint,
    provenance: {
      method: `L = 1/((2π·f_res)²·C) with the envelope's capacitance ${fmt(C * 1e6)} µF per phase (worst point ${cap.worstPoint?.capacitanceRequired ?? worstPoint}); current = the converter's input fundamental plus the capacitor's input-frequency current, worst over ${points.length} point(s); peak √2 × RMS (the switching ripple stays in the capacitors).`,
      source: 'f_res = 1/(2π√(LC)); resonance placement between 10·f_in and f_sw/5: common practice',
    },
  }]
}

function designPreamble(input: DesignInput): { derating: DeratingPolicy, rippleTarget: number | undefined, grid?: ConverterInput, carriers: LinkCarriers } {
  if (typeof input !== 'object' || input === null) throw new EngineInputError('input', 'design input must be an object')
  const derating = resolveDerating(input.derating)
  const rippleTarget = input.capacitorRippleTarget
  if (rippleTarget !== undefined && (typeof rippleTarget !== 'number' || !Number.isFinite(rippleTarget) || rippleTarget <= 0)) {
    throw new EngineInputError('capacitorRippleTarget', 'capacitorRippleTarget must be a number above 0 (V peak-to-peak)')
  }
  if (rippleTarget !== undefined && rippleTarget < INPUT_LIMITS.capacitorRippleTarget.min) throw new EngineInputError('capacitorRippleTarget', tooSmall('capacitorRippleTarget'))
  if (rippleTarget !== undefined && rippleTarget > INPUT_LIMITS.capacitorRippleTarget.max) throw new EngineInputError('capacitorRippleTarget', tooLarge('capacitorRippleTarget'))
  if (typeof input.machineSide !== 'object' || input.machineSide === null) throw new EngineInputError('machineSide', 'machineSide is required')
  const carriers = input.linkCarriers ?? 'independent'
  if (carriers !== 'independent' && carriers !== 'synchronised') throw new EngineInputError('linkCarriers', 'linkCarriers must be \'independent\' or \'synchronised\'')
  const grid = input.gridSide !== undefined ? gridInput(input.machineSide, input.gridSide) : undefined
  if (grid && carriers === 'synchronised' && grid.switchingHz !== input.machineSide.switchingHz) {
    throw new EngineInputError('linkCarriers', `synchronised carriers need both converters at one switching frequency (machine side ${input.machineSide.switchingHz} Hz, grid side ${grid.switchingHz} Hz)`)
  }
  return { derating, rippleTarget, carriers, ...(grid ? { grid } : {}) }
}

/** Checks a design input without evaluating it (for form and route validation); throws EngineInputError naming the field. */
export function checkDesignInput(input: DesignInput): void {
  const { rippleTarget, grid } = designPreamble(input)
  const sides: [ConverterInput, string][] = [[input.machineSide, 'machineSide'], ...(grid ? [[grid, 'gridSide'] as [ConverterInput, string]] : [])]
  for (const [conv, path] of sides) {
    for (const p of pointInputs(conv, path, rippleTarget)) atPoint(p, path, () => resolveStressInput(p.input))
  }
}

/** Evaluates every operating point of the machine side (and grid side), the envelopes and required ratings. */
export function evaluateDesign(input: DesignInput): DesignResult {
  const { derating, rippleTarget, grid, carriers } = designPreamble(input)
  const converters = [converterResult('machine', input.machineSide, 'machineSide', derating, rippleTarget)]
  if (grid) converters.push(converterResult('grid', grid, 'gridSide', derating, rippleTarget))
  for (const c of converters) {
    for (const cap of [...c.envelope.capacitors, ...c.points.flatMap(p => p.capacitors)]) cap.side = c.side
  }
  // Back-to-back: the link capacitors are one bank, sized from both converters' combined current, listed once.
  const link = grid ? sharedLink(input.machineSide, grid, converters as [ConverterResult, ConverterResult], derating, rippleTarget, carriers) : undefined
  if (link) for (const c of converters) c.envelope.capacitors = c.envelope.capacitors.filter(cap => !isLinkCapacitor(cap))

  const warnings: string[] = []
  for (const c of converters) {
    const series = c.envelope.devices.filter(d => d.voltageClass === undefined)
    if (series.length > 0) {
      const worst = Math.max(...series.map(d => d.requiredVoltageRating))
      warnings.push(`${c.side === 'machine' ? 'Machine' : 'Grid'} side: ${series.map(d => d.name).join(', ')} need a ${Math.ceil(worst)} V rating, above the 6500 V class: series-connected devices (or more levels) are needed.`)
    }
    warnings.push(...c.warnings.map(w => `${c.side === 'machine' ? 'Machine' : 'Grid'} side, ${w}`))
  }
  if (converters.length === 2) {
    const [m, g] = converters as [ConverterResult, ConverterResult]
    const pm = maxPower(input.machineSide, m)
    const pg = maxPower(grid!, g)
    if (pg < 0.95 * pm) warnings.push(`Grid side carries at most ${Math.round(pg / 1000)} kW of real power but the machine side up to ${Math.round(pm / 1000)} kW: the shared DC link cannot balance (add or uprate grid-side operating points).`)
    for (const pair of link!.pairs.filter(x => !x.balanced && x.pairedBy !== 'nearest power')) {
      warnings.push(`Shared DC link, ${pair.machinePoint} with ${pair.gridPoint}: the grid side takes in ${fmt(pair.gridPowerW / 1000)} kW but the machine side delivers ${fmt(pair.machinePowerW / 1000)} kW; they differ by ${fmt(pair.imbalanceW / 1000)} kW, more than 5 %, which the converters' losses cannot account for (real power must balance through the link).`)
    }
    const differ = link!.capacitors.filter(c => c.rippleCurrentRmsSynchronised !== undefined && Math.abs(c.rippleCurrentRmsSynchronised - c.rippleCurrentRmsIndependent) > 0.01 * c.rippleCurrentRmsIndependent)
    warnings.push(`Shared DC link: one bank rated for ${carriers} carriers${differ.length ? ` (${differ.map(c => `${c.name} ${fmt(c.rippleCurrentRmsIndependent)} A RMS independent, ${fmt(c.rippleCurrentRmsSynchronised!)} A with one common carrier`).join('; ')})` : ''}.`)
  }
  return { converters, derating, warnings, ...(link ? { sharedLink: link } : {}) }
}

/** W, largest real power magnitude √3·V_LL,1·I·cos φ over a converter's points. */
function maxPower(conv: ConverterInput, result: ConverterResult): number {
  return Math.max(...result.points.map((p, i) => {
    const op = conv.operatingPoints[i]!
    return Math.abs(Math.sqrt(3) * p.lineVoltageFundamentalRms * op.phaseCurrentRms * op.powerFactor)
  }))
}
