import { z } from 'zod'
import { dbInt } from './bounds'
import { CATALOG_COLUMNS, fosterKeys, LIFECYCLES, PART_KINDS } from '../../catalog/columns'

const columnKeys = CATALOG_COLUMNS.map(c => c.key) as [string, ...string[]]

/** The catalogue column's own upper bound (catalog/columns.ts is the one definition), within the database integer. */
function columnMax(key: string): number {
  const max = CATALOG_COLUMNS.find(c => c.key === key)?.max
  return Math.min(typeof max === 'number' ? max : Number.MAX_SAFE_INTEGER, 2_147_483_647)
}

export const decimalSeparatorSchema = z.enum(['.', ','], { message: 'Choose \'.\' or \',\'' })

const columnKey = z.enum(columnKeys, { message: 'Not a catalogue column' })

export const importMappingSchema = z.object({
  mapping: z.record(columnKey, z.number().int().min(0).max(16383, 'A sheet has at most 16 384 columns').nullable()),
  /** Decimal mark of columns whose cells show none of their own. */
  decimalSeparator: decimalSeparatorSchema.default('.'),
  /** Row the headers are on (as the spreadsheet numbers it); a change re-reads the file and re-suggests the mapping. */
  headerRow: z.number().int().min(1).max(1_000_000).optional(),
  /** Decimal mark chosen for single columns, over what their cells suggest. */
  columnDecimalSeparators: z.partialRecord(columnKey, decimalSeparatorSchema).optional(),
  /** Uploaded value → ours, per enum column. */
  valueMapping: z.partialRecord(columnKey, z.record(z.string().max(200), z.string().max(60)).refine(v => Object.keys(v).length <= 500, { message: 'At most 500 values per column' })).optional(),
  /** A value for every row of a column the file lacks (e.g. currency, manufacturer). */
  constants: z.partialRecord(columnKey, z.string().trim().max(200)).optional(),
})

export const importCommitSchema = importMappingSchema.extend({
  /** The number of refused rows the user agreed to leave out; must equal the count the preview shows. */
  leaveRefused: z.number().int().min(0).optional(),
})

export const partsBulkSchema = z.object({
  ids: z.array(z.number().int().min(1)).min(1, { message: 'Choose at least one part' }).max(5000, { message: 'At most 5000 parts at once' }),
  approved: z.boolean().optional(),
  lifecycle: z.enum(LIFECYCLES).optional(),
  /** Must equal ids.length: the count the confirmation named. */
  confirm: z.number().int().min(1),
}).refine(v => v.approved !== undefined || v.lifecycle !== undefined, { message: 'Give approved or lifecycle' })
  .refine(v => v.confirm === v.ids.length, { message: 'The confirmation must name how many parts change', path: ['confirm'] })

export const partsQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  kind: z.enum(PART_KINDS).optional(),
  lifecycle: z.enum(LIFECYCLES).optional(),
  approved: z.enum(['yes', 'no']).optional(),
  minVoltage: z.coerce.number().min(0).optional(),
  minCurrent: z.coerce.number().min(0).optional(),
  sort: z.enum(['partNumber', 'manufacturer', 'kind', 'voltageRating', 'currentRating', 'unitPrice', 'stock', 'leadTimeDays', 'lifecycle']).default('partNumber'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).max(1_000_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})

/** A Foster column in the part edit: a number within the column's range, or null to clear it. */
function fosterField(key: string) {
  const column = CATALOG_COLUMNS.find(c => c.key === key)!
  return z.number({ error: `${column.header} must be a number (${column.unit})` })
    .min(column.min ?? 0, { error: `${column.header} must be at least ${column.min ?? 0} ${column.unit}` })
    .max(column.max ?? Number.MAX_VALUE, { error: `${column.header} must be at most ${column.max} ${column.unit}` })
    .nullable().optional()
}

export const FOSTER_EDIT_KEYS = [...fosterKeys('Switch').flat(), ...fosterKeys('Diode').flat()]

export const partPatchSchema = z.object({
  approved: z.boolean().optional(),
  lifecycle: z.enum(LIFECYCLES).optional(),
  stock: dbInt().min(0).max(columnMax('stock')).optional(),
  leadTimeDays: dbInt().min(0).max(columnMax('leadTimeDays')).optional(),
  ...Object.fromEntries(FOSTER_EDIT_KEYS.map(k => [k, fosterField(k)])) as Record<(typeof FOSTER_EDIT_KEYS)[number], ReturnType<typeof fosterField>>,
}).refine(v => Object.values(v).some(x => x !== undefined), { message: 'Give at least one field to change' })
