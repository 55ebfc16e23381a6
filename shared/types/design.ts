import type { DesignResult, LegLayout, SpectrumLine, Waveform } from '../engine'

export interface SideExtras {
  /** the operating point the waveform belongs to */
  pointName: string
  waveform?: Waveform
  spectrum?: SpectrumLine[]
  /** full-band line-voltage THD (time-domain RMS) */
  thd?: number
  /** THD summed over orders 2…thdMaxOrder only */
  thdToOrder?: number
  thdMaxOrder?: number
}

/** What the design page shows: the evaluation, the leg drawings and the first point's waveform per side. */
export interface DesignPreview {
  result: DesignResult
  layouts: Partial<Record<'machine' | 'grid', LegLayout>>
  extras: Partial<Record<'machine' | 'grid', SideExtras>>
}
