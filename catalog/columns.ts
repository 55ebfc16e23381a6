// The one definition of the parts catalogue's columns. The import template, import validation,
// header mapping, UI labels and docs all read this file; add or change a column here only.
// Quantities are stored in SI units (V, A, Ω, J, K/W, F); temperatures in °C, lead times in days.

import type { TopologyId } from '../shared/engine/types'

/** What one catalogue row is. 'switch-diode' = a switch with its anti-parallel (free-wheeling) diode. */
export const PART_KINDS = ['switch-diode', 'switch', 'diode', 'capacitor'] as const
export type PartKind = (typeof PART_KINDS)[number]

export const SEMICONDUCTOR_KINDS: readonly PartKind[] = ['switch-diode', 'switch', 'diode']
export const SWITCH_KINDS: readonly PartKind[] = ['switch-diode', 'switch']
export const DIODE_KINDS: readonly PartKind[] = ['switch-diode', 'diode']

export const PACKAGE_CONFIGURATION_IDS = [
  'single', 'half-bridge', 'chopper', 'h-bridge', 'six-pack', 'npc-leg', 't-type-leg', 'anpc-leg', 'dual-diode',
] as const
export type PackageConfiguration = (typeof PACKAGE_CONFIGURATION_IDS)[number]

export const TECHNOLOGIES = ['si-igbt', 'si-mosfet', 'sic-mosfet', 'si-diode', 'sic-diode', 'film', 'electrolytic'] as const
export type Technology = (typeof TECHNOLOGIES)[number]

export const LIFECYCLES = ['active', 'nrnd', 'obsolete'] as const
export type Lifecycle = (typeof LIFECYCLES)[number]

export const CURRENCIES = ['EUR', 'USD', 'GBP', 'CHF', 'SEK', 'NOK', 'DKK', 'PLN', 'CZK', 'JPY', 'CNY', 'INR', 'KRW', 'CAD', 'AUD'] as const
export type Currency = (typeof CURRENCIES)[number]

/** How many device positions one package covers. */
export interface PackageConfigurationInfo {
  label: string
  /** Part kinds that may have this configuration. */
  kinds: readonly PartKind[]
  /** Switch positions (each with its anti-parallel diode when the kind is 'switch-diode'). */
  switches: number
  /** Free-standing diode positions (diode parts, chopper free-wheel diode). */
  diodes: number
  /** Clamp-diode positions built into the package (NPC leg). */
  clampDiodes: number
  /** Phase legs one package spans (a six-pack spans three phases). */
  phasesPerPackage: number
  /** Topologies the package is made for; absent = usable anywhere. */
  topologies?: readonly TopologyId[]
  description: string
}

const ALL_BUT_MATRIX: readonly TopologyId[] = ['two-level', 'diode-clamped', 't-type', 'anpc', 'flying-capacitor', 'cascaded-h-bridge']

export const PACKAGE_CONFIGURATIONS: Record<PackageConfiguration, PackageConfigurationInfo> = {
  'single': { label: 'Single', kinds: PART_KINDS, switches: 1, diodes: 1, clampDiodes: 1, phasesPerPackage: 1, description: 'one switch (with its diode), one diode or one capacitor' },
  'half-bridge': { label: 'Half-bridge', kinds: SWITCH_KINDS, switches: 2, diodes: 0, clampDiodes: 0, phasesPerPackage: 1, topologies: ALL_BUT_MATRIX, description: 'two switches in series with the midpoint brought out (one phase leg of a two-level inverter)' },
  'chopper': { label: 'Chopper', kinds: ['switch-diode'], switches: 1, diodes: 1, clampDiodes: 0, phasesPerPackage: 1, description: 'one switch and one free-wheeling diode in series' },
  'h-bridge': { label: 'H-bridge', kinds: SWITCH_KINDS, switches: 4, diodes: 0, clampDiodes: 0, phasesPerPackage: 1, topologies: ['cascaded-h-bridge'], description: 'four switches forming one H-bridge cell' },
  'six-pack': { label: 'Six-pack', kinds: SWITCH_KINDS, switches: 6, diodes: 0, clampDiodes: 0, phasesPerPackage: 3, topologies: ['two-level'], description: 'three half-bridges: a complete two-level three-phase bridge' },
  'npc-leg': { label: 'Three-level NPC leg', kinds: ['switch-diode'], switches: 4, diodes: 0, clampDiodes: 2, phasesPerPackage: 1, topologies: ['diode-clamped'], description: 'one neutral-point-clamped leg: four switches and two clamp diodes' },
  't-type-leg': { label: 'Three-level T-type leg', kinds: ['switch-diode'], switches: 4, diodes: 0, clampDiodes: 0, phasesPerPackage: 1, topologies: ['t-type'], description: 'one T-type leg: two outer switches at the full DC link and two back-to-back inner switches (voltage rating = outer switches)' },
  'anpc-leg': { label: 'Three-level active NPC leg', kinds: ['switch-diode'], switches: 6, diodes: 0, clampDiodes: 0, phasesPerPackage: 1, topologies: ['anpc'], description: 'one active-NPC leg: six switches' },
  'dual-diode': { label: 'Dual diode', kinds: ['diode'], switches: 0, diodes: 2, clampDiodes: 2, phasesPerPackage: 1, description: 'two diodes in one package (series or common terminal)' },
}

export type ColumnType = 'text' | 'number' | 'integer' | 'enum' | 'url' | 'priceBreaks'

export type ColumnKey
  = | 'partNumber' | 'manufacturer' | 'kind' | 'packageConfiguration' | 'technology'
    | 'voltageRating' | 'currentRating'
    | 'switchThresholdVoltage' | 'switchSlopeResistance' | 'diodeThresholdVoltage' | 'diodeSlopeResistance'
    | 'turnOnEnergy' | 'turnOffEnergy' | 'recoveryEnergy' | 'energyReferenceVoltage' | 'energyReferenceCurrent'
    | 'rthJunctionCaseSwitch' | 'rthJunctionCaseDiode' | 'rthCaseHeatsink' | 'junctionTemperatureMax'
    | 'lossDataTemperature' | 'switchThresholdVoltage25' | 'switchSlopeResistance25' | 'diodeThresholdVoltage25' | 'diodeSlopeResistance25'
    | 'turnOnEnergy25' | 'turnOffEnergy25' | 'recoveryEnergy25'
    | FosterColumnKey
    | 'capacitorRatedLife' | 'capacitorRatedTemperature' | 'capacitorRthHotSpot'
    | 'capacitance' | 'rippleCurrentRating' | 'esr'
    | 'priceBreaks' | 'currency' | 'minimumOrderQuantity' | 'stock' | 'leadTimeDays' | 'lifecycle'
    | 'supplier' | 'datasheetUrl' | 'description'

/** Foster network junction-case, up to four R/τ pairs per device (shared/thermal/network.ts). */
export const FOSTER_PAIRS = 4
export type FosterDevice = 'Switch' | 'Diode'
export type FosterColumnKey = `zth${FosterDevice}${'R' | 'Tau'}${1 | 2 | 3 | 4}`
/** The Foster columns of one device, pair by pair: [R_i key, τ_i key]. */
export function fosterKeys(device: FosterDevice): readonly (readonly [FosterColumnKey, FosterColumnKey])[] {
  return FOSTER_KEYS[device]
}

// Built once: the thermal code asks for them per device and operating point.
const FOSTER_KEYS: Record<FosterDevice, readonly (readonly [FosterColumnKey, FosterColumnKey])[]> = {
  Switch: Array.from({ length: FOSTER_PAIRS }, (_, i) => [`zthSwitchR${i + 1}` as FosterColumnKey, `zthSwitchTau${i + 1}` as FosterColumnKey] as const),
  Diode: Array.from({ length: FOSTER_PAIRS }, (_, i) => [`zthDiodeR${i + 1}` as FosterColumnKey, `zthDiodeTau${i + 1}` as FosterColumnKey] as const),
}

export type ExampleValue = string | number

export interface CatalogColumn {
  key: ColumnKey
  /** Header label as the template writes it. */
  header: string
  /** Unit shown in the template's units row; numbers without a unit are read in this unit. */
  unit: string
  type: ColumnType
  /** Part kinds for which the cell must be filled. */
  requiredFor: readonly PartKind[]
  /** Allowed values (enum columns). */
  values?: readonly string[]
  /** Other spellings accepted for enum values, normalised (lower case, single spaces) → value. */
  valueAliases?: Readonly<Record<string, string>>
  /** Plausible range in `unit`; outside it the cell is refused with the range named. */
  min?: number
  max?: number
  /** Value used when the cell is blank and the column is not required for the row's kind. */
  defaultValue?: string
  description: string
  /** Template example per kind (absent kinds leave the cell blank). */
  examples: Partial<Record<PartKind, ExampleValue>>
  /** Other header names this column is often given (for the mapping suggestion). */
  aliases: readonly string[]
}

const SEMIS = SEMICONDUCTOR_KINDS
// A switch's own diode figures and R_th(c-h) are optional: a part without them imports with them empty
// and matching says which figure is missing (losses or T_j not computed). A diode part needs its own.
const DIODE_ONLY: readonly PartKind[] = ['diode']
const ALL = PART_KINDS

export const CATALOG_COLUMNS: readonly CatalogColumn[] = [
  {
    key: 'partNumber', header: 'Part number', unit: '', type: 'text', requiredFor: ALL,
    description: 'Manufacturer\'s part number, exactly as ordered.',
    examples: { 'switch-diode': 'EXAMPLE-HB12-450', 'switch': 'EXAMPLE-SW17-300', 'diode': 'EXAMPLE-D33-800', 'capacitor': 'EXAMPLE-CF11-500U' },
    aliases: ['part no', 'part #', 'pn', 'mpn', 'manufacturer part number', 'mfr part number', 'order code', 'ordering code', 'article', 'article number', 'item', 'type designation', 'part'],
  },
  {
    key: 'manufacturer', header: 'Manufacturer', unit: '', type: 'text', requiredFor: ALL,
    description: 'Maker of the part (not the distributor).',
    examples: { 'switch-diode': 'Example Semiconductor', 'switch': 'Example Semiconductor', 'diode': 'Example Semiconductor', 'capacitor': 'Example Capacitors' },
    aliases: ['mfr', 'mfg', 'maker', 'make', 'brand', 'producer', 'manufacturer name'],
  },
  {
    key: 'kind', header: 'Kind', unit: '', type: 'enum', requiredFor: ALL, values: PART_KINDS,
    valueAliases: {
      'igbt + diode': 'switch-diode', 'igbt+diode': 'switch-diode', 'igbt/diode': 'switch-diode', 'igbt with diode': 'switch-diode',
      'switch + diode': 'switch-diode', 'switch with diode': 'switch-diode', 'switch/diode': 'switch-diode', 'mosfet + diode': 'switch-diode',
      'switch only': 'switch', 'igbt only': 'switch', 'rectifier diode': 'diode', 'clamp diode': 'diode', 'fwd': 'diode',
      'cap': 'capacitor', 'dc-link capacitor': 'capacitor', 'dc link capacitor': 'capacitor',
    },
    description: '\'switch-diode\' = switch with anti-parallel diode (IGBT with free-wheeling diode, MOSFET with body or co-packed diode); \'switch\' = switch without diode; \'diode\'; \'capacitor\'.',
    examples: { 'switch-diode': 'switch-diode', 'switch': 'switch', 'diode': 'diode', 'capacitor': 'capacitor' },
    aliases: ['part kind', 'device kind', 'device type', 'component type', 'part type', 'category', 'type'],
  },
  {
    key: 'packageConfiguration', header: 'Package configuration', unit: '', type: 'enum', requiredFor: SEMIS,
    values: PACKAGE_CONFIGURATION_IDS,
    valueAliases: {
      'half bridge': 'half-bridge', 'halfbridge': 'half-bridge', 'dual': 'half-bridge', '2-pack': 'half-bridge', 'phase leg': 'half-bridge',
      'sixpack': 'six-pack', 'six pack': 'six-pack', '6-pack': 'six-pack', '6 pack': 'six-pack', 'full bridge': 'h-bridge', 'h bridge': 'h-bridge',
      'npc': 'npc-leg', 'npc leg': 'npc-leg', 'three-level npc leg': 'npc-leg', '3-level npc': 'npc-leg', 'i-type': 'npc-leg',
      't-type': 't-type-leg', 't type': 't-type-leg', 'three-level t-type leg': 't-type-leg', 'anpc': 'anpc-leg', 'anpc leg': 'anpc-leg',
      'dual diode': 'dual-diode', 'single switch': 'single', 'discrete': 'single', 'brake chopper': 'chopper',
    },
    description: `How many device positions one package covers: ${PACKAGE_CONFIGURATION_IDS.map(id => `'${id}' = ${PACKAGE_CONFIGURATIONS[id].description}`).join('; ')}. Blank for capacitors.`,
    examples: { 'switch-diode': 'half-bridge', 'switch': 'single', 'diode': 'single' },
    aliases: ['configuration', 'config', 'circuit', 'circuit configuration', 'module type', 'package type', 'topology', 'housing'],
  },
  {
    key: 'technology', header: 'Technology', unit: '', type: 'enum', requiredFor: [], values: TECHNOLOGIES,
    valueAliases: { 'igbt': 'si-igbt', 'si igbt': 'si-igbt', 'sic': 'sic-mosfet', 'sic mosfet': 'sic-mosfet', 'mosfet': 'si-mosfet', 'sic schottky': 'sic-diode', 'schottky': 'sic-diode', 'sic diode': 'sic-diode', 'si diode': 'si-diode', 'film capacitor': 'film', 'polypropylene': 'film', 'aluminium electrolytic': 'electrolytic', 'aluminum electrolytic': 'electrolytic', 'e-cap': 'electrolytic' },
    description: 'Optional: semiconductor or dielectric technology, for filtering.',
    examples: { 'switch-diode': 'si-igbt', 'switch': 'si-igbt', 'diode': 'si-diode', 'capacitor': 'film' },
    aliases: ['tech', 'material', 'dielectric', 'device technology'],
  },
  {
    key: 'voltageRating', header: 'Voltage rating', unit: 'V', type: 'number', requiredFor: ALL, min: 1, max: 50_000,
    description: 'Semiconductors: rated blocking voltage (V_CES, V_DSS or V_RRM). Capacitors: rated DC voltage.',
    examples: { 'switch-diode': 1200, 'switch': '1.7 kV', 'diode': 3300, 'capacitor': 1100 },
    aliases: ['vces', 'vdss', 'vrrm', 'v ces', 'v rrm', 'rated voltage', 'blocking voltage', 'voltage class', 'voltage', 'v rating', 'vdc rated', 'un', 'vr'],
  },
  {
    key: 'currentRating', header: 'Current rating', unit: 'A', type: 'number', requiredFor: SEMIS, min: 0.01, max: 20_000,
    description: 'Nominal continuous current per switch or diode (I_C,nom, I_D or I_F).',
    examples: { 'switch-diode': 450, 'switch': 300, 'diode': 800 },
    aliases: ['ic', 'ic nom', 'icnom', 'inom', 'id', 'if', 'ifav', 'i nom', 'nominal current', 'rated current', 'current', 'current class'],
  },
  {
    key: 'switchThresholdVoltage', header: 'Switch threshold voltage V0', unit: 'V', type: 'number', requiredFor: SWITCH_KINDS, min: 0, max: 10,
    description: 'On-state model of the switch, v = V0 + r·i, at the hot junction temperature; 0 for a MOSFET.',
    examples: { 'switch-diode': 0.85, 'switch': 1.0 },
    aliases: ['vce0', 'v ce0', 'vt0 switch', 'v0 switch', 'switch v0', 'igbt v0', 'vce(to)', 'vto igbt', 'threshold voltage switch'],
  },
  {
    key: 'switchSlopeResistance', header: 'Switch slope resistance r', unit: 'Ω', type: 'number', requiredFor: SWITCH_KINDS, min: 0, max: 10,
    description: 'On-state slope resistance of the switch (R_DS(on) for a MOSFET), hot.',
    examples: { 'switch-diode': '2.1 mΩ', 'switch': '4.2 mOhm' },
    aliases: ['rce', 'r ce', 'rt switch', 'r switch', 'switch r', 'igbt r', 'rds(on)', 'rdson', 'rds on', 'slope resistance switch', 'on resistance'],
  },
  {
    key: 'diodeThresholdVoltage', header: 'Diode threshold voltage V0', unit: 'V', type: 'number', requiredFor: DIODE_ONLY, min: 0, max: 10,
    description: 'On-state model of the diode, v = V0 + r·i, hot.',
    examples: { 'switch-diode': 0.9, 'diode': 1.1 },
    aliases: ['vf0', 'v f0', 'vt0 diode', 'v0 diode', 'diode v0', 'vto diode', 'threshold voltage diode'],
  },
  {
    key: 'diodeSlopeResistance', header: 'Diode slope resistance r', unit: 'Ω', type: 'number', requiredFor: DIODE_ONLY, min: 0, max: 10,
    description: 'On-state slope resistance of the diode, hot.',
    examples: { 'switch-diode': '1.6 mΩ', 'diode': '0.9 mΩ' },
    aliases: ['rf', 'r f', 'rd', 'rt diode', 'r diode', 'diode r', 'slope resistance diode'],
  },
  {
    key: 'turnOnEnergy', header: 'Turn-on energy Eon', unit: 'J', type: 'number', requiredFor: SWITCH_KINDS, min: 0, max: 100,
    description: 'Switch turn-on energy per event at the test voltage and current, hot (e.g. "45 mJ").',
    examples: { 'switch-diode': '45 mJ', 'switch': '120 mJ' },
    aliases: ['eon', 'e on', 'turn on energy', 'turn-on loss'],
  },
  {
    key: 'turnOffEnergy', header: 'Turn-off energy Eoff', unit: 'J', type: 'number', requiredFor: SWITCH_KINDS, min: 0, max: 100,
    description: 'Switch turn-off energy per event at the test voltage and current, hot.',
    examples: { 'switch-diode': '55 mJ', 'switch': '110 mJ' },
    aliases: ['eoff', 'e off', 'turn off energy', 'turn-off loss'],
  },
  {
    key: 'recoveryEnergy', header: 'Reverse-recovery energy Err', unit: 'J', type: 'number', requiredFor: DIODE_ONLY, min: 0, max: 100,
    description: 'Diode reverse-recovery energy per event at the test voltage and current, hot; 0 for a SiC Schottky diode.',
    examples: { 'switch-diode': '30 mJ', 'diode': '0.9 J' },
    aliases: ['err', 'erec', 'e rec', 'e rr', 'recovery energy', 'reverse recovery energy'],
  },
  {
    key: 'energyReferenceVoltage', header: 'Energy test voltage', unit: 'V', type: 'number', requiredFor: SEMIS, min: 1, max: 50_000,
    description: 'DC voltage at which Eon, Eoff and Err are given (datasheet test condition).',
    examples: { 'switch-diode': 600, 'switch': 900, 'diode': 1800 },
    aliases: ['vcc', 'v cc', 'vdc test', 'test voltage', 'vref', 'v ref', 'reference voltage', 'energy reference voltage', 'switching test voltage'],
  },
  {
    key: 'energyReferenceCurrent', header: 'Energy test current', unit: 'A', type: 'number', requiredFor: SEMIS, min: 0.01, max: 50_000,
    description: 'Current at which Eon, Eoff and Err are given (datasheet test condition).',
    examples: { 'switch-diode': 450, 'switch': 300, 'diode': 800 },
    aliases: ['ic test', 'i test', 'iref', 'i ref', 'test current', 'reference current', 'energy reference current', 'switching test current'],
  },
  {
    key: 'rthJunctionCaseSwitch', header: 'Rth junction-case switch', unit: 'K/W', type: 'number', requiredFor: SWITCH_KINDS, min: 0.0001, max: 50,
    description: 'Thermal resistance junction to case of one switch.',
    examples: { 'switch-diode': 0.065, 'switch': 0.1 },
    aliases: ['rthjc switch', 'rth jc switch', 'rth(j-c) igbt', 'rthjc igbt', 'rth jc igbt', 'rth(j-c) switch', 'rthjc', 'rth jc', 'rth(j-c)', 'rthjc transistor'],
  },
  {
    key: 'rthJunctionCaseDiode', header: 'Rth junction-case diode', unit: 'K/W', type: 'number', requiredFor: DIODE_ONLY, min: 0.0001, max: 50,
    description: 'Thermal resistance junction to case of one diode.',
    examples: { 'switch-diode': 0.11, 'diode': 0.02 },
    aliases: ['rthjc diode', 'rth jc diode', 'rth(j-c) diode', 'rthjc fwd', 'rth(j-c) fwd', 'rth jc d'],
  },
  {
    key: 'rthCaseHeatsink', header: 'Rth case-heatsink', unit: 'K/W', type: 'number', requiredFor: [], min: 0, max: 50,
    description: 'Thermal resistance case to heatsink per switch or diode, with the specified interface material.',
    examples: { 'switch-diode': 0.03, 'switch': 0.04, 'diode': 0.01 },
    aliases: ['rthch', 'rth ch', 'rth(c-h)', 'rth(c-s)', 'rthcs', 'rth cs', 'rth case heatsink', 'rth case sink'],
  },
  {
    key: 'junctionTemperatureMax', header: 'Tj max', unit: '°C', type: 'number', requiredFor: SEMIS, min: 50, max: 250,
    description: 'Maximum operating junction temperature.',
    examples: { 'switch-diode': 175, 'switch': 150, 'diode': 150 },
    aliases: ['tjmax', 'tj max', 'tvj max', 'tvjop', 'tvj op', 'tj op', 'max junction temperature', 'junction temperature'],
  },
  // Optional second temperature: the figures above hold at "Tj of loss data"; with their 25 °C values they
  // become linear in T_j (shared/thermal/temperature.ts). Without them the figures hold at every T_j (stated).
  {
    key: 'lossDataTemperature', header: 'Tj of loss data', unit: '°C', type: 'number', requiredFor: [], min: 25, max: 250,
    description: 'Junction temperature at which V0, r and the switching energies above are given (the datasheet\'s hot value, e.g. 150 °C).',
    examples: { 'switch-diode': 150, 'switch': 150, 'diode': 150 },
    aliases: ['tj loss data', 'tvj of loss data', 'loss data temperature', 'data temperature'],
  },
  {
    key: 'switchThresholdVoltage25', header: 'Switch V0 at 25 °C', unit: 'V', type: 'number', requiredFor: [], min: 0, max: 10,
    description: 'Switch threshold voltage at 25 °C (optional; with it V0 is linear in T_j).',
    examples: { 'switch-diode': 0.8 },
    aliases: ['vce0 25', 'switch v0 25c'],
  },
  {
    key: 'switchSlopeResistance25', header: 'Switch r at 25 °C', unit: 'Ω', type: 'number', requiredFor: [], min: 0, max: 10,
    description: 'Switch slope resistance at 25 °C (optional).',
    examples: { 'switch-diode': '1.5 mΩ' },
    aliases: ['rce 25', 'switch r 25c'],
  },
  {
    key: 'diodeThresholdVoltage25', header: 'Diode V0 at 25 °C', unit: 'V', type: 'number', requiredFor: [], min: 0, max: 10,
    description: 'Diode threshold voltage at 25 °C (optional).',
    examples: { 'switch-diode': 1.0 },
    aliases: ['vf0 25', 'diode v0 25c'],
  },
  {
    key: 'diodeSlopeResistance25', header: 'Diode r at 25 °C', unit: 'Ω', type: 'number', requiredFor: [], min: 0, max: 10,
    description: 'Diode slope resistance at 25 °C (optional).',
    examples: { 'switch-diode': '1.2 mΩ' },
    aliases: ['rf 25', 'diode r 25c'],
  },
  {
    key: 'turnOnEnergy25', header: 'Eon at 25 °C', unit: 'J', type: 'number', requiredFor: [], min: 0, max: 100,
    description: 'Turn-on energy at 25 °C, same test voltage and current (optional).',
    examples: { 'switch-diode': '30 mJ' },
    aliases: ['eon 25', 'eon 25c'],
  },
  {
    key: 'turnOffEnergy25', header: 'Eoff at 25 °C', unit: 'J', type: 'number', requiredFor: [], min: 0, max: 100,
    description: 'Turn-off energy at 25 °C (optional).',
    examples: { 'switch-diode': '38 mJ' },
    aliases: ['eoff 25', 'eoff 25c'],
  },
  {
    key: 'recoveryEnergy25', header: 'Err at 25 °C', unit: 'J', type: 'number', requiredFor: [], min: 0, max: 100,
    description: 'Diode reverse-recovery energy at 25 °C (optional).',
    examples: { 'switch-diode': '15 mJ' },
    aliases: ['err 25', 'erec 25', 'err 25c'],
  },
  // Optional transient thermal impedance junction-case as a Foster network Z(t) = Σ R_i·(1 − e^(−t/τ_i)),
  // up to four pairs per device (the datasheet's Z_th table). Without it the single R_th above is used.
  ...(['Switch', 'Diode'] as const).flatMap(device => fosterKeys(device).flatMap(([rKey, tauKey], i): CatalogColumn[] => [
    {
      key: rKey, header: `Zth ${device.toLowerCase()} R${i + 1}`, unit: 'K/W', type: 'number', requiredFor: [], min: 0, max: 50,
      description: `Foster network junction-case of one ${device.toLowerCase()}: R of pair ${i + 1} (optional; the R_i sum to R_th,jc).`,
      examples: device === 'Switch' ? { 'switch-diode': [0.006, 0.02, 0.03, 0.009][i]! } : { 'switch-diode': [0.01, 0.035, 0.05, 0.015][i]! },
      aliases: [`zth ${device.toLowerCase()} r${i + 1}`, `r${i + 1} ${device.toLowerCase()}`, `${device === 'Switch' ? 'igbt' : 'fwd'} r${i + 1}`],
    },
    {
      key: tauKey, header: `Zth ${device.toLowerCase()} τ${i + 1}`, unit: 's', type: 'number', requiredFor: [], min: 1e-7, max: 10000,
      description: `Foster network junction-case of one ${device.toLowerCase()}: time constant of pair ${i + 1} (give it with R${i + 1}).`,
      examples: device === 'Switch' ? { 'switch-diode': ['0.8 ms', '12 ms', '60 ms', '0.4 s'][i]! } : { 'switch-diode': ['0.6 ms', '10 ms', '50 ms', '0.3 s'][i]! },
      aliases: [`zth ${device.toLowerCase()} tau${i + 1}`, `zth ${device.toLowerCase()} t${i + 1}`, `tau${i + 1} ${device.toLowerCase()}`, `${device === 'Switch' ? 'igbt' : 'fwd'} tau${i + 1}`],
    },
  ])),
  {
    key: 'capacitance', header: 'Capacitance', unit: 'F', type: 'number', requiredFor: ['capacitor'], min: 1e-12, max: 100,
    description: 'Rated capacitance (e.g. "500 µF").',
    examples: { capacitor: '500 µF' },
    aliases: ['c', 'cap', 'c rated', 'cn', 'c nom', 'capacity', 'capacitance value'],
  },
  {
    key: 'rippleCurrentRating', header: 'Ripple current rating', unit: 'A', type: 'number', requiredFor: ['capacitor'], min: 0.001, max: 10_000,
    description: 'Rated RMS ripple current at the hot-spot temperature the design assumes.',
    examples: { capacitor: 60 },
    aliases: ['irms', 'i rms', 'irms max', 'ripple current', 'ripple', 'i ripple', 'max ripple current', 'rated ripple current'],
  },
  {
    key: 'esr', header: 'ESR', unit: 'Ω', type: 'number', requiredFor: [], min: 0, max: 100,
    description: 'Optional: equivalent series resistance at the switching frequency, for capacitor losses.',
    examples: { capacitor: '1.2 mΩ' },
    aliases: ['esr', 'rs', 'equivalent series resistance', 'r esr'],
  },
  // Optional electrolytic life data: rated life at the rated (hot-spot) temperature; life doubles per 10 K
  // below it (common practice, shared/thermal/lifetime.ts).
  {
    key: 'capacitorRatedLife', header: 'Rated life', unit: 'h', type: 'number', requiredFor: [], min: 1, max: 1_000_000,
    description: 'Optional, electrolytic capacitors: rated (load) life in hours at the rated temperature.',
    examples: { capacitor: 10000 },
    aliases: ['rated life', 'load life', 'useful life', 'lifetime', 'life hours', 'endurance'],
  },
  {
    key: 'capacitorRatedTemperature', header: 'Rated life temperature', unit: '°C', type: 'number', requiredFor: [], min: 40, max: 200,
    description: 'Optional: the temperature the rated life holds at (the category temperature, e.g. 105 °C).',
    examples: { capacitor: 105 },
    aliases: ['rated temperature', 'category temperature', 'life temperature', 'max operating temperature'],
  },
  {
    key: 'capacitorRthHotSpot', header: 'Rth hot spot-ambient', unit: 'K/W', type: 'number', requiredFor: [], min: 0, max: 500,
    description: 'Optional: thermal resistance from the capacitor\'s hot spot to the ambient or cooling, for its hot-spot temperature.',
    examples: { capacitor: 3.5 },
    aliases: ['rth hot spot', 'rth hotspot', 'rth capacitor', 'rth cap', 'thermal resistance hot spot'],
  },
  {
    key: 'priceBreaks', header: 'Unit price breaks', unit: 'per piece', type: 'priceBreaks', requiredFor: [],
    description: 'Unit price per quantity break, "quantity:price" pairs separated by ";", e.g. "1:12.50; 100:10.80; 500:9.90" (quantity from which the price applies). A single number is the price from 1 piece.',
    examples: { 'switch-diode': '1:182.00; 10:169.50; 100:151.00', 'switch': '1:240.00; 20:221.00', 'diode': '1:310.00; 10:289.00', 'capacitor': '1:48.00; 50:43.50; 250:39.90' },
    aliases: ['price', 'unit price', 'prices', 'price breaks', 'pricing', 'cost', 'unit cost', 'price break'],
  },
  {
    key: 'currency', header: 'Currency', unit: '', type: 'enum', requiredFor: [], values: CURRENCIES,
    valueAliases: { '€': 'EUR', 'euro': 'EUR', '$': 'USD', 'us$': 'USD', '£': 'GBP' },
    description: 'ISO 4217 code of the prices; required when prices are given.',
    examples: { 'switch-diode': 'EUR', 'switch': 'EUR', 'diode': 'EUR', 'capacitor': 'EUR' },
    aliases: ['curr', 'ccy', 'currency code'],
  },
  {
    key: 'minimumOrderQuantity', header: 'MOQ', unit: 'pcs', type: 'integer', requiredFor: [], min: 1, max: 10_000_000,
    description: 'Optional: minimum order quantity in pieces.',
    examples: { 'switch-diode': 1, 'switch': 1, 'diode': 1, 'capacitor': 10 },
    aliases: ['moq', 'minimum order quantity', 'min order qty', 'min order', 'minimum order'],
  },
  {
    key: 'stock', header: 'Stock', unit: 'pcs', type: 'integer', requiredFor: [], min: 0, max: 1_000_000_000,
    description: 'Optional: pieces available now.',
    examples: { 'switch-diode': 140, 'switch': 25, 'diode': 60, 'capacitor': 900 },
    aliases: ['qty in stock', 'quantity in stock', 'in stock', 'inventory', 'on hand', 'available', 'availability', 'stock qty'],
  },
  {
    key: 'leadTimeDays', header: 'Lead time', unit: 'd', type: 'number', requiredFor: [], min: 0, max: 2000,
    description: 'Optional: factory lead time in days; "12 weeks" or "12 wk" are converted to days.',
    examples: { 'switch-diode': 56, 'switch': '16 weeks', 'diode': 84, 'capacitor': 28 },
    aliases: ['lead time', 'leadtime', 'lt', 'delivery time', 'lead time days', 'factory lead time'],
  },
  {
    key: 'lifecycle', header: 'Lifecycle', unit: '', type: 'enum', requiredFor: [], values: LIFECYCLES, defaultValue: 'active',
    valueAliases: {
      'production': 'active', 'in production': 'active', 'released': 'active', 'not for new designs': 'nrnd',
      'not recommended for new designs': 'nrnd', 'eol': 'nrnd', 'end of life': 'nrnd', 'last time buy': 'nrnd',
      'discontinued': 'obsolete', 'obs': 'obsolete',
    },
    description: '\'active\', \'nrnd\' (not for new designs) or \'obsolete\'; blank = active.',
    examples: { 'switch-diode': 'active', 'switch': 'nrnd', 'diode': 'active', 'capacitor': 'active' },
    aliases: ['life cycle', 'lifecycle status', 'status', 'part status', 'product status'],
  },
  {
    key: 'supplier', header: 'Supplier', unit: '', type: 'text', requiredFor: [],
    description: 'Optional: preferred distributor or supplier.',
    examples: { 'switch-diode': 'Example Distribution', 'capacitor': 'Example Distribution' },
    aliases: ['distributor', 'vendor', 'source', 'preferred supplier'],
  },
  {
    key: 'datasheetUrl', header: 'Datasheet URL', unit: '', type: 'url', requiredFor: [],
    description: 'Optional: http(s) link to the datasheet.',
    examples: { 'switch-diode': 'https://datasheets.example/EXAMPLE-HB12-450.pdf' },
    aliases: ['datasheet', 'data sheet', 'datasheet link', 'link', 'url', 'pdf', 'documentation'],
  },
  {
    key: 'description', header: 'Description', unit: '', type: 'text', requiredFor: [],
    description: 'Optional free text.',
    examples: { 'switch-diode': '1200 V 450 A IGBT half-bridge module (template example: delete this row)' },
    aliases: ['desc', 'comment', 'comments', 'notes', 'remarks'],
  },
]

export const COLUMN_BY_KEY: Readonly<Record<ColumnKey, CatalogColumn>> = Object.fromEntries(
  CATALOG_COLUMNS.map(column => [column.key, column]),
) as Record<ColumnKey, CatalogColumn>

/** Part numbers of the template's example rows: an upload that still contains them is told to delete them. */
export const TEMPLATE_EXAMPLE_PART_NUMBERS: readonly string[] = PART_KINDS.map(kind => String(COLUMN_BY_KEY.partNumber.examples[kind]))

/** Label for the units row: the unit, or a dash where the column has none. */
export function unitsRowLabel(column: CatalogColumn): string {
  return column.unit === '' ? '—' : column.unit
}

export interface TemplateRows {
  header: string[]
  units: string[]
  /** One example row per part kind, in PART_KINDS order. */
  examples: (ExampleValue | null)[][]
}

/** Rows of the import template: header, units, one example per kind. The server writes them to .xlsx / .csv. */
export function buildTemplateRows(): TemplateRows {
  return {
    header: CATALOG_COLUMNS.map(column => column.header),
    units: CATALOG_COLUMNS.map(unitsRowLabel),
    examples: PART_KINDS.map(kind => CATALOG_COLUMNS.map(column => column.examples[kind] ?? null)),
  }
}

export interface ColumnGuideRow {
  header: string
  unit: string
  type: ColumnType
  /** "all", "none" or the kinds, e.g. "switch-diode, switch". */
  requiredFor: string
  allowedValues: string
  description: string
}

/** One line per column for the template's guide sheet and the docs. */
export function describeColumns(): ColumnGuideRow[] {
  return CATALOG_COLUMNS.map(column => ({
    header: column.header,
    unit: unitsRowLabel(column),
    type: column.type,
    requiredFor: column.requiredFor.length === PART_KINDS.length ? 'all' : column.requiredFor.length === 0 ? 'none' : column.requiredFor.join(', '),
    allowedValues: column.values ? column.values.join(', ') : column.min !== undefined || column.max !== undefined ? `${column.min ?? ''}…${column.max ?? ''} ${column.unit}`.trim() : '',
    description: column.description,
  }))
}

/** True when a row looks like the template's units row (so the reader can skip it). */
export function isUnitsRow(cells: readonly (string | number | null)[]): boolean {
  const labels = new Set(CATALOG_COLUMNS.map(unitsRowLabel).concat(['', '-', 'unit', 'units']))
  const filled = cells.filter(cell => cell !== null && String(cell).trim() !== '')
  if (filled.length < 2) return false
  return filled.every(cell => typeof cell === 'string' && labels.has(cell.trim()))
}
