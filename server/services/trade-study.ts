// Trade study: one duty through several topologies and level counts, side by side.
import { evaluateDesign, EngineInputError, topologyById, type ConverterInput, type DesignInput, type TopologyId } from '#shared/engine'
import { matchPosition, type PartIndex } from '#shared/catalog/matching'
import { defaultCandidates, type TradeStudyInput } from '#shared/schemas/trade-study'
import type { TradeStudyMissing, TradeStudyRow } from '#shared/types/trade-study'
import { headlinePoint, totalsPerPoint } from '#shared/thermal/losses'
import { caseMatesByCoverage, designThermal, type ThermalPosition } from '#shared/thermal/design'
import { partKey } from '#shared/catalog/part-key'
import { runInPool } from '../workers/pool'
import { currentCatalog } from './catalog'
import { designPositions, legPositions, matchPolicy } from './parts'

export { defaultCandidates }

/** The converter a candidate needs for the duty: a cascaded H-bridge gets cells of V_dc/(N−1), so that its devices block what the diode-clamped leg's do. */
export function candidateConverter(duty: TradeStudyInput, topology: TopologyId, levels?: number): ConverterInput {
  const t = topologyById[topology]
  const modulation = t.modulations.includes('space-vector') ? 'space-vector' : 'sine'
  const n = levels ?? t.defaultLevels ?? 3
  const perCell = (v: number | undefined) => (v === undefined ? undefined : v / (n - 1))
  const maxLine = Math.max(...duty.operatingPoints.map(p => p.lineVoltageRms))
  return {
    topology,
    levels: t.allowedLevels === 'ignored' ? undefined : n,
    dcVoltage: t.supply === 'cell' ? perCell(duty.dcVoltage) : t.supply === 'dc-link' ? duty.dcVoltage : undefined,
    dcVoltageMax: t.supply === 'cell' ? perCell(duty.dcVoltageMax) : t.supply === 'dc-link' ? duty.dcVoltageMax : undefined,
    // Matrix: the grid voltage; by default one that keeps the transfer ratio at 0.8 of the 0.866 limit's headroom.
    inputLineVoltageRms: t.supply === 'ac-input' ? (duty.inputLineVoltageRms ?? Math.ceil(maxLine / 0.8)) : undefined,
    switchingHz: duty.switchingHz,
    modulation,
    overshootVoltage: duty.overshootVoltage,
    operatingPoints: duty.operatingPoints,
  }
}

/** The duty through every candidate against the given parts (on a worker thread: runTradeStudy). */
export async function runTradeStudy(duty: TradeStudyInput): Promise<{ rows: TradeStudyRow[] }> {
  const catalog = await currentCatalog()
  return runInPool({ kind: 'trade-study', generation: catalog.generation, index: catalog.shared, duty })
}

/** One row per candidate topology (pure: runs on a worker thread with the thread's catalogue index). */
export function tradeStudyRows(duty: TradeStudyInput, parts: PartIndex): { rows: TradeStudyRow[] } {
  const rows = (duty.candidates ?? defaultCandidates).map(({ topology, levels }) => {
    const converter = candidateConverter(duty, topology, levels)
    const input: DesignInput = { machineSide: converter, derating: duty.derating }
    const label = `${topologyById[topology].label}${topologyById[topology].allowedLevels === 'ignored' ? '' : `, N = ${converter.levels}`}`
    let result
    try {
      result = evaluateDesign(input)
    }
    catch (err) {
      if (err instanceof EngineInputError) return { topology, levels: converter.levels ?? null, label, input, error: `${err.field}: ${err.message}` }
      throw err
    }
    const conv = result.converters[0]!
    const first = conv.points[0]!
    const switches = conv.envelope.devices.filter(d => d.kind === 'switch')
    const policy = matchPolicy(input, result, { buildQuantity: 1, sparesPercent: 0, manualLines: [] })
    let cost: number | null = 0
    const unmatched: string[] = []
    // Losses summed per operating point (each position's figures at that point), the row shows the worst point.
    const lossesByPosition: { positionName: string, perPoint: { pointName: string, lossW: number }[] }[] = []
    let fixedLossW = 0
    const lossMissing: string[] = []
    // Why a figure is missing, per position: no part fits, or the best part lacks catalogue fields.
    const missing: TradeStudyMissing[] = []
    const thermalPositions: ThermalPosition[] = []
    for (const { side, duty: d } of designPositions(input, result)) {
      const best = matchPosition(d, parts, policy, { limit: 1 }).candidates[0]
      if (!best) {
        unmatched.push(d.positionName)
        missing.push({ position: d.positionName, partNumber: null, fields: [], figure: 'losses', reason: `${d.positionName}: no catalogue part fits the duty` })
        continue
      }
      if (d.kind !== 'capacitor') thermalPositions.push({ side, duty: d, choices: [{ part: best.part, seriesCount: best.seriesCount, parallelCount: best.parallelCount }], reference: 0, referenceAssigned: false })
      if (best.losses === null) {
        const fields = best.missingData ?? []
        lossMissing.push(`${d.positionName}: ${best.part.partNumber} lacks ${fields.length ? fields.join(', ') : 'loss data'}`)
        missing.push({ position: d.positionName, partNumber: best.part.partNumber, fields, figure: 'losses', reason: lossMissing.at(-1)! })
      }
      else if (best.missingData?.length) {
        missing.push({ position: d.positionName, partNumber: best.part.partNumber, fields: best.missingData, figure: 'junction temperature', reason: `${d.positionName}: ${best.part.partNumber} lacks ${best.missingData.join(', ')} (no T_j)` })
      }
      else if (best.losses.perPoint) lossesByPosition.push({ positionName: d.positionName, perPoint: best.losses.perPoint.map(l => ({ pointName: l.pointName, lossW: l.perConverter })) })
      else fixedLossW += best.losses.perConverter
      cost = cost === null || best.costPerDesign === null ? null : cost + best.costPerDesign
    }
    // Positions whose best part is one module (the same part, filling them by its coverage) share its case.
    const bestAt = new Map(thermalPositions.map(t => [t.duty.positionName, { key: partKey(t.choices[0]!.part.manufacturer, t.choices[0]!.part.partNumber), part: t.choices[0]!.part }]))
    const mates = caseMatesByCoverage(legPositions(input, 'machine'), name => bestAt.get(name) ?? null)
    for (const t of thermalPositions) {
      const own = mates.get(t.duty.positionName)
      if (own) t.choices[0]!.caseMates = own
    }
    const perPoint = totalsPerPoint(duty.operatingPoints.map((op, i) => ({ ...op, pointName: conv.points[i]!.pointName })), lossesByPosition)
    for (const pt of perPoint) pt.lossW += fixedLossW
    const head = headlinePoint(perPoint)
    const lossW = lossMissing.length || !head ? null : head.lossW
    // T_j over the fundamental period with the best part of every position (shared/thermal/design.ts): the hottest peak of the row.
    const thermal = designThermal(input, result.converters, thermalPositions, policy.junctionMarginC, policy.heatsinkTemperatureC).results
    let peak: { c: number, meanC: number, limitC: number, position: string, pointName: string } | null = null
    for (const [i, pos] of thermalPositions.entries()) {
      const t = thermal[i]?.[0]
      if (!t) {
        if (!missing.some(m => m.position === pos.duty.positionName)) missing.push({ position: pos.duty.positionName, partNumber: pos.choices[0]!.part.partNumber, fields: ['T_j,max'], figure: 'junction temperature', reason: `${pos.duty.positionName}: ${pos.choices[0]!.part.partNumber} lacks T_j,max or R_th (no T_j)` })
        continue
      }
      if (!peak || t.peakC > peak.c) peak = { c: t.peakC, meanC: t.meanC, limitC: t.limitC, position: pos.duty.positionName, pointName: t.worstPointName }
    }
    const hottest = peak
    return {
      topology,
      levels: converter.levels ?? null,
      label,
      input,
      modulationIndex: Math.max(...conv.points.map(p => p.modulationIndex)),
      switchesTotal: first.counts.switchesTotal,
      diodesTotal: first.counts.diodesTotal,
      clampDiodesTotal: first.counts.clampDiodesTotal,
      devicesTotal: first.counts.switchesTotal + first.counts.diodesTotal + first.counts.clampDiodesTotal,
      capacitors: conv.envelope.capacitors.reduce((s, c) => s + c.count, 0),
      voltageClasses: switches.map(s => ({ position: s.name, required: s.requiredVoltageRating, voltageClass: s.voltageClass ?? null })),
      highestVoltageClass: Math.max(...switches.map(s => s.voltageClass ?? Infinity)),
      lineVoltageThd: first.lineVoltageThd,
      semiconductorLossW: unmatched.length ? null : lossW,
      ...(lossW !== null && head && !unmatched.length ? { lossPointName: head.pointName } : {}),
      ...(lossMissing.length ? { lossMissing } : {}),
      ...(missing.length ? { missing } : {}),
      peakJunctionC: hottest ? Math.round(hottest.c * 10) / 10 : null,
      ...(hottest ? { meanJunctionC: Math.round(hottest.meanC * 10) / 10, junctionLimitC: hottest.limitC, peakJunctionPosition: hottest.position, peakJunctionPointName: hottest.pointName } : {}),
      semiconductorCost: unmatched.length ? null : cost,
      unmatched,
      warnings: [...conv.warnings, ...result.warnings],
    }
  })
  return { rows }
}
