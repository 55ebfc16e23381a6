import type { DesignInput, TopologyId } from '../engine'

/** One candidate of a trade study; `error` instead of figures when the engine refused the duty for it. */
export interface TradeStudyRow {
  topology: TopologyId
  levels: number | null
  label: string
  input: DesignInput
  error?: string
  modulationIndex?: number
  switchesTotal?: number
  diodesTotal?: number
  clampDiodesTotal?: number
  devicesTotal?: number
  capacitors?: number
  voltageClasses?: { position: string, required: number, voltageClass: number | null }[]
  /** V; null (JSON of Infinity) when a switch needs series devices */
  highestVoltageClass?: number | null
  lineVoltageThd?: number
  /** W, semiconductors at the operating point with the highest losses (lossPointName) */
  semiconductorLossW?: number | null
  lossPointName?: string
  /** why the losses are missing: position, part and the catalogue fields it lacks */
  lossMissing?: string[]
  /** per position, why a figure of the row is missing: no part fits, or the best part lacks these catalogue fields */
  missing?: TradeStudyMissing[]
  /** °C, the hottest peak T_j over the fundamental period among the best parts (null when no position has the figures) */
  peakJunctionC?: number | null
  /** °C, highest mean T_j of the position with that peak */
  meanJunctionC?: number
  /** °C, T_j,max − margin of that part */
  junctionLimitC?: number
  peakJunctionPosition?: string
  peakJunctionPointName?: string
  semiconductorCost?: number | null
  /** positions no catalogue part fits */
  unmatched?: string[]
  warnings?: string[]
}

/** A figure a trade-study row lacks for one position, and why. */
export interface TradeStudyMissing {
  position: string
  /** the best-fitting part; null when no part fits */
  partNumber: string | null
  /** catalogue fields the part lacks (by column header) */
  fields: string[]
  figure: 'losses' | 'junction temperature'
  reason: string
}
