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
  semiconductorCost?: number | null
  /** positions no catalogue part fits */
  unmatched?: string[]
  warnings?: string[]
}
