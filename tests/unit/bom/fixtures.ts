// Invented BOM inputs for the tests and the benchmark (invented manufacturers and part numbers).

import { buildBomSnapshot, type BomBuildInput, type BomSnapshotHeader, type CapacitorFill, type PositionFill } from '../../../shared/bom/build'
import type { BomSnapshot } from '../../../shared/bom/types'

export const SAFETY_NOTE = 'Design aid only. High-voltage equipment must be designed, built and tested by qualified people to the applicable standards and local codes (e.g. IEC 61800-5-1 for adjustable-speed drives). Vendor datasheets govern part ratings.'

export function positionFill(overrides: Partial<PositionFill> = {}): PositionFill {
  return {
    side: 'machine',
    position: 'S1',
    kind: 'switch',
    partNumber: 'ORS-IG12-150',
    manufacturer: 'Osprey Ridge Semiconductor',
    description: 'IGBT with diode 1200 V 150 A, single',
    positionsPerPhase: 1,
    phases: 3,
    perPackage: 1,
    seriesCount: 1,
    parallelCount: 1,
    unitPriceBreaks: [{ quantity: 1, price: 85 }, { quantity: 50, price: 79.5 }, { quantity: 100, price: 74 }],
    currency: 'EUR',
    moq: 1,
    leadTimeDays: 42,
    stock: 500,
    lifecycle: 'active',
    supplier: 'Brightwater Components',
    partVersionId: 101,
    ...overrides,
  }
}

export function capacitorFill(overrides: Partial<CapacitorFill> = {}): CapacitorFill {
  return {
    side: 'dc-link',
    position: 'C1',
    kind: 'capacitor',
    partNumber: 'MQF-F1100-500',
    manufacturer: 'Morrow & Quill Capacitors',
    description: 'Film capacitor 1100 V 500 µF',
    count: 8,
    unitPriceBreaks: [{ quantity: 1, price: 64 }, { quantity: 100, price: 58 }],
    currency: 'EUR',
    moq: 10,
    leadTimeDays: 28,
    stock: 1200,
    lifecycle: 'active',
    supplier: 'Northdeck Distribution',
    partVersionId: 301,
    ...overrides,
  }
}

export function snapshotHeader(overrides: Partial<BomSnapshotHeader> = {}): BomSnapshotHeader {
  return {
    company: 'Brennholm Drives AB',
    designId: 7,
    designName: 'Harbour crane hoist 400 kW',
    designRevision: 3,
    topologySummary: 'Three-level NPC, back-to-back, DC link 1100 V (1200 V worst case)',
    revision: 2,
    releasedAt: '2026-03-14T09:30:00.000Z',
    releasedBy: 'Emil Sandberg',
    designSummary: [
      ['DC link nominal', 1100, 'V'],
      ['DC link worst case', 1200, 'V'],
      ['Rated output', 400, 'kW'],
      ['Switching frequency', 2500, 'Hz'],
    ],
    safetyNote: SAFETY_NOTE,
    ...overrides,
  }
}

/** A small NPC back-to-back BOM with modules, a clamp-diode stack, capacitors and manual lines. */
export function demoInput(): BomBuildInput {
  return {
    buildQuantity: 10,
    sparesPercent: 5,
    currency: 'EUR',
    positions: [
      positionFill({ position: 'S1' }),
      positionFill({ position: 'S4' }),
      positionFill({ position: 'S2', partNumber: 'ORS-IG12-100', description: 'IGBT with diode 1200 V 100 A, single', unitPriceBreaks: [{ quantity: 1, price: 61.2 }, { quantity: 100, price: 55.4 }], partVersionId: 102 }),
      positionFill({ position: 'S3', partNumber: 'ORS-IG12-100', description: 'IGBT with diode 1200 V 100 A, single', unitPriceBreaks: [{ quantity: 1, price: 61.2 }, { quantity: 100, price: 55.4 }], partVersionId: 102 }),
      positionFill({ position: 'Dc1+', kind: 'clamp-diode', partNumber: 'TV-FD06-100', manufacturer: 'Tannvik Power Devices', description: 'Fast diode 600 V 100 A', seriesCount: 2, unitPriceBreaks: [{ quantity: 1, price: 9.8 }, { quantity: 100, price: 8.6 }], moq: 25, partVersionId: 201 }),
      positionFill({ position: 'Dc1-', kind: 'clamp-diode', partNumber: 'TV-FD06-100', manufacturer: 'Tannvik Power Devices', description: 'Fast diode 600 V 100 A', seriesCount: 2, unitPriceBreaks: [{ quantity: 1, price: 9.8 }, { quantity: 100, price: 8.6 }], moq: 25, partVersionId: 201 }),
      positionFill({ side: 'grid', position: 'S1', partNumber: 'VSW-HB12-300', manufacturer: 'Veldhaven Silicon Works', description: 'IGBT half-bridge module 1200 V 300 A', perPackage: 2, unitPriceBreaks: [{ quantity: 1, price: 310 }, { quantity: 25, price: 295 }, { quantity: 50, price: 280 }], moq: 40, partVersionId: 401 }),
      positionFill({ side: 'grid', position: 'S2', partNumber: 'VSW-HB12-300', manufacturer: 'Veldhaven Silicon Works', description: 'IGBT half-bridge module 1200 V 300 A', perPackage: 2, unitPriceBreaks: [{ quantity: 1, price: 310 }, { quantity: 25, price: 295 }, { quantity: 50, price: 280 }], moq: 40, partVersionId: 401 }),
    ],
    capacitors: [capacitorFill()],
    manualLines: [
      { description: 'Heatsink, forced air, 400 mm', partNumber: 'HS-400-FA', manufacturer: 'Brennholm in-house', quantityPerUnit: 1, unitPrice: 120 },
      { description: 'Laminated DC busbar', quantityPerUnit: 2 },
    ],
  }
}

export function demoSnapshot(overrides: Partial<BomSnapshotHeader> = {}): BomSnapshot {
  return buildBomSnapshot(snapshotHeader(overrides), demoInput())
}

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32), so large BOMs are the same every run. */
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

const MAKERS = ['Osprey Ridge Semiconductor', 'Tannvik Power Devices', 'Veldhaven Silicon Works', 'Carrow Carbide'] as const

/** `lines` distinct parts on one position each (a big BOM for paging and speed), plus two manual lines. */
export function largeInput(lines: number, seed = 1): BomBuildInput {
  const random = seeded(seed)
  const positions: PositionFill[] = []
  for (let i = 0; i < lines - 2; i++) {
    const perPackage = [1, 1, 1, 2, 6][Math.floor(random() * 5)]!
    const base = Math.round((5 + random() * 300) * 100) / 100
    positions.push(positionFill({
      side: i % 2 === 0 ? 'machine' : 'grid',
      position: `S${i + 1}`,
      partNumber: `BX-${String(1000 + i)}-${perPackage}`,
      manufacturer: MAKERS[i % MAKERS.length]!,
      description: `Test device ${i + 1}, ${perPackage === 1 ? 'single' : perPackage === 2 ? 'half-bridge' : 'six-pack'}`,
      perPackage,
      positionsPerPhase: 1 + Math.floor(random() * 4),
      unitPriceBreaks: [{ quantity: 1, price: base }, { quantity: 50, price: Math.round(base * 93) / 100 }, { quantity: 250, price: Math.round(base * 86) / 100 }],
      moq: [1, 10, 25, 50][Math.floor(random() * 4)]!,
      stock: Math.floor(random() * 2000),
      partVersionId: 1000 + i,
    }))
  }
  return {
    buildQuantity: 12,
    sparesPercent: 3,
    currency: 'EUR',
    positions,
    manualLines: [
      { description: 'Heatsink, forced air, 400 mm', quantityPerUnit: 1, unitPrice: 120 },
      { description: 'Gate driver board', quantityPerUnit: 6, unitPrice: 38.5 },
    ],
  }
}

export function largeSnapshot(lines: number): BomSnapshot {
  return buildBomSnapshot(snapshotHeader({ designName: 'Large test BOM' }), largeInput(lines))
}
