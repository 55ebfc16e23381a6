// The column index matching scans (shared/catalog/part-index.ts): parts sorted by voltage rating, the
// voltage prefix only counted, the cost bound read from the columns, parts read only when they could place.
// Checked against an independent brute-force computation: every part's counts found by trying every count
// (no index, no bound), the fitting ones rated at those counts and put in sortCandidates' order (stable, so
// ties keep catalogue order), then cut to the limit. The shared-memory copy the worker threads read must agree too.
import { describe, expect, it } from 'vitest'
import { PACKAGE_CONFIGURATIONS } from '../../../catalog/columns'
import { approvalRank, indexParts, matchPosition, openSharedIndex, rateAssignment, sharePartIndex, slotsPerPackage, sortCandidates, type Candidate, type MatchPolicy, type MatchResult, type PositionDuty } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'

const policy: MatchPolicy = { heatsinkTemperatureC: 80, junctionMarginC: 15, buildQuantity: 3 }

/** A small deterministic generator (the same catalogue on every run). */
function random(seed: number) {
  let s = seed >>> 0
  return () => { s = (s * 1664525 + 1013904223) >>> 0; return s / 2 ** 32 }
}

/** 1 200 invented parts of every kind, voltage classes unsorted, some figures missing, ties in price. */
function catalogue(): (CatalogPart & { partVersionId: number, approved: boolean })[] {
  const r = random(13)
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(r() * xs.length)]!
  const parts: (CatalogPart & { partVersionId: number, approved: boolean })[] = []
  for (let i = 0; i < 1200; i++) {
    const kind = pick(['switch-diode', 'switch-diode', 'switch', 'diode', 'capacitor'] as const)
    const voltageRating = pick([600, 650, 1200, 1700, 3300, 4500, 900, 1100, 1600])
    const lifecycle = pick(['active', 'active', 'active', 'nrnd', 'obsolete'] as const)
    const price = 40 + Math.floor(r() * 12) * 10
    const priceBreaks = r() < 0.05 ? [] : r() < 0.5 ? [{ minQuantity: 1, unitPrice: price }] : [{ minQuantity: 1, unitPrice: price }, { minQuantity: 20, unitPrice: price * 0.8 }, { minQuantity: 200, unitPrice: price * 0.7 }]
    const common = { partNumber: `P-${i}`, manufacturer: 'Index Test Devices', voltageRating, priceBreaks, currency: 'EUR', lifecycle, partVersionId: 5000 + i, approved: r() > 0.15 }
    if (kind === 'capacitor') {
      parts.push({ ...common, kind, packageConfiguration: 'single', capacitance: pick([200e-6, 500e-6, 1e-3]), rippleCurrentRating: r() < 0.03 ? undefined : 20 + Math.floor(r() * 6) * 10, esr: r() < 0.2 ? undefined : 1e-3 } as CatalogPart & { partVersionId: number, approved: boolean })
      continue
    }
    const packageConfiguration = kind === 'diode' ? pick(['single', 'dual-diode'] as const) : pick(['single', 'half-bridge', 'six-pack', 'npc-leg', 'h-bridge'] as const)
    parts.push({
      ...common, kind, packageConfiguration: kind === 'switch' && packageConfiguration === 'npc-leg' ? 'single' : packageConfiguration,
      currentRating: r() < 0.03 ? undefined : 100 + Math.floor(r() * 8) * 50,
      switchThresholdVoltage: 0.8, switchSlopeResistance: r() < 0.1 ? undefined : 1.5e-3 + Math.floor(r() * 4) * 0.5e-3,
      diodeThresholdVoltage: 0.9, diodeSlopeResistance: 1.6e-3,
      turnOnEnergy: 0.04, turnOffEnergy: 0.05, recoveryEnergy: 0.03, energyReferenceVoltage: 600, energyReferenceCurrent: 450,
      rthJunctionCaseSwitch: r() < 0.1 ? 0.5 : 0.07, rthJunctionCaseDiode: 0.11, rthCaseHeatsink: 0.03, junctionTemperatureMax: 175,
    } as CatalogPart & { partVersionId: number, approved: boolean })
  }
  return parts
}

const device = (positionName: string, kind: 'switch' | 'diode' | 'clamp-diode', requiredVoltageRating: number, extra: Partial<PositionDuty> = {}): PositionDuty => ({
  positionName, kind, requiredVoltageRating, requiredCurrentRating: 420, currentAvg: 90, currentRms: 160, currentPeak: 420,
  blockingVoltage: requiredVoltageRating * 0.6, commutatedVoltage: requiredVoltageRating * 0.6, switchingHz: 3000,
  positionsPerPhase: 2, phases: 3, converters: 1, topology: 'diode-clamped', levels: 3, ...extra,
})
const duties: PositionDuty[] = [
  device('S1', 'switch', 1150),
  device('S2', 'switch', 1150, { topology: 'two-level', levels: 2 }),
  device('D1', 'diode', 1500),
  // clamp stacks: up to 8 in series, so low-voltage parts are stacked and the voltage prefix is short
  device('Dc', 'clamp-diode', 5200),
  // capacitors: up to 4 in series, so 600 V parts (4 × 600 V < 2 500 V) are refused for voltage
  { positionName: 'C', kind: 'capacitor', requiredVoltageRating: 2500, requiredRippleRating: 120, capacitanceRequired: 2e-3, currentAvg: 0, currentRms: 110, currentPeak: 155, blockingVoltage: 1500, commutatedVoltage: 0, switchingHz: 0, positionsPerPhase: 2, phases: 1, converters: 2, topology: 'diode-clamped', levels: 3 },
]

/** Smallest count n ≥ 1 (up to `max`) with ok(n); 0 when none. */
function smallest(max: number, ok: (n: number) => boolean): number {
  for (let n = 1; n <= max; n++) if (ok(n)) return n
  return 0
}

/**
 * The straightforward method, written out here on its own: each part's refusal or series × parallel counts by
 * trying every count up to the policy's defaults (switch 1 × 4, diode 1 × 4, clamp diode 8 × 4, capacitor 4 × 50;
 * paralleled semiconductors at 90 % of their rating), the fitting parts rated at those counts (rateAssignment's
 * candidate), sorted by sortCandidates and cut to the limit.
 */
function bruteForce(duty: PositionDuty, parts: readonly CatalogPart[], keep: (p: CatalogPart) => boolean) {
  const maxSeries = { 'switch': 1, 'diode': 1, 'clamp-diode': 8, 'capacitor': 4 }[duty.kind]
  const maxParallel = duty.kind === 'capacitor' ? 50 : 4
  const rejected = { wrongKind: 0, wrongTopology: 0, voltage: 0, current: 0, capacitance: 0, obsolete: 0, missingData: 0 }
  const atLeast = (have: number, need: number) => have >= need * (1 - 1e-9)
  const fitting: Candidate[] = []
  let leftOut = 0
  for (const p of parts) {
    if (slotsPerPackage(p, duty.kind) === 0) { rejected.wrongKind++; continue }
    const cfg = PACKAGE_CONFIGURATIONS[p.packageConfiguration]
    if (cfg.topologies && duty.topology && (!cfg.topologies.includes(duty.topology) || (p.packageConfiguration === 'npc-leg' && duty.levels !== 3))) { rejected.wrongTopology++; continue }
    const isCapacitor = duty.kind === 'capacitor'
    const current = isCapacitor ? p.rippleCurrentRating : p.currentRating
    if (!(p.voltageRating > 0) || !(current !== undefined && current > 0) || (isCapacitor && !(p.capacitance! > 0))) { rejected.missingData++; continue }
    const series = smallest(maxSeries, n => atLeast(n * p.voltageRating, duty.requiredVoltageRating))
    if (series === 0) { rejected.voltage++; continue }
    let parallel: number
    if (isCapacitor) {
      const byRipple = smallest(1000, n => atLeast(n * current, duty.requiredRippleRating!))
      const byCapacitance = smallest(1000, n => atLeast((n * p.capacitance!) / series, duty.capacitanceRequired!))
      parallel = Math.max(byRipple, byCapacitance)
      if (parallel > maxParallel) { rejected[byCapacitance >= byRipple ? 'capacitance' : 'current']++; continue }
    }
    else {
      parallel = smallest(maxParallel, n => atLeast(n * current * (n > 1 ? 0.9 : 1), duty.requiredCurrentRating!))
      if (parallel === 0) { rejected.current++; continue }
    }
    if (p.lifecycle === 'obsolete') { rejected.obsolete++; continue }
    if (!keep(p)) { leftOut++; continue }
    fitting.push(rateAssignment(p, duty, policy, series, parallel).rated!)
  }
  return { order: sortCandidates(fitting).map(c => c.part.partNumber), fitting: fitting.length, leftOut, rejected }
}

const names = (m: MatchResult) => m.candidates.map(c => c.part.partNumber)

describe('the column index ranks as the straightforward method does', () => {
  const parts = catalogue()
  const index = indexParts(parts, p => (p as typeof parts[number]).partVersionId)
  const shared = openSharedIndex(sharePartIndex(parts, p => (p as typeof parts[number]).partVersionId))

  for (const duty of duties) {
    it(`${duty.positionName} (${duty.kind}): the first 15 and every count`, () => {
      const reference = bruteForce(duty, parts, () => true)
      // the catalogue is meant to exercise the checks: some parts fit, more than the limit, and each refusal occurs
      expect(reference.fitting).toBeGreaterThan(15)
      expect(reference.rejected.voltage).toBeGreaterThan(0)
      const bounded = matchPosition(duty, index, policy, { limit: 15 })
      expect(names(bounded)).toEqual(reference.order.slice(0, 15))
      expect(bounded.fitting).toBe(reference.fitting)
      expect(bounded.rejected).toEqual(reference.rejected)
      // without a limit: every fitting part, in the same order
      expect(names(matchPosition(duty, index, policy))).toEqual(reference.order)
      // the shared-memory copy (parts parsed from their text when read) gives the same answer
      const fromShared = matchPosition(duty, shared, policy, { limit: 15 })
      expect(names(fromShared)).toEqual(reference.order.slice(0, 15))
      expect(fromShared.candidates).toEqual(bounded.candidates)
    })
  }

  it('approvedActiveOnly and exceptId leave out what the equivalent `only` leaves out', () => {
    const duty = duties[0]!
    const host = parts.find(p => matchPosition(duty, [p], policy).candidates.length > 0 && approvalRank(p) === 0)!
    const keep = (p: CatalogPart) => approvalRank(p as typeof parts[number]) === 0 && p !== host
    const reference = bruteForce(duty, parts, keep)
    const viaOptions = matchPosition(duty, index, policy, { limit: 15, approvedActiveOnly: true, exceptId: host.partVersionId })
    const viaOnly = matchPosition(duty, index, policy, { limit: 15, only: keep })
    expect(names(viaOptions)).toEqual(reference.order.slice(0, 15))
    expect(names(viaOnly)).toEqual(reference.order.slice(0, 15))
    expect(viaOptions.leftOut).toBe(reference.leftOut)
    expect(viaOptions.fitting).toBe(reference.fitting)
    expect(names(viaOptions)).not.toContain(host.partNumber)
  })
})

describe('scans kept on an index between matchings', () => {
  const parts = catalogue()
  const idOf = (p: CatalogPart) => (p as typeof parts[number]).partVersionId
  const base = duties[0]!
  const host = parts.find(p => matchPosition(base, [p], policy).candidates.length > 0)!
  // each differs from the first in one figure the scan reads (or only in what it does not read: name, currents for losses)
  const cases: { name: string, duty: PositionDuty, policy?: MatchPolicy, options?: { approvedActiveOnly?: boolean, exceptId?: number } }[] = [
    { name: 'the first duty', duty: base },
    { name: 'another name and loss currents, same ratings', duty: { ...base, positionName: 'S9', currentAvg: 140, currentRms: 230 } },
    { name: 'required voltage', duty: { ...base, requiredVoltageRating: 1650 } },
    { name: 'required current', duty: { ...base, requiredCurrentRating: 900 } },
    { name: 'current rating from the peak', duty: { ...base, requiredCurrentRating: undefined, currentPeak: 700 } },
    { name: 'topology', duty: { ...base, topology: 'two-level', levels: 2 } },
    { name: 'levels', duty: { ...base, levels: 5 } },
    { name: 'no topology', duty: { ...base, topology: undefined, levels: undefined } },
    { name: 'positions per phase', duty: { ...base, positionsPerPhase: 4 } },
    { name: 'phases', duty: { ...base, phases: 1 } },
    { name: 'converters', duty: { ...base, converters: 2 } },
    { name: 'policy: parallel parts allowed', duty: base, policy: { ...policy, maxParallel: { switch: 1 } } },
    { name: 'policy: current sharing', duty: base, policy: { ...policy, parallelCurrentSharing: 0.7 } },
    { name: 'policy: obsolete parts offered', duty: base, policy: { ...policy, includeObsolete: true } },
    { name: 'approved active only', duty: base, options: { approvedActiveOnly: true } },
    { name: 'one part left out', duty: base, options: { exceptId: idOf(host) } },
    { name: 'capacitor', duty: duties[4]! },
    { name: 'capacitor, more capacitance', duty: { ...duties[4]!, capacitanceRequired: 6e-3 } },
    { name: 'capacitor, more ripple', duty: { ...duties[4]!, requiredRippleRating: 400 } },
  ]

  it('every matching on a used index answers as on a fresh one, in either order', () => {
    const used = indexParts(parts, idOf)
    const sharedUsed = openSharedIndex(sharePartIndex(parts, idOf))
    const answers = new Set<string>()
    for (const pass of [cases, [...cases].reverse(), cases]) {
      for (const c of pass) {
        const p = c.policy ?? policy
        const options = { limit: 15, ...c.options }
        const fresh = matchPosition(c.duty, indexParts(parts, idOf), p, options)
        expect(matchPosition(c.duty, used, p, options), c.name).toEqual(fresh)
        expect(matchPosition(c.duty, sharedUsed, p, options), c.name).toEqual(fresh)
        // without a limit too (every fitting part)
        expect(names(matchPosition(c.duty, used, p, c.options))).toEqual(names(matchPosition(c.duty, indexParts(parts, idOf), p, c.options)))
        answers.add(JSON.stringify([fresh.fitting, fresh.leftOut, fresh.rejected, names(fresh)]))
      }
    }
    // the variations change what the scan finds (else this test could not tell a kept scan from a fresh one)
    expect(answers.size).toBeGreaterThanOrEqual(cases.length - 2)
  })

  it('equal ratings share the scan, the candidates still name their own position', () => {
    const used = indexParts(parts, idOf)
    const a = matchPosition(base, used, policy, { limit: 15 })
    const renamed = { ...base, positionName: 'S9', positionsPerPhase: base.positionsPerPhase }
    const b = matchPosition(renamed, used, policy, { limit: 15 })
    expect(names(b)).toEqual(names(a))
    const slotWarnings = (m: MatchResult) => m.candidates.flatMap(c => c.warnings).filter(w => w.includes(' positions in these packages are not used by '))
    expect(slotWarnings(a).length).toBeGreaterThan(0)
    expect(slotWarnings(a).every(w => w.includes('used by S1'))).toBe(true)
    expect(slotWarnings(b).every(w => w.includes('used by S9'))).toBe(true)
  })
})
