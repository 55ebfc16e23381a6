// The demo catalogue: about 150 invented parts from invented manufacturers (no real brands or part
// numbers). Generated deterministically from a seeded formula so figures scale sensibly with the
// voltage class and current. Typical datasheet magnitudes per voltage class are "from memory";
// they are plausible, not any real part's values.

import type { CatalogPart, PriceBreak } from '../shared/catalog/types'
import type { PackageConfiguration, PartKind, Technology } from './columns'
import { PACKAGE_CONFIGURATIONS } from './columns'

export const DEMO_MANUFACTURERS = {
  osprey: { name: 'Osprey Ridge Semiconductor', prefix: 'ORS', slug: 'osprey-ridge' },
  tannvik: { name: 'Tannvik Power Devices', prefix: 'TV', slug: 'tannvik' },
  veldhaven: { name: 'Veldhaven Silicon Works', prefix: 'VSW', slug: 'veldhaven' },
  carrow: { name: 'Carrow Carbide', prefix: 'CCX', slug: 'carrow' },
  morrow: { name: 'Morrow & Quill Capacitors', prefix: 'MQF', slug: 'morrow-quill' },
  pellworth: { name: 'Pellworth Electrolytics', prefix: 'PWE', slug: 'pellworth' },
} as const

type Maker = keyof typeof DEMO_MANUFACTURERS

export const DEMO_SUPPLIERS = ['Brightwater Components', 'Northdeck Distribution', 'Direct from manufacturer'] as const

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32). */
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Typical hot datasheet figures per voltage class (from memory, rounded): Si IGBT and fast-recovery diode. */
interface ClassFigures {
  /** V, test voltage of the switching energies */
  vRef: number
  switchV0: number
  /** V, on-state voltage at the nominal current, hot */
  switchVon: number
  diodeV0: number
  diodeVon: number
  /** J per A of nominal current, per event */
  eonPerA: number
  eoffPerA: number
  errPerA: number
  /** K·A/W: R_th,jc ≈ this / I_nom for a switch */
  rthSwitchK: number
  tjMax: number
  /** EUR per switch position per 100 A */
  pricePer100A: number
  /** EUR per diode per 100 A */
  diodePricePer100A: number
  leadDays: number[]
}

const SI_CLASSES: Record<number, ClassFigures> = {
  650: { vRef: 400, switchV0: 0.75, switchVon: 1.55, diodeV0: 0.85, diodeVon: 1.55, eonPerA: 0.028e-3, eoffPerA: 0.030e-3, errPerA: 0.012e-3, rthSwitchK: 25, tjMax: 175, pricePer100A: 5, diodePricePer100A: 3, leadDays: [14, 28, 42] },
  1200: { vRef: 600, switchV0: 0.85, switchVon: 2.0, diodeV0: 0.95, diodeVon: 1.85, eonPerA: 0.09e-3, eoffPerA: 0.12e-3, errPerA: 0.06e-3, rthSwitchK: 27, tjMax: 175, pricePer100A: 14, diodePricePer100A: 8, leadDays: [28, 42, 56, 84] },
  1700: { vRef: 900, switchV0: 1.0, switchVon: 2.35, diodeV0: 1.0, diodeVon: 2.0, eonPerA: 0.25e-3, eoffPerA: 0.30e-3, errPerA: 0.15e-3, rthSwitchK: 30, tjMax: 150, pricePer100A: 25, diodePricePer100A: 12, leadDays: [42, 56, 84, 112] },
  3300: { vRef: 1800, switchV0: 1.3, switchVon: 3.0, diodeV0: 1.2, diodeVon: 2.6, eonPerA: 1.4e-3, eoffPerA: 1.6e-3, errPerA: 0.9e-3, rthSwitchK: 13, tjMax: 150, pricePer100A: 110, diodePricePer100A: 45, leadDays: [84, 112, 140] },
  4500: { vRef: 2800, switchV0: 1.5, switchVon: 3.4, diodeV0: 1.4, diodeVon: 3.0, eonPerA: 3.0e-3, eoffPerA: 3.2e-3, errPerA: 1.8e-3, rthSwitchK: 14, tjMax: 125, pricePer100A: 160, diodePricePer100A: 65, leadDays: [112, 140, 182] },
  6500: { vRef: 3600, switchV0: 1.8, switchVon: 4.0, diodeV0: 1.6, diodeVon: 3.4, eonPerA: 5.0e-3, eoffPerA: 5.5e-3, errPerA: 3.0e-3, rthSwitchK: 15, tjMax: 125, pricePer100A: 230, diodePricePer100A: 90, leadDays: [112, 140, 182] },
}

/** SiC MOSFET figures per class (from memory): resistive channel (V0 = 0), body diode, small energies. */
const SIC_CLASSES: Record<number, { vRef: number, rdsK: number, eonPerA: number, eoffPerA: number, pricePer100A: number }> = {
  650: { vRef: 400, rdsK: 1.1, eonPerA: 0.008e-3, eoffPerA: 0.004e-3, pricePer100A: 30 },
  1200: { vRef: 800, rdsK: 1.6, eonPerA: 0.02e-3, eoffPerA: 0.008e-3, pricePer100A: 45 },
}

interface SemiSpec {
  maker: Maker
  technology: Technology
  kind: Exclude<PartKind, 'capacitor'>
  configuration: PackageConfiguration
  voltageClass: number
  /** A per switch / diode */
  current: number
}

const CONFIG_CODE: Record<PackageConfiguration, string> = {
  'single': 'S', 'half-bridge': 'H', 'chopper': 'C', 'h-bridge': 'F', 'six-pack': 'X', 'npc-leg': 'N', 't-type-leg': 'T', 'anpc-leg': 'A', 'dual-diode': 'DD',
}

function semis(maker: Maker, technology: Technology, kind: SemiSpec['kind'], configuration: PackageConfiguration, voltageClass: number, currents: number[]): SemiSpec[] {
  return currents.map(current => ({ maker, technology, kind, configuration, voltageClass, current }))
}

const SEMI_SPECS: SemiSpec[] = [
  // Osprey Ridge: low- and medium-power Si IGBT discretes and modules, three-level legs.
  ...semis('osprey', 'si-igbt', 'switch-diode', 'single', 650, [30, 50, 75, 100]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'half-bridge', 650, [150, 300, 400, 600]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'six-pack', 650, [50, 100, 150]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'npc-leg', 650, [100, 200, 300, 400]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'anpc-leg', 650, [200]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'single', 1200, [40, 75, 100]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'six-pack', 1200, [25, 35, 50, 75, 100, 150, 200]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'half-bridge', 1200, [100, 150, 200, 300, 450]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'npc-leg', 1200, [150, 300]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 't-type-leg', 1200, [100, 200, 300, 450]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'anpc-leg', 1200, [300, 600]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'h-bridge', 1200, [100, 200]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'chopper', 1200, [150, 300]),
  ...semis('osprey', 'si-igbt', 'switch-diode', 'six-pack', 1700, [75, 100]),
  // Tannvik: high-power and high-voltage Si IGBT modules.
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'half-bridge', 1200, [300, 450, 600, 900]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'half-bridge', 1700, [225, 300, 450, 650, 1000, 1400]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'h-bridge', 1700, [300]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'single', 1700, [1800, 2400, 3600]),
  ...semis('tannvik', 'si-igbt', 'switch', 'single', 1700, [1200]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'single', 3300, [450, 800, 1000, 1200, 1500]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'half-bridge', 3300, [450]),
  ...semis('tannvik', 'si-igbt', 'switch', 'single', 3300, [1000]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'single', 4500, [650, 900, 1200]),
  ...semis('tannvik', 'si-igbt', 'switch-diode', 'single', 6500, [400, 600, 750]),
  // Veldhaven: second-source modules and diodes, including clamp diodes up to 6500 V.
  ...semis('veldhaven', 'si-igbt', 'switch-diode', 'half-bridge', 1200, [200, 450, 600]),
  ...semis('veldhaven', 'si-igbt', 'switch-diode', 'half-bridge', 1700, [450, 1000]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 650, [30, 60, 100, 200]),
  ...semis('veldhaven', 'si-diode', 'diode', 'dual-diode', 650, [100, 200]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 1200, [50, 100, 300]),
  ...semis('veldhaven', 'si-diode', 'diode', 'dual-diode', 1200, [150, 300, 600]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 1700, [600, 1200]),
  ...semis('veldhaven', 'si-diode', 'diode', 'dual-diode', 1700, [400]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 3300, [400, 800, 1200, 1500]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 4500, [800, 1200]),
  ...semis('veldhaven', 'si-diode', 'diode', 'single', 6500, [400, 600, 750]),
  // Carrow Carbide: SiC MOSFETs (body diode) and SiC Schottky diodes.
  ...semis('carrow', 'sic-mosfet', 'switch-diode', 'single', 650, [40, 60, 100]),
  ...semis('carrow', 'sic-mosfet', 'switch-diode', 'half-bridge', 650, [200, 400]),
  ...semis('carrow', 'sic-mosfet', 'switch-diode', 'single', 1200, [30, 60, 100]),
  ...semis('carrow', 'sic-mosfet', 'switch-diode', 'half-bridge', 1200, [200, 300, 400, 600]),
  ...semis('carrow', 'sic-mosfet', 'switch-diode', 'six-pack', 1200, [50, 100]),
  ...semis('carrow', 'sic-diode', 'diode', 'single', 650, [20, 40]),
  ...semis('carrow', 'sic-diode', 'diode', 'single', 1200, [20, 50]),
]

/** DC-link capacitors: [V, µF, A ripple, mΩ ESR, EUR]. Film (polypropylene) and aluminium electrolytic. */
const FILM: [number, number, number, number, number][] = [
  [500, 200, 30, 2.5, 18], [500, 500, 50, 1.5, 32], [700, 1000, 80, 0.9, 55], [800, 150, 28, 2.8, 22],
  [900, 500, 60, 1.2, 45], [1100, 300, 55, 1.3, 48], [1100, 800, 90, 0.8, 95], [1200, 2000, 150, 0.35, 230],
  [1300, 400, 70, 1.0, 78], [1500, 200, 45, 1.6, 62], [1800, 1500, 120, 0.45, 310], [2000, 1000, 100, 0.6, 280],
  [2800, 600, 110, 0.6, 340], [3300, 1000, 140, 0.5, 520], [4000, 500, 100, 0.7, 480], [1500, 1200, 130, 0.5, 190],
  [1000, 600, 75, 1.0, 58],
]
const ELECTROLYTIC: [number, number, number, number, number][] = [
  [400, 2200, 12, 45, 14], [400, 4700, 18, 28, 24], [400, 10000, 26, 15, 42], [450, 2200, 11, 50, 16],
  [450, 3300, 14, 38, 20], [450, 4700, 17, 30, 27], [450, 6800, 21, 22, 38], [450, 10000, 24, 18, 55],
  [500, 1500, 9, 60, 17], [500, 3300, 13, 40, 29], [500, 4700, 16, 32, 38], [550, 2200, 11, 55, 30],
  [400, 3300, 15, 35, 19],
]

function roundTo(value: number, significant: number): number {
  return Number(value.toPrecision(significant))
}

function priceBreaksFor(unitPrice: number, highVoltage: boolean, cheap: boolean): PriceBreak[] {
  const p = (f: number) => Math.round(unitPrice * f * 100) / 100
  if (highVoltage) return [{ minQuantity: 1, unitPrice: p(1) }, { minQuantity: 5, unitPrice: p(0.96) }, { minQuantity: 20, unitPrice: p(0.92) }]
  if (cheap) return [{ minQuantity: 1, unitPrice: p(1) }, { minQuantity: 50, unitPrice: p(0.9) }, { minQuantity: 250, unitPrice: p(0.82) }]
  return [{ minQuantity: 1, unitPrice: p(1) }, { minQuantity: 10, unitPrice: p(0.93) }, { minQuantity: 100, unitPrice: p(0.86) }]
}

function lifecycleFor(rand: number): CatalogPart['lifecycle'] {
  if (rand < 0.07) return 'obsolete'
  if (rand < 0.17) return 'nrnd'
  return 'active'
}

function describeConfiguration(configuration: PackageConfiguration): string {
  return PACKAGE_CONFIGURATIONS[configuration].label.toLowerCase()
}

function semiconductorPart(spec: SemiSpec, random: () => number): CatalogPart {
  const maker = DEMO_MANUFACTURERS[spec.maker]
  const cfg = PACKAGE_CONFIGURATIONS[spec.configuration]
  const si = SI_CLASSES[spec.voltageClass]!
  const jitter = (spread = 0.08) => 1 + spread * (2 * random() - 1)
  const I = spec.current
  const isModule = spec.configuration !== 'single' || I > 150
  const vCode = String(Math.round(spec.voltageClass / 10)).padStart(3, '0')
  const code = spec.kind === 'diode' ? (spec.configuration === 'dual-diode' ? 'DD' : 'D') : CONFIG_CODE[spec.configuration]
  const partNumber = `${maker.prefix}-${code}${vCode}${spec.technology.startsWith('sic') ? 'K' : ''}-${String(I).padStart(4, '0')}${spec.kind === 'switch' ? 'N' : ''}`
  const rthScale = isModule ? 1 : 1.15
  const part: CatalogPart = {
    partNumber,
    manufacturer: maker.name,
    kind: spec.kind,
    packageConfiguration: spec.configuration,
    technology: spec.technology,
    voltageRating: spec.voltageClass,
    currentRating: I,
    priceBreaks: [],
    lifecycle: lifecycleFor(random()),
  }
  const sic = spec.technology.startsWith('sic') ? SIC_CLASSES[spec.voltageClass] : undefined
  const hasSwitch = spec.kind !== 'diode'
  const hasDiode = spec.kind !== 'switch'
  if (hasSwitch) {
    if (sic) {
      part.switchThresholdVoltage = 0
      part.switchSlopeResistance = roundTo((sic.rdsK / I) * jitter(), 3)
      part.turnOnEnergy = roundTo(sic.eonPerA * I * jitter(), 3)
      part.turnOffEnergy = roundTo(sic.eoffPerA * I * jitter(), 3)
      part.energyReferenceVoltage = sic.vRef
    }
    else {
      part.switchThresholdVoltage = roundTo(si.switchV0 * jitter(0.05), 3)
      part.switchSlopeResistance = roundTo(((si.switchVon - si.switchV0) / I) * jitter(), 3)
      part.turnOnEnergy = roundTo(si.eonPerA * I * jitter(), 3)
      part.turnOffEnergy = roundTo(si.eoffPerA * I * jitter(), 3)
      part.energyReferenceVoltage = si.vRef
    }
    part.rthJunctionCaseSwitch = roundTo((si.rthSwitchK / I) * rthScale * jitter(), 3)
  }
  if (hasDiode) {
    if (spec.technology === 'sic-diode') {
      part.diodeThresholdVoltage = roundTo(0.9 * jitter(0.05), 3)
      part.diodeSlopeResistance = roundTo((0.8 / I) * jitter(), 3)
      part.recoveryEnergy = 0
      part.energyReferenceVoltage = SIC_CLASSES[spec.voltageClass]!.vRef
    }
    else if (sic) {
      // Body diode: high threshold, almost no reverse recovery.
      part.diodeThresholdVoltage = roundTo(2.6 * jitter(0.05), 3)
      part.diodeSlopeResistance = roundTo((1.2 / I) * jitter(), 3)
      part.recoveryEnergy = roundTo(0.003e-3 * I * jitter(), 3)
    }
    else {
      part.diodeThresholdVoltage = roundTo(si.diodeV0 * jitter(0.05), 3)
      part.diodeSlopeResistance = roundTo(((si.diodeVon - si.diodeV0) / I) * jitter(), 3)
      part.recoveryEnergy = roundTo(si.errPerA * I * jitter(), 3)
      part.energyReferenceVoltage ??= si.vRef
    }
    part.rthJunctionCaseDiode = roundTo(((si.rthSwitchK * (spec.kind === 'diode' ? 1.2 : 1.7)) / I) * rthScale * jitter(), 3)
  }
  part.energyReferenceCurrent = I
  // Foster networks junction-case: R_th,jc split over four pairs in a typical module shape (invented; no random
  // draw, so the rest of the demo catalogue stays as it was).
  if (part.rthJunctionCaseSwitch !== undefined) fosterFor(part, 'Switch', part.rthJunctionCaseSwitch)
  if (part.rthJunctionCaseDiode !== undefined) fosterFor(part, 'Diode', part.rthJunctionCaseDiode)
  const rthJc = part.rthJunctionCaseSwitch ?? part.rthJunctionCaseDiode!
  part.rthCaseHeatsink = roundTo(rthJc * (isModule ? 0.45 : 0.8), 3)
  part.junctionTemperatureMax = sic || spec.maker === 'osprey' ? 175 : si.tjMax

  const switches = cfg.switches
  const perSwitch = ((sic?.pricePer100A ?? si.pricePer100A) * I) / 100
  const perDiode = ((spec.technology === 'sic-diode' ? 20 : si.diodePricePer100A) * I) / 100
  const overhead = isModule ? 12 : 0.8
  const devices = spec.kind === 'diode' ? cfg.diodes * perDiode : switches * perSwitch * (spec.configuration === 'six-pack' ? 0.9 : 1) + cfg.clampDiodes * perDiode * (spec.configuration === 'npc-leg' ? 1 : 0)
  const unitPrice = Math.max(1.2, (devices + overhead) * jitter(0.1))
  const highVoltage = spec.voltageClass >= 3300
  part.priceBreaks = priceBreaksFor(unitPrice, highVoltage, unitPrice < 20)
  part.currency = 'EUR'
  part.minimumOrderQuantity = unitPrice < 5 ? 10 : 1
  const stockScale = unitPrice < 20 ? 2000 : unitPrice < 200 ? 300 : unitPrice < 1000 ? 60 : 12
  part.stock = random() < 0.12 ? 0 : Math.round(stockScale * random())
  part.leadTimeDays = si.leadDays[Math.floor(random() * si.leadDays.length)]!
  part.supplier = DEMO_SUPPLIERS[Math.floor(random() * DEMO_SUPPLIERS.length)]!
  part.datasheetUrl = `https://datasheets.example/${maker.slug}/${partNumber}.pdf`
  const what = spec.kind === 'diode'
    ? `${spec.technology === 'sic-diode' ? 'SiC Schottky' : 'fast-recovery'} diode${spec.configuration === 'dual-diode' ? ', dual' : ''}`
    : `${sic ? 'SiC MOSFET' : 'Si IGBT'}${spec.kind === 'switch' ? ' without diode' : ''}, ${describeConfiguration(spec.configuration)}${isModule ? ' module' : ' discrete'}`
  part.description = `${spec.voltageClass} V ${I} A ${what}`
  return part
}

const FOSTER_SHARES = [0.1, 0.3, 0.45, 0.15] as const
const FOSTER_TAUS = [0.0008, 0.01, 0.06, 0.4] as const

function fosterFor(part: CatalogPart, device: 'Switch' | 'Diode', rth: number): void {
  const out = part as unknown as Record<string, number>
  FOSTER_SHARES.forEach((share, i) => {
    out[`zth${device}R${i + 1}`] = roundTo(rth * share, 3)
    out[`zth${device}Tau${i + 1}`] = FOSTER_TAUS[i]!
  })
}

function capacitorPart(maker: 'morrow' | 'pellworth', row: [number, number, number, number, number], random: () => number): CatalogPart {
  const [voltage, microfarad, ripple, esrMilliohm, price] = row
  const m = DEMO_MANUFACTURERS[maker]
  const film = maker === 'morrow'
  const partNumber = `${m.prefix}-${String(voltage).padStart(4, '0')}-${microfarad}${film ? 'P' : 'E'}`
  const unitPrice = price * (1 + 0.06 * (2 * random() - 1))
  return {
    partNumber,
    manufacturer: m.name,
    kind: 'capacitor',
    packageConfiguration: 'single',
    technology: film ? 'film' : 'electrolytic',
    voltageRating: voltage,
    capacitance: roundTo(microfarad * 1e-6, 4),
    rippleCurrentRating: ripple,
    esr: roundTo(esrMilliohm * 1e-3, 3),
    // Electrolytic life data (invented, typical of a 105 °C screw-terminal type).
    ...(film ? {} : { capacitorRatedLife: 10000, capacitorRatedTemperature: 105, capacitorRthHotSpot: roundTo(2.2 * Math.sqrt(1000 / microfarad), 2) }),
    priceBreaks: priceBreaksFor(unitPrice, false, unitPrice < 60),
    currency: 'EUR',
    minimumOrderQuantity: film ? 1 : 10,
    stock: random() < 0.1 ? 0 : Math.round((film ? 400 : 3000) * random()),
    leadTimeDays: [21, 28, 42, 56][Math.floor(random() * 4)]!,
    lifecycle: lifecycleFor(random()),
    supplier: DEMO_SUPPLIERS[Math.floor(random() * 2)]!,
    datasheetUrl: `https://datasheets.example/${m.slug}/${partNumber}.pdf`,
    description: `${voltage} V ${microfarad} µF ${film ? 'polypropylene film' : 'aluminium electrolytic'} DC-link capacitor, ${ripple} A ripple`,
  }
}

/** Builds the demo catalogue (same result on every call). */
export function buildDemoParts(seed = 20_240_611): CatalogPart[] {
  const random = seeded(seed)
  return [
    ...SEMI_SPECS.map(spec => semiconductorPart(spec, random)),
    ...FILM.map(row => capacitorPart('morrow', row, random)),
    ...ELECTROLYTIC.map(row => capacitorPart('pellworth', row, random)),
  ]
}

export const DEMO_PARTS: readonly CatalogPart[] = buildDemoParts()
