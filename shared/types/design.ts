import type { DesignResult, LegLayout, SpectrumLine, Waveform } from '../engine'

export interface SideExtras {
  /** the operating point the waveform belongs to */
  pointName: string
  waveform?: Waveform
  spectrum?: SpectrumLine[]
  thd?: number
}

/** What the design page shows: the evaluation, the leg drawings and the first point's waveform per side. */
export interface DesignPreview {
  result: DesignResult
  layouts: Partial<Record<'machine' | 'grid', LegLayout>>
  extras: Partial<Record<'machine' | 'grid', SideExtras>>
}
