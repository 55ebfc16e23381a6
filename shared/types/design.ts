import type { DesignResult, LegLayout, SpectrumLine, Waveform } from '../engine'

export interface SideExtras {
  /** the operating point the waveform belongs to */
  pointName: string
  /** its index in the side's operating points */
  pointIndex: number
  /** samples the engine computed over one period (the waveform may carry fewer) */
  samples: number
  /** decimated: the extremes of each bucket, rounded for drawing; full: every sample */
  resolution: 'decimated' | 'full'
  waveform?: Waveform
  spectrum?: SpectrumLine[]
  /** full-band line-voltage THD (time-domain RMS) */
  thd?: number
  /** THD summed over orders 2…thdMaxOrder only */
  thdToOrder?: number
  thdMaxOrder?: number
}

/**
 * What the design page shows: the evaluation, the leg drawings and the chosen point's waveform per side. The live
 * preview and the results route send it compact: per-point positions without provenance (the envelope keeps it).
 */
export interface DesignPreview {
  result: DesignResult
  layouts: Partial<Record<'machine' | 'grid', LegLayout>>
  extras: Partial<Record<'machine' | 'grid', SideExtras>>
}
