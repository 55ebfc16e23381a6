// Shapes of the parts catalogue shared by the importer, the matcher, the server and the UI.
// SI units throughout (V, A, Ω, J, K/W, F); temperatures in °C, lead times in days, prices per piece.

import type { ColumnKey, Currency, Lifecycle, PackageConfiguration, PartKind, Technology } from '../../catalog/columns'

export type { ColumnKey, Currency, Lifecycle, PackageConfiguration, PartKind, Technology } from '../../catalog/columns'

/** Unit price from `minQuantity` pieces upwards. */
export interface PriceBreak {
  /** pieces */
  minQuantity: number
  /** per piece, in the part's currency */
  unitPrice: number
}

export interface CatalogPart {
  partNumber: string
  manufacturer: string
  kind: PartKind
  /** Device positions one package covers (see PACKAGE_CONFIGURATIONS); 'single' for capacitors. */
  packageConfiguration: PackageConfiguration
  technology?: Technology
  /** V, semiconductors: rated blocking voltage; capacitors: rated DC voltage. */
  voltageRating: number
  /** A, nominal current per switch or diode (semiconductors). */
  currentRating?: number
  /** V, switch on-state threshold (v = V0 + r·i). */
  switchThresholdVoltage?: number
  /** Ω, switch on-state slope resistance. */
  switchSlopeResistance?: number
  /** V, diode on-state threshold. */
  diodeThresholdVoltage?: number
  /** Ω, diode on-state slope resistance. */
  diodeSlopeResistance?: number
  /** J per event at the test voltage / current. */
  turnOnEnergy?: number
  /** J per event. */
  turnOffEnergy?: number
  /** J per event (diode reverse recovery). */
  recoveryEnergy?: number
  /** V, test voltage of the switching energies. */
  energyReferenceVoltage?: number
  /** A, test current of the switching energies. */
  energyReferenceCurrent?: number
  /** K/W, one switch. */
  rthJunctionCaseSwitch?: number
  /** K/W, one diode. */
  rthJunctionCaseDiode?: number
  /** K/W, per switch or diode. */
  rthCaseHeatsink?: number
  /** °C */
  junctionTemperatureMax?: number
  /** °C, junction temperature of the loss figures above (the datasheet's hot value) */
  lossDataTemperature?: number
  /** The same figures at 25 °C (optional): with them the figures are linear in T_j. */
  switchThresholdVoltage25?: number
  switchSlopeResistance25?: number
  diodeThresholdVoltage25?: number
  diodeSlopeResistance25?: number
  turnOnEnergy25?: number
  turnOffEnergy25?: number
  recoveryEnergy25?: number
  /** K/W and s: Foster network junction-case per device, pairs 1…4 (optional; the single R_th above otherwise) */
  zthSwitchR1?: number
  zthSwitchR2?: number
  zthSwitchR3?: number
  zthSwitchR4?: number
  zthSwitchTau1?: number
  zthSwitchTau2?: number
  zthSwitchTau3?: number
  zthSwitchTau4?: number
  zthDiodeR1?: number
  zthDiodeR2?: number
  zthDiodeR3?: number
  zthDiodeR4?: number
  zthDiodeTau1?: number
  zthDiodeTau2?: number
  zthDiodeTau3?: number
  zthDiodeTau4?: number
  /** F */
  capacitance?: number
  /** h at capacitorRatedTemperature (°C); K/W hot spot to ambient (optional, electrolytic life) */
  capacitorRatedLife?: number
  capacitorRatedTemperature?: number
  capacitorRthHotSpot?: number
  /** A RMS */
  rippleCurrentRating?: number
  /** Ω */
  esr?: number
  /** Ascending by minQuantity; empty when the catalogue gives no price. */
  priceBreaks: PriceBreak[]
  currency?: Currency
  /** pieces */
  minimumOrderQuantity?: number
  /** pieces */
  stock?: number
  /** days */
  leadTimeDays?: number
  lifecycle: Lifecycle
  supplier?: string
  datasheetUrl?: string
  description?: string
  /** Spreadsheet row the part was imported from (import preview only). */
  sourceRow?: number
}

export type CellValue = string | number | null

/** An uploaded sheet as read, before mapping: row numbers are the ones the user sees in the spreadsheet. */
export interface RawTable {
  sheetName: string
  format: 'xlsx' | 'csv'
  /** Row number of the header row (1-based). */
  headerRowNumber: number
  headers: string[]
  rows: { rowNumber: number, cells: CellValue[] }[]
  /** CSV only: the delimiter found. */
  delimiter?: ',' | ';' | '\t'
  /** Decimal separator the file suggests (';'-delimited CSV usually means decimal commas). */
  suggestedDecimalSeparator?: '.' | ','
  warnings: TableProblem[]
  errors: TableProblem[]
  /** Rows not read as parts, and why (title above the header, units, blank, notes under the table). */
  skipped: SkippedRow[]
  /** Rows the header could be on, with how many catalogue columns each names (for choosing another). */
  headerCandidates: HeaderCandidate[]
}

export interface SkippedRow {
  rowNumber: number
  reason: 'above-header' | 'units' | 'blank' | 'notes' | 'duplicate'
  /** The row's text, shortened, so the user recognises it. */
  text: string
}

export interface HeaderCandidate {
  rowNumber: number
  /** Catalogue columns the row's cells would name as headers. */
  score: number
  text: string
}

/** A problem with the file: `row` as the user sees it, `column` a letter such as "C". */
export interface TableProblem {
  row?: number
  column?: string
  message: string
}

/** Which uploaded column (0-based index into RawTable.headers) feeds each catalogue column. */
export type ColumnMapping = Partial<Record<ColumnKey, number | null>>

export interface ValidationIssue {
  /** Spreadsheet row as the user sees it (the header row for a problem with a whole column). */
  row: number
  /** Column letter of the uploaded sheet, e.g. "C"; "" when the column is not mapped. */
  column: string
  field: ColumnKey
  message: string
  /** 'error' rejects the row; 'warning' imports it but tells the user. */
  severity: 'error' | 'warning'
}

/** How an upload is read, beside the column mapping (stored per import; value mapping and constants also per uploader). */
export interface ImportSettings {
  /** Row number of the header row, when the user chose it (absent = detected). */
  headerRow?: number
  /** Decimal mark per column, chosen by the user (absent = detected from the cells). */
  columnDecimalSeparators?: Partial<Record<ColumnKey, '.' | ','>>
  /** Uploaded enum value (normalised) → ours, per column. */
  valueMapping?: Partial<Record<ColumnKey, Record<string, string>>>
  /** Values standing in for columns the file lacks. */
  constants?: Partial<Record<ColumnKey, string>>
}
