import { z } from 'zod'
import { dbInt } from './bounds'
import { CATALOG_COLUMNS, LIFECYCLES, PART_KINDS } from '../../catalog/columns'

const columnKeys = CATALOG_COLUMNS.map(c => c.key) as [string, ...string[]]

/** The catalogue column's own upper bound (catalog/columns.ts is the one definition), within the database integer. */
function columnMax(key: string): number {
  const max = CATALOG_COLUMNS.find(c => c.key === key)?.max
  return Math.min(typeof max === 'number' ? max : Number.MAX_SAFE_INTEGER, 2_147_483_647)
}

export const decimalSeparatorSchema = z.enum(['.', ','], { message: 'Choose \'.\' or \',\'' })

export const importMappingSchema = z.object({
  mapping: z.record(z.enum(columnKeys, { message: 'Not a catalogue column' }), z.number().int().min(0).max(16383, 'A sheet has at most 16 384 columns').nullable()),
  decimalSeparator: decimalSeparatorSchema.default('.'),
})

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

export const partPatchSchema = z.object({
  approved: z.boolean().optional(),
  lifecycle: z.enum(LIFECYCLES).optional(),
  stock: dbInt().min(0).max(columnMax('stock')).optional(),
  leadTimeDays: dbInt().min(0).max(columnMax('leadTimeDays')).optional(),
}).refine(v => Object.values(v).some(x => x !== undefined), { message: 'Give at least one field to change' })
