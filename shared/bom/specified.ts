// Design positions the catalogue has no kind for (the matrix converter's input filter inductors): one BOM
// line each with the figures to specify the part by, no part number and no price.
import type { DesignResult } from '../engine/types'
import { formatSi } from '../utils/format'
import type { SpecifiedLineInput } from './build'

export function specifiedLines(result: DesignResult | undefined): SpecifiedLineInput[] {
  if (!result) return []
  return result.converters.flatMap(c => (c.envelope.inductors ?? []).map(l => ({
    position: l.name,
    side: c.side,
    category: 'inductor',
    quantityPerUnit: l.count,
    description: `Input filter inductor ${l.name}, one per input phase: ${formatSi(l.inductance, 'H', 3)}, ${formatSi(l.currentRms, 'A', 3)} RMS, ${formatSi(l.currentPeak, 'A', 3)} peak, resonance ${formatSi(l.resonanceHz, 'Hz', 3)} with the filter capacitors; no catalogue kind, specify manually`,
  })))
}
