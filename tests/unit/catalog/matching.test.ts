// Part matching: losses against the two-level closed form, sizing, module counting, prices and the
// nothing-fits explanation.
import { describe, expect, it } from 'vitest'
import type { DeviceEnvelope } from '../../../shared/engine/types'
import { matchPosition, packagesPerConverter, positionDutyFromDevice, priceAtQuantity, slotsPerPackage, whyNothingFits, type MatchPolicy, type PositionDuty } from '../../../shared/catalog/matching'
import type { CatalogPart } from '../../../shared/catalog/types'

const policy: MatchPolicy = { heatsinkTemperatureC: 80, junctionMarginC: 15, buildQuantity: 1 }

/** A 1200 V 450 A IGBT half-bridge with round datasheet-like figures (invented). */
function igbt(overrides: Partial<CatalogPart> = {}): CatalogPart {
  return {
    partNumber: 'T-HB12-450', manufacturer: 'Test Devices', kind: 'switch-diode', packageConfiguration: 'half-bridge',
    voltageRating: 1200, currentRating: 450,
    switchThresholdVoltage: 0.85, switchSlopeResistance: 2.1e-3, diodeThresholdVoltage: 0.9, diodeSlopeResistance: 1.6e-3,
    turnOnEnergy: 0.045, turnOffEnergy: 0.055, recoveryEnergy: 0.030, energyReferenceVoltage: 600, energyReferenceCurrent: 450,
    rthJunctionCaseSwitch: 0.065, rthJunctionCaseDiode: 0.11, rthCaseHeatsink: 0.03, junctionTemperatureMax: 175,
    priceBreaks: [{ minQuantity: 1, unitPrice: 182 }, { minQuantity: 10, unitPrice: 169.5 }, { minQuantity: 100, unitPrice: 151 }],
    currency: 'EUR', stock: 500, leadTimeDays: 56, lifecycle: 'active',
    ...overrides,
  }
}

// Two-level leg, sine PWM: Î = 500 A, M = 0.9, cos φ = 0.85, V_dc = 600 V, f_sw = 4 kHz.
// Device currents from the closed forms of F. Bierhoff, F. W. Fuchs, IEEE PESC 2004:
//   I_T,avg = Î(1/(2π) + M·cosφ/8), I_T,rms = Î·√(1/8 + M·cosφ/(3π)), diode with the minus sign.
const peak = 500
const m = 0.9
const cosPhi = 0.85
const twoLevel = (kind: 'switch' | 'diode'): PositionDuty => {
  const sign = kind === 'switch' ? 1 : -1
  return {
    positionName: kind === 'switch' ? 'S' : 'D', kind,
    requiredVoltageRating: 600 / 0.65, requiredCurrentRating: peak,
    currentAvg: peak * (1 / (2 * Math.PI) + sign * m * cosPhi / 8),
    currentRms: peak * Math.sqrt(1 / 8 + sign * m * cosPhi / (3 * Math.PI)),
    currentPeak: peak, blockingVoltage: 600, commutatedVoltage: 600, switchingHz: 4000,
    positionsPerPhase: 2, phases: 3, converters: 1, topology: 'two-level',
  }
}

describe('losses and junction temperature: two-level example', () => {
  it('switch: conduction and switching losses match the hand calculation', () => {
    const [c] = matchPosition(twoLevel('switch'), [igbt({ currentRating: 600 })], policy).candidates
    expect(c).toBeDefined()
    // Worked by hand: I_avg = 500·(0.1591549 + 0.095625) = 127.390 A; I_rms² = 500²·0.2061690 = 51 542.25 A²
    // P_cond = 0.85·127.390 + 0.0021·51 542.25 = 108.282 + 108.239 = 216.520 W
    expect(c!.losses!.conduction).toBeCloseTo(216.52, 1)
    // Bierhoff & Fuchs PESC 2004 closed form: P_sw = f_sw·(Eon + Eoff)·(Î/π)/I_ref·V_dc/V_ref
    //   = 4000·0.100·(500/π)/450·(600/600) = 141.471 W (worked by hand; I_ref = 450 A)
    expect(c!.losses!.switching).toBeCloseTo(141.47, 1)
    expect(c!.losses!.total).toBeCloseTo(357.99, 1)
    // 6 switches per converter: 2147.95 W
    expect(c!.losses!.perConverter).toBeCloseTo(6 * 357.991, 0)
    // T_j = 80 + 357.99·(0.065 + 0.03) = 114.01 °C (worked by hand)
    expect(c!.junctionTemperatureC).toBeCloseTo(114.0, 1)
    expect(c!.junctionLimitC).toBe(160)
    expect(c!.thermalOk).toBe(true)
  })

  it('diode: conduction and reverse-recovery losses match the hand calculation', () => {
    const [c] = matchPosition(twoLevel('diode'), [igbt({ currentRating: 600 })], policy).candidates
    // I_D,avg = 500·(0.1591549 − 0.095625) = 31.765 A; I_D,rms² = 500²·0.0438310 = 10 957.75 A²
    // P_cond = 0.9·31.765 + 0.0016·10 957.75 = 28.589 + 17.532 = 46.121 W (worked by hand)
    expect(c!.losses!.conduction).toBeCloseTo(46.12, 1)
    // P_rr = f_sw·Err·(Î/π)/I_ref·V_dc/V_ref = 4000·0.030·159.155/450 = 42.441 W (Bierhoff & Fuchs PESC 2004)
    expect(c!.losses!.switching).toBeCloseTo(42.44, 1)
    // T_j uses the diode's R_th,jc: 80 + 88.56·(0.11 + 0.03) = 92.40 °C
    expect(c!.junctionTemperatureC).toBeCloseTo(92.4, 1)
    expect(c!.warnings.join(' ')).toMatch(/anti-parallel diode inside T-HB12-450/)
  })

  it('scales switching energy with the commutated voltage and the switched current', () => {
    const duty = twoLevel('switch')
    const base = matchPosition(duty, [igbt({ currentRating: 600 })], policy).candidates[0]!.losses!.switching
    const halfVoltage = matchPosition({ ...duty, commutatedVoltage: 300 }, [igbt({ currentRating: 600 })], policy).candidates[0]!.losses!.switching
    expect(halfVoltage).toBeCloseTo(base / 2, 2)
    // An explicit switching-averaged current replaces the two-level default Î/π.
    const given = matchPosition({ ...duty, switchedCurrentAvg: peak / (2 * Math.PI) }, [igbt({ currentRating: 600 })], policy).candidates[0]!.losses!.switching
    expect(given).toBeCloseTo(base / 2, 2)
    const noSwitching = matchPosition({ ...duty, switchingHz: 0 }, [igbt({ currentRating: 600 })], policy).candidates[0]!.losses!.switching
    expect(noSwitching).toBe(0)
  })

  it('warns when T_j exceeds T_j,max minus the margin and sorts such parts last', () => {
    const hot = igbt({ partNumber: 'HOT', rthJunctionCaseSwitch: 0.3, currentRating: 600, priceBreaks: [{ minQuantity: 1, unitPrice: 1 }] })
    const cool = igbt({ partNumber: 'COOL', currentRating: 600 })
    const { candidates } = matchPosition(twoLevel('switch'), [hot, cool], policy)
    expect(candidates.map(c => c.part.partNumber)).toEqual(['COOL', 'HOT'])
    // 80 + 357.99·(0.3 + 0.03) = 198.1 °C > 160 °C
    expect(candidates[1]!.thermalOk).toBe(false)
    expect(candidates[1]!.warnings.join(' ')).toMatch(/T_j 198\.1 °C exceeds 160 °C \(T_j,max 175 °C − 15 °C margin\)/)
  })
})

describe('ratings, series and parallel', () => {
  it('gives voltage and current margins', () => {
    const [c] = matchPosition(twoLevel('switch'), [igbt({ currentRating: 600 })], policy).candidates
    // 1200 V / 923.08 V − 1 = 30.0 %; 600 A / 500 A − 1 = 20 %
    expect(c!.voltageMarginPct).toBe(30)
    expect(c!.currentMarginPct).toBe(20)
    expect(c!.seriesCount).toBe(1)
    expect(c!.parallelCount).toBe(1)
  })

  it('parallels parts for current with a sharing allowance, up to the limit', () => {
    const duty = { ...twoLevel('switch'), requiredCurrentRating: 1000 }
    // ceil(1000 / (450·0.9)) = 3 in parallel
    const [c] = matchPosition(duty, [igbt()], policy).candidates
    expect(c!.parallelCount).toBe(3)
    expect(c!.packagesPerConverter).toBe(9)
    // Each device carries a third: P_cond = 0.85·(127.39/3) + 0.0021·(227.03/3)² = 36.094 + 12.026 = 48.12 W (worked by hand)
    expect(c!.losses!.conduction).toBeCloseTo(48.12, 1)
    const limited = matchPosition(duty, [igbt()], { ...policy, maxParallel: { switch: 2 } })
    expect(limited.candidates).toEqual([])
    expect(limited.rejected.current).toBe(1)
  })

  it('stacks clamp diodes in series for voltage', () => {
    const diode: CatalogPart = { ...igbt(), partNumber: 'D12', kind: 'diode', packageConfiguration: 'single', voltageRating: 1200, currentRating: 300 }
    const duty: PositionDuty = { ...twoLevel('diode'), kind: 'clamp-diode', positionName: 'Dc2', requiredVoltageRating: 2400, requiredCurrentRating: 250, topology: 'diode-clamped', levels: 5 }
    const [c] = matchPosition(duty, [diode], policy).candidates
    expect(c!.seriesCount).toBe(2)
    expect(c!.voltageMarginPct).toBe(0)
    expect(c!.warnings.join(' ')).toMatch(/2 in series: voltage sharing/)
    expect(matchPosition({ ...duty, requiredVoltageRating: 2500 }, [diode], { ...policy, maxSeries: { 'clamp-diode': 2 } }).rejected.voltage).toBe(1)
  })

  it('does not offer a single IGBT as a clamp diode, but offers an NPC leg module', () => {
    const duty: PositionDuty = { ...twoLevel('diode'), kind: 'clamp-diode', positionName: 'Dc', requiredVoltageRating: 900, requiredCurrentRating: 300, topology: 'diode-clamped', levels: 3, positionsPerPhase: 2 }
    const single = igbt({ partNumber: 'SINGLE', packageConfiguration: 'single' })
    const npc = igbt({ partNumber: 'NPC', packageConfiguration: 'npc-leg' })
    const { candidates } = matchPosition(duty, [single, npc], policy)
    expect(candidates.map(c => c.part.partNumber)).toEqual(['NPC'])
    expect(candidates[0]!.packagesPerConverter).toBe(3)
  })

  it('sizes capacitors by voltage (series), ripple and capacitance (parallel), with ESR losses', () => {
    const cap: CatalogPart = { partNumber: 'C1', manufacturer: 'Test Caps', kind: 'capacitor', packageConfiguration: 'single', voltageRating: 900, capacitance: 500e-6, rippleCurrentRating: 40, esr: 1e-3, priceBreaks: [{ minQuantity: 1, unitPrice: 40 }], currency: 'EUR', lifecycle: 'active' }
    const duty: PositionDuty = {
      positionName: 'C', kind: 'capacitor', requiredVoltageRating: 1100, requiredRippleRating: 100, capacitanceRequired: 1e-3,
      currentAvg: 0, currentRms: 90, currentPeak: 127, blockingVoltage: 1100, commutatedVoltage: 0, switchingHz: 0,
      positionsPerPhase: 1, phases: 1, converters: 1,
    }
    const [c] = matchPosition(duty, [cap], policy).candidates
    // 2 in series (900 V each); parallel = max(ceil(100/40) = 3, ceil(1 mF·2/0.5 mF) = 4) = 4 strings → 8 capacitors
    expect(c!.seriesCount).toBe(2)
    expect(c!.parallelCount).toBe(4)
    expect(c!.packagesPerConverter).toBe(8)
    expect(c!.capacitanceMarginPct).toBe(0)
    // 4·40 A / 100 A − 1 = 60 %
    expect(c!.currentMarginPct).toBe(60)
    // ESR loss: 1 mΩ·(90/4)² = 0.50625 W per capacitor, 4.05 W for 8
    expect(c!.losses!.total).toBeCloseTo(0.506, 3)
    expect(c!.losses!.perConverter).toBeCloseTo(4.05, 2)
  })

  it('names bad duty fields instead of matching', () => {
    const result = matchPosition({ ...twoLevel('switch'), requiredVoltageRating: -5, phases: 0 }, [igbt()], policy)
    expect(result.candidates).toEqual([])
    expect(result.dutyProblems).toEqual([
      'S: requiredVoltageRating must be a number > 0, got -5',
      'S: phases must be a whole number ≥ 1, got 0',
    ])
  })
})

describe('modules: packages per converter', () => {
  it('counts halves, six-packs and singles for a two-level converter', () => {
    const duty = twoLevel('switch') // 2 switch positions per phase, 3 phases
    const count = (cfg: CatalogPart['packageConfiguration']) => matchPosition(duty, [igbt({ packageConfiguration: cfg, currentRating: 600 })], policy).candidates[0]?.packagesPerConverter
    expect(count('half-bridge')).toBe(3)
    expect(count('six-pack')).toBe(1)
    expect(count('single')).toBe(6)
    expect(packagesPerConverter({ positionsPerPhase: 2, phases: 3 }, 2, 6, 3)).toBe(2)
  })

  it('counts packages per design for back-to-back converters and prices the build quantity', () => {
    const duty = { ...twoLevel('switch'), converters: 2 }
    const [c] = matchPosition(duty, [igbt({ currentRating: 600 })], { ...policy, buildQuantity: 10 })
      .candidates
    expect(c!.packagesPerDesign).toBe(6)
    // 6 × 10 = 60 pieces: the 10-piece break applies
    expect(c!.orderQuantity).toBe(60)
    expect(c!.unitPrice).toBe(169.5)
    expect(c!.priceBreakQuantity).toBe(10)
    expect(c!.costPerDesign).toBe(1017)
  })

  it('tells when a module position serves only part of a package', () => {
    const duty = { ...twoLevel('switch'), positionName: 'S1', positionsPerPhase: 1 }
    const [c] = matchPosition(duty, [igbt({ currentRating: 600 })], policy).candidates
    expect(c!.packagesPerConverter).toBe(3)
    expect(c!.warnings.join(' ')).toMatch(/3 of 6 switch positions in these packages are not used by S1/)
  })

  it('offers leg modules only for their topology', () => {
    const sixPack = igbt({ partNumber: '6P', packageConfiguration: 'six-pack', currentRating: 600 })
    const npc = igbt({ partNumber: 'NPC', packageConfiguration: 'npc-leg', currentRating: 600 })
    const twoLevelResult = matchPosition(twoLevel('switch'), [sixPack, npc], policy)
    expect(twoLevelResult.candidates.map(c => c.part.partNumber)).toEqual(['6P'])
    expect(twoLevelResult.rejected.wrongTopology).toBe(1)
    const npcDuty = { ...twoLevel('switch'), topology: 'diode-clamped' as const, levels: 3 }
    expect(matchPosition(npcDuty, [sixPack, npc], policy).candidates.map(c => c.part.partNumber)).toEqual(['NPC'])
    expect(matchPosition({ ...npcDuty, levels: 5 }, [sixPack, npc], policy).candidates).toEqual([])
  })

  it('knows the slots of each configuration', () => {
    expect(slotsPerPackage({ kind: 'switch-diode', packageConfiguration: 'npc-leg' }, 'switch')).toBe(4)
    expect(slotsPerPackage({ kind: 'switch-diode', packageConfiguration: 'npc-leg' }, 'clamp-diode')).toBe(2)
    expect(slotsPerPackage({ kind: 'diode', packageConfiguration: 'dual-diode' }, 'clamp-diode')).toBe(2)
    expect(slotsPerPackage({ kind: 'switch', packageConfiguration: 'single' }, 'diode')).toBe(0)
    expect(slotsPerPackage({ kind: 'diode', packageConfiguration: 'six-pack' }, 'diode')).toBe(0)
  })
})

describe('commercial data', () => {
  it('priceAtQuantity is exported here too', () => {
    expect(priceAtQuantity([{ minQuantity: 1, unitPrice: 12.5 }, { minQuantity: 100, unitPrice: 10.8 }], 100)?.unitPrice).toBe(10.8)
  })

  it('leaves obsolete parts out unless asked, warns on NRND and short stock', () => {
    const parts = [
      igbt({ partNumber: 'OLD', lifecycle: 'obsolete', currentRating: 600 }),
      igbt({ partNumber: 'NRND', lifecycle: 'nrnd', currentRating: 600, stock: 2 }),
    ]
    const result = matchPosition(twoLevel('switch'), parts, policy)
    expect(result.candidates.map(c => c.part.partNumber)).toEqual(['NRND'])
    expect(result.rejected.obsolete).toBe(1)
    const w = result.candidates[0]!.warnings.join(' | ')
    expect(w).toMatch(/not for new designs \(NRND\)/)
    expect(w).toMatch(/stock 2 < 3 needed; lead time 56 d/)
    expect(result.candidates[0]!.stockOk).toBe(false)
    const all = matchPosition(twoLevel('switch'), parts, { ...policy, includeObsolete: true })
    expect(all.candidates.map(c => c.part.partNumber)).toEqual(['NRND', 'OLD'])
  })

  it('warns that a switch without diode needs a separate diode', () => {
    const [c] = matchPosition(twoLevel('switch'), [igbt({ kind: 'switch', packageConfiguration: 'single', currentRating: 600 })], policy).candidates
    expect(c!.warnings).toContain('switch without anti-parallel diode: the diode position needs a part of its own')
    expect(c!.sharedPackage).toBe(false)
    expect(matchPosition(twoLevel('diode'), [igbt({ kind: 'switch', packageConfiguration: 'single' })], policy).candidates).toEqual([])
  })

  it('sorts by cost per design among equals', () => {
    const parts = [igbt({ partNumber: 'DEAR', currentRating: 600 }), igbt({ partNumber: 'CHEAP', currentRating: 600, priceBreaks: [{ minQuantity: 1, unitPrice: 99 }] })]
    expect(matchPosition(twoLevel('switch'), parts, policy).candidates.map(c => c.part.partNumber)).toEqual(['CHEAP', 'DEAR'])
  })
})

describe('whyNothingFits', () => {
  const catalogue = [
    igbt({ partNumber: 'A-1200-450' }),
    igbt({ partNumber: 'B-1700-300', voltageRating: 1700, currentRating: 300 }),
    igbt({ partNumber: 'C-1700-800-OLD', voltageRating: 1700, currentRating: 800, lifecycle: 'obsolete' }),
    { ...igbt(), partNumber: 'D-DIODE', kind: 'diode' as const, packageConfiguration: 'single' as const },
  ]
  const duty: PositionDuty = { ...twoLevel('switch'), requiredVoltageRating: 1700, requiredCurrentRating: 400 }

  it('names the requirement, the closest parts and what they lack', () => {
    const message = whyNothingFits(duty, catalogue, { ...policy, maxParallel: { switch: 1 } })
    expect(message).toBe(
      'S: no switch rated ≥ 1700 V and ≥ 400 A (allowing up to 1 in series and 1 in parallel). '
      + 'Closest: Test Devices B-1700-300 (1700 V, 300 A): current 300 A < 400 A; '
      + 'Test Devices A-1200-450 (1200 V, 450 A): voltage 1200 V < 1700 V. '
      + '1 obsolete part would fit.',
    )
  })

  it('is null when something fits and says when a kind is missing altogether', () => {
    expect(whyNothingFits({ ...duty, requiredCurrentRating: 250 }, catalogue, policy)).toBeNull()
    const cap: PositionDuty = { ...duty, kind: 'capacitor', positionName: 'C1', requiredRippleRating: 50, capacitanceRequired: 1e-3 }
    expect(whyNothingFits(cap, catalogue, policy)).toBe('C1: the catalogue has no part that can serve as a capacitor (kinds \'capacitor\').')
  })

  it('explains a capacitor bank that cannot reach the capacitance', () => {
    const cap: CatalogPart = { partNumber: 'C-SMALL', manufacturer: 'Test Caps', kind: 'capacitor', packageConfiguration: 'single', voltageRating: 1100, capacitance: 100e-6, rippleCurrentRating: 30, priceBreaks: [], lifecycle: 'active' }
    const duty2: PositionDuty = { ...duty, kind: 'capacitor', positionName: 'C1', requiredVoltageRating: 1000, requiredRippleRating: 50, capacitanceRequired: 0.01 }
    expect(whyNothingFits(duty2, [cap], { ...policy, maxParallel: { capacitor: 20 } })).toBe(
      'C1: no capacitor rated ≥ 1000 V and ≥ 50 A ripple and ≥ 10 mF (allowing up to 4 in series and 20 in parallel). '
      + 'Closest: Test Caps C-SMALL (1100 V, 100 µF, 30 A): capacitance 100 µF × 20 / 1 in series < 10 mF.',
    )
  })
})

describe('duty from the engine envelope', () => {
  it('copies the worst values and counts', () => {
    const device: DeviceEnvelope = {
      name: 'S1', kind: 'switch', countPerPhase: 2, blockingVoltage: 800, blockingVoltageWithOvershoot: 900,
      currentAvg: 120, currentRms: 220, currentPeak: 560, commutatedVoltage: 800,
      provenance: { method: 'test', source: 'test' },
      worstPoint: { blockingVoltage: 'a', currentAvg: 'a', currentRms: 'a', currentPeak: 'a' },
      requiredVoltageRating: 1231, positionVoltageRating: 1231, voltageRatingSetBy: 'utilisation', requiredCurrentRating: 560,
    }
    expect(positionDutyFromDevice(device, { switchingHz: 4000, converters: 2, topology: 'two-level' })).toEqual({
      positionName: 'S1', kind: 'switch', requiredVoltageRating: 1231, requiredCurrentRating: 560,
      currentAvg: 120, currentRms: 220, currentPeak: 560, blockingVoltage: 800, commutatedVoltage: 800,
      switchingHz: 4000, positionsPerPhase: 2, phases: 3, converters: 2, topology: 'two-level',
    })
  })

  it('a clamp-diode stack is matched on the whole stack\'s requirement, the same derating rule as the engine', () => {
    // Engine: 3300 V steady / 0.65 = 5077 V for the stack, 3 units of 1692 V each.
    const stack: DeviceEnvelope = {
      name: 'Dc1+', kind: 'clamp-diode', countPerPhase: 1, blockingVoltage: 3300, blockingVoltageWithOvershoot: 3300, seriesCount: 3,
      currentAvg: 20, currentRms: 60, currentPeak: 400, commutatedVoltage: 0,
      provenance: { method: 'test', source: 'test' },
      worstPoint: { blockingVoltage: 'a', currentAvg: 'a', currentRms: 'a', currentPeak: 'a' },
      requiredVoltageRating: 3300 / 0.65 / 3, positionVoltageRating: 3300 / 0.65, voltageRatingSetBy: 'utilisation', requiredCurrentRating: 400,
    }
    const duty = positionDutyFromDevice(stack, { switchingHz: 0, topology: 'diode-clamped', levels: 5 })
    expect(duty.requiredVoltageRating).toBeCloseTo(3300 / 0.65, 9)
    // 1700 V unit diodes: 3 in series (5100 V ≥ 5077 V), as the engine counted; 2 would be 3400 V.
    const unit: CatalogPart = { ...igbt(), partNumber: 'D17', kind: 'diode', packageConfiguration: 'single', voltageRating: 1700, currentRating: 600 }
    const fit = matchPosition(duty, [unit], policy).candidates[0]!
    expect(fit.seriesCount).toBe(3)
  })
})

describe('parts without optional figures', () => {
  it('stay candidates and say per candidate which figure is missing', () => {
    const noDiodeData = igbt({ partNumber: 'T-NODIODE', currentRating: 600, diodeThresholdVoltage: undefined, diodeSlopeResistance: undefined, rthJunctionCaseDiode: undefined, rthCaseHeatsink: undefined })
    const diode = matchPosition(twoLevel('diode'), [noDiodeData], policy).candidates[0]!
    expect(diode.losses).toBeNull()
    expect(diode.missingData).toEqual(['Diode threshold voltage V0', 'Diode slope resistance r', 'Rth junction-case diode'])
    expect(diode.warnings.join('\n')).toMatch(/missing Diode threshold voltage V0, Diode slope resistance r, Rth junction-case diode: losses and junction temperature not computed/)
    // The switch position of the same part has its figures: losses computed, T_j without R_th(c-h) said so.
    const sw = matchPosition(twoLevel('switch'), [noDiodeData], policy).candidates[0]!
    expect(sw.losses).not.toBeNull()
    expect(sw.missingData).toBeUndefined()
    expect(sw.warnings.join('\n')).toMatch(/no R_th case-heatsink/)
  })
})

describe('ranking on cheap keys (a large catalogue builds only the candidates shown)', () => {
  // Varied parts: some too hot for the T_j limit, some unapproved or NRND, prices and losses spread,
  // ties in price, some without loss data. The bounded ranking must give the first `limit` of the full order,
  // and the full order must be sortCandidates' order of the built candidates.
  const parts: CatalogPart[] = []
  for (let i = 0; i < 300; i++) {
    parts.push({
      ...igbt({
        partNumber: `R-${i}`,
        currentRating: 500 + (i % 7) * 50,
        switchSlopeResistance: i % 11 === 0 ? undefined : 1.5e-3 + (i % 5) * 0.4e-3,
        rthJunctionCaseSwitch: i % 13 === 0 ? 0.4 : 0.065,
        lifecycle: i % 17 === 0 ? 'nrnd' : 'active',
        priceBreaks: [{ minQuantity: 1, unitPrice: 100 + (i % 9) * 10 }],
      }),
      ...(i % 19 === 0 ? { approved: false } : {}),
    } as CatalogPart)
  }

  it('the first 25 of a bounded ranking are the first 25 of the full order, which is sortCandidates\' order', async () => {
    const { sortCandidates } = await import('../../../shared/catalog/matching')
    const full = matchPosition(twoLevel('switch'), parts, policy)
    const bounded = matchPosition(twoLevel('switch'), parts, policy, { limit: 25 })
    expect(full.candidates.length).toBe(300)
    expect(bounded.candidates.length).toBe(25)
    expect(bounded.fitting).toBe(300)
    expect(bounded.candidates.map(c => c.part.partNumber)).toEqual(full.candidates.slice(0, 25).map(c => c.part.partNumber))
    // sorting the built candidates by their own figures changes nothing: the cheap keys agree with them
    expect(sortCandidates([...full.candidates]).map(c => c.part.partNumber)).toEqual(full.candidates.map(c => c.part.partNumber))
    // the hot parts (T_j over the limit) come last
    expect(full.candidates.at(-1)!.thermalOk).toBe(false)
  })

  it('counts the fitting parts that `only` leaves out', () => {
    const approvedOnly = matchPosition(twoLevel('switch'), parts, policy, { limit: 5, only: p => (p as CatalogPart & { approved?: boolean }).approved !== false })
    expect(approvedOnly.leftOut).toBe(parts.filter((_, i) => i % 19 === 0).length)
    expect(approvedOnly.fitting + approvedOnly.leftOut).toBe(300)
    expect(approvedOnly.candidates.every(c => (c.part as CatalogPart & { approved?: boolean }).approved !== false)).toBe(true)
  })
})
