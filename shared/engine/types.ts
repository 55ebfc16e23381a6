// Public types of the stress engine. SI units throughout: V, A, Hz, H, F, W, °C.
// The API (POST /api/v1/stress), the UI and the reports all read these shapes.

export type TopologyId
  = | 'two-level'
    | 'diode-clamped'
    | 't-type'
    | 'anpc'
    | 'flying-capacitor'
    | 'cascaded-h-bridge'
    | 'matrix'

export type Modulation = 'sine' | 'third-harmonic' | 'space-vector' | 'six-step'

export type DeviceKind = 'switch' | 'diode' | 'clamp-diode'
export type CapacitorKind = 'dc-link' | 'flying' | 'cell' | 'input-filter'
/**
 * What a capacitor is, explicitly (never read from its name): 'dc-link' a bank across the whole DC link,
 * 'split' one of the series capacitors of a split DC link, 'flying' a flying capacitor, 'cell' an H-bridge
 * cell's own capacitor, 'filter' an AC input-filter capacitor.
 */
export type CapacitorRole = 'dc-link' | 'split' | 'flying' | 'cell' | 'filter'
/** Which converter a capacitor belongs to; 'shared': the one DC link a back-to-back pair shares (one bank). */
export type CapacitorSide = 'machine' | 'grid' | 'shared'
/** Carrier assumption for a shared DC link: one common carrier (same f_sw, in phase) or independent carriers. */
export type LinkCarriers = 'synchronised' | 'independent'

/** Where a number comes from, so an engineer can see why it is what it is. */
export interface Provenance {
  /** How it was computed, one sentence. */
  method: string
  /** The published source it was checked against ("common practice" / "from memory" where that is all there is). */
  source: string
}

/** Lagging: the current follows the voltage (inductive load, motoring); leading: it runs ahead (capacitive operation). */
export type PowerFactorSense = 'lagging' | 'leading'

/** One operating point of the AC side. */
export interface OperatingPoint {
  name?: string
  /** V, output fundamental line-to-line RMS (ignored for six-step). */
  lineVoltageRms: number
  /** A, output phase current RMS. */
  phaseCurrentRms: number
  /** −1…1; negative = regeneration (power from AC side into the DC link). */
  powerFactor: number
  /** Whether the current lags (default) or leads the voltage: φ = ±acos(powerFactor). */
  powerFactorSense?: PowerFactorSense
  /** Hz, output fundamental. */
  fundamentalHz: number
  /** Mission profile, not read by the engine: share of the operating hours (0…1) and start / stop cycles per hour. */
  hoursShare?: number
  startsPerHour?: number
}

/** One evaluation as POST /api/v1/stress takes it. */
export interface StressInput extends OperatingPoint {
  topology: TopologyId
  /** Level count: 2 two-level; 3 t-type/anpc; 3…9 diode-clamped/flying-capacitor; odd 3…15 cascaded-h-bridge; ignored for matrix. */
  levels?: number
  /** V, nominal DC link (per cell for cascaded-h-bridge; unused by matrix). */
  dcVoltage?: number
  /** V, worst-case DC link for blocking voltages; default dcVoltage. */
  dcVoltageMax?: number
  /** V, matrix converter input line-to-line RMS. */
  inputLineVoltageRms?: number
  /** Matrix converter: input displacement factor cos φ_i (0.2…1, default 1); the input may run at another power factor than the load. */
  inputDisplacementFactor?: number
  /** Matrix converter: whether the input current lags (default) or leads the input voltage. */
  inputDisplacementSense?: PowerFactorSense
  /** Hz, matrix converter input (grid) frequency, default 50. */
  inputFrequencyHz?: number
  /** Hz, matrix converter input filter L–C resonance target, default √(2·f_in·f_sw), the middle of 10·f_in … f_sw/5 (common practice). */
  inputFilterResonanceHz?: number
  /** Hz, switching frequency (equals the fundamental for six-step). */
  switchingHz: number
  modulation: Modulation
  /** V, commutation overshoot added to commutating devices' blocking voltage. */
  overshootVoltage?: number
  /** H, commutation-loop stray inductance; with the current slope gives the overshoot when overshootVoltage is absent. */
  strayInductance?: number
  /** A/s, current slope at turn-off used with strayInductance. */
  currentSlope?: number
  /** V, unit rating used to realise clamp-diode stacks (seriesCount); default V_dc,max/(N−1). */
  clampDiodeUnitVoltage?: number
  /** V peak-to-peak ripple target for capacitance sizing; default 5 % of each capacitor's nominal voltage. */
  capacitorRippleTarget?: number
}

export interface DeviceStress {
  /** Position name in the leg, e.g. "S1", "D1", "Dc1+" (stable ids; UI draws them). */
  name: string
  kind: DeviceKind
  countPerPhase: number
  /** V, steady-state blocking voltage at dcVoltageMax. */
  blockingVoltage: number
  /** V, with the commutation overshoot where the device commutates. */
  blockingVoltageWithOvershoot: number
  /** A */
  currentAvg: number
  /** A */
  currentRms: number
  /** A */
  currentPeak: number
  /** Clamp diodes: unit diodes in series to realise the position. */
  seriesCount?: number
  /** V, commutated voltage per switching event (for switching losses). */
  commutatedVoltage?: number
  /**
   * V·A, this operating point only: mean over the fundamental period of Σ |i|·v over the device's
   * commutations in one carrier period, by role (derived from the state table, shared/engine/commutations.ts).
   * Switching loss = f_sw · Σ_role E_ref,role · duty_role / (I_ref · V_ref) with linear E(I, V) scaling.
   * The matrix converter's from its carrier pattern at the instantaneous input line voltage (matrix-input.ts).
   * Absent when the topology has no commutation model.
   */
  switchingDuty?: { turnOn: number, turnOff: number, recovery: number }
  provenance: Provenance
}

export interface CapacitorStress {
  name: string
  kind: CapacitorKind
  role: CapacitorRole
  /** set by evaluateDesign: the converter it belongs to, or 'shared' for a back-to-back pair's DC link */
  side?: CapacitorSide
  count: number
  /** V, DC voltage across it at dcVoltageMax. */
  voltage: number
  /** A, RMS ripple current. */
  rippleCurrentRms: number
  /** F, capacitance needed for the ripple target (if computed). */
  capacitanceRequired?: number
  /** V peak-to-peak, the ripple target capacitanceRequired was sized for. */
  rippleTarget?: number
  /** A, RMS of the switching-period-averaged (low-frequency) part of the ripple current, e.g. the NPC neutral-point 3rd harmonic or the H-bridge cell 2nd harmonic. */
  lowFrequencyRippleRms?: number
  /** Unit capacitors rated one level step (V_dc/(N−1)) in series to realise it (flying capacitors: k). */
  seriesCount?: number
  provenance: Provenance
}

/** The matrix converter's input side at one operating point (shared/engine/matrix-input.ts). */
export interface MatrixInputSide {
  /** output phase peak / input phase peak */
  transferRatio: number
  /** largest linear transfer ratio: (√3/2)·cos φ_i with third-harmonic / space-vector, 0.75·cos φ_i with sine */
  transferLimit: number
  /** input displacement factor as designed: cos φ_i, sense, φ_i (rad, current behind the input voltage) */
  displacement: { value: number, sense: PowerFactorSense, angle: number }
  inputFrequencyHz: number
  /** A, converter-side input current per phase: fundamental RMS, switched RMS, rectified mean, peak */
  phaseCurrent: { fundamentalRms: number, rms: number, average: number, peak: number }
  /** A, one bidirectional switch path (input X ↔ output Y), both directions: rectified mean, RMS, peak */
  switchPath: { average: number, rms: number, peak: number }
  filter: {
    /** F per phase, star-connected, for the ripple target */
    capacitance: number
    /** V peak-to-peak the capacitance is sized for */
    rippleTarget: number
    /** V, capacitor voltage RMS (input phase voltage) and peak (with half the ripple) */
    capacitorVoltageRms: number
    capacitorVoltagePeak: number
    /** A RMS: total, switching part, input-frequency part ω_i·C·V_ph */
    capacitorCurrentRms: number
    capacitorSwitchingCurrentRms: number
    capacitorFundamentalCurrentRms: number
    /** var, three capacitors at the input frequency */
    reactivePower: number
    /** H per phase for the resonance target with this capacitance */
    inductance: number
    resonanceHz: number
    /** A RMS, inductor (grid) current: converter input fundamental plus the capacitor current */
    inductorCurrentRms: number
    /** the grid's displacement factor seen through the filter capacitors */
    gridDisplacement: { value: number, sense: PowerFactorSense }
  }
  provenance: Provenance
}

export interface SpectrumLine {
  /** harmonic order (1 = fundamental) */
  order: number
  /** Hz */
  frequency: number
  /** V, peak amplitude of the line voltage at that order */
  amplitude: number
}

export interface Waveform {
  /** s */
  time: number[]
  /** V, line-to-line voltage u_ab */
  lineVoltage: number[]
  /** V, phase-leg (pole) voltage */
  poleVoltage: number[]
  /** A, phase current */
  phaseCurrent: number[]
}

export interface StressResult {
  topology: TopologyId
  levels: number
  modulationIndex: number
  devices: DeviceStress[]
  capacitors: CapacitorStress[]
  /** V, line-to-line fundamental RMS actually produced */
  lineVoltageFundamentalRms: number
  /** fraction (0.31 = 31 %), full band: √(V_rms² − V_1²) / V_1 from the switched waveform's time-domain RMS */
  lineVoltageThd: number
  /** fraction, the harmonic sum over orders 2…thdMaxOrder only (labelled with thdMaxOrder wherever shown) */
  lineVoltageThdToOrder: number
  /** the power factor as evaluated: cos φ, lagging or leading, and φ (rad, current behind the voltage; negative = leading) */
  powerFactor: { value: number, sense: PowerFactorSense, currentPhaseAngle: number }
  warnings: string[]
  /** Assumptions behind this result (switching pattern, THD order range), one sentence each. */
  notes?: string[]
  /** Highest harmonic order included in lineVoltageThdToOrder. */
  thdMaxOrder?: number
  counts: { switchesPerPhase: number, diodesPerPhase: number, clampDiodesPerPhase: number, capacitors: number, switchesTotal: number, diodesTotal: number, clampDiodesTotal: number }
  /** Matrix converter only: input currents, input power factor and input filter. */
  inputSide?: MatrixInputSide
  /** Only when requested (includeWaveform): one fundamental period. */
  waveform?: Waveform
  spectrum?: SpectrumLine[]
}

/** Derating policy: how the envelope becomes required part ratings. Defaults: common practice (ENGINEERING.md). */
export interface DeratingPolicy {
  /** Max DC-link-to-rated-voltage utilisation of semiconductors (0.65 → a 1200 V part at ≤ 780 V blocking). */
  semiconductorVoltageUtilisation: number
  /** Max (steady blocking + commutation overshoot)-to-rated-voltage ratio (1 → the transient peak may reach the rating). */
  semiconductorTransientMargin: number
  /** Max peak-current-to-rated-current ratio (1 = peak at or below the nominal rating). */
  semiconductorCurrentUtilisation: number
  /** Max capacitor voltage-to-rating ratio. */
  capacitorVoltageUtilisation: number
  /** Max capacitor ripple-to-rating ratio. */
  capacitorRippleUtilisation: number
  /** °C margin kept below T_j,max in the thermal check. */
  junctionMarginC: number
  /** °C heatsink temperature assumed for the thermal check. */
  heatsinkTemperatureC: number
}

/** One converter (machine side or grid side) of a design. */
export interface ConverterInput {
  topology: TopologyId
  levels?: number
  dcVoltage?: number
  dcVoltageMax?: number
  inputLineVoltageRms?: number
  inputDisplacementFactor?: number
  inputDisplacementSense?: PowerFactorSense
  inputFrequencyHz?: number
  inputFilterResonanceHz?: number
  switchingHz: number
  modulation: Modulation
  overshootVoltage?: number
  strayInductance?: number
  currentSlope?: number
  clampDiodeUnitVoltage?: number
  operatingPoints: OperatingPoint[]
}

export interface DesignInput {
  machineSide: ConverterInput
  /** Optional active front end sharing the DC link (back-to-back): any topology with the same DC-link structure. */
  gridSide?: ConverterInput
  /** Back-to-back: carrier assumption the shared DC link is sized and rated for; default 'independent'. */
  linkCarriers?: LinkCarriers
  derating?: Partial<DeratingPolicy>
  /** V ripple target on the split / cell capacitors (peak-to-peak) for capacitance sizing. */
  capacitorRippleTarget?: number
  /** Cooling and lifetime-model settings, not read by the engine (shared/thermal/dynamics.ts, lifetime.ts). */
  thermal?: DesignThermalSettings
}

export interface DesignThermalSettings {
  /** °C, air or coolant temperature */
  ambientTemperatureC: number
  /** K/W, heatsink to ambient for the converter's whole semiconductor loss */
  heatsinkRth: number
  /** s */
  heatsinkTimeConstantS: number
  lifetime?: Partial<{ K: number, beta1: number, beta2: number, beta3: number, beta4: number, beta5: number, beta6: number, currentPerBondWireA: number, bondWireDiameterUm: number }>
}

export interface DeviceEnvelope extends DeviceStress {
  /** name of the operating point that set each worst value */
  worstPoint: { blockingVoltage: string, currentAvg: string, currentRms: string, currentPeak: string }
  /** V, required part voltage rating after derating: max(V/u, (V+ΔV)/margin); clamp-diode stacks: per unit diode */
  requiredVoltageRating: number
  /** V, the same requirement for the whole position (a clamp-diode stack: all its units together) */
  positionVoltageRating: number
  /** which derating check set the voltage requirement: utilisation (steady V/u) or transient ((V+ΔV)/margin) */
  voltageRatingSetBy: 'utilisation' | 'transient'
  /** A, required part current rating after derating */
  requiredCurrentRating: number
  /** V, smallest standard voltage class (600…6500 V) at or above requiredVoltageRating; absent when none suffices (series devices) */
  voltageClass?: number
}

export interface CapacitorEnvelope extends CapacitorStress {
  requiredVoltageRating: number
  requiredRippleRating: number
  /** name of the operating point that set each worst value */
  worstPoint?: { voltage: string, rippleCurrentRms: string, capacitanceRequired: string }
}

/** An inductor position (matrix converter input filter): no catalogue kind, specified by hand in the BOM. */
export interface InductorEnvelope {
  name: string
  /** per converter */
  count: number
  /** H per phase for the resonance target with the envelope's capacitance */
  inductance: number
  resonanceHz: number
  /** A RMS and peak, worst operating point */
  currentRms: number
  currentPeak: number
  worstPoint: string
  provenance: Provenance
}

export interface ConverterResult {
  side: 'machine' | 'grid'
  points: (StressResult & { pointName: string })[]
  envelope: { devices: DeviceEnvelope[], capacitors: CapacitorEnvelope[], inductors?: InductorEnvelope[] }
  warnings: string[]
}

/** One machine-side point run together with one grid-side point on the shared DC link. */
export interface LinkPointPair {
  machinePoint: string
  gridPoint: string
  /** how the pair was formed: the same point name, the same position in the lists, or the grid point closest in real power */
  pairedBy: 'name' | 'index' | 'nearest power'
  /** W, real power the machine side delivers at its AC terminals (negative: regeneration) */
  machinePowerW: number
  /** W, real power the grid side takes in at its AC terminals (negative: feeding back) */
  gridPowerW: number
  /** var, each side's own reactive power at its AC terminals (never netted through the link) */
  machineReactiveVar: number
  gridReactiveVar: number
  /** W, gridPowerW − machinePowerW: what the losses of both converters must account for */
  imbalanceW: number
  /** the two real powers agree within 5 % of the larger (losses unknown to the engine) */
  balanced: boolean
  /** A RMS per shared capacitor (by name): both carrier assumptions; synchronised only with equal switching frequencies */
  rippleCurrentRms: Record<string, { synchronised?: number, independent: number }>
}

export interface SharedLinkCapacitor extends CapacitorEnvelope {
  /** A RMS, combined ripple current with one common carrier (same f_sw, in phase); absent when the switching frequencies differ */
  rippleCurrentRmsSynchronised?: number
  /** A RMS, root-sum-square of the two sides' ripple currents (independent carriers) */
  rippleCurrentRmsIndependent: number
  /** F, capacitance for the ripple target under each assumption */
  capacitanceSynchronised?: number
  capacitanceIndependent: number
}

/** The one DC link of a back-to-back pair: one bank sized from both converters' combined current. */
export interface SharedLinkResult {
  /** the assumption `rippleCurrentRms`, `capacitanceRequired` and the required ratings use */
  carriers: LinkCarriers
  capacitors: SharedLinkCapacitor[]
  pairs: LinkPointPair[]
  notes: string[]
}

export interface DesignResult {
  converters: ConverterResult[]
  /** back-to-back only: the shared DC link (its capacitors are not repeated in the converters' envelopes) */
  sharedLink?: SharedLinkResult
  derating: DeratingPolicy
  warnings: string[]
}
